package dev.plumb.report;

import dev.plumb.model.Status;
import java.util.List;
import java.util.Map;

/** One self-contained HTML page: MathML for the mathematics, SVG plots inline, no external files. */
public final class HtmlMarkup implements Markup {
    private final StringBuilder body = new StringBuilder();
    private String title = "Derivation";
    private MathMLPrinter printer = MathMLPrinter.with(Map.of());

    static String esc(String s) {
        return MathMLPrinter.esc(s == null ? "" : s);
    }

    @Override
    public void begin(String file, Map<String, String> forms) {
        printer = MathMLPrinter.with(forms);
    }

    @Override
    public void heading(int level, String text) {
        if (level == 1) title = text;
        body.append("<h").append(level).append('>').append(esc(text)).append("</h").append(level).append(">\n");
    }

    @Override
    public void paragraph(List<Inline> runs) {
        body.append("<p>").append(inline(runs)).append("</p>\n");
    }

    /** Running text as HTML, mathematics as MathML: the one place where text is escaped. */
    String inline(List<Inline> runs) {
        StringBuilder out = new StringBuilder();
        Inline previous = null;
        for (Inline i : runs) {
            boolean afterNumber = previous instanceof Inline.Number;
            previous = i;
            if (i instanceof Inline.Text t) {
                out.append(esc(t.text()));
            } else if (i instanceof Inline.Math m) {
                // In a box of its own that scrolls sideways when wider than the line: a closed form can be far wider than a phone.
                out.append("<span class=\"im\">").append(printer.inlined(m.lhs(), m.rhs() == null ? null : relation(m.relation()), m.rhs()))
                        .append("</span>");
            } else if (i instanceof Inline.Number n) {
                out.append(number(n.text()));
            } else if (i instanceof Inline.Unit u) {
                String unit = MathMLPrinter.unit(u.unit());
                if (!afterNumber) unit = unit.replaceFirst("^<mspace width=\"0.2em\"/>", "");
                if (!unit.isEmpty()) out.append("<math><mrow>").append(unit).append("</mrow></math>");
            } else if (i instanceof Inline.Verdict v) {
                out.append(verdict(v.status()));
            }
        }
        return out.toString();
    }

    /** A number as text with a real minus sign and its exponent as a power of ten. */
    private static String number(String text) {
        java.util.regex.Matcher m = java.util.regex.Pattern.compile("([-+]?)([0-9]*\\.?[0-9]+)(?:[eE]([-+]?)0*([0-9]+))?").matcher(text.strip());
        if (!m.matches()) return esc(text);
        StringBuilder out = new StringBuilder(m.group(1).equals("-") ? "−" : "").append(m.group(2));
        if (m.group(4) != null && !(m.group(4).equals("0") && !m.group(3).equals("-"))) {
            out.append(" × 10<sup>").append(m.group(3).equals("-") ? "−" : "").append(m.group(4)).append("</sup>");
        }
        return out.toString();
    }

    private static String verdict(Status s) {
        String cls = s.name().toLowerCase(java.util.Locale.ROOT).replace("_", "");
        return "<span class=\"" + cls + "\">" + esc(s.word()) + "</span>";
    }

    private static String relation(String r) {
        if (r == null) return "=";
        return r.equals("~") ? "∝" : r;
    }

    @Override
    public void equation(Equation e) {
        String cls = e.mark() == null ? "eq" : "eq " + e.mark().status().name().toLowerCase(java.util.Locale.ROOT).replace("_", "");
        body.append("<div class=\"").append(cls).append('"');
        if (e.label() != null) body.append(" id=\"eq-").append(esc(e.label())).append('"');
        body.append('>').append(printer.displayed(e.lhs(), relation(e.relation()), e.rhs()));
        String tag = e.label() != null ? e.label() : e.note();
        if (tag != null || e.mark() != null) {
            body.append("<span class=\"tag\">").append(tag == null ? "" : "(" + esc(tag) + ")");
            if (e.mark() != null) body.append(tag == null ? "" : " ").append(verdict(e.mark().status()));
            body.append("</span>");
        }
        body.append("</div>\n");
        if (e.mark() != null && e.mark().correctLhs() != null) {
            body.append("<div class=\"eq derived\"><span class=\"tag\">derived by plumb:</span>")
                    .append(printer.displayed(e.mark().correctLhs(), "=", e.mark().correctRhs())).append("</div>\n");
        }
    }

    @Override
    public void tabulate(List<Cell> header, List<List<Cell>> rows) {
        // The wrapper scrolls sideways on a narrow screen, so a wide table never widens the page.
        body.append("<div class=\"scroll\"><table>\n<thead><tr>");
        header.forEach(h -> body.append("<th>").append(inline(h.runs())).append("</th>"));
        body.append("</tr></thead>\n<tbody>\n");
        for (List<Cell> row : rows) {
            body.append("<tr>");
            for (Cell c : row) body.append("<td>").append(inline(c.runs())).append("</td>");
            body.append("</tr>\n");
        }
        body.append("</tbody>\n</table></div>\n");
    }

    @Override
    public void bulletList(List<List<Inline>> items) {
        body.append("<ul>\n");
        items.forEach(i -> body.append("<li>").append(inline(i)).append("</li>\n"));
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
                + "th{border-bottom:2px solid #444}.holds{color:#17702a}.fails{color:#b00020;font-weight:bold}.undecided{color:#946200}.notevaluated{color:#555}\n"
                + ".eq{display:flex;align-items:center;justify-content:safe center;gap:2em;margin:0.8em 0;overflow-x:auto;overflow-y:hidden;padding:0.15em 0}.tag{color:#666}\n"
                + ".eq.fails,.eq.undecided,.eq.holds,.eq.notevaluated{color:inherit;font-weight:normal;padding-left:0.6em}.eq.fails{border-left:4px solid #b00020}"
                + ".eq.undecided{border-left:4px solid #946200}"
                + ".eq.derived{margin-top:-0.4em}.im{display:inline-block;max-width:100%;overflow-x:auto;overflow-y:hidden;"
                + "vertical-align:middle;padding:0.15em 0}\n"
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
