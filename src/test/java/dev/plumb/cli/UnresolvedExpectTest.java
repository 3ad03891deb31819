package dev.plumb.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * An expectation whose numeric value is not resolved to its tolerance is never decided on that value:
 * on the derived closed form where there is one, else undecided. The check values are computed here,
 * independently of plumb, from the closed form of the isothermal atmosphere under inverse-square
 * gravity, P(r) = P0 exp(-(Rp/H)(1 - Rp/r)) with H = k_B T/(mu m_u g0) (a textbook integration of
 * dP/dr = -P mu m_u g0 Rp^2/(k_B T r^2)), with CODATA 2018 constants.
 */
class UnresolvedExpectTest {

    /** Invented planet with a heavy, cold gas: the pressure at twice the radius is about e^-150 of the base's. */
    private static final String EXOSPHERE = """
            param g0 [m/s^2] > 0
            param Rp [m] > 0
            param T [K] > 0
            param mu > 0
            param P0 [Pa] > 0
            coord r [m] from Rp to 3*Rp
            let g(r) = g0*(Rp/r)^2
            unknown P(r) [Pa]
            relation hydrostatic: P'(r) = -P(r)*mu*m_u/(k_B*T)*g(r)
            boundary base: P(Rp) = P0
            case cold: g0 = 3.7 [m/s^2], Rp = 3390 [km], T = 210 [K], mu = 43.3, P0 = 610 [Pa]
            expect tiny: P(2*Rp) at cold = %s [Pa] within 1e-4
            """;

    private static double pressureAtTwiceTheRadius() {
        double h = Codata2018.K_B * 210 / (43.3 * Codata2018.M_U * 3.7);
        return 610 * Math.exp(-(3390e3 / h) * 0.5);
    }

    private static Map<String, Object> expect(CheckedText t, String label) {
        return t.list("checks").stream().filter(c -> "expect".equals(c.get("kind")) && label.equals(c.get("label")))
                .findFirst().orElseThrow(() -> new AssertionError("no expect '" + label + "': " + t.root().get("checks")));
    }

    @Test
    void aValueFarBelowTheProfilesScaleIsDecidedOnTheClosedForm() {
        double truth = pressureAtTwiceTheRadius();
        assertTrue(truth > 1e-70 && truth < 1e-60, "the test's own value: " + truth);

        Map<String, Object> right = expect(CheckedText.of("right", EXOSPHERE.formatted(String.format(java.util.Locale.ROOT, "%.8e", truth))), "tiny");
        assertEquals("holds", right.get("status"), (String) right.get("message"));
        assertTrue(((String) right.get("message")).contains("closed form"), (String) right.get("message"));
        assertEquals(truth, (Double) right.get("closed_form"), 1e-6 * truth);

        Map<String, Object> wrong = expect(CheckedText.of("wrong", EXOSPHERE.formatted(String.format(java.util.Locale.ROOT, "%.8e", 1.5 * truth))), "tiny");
        assertEquals("fails", wrong.get("status"), (String) wrong.get("message"));
    }

    /**
     * The n = 1 polytrope, for which plumb derives no closed form of P(r): a tolerance far tighter than the
     * integration's error leaves the expectation undecided. The exact value: theta = sin(xi)/xi, xi_1 = pi,
     * so P_c = (pi/8) G M^2/R^4 (worked by hand; pi/8 = 0.39269908169872414 to double precision).
     */
    @Test
    void aToleranceBelowTheIntegrationsErrorIsUndecidedWithoutAClosedForm() {
        String polytrope = """
                param M [kg] > 0
                param R [m] > 0
                coord r [m] from 0 to R
                unknown P(r) [Pa]
                unknown m(r) [kg]
                unknown K
                let rho(r) = (P(r)/K)^(1/2)
                relation balance: P'(r) = -G*m(r)*rho(r)/r^2
                relation mass: m'(r) = 4*pi*r^2*rho(r)
                boundary centre: m(0) = 0
                boundary surface: P(R) = 0
                boundary total: m(R) = M
                case giant: M = 1 [Mjup], R = 70000 [km]
                expect loose: P(0)*R^4/(G*M^2) at giant = 0.39269908169872414 within 1e-8
                expect impossible: P(0)*R^4/(G*M^2) at giant = 0.39269908169872414 within 1e-17
                """;
        CheckedText t = CheckedText.of("n1", polytrope);
        assertEquals("holds", expect(t, "loose").get("status"), (String) expect(t, "loose").get("message"));
        Map<String, Object> tight = expect(t, "impossible");
        assertEquals("undecided", tight.get("status"), (String) tight.get("message"));
        assertTrue(((String) tight.get("message")).contains("estimated error"), (String) tight.get("message"));
    }
}
