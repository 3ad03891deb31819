package dev.plumb.symbolic;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumb.lang.Expr;
import dev.plumb.model.Model;
import dev.plumb.model.Status;
import java.util.Map;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/** The 1976 standard atmosphere from 0 to 20 km: a lapse-rate layer and an isothermal layer, joined continuously. */
class StandardAtmosphereLayersTest {

    // The constants of U.S. Standard Atmosphere, 1976 (not CODATA); the temperature is piecewise in a let.
    private static final String FILE = """
            param g0 = 9.80665 [m/s^2]
            param M0 = 0.0289644 [kg/mol]
            param Rstar = 8.31432 [J/(mol K)]
            param T0 = 288.15 [K]
            param L = 6.5 [K/km]
            coord h [m] from 0 to 20 [km]
            let T(h) = if h < 11 [km] then T0 - L*h else T0 - L*(11 [km])
            unknown p(h) [Pa]
            relation hydrostatic: p'(h) = -p(h)*M0*g0/(Rstar*T(h))
            boundary ground: p(0) = 101325 [Pa]
            claim lower: p(5 [km]) = 101325 [Pa]*(1 - L*(5 [km])/T0)^(g0*M0/(Rstar*L))
            claim wrong_upper: p(15 [km]) = 101325 [Pa]*(1 - L*(15 [km])/T0)^(g0*M0/(Rstar*L))
            expect tropopause: p(11 [km]) = 22632.06 [Pa] within 1e-6
            expect top: p(20 [km]) = 5474.889 [Pa] within 1e-6
            """;

    static Model model;
    static SymbolicResult result;

    @BeforeAll
    static void analyze() {
        model = Fixtures.model("standard-atmosphere.plumb", FILE);
        result = Fixtures.analyze(model);
    }

    private static double at(String expr) {
        return ConstantEvaluatorSupport.evaluate(model, Fixtures.derived(result, expr).closedForm(), Map.of());
    }

    @Test
    void pressuresAtTheTropopauseAndAt20KmMatchTheStandard() {
        // U.S. Standard Atmosphere, 1976, table: 22632.06 Pa at 11 km and 5474.889 Pa at 20 km geopotential altitude.
        double p11 = at("p(11 [km])");
        double p20 = at("p(20 [km])");
        System.out.println("standard atmosphere: p(11 km) = " + p11 + " Pa, p(20 km) = " + p20 + " Pa");
        assertEquals(0, (p11 - 22632.06) / 22632.06, 1e-6);
        assertEquals(0, (p20 - 5474.889) / 5474.889, 1e-6);
    }

    @Test
    void theProfileIsPiecewiseAndContinuousAtTheBreak() {
        Derived p = Fixtures.derived(result, "p(h)");
        System.out.println("standard atmosphere: p(h) = " + p.printed());
        assertInstanceOf(Expr.If.class, p.closedForm());
        double below = ConstantEvaluatorSupport.evaluate(model, p.closedForm(), Map.of("h", 11000 * (1 - 1e-12)));
        double above = ConstantEvaluatorSupport.evaluate(model, p.closedForm(), Map.of("h", 11000 * (1 + 1e-12)));
        assertEquals(below, above, 1e-9 * below);
        assertTrue(p.trail().stream().anyMatch(t -> t.action().contains("continuity")), p.trail().toString());
    }

    @Test
    void theLapseRateFormHoldsOnlyInTheLowerLayer() {
        assertEquals(Status.HOLDS, Fixtures.check(result, "lower").status(), Fixtures.check(result, "lower").message());
        assertEquals(Status.FAILS, Fixtures.check(result, "wrong_upper").status(), Fixtures.check(result, "wrong_upper").message());
    }

    @Test
    void theLowerLayerReadsAsAPowerOfOneMinusTheLapse() {
        String printed = Fixtures.derived(result, "p(h)").printed();
        assertTrue(printed.startsWith("if h < 11000 then 101325*(1 - L*h/T0)^("), printed);
    }

    @Test
    void threeNestedLayersFromABoundaryInTheMiddleOneWorkOutwardBothWays() {
        String file = """
                param g0 = 9.80665 [m/s^2]
                param M0 = 0.0289644 [kg/mol]
                param Rstar = 8.31432 [J/(mol K)]
                coord z [m] from 0 to 32 [km]
                let T(z) = if z < 11 [km] then 288.15 [K] - 6.5 [K/km]*z else if z < 20 [km] then 216.65 [K] else 216.65 [K] + 1 [K/km]*(z - 20 [km])
                unknown P(z) [Pa]
                relation hydrostatic: P'(z) = -P(z)*M0*g0/(Rstar*T(z))
                boundary middle: P(20 [km]) = 5474.889 [Pa]
                show P(0)
                show P(32 [km])
                """;
        Model m = Fixtures.model("three-layers.plumb", file);
        SymbolicResult r = Fixtures.analyze(m);
        double ground = ConstantEvaluatorSupport.evaluate(m, Fixtures.derived(r, "P(0)").closedForm(), Map.of());
        double top = ConstantEvaluatorSupport.evaluate(m, Fixtures.derived(r, "P(32 [km])").closedForm(), Map.of());
        // U.S. Standard Atmosphere, 1976: 101325 Pa at 0 km; 868.0187 Pa at 32 km (layer-base table; value from memory).
        assertEquals(0, (ground - 101325) / 101325, 1e-6);
        assertEquals(0, (top - 868.0187) / 868.0187, 1e-6);
    }
}
