package dev.plumb.numeric;

import java.util.List;
import java.util.TreeSet;
import org.apache.commons.math3.analysis.solvers.BrentSolver;

/**
 * The breaks of piecewise relations: the points of the interval where a condition on the
 * coordinate alone ({@code z < 11 [km]}) changes, found by sampling and Brent's method, so the
 * integration can stop and restart there instead of stepping across a kink.
 */
final class PiecewiseBreaks {

    private PiecewiseBreaks() {
    }

    static double[] find(List<ExprCompiler.CoordinateCondition> conds, double[] frame, int epochSlot, double a, double limit) {
        TreeSet<Double> out = new TreeSet<>();
        double lo = Math.min(a, limit), hi = Math.max(a, limit);
        int samples = 256;
        BrentSolver brent = new BrentSolver(1e-15 * Math.max(Math.abs(lo), Math.abs(hi)) + 1e-300);
        for (ExprCompiler.CoordinateCondition c : conds) {
            double[] f = frame.clone();
            java.util.function.DoubleUnaryOperator g = x -> {
                f[0] = x;
                Evaluator.newEvaluation(f, epochSlot);
                return c.g().at(f);
            };
            double x0 = lo, g0 = g.applyAsDouble(lo);
            for (int k = 1; k <= samples; k++) {
                double x1 = lo + (hi - lo) * k / samples, g1 = g.applyAsDouble(x1);
                if (g1 == 0.0 && x1 < hi) {
                    out.add(x1);
                } else if (g0 * g1 < 0) {
                    out.add(brent.solve(200, g::applyAsDouble, x0, x1));
                }
                x0 = x1;
                g0 = g1;
            }
        }
        out.remove(lo);
        out.remove(hi);
        return out.stream().mapToDouble(Double::doubleValue).toArray();
    }

}
