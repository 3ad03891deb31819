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

    /**
     * The diagnostics in source order, one per mistake: an exact repeat is dropped, and so is an
     * error that only wraps another error found inside its span (a case value "must be a fixed number:
     * unknown unit ..." beside the "unknown unit ..." itself), keeping the more precise one.
     */
    public List<Diagnostic> sorted() {
        java.util.Map<Integer, List<Diagnostic>> errorsByLine = new java.util.HashMap<>();
        for (Diagnostic d : items) {
            if (d.severity() == Severity.ERROR) errorsByLine.computeIfAbsent(d.span().line(), k -> new ArrayList<>()).add(d);
        }
        java.util.Set<Diagnostic> kept = new java.util.LinkedHashSet<>();
        for (Diagnostic d : items) {
            if (!wrapsAnother(d, errorsByLine)) kept.add(d);
        }
        List<Diagnostic> copy = new ArrayList<>(kept);
        copy.sort(Comparator.comparingInt((Diagnostic d) -> d.span().line())
                .thenComparingInt(d -> d.span().column()));
        return List.copyOf(copy);
    }

    private static boolean wrapsAnother(Diagnostic d, java.util.Map<Integer, List<Diagnostic>> errorsByLine) {
        if (d.severity() != Severity.ERROR || d.span().endLine() - d.span().line() > 1000) return false;
        for (int line = d.span().line(); line <= d.span().endLine(); line++) {
            List<Diagnostic> onLine = errorsByLine.getOrDefault(line, List.of());
            if (onLine.size() > 100) return false; // a flood on one line: counted, not compared pairwise
            for (Diagnostic inner : onLine) {
                if (inner != d && !inner.message().equals(d.message())
                        && d.message().endsWith(inner.message()) && within(inner.span(), d.span())) {
                    return true;
                }
            }
        }
        return false;
    }

    private static boolean within(Span inner, Span outer) {
        boolean startsInside = inner.line() > outer.line() || inner.line() == outer.line() && inner.column() >= outer.column();
        boolean endsInside = inner.endLine() < outer.endLine() || inner.endLine() == outer.endLine() && inner.endColumn() <= outer.endColumn();
        return startsInside && endsInside;
    }
}
