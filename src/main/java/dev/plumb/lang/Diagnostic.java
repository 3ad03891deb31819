package dev.plumb.lang;

import java.util.List;

/**
 * One message about the input, anchored at a span; {@code details} are extra lines printed under
 * the quoted source (a table of units, a hint). An error is either about input that could not be
 * understood (syntax, an unknown name or unit) or, when {@code checkFailure} is set, a check that
 * fails on well-formed input (two sides with different units).
 */
public record Diagnostic(Severity severity, Span span, String message, List<String> details, boolean checkFailure) {

    public Diagnostic {
        details = List.copyOf(details);
    }

    public static Diagnostic error(Span span, String message, String... details) {
        return new Diagnostic(Severity.ERROR, span, message, List.of(details), false);
    }

    public static Diagnostic failure(Span span, String message, String... details) {
        return new Diagnostic(Severity.ERROR, span, message, List.of(details), true);
    }

    public static Diagnostic warning(Span span, String message, String... details) {
        return new Diagnostic(Severity.WARNING, span, message, List.of(details), false);
    }

    public static Diagnostic note(Span span, String message, String... details) {
        return new Diagnostic(Severity.NOTE, span, message, List.of(details), false);
    }

    /** An error about input that could not be understood, as opposed to a failing check. */
    public boolean isInputError() {
        return severity == Severity.ERROR && !checkFailure;
    }
}
