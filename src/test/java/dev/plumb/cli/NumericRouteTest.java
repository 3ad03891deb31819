package dev.plumb.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * Claims that no closed form decides are decided by the numbers: the relations are solved around
 * each case and both sides compared, and the JSON names the route, the points and the largest
 * difference. Each claimed formula is a published result, or deliberately off by a known factor.
 */
class NumericRouteTest {

    private static Map<String, Object> claim(CheckedText t, String label) {
        for (Map<String, Object> c : t.list("checks")) {
            if ("claim".equals(c.get("kind")) && label.equals(c.get("label"))) return c;
        }
        throw new AssertionError("no claim '" + label + "' in " + t.root().get("checks"));
    }

    /** Schwarzschild (1916), the interior solution of a uniform-density star: its central pressure. */
    private static final String GR_UNIFORM = """
            param M [kg] > 0
            param R [m] > 0
            coord r [m] from 0 to R
            let rho = M/(4/3*pi*R^3)
            let m(r) = 4/3*pi*r^3*rho
            unknown P(r) [Pa]
            relation tov: P'(r) = -G*(rho + P(r)/c^2)*(m(r) + 4*pi*r^3*P(r)/c^2)/(r^2*(1 - 2*G*m(r)/(r*c^2)))
            boundary surface: P(R) = 0
            claim central: P(0) = %s*rho*c^2*(1 - sqrt(1 - 2*G*M/(R*c^2)))/(3*sqrt(1 - 2*G*M/(R*c^2)) - 1)
            case star: M = 1 [Msun], R = 10 [km]
            case compact: M = 2 [Msun], R = 9 [km]
            """;

    @Test
    void theSchwarzschildInteriorCentralPressureHoldsByTheNumbers() {
        CheckedText t = CheckedText.of("gr-uniform", GR_UNIFORM.formatted("1"));
        Map<String, Object> c = claim(t, "central");
        assertEquals("holds", c.get("status"), c.toString());
        assertEquals("numeric", c.get("route"), c.toString());
        assertEquals(12.0, (Double) c.get("points"), c.toString());
        // The solved central pressure of a star this compact carries errors near 1e-9 (its own error estimate).
        assertTrue((Double) c.get("max_rel_diff") < 1e-7, c.toString());
    }

    @Test
    void aFactorOfTwoIsStillReportedAsTwo() {
        CheckedText t = CheckedText.of("gr-uniform-doubled", GR_UNIFORM.formatted("2"));
        Map<String, Object> c = claim(t, "central");
        assertEquals("fails", c.get("status"), c.toString());
        assertEquals("numeric", c.get("route"), c.toString());
        assertEquals("2", c.get("factor"), c.toString());
    }

    @Test
    void aClaimOffByAFunctionSaysHowTheRatioVaries() {
        // Claiming the Newtonian central pressure of a uniform sphere, 3 G M^2/(8 pi R^4), for a relativistic
        // star: the ratio to the truth depends on the compactness 2GM/(Rc^2), so it differs from point to point.
        CheckedText t = CheckedText.of("gr-newtonian", GR_UNIFORM.replace(
                "claim central: P(0) = %s*rho*c^2*(1 - sqrt(1 - 2*G*M/(R*c^2)))/(3*sqrt(1 - 2*G*M/(R*c^2)) - 1)",
                "claim central: P(0) = 3*G*M^2/(8*pi*R^4)"));
        Map<String, Object> c = claim(t, "central");
        assertEquals("fails", c.get("status"), c.toString());
        assertTrue(String.valueOf(c.get("message")).contains("not by a constant factor"), c.toString());
    }

    @Test
    void theRadiusOfAnIndexOnePolytropeHolds() {
        // Analytic Lane-Emden n = 1: theta = sin(xi)/xi, xi1 = pi, so R = pi*sqrt(K/(2*pi*G)) = sqrt(pi*K/(2*G)).
        CheckedText t = CheckedText.of("n1-radius", """
                param K [m^5/(kg s^2)] > 0
                param rho_c [kg/m^3] > 0
                unknown R [m]
                coord r [m] from 0 to R
                unknown P(r) [Pa]
                unknown m(r) [kg]
                relation balance: P'(r) = -G*m(r)*sqrt(P(r)/K)/r^2
                relation mass: m'(r) = 4*pi*r^2*sqrt(P(r)/K)
                boundary P(0) = K*rho_c^2
                boundary m(0) = 0
                boundary P(R) = 0
                claim radius: R = sqrt(pi*K/(2*G))
                claim mass: m(R) = 4*rho_c*R^3/pi
                case jovian: K = 2.1e5 [m^5/(kg s^2)], rho_c = 4000 [kg/m^3]
                """);
        for (String label : List.of("radius", "mass")) {
            Map<String, Object> c = claim(t, label);
            assertEquals("holds", c.get("status"), c.toString());
            assertTrue(List.of("numeric", "symbolic").contains(c.get("route")), c.toString());
        }
    }

    @Test
    void theCompressibleOceanProfileHoldsAndAWrongOneFails() {
        // Separation of variables: dP/dz = rho0 g exp(P/Kb) gives exp(-P/Kb) = 1 - rho0 g z/Kb, so
        // P(z) = -Kb ln(1 - rho0 g z/Kb). Sea water rho0 = 1025 kg/m^3, Kb = 2.2e9 Pa: common practice values.
        CheckedText t = CheckedText.of("ocean", """
                param rho0 [kg/m^3] > 0
                param g [m/s^2] > 0
                param Kb [Pa] > 0
                param D [m] > 0
                coord z [m] from 0 to D
                unknown P(z) [Pa]
                relation balance: P'(z) = rho0*g*exp(P(z)/Kb)
                boundary surface: P(0) = 0
                claim profile: P(z) = -Kb*log(1 - rho0*g*z/Kb)
                claim wrong: P(z) = Kb*log(1 + rho0*g*z/Kb)
                case sea: rho0 = 1025 [kg/m^3], g = 9.80665 [m/s^2], Kb = 2.2e9 [Pa], D = 11 [km]
                """);
        assertEquals("holds", claim(t, "profile").get("status"), claim(t, "profile").toString());
        Map<String, Object> wrong = claim(t, "wrong");
        assertEquals("fails", wrong.get("status"), wrong.toString());
        // Decided by either route, the message says the two sides differ by more than a constant factor.
        String why = String.valueOf(wrong.get("message"));
        assertTrue(why.contains("not by a constant factor") || why.contains("claimed/true depends on"), wrong.toString());
    }

    @Test
    void aProvenClaimNamesTheSymbolicRoute() {
        CheckedText t = CheckedText.of("uniform", """
                param M [kg] > 0
                param R [m] > 0
                coord r [m] from 0 to R
                let rho = M / (4/3*pi*R^3)
                let m(r) = 4/3*pi*r^3*rho
                unknown P(r) [Pa]
                relation balance: P'(r) = -G*m(r)*rho/r^2
                boundary surface: P(R) = 0
                claim central: P(0) = 3/(8*pi)*G*M^2/R^4
                case sun: M = 1 [Msun], R = 1 [Rsun]
                """);
        Map<String, Object> c = claim(t, "central");
        assertEquals("holds", c.get("status"), c.toString());
        assertEquals("symbolic", c.get("route"), c.toString());
    }
}
