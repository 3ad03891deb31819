package dev.plumb.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * A claim that takes one term of the true result with the wrong sign is told which term. The truth here is
 * the hydrostatic pressure of a liquid of constant density with the height z counted upward from the
 * surface: P(-D) = P0 + rho g D (elementary integration of dP/dz = -rho g).
 */
class FlippedTermTest {

    private static final String LAKE = """
            param rho [kg/m^3] > 0
            param g0 [m/s^2] > 0
            param D [m] > 0
            param P0 [Pa] > 0
            coord z [m] from -D to 0
            unknown P(z) [Pa]
            relation hs: P'(z) = -rho*g0
            boundary top: P(0) = P0
            claim bottom: P(-D) = P0 + rho*g0*D
            claim flipped: P(-D) = P0 - rho*g0*D
            claim doubled: P(-D) = 2*(P0 + rho*g0*D)
            """;

    private static Map<String, Object> claim(CheckedText t, String label) {
        return t.list("checks").stream().filter(c -> "claim".equals(c.get("kind")) && label.equals(c.get("label")))
                .findFirst().orElseThrow(() -> new AssertionError("no claim '" + label + "': " + t.root().get("checks")));
    }

    @Test
    void theTermWithTheWrongSignIsNamed() {
        CheckedText t = CheckedText.of("lake", LAKE);
        assertEquals("holds", claim(t, "bottom").get("status"));
        Map<String, Object> flipped = claim(t, "flipped");
        assertEquals("fails", flipped.get("status"), flipped.toString());
        assertTrue(String.valueOf(flipped.get("message")).contains("the term rho*g0*D has the wrong sign"), flipped.toString());
        // A constant factor is its own explanation; no term is named for it.
        Map<String, Object> doubled = claim(t, "doubled");
        assertEquals("fails", doubled.get("status"), doubled.toString());
        assertEquals("2", doubled.get("factor"), doubled.toString());
        assertFalse(String.valueOf(doubled.get("message")).contains("wrong sign"), doubled.toString());
        // A claim off by one compact term is told the difference: here 2 rho g0 D - (rho g0 D) = rho g0 D too much.
        Map<String, Object> extra = claim(CheckedText.of("lake-extra", LAKE + "claim extra: P(-D) = P0 + 2*rho*g0*D\n"), "extra");
        assertEquals("fails", extra.get("status"), extra.toString());
        assertTrue(String.valueOf(extra.get("message")).contains("claimed - true = rho*g0*D"), extra.toString());
    }

    /** The isothermal atmosphere of constant scale height H: P(z) = P0 exp(-z/H) (integration of dP/dz = -P/H). */
    @Test
    void anExponentWithTheWrongSignIsNamed() {
        CheckedText t = CheckedText.of("isothermal", """
                param H [m] > 0
                param P0 [Pa] > 0
                param D [m] > 0
                coord z [m] from 0 to D
                unknown P(z) [Pa]
                relation hs: P'(z) = -P(z)/H
                boundary ground: P(0) = P0
                claim top: P(D) = P0*exp(-D/H)
                claim flipped: P(D) = P0*exp(D/H)
                """);
        assertEquals("holds", claim(t, "top").get("status"));
        Map<String, Object> flipped = claim(t, "flipped");
        assertEquals("fails", flipped.get("status"), flipped.toString());
        assertTrue(String.valueOf(flipped.get("message")).contains("the exponent -(D/H) has the wrong sign")
                || String.valueOf(flipped.get("message")).contains("the exponent -D/H has the wrong sign"), flipped.toString());
    }
}
