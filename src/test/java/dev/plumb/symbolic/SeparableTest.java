package dev.plumb.symbolic;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumb.model.Model;
import dev.plumb.model.Status;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** Separable and linear first-order atmospheres: a polytropic layer under constant gravity, and the isothermal one. */
class SeparableTest {

    @Test
    void aPolytropicAtmosphereIsIntegratedBySeparatingTheVariables() {
        String file = """
                param g0 = 9.80665 [m/s^2]
                param K [Pa m^5 kg^(-5/3)] > 0
                param P0 [Pa] > 0
                coord z [m] from 0 to 1 [km]
                unknown P(z) [Pa]
                relation hydro: P'(z) = -g0*(P(z)/K)^(3/5)
                boundary ground: P(0) = P0
                claim profile: P(z) = (P0^(2/5) - 2*g0*z/(5*K^(3/5)))^(5/2)
                claim wrong: P(z) = (P0^(2/5) - g0*z/(5*K^(3/5)))^(5/2)
                case air: K = 1e3 [Pa m^5 kg^(-5/3)], P0 = 1e5 [Pa]
                """;
        Model model = Fixtures.model("polytropic-atmosphere.plumb", file);
        SymbolicResult r = Fixtures.analyze(model);
        Derived p = Fixtures.derived(r, "P(z)");
        assertTrue(p.trail().stream().anyMatch(t -> t.action().equals("separate the variables")), p.trail().toString());
        // Analytic: (5/2)*K^(3/5)*(P^(2/5) - P0^(2/5)) = -g0*z.
        double k = 1e3;
        double p0 = 1e5;
        double z = 500;
        double want = Math.pow(Math.pow(p0, 0.4) - 2 * 9.80665 * z / (5 * Math.pow(k, 0.6)), 2.5);
        double got = ConstantEvaluatorSupport.evaluate(model, p.closedForm(), Map.of("K", k, "P0", p0, "z", z));
        assertEquals(want, got, 1e-12 * want);
        assertEquals("(P0^(2/5) - 2*g0*z/(5*K^(3/5)))^(5/2)", p.printed());
        assertEquals(Status.HOLDS, Fixtures.check(r, "profile").status(), Fixtures.check(r, "profile").message());
        assertEquals(Status.FAILS, Fixtures.check(r, "wrong").status(), Fixtures.check(r, "wrong").message());
    }

    @Test
    void theIsothermalAtmosphereThroughALetStaysExponential() {
        SymbolicResult r = Fixtures.analyze(Fixtures.file("derivations/isothermal-atmosphere.plumb"));
        assertEquals(Status.HOLDS, Fixtures.check(r, "profile").status(), Fixtures.check(r, "profile").message());
        assertEquals(Status.HOLDS, Fixtures.check(r, "one_height").status(), Fixtures.check(r, "one_height").message());
        // e is a built-in of the language, so Euler's number prints as e.
        assertEquals("P0/e", Fixtures.derived(r, "P(H)").printed());
    }
}
