package dev.plumb.numeric;

import org.apache.commons.math3.analysis.solvers.AllowedSolution;
import org.apache.commons.math3.analysis.solvers.BracketingNthOrderBrentSolver;
import org.apache.commons.math3.ode.nonstiff.DormandPrince853Integrator;
import org.apache.commons.math3.ode.sampling.AbstractStepInterpolator;
import org.apache.commons.math3.util.Precision;

/**
 * Dormand-Prince 8(5,3) that records every accepted step from the state the integrator itself
 * computed, and that watches one switching function g(x, y) for a falling sign change, stopping
 * at its root. Commons Math's step handlers and event handlers read the state through the dense
 * output, and the first read in each step makes the 8(5,3) interpolator evaluate three extra
 * stages: a quarter more evaluations on every step, for a state the step already has at its end.
 * Here the dense output is only used inside the one step where g changes sign (and at interior
 * checks of a step longer than the check interval), with the same bracketing Brent solver and
 * convergence Commons Math's event handling uses, so the switch lands where it did.
 *
 * <p>A step in which a stage was not finite is rejected: the embedded error estimate alone would
 * accept it, because the stand-in derivatives are equal in every stage and their weighted
 * difference vanishes.
 */
final class WatchedDormandPrince extends DormandPrince853Integrator {

    /** A switching function of the coordinate and the state. */
    interface Switch {
        double g(double x, double[] y);
    }

    /** Thrown out of the integration where the switching function fell through zero. */
    static final class Reached extends RuntimeException {
        final double x;
        final double[] y;

        Reached(double x, double[] y) {
            super(null, null, false, false);
            this.x = x;
            this.y = y;
        }
    }

    private final RelationSystem system;
    /** The end of the last accepted step and its state (the start until a step is accepted), and the one before. */
    double last, stepStart;
    double[] lastY, stepStartY;
    int steps;
    /** When set, the lowest value of each component at the end of any accepted step and where it was. */
    double[] lowest, lowestAt;

    private Switch watch;
    private double maxCheck, convergence, watchedX, watchedG;
    private int maxIterations;

    WatchedDormandPrince(RelationSystem system, double minStep, double maxStep, double[] absTol, double[] relTol,
                         double x0, double[] y0) {
        super(minStep, maxStep, absTol, relTol);
        this.system = system;
        last = stepStart = x0;
        lastY = stepStartY = y0.clone();
    }

    /** Stops the integration (by {@link Reached}) where {@code g} first falls through zero; g must be positive at the start. */
    void watch(Switch g, double maxCheckInterval, double convergence, int maxIterations) {
        this.watch = g;
        this.maxCheck = maxCheckInterval;
        this.convergence = convergence;
        this.maxIterations = maxIterations;
        this.watchedX = last;
        this.watchedG = g.g(last, lastY);
    }

    @Override
    protected double estimateError(double[][] yDotK, double[] y0, double[] y1, double h) {
        double error = super.estimateError(yDotK, y0, y1, h);
        return system.takeNonFinite() ? 1e10 : error;
    }

    @Override
    protected double acceptStep(AbstractStepInterpolator interpolator, double[] y, double[] yDot, double tEnd) {
        double t1 = interpolator.getCurrentTime();
        if (watch != null) crossing(interpolator, t1, y);
        record(t1, y.clone());
        if (!getEventHandlers().isEmpty() || !getStepHandlers().isEmpty()) return super.acceptStep(interpolator, y, yDot, tEnd);
        // What Commons Math's acceptStep does with no event or step handler, less its read of the dense output at
        // the step's end (which costs the 8(5,3) interpolator three stages).
        double t = interpolator.getGlobalCurrentTime();
        isLastStep = isLastStep || Precision.equals(t, tEnd, 1);
        return t;
    }

    private void record(double t, double[] state) {
        stepStart = last;
        stepStartY = lastY;
        last = t;
        lastY = state;
        steps++;
        if (lowest != null) {
            for (int i = 0; i < lowest.length; i++) {
                if (state[i] < lowest[i]) {
                    lowest[i] = state[i];
                    lowestAt[i] = t;
                }
            }
        }
    }

    /** Looks for a falling sign change of the switch in the step ending at (t1, y1), as Commons Math's event states do. */
    private void crossing(AbstractStepInterpolator interpolator, double t1, double[] y1) {
        double t0 = watchedX, dt = t1 - t0;
        if (Math.abs(dt) < convergence) {
            // Commons Math does nothing on a step this short; the next check starts from its end.
            watchedX = t1;
            watchedG = watch.g(t1, y1);
            return;
        }
        int n = Math.max(1, (int) Math.ceil(Math.abs(dt) / maxCheck));
        double h = dt / n, ta = t0, ga = watchedG;
        for (int i = 0; i < n; i++) {
            double tb = i == n - 1 ? t1 : t0 + (i + 1) * h;
            double gb = i == n - 1 ? watch.g(t1, y1) : at(interpolator, tb);
            if ((ga >= 0) != (gb >= 0) && gb < ga) {
                boolean forward = dt > 0;
                BracketingNthOrderBrentSolver solver = new BracketingNthOrderBrentSolver(convergence, 5);
                double root = forward ? solver.solve(maxIterations, t -> at(interpolator, t), ta, tb, AllowedSolution.RIGHT_SIDE)
                        : solver.solve(maxIterations, t -> at(interpolator, t), tb, ta, AllowedSolution.LEFT_SIDE);
                interpolator.setInterpolatedTime(root);
                double[] state = interpolator.getInterpolatedState().clone();
                record(root, state);
                throw new Reached(root, state);
            }
            ta = tb;
            ga = gb;
        }
        watchedX = t1;
        watchedG = ga;
    }

    private double at(AbstractStepInterpolator interpolator, double t) {
        interpolator.setInterpolatedTime(t);
        return watch.g(t, interpolator.getInterpolatedState());
    }
}
