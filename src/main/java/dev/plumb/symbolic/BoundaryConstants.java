package dev.plumb.symbolic;

import dev.plumb.lang.Stmt;
import dev.plumb.model.Symbol;
import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.matheclipse.core.expression.F;
import org.matheclipse.core.interfaces.IAST;
import org.matheclipse.core.interfaces.IExpr;
import org.matheclipse.core.interfaces.ISymbol;

/**
 * Fixes unknown constants from the boundaries left over once the profiles are known: symbolic
 * solution where Symja finds one that really satisfies the boundary, else (for a boundary in that
 * constant alone) the first root beyond the start of the interval, found numerically and named
 * exactly when it is a rational multiple of a power of pi — the first zero of sin ξ/ξ is π.
 * Symja's own Solve answers 0 for sin ξ/ξ = 0, so every root is checked by substitution.
 */
final class BoundaryConstants {

    private final Symja symja;
    private final SymbolTable table;
    private final ClosedForms closedForms;

    BoundaryConstants(Symja symja, SymbolTable table, ClosedForms closedForms) {
        this.symja = symja;
        this.table = table;
        this.closedForms = closedForms;
    }

    Map<String, IExpr> solve(Map<String, IExpr> profiles, Set<Stmt.Boundary> used, Map<String, List<TrailStep>> trails,
                             List<String> notes) {
        Map<String, IExpr> constants = new LinkedHashMap<>();
        Set<Stmt.Boundary> done = new java.util.HashSet<>(used);
        // A boundary in two unknown constants can fix one of them once a later boundary has fixed the other.
        boolean progress = true;
        while (progress) {
            progress = false;
            for (Stmt.Boundary b : table.model().boundaries()) {
                if (done.contains(b)) continue;
                if (fix(b, profiles, constants, trails, notes)) {
                    done.add(b);
                    progress = true;
                }
            }
        }
        return constants;
    }

    /** Whether the boundary is settled: it fixed its one unknown constant, or cannot (said in a note); false while it holds none or several. */
    private boolean fix(Stmt.Boundary b, Map<String, IExpr> profiles, Map<String, IExpr> constants,
                        Map<String, List<TrailStep>> trails, List<String> notes) {
        Translation t = new Translation(table, symja, profiles, constants);
        String label = b.label().present() ? b.label().name() : "on line " + b.span().line();
        try {
            IExpr lhs = symja.eval(t.plain(b.equation().lhs()));
            IExpr rhs = symja.eval(t.plain(b.equation().rhs()));
            IExpr eq = symja.eval(F.Subtract(lhs, rhs));
            List<String> unknown = t.unknownConstantsIn(eq);
            if (t.mentionsUnknownProfile(eq) || unknown.size() != 1) return false;
            String k = unknown.get(0);
            ISymbol ks = table.symbol(k);
            Optional<IExpr> root = symbolicRoot(eq, ks, t);
            String how = "solve boundary " + label + " for " + k;
            if (root.isEmpty()) {
                root = numericRoot(eq, ks, t);
                how = "first root of boundary " + label + " in " + k + ", found numerically and identified exactly";
            }
            if (root.isEmpty()) {
                notes.add("boundary " + label + " does not give a closed form for " + k);
                return true;
            }
            IExpr value = closedForms.simplify(root.get());
            constants.put(k, value);
            List<TrailStep> trail = new ArrayList<>();
            trail.add(new TrailStep("substitute the closed forms into boundary " + label, closedForms.print(eq) + " = 0"));
            trail.add(new TrailStep(how, k + " = " + closedForms.print(value)));
            trails.put(k, trail);
            return true;
        } catch (Translation.Untranslatable | Symja.Failure e) {
            notes.add("boundary " + label + ": " + e.getMessage());
            return true;
        }
    }

    private Optional<IExpr> symbolicRoot(IExpr eq, ISymbol k, Translation t) {
        IExpr solutions;
        try {
            solutions = symja.eval(F.Solve(F.Equal(eq, F.C0), k));
        } catch (Symja.Failure f) {
            return Optional.empty();
        }
        if (!solutions.isList()) return Optional.empty();
        boolean positive = table.model().symbols().get(table.name(k)) instanceof Symbol.UnknownConstant u && u.endOfInterval();
        for (IExpr s : (IAST) solutions) {
            if (!s.isList() || ((IAST) s).argSize() != 1 || !((IAST) s).arg1().isRuleAST()) continue;
            IExpr candidate = ((IAST) s).arg1().second();
            if (satisfies(eq, k, candidate, positive, t)) return Optional.of(candidate);
        }
        return Optional.empty();
    }

    /**
     * Whether the root meets the boundary (simplifying to 0, or failing that 0 to 60 digits at
     * random points) and, for the end of the interval, lies beyond its start at each of them.
     */
    private boolean satisfies(IExpr eq, ISymbol k, IExpr candidate, boolean endOfInterval, Translation t) {
        IExpr at = symja.eval(F.ReplaceAll(eq, F.Rule(k, candidate)));
        if (Points.isSingular(at)) return false;
        boolean symbolicZero = closedForms.simplify(at).isZero();
        Sampler sampler = new Sampler(symja, table, 5);
        IExpr start = start(t);
        int real = 0;
        for (int i = 0; i < 16 && real < 4; i++) {
            Map<ISymbol, IExpr> p = sampler.point(t);
            BigDecimal v = sampler.value(candidate, p);
            BigDecimal residual = sampler.value(at, p);
            BigDecimal scale = sampler.value(F.ReplaceAll(F.Abs(eq), F.Rule(k, F.C1)), p);
            if (v == null || residual == null) continue;
            if (!symbolicZero && (scale == null || residual.abs().compareTo(scale.abs().add(BigDecimal.ONE).multiply(ZERO)) > 0)) {
                return false;
            }
            if (endOfInterval) {
                BigDecimal from = start == null ? BigDecimal.ZERO : sampler.value(start, p);
                if (from == null || v.compareTo(from) <= 0) return false;
            }
            real++;
        }
        return real >= 2;
    }

    private static final BigDecimal ZERO = new BigDecimal("1e-40");

    private IExpr start(Translation t) {
        try {
            return table.model().coordinate().isPresent() ? symja.eval(t.plain(table.model().coordinate().get().from())) : null;
        } catch (Translation.Untranslatable | Symja.Failure e) {
            return null;
        }
    }

    private Optional<IExpr> numericRoot(IExpr eq, ISymbol k, Translation t) {
        if (!eq.isFree(x -> x.isSymbol() && x != k && table.name((ISymbol) x) != null, true)) return Optional.empty();
        double step = 0.01;
        double a = 1e-6;
        Double fa = value(eq, k, a);
        for (double b = a + step; b < 100; b += step) {
            Double fb = value(eq, k, b);
            if (fa != null && fb != null && Math.signum(fa) != Math.signum(fb)) return refine(eq, k, a, b, t);
            a = b;
            fa = fb;
        }
        return Optional.empty();
    }

    private Optional<IExpr> refine(IExpr eq, ISymbol k, double lo, double hi, Translation t) {
        Double flo = value(eq, k, lo);
        for (int i = 0; i < 60 && flo != null; i++) {
            double mid = 0.5 * (lo + hi);
            Double fm = value(eq, k, mid);
            if (fm == null) return Optional.empty();
            if (Math.signum(fm) == Math.signum(flo)) {
                lo = mid;
                flo = fm;
            } else {
                hi = mid;
            }
        }
        Optional<IExpr> exact = ExactNumber.identify(new BigDecimal(0.5 * (lo + hi)).round(new java.math.MathContext(15)), symja,
                new BigDecimal("1e-12"));
        return exact.filter(e -> satisfies(eq, k, e, true, t));
    }

    private Double value(IExpr eq, ISymbol k, double at) {
        try {
            IExpr v = symja.eval(F.N(F.ReplaceAll(eq, F.Rule(k, F.num(at)))));
            return v.isReal() ? v.evalDouble() : null;
        } catch (Symja.Failure | ArithmeticException f) {
            return null;
        }
    }
}
