package dev.plumb.numeric;

import dev.plumb.lang.Span;

/** A numeric solve that could not be done: the message says what was tried, {@link #span()} where. */
public final class SolveException extends Exception {
    private final transient Span span;

    public SolveException(Span span, String message) {
        super(message, null, false, false);
        this.span = span == null ? Span.NONE : span;
    }

    /** The place in the file the failure is about ({@link Span#NONE} when it concerns the whole file). */
    public Span span() {
        return span;
    }
}
