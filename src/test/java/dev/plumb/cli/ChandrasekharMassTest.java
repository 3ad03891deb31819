package dev.plumb.cli;

import static dev.plumb.cli.Codata2018.C;
import static dev.plumb.cli.Codata2018.G;
import static dev.plumb.cli.Codata2018.HBAR;
import static dev.plumb.cli.Codata2018.MSUN;
import static dev.plumb.cli.Codata2018.M_U;
import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Chandrasekhar's limiting mass from the constants: a fully relativistic degenerate electron gas,
 * P = K rho^(4/3), is an n = 3 polytrope whose mass depends on K alone, so every central density
 * gives the same mass. The surface is free (R unknown, P(R) = 0).
 */
class ChandrasekharMassTest {

    // Chandrasekhar (1939), table of polytropes, n = 3.
    static final double XI1 = 6.89685, OMEGA3 = 2.01824;
    static final double MU_E = 2;
    static final double[] RHO_C = {1e7, 1e9, 1e11, 1e13};   // kg/m^3, six decades
    static final String[] CASES = {"a", "b", "d", "e"};

    static final String TEXT = """
            title "Relativistic degenerate dwarf: Chandrasekhar's limiting mass"
            param mu_e = 2
            param rho_c [kg/m^3] > 0
            unknown R [m]
            coord r [m] from 0 to R
            let K = hbar*c/4*(3*pi^2)^(1/3)/(mu_e*m_u)^(4/3)
            unknown P(r) [Pa]
            unknown m(r) [kg]
            relation balance: P'(r) = -G*m(r)*(P(r)/K)^(3/4)/r^2
            relation mass: m'(r) = 4*pi*r^2*(P(r)/K)^(3/4)
            boundary P(0) = K*rho_c^(4/3)
            boundary m(0) = 0
            boundary P(R) = 0
            case a: rho_c = 1e7 [kg/m^3]
            case b: rho_c = 1e9 [kg/m^3]
            case d: rho_c = 1e11 [kg/m^3]
            case e: rho_c = 1e13 [kg/m^3]
            show m(R) in [Msun]
            show R in [km]
            """;

    static CheckedText result;

    @BeforeAll
    static void run() {
        result = CheckedText.of("chandrasekhar", TEXT);
    }

    static double polytropicK() {
        return HBAR * C / 4 * Math.cbrt(3 * Math.PI * Math.PI) / Math.pow(MU_E * M_U, 4.0 / 3);
    }

    @Test
    void massIsTheLimitingMassForEveryCentralDensity() {
        // M_Ch = (sqrt(3 pi)/2) omega_3 (hbar c/G)^(3/2) / (mu_e m_u)^2 = 1.456300 Msun with CODATA 2018.
        double limit = Math.sqrt(3 * Math.PI) / 2 * OMEGA3 * Math.pow(HBAR * C / G, 1.5) / Math.pow(MU_E * M_U, 2);
        for (int i = 0; i < CASES.length; i++) {
            double m = result.numeric(CASES[i], "m(R)");
            int k = i;
            // omega_3 has six figures (+-2.5e-6 relative); plumb integrates at 1e-12.
            assertEquals(limit, m, 1e-5 * limit, () -> "m(R) at rho_c = " + RHO_C[k] + " kg/m^3: " + m / MSUN
                    + " Msun, expected the limiting mass " + limit / MSUN + " Msun");
        }
    }

    @Test
    void massDoesNotDependOnCentralDensityAtAll() {
        // Exact for n = 3 (M depends on K only): the spread measures plumb's own numeric error.
        double first = result.numeric(CASES[0], "m(R)");
        for (int i = 1; i < CASES.length; i++) {
            double m = result.numeric(CASES[i], "m(R)");
            int k = i;
            assertEquals(first, m, 1e-9 * first, () -> "m(R) at rho_c = " + RHO_C[k] + " differs from m(R) at rho_c = "
                    + RHO_C[0] + " by " + (m / first - 1) + " relative");
        }
    }

    @Test
    void radiusFollowsTheHomologyRelation() {
        // R = xi1 * alpha, alpha^2 = (n+1) K rho_c^(1/n-1) / (4 pi G) = K rho_c^(-2/3) / (pi G) for n = 3.
        for (int i = 0; i < CASES.length; i++) {
            double expected = XI1 * Math.sqrt(polytropicK() / (Math.PI * G)) * Math.pow(RHO_C[i], -1.0 / 3);
            double r = result.numeric(CASES[i], "R");
            int k = i;
            // xi1 has six figures: +-7.3e-7 relative.
            assertEquals(expected, r, 2e-6 * expected, () -> "R at rho_c = " + RHO_C[k] + " kg/m^3: " + r / 1e3
                    + " km, expected xi1 sqrt(K/(pi G)) rho_c^(-1/3) = " + expected / 1e3 + " km");
            // The ratio is exact, free of the table's rounding.
            double ratio = r / result.numeric(CASES[0], "R");
            double exact = Math.cbrt(RHO_C[0] / RHO_C[i]);
            assertEquals(exact, ratio, 1e-9 * exact, () -> "R(" + RHO_C[k] + ")/R(" + RHO_C[0] + ") should be (rho ratio)^(-1/3)");
        }
    }
}
