package dev.plumb.cli;

import static dev.plumb.cli.Codata2018.G;
import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * An n = 1 polytrope of given K and central density with its surface free: the analytic Lane–Emden
 * solution theta = sin(xi)/xi puts the surface at R = pi sqrt(K/(2 pi G)) whatever rho_c, and gives
 * M = 4 pi rho_c alpha^3 * pi = 4 rho_c R^3 / pi (alpha = R/pi).
 */
class PolytropeOneFreeSurfaceTest {

    static final double K = 2.1e5;   // m^5 kg^-1 s^-2: R near 7e7 m, a giant planet

    static final String TEXT = """
            title "n = 1 polytrope of given K and central density"
            param K = 2.1e5 [m^5/(kg s^2)]
            param rho_c [kg/m^3] > 0
            unknown R [m]
            coord r [m] from 0 to R
            unknown P(r) [Pa]
            unknown m(r) [kg]
            let rho(r) = sqrt(P(r)/K)
            relation balance: P'(r) = -G*m(r)*rho(r)/r^2
            relation mass: m'(r) = 4*pi*r^2*rho(r)
            boundary centre: P(0) = K*rho_c^2
            boundary m(0) = 0
            boundary surface: P(R) = 0
            case thin: rho_c = 10 [kg/m^3]
            case giant: rho_c = 1000 [kg/m^3]
            case dense: rho_c = 1e5 [kg/m^3]
            show R in [km]
            show m(R) in [Mjup]
            """;

    static CheckedText result;

    @BeforeAll
    static void run() {
        result = CheckedText.of("polytrope-n1-free-surface", TEXT);
    }

    @ParameterizedTest(name = "rho_c = {1} kg/m^3")
    @CsvSource({"thin, 10", "giant, 1000", "dense, 1e5"})
    void radiusIsPiTimesTheLengthScaleWhateverTheCentralDensity(String label, double rhoC) {
        double expected = Math.PI * Math.sqrt(K / (2 * Math.PI * G));
        double r = result.numeric(label, "R");
        assertEquals(expected, r, 1e-8 * expected, () -> "R at rho_c = " + rhoC + " kg/m^3: plumb " + r
                + " m, analytic pi sqrt(K/(2 pi G)) = " + expected + " m");
        double mass = 4 * rhoC * Math.pow(expected, 3) / Math.PI;
        double m = result.numeric(label, "m(R)");
        assertEquals(mass, m, 1e-8 * mass, () -> "m(R) at rho_c = " + rhoC + " kg/m^3: plumb " + m
                + " kg, analytic 4 rho_c R^3/pi = " + mass + " kg");
    }
}
