package dev.plumb.symbolic;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.plumb.model.ConstantEvaluator;
import dev.plumb.model.Model;
import dev.plumb.model.Status;
import java.util.Map;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/** The constant-lapse-rate troposphere, derived in closed form and compared with the standard. */
class TroposphereTest {

    static Model model;
    static SymbolicResult result;

    @BeforeAll
    static void analyze() {
        model = Fixtures.file("derivations/troposphere.plumb");
        result = Fixtures.analyze(model);
    }

    @Test
    void theDerivedPressureAtTheTropopauseMatchesTheStandard() throws ConstantEvaluator.NotConstant {
        Derived top = Fixtures.derived(result, "P(11 [km])");
        double p = new ConstantEvaluator(n -> model.symbols().get(n), Map.of()).evaluate(top.closedForm());
        // U.S. Standard Atmosphere, 1976: 22632.06 Pa at 11 km geopotential altitude.
        double relative = Math.abs(p - 22632.06) / 22632.06;
        System.out.println("troposphere: P(11 km) = " + p + " Pa, relative difference " + relative + "; " + top.printed());
        assertEquals(0, relative, 1e-6);
    }

    @Test
    void theProfileIsFoundByIntegratingALinearRelation() {
        Derived p = Fixtures.derived(result, "P(z)");
        p.trail().forEach(t -> System.out.println("  " + t.action() + ": " + t.result()));
        assertEquals("apply boundary ground", p.trail().get(p.trail().size() - 2).action());
    }

    @Test
    void theStepsAndTheClaimHold() {
        assertEquals(Status.HOLDS, Fixtures.check(result, "separate").status(), () -> Fixtures.check(result, "separate").message());
        assertEquals(Status.HOLDS, Fixtures.check(result, "barometric").status(), () -> Fixtures.check(result, "barometric").message());
        assertEquals(Status.HOLDS, Fixtures.check(result, "tropopause").status(), () -> Fixtures.check(result, "tropopause").message());
    }
}
