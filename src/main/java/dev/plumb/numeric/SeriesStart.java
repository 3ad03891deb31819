package dev.plumb.numeric;

import org.apache.commons.math3.analysis.integration.gauss.GaussIntegrator;
import org.apache.commons.math3.analysis.integration.gauss.GaussIntegratorFactory;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.RealVector;

/**
 * The start of an integration at a removable singular point (the centre, where m(r)/r^2 is 0/0):
 * on a short interval [a, a+h] each unknown is a polynomial in (x - a), a truncated series whose
 * coefficients are fixed by requiring the relations themselves to hold at the Gauss-Legendre
 * points inside the interval. The relations are never evaluated at the singular point, and the
 * value at a+h is checked against a series of higher degree (and h halved until they agree).
 */
final class SeriesStart {

    /** The state at {@code x}, and a description of how it was obtained. */
    record Result(double x, double[] y, String description) { }

    private static final int LOW = 8, HIGH = 12;

    private SeriesStart() {
    }

    /**
     * Finds a series start of the relations' own scale: from the first length tried, the length is
     * halved until the two degrees agree, or doubled while they agree and the state has hardly changed
     * (up to {@code hMax}), so the start does not depend on how good the first length was. A series whose end has crossed
     * the surface value of component {@code surface} (or left the relations' domain) does not count
     * as agreeing: the start never jumps over the surface.
     *
     * @param h0      the first length tried (its sign gives the direction)
     * @param hMax    the longest length allowed (same sign as h0), or infinity
     * @param scale   a typical magnitude of each state component (for tolerances and difference steps)
     * @param tol     the absolute agreement wanted per component
     * @param surface the component whose crossing of {@code surfaceValue} ends the interval, or -1
     */
    static Result start(RelationSystem f, double a, double[] y0, double h0, double hMax, double[] scale, double[] tol,
                        int surface, double surfaceValue) throws SolveException {
        double h = h0;
        double worst = Double.NaN;
        double[] good = null;
        double goodH = Double.NaN;
        int shrinks = 0;
        double[] miss = {Double.NaN};
        for (int attempt = 0; attempt < MAX_ATTEMPTS; attempt++) {
            double[] high = agreeing(f, a, y0, h, scale, tol, surface, surfaceValue, miss);
            if (high != null) {
                good = high;
                goodH = h;
                if (shrinks > 0 || Math.abs(2 * h) > Math.abs(hMax) || change(y0, high) >= GROWN) break;
                h *= 2;
            } else {
                if (good != null) break;
                worst = miss[0];
                shrinks++;
                h /= 2;
            }
        }
        if (good != null) {
            return new Result(a + goodH, good, String.format("series start on [%s, %s%+.3g] (collocation degree %d, checked against %d)",
                    trim(a), trim(a), goodH, HIGH, LOW));
        }
        throw new SolveException(f.form.coordinate.span(), "the relations are singular at " + f.form.coordinate.name() + " = "
                + trim(a) + " and no series start converged (tried " + MAX_ATTEMPTS + " lengths down from " + String.format("%.3g", h0)
                + (Double.isNaN(worst) ? "; the collocation equations had no finite solution)" : String.format(
                "; degree %d and %d series still differed by %.3g tolerances)", LOW, HIGH, worst)));
    }

    private static final int MAX_ATTEMPTS = 80;

    /**
     * A start needs to be long only against the step control's smallest steps: once a component that
     * starts away from zero has changed by this fraction, the series has found the relations' own scale,
     * and a longer one would only make values inside it come from a long backward integration.
     */
    private static final double GROWN = 1e-5;

    /** The largest relative change over the start of a component that starts away from zero (0 when none does). */
    private static double change(double[] y0, double[] y) {
        double out = 0;
        for (int i = 0; i < y0.length; i++) if (y0[i] != 0) out = Math.max(out, Math.abs(y[i] - y0[i]) / Math.abs(y0[i]));
        return out;
    }

    /** The degree-HIGH state at a+h when it agrees with degree LOW and stays on the start's side of the surface, else null. */
    private static double[] agreeing(RelationSystem f, double a, double[] y0, double h, double[] scale, double[] tol,
                                     int surface, double surfaceValue, double[] miss) {
        double[] low = collocate(f, a, y0, h, LOW, scale);
        double[] high = low == null ? null : collocate(f, a, y0, h, HIGH, scale);
        miss[0] = Double.NaN;
        if (low == null || high == null) return null;
        if (surface >= 0 && (high[surface] - surfaceValue) * (y0[surface] - surfaceValue) <= 0) return null;
        double worst = 0;
        for (int i = 0; i < y0.length; i++) worst = Math.max(worst, Math.abs(low[i] - high[i]) / tol[i]);
        miss[0] = worst;
        return worst <= 0.01 ? high : null;
    }

    static String trim(double v) {
        return v == Math.rint(v) && Math.abs(v) < 1e15 ? Long.toString((long) v) : String.format("%.6g", v);
    }

    /** The value at a+h of the degree-s collocation polynomial, or null when Newton fails. */
    private static double[] collocate(RelationSystem f, double a, double[] y0, double h, int s, double[] scale) {
        GaussIntegrator rule = new GaussIntegratorFactory().legendre(s, 0.0, 1.0);
        double[] c = new double[s], w = new double[s];
        for (int j = 0; j < s; j++) {
            c[j] = rule.getPoint(j);
            w[j] = rule.getWeight(j);
        }
        double[][] integ = integrationMatrix(c, rule);
        int n = y0.length, size = n * s;
        double[][] stage = new double[s][];
        for (int j = 0; j < s; j++) stage[j] = y0.clone();
        double[][] slope = new double[s][];
        for (int iter = 0; iter < 30; iter++) {
            double[][] jac = new double[s][];
            for (int j = 0; j < s; j++) {
                slope[j] = f.derivatives(a + c[j] * h, stage[j]);
                if (!finite(slope[j])) return null;
                jac[j] = jacobian(f, a + c[j] * h, stage[j], slope[j], scale);
            }
            // Residual G = Y - y0 - h A F(Y) and its Jacobian I - h A (x) J, both in units of each component's
            // scale: unscaled, a mass of 1e30 kg beside a dimensionless u makes pivots that look singular.
            double[] g = new double[size];
            double[][] m = new double[size][size];
            for (int i = 0; i < s; i++) {
                for (int k = 0; k < n; k++) {
                    double sum = 0;
                    for (int j = 0; j < s; j++) sum += integ[i][j] * slope[j][k];
                    g[i * n + k] = (stage[i][k] - y0[k] - h * sum) / scale[k];
                    m[i * n + k][i * n + k] += 1.0;
                    for (int j = 0; j < s; j++) {
                        for (int l = 0; l < n; l++) m[i * n + k][j * n + l] -= h * integ[i][j] * jac[j][k * n + l] * scale[l] / scale[k];
                    }
                }
            }
            RealVector delta;
            try {
                delta = new LUDecomposition(new Array2DRowRealMatrix(m, false)).getSolver().solve(new ArrayRealVector(g, false));
            } catch (RuntimeException singular) {
                return null;
            }
            double change = 0;
            for (int i = 0; i < s; i++) {
                for (int k = 0; k < n; k++) {
                    double d = delta.getEntry(i * n + k);
                    stage[i][k] -= d * scale[k];
                    change = Math.max(change, Math.abs(d));
                }
            }
            if (!(change < 1e300)) return null;
            if (change < 1e-15) break;
        }
        double[] out = y0.clone();
        for (int j = 0; j < s; j++) {
            slope[j] = f.derivatives(a + c[j] * h, stage[j]);
            if (!finite(slope[j])) return null;
            for (int k = 0; k < n; k++) out[k] += h * w[j] * slope[j][k];
        }
        return out;
    }

    /** A[i][j] = integral from 0 to c_i of the j-th Lagrange basis polynomial on the nodes c. */
    private static double[][] integrationMatrix(double[] c, GaussIntegrator rule) {
        int s = c.length;
        double[][] a = new double[s][s];
        for (int i = 0; i < s; i++) {
            for (int j = 0; j < s; j++) {
                double sum = 0;
                for (int q = 0; q < s; q++) sum += rule.getWeight(q) * c[i] * lagrange(c, j, c[i] * rule.getPoint(q));
                a[i][j] = sum;
            }
        }
        return a;
    }

    private static double lagrange(double[] c, int j, double t) {
        double p = 1;
        for (int k = 0; k < c.length; k++) if (k != j) p *= (t - c[k]) / (c[j] - c[k]);
        return p;
    }

    /** Column-major by component: entry [k*n + l] is d f_k / d y_l. */
    private static double[] jacobian(RelationSystem f, double x, double[] y, double[] fy, double[] scale) {
        int n = y.length;
        double[] out = new double[n * n];
        for (int l = 0; l < n; l++) {
            double[] yp = y.clone();
            double step = 1e-7 * Math.max(Math.abs(y[l]), scale[l]);
            yp[l] += step;
            double[] fp = f.derivatives(x, yp);
            for (int k = 0; k < n; k++) out[k * n + l] = Double.isFinite(fp[k]) ? (fp[k] - fy[k]) / step : 0.0;
        }
        return out;
    }

    private static boolean finite(double[] v) {
        for (double d : v) if (!Double.isFinite(d)) return false;
        return true;
    }
}
