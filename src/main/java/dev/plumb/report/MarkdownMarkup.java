package dev.plumb.report;

import dev.plumb.lang.ExprPrinter;
import dev.plumb.model.Status;
import java.util.List;
import java.util.Map;

/**
 * CommonMark with GitHub's tables; plots as SVG files. Text is escaped here and only here
 * ({@link #text}), so that any CommonMark renderer shows it as written: no emphasis out of the
 * {@code *} of a formula, no HTML, links, headings or lists out of what a message happens to hold.
 * Mathematics is LaTeX inside code, which CommonMark shows as written and GitHub and GitLab
 * typeset: {@code $`...`$} inline ({@link #inlineMath}) and a {@code math} fenced block for a
 * displayed equation, which also carries the equation as plumb reads it in a TeX comment.
 */
public final class MarkdownMarkup implements Markup {
    private final StringBuilder out = new StringBuilder();
    private LatexPrinter printer = LatexPrinter.with(Map.of(), false);

    @Override
    public void heading(int level, String text) {
        out.append("#".repeat(level)).append(' ').append(escape(text, true)).append("\n\n");
    }

    @Override
    public void begin(String file, Map<String, String> forms) {
        printer = LatexPrinter.with(forms, false);
    }

    @Override
    public void paragraph(List<Inline> runs) {
        out.append(inline(runs, false)).append("\n\n");
    }

    /**
     * Running text as Markdown, mathematics as LaTeX between dollars: the one place where text is
     * escaped. In a table, a bar inside mathematics is escaped for the table (which, not the code
     * span, takes the backslash away again: GitHub splits a row at every bar not escaped).
     */
    String inline(List<Inline> runs, boolean inTable) {
        StringBuilder b = new StringBuilder();
        for (int k = 0; k < runs.size(); k++) {
            Inline i = runs.get(k);
            boolean afterNumber = k > 0 && runs.get(k - 1) instanceof Inline.Number;
            String math = null;
            if (i instanceof Inline.Text t) {
                // Blanks at the edges of a run stay: they part it from the mathematics beside it.
                String s = t.text();
                String lead = k > 0 && s.startsWith(" ") ? " " : "";
                String trail = k + 1 < runs.size() && s.endsWith(" ") ? " " : "";
                b.append(lead).append(text(s)).append(s.isBlank() ? "" : trail);
            } else if (i instanceof Inline.Math m) {
                math = printer.render(m.lhs()) + (m.rhs() == null ? "" : " " + relation(m.relation()) + " " + printer.render(m.rhs()));
            } else if (i instanceof Inline.Number n) {
                math = n.text().strip().matches("[-+]?[0-9]*\\.?[0-9]+([eE][-+]?[0-9]+)?") ? LatexPrinter.number(n.text().strip()) : null;
                if (math == null) b.append(text(n.text()));
            } else if (i instanceof Inline.Unit u) {
                String unit = LatexPrinter.unit(u.unit());
                if (!u.unit().strip().equals("1")) {
                    math = unit.substring("\\,".length());
                    if (afterNumber) b.append(' ');
                }
            } else if (i instanceof Inline.Verdict v) {
                b.append(verdict(v.status()));
            }
            if (math != null) b.append(inTable ? inlineMath(math).replace("|", "\\|") : inlineMath(math));
        }
        return b.toString();
    }

    /** A verdict as a sign and its word (Markdown has no colour of its own). */
    private static String verdict(Status s) {
        return switch (s) {
            case HOLDS -> "✓ holds";
            case FAILS -> "✗ fails";
            case UNDECIDED -> "? undecided";
            case NOT_EVALUATED -> "not evaluated";
        };
    }

    /** The same verdict inside displayed mathematics, in colour as well, for the renderers that typeset it. */
    private static String verdictTex(Status s) {
        String colour = switch (s) {
            case HOLDS -> "green";
            case FAILS -> "red";
            case UNDECIDED -> "orange";
            case NOT_EVALUATED -> "gray";
        };
        return "\\textcolor{" + colour + "}{\\text{" + verdict(s).replace("✓", "").replace("✗", "").replace("?", "").strip() + "}}";
    }

    private static String relation(String r) {
        if (r == null) return "=";
        return switch (r) {
            case "~" -> "\\propto";
            case "≈" -> "\\approx";
            default -> r;
        };
    }

    @Override
    public void equation(Equation e) {
        StringBuilder tex = new StringBuilder();
        tex.append("% plumb: ").append(oneLine(ExprPrinter.print(e.lhs()) + (e.rhs() == null ? "" : " " + e.relation() + " "
                + ExprPrinter.print(e.rhs())))).append('\n');
        tex.append(printer.render(e.lhs())).append(e.rhs() == null ? "" : " " + relation(e.relation()) + " " + printer.render(e.rhs()));
        String tag = e.label() != null ? e.label() : e.note();
        if (tag != null || e.mark() != null) {
            tex.append(" \\qquad ");
            if (tag != null) tex.append("\\text{(").append(tag.replace("_", "\\_")).append(")}");
            if (e.mark() != null) tex.append("\\; ").append(verdictTex(e.mark().status()));
        }
        out.append(displayMath(tex.toString())).append('\n');
        if (e.mark() != null && e.mark().status() != Status.HOLDS) {
            // The verdict in words too, for a reader of the plain text or a renderer without mathematics.
            out.append(text((tag == null ? "The equation above " : tag + ": ") + verdict(e.mark().status()))).append("\n\n");
        }
        if (e.mark() != null && e.mark().correctLhs() != null) {
            String lhs = ExprPrinter.print(e.mark().correctLhs()), rhs = ExprPrinter.print(e.mark().correctRhs());
            out.append(displayMath("% plumb: " + oneLine(lhs + " = " + rhs) + "\n\\text{derived by plumb:}\\quad "
                    + printer.render(e.mark().correctLhs()) + " = " + printer.render(e.mark().correctRhs()))).append('\n');
        }
    }

    @Override
    public void tabulate(List<Cell> header, List<List<Cell>> rows) {
        out.append('|');
        header.forEach(h -> out.append(' ').append(inline(h.runs(), true)).append(" |"));
        out.append("\n|");
        header.forEach(h -> out.append("---|"));
        out.append('\n');
        for (List<Cell> row : rows) {
            out.append('|');
            for (Cell c : row) out.append(' ').append(inline(c.runs(), true)).append(" |");
            out.append('\n');
        }
        out.append('\n');
    }

    @Override
    public void bulletList(List<List<Inline>> items) {
        items.forEach(i -> out.append("- ").append(inline(i, false)).append('\n'));
        out.append('\n');
    }

    @Override
    public void figure(String id, String caption, Plot plot, Map<String, byte[]> files) {
        String file = id + ".svg";
        files.put(file, SvgPlot.file(plot).getBytes(java.nio.charset.StandardCharsets.UTF_8));
        out.append("![").append(text(caption)).append("](").append(destination(file)).append(")\n\n");
    }

    @Override
    public void footer(String text) {
        out.append(text(text)).append("\n\n");
    }

    @Override
    public String finish() {
        return out.toString();
    }

    @Override
    public String extension() {
        return "md";
    }

    /**
     * Text that CommonMark renders exactly as given (line breaks become spaces, and leading or trailing
     * blanks go, as a renderer would drop them anyway). Escaped: {@code \ ` * < $ ~ |} wherever they
     * stand; {@code &} before a letter, digit or {@code #} (a character reference); {@code ]} before
     * {@code ( [ :} (a link); {@code _} unless it stands between two letters or digits (where it can
     * neither open nor close emphasis); at the start, what would open a block ({@code # > [}, a
     * {@code -} or {@code +} list marker or rule, a number followed by {@code .} or {@code )} and a
     * blank). A backslash before {@code |} is written {@code &#92;}, since a table takes {@code \|}
     * as an escaped bar even after another backslash. {@code $} and {@code ~} mean nothing to
     * CommonMark, but GitHub reads them as mathematics and strike-through. The rest is left as it
     * is, so the Markdown reads as plainly as its rendering ({@code sun_value}, {@code P(0) [GPa]}).
     */
    public static String text(String s) {
        return escape(s, false);
    }

    /** {@link #text}; in a heading every {@code #} is escaped, since a closing run of them would be dropped. */
    private static String escape(String s, boolean heading) {
        if (s == null) return "";
        String t = oneLine(s).strip();
        StringBuilder b = new StringBuilder(t.length() + 16);
        for (int i = 0; i < t.length(); i++) {
            char c = t.charAt(i);
            char prev = i > 0 ? t.charAt(i - 1) : ' ';
            char next = i + 1 < t.length() ? t.charAt(i + 1) : ' ';
            if (c == '\\' && next == '|') {
                // A table takes '\|' for an escaped '|' even after a backslash: this one goes as a character reference.
                b.append("&#92;");
                continue;
            }
            boolean escape = switch (c) {
                case '\\', '`', '*', '<', '$', '~', '|' -> true;
                case '_' -> !(Character.isLetterOrDigit(prev) && Character.isLetterOrDigit(next));
                case '&' -> Character.isLetterOrDigit(next) || next == '#';
                case ']' -> next == '(' || next == '[' || next == ':';
                case '#' -> heading || i == 0;
                case '>', '[' -> i == 0;
                case '-', '+' -> i == 0 && (next == ' ' || next == '\t' || next == c || i + 1 == t.length());
                case '.', ')' -> i > 0 && listNumber(t, i) && (next == ' ' || next == '\t' || i + 1 == t.length());
                default -> false;
            };
            if (escape) b.append('\\');
            b.append(c);
        }
        return b.toString();
    }

    /** Whether {@code t} up to {@code i} is one to nine digits, so that {@code .} or {@code )} there would start an ordered list. */
    private static boolean listNumber(String t, int i) {
        if (i > 9) return false;
        for (int k = 0; k < i; k++) {
            if (t.charAt(k) < '0' || t.charAt(k) > '9') return false;
        }
        return true;
    }

    /** A link destination: as it is, or in pointy brackets when it holds a blank, a bracket or a parenthesis. */
    private static String destination(String file) {
        if (!file.matches(".*[\\s()<>\\\\].*")) return file;
        return "<" + file.replace("\\", "\\\\").replace("<", "\\<").replace(">", "\\>") + ">";
    }

    /** LaTeX as inline mathematics: {@code $`...`$}, a code span between dollars. */
    public static String inlineMath(String latex) {
        return "$" + code(oneLine(latex)) + "$";
    }

    /** A code span holding {@code s} exactly: fenced by more backticks than any run inside, padded when it starts or ends with one. */
    static String code(String s) {
        String fence = "`".repeat(longestRun(s, '`') + 1);
        boolean pad = s.startsWith("`") || s.endsWith("`") || (s.startsWith(" ") && s.endsWith(" ") && !s.isBlank());
        return fence + (pad ? " " + s + " " : s) + fence;
    }

    /** LaTeX (lines of it) as a displayed equation: a fenced block of kind {@code math}, ended by a blank line. */
    static String displayMath(String latex) {
        String fence = "`".repeat(Math.max(3, longestRun(latex, '`') + 1));
        return fence + "math\n" + latex.strip() + "\n" + fence + "\n";
    }

    private static int longestRun(String s, char c) {
        int best = 0;
        int run = 0;
        for (int i = 0; i < s.length(); i++) {
            run = s.charAt(i) == c ? run + 1 : 0;
            best = Math.max(best, run);
        }
        return best;
    }

    private static String oneLine(String s) {
        return s.replace("\r\n", " ").replace('\r', ' ').replace('\n', ' ');
    }
}
