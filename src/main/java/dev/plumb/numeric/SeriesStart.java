package dev.plumb.numeric;


/**
 * The start of an integration at a removable singular point (the centre, where m(r)/r^2 is 0/0):
 * on a short interval [a, a+h] each unknown is a polynomial in (x - a), a truncated series whose
 * coefficients are fixed by requiring the relations themselves to hold at the Gauss-Legendre
 * points inside the interval. The relations are never evaluated at the singular point, and the
 * value at a+h is checked against a series of higher degree (and h halved until they agree).
 */
final class SeriesStart {

    /** The state at {@code x} = a + h, started at {@code a}. */
    record Result(double a, double h, double x, double[] y) {
        /**
         * How the state was obtained, the interval in the file's unit for the coordinate (the length in SI beside);
         * formatted only when asked for (a sweep integrates thousands of starts and reads none).
         */
        String description(Formulation form) {
            dev.plumb.units.Unit u = form.units.coordinate();
            String unit = u.text().equals("1") ? "" : " " + u.text();
            String si = u.factor() == 1.0 ? "" : String.format(java.util.Locale.ROOT, "length %.3g %s; ", h,
                    dev.plumb.units.UnitCatalog.siName(u.dimension()));
            return String.format(java.util.Locale.ROOT, "series start on [%s, %s%+.3g]%s (%scollocation degree %d, checked against %d)",
                    trim(a / u.factor()), trim(a / u.factor()), h / u.factor(), unit, si, HIGH, LOW);
        }
    }

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
            return new Result(a, goodH, a + goodH, good);
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
