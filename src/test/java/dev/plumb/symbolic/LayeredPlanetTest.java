package dev.plumb.symbolic;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.plumb.model.Model;
import dev.plumb.model.Status;
import java.util.Map;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/** A uniform core inside a uniform mantle: mass and pressure layer by layer, the total mass and the core mass met. */
class LayeredPlanetTest {

    static Model model;
    static SymbolicResult result;

    @BeforeAll
    static void analyze() {
        model = Fixtures.file("derivations/layered-planet.plumb");
        result = Fixtures.analyze(model);
    }

    @Test
    void theMassClaimsHold() {
        for (String label : new String[] {"total", "core_mass"}) {
            assertEquals(Status.HOLDS, Fixtures.check(result, label).status(), () -> Fixtures.check(result, label).message());
        }
        assertEquals("Mtot", Fixtures.derived(result, "m(R)").printed());
    }

    @Test
    void theMassProfileIsCubicInTheCore() {
        // Analytic: 60% of the mass inside R/2 at constant density gives m = 0.6*M*(2r/R)^3 = 24*M*r^3/(5*R^3).
        assertEquals("if r < R/2 then 24*Mtot*r^3/(5*R^3) else Mtot*(19*R^3 + 16*r^3)/(35*R^3)",
                Fixtures.derived(result, "m(r)").printed());
    }

    @Test
    void theCentralPressureAgreesWithAQuadratureOfTheBalance() {
        double mass = 5.9722e24;
        double radius = 6.3781e6;
        double g = 6.67430e-11; // CODATA 2018
        double core = 0.6 * mass / (4.0 / 3 * Math.PI * Math.pow(radius / 2, 3));
        double mantle = 0.4 * mass / (4.0 / 3 * Math.PI * (Math.pow(radius, 3) - Math.pow(radius / 2, 3)));
        // P(0) = integral from 0 to R of G*m(r)*rho(r)/r^2, by the midpoint rule on the two uniform layers.
        int n = 200_000;
        double sum = 0;
        for (int i = 0; i < n; i++) {
            double r = (i + 0.5) * radius / n;
            double rho = r < radius / 2 ? core : mantle;
            double m = r < radius / 2 ? 4.0 / 3 * Math.PI * core * r * r * r
                    : 0.6 * mass + 4.0 / 3 * Math.PI * mantle * (r * r * r - Math.pow(radius / 2, 3));
            sum += g * m * rho / (r * r) * radius / n;
        }
        double closed = ConstantEvaluatorSupport.evaluate(model, Fixtures.derived(result, "P(0)").closedForm(),
                Map.of("Mtot", mass, "R", radius));
        System.out.println("two-layer planet: P(0) = " + closed + " Pa (quadrature " + sum + " Pa)");
        assertEquals(sum, closed, 1e-6 * sum);
    }
}
