package dev.plumb.model;

import dev.plumb.lang.Span;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * The outcome of one check on one statement: its kind ("units", "step", "claim", "scaling",
 * "expect", "boundary", "relation"), the statement's label, where it is, the verdict and a
 * sentence saying why. {@code factor} names a constant factor that explains a failure, and
 * {@code extra} carries kind-specific fields (exponents of a scaling check, for example).
 */
public record Check(String kind, String label, Span span, Status status, String message, String factor,
                    Map<String, Object> extra) {

    public Check {
        // In insertion order, so the JSON's keys come out the same on every run (Map.copyOf's order varies).
        extra = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(extra));
    }

    public static Check of(String kind, String label, Span span, Status status, String message) {
        return new Check(kind, label, span, status, message, null, Map.of());
    }

    public Check withFactor(String f) {
        return new Check(kind, label, span, status, message, f, extra);
    }

    public Check with(String key, Object value) {
        Map<String, Object> m = new LinkedHashMap<>(extra);
        m.put(key, value);
        return new Check(kind, label, span, status, message, factor, m);
    }
}
