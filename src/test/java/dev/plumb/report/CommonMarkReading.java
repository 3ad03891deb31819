package dev.plumb.report;

import java.util.ArrayList;
import java.util.List;
import org.commonmark.ext.gfm.tables.TableBlock;
import org.commonmark.ext.gfm.tables.TableCell;
import org.commonmark.ext.gfm.tables.TableRow;
import org.commonmark.ext.gfm.tables.TablesExtension;
import org.commonmark.node.Code;
import org.commonmark.node.Node;
import org.commonmark.node.SoftLineBreak;
import org.commonmark.node.Text;
import org.commonmark.parser.Parser;

/**
 * Markdown read back by an independent CommonMark parser (commonmark-java, with the GitHub tables
 * extension), as a renderer would read it: the check that what plumb writes shows as it was meant.
 */
final class CommonMarkReading {
    private static final Parser PARSER = Parser.builder().extensions(List.of(TablesExtension.create())).build();

    private CommonMarkReading() {
    }

    static Node parse(String markdown) {
        return PARSER.parse(markdown);
    }

    static List<Node> children(Node n) {
        List<Node> out = new ArrayList<>();
        for (Node c = n.getFirstChild(); c != null; c = c.getNext()) out.add(c);
        return out;
    }

    /** Every node below {@code n}, depth first. */
    static List<Node> descendants(Node n) {
        List<Node> out = new ArrayList<>();
        for (Node c = n.getFirstChild(); c != null; c = c.getNext()) {
            out.add(c);
            out.addAll(descendants(c));
        }
        return out;
    }

    /**
     * The text a renderer shows for the inline content of {@code n}: text and code as they are, a soft
     * line break as a blank. Any other inline node (emphasis, a link, HTML, ...) is not plain text:
     * its class name is returned in its place, in angle brackets, so that a comparison shows it.
     */
    static String plain(Node n) {
        StringBuilder b = new StringBuilder();
        for (Node c = n.getFirstChild(); c != null; c = c.getNext()) {
            if (c instanceof Text t) {
                b.append(t.getLiteral());
            } else if (c instanceof Code code) {
                b.append(code.getLiteral());
            } else if (c instanceof SoftLineBreak) {
                b.append(' ');
            } else {
                b.append('<').append(c.getClass().getSimpleName()).append('>').append(plain(c));
            }
        }
        return b.toString();
    }

    /** The rows of a table (the header first), each as its cells' plain text. */
    static List<List<String>> rows(TableBlock table) {
        List<List<String>> out = new ArrayList<>();
        for (Node n : descendants(table)) {
            if (n instanceof TableRow row) {
                List<String> cells = new ArrayList<>();
                for (Node c : children(row)) cells.add(plain((TableCell) c));
                out.add(cells);
            }
        }
        return out;
    }
}
