package dev.plumb.symbolic;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumb.model.Check;
import dev.plumb.model.Status;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/** Planted mistakes in an invented uniform sphere are found, and each says how it is wrong. */
class WrongDerivationTest {

    static SymbolicResult result;

    @BeforeAll
    static void analyze() {
        result = Fixtures.analyze(Fixtures.file("examples/wrong-moonlet.plumb"));
    }

    @Test
    void aClaimOffByTwoFailsWithFactorTwo() {
        Check c = Fixtures.check(result, "doubled");
        assertEquals(Status.FAILS, c.status());
        assertEquals("2", c.factor(), c.message());
    }

    @Test
    void aDroppedPiIsNamedExactly() {
        Check c = Fixtures.check(result, "lost_pi");
        assertEquals(Status.FAILS, c.status());
        assertEquals("pi", c.factor(), c.message());
    }

    @Test
    void aFlippedSignFailsAndSaysSo() {
        Check c = Fixtures.check(result, "flipped");
        assertEquals(Status.FAILS, c.status());
        assertEquals("-1", c.factor());
        assertTrue(c.message().contains("sign"), c.message());
    }

    @Test
    void aStepThatMeetsTheRelationButNotTheBoundarySaysWhichPartFails() {
        Check c = Fixtures.check(result, "wrong_end");
        assertEquals(Status.FAILS, c.status());
        assertTrue(c.message().contains("meets relation 'balance'"), c.message());
        assertTrue(c.message().contains("boundary 'surface' is not met"), c.message());
    }

    @Test
    void laterStepsAreCheckedOnTheirOwnMerits() {
        assertEquals(Status.HOLDS, Fixtures.check(result, "right").status());
        assertEquals(Status.HOLDS, Fixtures.check(result, "right_centre").status());
    }
}
