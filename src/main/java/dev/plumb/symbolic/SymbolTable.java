package dev.plumb.symbolic;

import dev.plumb.lang.Expr;
import dev.plumb.lang.Stmt;
import dev.plumb.model.Model;
import dev.plumb.model.Symbol;
import dev.plumb.units.Constants;
import dev.plumb.units.ExactRelations;
import dev.plumb.units.Rational;
import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.matheclipse.core.expression.F;
import org.matheclipse.core.interfaces.IExpr;
import org.matheclipse.core.interfaces.ISymbol;

/**
 * The private Symja symbol of every user name, and back. Symja gives meaning to names such as
 * {@code E}, {@code I}, {@code N}, {@code D} and folds case ({@code Mm} = {@code mm}); plumb names
 * are plain quantities, so each one gets a fresh symbol that no parser can reach. The symbols
 * are named so that Symja's canonical order puts built-in constants first, then the file's
 * names in declaration order — which is the order a reader expects in {@code 3*G*M^2/(8*pi*R^4)}.
 */
final class SymbolTable {

    private final Map<String, ISymbol> toSymja = new LinkedHashMap<>();
    private final Map<ISymbol, String> toPlumb = new HashMap<>();
    private final Map<String, IExpr> exactValues = new HashMap<>();
    private final Set<String> builtins = new LinkedHashSet<>();
    private final Map<ISymbol, IExpr> inBasis = new LinkedHashMap<>();
    private final Model model;
    final ISymbol coordinate;

    SymbolTable(Model model) {
        this.model = model;
        int user = 0;
        for (Symbol s : model.symbols().values()) {
            if (s instanceof Symbol.Definition) continue;
            // pi and e are Symja's own exact constants, not free symbols.
            if (s instanceof Symbol.Builtin b && (b.name().equals("pi") || b.name().equals("e"))) continue;
            if (s instanceof Symbol.FixedParam f) {
                Optional<IExpr> exact = exactDimensionless(f);
                if (exact.isPresent()) {
                    exactValues.put(f.name(), exact.get());
                    continue;
                }
            }
            if (s instanceof Symbol.Builtin) {
                builtin(s.name());
                continue;
            }
            ISymbol sym = Symja.symbol(String.format("pb%03d", user++));
            toSymja.put(s.name(), sym);
            toPlumb.put(sym, s.name());
        }
        for (ExactRelations.Relation r : ExactRelations.all()) {
            if (!(model.symbols().get(r.derived()) instanceof Symbol.Builtin)) continue;
            // A declaration that shadows a basis constant (param k_B = ...) makes the relation false for this file.
            if (!r.powers().keySet().stream().allMatch(b -> model.symbols().get(b) == null || model.symbols().get(b) instanceof Symbol.Builtin)) continue;
            IExpr basis = F.Times(F.QQ(r.coefficient().num(), r.coefficient().den()), F.Power(F.Pi, F.ZZ(r.piPower())));
            for (var p : r.powers().entrySet()) basis = F.Times(basis, F.Power(builtin(p.getKey()), F.ZZ(p.getValue())));
            inBasis.put(toSymja.get(r.derived()), basis);
        }
        coordinate = model.coordinate().map(c -> toSymja.get(c.name())).orElse(Symja.symbol("pzcoord"));
        if (model.coordinate().isEmpty()) toPlumb.put(coordinate, "x");
    }

    /**
     * The private symbol of a built-in constant, made on first use: a basis constant that only a
     * relation brings in (N_A for R_gas) gets one too. Numbered by the built-in order, so that
     * Symja's canonical order puts them as the constants table does.
     */
    private ISymbol builtin(String name) {
        ISymbol known = toSymja.get(name);
        if (known != null) return known;
        int index = new ArrayList<>(Constants.all().keySet()).indexOf(name);
        ISymbol sym = Symja.symbol(String.format("pa%03d", index));
        toSymja.put(name, sym);
        toPlumb.put(sym, name);
        builtins.add(name);
        return sym;
    }

    /**
     * The expression with every derived built-in constant (R_gas, hbar, sigma_SB) written in the
     * basis of the 2019 SI (N_A*k_B, h/(2*pi), 2*pi^5*k_B^4/(15*h^3*c^2)), so that a comparison
     * knows the exact relations; the symbols that remain are independent.
     */
    IExpr inBasis(IExpr e) {
        if (inBasis.isEmpty()) return e;
        return e.replaceAll(x -> x instanceof ISymbol s && inBasis.containsKey(s) ? inBasis.get(s) : F.NIL).orElse(e);
    }

    /** Whether the name is a built-in constant with a private symbol (used in the file or brought in by a relation). */
    boolean isBuiltin(String name) {
        return builtins.contains(name);
    }

    /**
     * The SI value of a built-in constant exactly as its source prints it ({@code 6.67430e-11} is
     * exactly 667430/10^16), or, for one computed in double precision, that double.
     */
    Optional<BigDecimal> constantValue(String name) {
        if (!builtins.contains(name)) return Optional.empty();
        var published = Constants.published(name);
        if (published.isPresent()) {
            try {
                return Optional.of(new BigDecimal(published.get()));
            } catch (NumberFormatException relation) {
                // A derived constant prints its relation; its double value follows.
            }
        }
        return Constants.lookup(name).map(c -> new BigDecimal(c.value()));
    }

    /**
     * A dimensionless fixed parameter whose value is a small exact ratio ({@code param n = 1}) is
     * replaced by that ratio, so that exponents such as {@code theta^n} stay exact; every other
     * fixed parameter stays a symbol, so that closed forms keep its name.
     */
    private static Optional<IExpr> exactDimensionless(Symbol.FixedParam f) {
        if (!f.dimension().isNone() || Double.isNaN(f.value())) return Optional.empty();
        Optional<Rational> q = Rational.approximate(f.value(), 1000);
        if (q.isEmpty() || q.get().toDouble() != f.value()) return Optional.empty();
        return Optional.of(F.QQ(q.get().num(), q.get().den()));
    }

    Model model() {
        return model;
    }

    ISymbol symbol(String name) {
        return toSymja.get(name);
    }

    Optional<IExpr> exactValue(String name) {
        return Optional.ofNullable(exactValues.get(name));
    }

    String name(ISymbol s) {
        return toPlumb.get(s);
    }

    boolean isCoordinate(ISymbol s) {
        return s == coordinate;
    }

    /** Every plumb name with a private symbol, in declaration order. */
    Map<String, ISymbol> all() {
        return toSymja;
    }

    /** What simplification may assume: signs of parameters and constants; the coordinate inside its interval. */
    /**
     * The symbols that may be zero or negative: free parameters declared without {@code > 0}, {@code >= 0}
     * or a lower bound, fixed parameters whose value is not positive, and the coordinate when its
     * interval may start below 0. Rewrites that hold only for positive bases (PowerExpand) are not
     * used on expressions that hold them, and sample points give them both signs.
     */
    Set<ISymbol> signed() {
        // Parameters and the coordinate get their symbols in the constructor (only built-ins come later), so once is enough.
        if (signed == null) signed = java.util.Collections.unmodifiableSet(signedSymbols());
        return signed;
    }

    private Set<ISymbol> signed;

    private Set<ISymbol> signedSymbols() {
        Set<ISymbol> out = new LinkedHashSet<>();
        for (Symbol s : model.symbols().values()) {
            ISymbol sym = toSymja.get(s.name());
            if (sym == null) continue;
            boolean signed = s instanceof Symbol.FreeParam ? !nonNegative(s)
                    : s instanceof Symbol.FixedParam f ? !(f.value() > 0)
                    : s instanceof Symbol.Coordinate c && !nonNegative(c.from());
            if (signed) out.add(sym);
        }
        return out;
    }

    /** Whether a declared symbol is known to be at least 0 from its declaration alone. */
    private boolean nonNegative(Symbol s) {
        if (s instanceof Symbol.FreeParam p) {
            return p.assumption() != null || p.bounds().stream().anyMatch(b -> (b.op() == Expr.CompareOp.GT || b.op() == Expr.CompareOp.GE)
                    && nonNegative(b.value()));
        }
        if (s instanceof Symbol.FixedParam f) return f.value() >= 0;
        return s instanceof Symbol.Builtin;
    }

    /** Whether an expression of declared names is at least 0: numbers, such names, and sums, products, quotients of them. */
    private boolean nonNegative(Expr e) {
        if (e instanceof Expr.Num n) return n.value() >= 0;
        if (e instanceof Expr.Quantity q) return q.value() >= 0;
        if (e instanceof Expr.Name n) return model.symbols().get(n.id()) != null && nonNegative(model.symbols().get(n.id()));
        if (e instanceof Expr.Binary b) {
            return b.op() != Expr.BinaryOp.SUB && b.op() != Expr.BinaryOp.POW && nonNegative(b.left()) && nonNegative(b.right());
        }
        return false;
    }

    IExpr assumptions(Translation t) {
        List<IExpr> facts = new ArrayList<>();
        for (Symbol s : model.symbols().values()) {
            ISymbol sym = toSymja.get(s.name());
            if (sym == null) continue;
            if (s instanceof Symbol.FreeParam p && p.assumption() == Stmt.Assumption.POSITIVE) facts.add(F.Greater(sym, F.C0));
            if (s instanceof Symbol.FreeParam p && p.assumption() == Stmt.Assumption.NON_NEGATIVE) facts.add(F.GreaterEqual(sym, F.C0));
            if (s instanceof Symbol.FreeParam p) {
                for (Stmt.Bound b : p.bounds()) {
                    try {
                        IExpr other = t.plain(b.value());
                        facts.add(switch (b.op()) {
                            case LT -> F.Less(sym, other);
                            case LE -> F.LessEqual(sym, other);
                            case GT -> F.Greater(sym, other);
                            case GE -> F.GreaterEqual(sym, other);
                        });
                    } catch (Translation.Untranslatable ignored) {
                        // An order that cannot be translated only weakens the assumptions.
                    }
                }
            }
            if (s instanceof Symbol.Builtin) facts.add(F.Greater(sym, F.C0));
            if (s instanceof Symbol.FixedParam f && f.value() > 0) facts.add(F.Greater(sym, F.C0));
            if (s instanceof Symbol.UnknownConstant u && u.endOfInterval()) facts.add(F.Greater(sym, F.C0));
            if (s instanceof Symbol.Coordinate c) {
                try {
                    facts.add(F.Greater(sym, t.plain(c.from())));
                    facts.add(F.Less(sym, t.plain(c.to())));
                } catch (Translation.Untranslatable ignored) {
                    // An interval that cannot be translated only weakens the assumptions.
                }
            }
        }
        // The basis constants that only a relation brings in are positive too.
        for (String b : builtins) if (!model.symbols().containsKey(b)) facts.add(F.Greater(toSymja.get(b), F.C0));
        return facts.isEmpty() ? F.True : F.And(facts.toArray(IExpr[]::new));
    }

    /** The SI value of a symbol that has one (fixed parameters and built-in constants), exactly as a decimal. */
    Optional<BigDecimal> fixedValue(String name) {
        Symbol s = model.symbols().get(name);
        if (s instanceof Symbol.FixedParam f && !Double.isNaN(f.value())) return Optional.of(new BigDecimal(f.value()));
        if (s instanceof Symbol.Builtin b) return Optional.of(new BigDecimal(b.constant().value()));
        return Optional.empty();
    }
}
