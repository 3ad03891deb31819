package dev.plumb.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * Draws a {@link Plot} as SVG written by hand: every label a real {@code <text>} element (searchable,
 * selectable, in the page's own font), the curves as polylines, no ids, so the bytes depend on the
 * data alone. The legend sits above the plotting area, never on the data; the residual panel, when
 * there is one, sits beneath the curves and shares their horizontal axis.
 */
public final class SvgPlot {
    private SvgPlot() {
    }

    static final String FONT = "Georgia, 'DejaVu Serif', serif";
    static final String NUMERIC_COLOUR = "#1f5fa8";
    static final String CLOSED_COLOUR = "#d4541a";
    static final String RESIDUAL_COLOUR = "#333333";

    private static final int WIDTH = 640;
    private static final int MAIN_HEIGHT = 300;
    private static final int RESIDUAL_HEIGHT = 100;
    private static final int GAP = 18;
    private static final double TICK_FONT = 13;
    private static final double TITLE_FONT = 14;
    private static final int RIGHT = 22;

    /** A standalone SVG file (for Markdown reports), with its XML declaration. */
    public static String file(Plot plot) {
        return "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n" + element(plot);
    }

    /** The {@code <svg>} element alone, to be put inline in an HTML page. */
    public static String element(Plot plot) {
        return new Drawing(plot).draw();
    }

    private static final class Drawing {
        final Plot plot;
        final double[] residual;
        final Ticks xt, yt, rt;
        final boolean legend;
        final double left, top, plotWidth, height;
        final StringBuilder out = new StringBuilder();

        Drawing(Plot plot) {
            this.plot = plot;
            double[] r = plot.residual();
            this.residual = r != null && java.util.Arrays.stream(r).anyMatch(Double::isFinite) ? r : null;
            List<double[]> xs = new ArrayList<>(), ys = new ArrayList<>();
            for (Plot.Series s : plot.series()) {
                xs.add(s.x());
                ys.add(s.y());
            }
            this.xt = Ticks.forData(concat(xs), 6, false, true);
            this.yt = Ticks.forData(concat(ys), 6, true, true);
            if (residual != null) {
                double lo = 0, hi = 0;
                for (double v : residual) {
                    if (!Double.isFinite(v)) continue;
                    lo = Math.min(lo, v);
                    hi = Math.max(hi, v);
                }
                this.rt = Ticks.linear(lo, hi, 3, true);
            } else {
                this.rt = null;
            }
            this.legend = plot.series().size() >= 2;
            double labels = width(yt.labels());
            if (rt != null) labels = Math.max(labels, width(rt.labels()));
            // The residual's title takes a second column for its power of ten: one line would not fit the short panel.
            int columns = rt != null && rt.power() != 0 ? 2 : 1;
            this.left = Math.ceil(12 + columns * (TITLE_FONT + 4) + 6 + labels + 8);
            this.top = legend ? 34 : 14;
            this.plotWidth = WIDTH - left - RIGHT;
            this.height = top + MAIN_HEIGHT + (residual != null ? GAP + RESIDUAL_HEIGHT : 0) + 8 + TICK_FONT + 10 + TITLE_FONT + 10;
        }

        String draw() {
            out.append("<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"").append(WIDTH).append("\" height=\"").append(n(height))
                    .append("\" viewBox=\"0 0 ").append(WIDTH).append(' ').append(n(height)).append("\" font-family=\"").append(FONT)
                    .append("\" font-size=\"").append(n(TICK_FONT)).append("\" role=\"img\">\n");
            out.append("<rect width=\"100%\" height=\"100%\" fill=\"#ffffff\"/>\n");
            double mainBottom = top + MAIN_HEIGHT;
            panel(yt, top, MAIN_HEIGHT, residual == null);
            for (Plot.Series s : plot.series()) curve(s.x(), s.y(), yt, top, MAIN_HEIGHT, s.kind());
            verticalTitle(PlotText.axisTitle(plot.y(), yt.power()), top + MAIN_HEIGHT / 2.0, 0);
            double bottom = mainBottom;
            if (residual != null) {
                double rTop = mainBottom + GAP;
                panel(rt, rTop, RESIDUAL_HEIGHT, true);
                double zero = yPixel(rt, 0, rTop, RESIDUAL_HEIGHT);
                out.append("<line x1=\"").append(n(left)).append("\" y1=\"").append(n(zero)).append("\" x2=\"").append(n(left + plotWidth))
                        .append("\" y2=\"").append(n(zero)).append("\" stroke=\"#999999\" stroke-width=\"1\"/>\n");
                curve(plot.series(Plot.Kind.NUMERIC).x(), residual, rt, rTop, RESIDUAL_HEIGHT, null);
                verticalTitle(List.of(PlotText.Run.plain(Plot.RESIDUAL_TITLE)), rTop + RESIDUAL_HEIGHT / 2.0, 0);
                if (rt.power() != 0) {
                    verticalTitle(List.of(PlotText.Run.plain("[10"), new PlotText.Run(PlotText.minus(Integer.toString(rt.power())), false,
                            PlotText.Shift.SUPER), PlotText.Run.plain("]")), rTop + RESIDUAL_HEIGHT / 2.0, 1);
                }
                bottom = rTop + RESIDUAL_HEIGHT;
            }
            double labelsBaseline = bottom + 8 + TICK_FONT;
            for (int i = 0; i < xt.ticks().size(); i++) {
                double x = xPixel(xt.ticks().get(i));
                out.append("<text x=\"").append(n(x)).append("\" y=\"").append(n(labelsBaseline)).append("\" text-anchor=\"middle\">")
                        .append(label(xt.labels().get(i))).append("</text>\n");
            }
            out.append("<text x=\"").append(n(left + plotWidth / 2)).append("\" y=\"").append(n(labelsBaseline + 10 + TITLE_FONT))
                    .append("\" text-anchor=\"middle\" font-size=\"").append(n(TITLE_FONT)).append("\">")
                    .append(runs(PlotText.axisTitle(plot.x(), xt.power()), TITLE_FONT)).append("</text>\n");
            if (legend) legend();
            return out.append("</svg>\n").toString();
        }

        /** Grid, frame, ticks and tick labels of one panel; horizontal ticks are shared by all panels. */
        private void panel(Ticks y, double panelTop, double panelHeight, boolean lowest) {
            out.append("<g stroke=\"#e3e3e3\" stroke-width=\"1\">");
            for (double v : xt.ticks()) {
                double x = xPixel(v);
                out.append("<line x1=\"").append(n(x)).append("\" y1=\"").append(n(panelTop)).append("\" x2=\"").append(n(x))
                        .append("\" y2=\"").append(n(panelTop + panelHeight)).append("\"/>");
            }
            for (double v : y.ticks()) {
                double py = yPixel(y, v, panelTop, panelHeight);
                out.append("<line x1=\"").append(n(left)).append("\" y1=\"").append(n(py)).append("\" x2=\"").append(n(left + plotWidth))
                        .append("\" y2=\"").append(n(py)).append("\"/>");
            }
            out.append("</g>\n<g stroke=\"#444444\" stroke-width=\"1\">");
            for (double v : xt.ticks()) {
                double x = xPixel(v);
                out.append("<line x1=\"").append(n(x)).append("\" y1=\"").append(n(panelTop + panelHeight)).append("\" x2=\"").append(n(x))
                        .append("\" y2=\"").append(n(panelTop + panelHeight - 5)).append("\"/>");
            }
            for (double v : y.ticks()) {
                double py = yPixel(y, v, panelTop, panelHeight);
                out.append("<line x1=\"").append(n(left)).append("\" y1=\"").append(n(py)).append("\" x2=\"").append(n(left + 5))
                        .append("\" y2=\"").append(n(py)).append("\"/>");
            }
            out.append("</g>\n<rect x=\"").append(n(left)).append("\" y=\"").append(n(panelTop)).append("\" width=\"").append(n(plotWidth))
                    .append("\" height=\"").append(n(panelHeight)).append("\" fill=\"none\" stroke=\"#444444\" stroke-width=\"1\"/>\n");
            for (int i = 0; i < y.ticks().size(); i++) {
                double py = yPixel(y, y.ticks().get(i), panelTop, panelHeight);
                out.append("<text x=\"").append(n(left - 6)).append("\" y=\"").append(n(py + TICK_FONT * 0.35))
                        .append("\" text-anchor=\"end\">").append(label(y.labels().get(i))).append("</text>\n");
            }
        }

        /** A curve as polylines, broken where a sample is missing or cannot be drawn on a logarithmic axis. */
        private void curve(double[] xs, double[] ys, Ticks y, double panelTop, double panelHeight, Plot.Kind kind) {
            String style = kind == null ? "stroke=\"" + RESIDUAL_COLOUR + "\" stroke-width=\"1.3\""
                    : kind == Plot.Kind.NUMERIC ? "stroke=\"" + NUMERIC_COLOUR + "\" stroke-width=\"2.4\""
                    : "stroke=\"" + CLOSED_COLOUR + "\" stroke-width=\"1.7\" stroke-dasharray=\"7 5\"";
            List<String> pieces = new ArrayList<>();
            StringBuilder points = new StringBuilder();
            int count = 0;
            for (int i = 0; i <= xs.length; i++) {
                boolean ok = i < xs.length && drawable(xs[i], xt) && drawable(ys[i], y);
                if (ok) {
                    if (count++ > 0) points.append(' ');
                    points.append(n(xPixel(xs[i]))).append(',').append(n(yPixel(y, ys[i], panelTop, panelHeight)));
                } else {
                    if (count >= 2) pieces.add(points.toString());
                    points.setLength(0);
                    count = 0;
                }
            }
            for (String p : pieces) {
                out.append("<polyline fill=\"none\" ").append(style).append(" stroke-linejoin=\"round\" points=\"").append(p).append("\"/>\n");
            }
        }

        private static boolean drawable(double v, Ticks t) {
            return Double.isFinite(v) && (!t.log() || v > 0);
        }

        private void legend() {
            List<Plot.Series> items = plot.series();
            double sample = 30, gap = 8, between = 22;
            double total = 0;
            for (Plot.Series s : items) total += sample + gap + textWidth(s.kind().legend, TICK_FONT) + between;
            total -= between;
            double x = left + plotWidth - total, y = top - 12;
            for (Plot.Series s : items) {
                String style = s.kind() == Plot.Kind.NUMERIC ? "stroke=\"" + NUMERIC_COLOUR + "\" stroke-width=\"2.4\""
                        : "stroke=\"" + CLOSED_COLOUR + "\" stroke-width=\"1.7\" stroke-dasharray=\"7 5\"";
                out.append("<line x1=\"").append(n(x)).append("\" y1=\"").append(n(y - 4)).append("\" x2=\"").append(n(x + sample))
                        .append("\" y2=\"").append(n(y - 4)).append("\" ").append(style).append("/>\n");
                out.append("<text x=\"").append(n(x + sample + gap)).append("\" y=\"").append(n(y)).append("\">").append(esc(s.kind().legend))
                        .append("</text>\n");
                x += sample + gap + textWidth(s.kind().legend, TICK_FONT) + between;
            }
        }

        /** A title turned to read upwards, in the given column of the left margin (0 the outermost). */
        private void verticalTitle(List<PlotText.Run> title, double centre, int column) {
            double x = 12 + TITLE_FONT + column * (TITLE_FONT + 4);
            out.append("<text x=\"").append(n(x)).append("\" y=\"").append(n(centre)).append("\" text-anchor=\"middle\" font-size=\"")
                    .append(n(TITLE_FONT)).append("\" transform=\"rotate(-90 ").append(n(x)).append(' ').append(n(centre)).append(")\">")
                    .append(runs(title, TITLE_FONT)).append("</text>\n");
        }

        double xPixel(double v) {
            return left + fraction(xt, v) * plotWidth;
        }

        static double yPixel(Ticks t, double v, double panelTop, double panelHeight) {
            return panelTop + (1 - fraction(t, v)) * panelHeight;
        }

        private static double fraction(Ticks t, double v) {
            double f = t.log() ? (Math.log10(v) - Math.log10(t.min())) / (Math.log10(t.max()) - Math.log10(t.min()))
                    : (v - t.min()) / (t.max() - t.min());
            return Math.max(0, Math.min(1, f));
        }

        private static double[] concat(List<double[]> parts) {
            return parts.stream().flatMapToDouble(java.util.Arrays::stream).toArray();
        }

        private static double width(List<Ticks.Label> labels) {
            double w = 0;
            for (Ticks.Label l : labels) {
                w = Math.max(w, l.decade() == null ? textWidth(l.mantissa(), TICK_FONT)
                        : textWidth("10", TICK_FONT) + textWidth(Integer.toString(l.decade()), TICK_FONT * 0.7));
            }
            return w;
        }
    }

    /** A tick label: the number with a real minus sign, or ten with its power raised. */
    static String label(Ticks.Label l) {
        if (l.decade() == null) return esc(PlotText.minus(l.mantissa()));
        return runs(List.of(PlotText.Run.plain("10"), new PlotText.Run(PlotText.minus(Integer.toString(l.decade())), false,
                PlotText.Shift.SUPER)), TICK_FONT);
    }

    /**
     * Styled runs as {@code <tspan>}s. A raised or lowered run is moved with {@code dy} in pixels of the
     * surrounding text (not em: a smaller tspan's em is its own) and the next run moves back.
     */
    static String runs(List<PlotText.Run> runs, double fontSize) {
        StringBuilder s = new StringBuilder();
        double offset = 0;
        for (PlotText.Run r : runs) {
            double target = switch (r.shift()) {
                case SUPER -> -0.42 * fontSize;
                case SUB -> 0.25 * fontSize;
                case BASE -> 0;
            };
            boolean styled = r.italic() || r.shift() != PlotText.Shift.BASE || target != offset;
            if (!styled) {
                s.append(esc(r.text()));
                continue;
            }
            s.append("<tspan");
            if (target != offset) s.append(" dy=\"").append(n(target - offset)).append('"');
            if (r.italic()) s.append(" font-style=\"italic\"");
            if (r.shift() != PlotText.Shift.BASE) s.append(" font-size=\"").append(n(0.72 * fontSize)).append('"');
            s.append('>').append(esc(r.text())).append("</tspan>");
            offset = target;
        }
        return s.toString();
    }

    /** About how wide a text is in a serif face: digits and most letters take a little over half an em. */
    static double textWidth(String s, double fontSize) {
        return s.codePointCount(0, s.length()) * 0.56 * fontSize;
    }

    private static String n(double v) {
        String s = String.format(Locale.ROOT, "%.2f", v);
        if (s.endsWith(".00")) s = s.substring(0, s.length() - 3);
        return s.equals("-0") ? "0" : s;
    }

    private static String esc(String s) {
        return s.replace("&", "&amp;").replace("<", "&lt;").replace(">", "&gt;").replace("\"", "&quot;");
    }
}
