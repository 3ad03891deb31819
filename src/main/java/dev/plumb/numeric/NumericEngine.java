package dev.plumb.numeric;

import dev.plumb.lang.Diagnostic;
import dev.plumb.lang.Expr;
import dev.plumb.lang.ExprPrinter;
import dev.plumb.lang.Span;
import dev.plumb.lang.Stmt;
import dev.plumb.model.Check;
import dev.plumb.model.ConstantEvaluator;
import dev.plumb.model.Model;
import dev.plumb.model.Status;
import dev.plumb.units.UnitCatalog;
import dev.plumb.units.UnitException;
import dev.plumb.units.UnitParser;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The numeric stage: integrates the relations of a checked model for every case (shooting for the
 * unknowns the boundaries fix) and sets each shown, claimed and expected quantity beside its
 * closed form.
 */
public final class NumericEngine {

    /** The label of the one implicit case of a file without free parameters. */
    public static final String IMPLICIT_CASE = "fixed";

    private NumericEngine() {
    }

    /**
     * Solves one case given explicit SI parameter values. The map gives every free parameter and may
     * override fixed ones (for sweeps).
     */
    public static Solution solve(Model model, Map<String, Double> parameterValues, NumericOptions options) throws SolveException {
        return solve(model, parameterValues, options, Map.of());
    }

    static Solution solve(Model model, Map<String, Double> parameterValues, NumericOptions options, Map<String, Expr> closedForms)
            throws SolveException {
        return solve(model, parameterValues, options, closedForms, null);
    }

    /**
     * @param start the shooting unknowns to start from (a neighbouring solve's, in a sweep), or null for the
     *              closed-form and dimensional guesses
     */
    static Solution solve(Model model, Map<String, Double> parameterValues, NumericOptions options, Map<String, Expr> closedForms,
                          double[] start) throws SolveException {
        if (model.hasErrors()) throw new SolveException(Span.NONE, "the file has errors; it is not integrated");
        if (model.profiles().isEmpty() && model.unknownConstants().isEmpty()) return new Algebraic(model, parameterValues);
        Formulation form = formulation(model);
        CaseProblem problem = new CaseProblem(form, parameterValues, options, closedForms, true, start);
        try {
            return new SolvedCase(problem, Shooting.solve(problem));
        } catch (SolveException byEvent) {
            if (!problem.fixedSurface) throw byEvent;
            // The surface was sought as an event near the fixed end; a zero the profile only touches there
            // is not an event, so the same boundary is tried as a plain condition at the end.
            CaseProblem plain = new CaseProblem(form, parameterValues, options, closedForms, false, start);
            try {
                return new SolvedCase(plain, Shooting.solve(plain));
            } catch (SolveException alsoPlain) {
                // The plain condition's failure says which boundaries are missed; the surface event's is the first try.
                throw new SolveException(alsoPlain.span(), alsoPlain.getMessage() + " (" + CaseProblem.describe(problem.surfaceBoundary)
                        + " taken as a condition at the end; sought as a surface instead, it failed too)");
            }
        }
    }

    /** The formulation last worked out, with its model: it depends on the model alone, so a sweep works it out once. */
    private record LastFormulation(Model model, Formulation form) { }

    private static volatile LastFormulation last;

    private static Formulation formulation(Model model) throws SolveException {
        LastFormulation known = last;
        // By identity: a model is an immutable record whose structural hash would cost more than the formulation.
        if (known != null && known.model() == model) return known.form();
        Formulation form = Formulation.of(model);
        last = new LastFormulation(model, form);
        return form;
    }

    /**
     * The same case solved again at other options, starting from a solved case's unknowns and treating
     * its boundaries the same way (for an error estimate at a tighter tolerance).
     */
    static Solution resolve(Solution first, NumericOptions options) throws SolveException {
        if (first instanceof SolvedCase sc) return sc.again(options);
        return first;
    }

    /** A file with no unknown: every quantity is a formula in the parameters, evaluated directly. */
    private record Algebraic(Model model, Map<String, Double> values) implements Solution {
        @Override
        public double evaluate(Expr quantity) throws SolveException {
            try {
                return new ConstantEvaluator(n -> model.symbols().get(n), values).evaluate(quantity);
            } catch (ConstantEvaluator.NotConstant e) {
                throw new SolveException(e.where.span(), e.getMessage());
            }
        }

        @Override
        public String method() {
            return "no unknowns: evaluated directly from the parameters";
        }
    }

    /** A quantity of the comparison table with the statement it comes from. */
    private record Wanted(Expr expr, String shownUnit, Expr claimed) { }

    /**
     * Solves every case of the model and compares. {@code closedForms} maps a quantity as printed by
     * ExprPrinter ("P(0)", "m(R)", "xi1") to its closed form in parameters and constants; may be empty.
     */
    public static NumericResult run(Model model, Map<String, Expr> closedForms, NumericOptions options) {
        List<CaseResult> cases = new ArrayList<>();
        List<Check> checks = new ArrayList<>();
        List<String> notes = new ArrayList<>();
        List<Diagnostic> diagnostics = new ArrayList<>();
        if (model.hasErrors()) {
            notes.add("the file has errors; nothing was integrated");
            return new NumericResult(cases, checks, notes, diagnostics);
        }
        List<dev.plumb.model.CaseValues> all = new ArrayList<>(model.cases());
        if (all.isEmpty() && model.freeParams().isEmpty()) {
            all.add(new dev.plumb.model.CaseValues(IMPLICIT_CASE, Span.NONE, Map.of(), Map.of()));
        } else if (all.isEmpty() && model.sweeps().isEmpty()) {
            notes.add("no case gives values to the free parameters, so nothing was integrated; add e.g. case sun: "
                    + model.freeParams().get(0).name() + " = ...");
        }
        Map<String, Wanted> wanted = wanted(model);
        for (dev.plumb.model.CaseValues c : all) {
            List<Stmt.Expect> expects = model.caseExpects().stream()
                    .filter(e -> e.caseName() == null ? c.label().equals(IMPLICIT_CASE) || model.cases().size() <= 1
                            : e.caseName().equals(c.label())).toList();
            Solution solution;
            try {
                solution = solve(model, c.values(), options, closedForms);
            } catch (SolveException ex) {
                String failure = where(model, ex.span()) + ex.getMessage();
                cases.add(new CaseResult(c.label(), null, List.of(), failure));
                // An unsolved case is a failing check, so the summary's counts agree with the exit status.
                checks.add(Check.of("case", c.label(), ex.span(), Status.FAILS, (implicit(model) ? "the relations" : "case '"
                        + c.label() + "'") + " could not be solved numerically: " + ex.getMessage()));
                for (Stmt.Expect e : expects) {
                    checks.add(Check.of("expect", label(e), e.span(), Status.FAILS, (implicit(model) ? "the relations"
                            : "case '" + c.label() + "'") + " could not be solved numerically: " + ex.getMessage()));
                }
                continue;
            }
            Solution tight = null;
            if (options.errorEstimate()) {
                try {
                    tight = resolve(solution, options.tighter());
                } catch (SolveException ex) {
                    notes.add(prefix(model, c.label()) + "the second solve at a tighter tolerance failed, so no error estimate: "
                            + ex.getMessage());
                }
            }
            Signs.check(model, c.label(), implicit(model), solution, diagnostics);
            List<QuantityRow> rows = new ArrayList<>();
            for (Map.Entry<String, Wanted> w : wanted.entrySet()) {
                rows.add(row(model, c, w.getKey(), w.getValue(), solution, tight, closedForms, notes, diagnostics));
            }
            for (Stmt.Expect e : expects) checks.add(expect(model, c, e, solution, tight, diagnostics));
            cases.add(new CaseResult(c.label(), solution.method(), rows, null));
        }
        List<Sequences.Result> sequences = Sequences.run(model, closedForms, options, checks);
        return new NumericResult(cases, checks, notes, diagnostics, sequences);
    }

    private static Map<String, Wanted> wanted(Model model) {
        Map<String, Wanted> out = new LinkedHashMap<>();
        for (Stmt.Show s : model.shows()) out.putIfAbsent(ExprPrinter.print(s.expr()), new Wanted(s.expr(), s.unit() == null ? null : s.unit().text(), null));
        for (Stmt.Claim c : model.claims()) {
            // A claim about a whole profile (P(z) = ...) has no single value in a case; the symbolic side checks it.
            if (dependsOnCoordinate(model, c.equation().lhs(), new java.util.HashSet<>())) continue;
            String key = ExprPrinter.print(c.equation().lhs());
            Wanted old = out.get(key);
            out.put(key, new Wanted(old == null ? c.equation().lhs() : old.expr(), old == null ? null : old.shownUnit(), c.equation().rhs()));
        }
        for (Stmt.Expect e : model.caseExpects()) out.putIfAbsent(ExprPrinter.print(e.lhs()), new Wanted(e.lhs(), null, null));
        return out;
    }

    private static QuantityRow row(Model model, dev.plumb.model.CaseValues c, String key, Wanted w, Solution solution,
                                   Solution tight, Map<String, Expr> closedForms, List<String> notes, List<Diagnostic> diagnostics) {
        double numeric;
        try {
            numeric = solution.evaluate(w.expr());
        } catch (SolveException ex) {
            if (ex.isRequest()) {
                request(diagnostics, ex, prefix(model, c.label()));
            } else {
                notes.add(prefix(model, c.label()) + key + " could not be evaluated: " + where(model, ex.span()) + ex.getMessage());
            }
            numeric = Double.NaN;
        }
        double error = Double.NaN;
        if (tight != null && Double.isFinite(numeric)) {
            try {
                error = Math.abs(tight.evaluate(w.expr()) - numeric);
            } catch (SolveException ignored) {
                // The first solve evaluated it; a failure here only means no estimate.
            }
        }
        Double closed = null;
        String source = null;
        Expr derived = closedForms.get(key);
        if (derived != null) {
            closed = constant(model, derived, c.values());
            source = "derived";
        } else if (w.claimed() != null) {
            closed = constant(model, w.claimed(), c.values());
            source = "claim";
        }
        if (closed != null && closed.isNaN()) {
            closed = null;
            source = null;
        }
        // Boxed on every branch: a mixed double/Double conditional unboxes its null (a closed form of 0, numeric not 0).
        Double rel = closed == null ? null : closed != 0 ? Double.valueOf(Math.abs(numeric - closed) / Math.abs(closed))
                : numeric == 0 ? Double.valueOf(0.0) : null;
        String unit = UnitCatalog.siName(model.dimensionOf(w.expr()));
        double factor = 1.0;
        if (w.shownUnit() != null) {
            try {
                factor = UnitParser.parse(w.shownUnit()).factor();
            } catch (UnitException ex) {
                notes.add("cannot show " + key + " in [" + w.shownUnit() + "]: " + ex.getMessage());
            }
        }
        return new QuantityRow(key, unit, closed, numeric, rel, error, w.shownUnit(), factor, source);
    }

    private static Check expect(Model model, dev.plumb.model.CaseValues c, Stmt.Expect e, Solution solution, Solution tight,
                                List<Diagnostic> diagnostics) {
        String label = label(e);
        double value;
        try {
            value = solution.evaluate(e.lhs());
        } catch (SolveException ex) {
            if (ex.isRequest()) request(diagnostics, ex, prefix(model, c.label()));
            return Check.of("expect", label, e.span(), Status.FAILS, ExprPrinter.print(e.lhs()) + " could not be evaluated"
                    + (implicit(model) ? "" : " in case '" + c.label() + "'") + ": " + ex.getMessage());
        }
        Double expected = constant(model, e.expected(), c.values());
        if (expected == null || expected.isNaN()) {
            return Check.of("expect", label, e.span(), Status.FAILS, "the expected value is not a fixed number");
        }
        String unit = UnitCatalog.siName(model.dimensionOf(e.lhs()));
        double allowed;
        String tolText;
        if (e.tolerance().isRelative()) {
            allowed = e.tolerance().relative() * Math.abs(expected);
            tolText = String.format("%.3g relative", e.tolerance().relative());
        } else {
            Double abs = constant(model, e.tolerance().absolute(), c.values());
            allowed = abs == null ? Double.NaN : Math.abs(abs);
            tolText = unit.equals("1") ? String.format("%.6g", allowed) + " absolute" : withUnit(String.format("%.6g", allowed), unit);
        }
        double diff = Math.abs(value - expected);
        double rel = expected != 0 ? diff / Math.abs(expected) : diff;
        Status status = diff <= allowed ? Status.HOLDS : Status.FAILS;
        String message = String.format("%s%s: numeric %s, expected %s, relative difference %.3g (allowed %s)",
                ExprPrinter.print(e.lhs()), implicit(model) ? "" : " at " + c.label(), withUnit(String.format("%.10g", value), unit),
                withUnit(String.format("%.10g", expected), unit), rel, tolText);
        Check check = Check.of("expect", label, e.span(), status, message)
                .with("case", c.label()).with("numeric", value).with("expected", expected).with("rel_diff", rel).with("unit", unit);
        if (tight != null) {
            try {
                check = check.with("error_estimate", Math.abs(tight.evaluate(e.lhs()) - value));
            } catch (SolveException ignored) {
                // No estimate; the check itself stands.
            }
        }
        return check;
    }

    /** A request no solve can honour, reported once per place. */
    private static void request(List<Diagnostic> diagnostics, SolveException ex, String casePrefix) {
        for (Diagnostic d : diagnostics) if (d.span().equals(ex.span()) && d.severity() == dev.plumb.lang.Severity.ERROR) return;
        diagnostics.add(Diagnostic.error(ex.span(), casePrefix + ex.getMessage()));
    }

    /** Whether {@code e} names the coordinate freely (not only inside a definition's own parameters). */
    static boolean dependsOnCoordinate(Model model, Expr e, java.util.Set<String> visiting) {
        if (model.coordinate().isEmpty()) return false;
        String x = model.coordinate().get().name();
        for (String name : dev.plumb.model.References.names(e)) {
            if (name.equals(x)) return true;
            if (model.symbols().get(name) instanceof dev.plumb.model.Symbol.Definition d && d.params().isEmpty() && visiting.add(name)
                    && dependsOnCoordinate(model, d.body(), visiting)) {
                return true;
            }
        }
        return false;
    }

    /** Whether the model's only case is the implicit one of a file without free parameters (its label is not the user's). */
    private static boolean implicit(Model model) {
        return model.cases().isEmpty();
    }

    /** How a note about one case begins: nothing for the implicit case, else the case's label. */
    private static String prefix(Model model, String label) {
        return implicit(model) ? "" : "case '" + label + "': ";
    }

    /** A number with its SI unit; a pure number goes without the "1". */
    private static String withUnit(String number, String unit) {
        return unit == null || unit.isEmpty() || unit.equals("1") ? number : number + " " + unit;
    }

    private static String label(Stmt.Expect e) {
        return e.label().present() ? e.label().name() : "line " + e.span().line();
    }

    private static Double constant(Model model, Expr e, Map<String, Double> values) {
        try {
            return new ConstantEvaluator(n -> model.symbols().get(n), values).evaluate(e);
        } catch (ConstantEvaluator.NotConstant ex) {
            return Double.NaN;
        }
    }

    private static String where(Model model, Span span) {
        if (span == null || span.line() < 1) return model.source().path() + ": ";
        return model.source().path() + ":" + span.line() + ":" + span.column() + ": ";
    }
}
