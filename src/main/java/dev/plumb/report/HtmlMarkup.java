package dev.plumb.report;

import dev.plumb.lang.Expr;
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
        // The wrapper scrolls sideways on a narrow screen, so a wide table never widens the page.
        body.append("<div class=\"scroll\"><table>\n<thead><tr>");
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
        body.append("</tbody>\n</table></div>\n");
    }

    @Override
    public void bullets(List<String> items) {
        body.append("<ul>\n");
        items.forEach(i -> body.append("<li>").append(esc(i)).append("</li>\n"));
        body.append("</ul>\n");
    }

    @Override
    public void figure(String id, String caption, Plot plot, Map<String, byte[]> files) {
        body.append("<figure id=\"").append(esc(id)).append("\">").append(SvgPlot.element(plot))
                .append("<figcaption>").append(esc(caption)).append("</figcaption></figure>\n");
    }

    @Override
    public void footer(String text) {
        body.append("<footer class=\"caution\">").append(esc(text)).append("</footer>\n");
    }

    @Override
    public String finish() {
        return "<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\"/>\n"
                + "<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\"/>\n<title>" + esc(title) + "</title>\n"
                + "<style>\nbody{font-family:Georgia,serif;max-width:52em;margin:2em auto;padding:0 1em;line-height:1.45;color:#222;overflow-wrap:break-word}\n"
                + "table{border-collapse:collapse;margin:1em 0;font-size:0.92em}th,td{border-bottom:1px solid #ccc;padding:0.3em 0.7em;text-align:left}\n"
                + "th{border-bottom:2px solid #444}.holds{color:#17702a}.fails{color:#b00020;font-weight:bold}.undecided{color:#946200}\n"
                + ".eq{display:flex;align-items:center;justify-content:safe center;gap:2em;margin:0.8em 0;overflow-x:auto}.tag{color:#666}\n"
                + "figure{margin:1.5em 0;text-align:center}figure svg{display:block;margin:0 auto;width:100%;max-width:640px;height:auto}"
                + "figcaption{color:#555}\n.scroll{overflow-x:auto;margin:1em 0}.scroll table{margin:0}\n"
                + ".caution{margin-top:2.5em;padding-top:0.5em;border-top:1px solid #ccc;font-size:0.85em;color:#555}\n</style>\n</head>\n<body>\n"
                + body + "</body>\n</html>\n";
    }

    @Override
    public String extension() {
        return "html";
    }
}
