package dev.plumb.numeric;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumb.model.Model;
import dev.plumb.model.Status;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** Relations written in other shapes, other boundary layouts, and the messages when a problem is ill-posed. */
class FormulationTest {

    static final double G = 6.67430e-11; // CODATA 2018

    static String sphere(String relation, String boundaries) {
        return """
                param M [kg] > 0
                param R [m] > 0
                coord r [m] from 0 to R
                let rho = M / (4/3*pi*R^3)
                let m(r) = 4/3*pi*r^3*rho
                unknown P(r) [Pa]
                %s
                %s
                case earth: M = 5.972e24 [kg], R = 6371 [km]
                """.formatted(relation, boundaries);
    }

    static double uniformCentre() {
        return 3 * G * 5.972e24 * 5.972e24 / (8 * Math.PI * Math.pow(6.371e6, 4));
    }

    @Test
    void relationScaledOrWithTheDerivativeOnTheRightGivesTheSameAnswer() throws SolveException {
        // Analytic: uniform sphere, P(0) = 3 G M^2 / (8 pi R^4).
        for (String rel : new String[]{"relation b: r^2*P'(r) = -G*m(r)*rho", "relation b: -G*m(r)*rho/r^2 = P'(r)",
                "relation b: 2*P'(r) + 2*G*m(r)*rho/r^2 = 0"}) {
            Model m = Models.of(sphere(rel, "boundary surface: P(R) = 0"));
            Solution s = NumericEngine.solve(m, m.cases().get(0).values(), NumericOptions.defaults());
            assertEquals(uniformCentre(), s.evaluate(Models.expr("P(0)")), 1e-10 * uniformCentre(), rel);
        }
    }

    @Test
    void knownCentreIntegratesOutwardWithoutShooting() throws SolveException {
        Model m = Models.of(sphere("relation b: P'(r) = -G*m(r)*rho/r^2", "boundary centre: P(0) = " + uniformCentre() + " [Pa]"));
        Solution s = NumericEngine.solve(m, m.cases().get(0).values(), NumericOptions.defaults());
        assertEquals(0.0, s.evaluate(Models.expr("P(R)")) / uniformCentre(), 1e-12);
        assertTrue(!s.method().contains("shooting"), s.method());
    }

    @Test
    void interiorBoundaryFixesTheStartValue() throws SolveException {
        // An isothermal layer, P = P0 exp(-z/H): given P at 5 km, find P at 0.
        Model m = Models.of("""
                param H = 8 [km]
                coord z [m] from 0 to 10 [km]
                unknown P(z) [Pa]
                relation hydrostatic: P'(z) = -P(z)/H
                boundary middle: P(5 [km]) = 50000 [Pa]
                """);
        Solution s = NumericEngine.solve(m, Map.of(), NumericOptions.defaults());
        assertEquals(50000 * Math.exp(5.0 / 8), s.evaluate(Models.expr("P(0)")), 1e-10 * 50000 * Math.exp(5.0 / 8));
    }

    @Test
    void underDeterminedSaysWhatIsMissing() {
        Model m = Models.of(sphere("relation b: P'(r) = -G*m(r)*rho/r^2", ""));
        SolveException e = assertThrows(SolveException.class,
                () -> NumericEngine.solve(m, m.cases().get(0).values(), NumericOptions.defaults()));
        assertTrue(e.getMessage().contains("under-determined") && e.getMessage().contains("P(0)"), e.getMessage());
        assertTrue(e.span().line() > 0);
    }

    @Test
    void overDeterminedSaysWhichConditions() {
        Model m = Models.of(sphere("relation b: P'(r) = -G*m(r)*rho/r^2",
                "boundary surface: P(R) = 0\nboundary centre: P(0) = 1e11 [Pa]\nboundary extra: P(R/2) = 1e10 [Pa]"));
        SolveException e = assertThrows(SolveException.class,
                () -> NumericEngine.solve(m, m.cases().get(0).values(), NumericOptions.defaults()));
        assertTrue(e.getMessage().contains("over-determined"), e.getMessage());
        assertTrue(e.getMessage().contains("'extra'"), e.getMessage());
    }

    @Test
    void failedCaseBecomesAMessageWithAPlaceAndFailsItsExpectation() {
        Model m = Models.of("""
                param n = 5
                coord xi from 0 to xi1
                unknown theta(xi)
                unknown xi1
                relation lane_emden: theta''(xi) = -2/xi*theta'(xi) - theta(xi)^n
                boundary centre: theta(0) = 1
                boundary regular: theta'(0) = 0
                boundary surface: theta(xi1) = 0
                expect radius: xi1 = 10 within 1%
                """);
        NumericResult r = NumericEngine.run(m, Map.of(), NumericOptions.defaults());
        String failure = r.cases().get(0).failure();
        assertTrue(failure.startsWith("test.plumb:8:"), failure);
        assertTrue(failure.contains("never reached"), failure);
        assertEquals(Status.FAILS, r.checks().get(0).status());
    }

    @Test
    void expectOutsideItsToleranceFails() {
        Model m = Models.of("""
                param H = 8 [km]
                coord z [m] from 0 to 10 [km]
                unknown P(z) [Pa]
                relation hydrostatic: P'(z) = -P(z)/H
                boundary ground: P(0) = 1 [atm]
                expect close: P(8 [km]) = 37275 [Pa] within 0.01%
                expect far: P(8 [km]) = 37000 [Pa] within 0.1%
                expect absolute: P(8 [km]) = 372.75 [hPa] within 5 [Pa]
                """);
        NumericResult r = NumericEngine.run(m, Map.of(), NumericOptions.defaults());
        // Analytic: 101325 Pa / e = 37275.38 Pa
        assertEquals(Status.HOLDS, r.checks().get(0).status(), r.checks().get(0).message());
        assertEquals(Status.FAILS, r.checks().get(1).status(), r.checks().get(1).message());
        assertEquals(Status.HOLDS, r.checks().get(2).status(), r.checks().get(2).message());
        assertNull(r.cases().get(0).failure());
    }

    @Test
    void messagesNameTheUnitAndLeaveWholeProfileClaimsToTheSymbolicSide() {
        Model m = Models.of("""
                param H = 8 [km]
                param P0 = 1 [atm]
                coord z [m] from 0 to 10 [km]
                unknown P(z) [Pa]
                relation hydrostatic: P'(z) = -P(z)/H
                boundary ground: P(0) = P0
                claim profile: P(z) = P0*exp(-z/H)
                expect absolute: P(8 [km]) = 372.75 [hPa] within 5 [Pa]
                expect ratio: P(8 [km])/P0 = 0.3679 within 1e-4 [1]
                """);
        NumericResult r = NumericEngine.run(m, Map.of(), NumericOptions.defaults());
        // Analytic: P(8 km) = 101325 Pa / e = 37275.38 Pa.
        String absolute = r.checks().get(0).message(), ratio = r.checks().get(1).message();
        // The message speaks the file's unit (hPa) with SI beside it, and keeps the tolerance as written.
        assertTrue(absolute.startsWith("P(8 [km]): numeric 372.753") && absolute.contains("(37275.3")
                && absolute.contains("(allowed 5.00000 Pa"), absolute);
        assertTrue(ratio.contains("(allowed 0.000100000 absolute)") && !ratio.contains(" 1,"), ratio);
        assertEquals(Status.HOLDS, r.checks().get(1).status(), ratio);
        CaseResult c = r.cases().get(0);
        assertTrue(c.quantities().stream().noneMatch(q -> q.expr().equals("P(z)")), c.quantities().toString());
        assertTrue(r.notes().stream().noneMatch(n -> n.contains("no single value") || n.contains("'fixed'")), r.notes().toString());
    }

    @Test
    void algebraicUnknownIsRefusedWithAHint() {
        Model m = Models.of("""
                coord z [m] from 0 to 1 [km]
                unknown P(z) [Pa]
                unknown Q(z) [Pa]
                relation a: P'(z) = -Q(z)/(1 [km])
                relation b: Q(z) = P(z)
                boundary ground: P(0) = 1 [atm]
                """);
        SolveException e = assertThrows(SolveException.class, () -> NumericEngine.solve(m, Map.of(), NumericOptions.defaults()));
        assertTrue(e.getMessage().contains("'Q'") && e.getMessage().contains("let"), e.getMessage());
    }
}
