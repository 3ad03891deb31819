package dev.plumb.numeric;

import dev.plumb.model.Check;
import java.util.List;

/** Everything the numeric engine found for a file: one result per case, the expect checks, notes. */
public record NumericResult(List<CaseResult> cases, List<Check> checks, List<String> notes) {
    public NumericResult {
        cases = List.copyOf(cases);
        checks = List.copyOf(checks);
        notes = List.copyOf(notes);
    }
}
