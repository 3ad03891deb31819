package dev.plumb.lsp;

import dev.plumb.lang.Span;
import org.eclipse.lsp4j.Position;
import org.eclipse.lsp4j.Range;

/**
 * Converts between plumb's spans and the positions of the Language Server Protocol in one
 * document's text as the editor sent it.
 *
 * <p>A {@link Span} counts lines and columns from 1, columns in UTF-16 code units (Java
 * {@code char}s) of the text after {@link dev.plumb.lang.SourceFile} dropped a leading byte-order
 * mark. LSP counts both from 0, characters in UTF-16 code units of the text as sent (a byte-order
 * mark included). Both break lines at LF, CR LF and a lone CR, so line numbers agree. A position is
 * kept inside its line, and never between the two halves of a surrogate pair.
 */
final class SourcePositions {

    private final String[] lines;
    /** 1 when the text as sent starts with a byte-order mark, which shifts the first line's columns. */
    private final int bomShift;

    SourcePositions(String text) {
        this.bomShift = text.startsWith("\uFEFF") ? 1 : 0;
        this.lines = text.split("\r\n|\r|\n", -1);
    }

    /** The LSP range of a span ({@link Span#NONE}, for a file-wide message, becomes the start of the text). */
    Range range(Span span) {
        if (span.line() < 1) return new Range(new Position(0, 0), new Position(0, 0));
        Position start = position(span.line(), span.column(), false);
        Position end = position(span.endLine(), span.endColumn(), true);
        if (end.getLine() < start.getLine() || end.getLine() == start.getLine() && end.getCharacter() < start.getCharacter()) {
            end = start;
        }
        return new Range(start, end);
    }

    /** The 1-based line and column of plumb that an LSP position points at. */
    int[] lineAndColumn(Position p) {
        int line = p.getLine() + 1;
        int column = p.getCharacter() + 1 - (p.getLine() == 0 ? bomShift : 0);
        return new int[] {line, Math.max(1, column)};
    }

    private Position position(int line, int column, boolean end) {
        int index = Math.min(line, lines.length) - 1;
        if (index < 0) return new Position(0, 0);
        String text = lines[index];
        int shift = index == 0 ? bomShift : 0;
        int character = line > lines.length ? text.length() : Math.min(text.length(), Math.max(shift, column - 1 + shift));
        // A span ending (or starting) inside a surrogate pair takes in the whole character.
        if (character > 0 && character < text.length() && Character.isHighSurrogate(text.charAt(character - 1))
                && Character.isLowSurrogate(text.charAt(character))) {
            character += end ? 1 : -1;
        }
        return new Position(index, character);
    }
}
