package dev.plumb.numeric;

import org.apache.commons.math3.exception.MaxCountExceededException;
import org.apache.commons.math3.exception.NumberIsTooSmallException;
import org.apache.commons.math3.ode.FirstOrderDifferentialEquations;
import org.apache.commons.math3.ode.nonstiff.DormandPrince853Integrator;

/**
 * The last stretch to a free surface, integrated in a variable that reaches it linearly. Near a
 * surface where the component y reaches the value v, y - v ~ C s^p with s the distance left
 * (p = n + 1 for a polytrope's pressure, 1/2 for Chandrasekhar's x); integrated in the
 * coordinate, the relations are undefined past the surface (a fractional power of a negative
 * number), so the steps shrink geometrically towards it and y - v falls below every absolute
 * tolerance long before the zero is pinned down. With w = |y - v|^(1/p) as independent variable
 * the coordinate and the other components are smooth functions of w, the integration runs from
 * the present w to exactly w = 0, and the surface is where it ends.
 *
 * <p>The exponent p comes from the relations themselves: if y' ~ A |y - v|^q near the surface
 * (at fixed coordinate and other components), then p = 1/(1 - q); q is read as the slope of
 * ln |y'| against ln |y - v| between two points a thousandth and a millionth of the way to v.
 * For a pure power law (a polytrope) that is exact.
 */
final class SurfaceApproach {

    /**
     * Where the coordinate switches to w: when the distance left, estimated as |y - v| / |y'| (which is
     * s/p), falls below this fraction of the distance integrated so far. The stretch in w is smooth, so
     * an early switch saves steps (an n = 3 polytrope: 87 steps at 0.01, 57 at 0.1, same accuracy).
     */
    static final double SWITCH = 0.1;

    private static final double MAX_EXPONENT = 64;

    private SurfaceApproach() {
    }

    /**
     * The approach test, positive while the surface is further than {@link #SWITCH} of the way travelled
     * and negative once it is nearer (continuous, so Commons Math can locate the switch as an event).
     */
    static double gap(RelationSystem system, Integration.Surface surface, double origin, double x, double[] y, double sense,
                      double side) {
        int i = surface.index();
        double d = y[i] - surface.value();
        double slope = system.derivativesAside(x, y)[i];
        if (!Double.isFinite(slope)) return side * d;
        // sense: +1 when the coordinate increases; side: the sign of y - v where the segment began, fixed so that
        // the test stays negative past a crossing (a sign taken afresh would turn it positive again within the
        // same step, and Commons Math, seeing equal signs at both ends, would miss both roots).
        return side * (d + SWITCH * Math.abs(x - origin) * slope * sense);
    }

    /** The local exponent p of y - v ~ s^p at state (x, y), or NaN when the relations give none. */
    static double exponent(RelationSystem system, Integration.Surface surface, double x, double[] y) {
        int i = surface.index();
        double d = y[i] - surface.value();
        if (d == 0 || !Double.isFinite(d)) return Double.NaN;
        double[] probe = y.clone();
        probe[i] = surface.value() + d * 1e-3;
        double f1 = system.derivativesAside(x, probe)[i];
        probe[i] = surface.value() + d * 1e-6;
        double f2 = system.derivativesAside(x, probe)[i];
        if (!(f1 != 0 && f2 != 0 && Math.signum(f1) == Math.signum(f2)) || !Double.isFinite(f1) || !Double.isFinite(f2)) {
            return Double.NaN;
        }
        double q = Math.log(Math.abs(f1 / f2)) / Math.log(1e3);
        double p = 1 / (1 - q);
        return p > 0 && p <= MAX_EXPONENT ? p : Double.NaN;
    }

    /**
     * Integrates from (x0, y0) to the surface in the variable w; returns the surface point and state
     * (the surface component exactly at its value), or null when the relations do not approach the
     * surface like a power law from here (then the caller goes on in the coordinate).
     *
     * @param absX absolute tolerance on the coordinate
     */
    static Integration.Stop finish(RelationSystem system, Integration.Surface surface, double x0, double[] y0,
                                   double[] absTol, double[] relTol, double absX) throws SolveException {
        int i = surface.index(), n = y0.length;
        double p = exponent(system, surface, x0, y0);
        double d = y0[i] - surface.value();
        if (Double.isNaN(p)) return null;
        double sign = Math.signum(d);
        double slope0 = system.derivativesAside(x0, y0)[i];
        if (!(slope0 * sign < 0) && !(slope0 * sign > 0)) return null;
        double w0 = Math.pow(Math.abs(d), 1 / p);
        double floor = w0 * Math.max(1e-9, Math.pow(2, -900 / p));
        double[] work = new double[n], f = new double[n];
        boolean[] nonFinite = {false};
        FirstOrderDifferentialEquations inW = new FirstOrderDifferentialEquations() {
            @Override public int getDimension() {
                return n + 1;
            }

            @Override public void computeDerivatives(double w, double[] z, double[] zDot) {
                double x = z[n];
                System.arraycopy(z, 0, work, 0, n);
                // Within the floor of the surface the relations are read at the floor: the error is of the order of
                // the floor squared, and at w = 0 itself they may be infinite (x' ~ 1/x) or 0/0.
                double wr = Math.max(Math.abs(w), floor), wp1 = Math.pow(wr, p - 1);
                work[i] = surface.value() + sign * wp1 * wr;
                // Straight into a kept array: the coordinate's integration is over, so the record of non-finite
                // evaluations it reads may be written (the next segment clears it before it starts).
                system.computeDerivatives(x, work, f);
                double fi = f[i];
                // dx/dw from sign * (y_i - v) = w^p: sign * y_i' dx = p w^(p-1) dw.
                double dxdw = p * wp1 / (sign * fi);
                boolean ok = system.lastFinite() && Double.isFinite(dxdw);
                for (int k = 0; k < n; k++) {
                    // The surface component is w^p itself, written back from w; it is carried along unchanged.
                    zDot[k] = k == i ? 0.0 : f[k] * dxdw;
                    ok &= Double.isFinite(zDot[k]);
                }
                zDot[n] = dxdw;
                if (!ok) {
                    nonFinite[0] = true;
                    java.util.Arrays.fill(zDot, RelationSystem.REJECT);
                }
            }
        };
        double[] abs = new double[n + 1], rel = new double[n + 1];
        for (int k = 0; k < n; k++) {
            abs[k] = absTol[k];
            rel[k] = relTol[k];
        }
        abs[n] = absX;
        rel[n] = relTol[i];
        int[] steps = {0};
        DormandPrince853Integrator dp = new DormandPrince853Integrator(w0 * 1e-12, w0, abs, rel) {
            @Override
            protected double estimateError(double[][] yDotK, double[] y, double[] y1, double h) {
                double error = super.estimateError(yDotK, y, y1, h);
                boolean bad = nonFinite[0];
                nonFinite[0] = false;
                return bad ? 1e10 : error;
            }

            @Override
            protected double acceptStep(org.apache.commons.math3.ode.sampling.AbstractStepInterpolator interpolator, double[] y,
                                        double[] yDot, double tEnd) {
                // Counted here rather than by a step handler, and without Commons Math's read of the dense output at the
                // step's end, which costs the 8(5,3) interpolator three stages (nothing here uses it).
                steps[0]++;
                double t = interpolator.getGlobalCurrentTime();
                isLastStep = isLastStep || org.apache.commons.math3.util.Precision.equals(t, tEnd, 1);
                return t;
            }
        };
        dp.setMaxEvaluations(200_000);
        double[] z0 = new double[n + 1];
        System.arraycopy(y0, 0, z0, 0, n);
        z0[n] = x0;
        double[] z = z0.clone();
        try {
            dp.integrate(inW, w0, z0, 0.0, z);
        } catch (NumberIsTooSmallException | MaxCountExceededException notAPowerLaw) {
            return null;
        }
        double[] y = new double[n];
        System.arraycopy(z, 0, y, 0, n);
        y[i] = surface.value();
        for (double v : y) if (!Double.isFinite(v)) return null;
        if (!Double.isFinite(z[n])) return null;
        return new Integration.Stop(z[n], y, true, steps[0], false, p);
    }
}
