package dev.plumb.lsp;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.plumb.lang.Diagnostics;
import dev.plumb.lang.Parser;
import dev.plumb.lang.SourceFile;
import dev.plumb.lang.Span;
import dev.plumb.lang.Stmt;
import org.eclipse.lsp4j.Position;
import org.eclipse.lsp4j.Range;
import org.junit.jupiter.api.Test;

/** plumb's 1-based spans against LSP's 0-based UTF-16 positions, on the texts an editor may send. */
class SourcePositionsTest {

    private static Range range(int line, int from, int toLine, int to) {
        return new Range(new Position(line, from), new Position(toLine, to));
    }

    /** The span the parser gives the name of the first parameter declared in {@code text}. */
    private static Span firstParamName(String text) {
        Stmt.Param p = Parser.parse(new SourceFile("t.plumb", text), new Diagnostics()).all(Stmt.Param.class).get(0);
        return p.nameSpan();
    }

    @Test
    void aSpanIsShiftedToZeroBasedLinesAndCharacters() {
        String text = "param M [kg] > 0\nparam Rc [m] > 0\n";
        Span rc = firstParamName("param Rc [m] > 0\n");
        assertEquals(new Span(1, 7, 1, 9), rc);
        assertEquals(range(1, 6, 1, 8), new SourcePositions(text).range(new Span(2, 7, 2, 9)));
        assertArrayEquals(new int[] {2, 7}, new SourcePositions(text).lineAndColumn(new Position(1, 6)));
    }

    @Test
    void charactersOutsideTheBasicPlaneCountTwiceAsInUtf16() {
        // A title with a character outside the Basic Multilingual Plane (two UTF-16 code units) in it.
        String text = "title \"\uD835\uDC43 tank\"\nparam M [kg] > 0\n";
        // The lexer counts Java chars, which are UTF-16 code units: LSP's unit too. 'title "' is 7, the pair 2.
        SourcePositions positions = new SourcePositions(text);
        assertEquals(range(0, 7, 0, 9), positions.range(new Span(1, 8, 1, 10)));
        // A span that would end between the two halves of the pair takes in the whole character.
        assertEquals(range(0, 7, 0, 9), positions.range(new Span(1, 8, 1, 9)));
        // ...and one that would start between them starts before it.
        assertEquals(range(0, 7, 0, 9), positions.range(new Span(1, 9, 1, 10)));
    }

    @Test
    void aByteOrderMarkShiftsOnlyTheFirstLine() {
        String text = "\uFEFFparam M [kg] > 0\nparam R [m] > 0\n";
        // SourceFile drops the mark, so the parser puts M at column 7 of line 1; the editor's text has it at 7 (0-based).
        assertEquals(new Span(1, 7, 1, 8), firstParamName(text));
        SourcePositions positions = new SourcePositions(text);
        assertEquals(range(0, 7, 0, 8), positions.range(new Span(1, 7, 1, 8)));
        assertEquals(range(1, 6, 1, 7), positions.range(new Span(2, 7, 2, 8)));
        assertArrayEquals(new int[] {1, 7}, positions.lineAndColumn(new Position(0, 7)));
        assertArrayEquals(new int[] {2, 7}, positions.lineAndColumn(new Position(1, 6)));
    }

    @Test
    void windowsAndOldMacLineEndsCountAsOneLineBreak() {
        SourcePositions crlf = new SourcePositions("param M [kg] > 0\r\nparam R [m] > 0\r\n");
        assertEquals(range(1, 6, 1, 7), crlf.range(new Span(2, 7, 2, 8)));
        SourcePositions cr = new SourcePositions("param M [kg] > 0\rparam R [m] > 0\r");
        assertEquals(range(1, 6, 1, 7), cr.range(new Span(2, 7, 2, 8)));
    }

    @Test
    void aSpanPastItsLineOrTheTextIsKeptInsideAndAFileWideOneIsAtTheStart() {
        SourcePositions positions = new SourcePositions("param M [kg] > 0\nlet x = M\n");
        // One past the last character (where "expected an expression" points at a line's end).
        assertEquals(range(1, 9, 1, 9), positions.range(Span.at(2, 10, 1)));
        assertEquals(range(2, 0, 2, 0), positions.range(Span.at(3, 1, 1)), "the empty line after the last break");
        assertEquals(range(2, 0, 2, 0), positions.range(Span.at(40, 1, 1)));
        assertEquals(range(0, 0, 0, 0), positions.range(Span.NONE));
    }
}
