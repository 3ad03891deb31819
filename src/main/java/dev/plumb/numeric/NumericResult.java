package dev.plumb.numeric;

import dev.plumb.lang.Diagnostic;
import dev.plumb.model.Check;
import java.util.List;

/**
 * Everything the numeric engine found for a file: one result per case, the expect checks, notes,
 * and located diagnostics (a request no solve can honour, a profile of the wrong sign).
 */
public record NumericResult(List<CaseResult> cases, List<Check> checks, List<String> notes, List<Diagnostic> diagnostics,
                            List<Sequences.Result> sequences) {
    public NumericResult {
        sequences = List.copyOf(sequences);
        cases = List.copyOf(cases);
        checks = List.copyOf(checks);
        notes = List.copyOf(notes);
        diagnostics = List.copyOf(diagnostics);
    }

    public NumericResult(List<CaseResult> cases, List<Check> checks, List<String> notes) {
        this(cases, checks, notes, List.of(), List.of());
    }

    public NumericResult(List<CaseResult> cases, List<Check> checks, List<String> notes, List<Diagnostic> diagnostics) {
        this(cases, checks, notes, diagnostics, List.of());
    }
}
