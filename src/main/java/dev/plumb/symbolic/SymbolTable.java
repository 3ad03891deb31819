package dev.plumb.symbolic;

import dev.plumb.lang.Stmt;
import dev.plumb.model.Model;
import dev.plumb.model.Symbol;
import dev.plumb.units.Rational;
import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
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
    private final Model model;
    final ISymbol coordinate;

    SymbolTable(Model model) {
        this.model = model;
        int builtin = 0;
        int user = 0;
        for (Symbol s : model.symbols().values()) {
            if (s instanceof Symbol.Definition) continue;
            if (s instanceof Symbol.Builtin b && b.name().equals("pi")) continue;
            if (s instanceof Symbol.FixedParam f) {
                Optional<IExpr> exact = exactDimensionless(f);
                if (exact.isPresent()) {
                    exactValues.put(f.name(), exact.get());
                    continue;
                }
            }
            String privateName = s instanceof Symbol.Builtin ? String.format("pa%03d", builtin++) : String.format("pb%03d", user++);
            ISymbol sym = F.Dummy(privateName);
            toSymja.put(s.name(), sym);
            toPlumb.put(sym, s.name());
        }
        coordinate = model.coordinate().map(c -> toSymja.get(c.name())).orElse(F.Dummy("pzcoord"));
        if (model.coordinate().isEmpty()) toPlumb.put(coordinate, "x");
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
    IExpr assumptions(Translation t) {
        List<IExpr> facts = new ArrayList<>();
        for (Symbol s : model.symbols().values()) {
            ISymbol sym = toSymja.get(s.name());
            if (sym == null) continue;
            if (s instanceof Symbol.FreeParam p && p.assumption() == Stmt.Assumption.POSITIVE) facts.add(F.Greater(sym, F.C0));
            if (s instanceof Symbol.FreeParam p && p.assumption() == Stmt.Assumption.NON_NEGATIVE) facts.add(F.GreaterEqual(sym, F.C0));
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
