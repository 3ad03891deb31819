package dev.plumb.report;

import dev.plumb.lang.Expr;
import java.io.IOException;
import java.util.List;
import java.util.Map;

/**
 * The building blocks of a derivation document, written once by {@link DerivationDocument} and
 * rendered by each output format (Markdown, LaTeX, HTML).
 */
public interface Markup {

    /** A table cell: plain text, or inline math when {@code math} is set. */
    record Cell(String text, Expr math) {
        public static Cell text(String t) {
            return new Cell(t, null);
        }

        public static Cell math(Expr e) {
            return new Cell(null, e);
        }
    }

    void heading(int level, String text);

    void paragraph(String text);

    /** A displayed equation {@code lhs REL rhs}, optionally labelled. */
    void equation(String label, Expr lhs, String relation, Expr rhs);

    void table(List<String> header, List<List<Cell>> rows);

    void bullets(List<String> items);

    /** A plot; formats that keep figures (or their data) in files add them to {@code files}. */
    void figure(String id, String caption, Plot plot, Map<String, byte[]> files) throws IOException;

    /** One closing line set apart from the body (the caution); formats without a footer write a paragraph. */
    default void footer(String text) {
        paragraph(text);
    }

    String finish();

    /** The file extension of the main document. */
    String extension();
}
