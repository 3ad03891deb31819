package dev.plumb.cli;

import java.util.function.ToDoubleFunction;

/**
 * The tests' own integrator, written apart from plumb's: classical fourth-order Runge–Kutta at a fixed
 * step, the surface located by bisection on the length of one last step taken from the point before
 * it. Each test runs it at two steps and checks the answers agree, so its own error is known.
 */
final class Rk4 {
    private Rk4() {
    }

    /** dy/dt = f(t, y), written into {@code dy}. */
    interface Field {
        void derivatives(double t, double[] y, double[] dy);
    }

    /** A point of a solution: the independent variable and the state there. */
    record State(double t, double[] y) {
    }

    static double[] step(Field f, double t, double[] y, double h) {
        int n = y.length;
        double[] k1 = new double[n], k2 = new double[n], k3 = new double[n], k4 = new double[n], w = new double[n];
        f.derivatives(t, y, k1);
        for (int i = 0; i < n; i++) w[i] = y[i] + h / 2 * k1[i];
        f.derivatives(t + h / 2, w, k2);
        for (int i = 0; i < n; i++) w[i] = y[i] + h / 2 * k2[i];
        f.derivatives(t + h / 2, w, k3);
        for (int i = 0; i < n; i++) w[i] = y[i] + h * k3[i];
        f.derivatives(t + h, w, k4);
        double[] out = new double[n];
        for (int i = 0; i < n; i++) out[i] = y[i] + h / 6 * (k1[i] + 2 * k2[i] + 2 * k3[i] + k4[i]);
        return out;
    }

    /** From (t0, y0) to t1 in {@code steps} equal steps (t1 may lie below t0). */
    static State toPoint(Field f, double t0, double[] y0, double t1, int steps) {
        double h = (t1 - t0) / steps;
        double[] y = y0.clone();
        for (int i = 0; i < steps; i++) y = step(f, t0 + i * h, y, h);
        return new State(t1, y);
    }

    /**
     * From (t0, y0) outward at step h until {@code surface} turns from positive to zero or negative;
     * the state where it vanishes. The field must stay finite a little beyond the surface.
     */
    static State toSurface(Field f, double t0, double[] y0, double h, ToDoubleFunction<double[]> surface, double tMax) {
        double t = t0;
        double[] y = y0.clone();
        while (t < tMax) {
            double[] next = step(f, t, y, h);
            if (surface.applyAsDouble(next) <= 0) {
                double lo = 0, hi = h;
                for (int i = 0; i < 200 && hi - lo > 1e-16 * Math.abs(t); i++) {
                    double mid = (lo + hi) / 2;
                    if (surface.applyAsDouble(step(f, t, y, mid)) > 0) lo = mid; else hi = mid;
                }
                double s = (lo + hi) / 2;
                return new State(t + s, step(f, t, y, s));
            }
            t += h;
            y = next;
        }
        throw new AssertionError("the test's own integration found no surface before t = " + tMax);
    }
}
