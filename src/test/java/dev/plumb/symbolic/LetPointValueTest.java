package dev.plumb.symbolic;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.plumb.model.Check;
import dev.plumb.model.Status;
import org.junit.jupiter.api.Test;

/** A let function called at a point, m(R), is derived and checked like a profile at a point. */
class LetPointValueTest {

    @Test
    void aLetFunctionAtTheSurfaceGivesTheTotalMass() {
        String file = """
                param M [kg] > 0
                param R [m] > 0
                coord r [m] from 0 to R
                let rho = M / (4/3*pi*R^3)
                let m(r) = 4/3*pi*r^3*rho
                claim total: m(R) = M
                claim half: m(R/2) = M/4
                """;
        SymbolicResult r = Fixtures.analyze(Fixtures.model("let.plumb", file));
        assertEquals("M", Fixtures.derived(r, "m(R)").printed());
        // Analytic: m(R/2) = M/8 at uniform density, so the claim M/4 is twice too large.
        assertEquals("M/8", Fixtures.derived(r, "m(R/2)").printed());
        assertEquals(Status.HOLDS, Fixtures.check(r, "total").status());
        Check half = Fixtures.check(r, "half");
        assertEquals(Status.FAILS, half.status());
        assertEquals("2", half.factor(), half.message());
    }

    @Test
    void theLinearDensityLawGivesItsMassAndCentralPressure() {
        SymbolicResult r = Fixtures.analyze(Fixtures.file("derivations/linear-density.plumb"));
        // Analytic: m(R) = pi*rho_c*R^3/3 and P(0) = 5*pi*G*rho_c^2*R^2/36 for rho = rho_c*(1 - r/R).
        assertEquals("pi*rho_c*R^3/3", Fixtures.derived(r, "m(R)").printed());
        assertEquals("5*pi*G*rho_c^2*R^2/36", Fixtures.derived(r, "P(0)").printed());
        assertEquals("0", Fixtures.derived(r, "rho(R)").printed());
        for (String label : new String[] {"surface_density", "total", "central"}) {
            assertEquals(Status.HOLDS, Fixtures.check(r, label).status(), () -> Fixtures.check(r, label).message());
        }
    }
}
