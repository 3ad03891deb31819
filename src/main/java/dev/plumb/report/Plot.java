package dev.plumb.report;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.List;
import org.knowm.xchart.VectorGraphicsEncoder;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.style.markers.SeriesMarkers;

/**
 * A profile plot (numeric solution, and the closed form where one exists) drawn with XChart and
 * written as SVG (for HTML and Markdown) or PDF (for LaTeX).
 */
public final class Plot {
    private Plot() {
    }

    /** One curve: x and y in the units named on the axes. */
    public record Series(String name, double[] x, double[] y, boolean dashed) { }

    public static byte[] svg(String title, String xLabel, String yLabel, List<Series> series) throws IOException {
        return encode(chart(title, xLabel, yLabel, series), VectorGraphicsEncoder.VectorGraphicsFormat.SVG);
    }

    public static byte[] pdf(String title, String xLabel, String yLabel, List<Series> series) throws IOException {
        return reproducibleId(encode(chart(title, xLabel, yLabel, series), VectorGraphicsEncoder.VectorGraphicsFormat.PDF));
    }

    /**
     * The PDF with its file identifier made from its content: the encoder writes a random /ID, so two
     * runs would differ. ISO 32000-1 (14.4) suggests an MD5 digest of the file's content, which is what
     * replaces it here (same length, so no offset moves).
     */
    private static byte[] reproducibleId(byte[] pdf) {
        String text = new String(pdf, StandardCharsets.ISO_8859_1);
        java.util.regex.Matcher m = java.util.regex.Pattern.compile("/ID \\[<([0-9A-Fa-f]+)> <([0-9A-Fa-f]+)>\\]").matcher(text);
        if (!m.find()) return pdf;
        String id;
        try {
            byte[] digest = java.security.MessageDigest.getInstance("MD5").digest(java.util.Arrays.copyOf(pdf, m.start()));
            id = java.util.HexFormat.of().withUpperCase().formatHex(digest);
        } catch (java.security.NoSuchAlgorithmException e) {
            throw new IllegalStateException("MD5 is required of every Java platform", e);
        }
        if (id.length() != m.group(1).length() || id.length() != m.group(2).length()) return pdf;
        byte[] out = pdf.clone();
        byte[] idBytes = id.getBytes(StandardCharsets.ISO_8859_1);
        System.arraycopy(idBytes, 0, out, m.start(1), idBytes.length);
        System.arraycopy(idBytes, 0, out, m.start(2), idBytes.length);
        return out;
    }

    /** The SVG as text without its XML prolog, ready to inline in HTML. */
    public static String inlineSvg(String title, String xLabel, String yLabel, List<Series> series) throws IOException {
        String s = new String(svg(title, xLabel, yLabel, series), StandardCharsets.UTF_8);
        int start = s.indexOf("<svg");
        return start >= 0 ? s.substring(start) : s;
    }

    private static XYChart chart(String title, String xLabel, String yLabel, List<Series> series) {
        // Headless: report generation must work on machines without a display.
        System.setProperty("java.awt.headless", "true");
        XYChart chart = new XYChartBuilder().width(640).height(400).title(title).xAxisTitle(xLabel).yAxisTitle(yLabel).build();
        chart.getStyler().setLegendPosition(Styler.LegendPosition.InsideNE);
        chart.getStyler().setChartBackgroundColor(java.awt.Color.WHITE);
        chart.getStyler().setPlotGridLinesVisible(true);
        for (Series s : series) {
            XYSeries xy = chart.addSeries(s.name(), s.x(), s.y());
            xy.setMarker(SeriesMarkers.NONE);
            if (s.dashed()) {
                xy.setLineStyle(new java.awt.BasicStroke(2f, java.awt.BasicStroke.CAP_BUTT, java.awt.BasicStroke.JOIN_MITER,
                        10f, new float[] {6f, 4f}, 0f));
            }
        }
        return chart;
    }

    private static byte[] encode(XYChart chart, VectorGraphicsEncoder.VectorGraphicsFormat format) throws IOException {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        VectorGraphicsEncoder.saveVectorGraphic(chart, out, format);
        return out.toByteArray();
    }
}
