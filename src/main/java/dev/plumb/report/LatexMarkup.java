package dev.plumb.report;

import dev.plumb.lang.Expr;
import java.io.IOException;
import java.util.List;
import java.util.Map;

/** A standalone LaTeX article (amsmath, booktabs, pgfplots); plots as pgfplots pictures over CSV files beside it. */
public final class LatexMarkup implements Markup {
    private final StringBuilder body = new StringBuilder();
    private String title = "Derivation";

    @Override
    public void heading(int level, String text) {
        if (level == 1) {
            title = text;
            return;
        }
        body.append(level == 2 ? "\\section*{" : "\\subsection*{").append(LatexPrinter.escape(text)).append("}\n\n");
    }

    @Override
    public void paragraph(String text) {
        body.append(LatexPrinter.escape(text)).append("\n\n");
    }

    @Override
    public void equation(String label, Expr lhs, String relation, Expr rhs) {
        String rel = switch (relation) {
            case "~" -> "\\propto";
            case "\u2248" -> "\\approx";
            default -> relation;
        };
        body.append("\\begin{equation*}\n  ").append(LatexPrinter.print(lhs));
        if (rhs != null) body.append(" ").append(rel).append(" ").append(LatexPrinter.print(rhs));
        if (label != null) body.append(" \\tag{").append(LatexPrinter.escape(label)).append("}");
        body.append("\n\\end{equation*}\n\n");
    }

    @Override
    public void table(List<String> header, List<List<Cell>> rows) {
        body.append("\\begin{center}\\small\n\\begin{tabular}{").append("l".repeat(header.size())).append("}\n\\toprule\n");
        body.append(String.join(" & ", header.stream().map(LatexPrinter::escape).toList())).append(" \\\\\n\\midrule\n");
        for (List<Cell> row : rows) {
            body.append(String.join(" & ", row.stream().map(c -> c.math() != null ? "$" + LatexPrinter.print(c.math()) + "$"
                    : LatexPrinter.escape(c.text() == null ? "" : c.text())).toList())).append(" \\\\\n");
        }
        body.append("\\bottomrule\n\\end{tabular}\n\\end{center}\n\n");
    }

    @Override
    public void bullets(List<String> items) {
        body.append("\\begin{itemize}\n");
        items.forEach(i -> body.append("  \\item ").append(LatexPrinter.escape(i)).append('\n'));
        body.append("\\end{itemize}\n\n");
    }

    @Override
    public void figure(String id, String caption, Plot plot, Map<String, byte[]> files) throws IOException {
        PgfPlot.Picture p = PgfPlot.of(id, plot);
        files.put(p.dataFile(), p.data());
        body.append("\\begin{figure}[htbp]\n\\centering\n").append(p.tikz()).append("\\caption{").append(LatexPrinter.escape(caption))
                .append("}\n\\label{fig:").append(id).append("}\n\\end{figure}\n\n");
    }

    @Override
    public void footer(String text) {
        body.append("\\par\\vspace{2\\baselineskip}\\noindent\\rule{\\linewidth}{0.4pt}\\par\\noindent{\\footnotesize ")
                .append(LatexPrinter.escape(text)).append("\\par}\n\n");
    }

    @Override
    public String finish() {
        return "\\documentclass[11pt]{article}\n\\usepackage[utf8]{inputenc}\n\\usepackage{amsmath,amssymb,booktabs,graphicx}\n"
                + "\\usepackage[margin=2.5cm]{geometry}\n" + PgfPlot.PREAMBLE + "\\title{" + LatexPrinter.escape(title) + "}\n\\date{}\n"
                + "\\begin{document}\n\\maketitle\n\n" + body + "\\end{document}\n";
    }

    @Override
    public String extension() {
        return "tex";
    }
}
