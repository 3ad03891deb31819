package dev.plumb.numeric;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumb.model.Model;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** The shipped uniform-density sphere: numeric central pressure against the closed form, for the Sun and the Earth. */
class ClosedFormTest {

    // CODATA 2018: G. IAU 2015 Resolution B3: nominal solar GM and radius (the Msun unit is GM_sun / G).
    static final double G = 6.67430e-11, MSUN = 1.3271244e20 / G, RSUN = 6.957e8;

    static double uniform(double m, double r) {
        return 3 * G * m * m / (8 * Math.PI * Math.pow(r, 4));
    }

    @Test
    void sunAndEarthAgreeWithTheClosedFormTo1e10() {
        Model m = Models.derivation("uniform-sphere.plumb");
        NumericResult r = NumericEngine.run(m, Map.of("P(0)", Models.expr("3*G*M^2/(8*pi*R^4)")), NumericOptions.defaults());
        assertEquals(2, r.cases().size());
        // The Earth case is given in the file as 5.972e24 kg and 6371 km.
        double[] expected = {uniform(MSUN, RSUN), uniform(5.972e24, 6.371e6)};
        for (int i = 0; i < 2; i++) {
            CaseResult c = r.cases().get(i);
            QuantityRow p0 = c.quantities().get(0);
            assertEquals("P(0)", p0.expr());
            assertEquals("Pa", p0.unit());
            assertEquals("derived", p0.comparedWith());
            assertEquals(expected[i], p0.closedForm(), 1e-14 * expected[i], "closed form evaluated in SI");
            assertEquals(expected[i], p0.numeric(), 1e-10 * expected[i], c.label());
            assertTrue(p0.relDiff() < 1e-10, c.label() + " rel diff " + p0.relDiff());
            assertTrue(p0.errorEstimate() < 1e-10 * expected[i], "error estimate " + p0.errorEstimate());
            assertEquals("GPa", p0.shownUnit());
            assertEquals(1e9, p0.shownFactor(), 1e-6);
            assertNotNull(c.method());
            assertTrue(c.method().contains("rtol 1e-12"), c.method());
        }
    }

    @Test
    void claimWithoutDerivedFormIsComparedAsClaimed() {
        NumericResult r = NumericEngine.run(Models.derivation("uniform-sphere.plumb"), Map.of(), NumericOptions.defaults());
        QuantityRow p0 = r.cases().get(0).quantities().get(0);
        assertEquals("claim", p0.comparedWith());
        assertTrue(p0.relDiff() < 1e-10);
    }

    @Test
    void aWrongClaimShowsItsRelativeDifference() {
        // The claim drops the 3/(8 pi): the numeric value is 8 pi / 3 times larger... smaller than claimed.
        Model m = Models.of("""
                param M [kg] > 0
                param R [m] > 0
                coord r [m] from 0 to R
                let rho = M / (4/3*pi*R^3)
                let m(r) = 4/3*pi*r^3*rho
                unknown P(r) [Pa]
                relation balance: P'(r) = -G*m(r)*rho/r^2
                boundary surface: P(R) = 0
                claim central: P(0) = G*M^2/R^4
                case earth: M = 5.972e24 [kg], R = 6371 [km]
                """);
        QuantityRow p0 = NumericEngine.run(m, Map.of(), NumericOptions.defaults()).cases().get(0).quantities().get(0);
        assertEquals(1 - 3 / (8 * Math.PI), p0.relDiff(), 1e-10);
    }

    @Test
    void interiorProfileMatchesTheClosedForm() throws SolveException {
        // Closed form P(r) = 2/3 pi G rho^2 (R^2 - r^2) of the uniform sphere.
        Model m = Models.derivation("uniform-sphere.plumb");
        Solution s = NumericEngine.solve(m, Map.of("M", MSUN, "R", RSUN), NumericOptions.defaults());
        double rho = MSUN / (4.0 / 3 * Math.PI * Math.pow(RSUN, 3));
        for (double f : new double[]{0.001, 0.25, 0.5, 0.9}) {
            double r = f * RSUN;
            double exact = 2.0 / 3 * Math.PI * G * rho * rho * (RSUN * RSUN - r * r);
            assertEquals(exact, s.evaluate(Models.expr("P(" + f + "*R)")), 1e-10 * exact);
        }
    }
}
