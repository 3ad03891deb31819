package dev.plumb.symbolic;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.plumb.model.Check;
import dev.plumb.model.Model;
import dev.plumb.model.Status;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** An unknown radius fixed by an algebraic boundary: P(R) = 0 has two roots and only the positive one is a radius. */
class FreeSurfaceTest {

    @Test
    void theRadiusIsThePositiveRootAndItsClaimsHold() {
        Model model = Fixtures.file("derivations/free-surface-sphere.plumb");
        SymbolicResult r = Fixtures.analyze(model);
        Derived radius = Fixtures.derived(r, "R");
        assertEquals("sqrt(3*P_c/(2*pi*G*rho0^2))", radius.printed());
        // Analytic: P_c - (2/3)*pi*G*rho0^2*R^2 = 0, with G from CODATA 2018.
        double want = Math.sqrt(3 * 1e11 / (2 * Math.PI * 6.67430e-11 * 5000.0 * 5000.0));
        double got = ConstantEvaluatorSupport.evaluate(model, radius.closedForm(), Map.of("rho0", 5000.0, "P_c", 1e11));
        assertEquals(want, got, 1e-12 * want);
        assertEquals(Status.HOLDS, Fixtures.check(r, "radius").status(), Fixtures.check(r, "radius").message());
        assertEquals(Status.HOLDS, Fixtures.check(r, "mass").status(), Fixtures.check(r, "mass").message());
    }

    @Test
    void aWrongClaimOnTheRadiusFailsWithItsFactor() {
        String file = """
                param rho0 [kg/m^3] > 0
                param P_c [Pa] > 0
                unknown R [m]
                coord r [m] from 0 to R
                unknown P(r) [Pa]
                relation balance: P'(r) = -4/3*pi*G*rho0^2*r
                boundary centre: P(0) = P_c
                boundary surface: P(R) = 0
                claim doubled: R = 2*sqrt(3*P_c/(2*pi*G*rho0^2))
                """;
        Check c = Fixtures.check(Fixtures.analyze(Fixtures.model("free.plumb", file)), "doubled");
        assertEquals(Status.FAILS, c.status(), c.message());
        assertEquals("2", c.factor(), c.message());
    }
}
