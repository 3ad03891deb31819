package dev.plumb.lang;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

/** An append-only collection of diagnostics gathered by one stage. */
public final class Diagnostics {
    private final List<Diagnostic> items = new ArrayList<>();

    public void add(Diagnostic d) {
        items.add(d);
    }

    public void error(Span span, String message, String... details) {
        add(Diagnostic.error(span, message, details));
    }

    /** An error that records a failing check on well-formed input. */
    public void failure(Span span, String message, String... details) {
        add(Diagnostic.failure(span, message, details));
    }

    public boolean hasInputErrors() {
        return items.stream().anyMatch(Diagnostic::isInputError);
    }

    public void warning(Span span, String message, String... details) {
        add(Diagnostic.warning(span, message, details));
    }

    public void note(Span span, String message, String... details) {
        add(Diagnostic.note(span, message, details));
    }

    public int errorCount() {
        return (int) items.stream().filter(d -> d.severity() == Severity.ERROR).count();
    }

    public boolean hasErrors() {
        return items.stream().anyMatch(d -> d.severity() == Severity.ERROR);
    }

    /** The diagnostics in source order. */
    public List<Diagnostic> sorted() {
        List<Diagnostic> copy = new ArrayList<>(items);
        copy.sort(Comparator.comparingInt((Diagnostic d) -> d.span().line())
                .thenComparingInt(d -> d.span().column()));
        return List.copyOf(copy);
    }
}
