package dev.plumb.numeric;

import dev.plumb.lang.Span;

/** A numeric solve that could not be done: the message says what was tried, {@link #span()} where. */
public final class SolveException extends Exception {
    private final transient Span span;
    private final boolean request;

    public SolveException(Span span, String message) {
        this(span, message, false);
    }

    /**
     * @param request whether the file asked for something no solve can give (a value past the end of
     *                the interval): an error in the input rather than a solve that failed
     */
    public SolveException(Span span, String message, boolean request) {
        super(message, null, false, false);
        this.span = span == null ? Span.NONE : span;
        this.request = request;
    }

    /** Whether the file asked for something no solve can give, such as a point outside the interval. */
    public boolean isRequest() {
        return request;
    }

    /** The place in the file the failure is about ({@link Span#NONE} when it concerns the whole file). */
    public Span span() {
        return span;
    }
}
