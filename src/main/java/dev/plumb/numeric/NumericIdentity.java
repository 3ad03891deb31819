package dev.plumb.numeric;

import dev.plumb.lang.Expr;
import dev.plumb.lang.ExprPrinter;
import dev.plumb.lang.Span;
import dev.plumb.lang.Stmt;
import dev.plumb.model.CaseValues;
import dev.plumb.model.Check;
import dev.plumb.model.Model;
import dev.plumb.model.Status;
import dev.plumb.model.Symbol;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;

/**
 * Decides a claim or step that no closed form decides by the numbers: the relations are solved at
 * parameter points drawn around each case (each free parameter scaled by up to a factor 1.25 either
 * way, keeping its sign), and at each both sides are evaluated (a claim about a whole profile at
 * several points of the interval). It holds when every point agrees within a tolerance tied to the
 * solver's own error estimate; it fails with a factor when the ratio of the two sides is the same
 * at every point, and otherwise says how the ratio varies. The points come from a fixed seed, so
 * the verdict is the same on every run.
 */
public final class NumericIdentity {

    /** Parameter points per case (the case itself included), cases used at most, interval points per solve. */
    private static final int PER_CASE = 6, MAX_CASES = 3, ALONG = 5;
    /** The agreement asked for, relative, below which no solver error estimate can be trusted anyway. */
    private static final double FLOOR = 1e-10;
    /** How much larger than the error estimate a difference must be to count. */
    private static final double SAFETY = 20;

    private NumericIdentity() {
    }

    /**
     * The numeric verdict on {@code eq} (a claim or step), or null when the numbers cannot decide it: no
     * case gives the free parameters values, the relations do not solve, or a side cannot be evaluated.
     */
    public static Check decide(Model model, String kind, String label, Stmt.Equation eq, Span span, Map<String, Expr> closedForms) {
        List<Map<String, Double>> points = points(model, label);
        if (points.isEmpty()) return null;
        boolean alongProfile = NumericEngine.dependsOnCoordinate(model, eq.lhs(), new java.util.HashSet<>())
                || NumericEngine.dependsOnCoordinate(model, eq.rhs(), new java.util.HashSet<>());
        List<double[]> pairs = new ArrayList<>();
        double worst = 0;
        int solved = 0;
        for (Map<String, Double> values : points) {
            Solution s, tight;
            try {
                s = NumericEngine.solve(model, values, NumericOptions.defaults(), closedForms);
                tight = NumericEngine.resolve(s, NumericOptions.defaults().tighter());
            } catch (SolveException notSolved) {
                // A point outside the bodies the relations allow (a star inside its own horizon) says nothing.
                continue;
            }
            List<Map<String, Double>> at = alongProfile ? along(model, s, values) : List.of(Map.of());
            if (at == null) continue;
            solved++;
            for (Map<String, Double> where : at) {
                try {
                    Expr l = bind(eq.lhs(), where), r = bind(eq.rhs(), where);
                    double lv = s.evaluate(l), rv = s.evaluate(r);
                    double err = Math.abs(tight.evaluate(l) - lv) + Math.abs(tight.evaluate(r) - rv);
                    if (!Double.isFinite(lv) || !Double.isFinite(rv)) continue;
                    double size = Math.max(Math.abs(lv), Math.abs(rv));
                    double allowed = Math.max(SAFETY * err, FLOOR * size);
                    double diff = Math.abs(lv - rv);
                    if (size > 0) worst = Math.max(worst, diff / size);
                    pairs.add(new double[]{lv, rv, allowed});
                } catch (SolveException cannot) {
                    // A side that cannot be evaluated at this point (outside its domain) is left out.
                }
            }
        }
        // Decide only on most of the points: a verdict from a few survivors of a domain the cases barely sit in is no proof.
        if (solved < Math.max(2, (points.size() + 1) / 2) || pairs.isEmpty()) return null;
        String route = "numeric identity over " + pairs.size() + " points (" + solved + " parameter sets around "
                + (model.cases().isEmpty() ? "the file's values" : "the cases") + (alongProfile ? ", " + ALONG + " places along the interval each" : "") + ")";
        Check base;
        if (pairs.stream().allMatch(p -> Math.abs(p[0] - p[1]) <= p[2])) {
            base = Check.of(kind, label, span, Status.HOLDS, "holds: " + route + " agrees to " + String.format("%.1e", worst)
                    + ", within the solver's error estimate");
        } else {
            base = differs(kind, label, span, pairs, route);
        }
        return base.with("route", "numeric").with("points", pairs.size()).with("max_rel_diff", worst);
    }

    /** A failing verdict: a constant factor when the ratio is the same everywhere, else how it varies. */
    private static Check differs(String kind, String label, Span span, List<double[]> pairs, String route) {
        double lo = Double.POSITIVE_INFINITY, hi = Double.NEGATIVE_INFINITY;
        boolean ratios = true;
        for (double[] p : pairs) {
            // The model puts the unknown side on the left: p[0] is the solved truth, p[1] the claimed side.
            if (p[0] == 0) {
                ratios = false;
                break;
            }
            double q = p[1] / p[0];
            lo = Math.min(lo, q);
            hi = Math.max(hi, q);
        }
        if (ratios && hi - lo <= 1e-8 * Math.max(Math.abs(lo), Math.abs(hi))) {
            double q = 0.5 * (lo + hi);
            String factor = factor(q);
            String how = q == -1.0 || factor.equals("-1") ? "the sign is wrong: claimed/true = -1"
                    : "off by a constant factor: claimed/true = " + factor;
            return Check.of(kind, label, span, Status.FAILS, "fails: " + how + " at every point of the " + route).withFactor(factor);
        }
        if (ratios) {
            return Check.of(kind, label, span, Status.FAILS, String.format("fails: the two sides differ, and not by a constant "
                    + "factor: claimed/true goes from %.6g to %.6g over the %s", lo, hi, route));
        }
        return Check.of(kind, label, span, Status.FAILS, "fails: the two sides differ (the true side is 0 where the claimed is not) in the " + route);
    }

    /**
     * A ratio as a short exact-looking number (2, -1, 1/2, 3/4) when it is one to 1e-7 (the ratio was
     * found constant to 1e-8, and solved values carry errors near 1e-9), else 8 figures.
     */
    static String factor(double q) {
        for (int den = 1; den <= 12; den++) {
            double num = Math.rint(q * den);
            if (num != 0 && Math.abs(q * den - num) <= 1e-7 * Math.abs(q * den)) {
                return den == 1 ? Long.toString((long) num) : (long) num + "/" + den;
            }
        }
        return String.format("%.8g", q);
    }

    /** The parameter points: around each case (the first few), or the file's own values when it has no free parameter. */
    private static List<Map<String, Double>> points(Model model, String label) {
        List<Map<String, Double>> out = new ArrayList<>();
        if (model.freeParams().isEmpty()) {
            out.add(Map.of());
            return out;
        }
        SplittableRandom random = new SplittableRandom(label.hashCode() * 1_000_003L + 17);
        for (CaseValues c : model.cases().subList(0, Math.min(MAX_CASES, model.cases().size()))) {
            out.add(c.values());
            for (int k = 1; k < PER_CASE; k++) {
                // Drawn again until the declared orders between parameters (Rc < R) hold, at most 20 times.
                for (int tries = 0; tries < 20; tries++) {
                    Map<String, Double> v = new LinkedHashMap<>(c.values());
                    for (Symbol.FreeParam p : model.freeParams()) {
                        Double base = v.get(p.name());
                        if (base != null) v.put(p.name(), base * Math.exp((random.nextDouble() * 2 - 1) * Math.log(1.25)));
                    }
                    if (ordered(model, v)) {
                        out.add(v);
                        break;
                    }
                }
            }
        }
        return out;
    }

    private static boolean ordered(Model model, Map<String, Double> values) {
        dev.plumb.model.ConstantEvaluator ev = new dev.plumb.model.ConstantEvaluator(n -> model.symbols().get(n), values);
        for (Symbol.FreeParam p : model.freeParams()) {
            for (Stmt.Bound b : p.bounds()) {
                Double v = values.get(p.name());
                if (v == null) continue;
                try {
                    if (!b.op().test(v, ev.evaluate(b.value()))) return false;
                } catch (dev.plumb.model.ConstantEvaluator.NotConstant cannotTell) {
                    // An order that cannot be evaluated here does not rule the point out.
                }
            }
        }
        return true;
    }

    /** Places strictly inside the interval (its ends as the solved case has them), or null when they cannot be had. */
    private static List<Map<String, Double>> along(Model model, Solution s, Map<String, Double> values) {
        Symbol.Coordinate coord = model.coordinate().orElseThrow();
        double a, b;
        try {
            a = s.evaluate(coord.from());
            b = s.evaluate(coord.to());
        } catch (SolveException e) {
            return null;
        }
        List<Map<String, Double>> out = new ArrayList<>();
        for (int i = 1; i <= ALONG; i++) out.add(Map.of(coord.name(), a + (b - a) * (i - 0.5) / ALONG));
        return out;
    }

    /** The expression with the coordinate replaced by a number. */
    private static Expr bind(Expr e, Map<String, Double> at) {
        if (at.isEmpty()) return e;
        if (e instanceof Expr.Name n && at.containsKey(n.id())) return new Expr.Num(at.get(n.id()), ExprPrinter.print(n), n.span());
        if (e instanceof Expr.Call c) return new Expr.Call(c.callee(), c.calleeSpan(), c.order(), c.args().stream().map(a -> bind(a, at)).toList(), c.span());
        if (e instanceof Expr.Neg n) return new Expr.Neg(bind(n.operand(), at), n.span());
        if (e instanceof Expr.Binary b) return new Expr.Binary(b.op(), bind(b.left(), at), bind(b.right(), at), b.span());
        if (e instanceof Expr.If i) {
            Expr.Condition c = i.condition();
            return new Expr.If(new Expr.Condition(c.op(), bind(c.left(), at), bind(c.right(), at), c.span()), bind(i.then(), at),
                    bind(i.otherwise(), at), i.span());
        }
        return e;
    }
}
