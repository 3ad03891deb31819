package dev.plumb.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * A parameter declared without {@code > 0} may be negative or zero, and a claim must hold for every value
 * its declaration allows. The identities here are elementary algebra over the reals: sqrt(a^2) = |a|, which
 * is a only for a >= 0; log(a^2) = 2 log|a|; (a b)^2 = a^2 b^2 for every sign.
 */
class SignedParametersTest {

    private static Map<String, Object> claim(CheckedText t, String label) {
        return t.list("checks").stream().filter(c -> "claim".equals(c.get("kind")) && label.equals(c.get("label")))
                .findFirst().orElseThrow(() -> new AssertionError("no claim '" + label + "': " + t.root().get("checks")));
    }

    @Test
    void anIdentityThatNeedsAPositiveParameterDoesNotHoldForOneOfEitherSign() {
        CheckedText t = CheckedText.of("signed", """
                param a [m]
                param b [m] > 0
                claim root_of_square: sqrt(a^2) = a
                claim root_of_square_positive: sqrt(b^2) = b
                claim log_of_square: log(a^2/(1 [m^2])) = 2*log(a/(1 [m]))
                claim square_of_product: (a*b)^2 = a^2*b^2
                """);
        Map<String, Object> root = claim(t, "root_of_square");
        assertEquals("fails", root.get("status"), root.toString());
        assertTrue(String.valueOf(root.get("message")).contains("declared without '> 0'"), root.toString());
        assertEquals("holds", claim(t, "root_of_square_positive").get("status"));
        // 2 log(a) is not real for a < 0: never "holds" on the strength of positive samples alone.
        assertNotEquals("holds", claim(t, "log_of_square").get("status"), claim(t, "log_of_square").toString());
        assertEquals("holds", claim(t, "square_of_product").get("status"), claim(t, "square_of_product").toString());
    }

    @Test
    void theSameClaimHoldsOnceTheParameterIsDeclaredPositive() {
        CheckedText t = CheckedText.of("positive", """
                param a [m] > 0
                claim root_of_square: sqrt(a^2) = a
                claim log_of_square: log(a^2/(1 [m^2])) = 2*log(a/(1 [m]))
                """);
        assertEquals("holds", claim(t, "root_of_square").get("status"), claim(t, "root_of_square").toString());
        assertEquals("holds", claim(t, "log_of_square").get("status"), claim(t, "log_of_square").toString());
    }
}
