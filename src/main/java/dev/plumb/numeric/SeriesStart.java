package dev.plumb.numeric;


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
     * @param h0    the first length tried
     * @param scale a typical magnitude of each state component (for tolerances and difference steps)
     * @param tol   the absolute agreement wanted per component
     */
    static Result start(RelationSystem f, double a, double[] y0, double h0, double[] scale, double[] tol)
            throws SolveException {
        double h = h0;
        double worst = Double.NaN;
        for (int attempt = 0; attempt < 16; attempt++, h /= 2) {
            double[] low = collocate(f, a, y0, h, LOW, scale);
            double[] high = collocate(f, a, y0, h, HIGH, scale);
            if (low == null || high == null) continue;
            worst = 0;
            for (int i = 0; i < y0.length; i++) worst = Math.max(worst, Math.abs(low[i] - high[i]) / tol[i]);
            if (worst <= 0.01) {
                return new Result(a + h, high, String.format("series start on [%s, %s+%.3g] (collocation degree %d, checked against %d)",
                        trim(a), trim(a), h, HIGH, LOW));
            }
        }
        throw new SolveException(f.form.coordinate.span(), "the relations are singular at " + f.form.coordinate.name() + " = "
                + trim(a) + " and no series start converged (tried 16 lengths from " + String.format("%.3g", h0)
                + (Double.isNaN(worst) ? "; the collocation equations had no finite solution)" : String.format(
                "; degree %d and %d series still differed by %.3g tolerances)", LOW, HIGH, worst)));
    }

    static String trim(double v) {
        return v == Math.rint(v) && Math.abs(v) < 1e15 ? Long.toString((long) v) : String.format("%.6g", v);
    }

    /**
     * The value at a+h of the degree-s collocation polynomial, or null when Newton fails. The Newton
     * matrix is factored once and kept while it converges fast (simplified Newton): on a start interval
     * short enough for the series, the relations' Jacobian barely changes between iterations.
     */
    private static double[] collocate(RelationSystem f, double a, double[] y0, double h, int s, double[] scale) {
        CollocationRule rule = CollocationRule.of(s);
        double[] c = rule.nodes, w = rule.weights;
        double[][] integ = rule.integration;
        int n = y0.length, size = n * s;
        double[][] stage = new double[s][];
        for (int j = 0; j < s; j++) stage[j] = y0.clone();
        double[][] slope = new double[s][];
        DenseLu solver = null;
        double previous = Double.POSITIVE_INFINITY;
        for (int iter = 0; iter < 30; iter++) {
            for (int j = 0; j < s; j++) {
                slope[j] = f.derivatives(a + c[j] * h, stage[j]);
                if (!finite(slope[j])) return null;
            }
            // Residual G = Y - y0 - h A F(Y) and its Jacobian I - h A (x) J, each component divided by its scale:
            // in SI the entries span forty decades (a mass beside a dimensionless u) and LU took them for singular.
            double[] g = new double[size];
            for (int i = 0; i < s; i++) {
                for (int k = 0; k < n; k++) {
                    double sum = 0;
                    for (int j = 0; j < s; j++) sum += integ[i][j] * slope[j][k];
                    g[i * n + k] = (stage[i][k] - y0[k] - h * sum) / scale[k];
                }
            }
            boolean fresh = solver == null;
            if (fresh) {
                double[][] m = new double[size][size];
                for (int j = 0; j < s; j++) {
                    double[] jac = jacobian(f, a + c[j] * h, stage[j], slope[j], scale);
                    for (int i = 0; i < s; i++) {
                        for (int k = 0; k < n; k++) {
                            for (int l = 0; l < n; l++) {
                                m[i * n + k][j * n + l] -= h * integ[i][j] * jac[k * n + l] * scale[l] / scale[k];
                            }
                        }
                    }
                }
                for (int i = 0; i < size; i++) m[i][i] += 1.0;
                solver = DenseLu.factor(m);
                if (solver == null) return null;
            }
            solver.solve(g);
            double[] delta = g;
            double change = 0;
            for (int i = 0; i < s; i++) {
                for (int k = 0; k < n; k++) {
                    double d = delta[i * n + k];
                    stage[i][k] -= d * scale[k];
                    change = Math.max(change, Math.abs(d));
                }
            }
            if (!(change < 1e300)) return null;
            if (change < 1e-15) break;
            if (change > 0.1 * previous) {
                // Converging slowly: with a fresh matrix that is rounding noise, and more iterations gain nothing;
                // with a kept one the matrix is stale and is factored afresh at the current stages.
                if (fresh && change < 1e-12) break;
                solver = null;
            }
            previous = change;
        }
        double[] out = y0.clone();
        for (int j = 0; j < s; j++) {
            slope[j] = f.derivatives(a + c[j] * h, stage[j]);
            if (!finite(slope[j])) return null;
            for (int k = 0; k < n; k++) out[k] += h * w[j] * slope[j][k];
        }
        return out;
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
