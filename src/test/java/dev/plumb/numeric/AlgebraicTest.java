package dev.plumb.numeric;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;

import dev.plumb.lang.Diagnostics;
import dev.plumb.lang.Parser;
import dev.plumb.lang.SourceFile;
import dev.plumb.model.Checker;
import dev.plumb.model.Model;
import dev.plumb.model.Status;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** A file with no unknown profile or constant is evaluated directly, case by case. */
class AlgebraicTest {

    @Test
    void isothermalScaleHeightOfAirIsAboutEightKilometres() throws Exception {
        String text = """
                param T [K] > 0
                param mu > 0
                param g [m/s^2] > 0
                let H = k_B*T/(mu*m_u*g)
                case air: T = 288.15 [K], mu = 28.9644, g = 9.80665 [m/s^2]
                expect scale: H at air = 8.4 [km] within 2%
                """;
        Diagnostics d = new Diagnostics();
        Model m = Checker.check(Parser.parse(new SourceFile("h.plumb", text), d), d);
        assertFalse(m.hasErrors(), m.diagnostics().toString());
        NumericResult r = NumericEngine.run(m, Map.of(), NumericOptions.defaults());
        // k_B and m_u: CODATA 2018; T, M0/m_u and g0: U.S. Standard Atmosphere 1976 sea level.
        double expected = 1.380649e-23 * 288.15 / (28.9644 * 1.66053906660e-27 * 9.80665);
        assertEquals(Status.HOLDS, r.checks().get(0).status(), r.checks().get(0).message());
        assertEquals(expected, (Double) r.checks().get(0).extra().get("numeric"), 1e-9 * expected);
        // About 8.4 km: the usual figure for the scale height of the lower atmosphere (common practice).
        assertEquals(8.4e3, expected, 0.1e3);
    }
}
