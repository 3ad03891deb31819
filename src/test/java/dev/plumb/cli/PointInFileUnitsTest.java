package dev.plumb.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * A closed form at a point the file wrote in km is printed with that quantity, not its SI number, and
 * still has the right value: the U.S. Standard Atmosphere 1976 gives 22632.06 Pa at 11 km geopotential.
 */
class PointInFileUnitsTest {

    @Test
    void theTropopausePressureIsPrintedWithElevenKilometres() throws Exception {
        CheckedText t = CheckedText.of("troposphere", Files.readString(Path.of("derivations/troposphere.plumb")));
        Map<String, Object> tropopause = t.list("derived").stream().filter(d -> "P(11 [km])".equals(d.get("expr"))).findFirst()
                .orElseThrow(() -> new AssertionError("no derived P(11 [km]): " + t.root().get("derived")));
        String form = String.valueOf(tropopause.get("closed_form"));
        assertTrue(form.contains("11 [km]"), form);
        assertFalse(form.contains("11000"), form);
        // The case row's closed-form value (SI) is the standard's, to its 7 figures.
        Object closed = t.list("cases").get(0).get("quantities") instanceof java.util.List<?> rows
                ? rows.stream().map(r -> (Map<?, ?>) r).filter(r -> "P(11 [km])".equals(r.get("expr"))).findFirst().orElseThrow().get("closed_form")
                : null;
        assertEquals(22632.06, (Double) closed, 0.01, String.valueOf(closed));
    }
}
