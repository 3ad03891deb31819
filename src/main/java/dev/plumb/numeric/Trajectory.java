package dev.plumb.numeric;

import dev.plumb.lang.Expr;
import dev.plumb.lang.ExprPrinter;
import java.util.Map;
import java.util.TreeMap;

/**
 * One integration of a case for given unknowns: the states recorded at the start, after the
 * series start, at the points the boundaries and quantities need, and at the surface. States at
 * other points are integrated on demand from the nearest recorded one, so every value is as
 * accurate as an integration that stopped exactly there (no interpolation).
 */
final class Trajectory implements PointEvaluator.States {

    final CaseProblem problem;
    final double[] constants;
    final TreeMap<Double, double[]> states = new TreeMap<>();
    final double seriesX;
    final String startNote;
    double surfaceX = Double.NaN;
    double[] surfaceState;
    boolean surfaceByApproach;
    /** The exponent p of the last stretch integrated in |y - v|^(1/p) (see SurfaceApproach), NaN when none was. */
    double surfaceExponent = Double.NaN;
    int steps;

    Trajectory(CaseProblem problem, double[] constants, double[] start, double seriesX, double[] seriesState, String startNote) {
        this.problem = problem;
        this.constants = constants.clone();
        this.seriesX = seriesX;
        this.startNote = startNote;
        states.put(problem.a, start.clone());
        states.put(seriesX, seriesState.clone());
    }

    /** Integrates a case from the start to the end of the interval (or to the surface) for the unknowns {@code z}. */
    static Trajectory integrate(CaseProblem p, double[] z) throws SolveException {
        double[][] d = p.decode(z);
        double[] consts = d[0], y0 = d[1];
        for (int i = 0; i < y0.length; i++) {
            if (!Double.isFinite(y0[i])) {
                throw new SolveException(p.form.coordinate.span(), "the start value of " + p.form.componentName(i) + " is not finite");
            }
        }
        p.integration.freeBranches();
        double[] slope = p.system.derivatives(p.a, y0);
        double x = p.a;
        double[] y = y0;
        String note = "regular start";
        boolean singular = false;
        for (double s : slope) singular |= !Double.isFinite(s);
        if (singular) {
            double[] tol = new double[y0.length];
            for (int i = 0; i < tol.length; i++) {
                tol[i] = p.options.relTol() * Math.max(Math.abs(y0[i]), p.scale[i] * p.options.absTolScale() / p.options.relTol());
            }
            SeriesStart.Result r = SeriesStart.start(p.system, p.a, y0, (p.forward() ? 1 : -1) * 1e-2 * p.scaleX, p.scale, tol);
            x = r.x();
            y = r.y();
            note = r.description();
        }
        Trajectory t = new Trajectory(p, consts, y0, x, y, note);
        double end = Double.isNaN(p.b) ? p.limit : p.surface != null ? p.limit : p.b;
        Integration.Stop stop = p.integration.advance(x, y, end, p.surface);
        t.steps += stop.steps();
        if (p.surface != null) {
            if (!stop.atSurface()) {
                throw new SolveException(p.surfaceBoundary.span(), "the surface " + p.surface.description() + " = "
                        + SeriesStart.trim(p.surface.value()) + " was never reached: integrated from " + p.form.coordinate.name() + " = "
                        + SeriesStart.trim(p.a) + " to " + String.format("%.6g", end) + " with " + p.describeUnknowns(z)
                        + "; at the end " + p.integration.describe(stop.y()));
            }
            t.surfaceX = stop.x();
            t.surfaceState = stop.y().clone();
            t.surfaceByApproach = stop.byApproach();
            t.surfaceExponent = stop.exponent();
            t.states.put(stop.x(), stop.y().clone());
        } else {
            t.states.put(stop.x(), stop.y().clone());
        }
        return t;
    }

    boolean surfaceReached() {
        return !Double.isNaN(surfaceX);
    }

    @Override
    public double[] stateAt(double x, Expr.Call where) throws SolveException {
        double[] known = states.get(x);
        if (known != null) return known.clone();
        if (surfaceReached()) {
            boolean past = problem.forward() ? x > surfaceX : x < surfaceX;
            boolean fixedEnd = problem.fixedSurface && x == problem.b;
            if (fixedEnd || (past && Math.abs(x - surfaceX) <= 1e-9 * problem.scaleX)) return surfaceState.clone();
            if (past) {
                throw new SolveException(where == null ? problem.form.coordinate.span() : where.span(),
                        (where == null ? "the point " : ExprPrinter.print(where) + ": the point ") + problem.form.coordinate.name()
                                + " = " + SeriesStart.trim(x) + " lies beyond the surface at " + String.format("%.9g", surfaceX));
            }
        }
        boolean before = problem.forward() ? x < problem.a : x > problem.a;
        if (before) {
            throw new SolveException(where == null ? problem.form.coordinate.span() : where.span(), "the point "
                    + problem.form.coordinate.name() + " = " + SeriesStart.trim(x) + " lies outside the interval");
        }
        problem.load(constants);
        double from;
        boolean insideSeries = problem.forward() ? x < seriesX : x > seriesX;
        if (insideSeries) {
            from = seriesX;
        } else {
            Map.Entry<Double, double[]> e = problem.forward() ? states.floorEntry(x) : states.ceilingEntry(x);
            from = e.getKey();
        }
        Integration.Stop s = problem.integration.advance(from, states.get(from), x, null);
        steps += s.steps();
        states.put(x, s.y().clone());
        return s.y().clone();
    }

    @Override
    public double[] derivativesAt(double x, double[] state, Expr.Call where) {
        problem.load(constants);
        problem.integration.freeBranches();
        return problem.system.derivatives(x, state);
    }

    @Override
    public double constant(int k) {
        return constants[k];
    }

    @Override
    public double freeEnd() {
        return surfaceX;
    }
}
