package dev.plumb.numeric;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumb.model.Model;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * P(R) = 0 at a fixed radius where the density also vanishes, so P has a double zero there and
 * touches zero without crossing it: the condition must be solved as a plain residual at R, not as
 * a surface event. Solved without closed forms, so the shooting starts from a dimensional guess.
 */
class TouchingSurfaceTest {

    // CODATA 2018: G. IAU 2015 Resolution B3: nominal solar GM and radius, Jupiter GM and equatorial radius.
    static final double G = 6.67430e-11, MSUN = 1.3271244e20 / G, RSUN = 6.957e8;
    static final double MJUP = 1.2668653e17 / G, RJUP = 7.1492e7;

    @Test
    void linearDensityMeetsItsClosedForm() throws SolveException {
        Model m = Models.derivation("linear-density.plumb");
        double rhoC = 3 * MSUN / (Math.PI * Math.pow(RSUN, 3));
        Solution s = NumericEngine.solve(m, Map.of("rho_c", rhoC, "R", RSUN), NumericOptions.defaults());
        // Analytic: integrating G m rho / r^2 for rho = rho_c (1 - r/R) gives P(0) = 5 pi G rho_c^2 R^2 / 36.
        double pc = 5 * Math.PI * G * rhoC * rhoC * RSUN * RSUN / 36;
        assertEquals(pc, s.evaluate(Models.expr("P(0)")), 1e-10 * pc, s.method());
        assertEquals(0.0, s.evaluate(Models.expr("P(R)")) / pc, 1e-12);
        assertEquals(MSUN, s.evaluate(Models.expr("m(R)")), 1e-12 * MSUN);
        assertFalse(s.method().contains("surface"), "a plain condition at R, not a surface event: " + s.method());
    }

    @Test
    void parabolicDensityMeetsItsClosedProfile() throws SolveException {
        Model m = Models.of("""
                param M [kg] > 0
                param R [m] > 0
                coord r [m] from 0 to R
                let rho_c = 15*M/(8*pi*R^3)
                let rho(r) = rho_c*(1 - (r/R)^2)
                unknown m(r) [kg]
                unknown P(r) [Pa]
                relation mass: m'(r) = 4*pi*r^2*rho(r)
                relation balance: P'(r) = -G*m(r)*rho(r)/r^2
                boundary centre: m(0) = 0
                boundary surface: P(R) = 0
                case jupiter: M = 1 [Mjup], R = 1 [Rjup]
                """);
        Solution s = NumericEngine.solve(m, m.cases().get(0).values(), NumericOptions.defaults());
        for (int i = 0; i <= 10; i++) {
            double r = RJUP * i / 10;
            // Analytic, rho = rho_c (1 - r^2/R^2): P(r) = 15 G M^2 (2R^2 - r^2)(R^2 - r^2)^2 / (32 pi R^10).
            double closed = 15 * G * MJUP * MJUP * (2 * RJUP * RJUP - r * r) * Math.pow(RJUP * RJUP - r * r, 2)
                    / (32 * Math.PI * Math.pow(RJUP, 10));
            double pc = 15 * G * MJUP * MJUP / (16 * Math.PI * Math.pow(RJUP, 4));
            assertEquals(closed, s.evaluate(Models.expr("P(" + i + "*R/10)")), 1e-10 * pc, "r = " + r + "; " + s.method());
        }
    }

    @Test
    void relationsThatDependOnPressureStillFindTheSurfaceAsAnEvent() throws SolveException {
        // A polytrope's density (P/K)^(n/(n+1)) is undefined past P = 0: the plain residual at R could not be reached.
        Model m = Models.derivation("polytrope.plumb");
        Solution s = NumericEngine.solve(m, Map.of("M", MSUN, "R", RSUN, "n", 3.0), NumericOptions.defaults());
        assertTrue(s.method().contains("surface P(R) = 0 found at"), s.method());
    }
}
