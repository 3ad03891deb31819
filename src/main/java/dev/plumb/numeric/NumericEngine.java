package dev.plumb.numeric;

import dev.plumb.lang.Diagnostic;
import dev.plumb.lang.Expr;
import dev.plumb.lang.ExprPrinter;
import dev.plumb.lang.Span;
import dev.plumb.lang.Stmt;
import dev.plumb.model.Check;
import dev.plumb.model.ConstantEvaluator;
import dev.plumb.model.FileUnits;
import dev.plumb.model.Model;
import dev.plumb.model.Status;
import dev.plumb.units.UnitCatalog;
import dev.plumb.units.UnitException;
import dev.plumb.units.UnitParser;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The numeric stage: integrates the relations of a checked model for every case (shooting for the
 * unknowns the boundaries fix) and sets each shown, claimed and expected quantity beside its
 * closed form.
 */
public final class NumericEngine {

    /** The label of the one implicit case of a file without free parameters. */
    public static final String IMPLICIT_CASE = dev.plumb.model.CaseValues.IMPLICIT;

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

    /**
     * A row of the comparison table: the quantity, the unit it is shown in (a {@code show}'s own, else the
     * file's unit for it) and the claimed value it is compared with when no closed form is derived.
     */
    private record Wanted(String key, Expr expr, dev.plumb.units.Unit shown, Expr claimed) { }

    /**
     * Solves every case of the model and compares. {@code closedForms} maps a quantity as printed by
     * ExprPrinter ("P(0)", "m(R)", "xi1") to its closed form in parameters and constants; may be empty.
     */
    public static NumericResult run(Model model, Map<String, Expr> closedForms, NumericOptions options) {
        return run(model, closedForms, options, what -> { });
    }

    /** As {@link #run(Model, Map, NumericOptions)}, telling {@code progress} which case or sweep is being solved. */
    public static NumericResult run(Model model, Map<String, Expr> closedForms, NumericOptions options,
                                    java.util.function.Consumer<String> progress) {
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
        FileUnits units = FileUnits.of(model);
        List<Wanted> wanted = wanted(model, units);
        for (dev.plumb.model.CaseValues c : all) {
            progress.accept(implicit(model) ? "solving" : "case " + c.label());
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
            for (Wanted w : wanted) rows.add(row(model, c, w, solution, tight, closedForms, notes, diagnostics));
            for (Stmt.Expect e : expects) checks.add(expect(model, units, c, e, solution, tight, closedForms, diagnostics));
            cases.add(new CaseResult(c.label(), solution.method(), rows, null));
        }
        List<Sequences.Result> sequences = Sequences.run(model, closedForms, options, checks, progress);
        return new NumericResult(cases, checks, notes, diagnostics, sequences);
    }

    /**
     * The rows of every case's table: one per {@code show} line (two shows of one quantity in two units are two
     * rows), then each claimed and expected quantity not shown already. A claim's right side goes to every row of
     * its quantity.
     */
    private static List<Wanted> wanted(Model model, FileUnits units) {
        List<Wanted> out = new ArrayList<>();
        for (Stmt.Show s : model.shows()) {
            dev.plumb.units.Unit unit = s.unit() == null ? units.forUnshown(s.expr()) : shownUnit(s.unit().text(), units, s.expr());
            out.add(new Wanted(ExprPrinter.print(s.expr()), s.expr(), unit, null));
        }
        for (Stmt.Claim c : model.claims()) {
            // A claim about a whole profile (P(z) = ...) has no single value in a case; the symbolic side checks it.
            if (dependsOnCoordinate(model, c.equation().lhs(), new java.util.HashSet<>())) continue;
            String key = ExprPrinter.print(c.equation().lhs());
            boolean found = false;
            for (int i = 0; i < out.size(); i++) {
                Wanted w = out.get(i);
                if (!w.key().equals(key)) continue;
                out.set(i, new Wanted(key, w.expr(), w.shown(), c.equation().rhs()));
                found = true;
            }
            if (!found) out.add(new Wanted(key, c.equation().lhs(), units.forQuantity(c.equation().lhs()), c.equation().rhs()));
        }
        for (Stmt.Expect e : model.caseExpects()) {
            String key = ExprPrinter.print(e.lhs());
            if (out.stream().noneMatch(w -> w.key().equals(key))) out.add(new Wanted(key, e.lhs(), units.forQuantity(e.lhs()), null));
        }
        return out;
    }

    /** The unit a show names, parsed; the file's unit for the quantity when it does not parse (the unit check said why). */
    private static dev.plumb.units.Unit shownUnit(String text, FileUnits units, Expr quantity) {
        try {
            return UnitParser.parse(text);
        } catch (UnitException ex) {
            return units.forQuantity(quantity);
        }
    }

    private static QuantityRow row(Model model, dev.plumb.model.CaseValues c, Wanted w, Solution solution,
                                   Solution tight, Map<String, Expr> closedForms, List<String> notes, List<Diagnostic> diagnostics) {
        String key = w.key();
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
        // A closed form of 0 has no relative difference unless the numeric value is 0 too (boxed
        // explicitly: a conditional mixing double and a null Double would unbox the null).
        Double rel = null;
        if (closed != null && closed != 0) rel = Math.abs(numeric - closed) / Math.abs(closed);
        else if (closed != null && numeric == 0) rel = 0.0;
        String unit = UnitCatalog.siName(model.dimensionOf(w.expr()));
        // A row in SI needs no second unit; any other (a show's, or the file's own) is named beside the SI values.
        boolean inSi = w.shown().factor() == 1.0 && (w.shown().text().equals(unit) || w.shown().dimension().isNone());
        return new QuantityRow(key, unit, closed, numeric, rel, error, inSi ? null : w.shown().text(), inSi ? 1.0 : w.shown().factor(),
                source);
    }

    /**
     * An expectation decided on the numeric value when ten times its estimated error cannot reach across
     * the tolerance's edge; otherwise on the derived closed form where there is one (a value far below the
     * profile's scale, such as a pressure e^-150 times the base one, is noise to the integrator but exact
     * in the closed form), else undecided. Without an error estimate, on the numeric value alone.
     */
    private static Check expect(Model model, FileUnits units, dev.plumb.model.CaseValues c, Stmt.Expect e, Solution solution,
                                Solution tight, Map<String, Expr> closedForms, List<Diagnostic> diagnostics) {
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
        // Echoed in the unit the expectation is written in (else the file's unit for the quantity), SI beside.
        dev.plumb.units.Unit shown = FileUnits.written(e.expected());
        if (shown == null || !shown.dimension().equals(model.dimensionOf(e.lhs()))) shown = units.forQuantity(e.lhs());
        double allowed;
        String tolText;
        if (e.tolerance().isRelative()) {
            allowed = e.tolerance().relative() * Math.abs(expected);
            tolText = String.format(Locale.ROOT, "%.3g relative", e.tolerance().relative());
        } else {
            Double abs = constant(model, e.tolerance().absolute(), c.values());
            allowed = abs == null ? Double.NaN : Math.abs(abs);
            dev.plumb.units.Unit tolUnit = FileUnits.written(e.tolerance().absolute());
            if (tolUnit == null || !tolUnit.dimension().equals(shown.dimension())) tolUnit = shown;
            tolText = FileUnits.format(allowed, tolUnit, "%.6g") + " absolute";
        }
        double error = Double.NaN;
        if (tight != null) {
            try {
                error = Math.abs(tight.evaluate(e.lhs()) - value);
            } catch (SolveException ignored) {
                // No estimate; the check is decided on the value alone.
            }
        }
        String where = ExprPrinter.print(e.lhs()) + (implicit(model) ? "" : " at " + c.label());
        double diff = Math.abs(value - expected);
        double rel = expected != 0 ? diff / Math.abs(expected) : diff;
        Status status;
        String message;
        // The estimate is the change under a tighter tolerance, not a bound: a margin of ten of them before the
        // value decides either way.
        double margin = ERROR_MARGIN * error;
        boolean unresolved = Double.isFinite(error) && diff + margin > allowed && diff - margin <= allowed;
        Expr derived = closedForms.get(ExprPrinter.print(e.lhs()));
        Double closed = unresolved && derived != null ? constant(model, derived, c.values()) : null;
        if (!unresolved) {
            status = diff <= allowed ? Status.HOLDS : Status.FAILS;
            message = String.format(Locale.ROOT, "%s: numeric %s, expected %s, relative difference %.3g (allowed %s)",
                    where, FileUnits.format(value, shown, "%.10g"), FileUnits.format(expected, shown, "%.10g"), rel, tolText);
        } else if (closed != null && Double.isFinite(closed)) {
            double closedDiff = Math.abs(closed - expected);
            double closedRel = expected != 0 ? closedDiff / Math.abs(expected) : closedDiff;
            status = closedDiff <= allowed ? Status.HOLDS : Status.FAILS;
            message = String.format(Locale.ROOT, "%s: closed form %s, expected %s, relative difference %.3g (allowed %s); decided on the"
                            + " derived closed form, since the numeric value %s has an estimated error of %s, too large to decide this tolerance",
                    where, FileUnits.format(closed, shown, "%.10g"), FileUnits.format(expected, shown, "%.10g"), closedRel, tolText,
                    FileUnits.format(value, shown, "%.6g"), FileUnits.format(error, shown, "%.2g"));
        } else {
            status = Status.UNDECIDED;
            message = String.format(Locale.ROOT, "%s: numeric %s with an estimated error of %s, expected %s (allowed %s): the error"
                            + " reaches across the tolerance's edge, so the integration cannot decide this; there is no closed form to decide it",
                    where, FileUnits.format(value, shown, "%.10g"), FileUnits.format(error, shown, "%.2g"),
                    FileUnits.format(expected, shown, "%.10g"), tolText);
        }
        Check check = Check.of("expect", label, e.span(), status, message)
                .with("case", c.label()).with("numeric", value).with("expected", expected).with("rel_diff", rel).with("unit", unit);
        if (!shown.dimension().isNone() && !shown.text().equals(unit)) {
            check = check.with("shown_unit", shown.text()).with("shown_numeric", value / shown.factor())
                    .with("shown_expected", expected / shown.factor());
        }
        if (Double.isFinite(error)) check = check.with("error_estimate", error);
        if (closed != null && Double.isFinite(closed)) check = check.with("closed_form", closed);
        return check;
    }

    /** How many error estimates must separate a numeric value from a tolerance's edge before it decides an expectation. */
    static final double ERROR_MARGIN = 10;

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
