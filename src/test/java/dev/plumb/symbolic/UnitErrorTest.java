package dev.plumb.symbolic;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumb.model.Status;
import org.junit.jupiter.api.Test;

/** A relation whose two sides differ in unit gives no closed form, and says why. */
class UnitErrorTest {

    private static final String FILE = """
            param M [kg] > 0
            param R [m] > 0
            coord r [m] from 0 to R
            let rho = M / (4/3*pi*R^3)
            let m(r) = 4/3*pi*r^3*rho
            unknown P(r) [Pa]
            relation balance: P'(r) = -G*m(r)*rho/r
            boundary surface: P(R) = 0
            step s1: P'(r) = -G*m(r)*rho/r
            claim central: P(0) = G*M^2/(4*pi*R^3)
            """;

    @Test
    void theInconsistentRelationIsNotIntegrated() {
        SymbolicResult r = Fixtures.analyze(Fixtures.modelWithUnitErrors("units.plumb", FILE));
        assertTrue(r.derived().isEmpty(), r.derived().toString());
        assertFalse(r.profiles().containsKey("P"));
        assertTrue(r.notes().contains("relation 'balance' has inconsistent units; no closed form is derived from it"), r.notes().toString());
        // The claim is what integrating the broken relation would give: it must not be confirmed by it.
        assertNotEquals(Status.HOLDS, Fixtures.check(r, "central").status());
        assertNotEquals(Status.HOLDS, Fixtures.check(r, "s1").status());
    }

    @Test
    void theSameFileWithTheUnitsRightIsIntegrated() {
        SymbolicResult r = Fixtures.analyze(Fixtures.model("units-ok.plumb",
                FILE.replace("rho/r\n", "rho/r^2\n").replace("claim central: P(0) = G*M^2/(4*pi*R^3)", "claim central: P(0) = 3*G*M^2/(8*pi*R^4)")));
        // Analytic, uniform density: P(0) = 3 G M^2/(8 pi R^4).
        assertEquals(Status.HOLDS, Fixtures.check(r, "central").status());
        assertTrue(r.notes().stream().noneMatch(n -> n.contains("inconsistent units")), r.notes().toString());
    }
}
