package dev.plumb.numeric;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.RealVector;

/**
 * Finds the unknown start values and constants of a case so that every boundary holds: damped
 * Newton on the mismatches, with a finite-difference Jacobian, unknowns that start positive
 * moved in log space, and conditions with a positive target measured as log ratios. For
 * homologous problems (a polytrope of given mass and radius) both are power laws of the
 * unknowns, so the mismatches are nearly linear in these coordinates and Newton converges from
 * a dimensional estimate without tuning.
 */
final class Shooting {

    /** The converged trajectory, the unknowns and how many Newton steps it took. */
    record Result(Trajectory trajectory, double[] z, int iterations, double mismatch) { }

    private static final int MAX_ITERATIONS = 60;

    private Shooting() {
    }

    static Result solve(CaseProblem p) throws SolveException {
        double[] z = p.initialVector();
        if (p.unknowns.isEmpty()) {
            return new Result(p.integrate(z), z, 0, 0.0);
        }
        // The boundaries are met to a few times the integration's own relative tolerance: an integration at
        // rtol 1e-12 over a few hundred steps carries errors of that size, and a Newton step asked to do better
        // only chases them (the error estimate from the tighter re-solve reports what is left).
        double tol = Math.max(4 * p.options.relTol(), 1e-14);
        Trajectory t;
        double[] f;
        try {
            t = p.integrate(z);
            f = mismatch(p, t);
        } catch (SolveException first) {
            double[] rescued = rescue(p, z);
            if (rescued == null) {
                throw new SolveException(first.span(), "the shooting on " + names(p) + " found no trial that meets the boundaries, "
                        + "from its first guess (" + p.describeGuesses() + ") nor from guesses up to a factor 1e6 away in every direction; "
                        + "the first guess failed: " + first.getMessage() + "; give a better first guess with 'guess'");
            }
            z = rescued;
            t = p.integrate(z);
            f = mismatch(p, t);
        }
        double norm = norm(f);
        // The first Jacobian comes from the scalings the relations allow when they fix it (no integration);
        // if a step along it fails, the finite differences take over.
        double[][] jac = Homology.jacobian(p, t, f);
        for (int it = 0; it < MAX_ITERATIONS; it++) {
            if (norm <= tol) return new Result(t, z, it, norm);
            // A fresh finite-difference Jacobian costs one integration per unknown; after a full Newton
            // step the Broyden update below is kept instead, which suits the nearly linear log coordinates.
            boolean freshJacobian = jac == null;
            if (freshJacobian) jac = jacobian(p, z, f);
            RealVector dz;
            try {
                LUDecomposition lu = new LUDecomposition(new Array2DRowRealMatrix(jac, false), 1e-14);
                dz = lu.getSolver().solve(new ArrayRealVector(f, false)).mapMultiply(-1);
            } catch (RuntimeException singular) {
                throw new SolveException(p.form.coordinate.span(), "the boundaries do not fix " + names(p)
                        + ": the mismatches do not change independently with them (singular Jacobian at " + p.describeUnknowns(z) + ")");
            }
            // Keep one step within a factor e^4 in log coordinates, so a poor guess cannot throw the next trial far off.
            double biggest = dz.getLInfNorm();
            double lambda = biggest > 4 ? 4 / biggest : 1.0;
            boolean accepted = false;
            String lastFailure = null;
            for (int half = 0; half < 30; half++, lambda /= 2) {
                double[] trial = z.clone();
                for (int k = 0; k < trial.length; k++) trial[k] += lambda * dz.getEntry(k);
                try {
                    Trajectory tt = p.integrate(trial);
                    double[] ft = mismatch(p, tt);
                    double nt = norm(ft);
                    if (nt < (1 - 1e-4 * lambda) * norm || nt <= tol) {
                        jac = lambda == 1.0 ? broyden(jac, z, trial, f, ft) : null;
                        z = trial;
                        t = tt;
                        f = ft;
                        norm = nt;
                        accepted = true;
                        break;
                    }
                } catch (SolveException failed) {
                    lastFailure = failed.getMessage();
                }
            }
            if (!accepted && !freshJacobian) {
                jac = null;
                continue;
            }
            if (!accepted) {
                // Near the integration's own noise no step can reduce the mismatch further: that is convergence.
                if (norm <= 1e3 * tol) return new Result(t, z, it + 1, norm);
                throw new SolveException(worst(p, f), "the shooting on " + names(p) + " did not converge: "
                        + missed(p, t, f, tol) + "; no Newton step after " + (it + 1) + " improved on the last trial " + p.describeUnknowns(z)
                        + " (started from " + p.describeGuesses() + ")" + (lastFailure == null ? "" : "; a shorter step failed: " + lastFailure));
            }
        }
        if (norm <= 1e3 * tol) return new Result(t, z, MAX_ITERATIONS, norm);
        throw new SolveException(worst(p, f), "the shooting on " + names(p) + " did not converge in "
                + MAX_ITERATIONS + " Newton steps: " + missed(p, t, f, tol) + " at the last trial " + p.describeUnknowns(z)
                + " (started from " + p.describeGuesses() + ")");
    }

    private static final int RESCUE_TRIALS = 6;

    /**
     * When the first guess gives no usable trajectory (the surface beyond reach, a non-finite value),
     * tries guesses further and further away along each unknown and each pair, in log coordinates, and
     * returns the first that does; null when none does.
     */
    private static double[] rescue(CaseProblem p, double[] z0) {
        int n = z0.length;
        List<double[]> directions = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            for (int si = -1; si <= 1; si += 2) {
                double[] d = new double[n];
                d[i] = si;
                directions.add(d);
                for (int j = i + 1; j < n; j++) {
                    for (int sj = -1; sj <= 1; sj += 2) {
                        double[] e = d.clone();
                        e[j] = sj;
                        directions.add(e);
                    }
                }
            }
        }
        for (int k = 1; k <= RESCUE_TRIALS; k++) {
            double step = k * Math.log(10.0);
            for (double[] d : directions) {
                double[] z = z0.clone();
                for (int i = 0; i < n; i++) z[i] += (p.unknowns.get(i).log() ? step : Math.pow(10, k)) * d[i];
                try {
                    mismatch(p, p.integrate(z));
                    return z;
                } catch (SolveException tryFurther) {
                    // Keep widening the search.
                }
            }
        }
        return null;
    }

    /** Broyden's rank-one update of the Jacobian after the step z0 to z1 changed the mismatch from f0 to f1. */
    private static double[][] broyden(double[][] jac, double[] z0, double[] z1, double[] f0, double[] f1) {
        int m = f0.length, n = z0.length;
        double[] dz = new double[n];
        double dz2 = 0;
        for (int k = 0; k < n; k++) {
            dz[k] = z1[k] - z0[k];
            dz2 += dz[k] * dz[k];
        }
        if (!(dz2 > 0)) return null;
        double[][] out = new double[m][];
        for (int i = 0; i < m; i++) {
            double predicted = 0;
            for (int k = 0; k < n; k++) predicted += jac[i][k] * dz[k];
            double miss = (f1[i] - f0[i]) - predicted;
            out[i] = jac[i].clone();
            for (int k = 0; k < n; k++) out[i][k] += miss * dz[k] / dz2;
        }
        return out;
    }

    static String names(CaseProblem p) {
        return String.join(", ", p.unknowns.stream().map(CaseProblem.Unknown::name).toList());
    }

    /** The statement of the boundary missed the most, where a failure to converge is reported. */
    private static dev.plumb.lang.Span worst(CaseProblem p, double[] f) {
        int extra = p.fixedSurface ? 1 : 0, w = 0;
        for (int i = 1; i < f.length; i++) if (Math.abs(f[i]) > Math.abs(f[w])) w = i;
        if (f.length == 0) return p.form.coordinate.span();
        return w < extra ? p.surfaceBoundary.span() : p.conditions.get(w - extra).boundary().span();
    }

    /**
     * Which boundaries a trial misses and by how much against their own scale, worst first: a log
     * condition as a percentage, a plain one as its two sides and the scale they are measured by.
     */
    static String missed(CaseProblem p, Trajectory t, double[] f, double tol) {
        int extra = p.fixedSurface ? 1 : 0;
        Integer[] order = new Integer[f.length];
        for (int i = 0; i < f.length; i++) order[i] = i;
        java.util.Arrays.sort(order, (i, j) -> Double.compare(Math.abs(f[j]), Math.abs(f[i])));
        List<String> parts = new ArrayList<>();
        PointEvaluator ev = new PointEvaluator(p.form, p.values, t);
        for (int i : order) {
            if (Math.abs(f[i]) <= tol || parts.size() == 2) break;
            if (i < extra) {
                parts.add(String.format("the surface %s lies at %s = %s instead of at the end %s", CaseProblem.describe(p.surfaceBoundary),
                        p.form.coordinate.name(), p.form.position(t.surfaceX, "%.6g"), p.form.position(p.b, "%.6g")));
                continue;
            }
            CaseProblem.Condition c = p.conditions.get(i - extra);
            String what = "boundary " + CaseProblem.describe(c.boundary());
            if (c.log()) {
                parts.add(String.format("%s is missed by %+.3g%%", what, 100 * Math.expm1(f[i])));
            } else {
                String sides;
                try {
                    double l = ev.evaluate(c.boundary().equation().lhs()), r = ev.evaluate(c.boundary().equation().rhs());
                    dev.plumb.units.Unit u = p.form.units.forQuantity(c.boundary().equation().lhs());
                    sides = " (" + dev.plumb.model.FileUnits.format(l, u, "%.6g") + " against " + dev.plumb.model.FileUnits.format(r, u, "%.6g") + ")";
                } catch (SolveException unavailable) {
                    sides = "";
                }
                String scale = dev.plumb.model.FileUnits.format(c.scale(), p.form.units.forQuantity(c.boundary().equation().lhs()), "%.3g");
                parts.add(String.format(java.util.Locale.ROOT, "%s is missed by %.3g of its scale %s%s", what, Math.abs(f[i]), scale, sides));
            }
        }
        return parts.isEmpty() ? "the mismatch is " + String.format("%.3g", norm(f)) : String.join(", and ", parts);
    }

    private static double norm(double[] f) {
        double n = 0;
        for (double v : f) n = Math.max(n, Math.abs(v));
        return Double.isNaN(n) ? Double.POSITIVE_INFINITY : n;
    }

    private static double[][] jacobian(CaseProblem p, double[] z, double[] f) throws SolveException {
        int n = z.length;
        double[][] jac = new double[f.length][n];
        for (int k = 0; k < n; k++) {
            double h = 1e-6 * Math.max(1.0, Math.abs(z[k]) * (p.unknowns.get(k).log() ? 0 : 1));
            double[] zp = z.clone();
            zp[k] += h;
            double[] fp;
            try {
                fp = mismatch(p, p.integrate(zp));
            } catch (SolveException forwardFailed) {
                zp[k] = z[k] - h;
                fp = mismatch(p, p.integrate(zp));
                h = -h;
            }
            for (int i = 0; i < f.length; i++) jac[i][k] = (fp[i] - f[i]) / h;
        }
        return jac;
    }

    /** Each condition's mismatch for a trajectory; the surface of a fixed interval counts first. */
    static double[] mismatch(CaseProblem p, Trajectory t) throws SolveException {
        int extra = p.fixedSurface ? 1 : 0;
        double[] f = new double[p.conditions.size() + extra];
        if (p.fixedSurface) f[0] = Math.log((t.surfaceX - p.a) / (p.b - p.a));
        PointEvaluator ev = new PointEvaluator(p.form, p.values, t);
        for (int i = 0; i < p.conditions.size(); i++) {
            CaseProblem.Condition c = p.conditions.get(i);
            double l = ev.evaluate(c.boundary().equation().lhs());
            double r = ev.evaluate(c.boundary().equation().rhs());
            f[i + extra] = c.log() ? (l > 0 ? Math.log(l / r) : Double.NaN) : (l - r) / c.scale();
        }
        for (double v : f) {
            if (!Double.isFinite(v)) {
                throw new SolveException(p.form.coordinate.span(), "a boundary mismatch is not finite for " + p.describeUnknowns(
                        p.initialVector().length == 0 ? new double[0] : reencode(p, t)));
            }
        }
        return f;
    }

    private static double[] reencode(CaseProblem p, Trajectory t) {
        double[] z = new double[p.unknowns.size()];
        double[] y0 = t.states.firstEntry().getValue();
        for (int k = 0; k < z.length; k++) {
            CaseProblem.Unknown u = p.unknowns.get(k);
            double v = u.component() >= 0 ? y0[u.component()] : t.constants[u.constant()];
            z[k] = u.log() ? Math.log(v) : v / (u.component() >= 0 ? p.scale[u.component()] : 1.0);
        }
        return z;
    }
}
