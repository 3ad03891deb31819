package dev.plumb.numeric;

import dev.plumb.lang.Expr;
import dev.plumb.lang.ExprPrinter;
import dev.plumb.lang.Span;
import dev.plumb.model.FileUnits;
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
    /** The series start, or null for a regular start. */
    private final SeriesStart.Result series;
    double surfaceX = Double.NaN;
    double[] surfaceState;
    boolean surfaceByApproach;
    /** The exponent p of the last stretch integrated in |y - v|^(1/p) (see SurfaceApproach), NaN when none was. */
    double surfaceExponent = Double.NaN;
    int steps;
    /** The lowest value of each state component over the main integration, and where it was. */
    double[] lowest, lowestAt;

    Trajectory(CaseProblem problem, double[] constants, double[] start, double seriesX, double[] seriesState, SeriesStart.Result series) {
        this.problem = problem;
        this.constants = constants.clone();
        this.seriesX = seriesX;
        this.series = series;
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
        SeriesStart.Result note = null;
        boolean singular = false;
        for (double s : slope) singular |= !Double.isFinite(s);
        if (singular) {
            double[] tol = new double[y0.length];
            for (int i = 0; i < tol.length; i++) {
                tol[i] = p.options.relTol() * Math.max(Math.abs(y0[i]), p.scale[i] * p.options.absTolScale() / p.options.relTol());
            }
            SeriesStart.Result r = SeriesStart.start(p.system, p.a, y0, p.seriesFirstLength(), p.seriesLongestLength(), p.scale, tol,
                    p.surface == null ? -1 : p.surface.index(), p.surface == null ? 0.0 : p.surface.value());
            p.seriesLength = r.x() - p.a;
            x = r.x();
            y = r.y();
            note = r;
        }
        Trajectory t = new Trajectory(p, consts, y0, x, y, note);
        // A free surface is sought out to the scale of the relations times 1e4, or a billion times the
        // series start's own length, whichever is further: a poor scale estimate cannot hide the surface.
        double end = Double.isNaN(p.b) ? p.a + (p.forward() ? 1 : -1) * Math.max(Math.abs(p.limit - p.a), 1e9 * Math.abs(x - p.a))
                : p.surface != null ? p.limit : p.b;
        t.lowest = y0.clone();
        t.lowestAt = new double[y0.length];
        java.util.Arrays.fill(t.lowestAt, p.a);
        for (int i = 0; i < y.length; i++) {
            if (y[i] < t.lowest[i]) {
                t.lowest[i] = y[i];
                t.lowestAt[i] = x;
            }
        }
        p.integration.lowest = t.lowest;
        p.integration.lowestAt = t.lowestAt;
        Integration.Stop stop;
        try {
            stop = p.integration.advance(x, y, end, p.surface);
        } finally {
            p.integration.lowest = null;
            p.integration.lowestAt = null;
        }
        t.steps += stop.steps();
        if (p.surface != null) {
            if (!stop.atSurface() && !Double.isNaN(stop.asymptote())) {
                throw new SolveException(p.surfaceBoundary.span(), "the surface " + p.surface.description() + " = "
                        + p.form.componentValue(p.surface.index(), p.surface.value(), FileUnits.SHORT) + " is never reached: "
                        + p.form.componentName(p.surface.index())
                        + " approaches it without arriving, falling by a factor e every " + p.form.position(stop.asymptote(), "%.4g")
                        + " near " + p.form.coordinate.name() + " = " + p.form.position(stop.x(), "%.6g")
                        + (p.unknowns.isEmpty() ? "" : " (with " + p.describeUnknowns(z) + ")")
                        + ": the relations put no surface at a finite distance");
            }
            if (!stop.atSurface()) {
                String reach = Double.isNaN(p.b) ? String.format(" (the search goes to 1e4 times the length scale of the balance, %s, "
                        + "or 1e9 times the series start, whichever is further; 'guess %s = ...' sets the scale)", p.form.position(p.scaleX, "%.3g"),
                        p.form.freeEnd.name())
                        : String.format(" (%.0f times the interval)", CaseProblem.FIXED_SURFACE_REACH);
                throw new SolveException(p.surfaceBoundary.span(), "the surface " + p.surface.description() + " = "
                        + p.form.componentValue(p.surface.index(), p.surface.value(), FileUnits.SHORT) + " is never reached: integrated from "
                        + p.form.coordinate.name() + " = " + p.form.position(p.a, FileUnits.SHORT) + " to " + p.form.position(end, "%.6g") + reach
                        + (p.unknowns.isEmpty() ? "" : " with " + p.describeUnknowns(z)) + "; there " + p.integration.describe(stop.y()));
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

    /** How the integration started: regularly, or from a series at a singular point. */
    String startNote() {
        return series == null ? "regular start" : series.description(problem.form);
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
                throw new SolveException(at(where), (where == null ? "the point " : ExprPrinter.print(where) + " asks for the point ")
                        + problem.form.coordinate.name() + " = " + problem.form.position(x, FileUnits.SHORT) + ", beyond the surface at "
                        + problem.form.position(surfaceX, "%.9g") + ": plumb does not extrapolate past the end of the interval", true);
            }
        }
        boolean before = problem.forward() ? x < problem.a : x > problem.a;
        boolean after = !Double.isNaN(problem.b) && !problem.fixedSurface
                && (problem.forward() ? x > problem.b : x < problem.b) && Math.abs(x - problem.b) > 1e-12 * problem.scaleX;
        if (before || after) {
            throw new SolveException(at(where), (where == null ? "the point " : ExprPrinter.print(where) + " asks for the point ")
                    + problem.form.coordinate.name() + " = " + problem.form.position(x, FileUnits.SHORT) + ", outside the interval from "
                    + problem.form.position(problem.a, FileUnits.SHORT) + " to " + problem.form.position(problem.b, FileUnits.SHORT) + ": plumb does not extrapolate", true);
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

    private Span at(Expr.Call where) {
        return where == null ? problem.form.coordinate.span() : where.span();
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
