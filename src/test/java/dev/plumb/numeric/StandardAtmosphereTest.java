package dev.plumb.numeric;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumb.model.Status;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** The troposphere and the isothermal layer above it, integrated as one piecewise model. */
class StandardAtmosphereTest {

    // U.S. Standard Atmosphere, 1976: its own constants.
    static final double RSTAR = 8.31432, M0 = 0.0289644, G0 = 9.80665, T0 = 288.15, L = 0.0065, P0 = 101325;

    /** The standard's pressure equations for a layer with a lapse rate and for an isothermal layer. */
    static double standard(double h) {
        double exponent = G0 * M0 / (RSTAR * L);
        if (h <= 11000) return P0 * Math.pow((T0 - L * h) / T0, exponent);
        double t11 = T0 - L * 11000;
        return standard(11000) * Math.exp(-G0 * M0 * (h - 11000) / (RSTAR * t11));
    }

    @Test
    void pressuresMatchTheStandardsTable() throws SolveException {
        Solution s = NumericEngine.solve(Models.derivation("standard-atmosphere-1976.plumb"), Map.of(), NumericOptions.defaults());
        // U.S. Standard Atmosphere 1976, layer base pressures at 11 km and 20 km geopotential altitude
        // (22632.06 Pa as in the design brief; 5474.889 Pa from memory of the standard's table).
        assertEquals(22632.06, s.evaluate(Models.expr("P(11 [km])")), 1e-5 * 22632.06);
        assertEquals(5474.889, s.evaluate(Models.expr("P(20 [km])")), 1e-5 * 5474.889);
        assertTrue(s.method().contains("break"), s.method());
    }

    @Test
    void profileMatchesTheStandardsEquationsOnBothSidesOfTheBreak() throws SolveException {
        Solution s = NumericEngine.solve(Models.derivation("standard-atmosphere-1976.plumb"), Map.of(), NumericOptions.defaults());
        for (double km : new double[]{1, 5, 10.999, 11, 11.001, 15, 19.5}) {
            double exact = standard(km * 1000);
            assertEquals(exact, s.evaluate(Models.expr("P(" + km + " [km])")), 1e-10 * exact, km + " km");
        }
    }

    @Test
    void shippedExpectationsHold() {
        NumericResult r = NumericEngine.run(Models.derivation("standard-atmosphere-1976.plumb"), Map.of(), NumericOptions.defaults());
        assertEquals(2, r.checks().size());
        r.checks().forEach(c -> assertEquals(Status.HOLDS, c.status(), c.message()));
        assertEquals("hPa", r.cases().get(0).quantities().get(0).shownUnit());
    }
}
