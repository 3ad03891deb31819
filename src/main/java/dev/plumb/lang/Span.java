package dev.plumb.lang;

/**
 * A region of source text: 1-based line and column of the first character, and of the
 * character just past the last one (so a one-character span has endColumn = column + 1).
 */
public record Span(int line, int column, int endLine, int endColumn) {

    public static final Span NONE = new Span(0, 0, 0, 0);

    public static Span at(int line, int column, int length) {
        return new Span(line, column, line, column + Math.max(1, length));
    }

    /** The smallest span covering both. */
    public Span to(Span other) {
        if (this == NONE) return other;
        if (other == NONE) return this;
        Span first = before(other) ? this : other;
        Span last = endsAfter(other) ? this : other;
        return new Span(first.line, first.column, last.endLine, last.endColumn);
    }

    private boolean before(Span o) {
        return line < o.line || (line == o.line && column <= o.column);
    }

    private boolean endsAfter(Span o) {
        return endLine > o.endLine || (endLine == o.endLine && endColumn >= o.endColumn);
    }
}
