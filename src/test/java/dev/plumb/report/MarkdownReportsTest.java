package dev.plumb.report;

import static dev.plumb.report.CommonMarkReading.descendants;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.commonmark.ext.gfm.tables.TableBlock;
import org.commonmark.node.BlockQuote;
import org.commonmark.node.Code;
import org.commonmark.node.Emphasis;
import org.commonmark.node.FencedCodeBlock;
import org.commonmark.node.HtmlBlock;
import org.commonmark.node.HtmlInline;
import org.commonmark.node.Image;
import org.commonmark.node.IndentedCodeBlock;
import org.commonmark.node.Link;
import org.commonmark.node.Node;
import org.commonmark.node.OrderedList;
import org.commonmark.node.StrongEmphasis;
import org.commonmark.node.Text;
import org.commonmark.node.ThematicBreak;
import org.junit.jupiter.api.Test;

/**
 * The Markdown report of every shipped derivation and example, read back with an independent
 * CommonMark parser (commonmark-java, GitHub tables): no formula or message turns into emphasis,
 * HTML, a link, a list or a quote; tables parse as tables; mathematics is LaTeX in code.
 */
class MarkdownReportsTest {

    private record Report(Path input, Path markdown, String text, Node document) { }

    private static List<Report> reports() throws Exception {
        ReportRuns.Run run = ReportRuns.first();
        List<Report> out = new ArrayList<>();
        for (Map.Entry<Path, Integer> e : run.statuses().entrySet()) {
            Path md = run.reportOf(e.getKey()).resolve(ReportBatch.folder(e.getKey()) + ".md");
            if (e.getValue() == 2) {
                assertFalse(Files.exists(md), () -> "no report for input that cannot be understood: " + e.getKey());
                continue;
            }
            String text = Files.readString(md);
            out.add(new Report(e.getKey(), md, text, CommonMarkReading.parse(text)));
        }
        assertTrue(out.size() >= 35, "the derivations and examples that can be reported: " + out.size());
        return out;
    }

    @Test
    void noFormulaOrMessageBecomesEmphasisHtmlALinkAListOrAQuote() throws Exception {
        for (Report r : reports()) {
            for (Node n : descendants(r.document())) {
                if (n instanceof Emphasis || n instanceof StrongEmphasis || n instanceof HtmlInline || n instanceof HtmlBlock
                        || n instanceof Link || n instanceof OrderedList || n instanceof BlockQuote || n instanceof IndentedCodeBlock
                        || n instanceof ThematicBreak) {
                    fail(r.markdown() + ": a " + n.getClass().getSimpleName() + " holding '" + CommonMarkReading.plain(n) + "'");
                }
                if (n instanceof Image img) {
                    assertTrue(Files.exists(r.markdown().resolveSibling(img.getDestination())), () -> r.markdown() + ": "
                            + img.getDestination() + " is not among the files written");
                }
            }
        }
    }

    @Test
    void everyTableLineParsesAsARowOfATableWithAllItsCells() throws Exception {
        for (Report r : reports()) {
            long tableLines = r.text().lines().filter(l -> l.startsWith("|")).count();
            long parsed = 0;
            for (Node n : descendants(r.document())) {
                if (n instanceof TableBlock t) {
                    List<List<String>> rows = CommonMarkReading.rows(t);
                    int width = rows.get(0).size();
                    for (List<String> row : rows) assertEquals(width, row.size(), () -> r.markdown() + ": " + row);
                    parsed += rows.size() + 1;
                }
            }
            // Each table is its rows plus the line under the header.
            assertEquals(tableLines, parsed, r.markdown() + ": lines starting with '|' that are not in a table");
        }
    }

    @Test
    void mathematicsIsLatexInCodeBlocksAndBetweenDollars() throws Exception {
        for (Report r : reports()) {
            for (Node n : descendants(r.document())) {
                if (n instanceof FencedCodeBlock block) {
                    assertEquals("math", block.getInfo(), r.markdown()::toString);
                    assertTrue(block.getLiteral().startsWith("% plumb: "), () -> r.markdown() + ": " + block.getLiteral());
                }
                if (n instanceof Code code) {
                    boolean dollars = code.getPrevious() instanceof Text before && before.getLiteral().endsWith("$")
                            && code.getNext() instanceof Text after && after.getLiteral().startsWith("$");
                    assertTrue(dollars, () -> r.markdown() + ": code that is not mathematics: " + code.getLiteral());
                }
            }
        }
    }

    /**
     * Each check's label and message show as written (the messages are read from the JSON of the same
     * run): the formulas inside a message are typeset, so they show as LaTeX, but every word of it
     * shows, in order, and nothing of it is lost to escaping or taken as markup.
     */
    @Test
    void checkLabelsAndTheWordsOfTheirMessagesShow() throws Exception {
        ObjectMapper json = new ObjectMapper();
        for (Report r : reports()) {
            List<String> rows = new ArrayList<>();
            for (Node n : descendants(r.document())) {
                if (n instanceof TableBlock t) CommonMarkReading.rows(t).forEach(row -> rows.add(String.join(" | ", row)));
            }
            JsonNode doc = json.readTree(r.markdown().resolveSibling(ReportBatch.folder(r.input()) + ".json").toFile());
            for (JsonNode check : doc.get("checks")) {
                // The kinds the report tabulates with label, line, verdict, factor and message.
                if (!List.of("units", "step", "claim", "expect").contains(check.get("kind").asText())) continue;
                String start = check.get("label").asText() + " | " + check.get("line").asInt() + " | ";
                String message = check.get("message").asText().replace('\n', ' ').strip();
                List<String> words = java.util.Arrays.stream(message.split(" ")).filter(w -> w.matches("[A-Za-z]{3,}[,;:.]?")).toList();
                boolean found = false;
                for (String row : rows) {
                    if (!row.startsWith(start)) continue;
                    int at = 0;
                    boolean all = true;
                    for (String w : words) {
                        int k = row.indexOf(w, at);
                        if (k < 0) {
                            all = false;
                            break;
                        }
                        at = k + w.length();
                    }
                    found |= all;
                }
                assertTrue(found, () -> r.markdown() + ": no row " + start + "shows the words of: " + message);
            }
        }
    }
}
