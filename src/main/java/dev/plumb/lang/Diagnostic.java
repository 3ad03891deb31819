package dev.plumb.lang;

import java.util.List;

/**
 * One message about the input, anchored at a span; {@code details} are extra lines printed under
 * the quoted source (a table of units, a hint).
 */
public record Diagnostic(Severity severity, Span span, String message, List<String> details) {

    public Diagnostic {
        details = List.copyOf(details);
    }

    public static Diagnostic error(Span span, String message, String... details) {
        return new Diagnostic(Severity.ERROR, span, message, List.of(details));
    }

    public static Diagnostic warning(Span span, String message, String... details) {
        return new Diagnostic(Severity.WARNING, span, message, List.of(details));
    }

    public static Diagnostic note(Span span, String message, String... details) {
        return new Diagnostic(Severity.NOTE, span, message, List.of(details));
    }
}
