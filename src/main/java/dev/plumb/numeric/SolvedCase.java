package dev.plumb.numeric;

import dev.plumb.lang.Expr;

/** A case solved by {@link Shooting}: evaluates expressions on its trajectory (one thread at a time). */
final class SolvedCase implements Solution {

    private final CaseProblem problem;
    private final Trajectory trajectory;
    private final double[] unknowns;
    private final Shooting.Result result;
    private String method;

    SolvedCase(CaseProblem problem, Shooting.Result result) {
        this.problem = problem;
        this.trajectory = result.trajectory();
        this.unknowns = result.z().clone();
        this.result = result;
    }

    /** The case solved again at other options, from this solution's unknowns and with its boundaries read the same way. */
    SolvedCase again(NumericOptions options) throws SolveException {
        CaseProblem p = new CaseProblem(problem.form, problem.values, options, problem.closedForms, problem.surfaceEvents, unknowns);
        return new SolvedCase(p, Shooting.solve(p));
    }

    /** The shooting unknowns of the solution (log or scaled coordinates), for a neighbouring solve to start from. */
    double[] unknowns() {
        return unknowns.clone();
    }

    @Override
    public synchronized double evaluate(Expr quantity) throws SolveException {
        return new PointEvaluator(problem.form, problem.values, trajectory).evaluate(quantity);
    }

    @Override
    public synchronized String method() {
        // Formatted on demand: a sweep asks for thousands of solutions and none of their descriptions.
        if (method == null) method = describe(problem, result);
        return method;
    }

    @Override
    public java.util.Map<String, double[]> lowest() {
        java.util.Map<String, double[]> out = new java.util.LinkedHashMap<>();
        if (trajectory.lowest == null) return out;
        for (int j = 0; j < problem.form.profiles.size(); j++) {
            int i = problem.form.base[j];
            double[] start = trajectory.states.firstEntry().getValue();
            out.put(problem.form.profiles.get(j).name(), new double[]{trajectory.lowest[i], trajectory.lowestAt[i],
                    Math.max(Math.abs(start[i]), problem.scale[i])});
        }
        return out;
    }

    private static String describe(CaseProblem p, Shooting.Result r) {
        StringBuilder sb = new StringBuilder(Integration.METHOD);
        sb.append(String.format(", rtol %.0e, atol %.0e of each component's scale", p.options.relTol(), p.options.absTolScale()));
        sb.append("; ").append(r.trajectory().startNote());
        if (p.integration.breaks.length > 0) {
            sb.append("; restarted at ").append(p.integration.breaks.length).append(" break(s) of a piecewise relation (")
                    .append(p.form.coordinate.name()).append(" = ");
            for (int i = 0; i < p.integration.breaks.length; i++) {
                if (i > 0) sb.append(", ");
                sb.append(p.form.position(p.integration.breaks[i], "%.9g"));
            }
            sb.append(")");
        }
        if (p.surface != null) {
            sb.append("; surface ").append(p.surface.description()).append(" = ")
                    .append(p.form.componentValue(p.surface.index(), p.surface.value(), dev.plumb.model.FileUnits.SHORT))
                    .append(" found at ").append(p.form.coordinate.name()).append(" = ")
                    .append(p.form.position(r.trajectory().surfaceX, "%.12g"))
                    .append(r.trajectory().surfaceByApproach
                            ? " (the relations are undefined past it, so it was approached until the step size reached "
                            + p.form.position(p.integration.minStep, "%.0e") + ")"
                            : !Double.isNaN(r.trajectory().surfaceExponent) ? String.format(" (the last stretch integrated in w = |%s - %s|^(1/p), "
                            + "which reaches it linearly; p = %.6g from the relations)", p.surface.description(),
                            p.form.componentValue(p.surface.index(), p.surface.value(), dev.plumb.model.FileUnits.SHORT),
                            r.trajectory().surfaceExponent)
                            : " by event detection");
        }
        if (!p.unknowns.isEmpty()) {
            sb.append("; shooting on ").append(Shooting.names(p)).append(": ").append(r.iterations())
                    .append(" damped Newton step(s), mismatch ").append(String.format("%.1e", r.mismatch()));
        }
        return sb.toString();
    }
}
