package dev.plumb.numeric;

import dev.plumb.model.Model;
import java.util.List;
import java.util.Map;

/**
 * The relations of a model compiled for one set of SI parameter values: the right-hand side
 * y' = f(x, y) the integrator calls, exposed for benchmarks and for callers that integrate
 * themselves. State components are the profiles and their lower derivatives in declaration order
 * ({@link #components()}); not thread-safe.
 */
public final class CompiledRelations {

    private final CaseProblem problem;

    private CompiledRelations(CaseProblem problem) {
        this.problem = problem;
    }

    public static CompiledRelations of(Model model, Map<String, Double> parameterValues) throws SolveException {
        return new CompiledRelations(new CaseProblem(Formulation.of(model), parameterValues, NumericOptions.defaults(), Map.of()));
    }

    /** Names of the state components: "P", "m", "theta", "theta'"... */
    public List<String> components() {
        return problem.system.componentNames();
    }

    /** Sets the unknown constants (SI, in declaration order) the relations read. */
    public void setConstants(double... values) {
        problem.load(values);
    }

    /** The derivatives of the state {@code y} at coordinate {@code x} (SI), written into {@code yDot}. */
    public void derivatives(double x, double[] y, double[] yDot) {
        problem.system.computeDerivatives(x, y, yDot);
    }
}
