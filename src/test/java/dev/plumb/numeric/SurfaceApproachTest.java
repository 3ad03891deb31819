package dev.plumb.numeric;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumb.model.Model;
import java.util.Map;
import org.apache.commons.math3.ode.FirstOrderDifferentialEquations;
import org.apache.commons.math3.ode.events.EventHandler;
import org.apache.commons.math3.ode.nonstiff.DormandPrince853Integrator;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Free surfaces with an unknown radius where the profile only touches zero (P ~ (R - r)^2 for an
 * n = 1 polytrope) or has an infinite slope (Chandrasekhar's x ~ (R - r)^(1/2) in a cold electron
 * gas), found to the solver's accuracy by the last stretch in w = |y - v|^(1/p).
 */
class SurfaceApproachTest {

    // CODATA 2018 recommended values.
    static final double G = 6.67430e-11, M_E = 9.1093837015e-31, C = 299792458.0, H = 6.62607015e-34, M_U = 1.66053906660e-27;
    // The cold electron gas P = A f(x), rho = B x^3, with mu_e = 2.
    static final double A = Math.PI * Math.pow(M_E, 4) * Math.pow(C, 5) / (3 * H * H * H);
    static final double B = 8 * Math.PI * Math.pow(M_E * C, 3) * 2 * M_U / (3 * H * H * H);

    @ParameterizedTest(name = "rho_c = {0} kg/m^3")
    @ValueSource(doubles = {10, 3e3, 1e6})
    void indexOneRadiusIsFixedByKAlone(double rhoC) throws SolveException {
        double k = 2.5e5;
        Model m = Models.of("""
                param K [m^5 kg^-1 s^-2] > 0
                param rho_c [kg/m^3] > 0
                unknown R [m]
                coord r [m] from 0 to R
                unknown P(r) [Pa]
                unknown m(r) [kg]
                let rho(r) = (P(r)/K)^(1/2)
                relation balance: P'(r) = -G*m(r)*rho(r)/r^2
                relation mass: m'(r) = 4*pi*r^2*rho(r)
                boundary centre: m(0) = 0
                boundary core: P(0) = K*rho_c^2
                boundary surface: P(R) = 0
                """);
        Solution s = NumericEngine.solve(m, Map.of("K", k, "rho_c", rhoC), NumericOptions.defaults());
        // Analytic Lane-Emden n = 1: theta = sin(xi)/xi, xi1 = pi, so R = pi sqrt(K/(2 pi G)) whatever rho_c,
        // and -xi1^2 theta'(xi1) = pi gives M = 4 pi alpha^3 rho_c pi = 4 rho_c R^3 / pi.
        double r = Math.PI * Math.sqrt(k / (2 * Math.PI * G));
        assertEquals(r, s.evaluate(Models.expr("R")), 1e-10 * r, s.method());
        double mass = 4 * rhoC * r * r * r / Math.PI;
        assertEquals(mass, s.evaluate(Models.expr("m(R)")), 1e-10 * mass);
        assertTrue(s.method().contains("p = 2"), s.method());
    }

    @ParameterizedTest(name = "x_c = {0}")
    @ValueSource(doubles = {0.3, 1, 5})
    void coldElectronGasWrittenInUMeetsChandrasekharsEquation(double xc) throws SolveException {
        Model m = Models.of(electronGas("""
                unknown u(r)
                relation balance: u'(r) = -G*m(r)*B/(8*A*r^2)
                relation mass: m'(r) = 4*pi*r^2*B*(u(r)^2 - 1)^(3/2)
                boundary u(0) = sqrt(1 + x_c^2)
                boundary u(R) = 1
                """));
        Solution s = NumericEngine.solve(m, Map.of("x_c", xc, "A", A, "B", B), NumericOptions.defaults());
        double[] expected = chandrasekhar(xc);
        assertEquals(expected[0], s.evaluate(Models.expr("R")), 1e-9 * expected[0], s.method());
        assertEquals(expected[1], s.evaluate(Models.expr("m(R)")), 1e-9 * expected[1], s.method());
    }

    @ParameterizedTest(name = "x_c = {0}")
    @ValueSource(doubles = {0.3, 1, 5})
    void coldElectronGasWrittenInXHasAnInfiniteSlopeAtTheSurface(double xc) throws SolveException {
        // dP/dr = A f'(x) x' with f'(x) = 8 x^4 / sqrt(1 + x^2), so x' ~ 1/x and x ~ (R - r)^(1/2).
        Model m = Models.of(electronGas("""
                unknown x(r)
                relation balance: x'(r) = -G*m(r)*B*sqrt(1 + x(r)^2)/(8*A*x(r)*r^2)
                relation mass: m'(r) = 4*pi*r^2*B*x(r)^3
                boundary x(0) = x_c
                boundary x(R) = 0
                """));
        Solution s = NumericEngine.solve(m, Map.of("x_c", xc, "A", A, "B", B), NumericOptions.defaults());
        double[] expected = chandrasekhar(xc);
        assertEquals(expected[0], s.evaluate(Models.expr("R")), 1e-9 * expected[0], s.method());
        assertEquals(expected[1], s.evaluate(Models.expr("m(R)")), 1e-9 * expected[1], s.method());
        // The radius and mass above are what matters; the surface may be reached in w = x^2 or, where the switch
        // does not fire, approached to the step-size limit, both within the tolerance checked above.
        assertTrue(s.method().contains("p = 0.5") || s.method().contains("approached until the step size"), s.method());
    }

    /** A white dwarf of central x_c with the gas constants typed in as numbers (SI-sane scales for the guesses). */
    private static String electronGas(String profile) {
        return """
                param x_c > 0
                param A [Pa] > 0
                param B [kg/m^3] > 0
                unknown R [m]
                coord r [m] from 0 to R
                unknown m(r) [kg]
                boundary m(0) = 0
                """ + profile;
    }

    /**
     * Radius and mass from Chandrasekhar's own form of the equation, integrated here independently:
     * (1/eta^2) (eta^2 phi')' = -(phi^2 - 1/y0^2)^(3/2), phi(0) = 1, y0^2 = 1 + x_c^2, surface where
     * phi = 1/y0 (crossed with a finite slope), r = alpha eta with alpha^2 = 2A/(pi G B^2 y0^2), and
     * M = -8 A alpha y0 eta1^2 phi'(eta1) / (G B) (from u' = -G m B/(8 A r^2) with u = y0 phi).
     */
    static double[] chandrasekhar(double xc) {
        double y0 = Math.sqrt(1 + xc * xc), floor = 1 / (y0 * y0);
        FirstOrderDifferentialEquations eq = new FirstOrderDifferentialEquations() {
            @Override public int getDimension() {
                return 2;
            }

            @Override public void computeDerivatives(double eta, double[] y, double[] yDot) {
                double q = Math.max(0, y[0] * y[0] - floor);
                yDot[0] = y[1];
                yDot[1] = -q * Math.sqrt(q) - 2 * y[1] / eta;
            }
        };
        double q0 = Math.pow(1 - floor, 1.5), eta0 = 1e-5;
        double[] y = {1 - q0 * eta0 * eta0 / 6, -q0 * eta0 / 3};
        DormandPrince853Integrator dp = new DormandPrince853Integrator(1e-14, 10, 1e-14, 1e-13);
        dp.addEventHandler(new EventHandler() {
            @Override public void init(double t0, double[] s, double t) { }

            @Override public double g(double t, double[] s) {
                return s[0] - 1 / y0;
            }

            @Override public Action eventOccurred(double t, double[] s, boolean increasing) {
                return Action.STOP;
            }

            @Override public void resetState(double t, double[] s) { }
        }, 0.05, 1e-15, 200);
        double[] end = new double[2];
        double eta1 = dp.integrate(eq, eta0, y, 1e3, end);
        double alpha = Math.sqrt(2 * A / (Math.PI * G * B * B * y0 * y0));
        double mass = -8 * A * alpha * y0 * eta1 * eta1 * end[1] / (G * B);
        return new double[]{alpha * eta1, mass};
    }
}
