package dev.plumb.report;

import dev.plumb.lang.Diagnostic;
import dev.plumb.lang.SourceFile;
import dev.plumb.model.Check;
import dev.plumb.model.Model;
import dev.plumb.model.Status;
import java.util.List;

/**
 * Everything one run found out about one file, ready to be written as text, JSON or a report:
 * diagnostics, checks, derived closed forms and the per-case comparison tables.
 *
 * @param model null when the file could not be parsed far enough to build one
 */
public record Analysis(SourceFile source, Model model, List<Diagnostic> diagnostics, List<Check> checks,
                       List<DerivedForm> derived, List<CaseTable> cases, List<String> notes) {

    public Analysis {
        diagnostics = List.copyOf(diagnostics);
        checks = List.copyOf(checks);
        derived = List.copyOf(derived);
        cases = List.copyOf(cases);
        notes = List.copyOf(notes);
    }

    /** A closed form the symbolic engine derived, with the trail of transformations that led to it. */
    public record DerivedForm(String expr, String closedForm, String unit, List<TrailEntry> trail) {
        public DerivedForm {
            trail = List.copyOf(trail);
        }
    }

    public record TrailEntry(String action, String result) { }

    /** One concrete body: how it was solved, and each quantity closed-form beside numeric. */
    public record CaseTable(String label, String method, String failure, List<Row> rows) {
        public CaseTable {
            rows = List.copyOf(rows);
        }
    }

    /**
     * One quantity of a case, in SI base units; {@code shownUnit}/{@code shownFactor} give the
     * unit the file asked to show it in (SI per shown unit).
     */
    public record Row(String expr, String unit, Double closedForm, Double numeric, Double relDiff, Double errorEstimate,
                      String shownUnit, double shownFactor) { }

    public boolean hasInputErrors() {
        return diagnostics.stream().anyMatch(Diagnostic::isInputError);
    }

    public long count(Status s) {
        return checks.stream().filter(c -> c.status() == s).count();
    }

    /** Whether every check holds (undecided ones count against only when {@code strict}). */
    public boolean ok(boolean strict) {
        return !hasInputErrors() && count(Status.FAILS) == 0 && (!strict || count(Status.UNDECIDED) == 0)
                && cases.stream().allMatch(c -> c.failure() == null);
    }

    /** Exit status: 0 all hold, 1 a check fails, 2 the input could not be understood. */
    public int exitStatus(boolean strict) {
        if (hasInputErrors()) return 2;
        return ok(strict) ? 0 : 1;
    }
}
