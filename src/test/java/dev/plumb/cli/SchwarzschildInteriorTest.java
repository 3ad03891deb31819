package dev.plumb.cli;

import static dev.plumb.cli.Codata2018.C;
import static dev.plumb.cli.Codata2018.G;
import static dev.plumb.cli.Codata2018.MSUN;
import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * A relativistic star of uniform density against Schwarzschild's (1916) interior solution,
 * P(r) = rho c^2 (sqrt(1 - k r^2/R^2) - sqrt(1 - k)) / (3 sqrt(1 - k) - sqrt(1 - k r^2/R^2)), k = 2GM/(R c^2).
 * The formula is itself checked against the test's own integration of the TOV equation in p = P/(rho c^2).
 */
class SchwarzschildInteriorTest {

    static final double RSUN = 6.957e8;   // m, IAU 2015 Resolution B3 nominal solar radius

    static final String TEXT = """
            title "Uniform-density star in general relativity"
            param M [kg] > 0
            param R [m] > 0
            coord r [m] from 0 to R
            let rho = M/(4/3*pi*R^3)
            let m(r) = 4/3*pi*r^3*rho
            unknown P(r) [Pa]
            relation tov: P'(r) = -G*(rho + P(r)/c^2)*(m(r) + 4*pi*r^3*P(r)/c^2)/(r^2*(1 - 2*G*m(r)/(r*c^2)))
            boundary surface: P(R) = 0
            case sun: M = 1 [Msun], R = 1 [Rsun]
            case star: M = 1 [Msun], R = 10 [km]
            case compact: M = 2 [Msun], R = 8 [km]
            show P(0)
            show P(R/2)
            """;

    static CheckedText result;

    @BeforeAll
    static void run() {
        result = CheckedText.of("schwarzschild-interior", TEXT);
    }

    /**
     * Schwarzschild's interior pressure at s = r/R, in units of rho c^2; b - a written as k (1 - s^2)/(a + b),
     * since for the Sun (k = 4e-6) the difference of square roots keeps only ten digits.
     */
    static double schwarzschild(double k, double s) {
        double a = Math.sqrt(1 - k), b = Math.sqrt(1 - k * s * s);
        return k * (1 - s * s) / ((a + b) * (3 * a - b));
    }

    /** The test's own: dp/ds = -(k/2) s (1 + p)(1 + 3p) / (1 - k s^2) from p(1) = 0 inward, in units of rho c^2. */
    static double integrated(double k, double s, int steps) {
        Rk4.Field f = (x, p, dp) -> dp[0] = -k / 2 * x * (1 + p[0]) * (1 + 3 * p[0]) / (1 - k * x * x);
        return Rk4.toPoint(f, 1, new double[] {0}, s, steps).y()[0];
    }

    @ParameterizedTest(name = "{0}: M = {1} Msun, R = {2} m")
    @CsvSource({"sun, 1, 6.957e8", "star, 1, 1e4", "compact, 2, 8e3"})
    void centralAndMidwayPressureAreSchwarzschilds(String label, double mSun, double radius) {
        double mass = mSun * MSUN, k = 2 * G * mass / (radius * C * C);
        double rhoC2 = mass / (4.0 / 3 * Math.PI * Math.pow(radius, 3)) * C * C;
        for (double s : new double[] {0, 0.5}) {
            double formula = schwarzschild(k, s);
            double own = integrated(k, s, 20000);
            assertEquals(own, integrated(k, s, 10000), 1e-12 * own, "the test's own Runge-Kutta is not converged");
            assertEquals(own, formula, 1e-11 * own, () -> "Schwarzschild's formula disagrees with the test's integration at r/R = " + s);
            String expr = s == 0 ? "P(0)" : "P(R/2)";
            double p = result.numeric(label, expr);
            assertEquals(formula * rhoC2, p, 1e-9 * formula * rhoC2, () -> expr + " in case " + label + " (2GM/(Rc^2) = " + k
                    + "): plumb " + p + " Pa, Schwarzschild's interior solution " + formula * rhoC2 + " Pa");
        }
    }
}
