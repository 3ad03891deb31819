package dev.plumb.numeric;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * Starting points for the shootings of a sweep, from the solutions already found on the same
 * thread: along a line of parameter points, the secant through the last two solutions (exact when
 * the unknowns are linear in the log parameters, as for homologous stars); elsewhere, the nearest
 * solution. Parameters are compared in log space when positive. One per thread.
 */
final class Continuation {

    private static final int MEMORY = 2048;

    private final List<double[]> where = new ArrayList<>();
    private final List<double[]> unknowns = new ArrayList<>();

    /** The predicted unknowns at {@code point}, or null when nothing has been solved yet. */
    double[] predict(Map<String, Double> point) {
        if (where.isEmpty()) return null;
        double[] t = coordinates(point);
        int last = where.size() - 1;
        if (last >= 1 && t.length == where.get(last).length) {
            double[] t1 = where.get(last), t0 = where.get(last - 1);
            double[] d1 = minus(t1, t0), d = minus(t, t1);
            double n1 = dot(d1, d1);
            if (n1 > 0) {
                double alpha = dot(d, d1) / n1;
                double off = 0;
                for (int k = 0; k < d.length; k++) off = Math.max(off, Math.abs(d[k] - alpha * d1[k]));
                // On the line through the last two points and not far beyond: extrapolate along the secant.
                if (alpha > 0 && alpha <= 4 && off <= 1e-9 * Math.sqrt(dot(d, d) + n1)) {
                    double[] z1 = unknowns.get(last), z0 = unknowns.get(last - 1);
                    if (z1.length == z0.length) {
                        double[] z = z1.clone();
                        for (int k = 0; k < z.length; k++) z[k] += alpha * (z1[k] - z0[k]);
                        return z;
                    }
                }
            }
        }
        int best = -1;
        double bestDistance = Double.POSITIVE_INFINITY;
        for (int i = 0; i < where.size(); i++) {
            if (where.get(i).length != t.length) continue;
            double[] d = minus(t, where.get(i));
            double dist = dot(d, d);
            if (dist < bestDistance) {
                bestDistance = dist;
                best = i;
            }
        }
        return best < 0 ? null : unknowns.get(best).clone();
    }

    /** Remembers a solved point (only a shooting's solution carries unknowns to start from). */
    void record(Map<String, Double> point, Solution s) {
        if (!(s instanceof SolvedCase sc)) return;
        if (where.size() == MEMORY) {
            where.remove(0);
            unknowns.remove(0);
        }
        where.add(coordinates(point));
        unknowns.add(sc.unknowns());
    }

    private static double[] coordinates(Map<String, Double> point) {
        TreeMap<String, Double> sorted = new TreeMap<>(point);
        double[] t = new double[sorted.size()];
        int k = 0;
        for (double v : sorted.values()) t[k++] = v > 0 ? Math.log(v) : v;
        return t;
    }

    private static double[] minus(double[] a, double[] b) {
        double[] out = new double[a.length];
        for (int i = 0; i < a.length; i++) out[i] = a[i] - b[i];
        return out;
    }

    private static double dot(double[] a, double[] b) {
        double s = 0;
        for (int i = 0; i < a.length; i++) s += a[i] * b[i];
        return s;
    }
}
