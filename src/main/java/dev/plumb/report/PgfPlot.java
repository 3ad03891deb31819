package dev.plumb.report;

import java.io.IOException;
import java.io.StringWriter;
import java.math.BigDecimal;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;

/**
 * Draws a {@link Plot} for LaTeX as a pgfplots picture over a CSV data file written beside the
 * document, so the labels are set in the document's own fonts and sizes. Ticks, colours, dashes,
 * the legend above the curves and the residual panel beneath are the same as in {@link SvgPlot}.
 */
public final class PgfPlot {
    private PgfPlot() {
    }

    /** What the document's preamble needs for these pictures. */
    public static final String PREAMBLE = "\\usepackage{pgfplots}\n\\usepgfplotslibrary{groupplots}\n\\pgfplotsset{compat=1.16}\n";

    /** The picture (a {@code tikzpicture}, to be put in a figure) and its data file. */
    public record Picture(String tikz, String dataFile, byte[] data) { }

    public static Picture of(String id, Plot plot) throws IOException {
        String dataFile = id + "-plotdata.csv";
        double[] residual = plot.residual();
        if (residual != null && java.util.Arrays.stream(residual).noneMatch(Double::isFinite)) residual = null;
        Plot.Series numeric = plot.series(Plot.Kind.NUMERIC), closed = plot.series(Plot.Kind.CLOSED_FORM);
        List<double[]> xs = new ArrayList<>(), ys = new ArrayList<>();
        for (Plot.Series s : plot.series()) {
            xs.add(s.x());
            ys.add(s.y());
        }
        Ticks xt = Ticks.forData(xs.stream().flatMapToDouble(java.util.Arrays::stream).toArray(), 6, false, true);
        Ticks yt = Ticks.forData(ys.stream().flatMapToDouble(java.util.Arrays::stream).toArray(), 6, true, true);
        Ticks rt = null;
        if (residual != null) {
            double lo = 0, hi = 0;
            for (double v : residual) {
                if (!Double.isFinite(v)) continue;
                lo = Math.min(lo, v);
                hi = Math.max(hi, v);
            }
            rt = Ticks.linear(lo, hi, 3, true);
        }

        String file = "{\\plumbplotdir " + dataFile + "}";
        String table = "table[col sep=comma, comment chars={\\#}, x=x, y=";
        StringBuilder s = new StringBuilder();
        // The folder of the data files, for a document that \input-s this one from elsewhere (empty: beside it).
        s.append("\\providecommand{\\plumbplotdir}{}%\n");
        s.append("\\definecolor{plumbnumeric}{HTML}{").append(SvgPlot.NUMERIC_COLOUR.substring(1).toUpperCase(Locale.ROOT)).append("}%\n");
        s.append("\\definecolor{plumbclosed}{HTML}{").append(SvgPlot.CLOSED_COLOUR.substring(1).toUpperCase(Locale.ROOT)).append("}%\n");
        s.append("\\begin{tikzpicture}\n");
        // The tick labels are written out here (round values, the common power of ten in the axis title), so
        // pgfplots must neither scale them again nor add minor ticks of its own.
        String common = "scale only axis, width=0.74\\linewidth, unbounded coords=jump, grid=major, grid style={black!12}, "
                + "scaled ticks=false, tick align=inside, every tick label/.append style={font=\\small}, "
                + axis("x", xt, xt.log() ? "log" : null);
        String yTitle = "ylabel={" + PlotText.texAxisTitle(plot.y(), yt.power()) + "}, " + yLabelPlace(yt, rt);
        String legend = plot.series().size() >= 2
                ? "legend style={at={(1,1.02)}, anchor=south east, legend columns=-1, draw=none, fill=none, font=\\small, "
                + "/tikz/every even column/.append style={column sep=1em}}, legend cell align=left, "
                : "";
        String xTitle = "xlabel={" + PlotText.texAxisTitle(plot.x(), xt.power()) + "}";
        if (rt != null) {
            s.append("\\begin{groupplot}[group style={group size=1 by 2, vertical sep=14pt}, ").append(common).append("]\n");
            s.append("\\nextgroupplot[height=0.24\\linewidth, xticklabels={}, ").append(axis("y", yt, yt.log() ? "log" : null))
                    .append(", ").append(yTitle).append(", ").append(legend).append("]\n");
        } else {
            s.append("\\begin{axis}[").append(common).append(", height=0.3\\linewidth, ").append(axis("y", yt, yt.log() ? "log" : null))
                    .append(", ").append(yTitle).append(", ").append(legend).append(xTitle).append("]\n");
        }
        if (numeric != null) {
            s.append("\\addplot[draw=plumbnumeric, line width=1.2pt, mark=none] ").append(table).append("numeric] ").append(file).append(";\n");
            if (plot.series().size() >= 2) s.append("\\addlegendentry{").append(Plot.Kind.NUMERIC.legend).append("}\n");
        }
        if (closed != null) {
            s.append("\\addplot[draw=plumbclosed, line width=0.85pt, dash pattern=on 3.5pt off 2.5pt, mark=none] ").append(table)
                    .append(numeric != null ? "closed_form" : "numeric").append("] ").append(file).append(";\n");
            if (plot.series().size() >= 2) s.append("\\addlegendentry{").append(Plot.Kind.CLOSED_FORM.legend).append("}\n");
        }
        if (rt != null) {
            String rTitle = Plot.RESIDUAL_TITLE.replace(". ", ".\\ ") + (rt.power() != 0 ? " [$10^{" + rt.power() + "}$]" : "");
            s.append("\\nextgroupplot[height=0.1\\linewidth, ").append(axis("y", rt, null)).append(", ylabel={").append(rTitle)
                    .append("}, ").append(yLabelPlace(yt, rt)).append(", ").append(xTitle).append("]\n");
            s.append("\\addplot[black!50, line width=0.5pt, forget plot] coordinates {(").append(tex(xt.min())).append(",0) (")
                    .append(tex(xt.max())).append(",0)};\n");
            s.append("\\addplot[draw=black!80, line width=0.7pt, mark=none] ").append(table).append("residual] ").append(file).append(";\n");
            s.append("\\end{groupplot}\n");
        } else {
            s.append("\\end{axis}\n");
        }
        s.append("\\end{tikzpicture}\n");
        return new Picture(s.toString(), dataFile, data(plot, residual));
    }

    /** Limits, tick positions and their labels of one axis, as pgfplots keys. */
    private static String axis(String a, Ticks t, String mode) {
        StringBuilder s = new StringBuilder();
        if (mode != null) s.append(a).append("mode=").append(mode).append(", ");
        s.append(a).append("min=").append(tex(t.min())).append(", ").append(a).append("max=").append(tex(t.max())).append(", ");
        s.append(a).append("tick={");
        for (int i = 0; i < t.ticks().size(); i++) s.append(i > 0 ? "," : "").append(tex(t.ticks().get(i)));
        s.append("}, ").append(a).append("ticklabels={");
        for (int i = 0; i < t.labels().size(); i++) {
            Ticks.Label l = t.labels().get(i);
            s.append(i > 0 ? "," : "").append("{$").append(l.decade() == null ? l.mantissa() : "10^{" + l.decade() + "}").append("$}");
        }
        return s.append("}, minor ").append(a).append("tick={}").toString();
    }

    /** Both panels' vertical titles at the same distance from the frame, clear of the wider tick labels. */
    private static String yLabelPlace(Ticks y, Ticks r) {
        int chars = widest(y);
        if (r != null) chars = Math.max(chars, widest(r));
        double em = 0.9 + 0.55 * chars;
        // The title is turned a quarter to the left before it is shifted, so its own y points leftwards on the page.
        return String.format(Locale.ROOT, "ylabel style={at={(axis description cs:0,0.5)}, anchor=south, yshift=%.2fem}", em);
    }

    private static int widest(Ticks t) {
        int w = 0;
        for (Ticks.Label l : t.labels()) w = Math.max(w, l.decade() == null ? l.mantissa().length() : 2 + String.valueOf(l.decade()).length());
        return w;
    }

    /** A number as pgfplots reads it: the shortest decimal that gives the double back, large and small ones as 1.5e-13. */
    static String tex(double v) {
        if (v == 0) return "0";
        // Not Double.toString: before Java 19 it can give more digits than needed (8e23 prints as 7.999999999999999E23).
        BigDecimal d = null;
        for (int digits = 1; digits <= 17 && d == null; digits++) {
            BigDecimal r = new BigDecimal(v).round(new java.math.MathContext(digits));
            if (r.doubleValue() == v) d = r.stripTrailingZeros();
        }
        String digits = d.unscaledValue().abs().toString();
        int power = digits.length() - 1 - d.scale();
        if (power >= -3 && power <= 6) return d.toPlainString();
        return (d.signum() < 0 ? "-" : "") + digits.charAt(0) + (digits.length() > 1 ? "." + digits.substring(1) : "") + "e" + power;
    }

    /** The data file: x, then each curve and the residual, in the axes' units. */
    private static byte[] data(Plot plot, double[] residual) throws IOException {
        Plot.Series numeric = plot.series(Plot.Kind.NUMERIC), closed = plot.series(Plot.Kind.CLOSED_FORM);
        Plot.Series first = numeric != null ? numeric : closed;
        List<String> header = new ArrayList<>(List.of("x", "numeric"));
        if (numeric != null && closed != null) header.add("closed_form");
        if (residual != null) header.add("residual");
        StringWriter out = new StringWriter();
        CSVFormat format = CSVFormat.RFC4180.builder().setCommentMarker('#').setRecordSeparator('\n')
                .setHeader(header.toArray(String[]::new)).setHeaderComments(
                        "x: " + plain(plot.x()) + "; " + (numeric != null ? "numeric" : "closed form") + " y: " + plain(plot.y())
                                + (residual != null ? "; residual: (numeric - closed form) / max|closed form|" : ""))
                .build();
        try (CSVPrinter csv = new CSVPrinter(out, format)) {
            double[] x = first.x(), y = first.y(), c = numeric != null && closed != null ? closed.y() : null;
            for (int i = 0; i < x.length; i++) {
                List<String> row = new ArrayList<>(List.of(num(x[i]), num(y[i])));
                if (c != null) row.add(num(c[i]));
                if (residual != null) row.add(num(residual[i]));
                csv.printRecord(row);
            }
        }
        return out.toString().getBytes(StandardCharsets.UTF_8);
    }

    private static String plain(Plot.Axis a) {
        return a.quantity() + (a.dimensionless() ? "" : " [" + a.unit() + "]");
    }

    private static String num(double v) {
        return Double.isFinite(v) ? String.format(Locale.ROOT, "%.10e", v) : "nan";
    }
}
