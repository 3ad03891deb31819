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
    int steps;

    Trajectory(CaseProblem problem, double[] constants, double[] start, double seriesX, double[] seriesState, String startNote) {
        this.problem = problem;
        this.constants = constants.clone();
        this.seriesX = seriesX;
        this.startNote = startNote;
        states.put(problem.a, start.clone());
        states.put(seriesX, seriesState.clone());
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
