package dev.plumb.symbolic;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.plumb.model.Model;
import dev.plumb.model.Status;
import java.util.Map;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/** Lane–Emden n = 1: the analytic solution theta = sin(xi)/xi is recognised, with its first zero at pi. */
class LaneEmdenTest {

    static Model model;
    static SymbolicResult result;

    @BeforeAll
    static void analyze() {
        model = Fixtures.file("derivations/lane-emden-n1.plumb");
        result = Fixtures.analyze(model);
    }

    @Test
    void recognisesTheAnalyticSolution() {
        Derived theta = Fixtures.derived(result, "theta(xi)");
        assertEquals("sin(xi)/xi", theta.printed());
        assertEquals("verify", theta.trail().stream().filter(t -> t.action().equals("verify")).findFirst().orElseThrow().action());
    }

    @Test
    void theFirstZeroIsPi() {
        Derived xi1 = Fixtures.derived(result, "xi1");
        assertEquals("pi", xi1.printed());
        // Analytic: the first positive zero of sin(xi)/xi is pi.
        assertEquals(Math.PI, ConstantEvaluatorSupport.evaluate(model, xi1.closedForm(), Map.of()), 1e-15);
    }

    @Test
    void theClaimsAndTheStepHold() {
        for (String label : new String[] {"solution", "first_zero", "mass_constant"}) {
            assertEquals(Status.HOLDS, Fixtures.check(result, label).status(), () -> label + ": " + Fixtures.check(result, label).message()
                    + " " + result.notes());
        }
    }
}
