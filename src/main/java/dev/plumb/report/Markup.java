package dev.plumb.report;

import dev.plumb.lang.Expr;
import dev.plumb.model.Status;
import java.io.IOException;
import java.util.List;
import java.util.Map;

/**
 * The building blocks of a derivation document, written once by {@link DerivationDocument} and
 * rendered by each output format (Markdown, LaTeX, HTML). Running text is a list of {@link Inline}
 * runs, so that a formula, a number or a unit inside a sentence is typeset by the format, and each
 * format escapes text in exactly one place (its rendering of {@link Inline.Text}).
 */
public interface Markup {

    /** One run of running text. */
    sealed interface Inline {
        /** Words, shown as written. */
        record Text(String text) implements Inline { }

        /** Inline mathematics: {@code lhs}, or {@code lhs REL rhs} when {@code relation} is set. */
        record Math(Expr lhs, String relation, Expr rhs) implements Inline {
            public static Math of(Expr e) {
                return new Math(e, null, null);
            }
        }

        /** A number as formatted ({@code 3.69220e+07}), typeset with a real minus sign and a power of ten. */
        record Number(String text) implements Inline { }

        /** A unit as plumb writes units ({@code kg m^-3}, {@code Pa/m}); the dimensionless {@code 1} shows as nothing. */
        record Unit(String unit) implements Inline { }

        /** A verdict, shown in its colour and always as its word. */
        record Verdict(Status status) implements Inline { }
    }

    static Inline text(String s) {
        return new Inline.Text(s);
    }

    /** A table cell: a few runs of text. */
    record Cell(List<Inline> runs) {
        public Cell {
            runs = List.copyOf(runs);
        }

        public static Cell text(String t) {
            return new Cell(t == null || t.isEmpty() ? List.of() : List.of(new Inline.Text(t)));
        }

        public static Cell math(Expr e) {
            return new Cell(List.of(Inline.Math.of(e)));
        }

        public static Cell of(Inline... runs) {
            return new Cell(List.of(runs));
        }

        /** The length of the cell's text as written in plumb's notation, a measure of how wide it wants to be. */
        int length() {
            int n = 0;
            for (Inline i : runs) {
                if (i instanceof Inline.Text t) n += t.text().length();
                else if (i instanceof Inline.Math m) n += dev.plumb.lang.ExprPrinter.print(m.lhs()).length()
                        + (m.rhs() == null ? 0 : 3 + dev.plumb.lang.ExprPrinter.print(m.rhs()).length());
                else if (i instanceof Inline.Number x) n += x.text().length();
                else if (i instanceof Inline.Unit u) n += u.unit().length() + 1;
                else if (i instanceof Inline.Verdict v) n += v.status().word().length() + 2;
            }
            return n;
        }
    }

    /**
     * How a checked statement fared, to be shown at its equation: the verdict and, when plumb derived
     * one, the correct form {@code correctLhs = correctRhs} (both null otherwise).
     */
    record Mark(Status status, Expr correctLhs, Expr correctRhs) { }

    /**
     * A displayed equation {@code lhs REL rhs} (rhs may be null). {@code label} is the statement's own
     * label (numbered and referable in LaTeX), or null; {@code note} says what the equation is when
     * it has no label ("definition", "boundary"), or null; {@code mark} is null for unchecked ones.
     */
    record Equation(String label, String note, Expr lhs, String relation, Expr rhs, Mark mark) { }

    /**
     * Called once before anything else: the name of the file reported (without its extension, for
     * labels that stay apart from another report's) and the typeset forms the user gave names
     * ({@code typeset NAME as "TeX"}), to be used in every formula.
     */
    default void begin(String file, Map<String, String> forms) {
    }

    void heading(int level, String text);

    void paragraph(List<Inline> runs);

    default void paragraph(String text) {
        paragraph(List.of(text(text)));
    }

    void equation(Equation e);

    /** A displayed equation {@code lhs REL rhs}, optionally labelled. */
    default void equation(String label, Expr lhs, String relation, Expr rhs) {
        equation(new Equation(label, null, lhs, relation, rhs, null));
    }

    void tabulate(List<Cell> header, List<List<Cell>> rows);

    default void table(List<String> header, List<List<Cell>> rows) {
        tabulate(header.stream().map(Cell::text).toList(), rows);
    }

    void bulletList(List<List<Inline>> items);

    default void bullets(List<String> items) {
        bulletList(items.stream().map(i -> List.of(text(i))).toList());
    }

    /** A plot; formats that keep figures (or their data) in files add them to {@code files}. */
    void figure(String id, String caption, Plot plot, Map<String, byte[]> files) throws IOException;

    /** One closing line set apart from the body (the caution); formats without a footer write a paragraph. */
    default void footer(String text) {
        paragraph(text);
    }

    String finish();

    /**
     * Documents written beside the main one, by file name, given the main one's name without its
     * extension (LaTeX's preamble-free body for a thesis to {@code \input}); none by default.
     */
    default Map<String, String> companions(String base) {
        return Map.of();
    }

    /** The file extension of the main document. */
    String extension();
}
