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
        System.out.println(p.printed());
        p.trail().forEach(t -> System.out.println("  " + t.action() + ": " + t.result()));
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
