package dev.plumb.model;

import dev.plumb.lang.Span;
import java.util.Map;

/**
 * A concrete body: a value in SI base units for every free parameter, and a standard
 * uncertainty (also SI) for those given with {@code +-}.
 */
public record CaseValues(String label, Span span, Map<String, Double> values, Map<String, Double> uncertainties) {
    /**
     * The name of the one case of a file without free parameters (and without cases of its own);
     * {@code expect ... at fixed} may name it, or leave {@code at} out.
     */
    public static final String IMPLICIT = "fixed";

    public CaseValues {
        values = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(values));
        uncertainties = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(uncertainties));
    }
}
