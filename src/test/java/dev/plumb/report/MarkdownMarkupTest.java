package dev.plumb.report;

import static dev.plumb.report.CommonMarkReading.children;
import static dev.plumb.report.CommonMarkReading.parse;
import static dev.plumb.report.CommonMarkReading.plain;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumb.lang.Expr;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.commonmark.ext.gfm.tables.TableBlock;
import org.commonmark.ext.gfm.tables.TableCell;
import org.commonmark.node.BulletList;
import org.commonmark.node.Code;
import org.commonmark.node.FencedCodeBlock;
import org.commonmark.node.Heading;
import org.commonmark.node.ListItem;
import org.commonmark.node.Node;
import org.commonmark.node.Paragraph;
import org.commonmark.node.Text;
import org.junit.jupiter.api.Test;

/**
 * Text written by {@link MarkdownMarkup} is read back by an independent CommonMark parser
 * (commonmark-java with GitHub's tables) and must show exactly as it was given, in every place
 * the report puts text; mathematics must come back as the LaTeX that was written.
 */
class MarkdownMarkupTest {

    /** What a renderer shows for text given to the markup: one line, no blanks at either end. */
    private static String shown(String s) {
        return s.replace("\r\n", " ").replace('\r', ' ').replace('\n', ' ').strip();
    }

    private static String paragraphOf(String s) {
        MarkdownMarkup m = new MarkdownMarkup();
        m.paragraph(s);
        List<Node> blocks = children(parse(m.finish()));
        assertEquals(1, blocks.size(), () -> "one block for " + s + ": " + m.finish());
        assertInstanceOf(Paragraph.class, blocks.get(0), () -> "a paragraph for " + s + ": " + m.finish());
        return plain(blocks.get(0));
    }

    private static String headingOf(String s) {
        MarkdownMarkup m = new MarkdownMarkup();
        m.heading(2, s);
        List<Node> blocks = children(parse(m.finish()));
        assertEquals(1, blocks.size(), () -> "one block for " + s + ": " + m.finish());
        Heading h = assertInstanceOf(Heading.class, blocks.get(0), () -> "a heading for " + s + ": " + m.finish());
        assertEquals(2, h.getLevel());
        return plain(h);
    }

    private static List<String> bulletsOf(List<String> items) {
        MarkdownMarkup m = new MarkdownMarkup();
        m.bullets(items);
        List<Node> blocks = children(parse(m.finish()));
        assertEquals(1, blocks.size(), () -> "one list for " + items + ": " + m.finish());
        BulletList list = assertInstanceOf(BulletList.class, blocks.get(0), () -> "a list for " + items + ": " + m.finish());
        List<String> out = new ArrayList<>();
        for (Node item : children(list)) {
            ListItem li = assertInstanceOf(ListItem.class, item);
            List<Node> inside = children(li);
            assertEquals(1, inside.size(), () -> "one paragraph in each item of " + items + ": " + m.finish());
            out.add(plain(assertInstanceOf(Paragraph.class, inside.get(0), () -> "plain items for " + items + ": " + m.finish())));
        }
        return out;
    }

    private static List<List<String>> tableOf(List<String> header, List<List<Markup.Cell>> rows) {
        MarkdownMarkup m = new MarkdownMarkup();
        m.table(header, rows);
        List<Node> blocks = children(parse(m.finish()));
        assertEquals(1, blocks.size(), () -> "one table for " + header + rows + ": " + m.finish());
        TableBlock t = assertInstanceOf(TableBlock.class, blocks.get(0), () -> "a table for " + header + rows + ": " + m.finish());
        return CommonMarkReading.rows(t);
    }

    /** Text that would turn into something else in a Markdown file written without escaping. */
    private static final List<String> HOSTILE = List.of(
            "P(R) = -3*G*M^2/(8*pi*R^4) instead of 0",
            "rho_c*T0^(n+1)/k_B and _x_ and __y__ and a_b_c",
            "* not a list", "- not a list", "+ not a list", "1. not a list", "12) not a list", "# not a heading",
            "> not a quote", "---", "***", "___", "= =", "    not code", "```not a fence", "~~~ not a fence",
            "`P(0)` not code", "<b>not bold</b>", "<!-- not a comment -->", "<https://not.a.link>",
            "[not a link](https://example.org)", "![not an image](x.svg)", "[ref]: /not-a-definition",
            "[x] not a task", "a | b | c", "&amp; &#42; &copy; stay as typed", "a backslash \\ and \\* and \\| and \\\\",
            "$x$ and $$y$$ are not mathematics", "~~not struck~~", "trailing backslash \\", "trailing hashes ##",
            "ends with two spaces  ", "line\nbreaks\r\nbecome blanks", "0.0e+00", "-3*G", "1.5e14 [Pa]", "x [km]");

    @Test
    void hostileTextShowsAsWrittenInEveryPlace() {
        for (String s : HOSTILE) {
            String want = shown(s);
            assertEquals(want, paragraphOf(s), "paragraph");
            assertEquals(want, headingOf(s), "heading");
            assertEquals(List.of(want, want), bulletsOf(List.of(s, s)), "bullets");
            assertEquals(List.of(List.of(want, "x"), List.of("y", want)),
                    tableOf(List.of(s, "x"), List.of(List.of(Markup.Cell.text("y"), Markup.Cell.text(s)))), "table");
        }
    }

    /**
     * Random text over the characters that mean something to CommonMark or GitHub (and a few that do
     * not), 4000 strings from a fixed seed: each must show as written as a paragraph, a heading, a
     * bullet and a table cell.
     */
    @Test
    void randomTextShowsAsWrittenInEveryPlace() {
        String alphabet = "ab1_ *`\\<>&#;[]()!|~$-+=.:\t\"'{}^/0ρé\n";
        Random random = new Random(20261202L);
        for (int k = 0; k < 4000; k++) {
            StringBuilder b = new StringBuilder();
            int n = 1 + random.nextInt(14);
            for (int i = 0; i < n; i++) b.append(alphabet.charAt(random.nextInt(alphabet.length())));
            String s = b.toString();
            String want = shown(s);
            if (!want.isEmpty()) {
                assertEquals(want, paragraphOf(s), () -> "paragraph of [" + s + "]");
                assertEquals(List.of(want), bulletsOf(List.of(s)), () -> "bullet of [" + s + "]");
            }
            assertEquals(want, headingOf(s), () -> "heading of [" + s + "]");
            assertEquals(List.of(List.of(want), List.of(want)), tableOf(List.of(s), List.of(List.of(Markup.Cell.text(s)))),
                    () -> "table cell of [" + s + "]");
        }
    }

    @Test
    void aDisplayedEquationIsAMathBlockHoldingItsLatexAndItsPlumbForm() {
        Expr lhs = dev.plumb.lang.Parser.parseExpression("P'(r)");
        Expr rhs = dev.plumb.lang.Parser.parseExpression("-G*m(r)*rho/r^2");
        MarkdownMarkup m = new MarkdownMarkup();
        m.equation("hydro_balance", lhs, "=", rhs);
        List<Node> blocks = children(parse(m.finish()));
        assertEquals(1, blocks.size(), m.finish());
        FencedCodeBlock block = assertInstanceOf(FencedCodeBlock.class, blocks.get(0), m.finish());
        assertEquals("math", block.getInfo());
        assertEquals("% plumb: P'(r) = -G*m(r)*rho/r^2\n" + LatexPrinter.print(lhs) + " = " + LatexPrinter.print(rhs)
                + " \\qquad \\text{(hydro\\_balance)}\n", block.getLiteral());
    }

    @Test
    void mathInATableCellIsCodeBetweenDollarsEvenWithBars() {
        // abs() is typeset with bars, which GitHub's tables would otherwise take for cell borders.
        Expr e = dev.plumb.lang.Parser.parseExpression("rho_c*abs(x)^2/k_B");
        String latex = LatexPrinter.print(e);
        assertTrue(latex.contains("|"), latex);
        MarkdownMarkup m = new MarkdownMarkup();
        m.table(List.of("q", "r"), List.of(List.of(Markup.Cell.math(e), Markup.Cell.text("after"))));
        TableBlock t = assertInstanceOf(TableBlock.class, children(parse(m.finish())).get(0), m.finish());
        List<Node> cells = CommonMarkReading.descendants(t).stream().filter(n -> n instanceof TableCell).toList();
        assertEquals(4, cells.size(), m.finish());
        List<Node> inline = children(cells.get(2));
        assertEquals(3, inline.size(), m.finish());
        assertEquals("$", ((Text) inline.get(0)).getLiteral());
        assertEquals(latex, ((Code) inline.get(1)).getLiteral());
        assertEquals("$", ((Text) inline.get(2)).getLiteral());
        assertEquals("after", plain(cells.get(3)));
    }

    @Test
    void codeSpansHoldBackticksAndBlanksAsWritten() {
        for (String s : List.of("a`b", "``", " x ", "`x`", "a``b`c")) {
            Node p = children(parse(MarkdownMarkup.code(s) + "\n")).get(0);
            Code code = assertInstanceOf(Code.class, p.getFirstChild(), MarkdownMarkup.code(s));
            assertEquals(s, code.getLiteral(), MarkdownMarkup.code(s));
        }
    }

    @Test
    void plainLabelsAndUnitsStayReadableInTheFile() {
        // Escaping only what needs it keeps the Markdown file as readable as its rendering.
        assertEquals("sun_value", MarkdownMarkup.text("sun_value"));
        assertEquals("P(0) [GPa]", MarkdownMarkup.text("P(0) [GPa]"));
        assertEquals("0.0e+00", MarkdownMarkup.text("0.0e+00"));
        assertEquals("3\\*G\\*M^2", MarkdownMarkup.text("3*G*M^2"));
    }
}
