package dev.plumb.numeric;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumb.model.Model;
import dev.plumb.model.Status;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** The Lane-Emden equation with its free surface, against analytic solutions and Chandrasekhar's table. */
class LaneEmdenTest {

    static Model laneEmden(double n) {
        return Models.of("""
                param n = %s
                coord xi from 0 to xi1
                unknown theta(xi)
                unknown xi1
                relation lane_emden: theta''(xi) = -2/xi*theta'(xi) - theta(xi)^n
                boundary centre: theta(0) = 1
                boundary regular: theta'(0) = 0
                boundary surface: theta(xi1) = 0
                """.formatted(n));
    }

    static double value(Solution s, String expr) throws SolveException {
        return s.evaluate(Models.expr(expr));
    }

    @Test
    void uniformDensityMatchesTheAnalyticSolution() throws SolveException {
        // Analytic, n = 0: theta = 1 - xi^2/6, so xi1 = sqrt(6) and -xi1^2 theta'(xi1) = 2 sqrt(6).
        Solution s = NumericEngine.solve(laneEmden(0), Map.of(), NumericOptions.defaults());
        assertEquals(Math.sqrt(6), value(s, "xi1"), 1e-10 * Math.sqrt(6));
        assertEquals(2 * Math.sqrt(6), value(s, "-xi1^2*theta'(xi1)"), 1e-10 * 2 * Math.sqrt(6));
        assertEquals(1 - 1.0 / 6, value(s, "theta(1)"), 1e-12);
    }

    @Test
    void indexOneMatchesTheAnalyticSolution() throws SolveException {
        // Analytic, n = 1: theta = sin(xi)/xi, so xi1 = pi and -xi1^2 theta'(xi1) = pi.
        Solution s = NumericEngine.solve(laneEmden(1), Map.of(), NumericOptions.defaults());
        assertEquals(Math.PI, value(s, "xi1"), 1e-10 * Math.PI);
        assertEquals(Math.PI, value(s, "-xi1^2*theta'(xi1)"), 1e-10 * Math.PI);
        assertEquals(Math.sin(2.0) / 2.0, value(s, "theta(2)"), 1e-11);
        assertEquals(Math.sin(1e-3) / 1e-3, value(s, "theta(0.001)"), 1e-12, "inside the series start");
    }

    @Test
    void indexFiveMatchesTheAnalyticSolution() throws SolveException {
        // Analytic, n = 5: theta = (1 + xi^2/3)^(-1/2), which never vanishes.
        Model m = Models.derivation("lane-emden-n5.plumb");
        Solution s = NumericEngine.solve(m, Map.of(), NumericOptions.defaults());
        for (double xi : new double[]{0.5, 3, 10, 20}) {
            double exact = 1 / Math.sqrt(1 + xi * xi / 3);
            assertEquals(exact, value(s, "theta(" + xi + ")"), 1e-10 * exact, "theta(" + xi + ")");
        }
        double slope = -10.0 / 3 * Math.pow(1 + 100.0 / 3, -1.5);
        assertEquals(slope, value(s, "theta'(10)"), 1e-10 * Math.abs(slope));
    }

    @Test
    void indexFiveHasNoSurface() {
        SolveException e = org.junit.jupiter.api.Assertions.assertThrows(SolveException.class,
                () -> NumericEngine.solve(laneEmden(5), Map.of(), NumericOptions.defaults()));
        assertTrue(e.getMessage().contains("never reached"), e.getMessage());
        assertTrue(e.span().line() > 0, "the message points at the surface boundary");
    }

    @ParameterizedTest(name = "n = {0}")
    @CsvSource({
            // Chandrasekhar (1939), An Introduction to the Study of Stellar Structure, table of polytropes:
            // n, xi1, -xi1^2 theta'(xi1), rho_c/rho_mean. n = 3 as quoted in the design brief; n = 1.5 from memory
            // of the table, consistent since rho_c/rho_mean = xi1^3 / (3 (-xi1^2 theta'(xi1))).
            "1.5, 3.65375, 2.71406, 5.99071",
            "3,   6.89685, 2.01824, 54.1825"})
    void chandrasekharTableToSixFigures(double n, double xi1, double mass, double concentration) throws SolveException {
        Solution s = NumericEngine.solve(laneEmden(n), Map.of(), NumericOptions.defaults());
        // Six significant figures: agreement within half a unit of the last printed digit.
        assertEquals(xi1, value(s, "xi1"), halfUnit(xi1));
        assertEquals(mass, value(s, "-xi1^2*theta'(xi1)"), halfUnit(mass));
        // For n = 1.5 the remembered 5.99071 is one unit of its last digit off what the table's own xi1 and
        // -xi1^2 theta' give (3.65375^3 / (3 * 2.71406) = 5.990705), so that entry is held to a whole unit.
        double allowed = n == 1.5 ? 2 * halfUnit(concentration) : halfUnit(concentration);
        assertEquals(concentration, value(s, "-xi1/(3*theta'(xi1))"), allowed);
    }

    static double halfUnit(double sixFigures) {
        return 0.5 * Math.pow(10, Math.floor(Math.log10(Math.abs(sixFigures))) - 5);
    }

    @Test
    void shippedFilesPassTheirExpectations() {
        for (String f : new String[]{"lane-emden-n0.plumb", "lane-emden-n1.5.plumb", "lane-emden-n3.plumb", "lane-emden-n5.plumb"}) {
            NumericResult r = NumericEngine.run(Models.derivation(f), Map.of(), NumericOptions.defaults());
            assertEquals(1, r.cases().size(), f);
            assertEquals(NumericEngine.IMPLICIT_CASE, r.cases().get(0).label());
            assertNull(r.cases().get(0).failure(), f);
            r.checks().forEach(c -> assertEquals(Status.HOLDS, c.status(), f + ": " + c.message()));
            for (QuantityRow q : r.cases().get(0).quantities()) {
                if (q.relDiff() != null) assertTrue(q.relDiff() < 1e-10, f + " " + q);
                assertTrue(q.errorEstimate() < 1e-9 * Math.max(1, Math.abs(q.numeric())), f + " error estimate " + q);
            }
        }
    }
}
