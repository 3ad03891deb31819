package dev.plumb.numeric;

import java.util.List;

/** The numeric results of one case: its comparison rows, or the reason it could not be solved. */
public record CaseResult(String label, String method, List<QuantityRow> quantities, String failure) {
    public CaseResult {
        quantities = List.copyOf(quantities);
    }

    public boolean solved() {
        return failure == null;
    }
}
