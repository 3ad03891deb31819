package dev.plumb.report;

import dev.plumb.lang.Diagnostic;
import dev.plumb.lang.Expr;
import dev.plumb.lang.SourceFile;
import dev.plumb.model.Check;
import dev.plumb.model.Model;
import dev.plumb.model.Status;
import java.util.List;
import java.util.Map;

/**
 * Everything one run found out about one file, ready to be written as text, JSON or a report:
 * diagnostics, checks, derived closed forms and the per-case comparison tables.
 *
 * @param model null when the file could not be parsed far enough to build one
 */
public record Analysis(SourceFile source, Model model, List<Diagnostic> diagnostics, List<Check> checks,
                       List<DerivedForm> derived, List<CaseTable> cases, List<String> scales, List<String> notes,
                       List<dev.plumb.numeric.Sequences.Result> sweeps) {

    public Analysis(SourceFile source, Model model, List<Diagnostic> diagnostics, List<Check> checks,
                    List<DerivedForm> derived, List<CaseTable> cases, List<String> scales, List<String> notes) {
        this(source, model, diagnostics, checks, derived, cases, scales, notes, List.of());
    }

    public Analysis {
        sweeps = List.copyOf(sweeps);
        diagnostics = List.copyOf(diagnostics);
        checks = List.copyOf(checks);
        derived = List.copyOf(derived);
        cases = List.copyOf(cases);
        scales = List.copyOf(scales);
        notes = List.copyOf(notes);
    }

    /**
     * A closed form the symbolic engine derived, with the trail of transformations that led to it;
     * {@code form} is the same closed form as a syntax tree (for typesetting), or null.
     */
    public record DerivedForm(String expr, String closedForm, String unit, Expr form, List<TrailEntry> trail) {
        public DerivedForm {
            trail = List.copyOf(trail);
        }
    }

    public record TrailEntry(String action, String result) { }

    /** One concrete body: how it was solved, each quantity closed-form beside numeric, and sampled profiles. */
    public record CaseTable(String label, String method, String failure, List<Row> rows, List<ProfileSample> profiles) {
        public CaseTable {
            rows = List.copyOf(rows);
            profiles = List.copyOf(profiles);
        }
    }

    /**
     * One quantity of a case, in SI base units; {@code shownUnit}/{@code shownFactor} give the
     * unit the file asked to show it in (SI per shown unit). {@code sensitivities} are
     * ∂ln Q/∂ln p for each free parameter; {@code uncertainty} is null when no case value has one.
     */
    public record Row(String expr, String unit, Double closedForm, Double numeric, Double relDiff, Double errorEstimate,
                      String shownUnit, double shownFactor, Map<String, Double> sensitivities, Uncertainty uncertainty) {
        public Row {
            sensitivities = sensitivities == null ? Map.of() : java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(sensitivities));
        }
    }

    /** A propagated standard uncertainty (SI): first order from the sensitivities, and Monte Carlo. */
    public record Uncertainty(double firstOrder, double monteCarlo, double samplingError, int samples, long seed) { }

    /**
     * A profile sampled across the interval for plotting, in the file's units ({@code coordinateUnit} the
     * coordinate's declared unit, {@code unit} the profile's); {@code closedForm} may be null.
     */
    public record ProfileSample(String profile, String coordinate, String coordinateUnit, String unit, double[] x,
                                double[] numeric, double[] closedForm) { }

    public boolean hasInputErrors() {
        return diagnostics.stream().anyMatch(Diagnostic::isInputError);
    }

    public long count(Status s) {
        return checks.stream().filter(c -> c.status() == s).count();
    }

    /** Errors reported as diagnostics (a unit error inside an expression that no check counts, for one). */
    public long errorCount() {
        return diagnostics.stream().filter(d -> d.severity() == dev.plumb.lang.Severity.ERROR).count();
    }

    /**
     * Whether every check holds (undecided ones count against only when {@code strict}): no failing
     * check, no unsolved case (each is a failing check of kind "case") and no error printed.
     */
    public boolean ok(boolean strict) {
        return errorCount() == 0 && count(Status.FAILS) == 0 && (!strict || count(Status.UNDECIDED) == 0)
                && cases.stream().allMatch(c -> c.failure() == null);
    }

    /** Exit status: 0 all hold, 1 a check fails, 2 the input could not be understood. */
    public int exitStatus(boolean strict) {
        if (hasInputErrors()) return 2;
        return ok(strict) ? 0 : 1;
    }
}
