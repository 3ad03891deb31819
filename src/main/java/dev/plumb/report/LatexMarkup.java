package dev.plumb.report;

import dev.plumb.lang.ExprPrinter;
import dev.plumb.model.Status;
import java.io.IOException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * A standalone LaTeX article for pdfLaTeX (T1 fonts, amsmath, siunitx for units, xltabular for
 * tables that wrap and break across pages, pgfplots over CSV files beside it for plots), and the
 * same body without a preamble for a thesis to {@code \input} ({@link #companions}). Every labelled
 * statement is a numbered equation with a {@code \label} made from the file's name and its label.
 */
public final class LatexMarkup implements Markup {
    /** The preamble lines the body needs, in the order a document loads them; the body's top comment lists them. */
    static final List<String> PACKAGES = List.of("\\usepackage[T1]{fontenc}", "\\usepackage{amsmath,amssymb}",
            "\\usepackage{array,booktabs,xltabular}", "\\usepackage{graphicx,xcolor}", "\\usepackage{siunitx}", "\\usepackage{pgfplots}",
            "\\usepgfplotslibrary{groupplots}", "\\pgfplotsset{compat=1.16}");
    /** Inline formulas longer than this (in plumb's notation) are put in a box that shrinks to the line when wider. */
    private static final int LONG_INLINE = 30;

    /** The standalone document's body and the fragment's: the same but for the level of the headings. */
    private final StringBuilder body = new StringBuilder();
    private final StringBuilder fragment = new StringBuilder();
    private String title = "Derivation";
    private String name = "plumb";
    private LatexPrinter printer = LatexPrinter.with(Map.of(), true);

    @Override
    public void begin(String file, Map<String, String> forms) {
        this.name = file;
        this.printer = LatexPrinter.with(forms, true);
    }

    private void put(String s) {
        body.append(s);
        fragment.append(s);
    }

    @Override
    public void heading(int level, String text) {
        // Headings are set ragged right: a long title with a hyphenated name would otherwise run into the margin.
        String t = "\\raggedright " + LatexPrinter.escape(text);
        if (level == 1) {
            title = text;
            fragment.append("\\section*{").append(t).append("}\n\n");
            return;
        }
        body.append(level == 2 ? "\\section*{" : "\\subsection*{").append(t).append("}\n\n");
        fragment.append(level == 2 ? "\\subsection*{" : "\\subsubsection*{").append(t).append("}\n\n");
    }

    @Override
    public void paragraph(List<Inline> runs) {
        put(inline(runs) + "\n\n");
    }

    /** Running text as LaTeX: the one place where text is escaped. */
    String inline(List<Inline> runs) {
        StringBuilder out = new StringBuilder();
        Inline previous = null;
        for (Inline i : runs) {
            boolean afterNumber = previous instanceof Inline.Number;
            previous = i;
            if (i instanceof Inline.Text t) {
                // A path or a unit such as Pa/m may break after its slash, so that a long file name fits a narrow column.
                out.append(LatexPrinter.escape(t.text()).replace("/", "/\\allowbreak{}"));
            } else if (i instanceof Inline.Math m) {
                String math = "$" + printer.render(m.lhs()) + (m.rhs() == null ? "" : " " + relation(m.relation()) + " " + printer.render(m.rhs()))
                        + "$";
                // A long formula cannot break across lines (fractions and brackets hold it together): it starts a line
                // of its own and is shrunk to fit the line when wider. Only a wrapping cell or a paragraph holds one.
                if (Markup.Cell.of(m).length() <= LONG_INLINE) out.append(math);
                else out.append(out.length() > 0 ? "\\newline " : "").append("\\plumbfit{").append(math).append('}');
            } else if (i instanceof Inline.Number n) {
                out.append(number(n.text()));
            } else if (i instanceof Inline.Unit u) {
                String unit = LatexPrinter.siUnit(u.unit());
                if (!unit.isEmpty()) out.append(afterNumber ? "\\," : "").append('$').append(unit).append('$');
            } else if (i instanceof Inline.Verdict v) {
                out.append(verdict(v.status()));
            }
        }
        return out.toString();
    }

    /** A number with siunitx, so that a minus is a minus and an exponent a power of ten; anything else as text. */
    private static String number(String text) {
        String t = text.strip();
        if (t.matches("[-+]?[0-9]*\\.?[0-9]+([eE][-+]?[0-9]+)?")) return "\\num[group-digits=none]{" + t + "}";
        return LatexPrinter.escape(t);
    }

    private static String verdict(Status s) {
        return "\\textcolor{plumb" + s.name().toLowerCase(Locale.ROOT).replace("_", "") + "}{\\textbf{" + s.word() + "}}";
    }

    private static String relation(String r) {
        if (r == null) return "=";
        return switch (r) {
            case "~" -> "\\propto";
            case "\u2248" -> "\\approx";
            default -> r;
        };
    }

    @Override
    public void equation(Equation e) {
        String math = printer.render(e.lhs()) + (e.rhs() == null ? "" : " " + relation(e.relation()) + " " + printer.render(e.rhs()));
        String note = "";
        if (e.label() != null || e.note() != null) {
            note = "\\textit{" + LatexPrinter.escape(e.label() != null ? e.label() : e.note()) + "}";
        }
        if (e.mark() != null) note += (note.isEmpty() ? "" : ": ") + verdict(e.mark().status());
        boolean numbered = e.label() != null;
        put("\\begin{" + (numbered ? "equation" : "equation*") + "}");
        if (numbered) put("\\label{" + label(e.label()) + "}");
        int length = ExprPrinter.print(e.lhs()).length() + (e.rhs() == null ? 0 : ExprPrinter.print(e.rhs()).length());
        if (note.isEmpty()) {
            put("\n  " + fit(math));
        } else if (length < 48) {
            put("\n  " + fit(math + " \\qquad \\text{\\small " + note + "}"));
        } else {
            // A long equation takes its note on a line of its own beneath, so that neither runs into the margin.
            put("\n  " + fit("\\begin{gathered}" + math + "\\\\ \\text{\\small " + note + "}\\end{gathered}"));
        }
        put("\n\\end{" + (numbered ? "equation" : "equation*") + "}\n");
        if (e.mark() != null && e.mark().correctLhs() != null) {
            put("\\begin{equation*}\n  " + fit("\\text{\\small derived by plumb:}\\quad " + printer.render(e.mark().correctLhs()) + " = "
                    + printer.render(e.mark().correctRhs())) + "\n\\end{equation*}\n");
        }
        put("\n");
    }

    /**
     * The {@code \label} of a statement: the file's name and the label, with every character beyond
     * ASCII letters, digits and {@code - .} written as {@code -u} and its code, so that any label is
     * safe for LaTeX and two reports in one thesis do not clash.
     */
    String label(String statement) {
        return safe(name) + ":" + safe(statement);
    }

    /**
     * Displayed mathematics in a box that shrinks to the line, less room for the equation number, when
     * it is wider: plumb's closed forms can be far wider than a page, and TeX cannot break a display.
     */
    private static String fit(String math) {
        return "\\plumbfit[\\dimexpr\\linewidth-4em\\relax]{$\\displaystyle " + math + "$}";
    }

    static String safe(String s) {
        StringBuilder out = new StringBuilder();
        s.codePoints().forEach(c -> {
            if (c < 0x80 && (Character.isLetterOrDigit(c) || c == '-' || c == '.' || c == '_')) out.appendCodePoint(c);
            else out.append("-u").append(Integer.toHexString(c).toUpperCase(Locale.ROOT));
        });
        return out.toString();
    }

    @Override
    public void tabulate(List<Cell> header, List<List<Cell>> rows) {
        int n = header.size();
        int[] widest = new int[n];
        int[] unbreakable = new int[n];
        for (List<Cell> row : concat(header, rows)) {
            for (int k = 0; k < n && k < row.size(); k++) {
                widest[k] = Math.max(widest[k], row.get(k).length());
                unbreakable[k] = Math.max(unbreakable[k], longestPiece(row.get(k)));
            }
        }
        // A column wraps (X) when it holds text that can break and is more than a few words wide; a column of
        // numbers, short words or one long name keeps its natural width, since wrapping could not narrow it.
        // xltabular needs one X column: when none qualifies, the widest breakable column (or the widest) wraps.
        boolean[] wraps = new boolean[n];
        int widestBreakable = -1;
        int widestColumn = 0;
        for (int k = 0; k < n; k++) {
            boolean breakable = widest[k] > unbreakable[k];
            wraps[k] = breakable && widest[k] > 14;
            if (breakable && (widestBreakable < 0 || widest[k] > widest[widestBreakable])) widestBreakable = k;
            if (widest[k] > widest[widestColumn]) widestColumn = k;
        }
        if (count(wraps) == 0) wraps[widestBreakable >= 0 ? widestBreakable : widestColumn] = true;
        StringBuilder spec = new StringBuilder("@{}");
        // Wrapping columns share the width by what they hold: at least their longest unbreakable piece, at most 40 characters.
        double[] weight = new double[n];
        double total = 0;
        for (int k = 0; k < n; k++) {
            if (!wraps[k]) continue;
            weight[k] = Math.max(unbreakable[k], Math.min(widest[k], 40)) + 2;
            total += weight[k];
        }
        int wrapping = count(wraps);
        for (int k = 0; k < n; k++) {
            if (!wraps[k]) {
                spec.append('l');
                continue;
            }
            String share = String.format(Locale.ROOT, "%.3f", wrapping * weight[k] / total);
            spec.append(">{\\raggedright\\arraybackslash\\hsize=").append(share).append("\\hsize\\linewidth=\\hsize}X");
        }
        spec.append("@{}");
        StringBuilder t = new StringBuilder(n >= 6 ? "{\\footnotesize\\setlength{\\tabcolsep}{4pt}" : "{\\small").append("\n\\begin{xltabular}{\\linewidth}{").append(spec).append("}\n\\toprule\n");
        t.append(row(header)).append("\\midrule\n\\endhead\n");
        for (List<Cell> r : rows) t.append(row(r));
        t.append("\\bottomrule\n\\end{xltabular}}\n\n");
        put(t.toString());
    }

    /** The longest run of a cell's text that cannot break across lines (a word, a number, a short formula). */
    private static int longestPiece(Cell c) {
        int longest = 0;
        for (Inline i : c.runs()) {
            if (i instanceof Inline.Text t) {
                for (String w : t.text().split(" ")) longest = Math.max(longest, w.length());
            } else {
                int n = Cell.of(i).length();
                // A long formula shrinks to the column (plumbfit), so it does not hold the column wide.
                longest = Math.max(longest, i instanceof Inline.Math && n > LONG_INLINE ? 10 : n);
            }
        }
        return longest;
    }

    private static int count(boolean[] b) {
        int c = 0;
        for (boolean x : b) if (x) c++;
        return c;
    }

    private static List<List<Cell>> concat(List<Cell> header, List<List<Cell>> rows) {
        List<List<Cell>> all = new ArrayList<>();
        all.add(header);
        all.addAll(rows);
        return all;
    }

    private String row(List<Cell> cells) {
        return String.join(" & ", cells.stream().map(c -> inline(c.runs())).toList()) + " \\\\\n";
    }

    @Override
    public void bulletList(List<List<Inline>> items) {
        StringBuilder t = new StringBuilder("\\begin{itemize}\n");
        items.forEach(i -> t.append("  \\item ").append(inline(i)).append('\n'));
        put(t.append("\\end{itemize}\n\n").toString());
    }

    @Override
    public void figure(String id, String caption, Plot plot, Map<String, byte[]> files) throws IOException {
        PgfPlot.Picture p = PgfPlot.of(id, plot);
        files.put(p.dataFile(), p.data());
        put("\\begin{figure}[htbp]\n\\centering\n" + p.tikz() + "\\caption{" + LatexPrinter.escape(caption) + "}\n\\label{"
                + label("fig-" + id) + "}\n\\end{figure}\n\n");
    }

    @Override
    public void footer(String text) {
        put("\\par\\vspace{2\\baselineskip}\\noindent\\rule{\\linewidth}{0.4pt}\\par\\noindent{\\footnotesize "
                + LatexPrinter.escape(text) + "\\par}\n\n");
    }

    /**
     * The body is a group, so that what it sets stays in it when a thesis inputs it: some emergency
     * stretch, with which TeX breaks a paragraph holding a long file name or formula rather than let
     * a line run into the margin.
     */
    private static final String OPEN = "\\begingroup\\setlength{\\emergencystretch}{3em}%\n";
    private static final String CLOSE = "\\endgroup\n";

    /**
     * Defined in the body, so that the fragment brings them along: the colours of the verdicts, and
     * {@code \\plumbfit[WIDTH]{TEXT}}, TEXT as it is or shrunk to WIDTH (the line) when wider.
     */
    private static final String COLOURS = "\\definecolor{plumbholds}{HTML}{17702A}\\definecolor{plumbfails}{HTML}{B00020}"
            + "\\definecolor{plumbundecided}{HTML}{946200}\\definecolor{plumbnotevaluated}{HTML}{555555}%\n"
            + "\\ifdefined\\plumbbox\\else\\newsavebox{\\plumbbox}\\newlength{\\plumbwidth}\\fi\n"
            + "\\providecommand{\\plumbfit}[2][\\linewidth]{\\setlength{\\plumbwidth}{#1}\\sbox{\\plumbbox}{#2}%\n"
            + "  \\ifdim\\wd\\plumbbox>\\plumbwidth\\resizebox{\\plumbwidth}{!}{\\usebox{\\plumbbox}}\\else\\usebox{\\plumbbox}\\fi}\n";

    @Override
    public String finish() {
        return "\\documentclass[11pt]{article}\n" + String.join("\n", PACKAGES.subList(0, 1)) + "\n\\usepackage[utf8]{inputenc}\n"
                + "\\usepackage{lmodern}\n" + String.join("\n", PACKAGES.subList(1, PACKAGES.size())) + "\n"
                + "\\usepackage[margin=2.5cm]{geometry}\n\\title{" + LatexPrinter.escape(title) + "}\n\\date{}\n"
                + "\\begin{document}\n\\maketitle\n" + OPEN + COLOURS + "\n" + body + CLOSE + "\\end{document}\n";
    }

    @Override
    public Map<String, String> companions(String base) {
        StringBuilder top = new StringBuilder("% The body of the plumb report '").append(base).append(".tex', without a preamble, for\n")
                .append("% \\input{").append(base).append("-body} in a larger document. That document's preamble needs:\n");
        PACKAGES.forEach(p -> top.append("%   ").append(p).append('\n'));
        top.append("% Plot data files are read from \\plumbplotdir (empty: the current folder); define it first to read them\n")
                .append("% from elsewhere, e.g. \\newcommand{\\plumbplotdir}{reports/}. Equations are labelled NAME:LABEL,\n")
                .append("% e.g. \\eqref{").append(label("balance")).append("}.\n");
        return Map.of(base + "-body.tex", top + OPEN + COLOURS + "\n" + fragment + CLOSE);
    }

    @Override
    public String extension() {
        return "tex";
    }
}
