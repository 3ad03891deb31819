package dev.plumb.report;

import dev.plumb.lang.Expr;
import java.io.IOException;
import java.util.List;
import java.util.Map;

/** One self-contained HTML page: MathML for the mathematics, SVG plots inline, no external files. */
public final class HtmlMarkup implements Markup {
    private final StringBuilder body = new StringBuilder();
    private String title = "Derivation";

    static String esc(String s) {
        return MathMLPrinter.esc(s == null ? "" : s);
    }

    @Override
    public void heading(int level, String text) {
        if (level == 1) title = text;
        body.append("<h").append(level).append('>').append(esc(text)).append("</h").append(level).append(">\n");
    }

    @Override
    public void paragraph(String text) {
        body.append("<p>").append(esc(text)).append("</p>\n");
    }

    @Override
    public void equation(String label, Expr lhs, String relation, Expr rhs) {
        String rel = switch (relation) {
            case "~" -> "∝";
            default -> relation;
        };
        body.append("<div class=\"eq\">").append(MathMLPrinter.equation(lhs, rel, rhs));
        if (label != null) body.append("<span class=\"tag\">(").append(esc(label)).append(")</span>");
        body.append("</div>\n");
    }

    @Override
    public void table(List<String> header, List<List<Cell>> rows) {
        body.append("<table>\n<thead><tr>");
        header.forEach(h -> body.append("<th>").append(esc(h)).append("</th>"));
        body.append("</tr></thead>\n<tbody>\n");
        for (List<Cell> row : rows) {
            body.append("<tr>");
            for (Cell c : row) {
                String cls = c.text() != null && (c.text().equals("holds") || c.text().equals("fails") || c.text().equals("undecided"))
                        ? " class=\"" + c.text() + "\"" : "";
                body.append("<td").append(cls).append('>')
                        .append(c.math() != null ? MathMLPrinter.inline(c.math()) : esc(c.text())).append("</td>");
            }
            body.append("</tr>\n");
        }
        body.append("</tbody>\n</table>\n");
    }

    @Override
    public void bullets(List<String> items) {
        body.append("<ul>\n");
        items.forEach(i -> body.append("<li>").append(esc(i)).append("</li>\n"));
        body.append("</ul>\n");
    }

    @Override
    public void figure(String id, String caption, String xLabel, String yLabel, List<Plot.Series> series,
                       Map<String, byte[]> files) throws IOException {
        body.append("<figure id=\"").append(esc(id)).append("\">").append(Plot.inlineSvg(caption, xLabel, yLabel, series))
                .append("<figcaption>").append(esc(caption)).append("</figcaption></figure>\n");
    }

    @Override
    public String finish() {
        return "<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\"/>\n<title>" + esc(title) + "</title>\n"
                + "<style>\nbody{font-family:Georgia,serif;max-width:52em;margin:2em auto;padding:0 1em;line-height:1.45;color:#222}\n"
                + "table{border-collapse:collapse;margin:1em 0;font-size:0.92em}th,td{border-bottom:1px solid #ccc;padding:0.3em 0.7em;text-align:left}\n"
                + "th{border-bottom:2px solid #444}.holds{color:#17702a}.fails{color:#b00020;font-weight:bold}.undecided{color:#946200}\n"
                + ".eq{display:flex;align-items:center;justify-content:center;gap:2em;margin:0.8em 0}.tag{color:#666}\n"
                + "figure{margin:1.5em 0;text-align:center}figure svg{max-width:100%;height:auto}figcaption{color:#555}\n"
                + ".caution{border-left:4px solid #b00020;padding:0.3em 1em;background:#fff4f4}\n</style>\n</head>\n<body>\n"
                + body + "</body>\n</html>\n";
    }

    @Override
    public String extension() {
        return "html";
    }
}
