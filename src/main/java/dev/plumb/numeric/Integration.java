package dev.plumb.numeric;

import java.util.List;
import org.apache.commons.math3.exception.MaxCountExceededException;
import org.apache.commons.math3.exception.NumberIsTooSmallException;
import org.apache.commons.math3.ode.events.EventHandler;
import org.apache.commons.math3.ode.sampling.StepHandler;
import org.apache.commons.math3.ode.sampling.StepInterpolator;

/**
 * Integrates one case's relation system between two points with Dormand-Prince 8(5,3) from
 * Commons Math, stopping at every break of a piecewise relation (so no step straddles a kink and
 * each segment uses its own branch), and optionally at a free surface where one state component
 * reaches a given value. A step whose stages leave the domain of the relations (a negative base
 * under a fractional power just past a surface) is rejected rather than accepted with NaN, so a
 * surface the relations cannot cross is approached until the step size runs out; that end point
 * is accepted as the surface only when the component is within a hair of the surface value.
 */
final class Integration {

    /** Where an integration stopped. */
    /**
     * Where an integration stopped; {@code exponent} is the power p of the approach y - v ~ s^p when
     * the surface was reached in w = |y - v|^(1/p), and {@code asymptote} the e-folding length when
     * the profile only approached the surface value without reaching it (both NaN otherwise).
     */
    record Stop(double x, double[] y, boolean atSurface, int steps, boolean byApproach, double exponent, double asymptote) {
        Stop(double x, double[] y, boolean atSurface, int steps, boolean byApproach, double exponent) {
            this(x, y, atSurface, steps, byApproach, exponent, Double.NaN);
        }

        Stop(double x, double[] y, boolean atSurface, int steps) {
            this(x, y, atSurface, steps, false, Double.NaN);
        }

        Stop(double x, double[] y, boolean atSurface, int steps, boolean byApproach) {
            this(x, y, atSurface, steps, byApproach, Double.NaN);
        }
    }

    /** The surface condition: component {@code index} reaches {@code value}. */
    record Surface(int index, double value, String description) { }

    static final String METHOD = "Dormand-Prince 8(5,3)";

    /**
     * When set, the lowest value of each component at the end of any accepted step and where it was
     * (for a sign check of the main integration; stays null for on-demand integrations).
     */
    double[] lowest, lowestAt;

    final RelationSystem system;
    final double[] absTol, relTol;
    final double minStep;
    final double[] breaks;
    final List<ExprCompiler.CoordinateCondition> conditions;
    final double[] scale;

    Integration(RelationSystem system, double[] absTol, double[] relTol, double minStep, double[] breaks,
                List<ExprCompiler.CoordinateCondition> conditions, double[] scale) {
        this.system = system;
        this.absTol = absTol;
        this.relTol = relTol;
        this.minStep = minStep;
        this.breaks = breaks;
        this.conditions = conditions;
        this.scale = scale;
    }

    /** Integrates from (x0, y0) to x1 (either direction), or until the surface when one is given. */
    Stop advance(double x0, double[] y0, double x1, Surface surface) throws SolveException {
        double x = x0;
        double[] y = y0.clone();
        int steps = 0;
        boolean forward = x1 > x0;
        while (x != x1) {
            double next = x1;
            for (double b : breaks) {
                if (forward ? b > x && b < next : b < x && b > next) next = b;
            }
            lockBranches(0.5 * (x + next));
            Stop s = segment(x, y, next, surface, x0, true);
            steps += s.steps();
            y = s.y();
            if (s.atSurface()) return new Stop(s.x(), y, true, steps, s.byApproach(), s.exponent());
            if (!Double.isNaN(s.asymptote())) {
                freeBranches();
                return new Stop(s.x(), y, false, steps, false, Double.NaN, s.asymptote());
            }
            // The integrator ends a span within an ulp of where it was asked to; taken as is, the rest would
            // be a span too short to integrate (Commons Math refuses it as "too small"), so the segment's end
            // is taken to be the point asked for.
            x = next;
        }
        freeBranches();
        return new Stop(x, y, false, steps);
    }

    private void lockBranches(double mid) {
        double[] f = system.frame;
        double saved = f[0];
        f[0] = mid;
        for (ExprCompiler.CoordinateCondition c : conditions) f[c.lockSlot()] = Double.NaN;
        double[] locks = new double[conditions.size()];
        for (int k = 0; k < locks.length; k++) {
            Evaluator.newEvaluation(f, system.form.firstLockSlot());
            ExprCompiler.CoordinateCondition c = conditions.get(k);
            locks[k] = c.op().test(c.g().at(f), 0.0) ? 1.0 : 0.0;
        }
        for (int k = 0; k < locks.length; k++) f[conditions.get(k).lockSlot()] = locks[k];
        Evaluator.newEvaluation(f, system.form.firstLockSlot());
        f[0] = saved;
    }

    void freeBranches() {
        for (ExprCompiler.CoordinateCondition c : conditions) system.frame[c.lockSlot()] = Double.NaN;
    }

    /**
     * @param origin   where the integration began (the approach to a surface is judged against the way travelled)
     * @param approach whether to switch to {@link SurfaceApproach} near the surface
     */
    private Stop segment(double x0, double[] y0, double x1, Surface surface, double origin, boolean approach)
            throws SolveException {
        double span = Math.abs(x1 - x0);
        if (span <= 1e-11 * Math.max(Math.abs(x0), Math.abs(x1))) return shortSegment(x0, y0, x1, surface);
        WatchedDormandPrince dp = new WatchedDormandPrince(system, Math.min(minStep, span * 1e-3), span, absTol, relTol, x0, y0);
        system.takeNonFinite();
        dp.setMaxEvaluations(2_000_000);
        dp.lowest = lowest;
        dp.lowestAt = lowestAt;
        boolean[] hit = {false};
        if (surface != null && approach) {
            double sense = x1 > x0 ? 1.0 : -1.0, side = y0[surface.index()] >= surface.value() ? 1.0 : -1.0;
            // (Commons Math skips a step shorter than the event's convergence, sign change and all; a loose
            // convergence would let the switch slip by near the surface, where steps are short.)
            dp.watch((t, y) -> SurfaceApproach.gap(system, surface, origin, t, y, sense, side),
                    Math.max(span / 16, minStep * 10), Math.max(1e-9 * span, minStep), 200);
        }
        // While the approach is watched the crossing needs no test of its own: before y - v can change sign
        // with a finite slope, the approach test has already turned negative.
        if (surface != null && !approach) {
            dp.addEventHandler(new EventHandler() {
                @Override public void init(double t0, double[] y, double t) { }

                @Override public double g(double t, double[] y) {
                    return y[surface.index()] - surface.value();
                }

                @Override public Action eventOccurred(double t, double[] y, boolean increasing) {
                    hit[0] = true;
                    return Action.STOP;
                }

                @Override public void resetState(double t, double[] y) { }
            }, Math.max(span / 16, minStep * 10), Math.max(1e-15 * Math.abs(x0), minStep * 1e-2), 200);
            // The steps are recorded from the integrator's own end states, which past a crossing lie beyond it:
            // with a Commons Math event the lowest values come from a step handler, which sees the truncated step.
            dp.lowest = null;
            if (lowest != null) {
                dp.addStepHandler(new StepHandler() {
                    @Override public void init(double t0, double[] y, double t) { }

                    @Override public void handleStep(StepInterpolator interpolator, boolean isLast) {
                        double[] at = interpolator.getInterpolatedState();
                        for (int i = 0; i < lowest.length; i++) {
                            if (at[i] < lowest[i]) {
                                lowest[i] = at[i];
                                lowestAt[i] = interpolator.getCurrentTime();
                            }
                        }
                    }
                });
            }
        }
        double[] y = y0.clone();
        try {
            double end;
            boolean near = false;
            try {
                end = dp.integrate(system, x0, y0.clone(), x1, y);
            } catch (WatchedDormandPrince.Reached switched) {
                end = switched.x;
                y = switched.y.clone();
                near = true;
            }
            if (near) {
                Stop tail = SurfaceApproach.finish(system, surface, end, y, absTol, relTol, minStep * 10);
                if (tail != null) return new Stop(tail.x(), tail.y(), true, dp.steps + tail.steps(), false, tail.exponent());
                // Not a power-law approach after all: go on in the coordinate, watching only for the crossing.
                Stop rest = segment(end, y, x1, surface, origin, false);
                return new Stop(rest.x(), rest.y(), rest.atSurface(), dp.steps + rest.steps(), rest.byApproach(), rest.exponent(),
                        rest.asymptote());
            }
            if (hit[0]) {
                double asymptote = asymptote(dp.stepStart, dp.stepStartY, surface);
                if (!Double.isNaN(asymptote)) return new Stop(end, y, false, dp.steps, false, Double.NaN, asymptote);
            }
            return new Stop(end, y, hit[0], dp.steps);
        } catch (NumberIsTooSmallException stalled) {
            double xs = dp.last;
            double[] ys = dp.lastY;
            if (surface != null && Math.abs(ys[surface.index()] - surface.value()) <= 1e-6 * scale[surface.index()]) {
                return new Stop(xs, ys, true, dp.steps, true);
            }
            throw new SolveException(system.form.coordinate.span(), "the integration stalled at "
                    + system.form.coordinate.name() + " = " + system.form.position(xs, "%.9g")
                    + (system.lastFinite() ? "" : ", where the relations give a non-finite value")
                    + " (step size below " + system.form.position(Math.min(minStep, span * 1e-3), "%.3g") + "; state "
                    + describe(ys) + "): the relations may be singular there");
        } catch (MaxCountExceededException tooMany) {
            throw new SolveException(system.form.coordinate.span(), "the integration needed more than 2,000,000 evaluations between "
                    + system.form.coordinate.name() + " = " + system.form.position(x0, "%.6g") + " and " + system.form.position(dp.last, "%.6g")
                    + " (tolerance " + relTol[0] + "): the relations are too stiff here");
        }
    }

    /**
     * Whether a crossing of the surface value found in the step from (x, y) is an artefact of an
     * approach that never arrives: NaN when the crossing is genuine, else the local e-folding length.
     * Near a genuine surface the distance to it behaves like a power, g ~ C s^p with s the distance,
     * and g g''/g'^2 = (p - 1)/p stays below 1; an exponential approach (an isothermal atmosphere
     * thinning out) has g g''/g'^2 = 1, p infinite, and its "crossing" is the integrator stepping
     * past a value far below its tolerance, which must not be taken for a surface.
     */
    private double asymptote(double x, double[] y, Surface surface) {
        int i = surface.index();
        double g = y[i] - surface.value();
        double[] f0 = system.derivatives(x, y);
        double slope = f0[i];
        if (!(g * slope < 0)) return Double.NaN;
        double delta = 1e-6 * Math.abs(g / slope);
        double[] y1 = y.clone();
        for (int k = 0; k < y1.length; k++) y1[k] += delta * f0[k];
        double[] f1 = system.derivatives(x + delta, y1);
        double curvature = (f1[i] - slope) / delta;
        double p = 1.0 / (1.0 - g * curvature / (slope * slope));
        if (Double.isFinite(curvature) && !(p > 0 && p < 50)) return Math.abs(g / slope);
        return Double.NaN;
    }

    /**
     * A span so short beside its coordinate that Commons Math will not integrate it (a point a few ulps
     * past a recorded state, or a break that close to the start): one explicit midpoint step, whose error
     * is of the order of the span squared, far below any tolerance.
     */
    private Stop shortSegment(double x0, double[] y0, double x1, Surface surface) throws SolveException {
        double h = x1 - x0;
        double[] k1 = system.derivatives(x0, y0);
        double[] mid = y0.clone();
        for (int i = 0; i < mid.length; i++) mid[i] += 0.5 * h * k1[i];
        double[] k2 = system.derivatives(x0 + 0.5 * h, mid);
        double[] y = y0.clone();
        for (int i = 0; i < y.length; i++) y[i] += h * k2[i];
        for (double v : y) {
            if (!Double.isFinite(v)) {
                throw new SolveException(system.form.coordinate.span(), "the relations are not finite between "
                        + system.form.coordinate.name() + " = " + system.form.position(x0, "%.12g") + " and " + system.form.position(x1, "%.12g")
                        + " (state " + describe(y0) + ")");
            }
        }
        boolean crossed = surface != null && (y0[surface.index()] - surface.value()) * (y[surface.index()] - surface.value()) <= 0;
        return new Stop(x1, y, crossed, 1);
    }

    String describe(double[] y) {
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < y.length; i++) {
            if (i > 0) sb.append(", ");
            sb.append(system.form.componentName(i)).append(" = ").append(system.form.componentValue(i, y[i], "%.6g"));
        }
        return sb.toString();
    }
}
