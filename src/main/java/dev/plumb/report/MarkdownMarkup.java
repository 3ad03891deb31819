package dev.plumb.report;

import dev.plumb.lang.Expr;
import dev.plumb.lang.ExprPrinter;
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

    @Override
    public void heading(int level, String text) {
        out.append("#".repeat(level)).append(' ').append(escape(text, true)).append("\n\n");
    }

    @Override
    public void paragraph(String text) {
        out.append(text(text)).append("\n\n");
    }

    @Override
    public void equation(String label, Expr lhs, String relation, Expr rhs) {
        String rel = switch (relation) {
            case "~" -> "\\propto";
            case "≈" -> "\\approx";
            default -> relation;
        };
        StringBuilder tex = new StringBuilder();
        tex.append("% plumb: ").append(oneLine(ExprPrinter.print(lhs) + (rhs == null ? "" : " " + relation + " " + ExprPrinter.print(rhs))))
                .append('\n');
        tex.append(LatexPrinter.print(lhs)).append(rhs == null ? "" : " " + rel + " " + LatexPrinter.print(rhs));
        if (label != null) tex.append(" \\qquad \\text{(").append(label.replace("_", "\\_")).append(")}");
        out.append(displayMath(tex.toString())).append('\n');
    }

    @Override
    public void table(List<String> header, List<List<Cell>> rows) {
        out.append('|');
        header.forEach(h -> out.append(' ').append(text(h)).append(" |"));
        out.append("\n|");
        header.forEach(h -> out.append("---|"));
        out.append('\n');
        for (List<Cell> row : rows) {
            out.append('|');
            for (Cell c : row) {
                // GitHub's tables split a row at every '|' not escaped, inside code spans too (where the
                // table, not the code span, takes the backslash away again).
                out.append(' ').append(c.math() != null ? inlineMath(LatexPrinter.print(c.math())).replace("|", "\\|") : text(c.text()))
                        .append(" |");
            }
            out.append('\n');
        }
        out.append('\n');
    }

    @Override
    public void bullets(List<String> items) {
        items.forEach(i -> out.append("- ").append(text(i)).append('\n'));
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
