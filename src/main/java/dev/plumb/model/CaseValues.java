package dev.plumb.model;

import dev.plumb.lang.Span;
import java.util.Map;

/**
 * A concrete body: a value in SI base units for every free parameter, and a standard
 * uncertainty (also SI) for those given with {@code +-}.
 */
public record CaseValues(String label, Span span, Map<String, Double> values, Map<String, Double> uncertainties) {
    public CaseValues {
        values = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(values));
        uncertainties = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(uncertainties));
    }
}
