package dev.plumb.numeric;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumb.model.Model;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** Compiled relations against the same formulas computed directly. */
class EvaluatorTest {

    static final double G = 6.67430e-11; // CODATA 2018

    @Test
    void polytropeRelationsCompileToBytecodeAndMatchTheFormula() throws SolveException {
        Model m = Models.derivation("polytrope.plumb");
        Map<String, Double> values = Map.of("M", 2e30, "R", 7e8);
        CaseProblem p = new CaseProblem(Formulation.of(m), values, NumericOptions.defaults(), Map.of());
        assertTrue(p.system.compiledToBytecode(), "kernel source:\n" + KernelCompiler.source(explicitOf(p), new int[]{0, 1}, new int[]{-1, -1}, 2));
        double k = 3.8e9, r = 2e8, pr = 1e15, mr = 1e30;
        p.load(new double[]{k});
        double[] d = p.system.derivatives(r, new double[]{pr, mr});
        double rho = Math.pow(pr / k, 3.0 / 4.0);
        assertEquals(-G * mr * rho / (r * r), d[0], 1e-15 * Math.abs(d[0]));
        assertEquals(4 * Math.PI * r * r * rho, d[1], 1e-15 * d[1]);
    }

    static Evaluator[] explicitOf(CaseProblem p) {
        try {
            var f = RelationSystem.class.getDeclaredField("explicit");
            f.setAccessible(true);
            return (Evaluator[]) f.get(p.system);
        } catch (ReflectiveOperationException e) {
            throw new IllegalStateException(e);
        }
    }

    @Test
    void piecewiseBranchLocksAndFreesInBytecodeAndTrees() throws SolveException {
        Model m = Models.derivation("standard-atmosphere-1976.plumb");
        CaseProblem p = new CaseProblem(Formulation.of(m), Map.of(), NumericOptions.defaults(), Map.of());
        assertTrue(p.system.compiledToBytecode());
        // U.S. Standard Atmosphere 1976 constants: g0 M0 / R* and the temperatures on either side of 11 km.
        double c = 9.80665 * 0.0289644 / 8.31432;
        double below = p.system.derivatives(5000, new double[]{50000})[0];
        assertEquals(-c * 50000 / (288.15 - 0.0065 * 5000), below, 1e-12 * Math.abs(below));
        double above = p.system.derivatives(15000, new double[]{10000})[0];
        assertEquals(-c * 10000 / 216.65, above, 1e-12 * Math.abs(above));
    }

    @Test
    void implicitRelationsUseTheInterpretedLinearSolve() throws SolveException {
        Model m = Models.of("""
                coord z [m] from 0 to 1 [km]
                unknown P(z) [Pa]
                relation a: 2 [km]*P'(z) + P(z) = 0
                boundary ground: P(0) = 1 [atm]
                """);
        CaseProblem p = new CaseProblem(Formulation.of(m), Map.of(), NumericOptions.defaults(), Map.of());
        assertTrue(!p.system.compiledToBytecode());
        assertEquals(-101325 / 2000.0, p.system.derivatives(0, new double[]{101325})[0], 1e-12);
    }
}
