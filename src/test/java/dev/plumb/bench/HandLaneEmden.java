package dev.plumb.bench;

import org.apache.commons.math3.ode.FirstOrderDifferentialEquations;
import org.apache.commons.math3.ode.events.EventHandler;
import org.apache.commons.math3.ode.nonstiff.DormandPrince853Integrator;

/**
 * The n = 3 polytrope of given mass and radius solved by hand with Commons Math, as a yardstick
 * for the engine: the Lane-Emden equation theta'' = -theta^n - 2 theta'/xi from a short series at
 * the centre, Dormand-Prince 8(5,3) with an event at theta = 0, then the homology relations
 * alpha = R/xi1, rho_c = M/(4 pi alpha^3 omega) with omega = -xi1^2 theta'(xi1),
 * K = 4 pi G alpha^2 rho_c^(1 - 1/n)/(n + 1) and P(0) = K rho_c^(1 + 1/n).
 */
final class HandLaneEmden {

    static final double G = 6.67430e-11;

    private HandLaneEmden() {
    }

    /** The central pressure (Pa) of the polytrope of index n, mass M (kg) and radius R (m), at relative tolerance tol. */
    static double centralPressure(double n, double mass, double radius, double tol) {
        FirstOrderDifferentialEquations laneEmden = new FirstOrderDifferentialEquations() {
            @Override public int getDimension() {
                return 2;
            }

            @Override public void computeDerivatives(double xi, double[] y, double[] yDot) {
                yDot[0] = y[1];
                // theta^n for theta >= 0; past the surface the density is zero.
                yDot[1] = -(y[0] > 0 ? Math.pow(y[0], n) : 0.0) - 2 * y[1] / xi;
            }
        };
        // Series about the centre: theta = 1 - xi^2/6 + n xi^4/120 - n (8n - 5) xi^6/15120 + O(xi^8).
        double xi0 = 1e-2, x2 = xi0 * xi0;
        double[] y = {1 - x2 / 6 + n * x2 * x2 / 120 - n * (8 * n - 5) * x2 * x2 * x2 / 15120,
                -xi0 / 3 + n * xi0 * x2 / 30 - n * (8 * n - 5) * xi0 * x2 * x2 / 2520};
        DormandPrince853Integrator dp = new DormandPrince853Integrator(1e-12, 100, tol, tol);
        dp.addEventHandler(new EventHandler() {
            @Override public void init(double t0, double[] y0, double t) { }

            @Override public double g(double t, double[] s) {
                return s[0];
            }

            @Override public Action eventOccurred(double t, double[] s, boolean increasing) {
                return Action.STOP;
            }

            @Override public void resetState(double t, double[] s) { }
        }, 1.0, 1e-14, 100);
        double[] out = new double[2];
        double xi1 = dp.integrate(laneEmden, xi0, y, 100, out);
        double omega = -xi1 * xi1 * out[1];
        double alpha = radius / xi1;
        double rhoC = mass / (4 * Math.PI * alpha * alpha * alpha * omega);
        double k = 4 * Math.PI * G * alpha * alpha * Math.pow(rhoC, 1 - 1 / n) / (n + 1);
        return k * Math.pow(rhoC, 1 + 1 / n);
    }
}
