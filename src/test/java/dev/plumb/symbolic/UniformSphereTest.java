package dev.plumb.symbolic;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.plumb.model.Model;
import dev.plumb.model.Status;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/** The uniform-density sphere of DESIGN.md, derived and checked symbolically. */
class UniformSphereTest {

    static Model model;
    static SymbolicResult result;

    @BeforeAll
    static void analyze() {
        model = Fixtures.file("derivations/uniform-sphere.plumb");
        result = Fixtures.analyze(model);
    }

    @Test
    void derivesThePressureProfile() {
        Derived p = Fixtures.derived(result, "P(r)");
        // P(r) = (2/3) pi G rho^2 (R^2 - r^2) with rho = 3M/(4 pi R^3): the analytic solution.
        dev.plumb.lang.Expr expected = Fixtures.model("x.plumb", "param M [kg] > 0\nparam R [m] > 0\ncoord r [m] from 0 to R\n"
                + "claim e: 1 [Pa] = 3*G*M^2*(R^2 - r^2)/(8*pi*R^6)\n").claims().get(0).equation().rhs();
        var bindings = java.util.Map.of("M", 1.989e30, "R", 6.957e8, "r", 2.0e8);
        double got = ConstantEvaluatorSupport.evaluate(model, p.closedForm(), bindings);
        double want = ConstantEvaluatorSupport.evaluate(model, expected, bindings);
        assertEquals(want, got, 1e-12 * want);
        System.out.println("uniform sphere: P(r) = " + p.printed());
        assertEquals("integrate", p.trail().get(2).action());
        assertEquals("apply boundary surface", p.trail().get(3).action());
    }

    @Test
    void derivesTheCentralPressure() {
        assertEquals("3*G*M^2/(8*pi*R^4)", Fixtures.derived(result, "P(0)").printed());
    }

    @Test
    void theClaimAndTheStepsHold() {
        assertEquals(Status.HOLDS, Fixtures.check(result, "central").status());
        assertEquals(Status.HOLDS, Fixtures.check(result, "s1").status());
        assertEquals(Status.HOLDS, Fixtures.check(result, "s2").status());
    }
}
