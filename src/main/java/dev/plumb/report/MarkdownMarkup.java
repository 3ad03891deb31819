package dev.plumb.report;

import dev.plumb.lang.Expr;
import dev.plumb.lang.ExprPrinter;
import java.util.List;
import java.util.Map;

/** Markdown with {@code $...$} math (LaTeX inside), as most Markdown viewers render it; plots as SVG files. */
public final class MarkdownMarkup implements Markup {
    private final StringBuilder out = new StringBuilder();

    @Override
    public void heading(int level, String text) {
        out.append("#".repeat(level)).append(' ').append(text).append("\n\n");
    }

    @Override
    public void paragraph(String text) {
        out.append(text).append("\n\n");
    }

    @Override
    public void equation(String label, Expr lhs, String relation, Expr rhs) {
        String rel = switch (relation) {
            case "~" -> "\\propto";
            case "≈" -> "\\approx";
            default -> relation;
        };
        out.append("$$").append(LatexPrinter.print(lhs)).append(rhs == null ? "" : " " + rel + " " + LatexPrinter.print(rhs));
        if (label != null) out.append(" \\qquad \\text{(").append(label.replace("_", "\\_")).append(")}");
        out.append("$$\n\n");
        out.append("<!-- plumb: ").append(ExprPrinter.print(lhs)).append(rhs == null ? "" : " " + relation + " " + ExprPrinter.print(rhs))
                .append(" -->\n\n");
    }

    @Override
    public void table(List<String> header, List<List<Cell>> rows) {
        out.append('|');
        header.forEach(h -> out.append(' ').append(cellText(h)).append(" |"));
        out.append("\n|");
        header.forEach(h -> out.append("---|"));
        out.append('\n');
        for (List<Cell> row : rows) {
            out.append('|');
            for (Cell c : row) {
                out.append(' ').append(c.math() != null ? "$" + LatexPrinter.print(c.math()) + "$" : cellText(c.text())).append(" |");
            }
            out.append('\n');
        }
        out.append('\n');
    }

    private static String cellText(String s) {
        return s == null ? "" : s.replace("|", "\\|").replace("\n", " ");
    }

    @Override
    public void bullets(List<String> items) {
        items.forEach(i -> out.append("- ").append(i).append('\n'));
        out.append('\n');
    }

    @Override
    public void figure(String id, String caption, Plot plot, Map<String, byte[]> files) {
        String file = id + ".svg";
        files.put(file, SvgPlot.file(plot).getBytes(java.nio.charset.StandardCharsets.UTF_8));
        out.append("![").append(caption).append("](").append(file).append(")\n\n");
    }

    @Override
    public void footer(String text) {
        out.append("---\n\n").append(text).append("\n\n");
    }

    @Override
    public String finish() {
        return out.toString();
    }

    @Override
    public String extension() {
        return "md";
    }
}
