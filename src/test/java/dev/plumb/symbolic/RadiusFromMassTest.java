package dev.plumb.symbolic;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumb.model.Model;
import dev.plumb.model.Status;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * An unknown end of the interval fixed by a boundary that is not the free surface: the radius of
 * an incompressible planet from m(R) = M, with the pressure then following from P(R) = 0.
 */
class RadiusFromMassTest {

    private static final String LIQUID_PLANET = """
            param rho [kg/m^3] > 0
            param M [kg] > 0
            unknown R [m]
            coord r [m] from 0 to R
            unknown m(r) [kg]
            unknown P(r) [Pa]
            relation mass: m'(r) = 4*pi*r^2*rho
            relation balance: P'(r) = -G*m(r)*rho/r^2
            boundary centre: m(0) = 0
            boundary total: m(R) = M
            boundary surface: P(R) = 0
            claim radius: R = (3*M/(4*pi*rho))^(1/3)
            claim central: P(0) = 2/3*pi*G*rho^2*R^2
            claim halved: P(0) = 1/3*pi*G*rho^2*R^2
            """;

    @Test
    void theRadiusFollowsFromTheMassAndThePressureFromTheSurface() {
        Model model = Fixtures.model("liquid.plumb", LIQUID_PLANET);
        SymbolicResult r = Fixtures.analyze(model);
        // Analytic, uniform density: R = (3M/(4 pi rho))^(1/3), P(r) = (2/3) pi G rho^2 (R^2 - r^2).
        assertEquals("(3*M/(4*pi*rho))^(1/3)", Fixtures.derived(r, "R").printed());
        assertEquals(Status.HOLDS, Fixtures.check(r, "radius").status(), Fixtures.check(r, "radius").message());
        assertEquals(Status.HOLDS, Fixtures.check(r, "central").status(), Fixtures.check(r, "central").message());
        assertEquals(Status.FAILS, Fixtures.check(r, "halved").status());
        assertEquals("1/2", Fixtures.check(r, "halved").factor());
        // Water, 1000 kg/m^3, and 0.1 nominal Earth mass (IAU 2015 B3: GM = 3.986004e14 m^3/s^2, G from CODATA 2018).
        double m = 0.1 * 3.986004e14 / 6.67430e-11;
        double radius = Math.cbrt(3 * m / (4 * Math.PI * 1000));
        Map<String, Double> at = Map.of("rho", 1000.0, "M", m, "r", 0.25 * radius);
        double p = 2.0 / 3 * Math.PI * 6.67430e-11 * 1e6 * (radius * radius - 0.0625 * radius * radius);
        assertEquals(p, ConstantEvaluatorSupport.evaluate(model, Fixtures.derived(r, "P(r)").closedForm(), at), 1e-12 * p);
        assertTrue(r.notes().stream().noneMatch(n -> n.contains("constant of integration")), r.notes().toString());
    }

    @Test
    void theRootIsTheOneTheAssumptionsAllow() {
        // A disk of surface density sigma: m(R) = pi*sigma*R^2 = M has the roots ±sqrt(M/(pi*sigma)); a radius is positive.
        String file = """
                param sigma [kg/m^2] > 0
                param M [kg] > 0
                param P_s [Pa] > 0
                unknown R [m]
                coord r [m] from 0 to R
                unknown m(r) [kg]
                unknown P(r) [Pa]
                relation mass: m'(r) = 2*pi*sigma*r
                relation balance: P'(r) = -G*m(r)*sigma/r^3
                boundary m(0) = 0
                boundary P(R) = P_s
                boundary m(R) = M
                claim radius: R = sqrt(M/(pi*sigma))
                claim inner: P(R/2) = P_s + pi*G*sigma^2*log(2)
                """;
        SymbolicResult r = Fixtures.analyze(Fixtures.model("disk.plumb", file));
        // Analytic: m(r) = pi sigma r^2, P'(r) = -pi G sigma^2/r, so P(r) = P_s + pi G sigma^2 log(R/r).
        assertEquals(Status.HOLDS, Fixtures.check(r, "radius").status(), Fixtures.check(r, "radius").message());
        assertEquals(Status.HOLDS, Fixtures.check(r, "inner").status(), Fixtures.check(r, "inner").message() + r.notes());
    }

    @Test
    void aNoteIsSaidOnceThoughThePassesMeetItTwice() {
        String file = LIQUID_PLANET.replace("boundary surface: P(R) = 0\n", "");
        SymbolicResult r = Fixtures.analyze(Fixtures.model("no-surface.plumb", file));
        assertEquals(1, r.notes().stream().filter(n -> n.contains("no boundary condition fixes the constant of integration of P(r)")).count(),
                r.notes().toString());
        assertEquals(Status.UNDECIDED, Fixtures.check(r, "central").status());
    }
}
