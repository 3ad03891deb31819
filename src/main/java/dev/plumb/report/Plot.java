package dev.plumb.report;

import java.util.List;

/**
 * A figure as data: curves of one quantity against another, each axis in a unit the file chose.
 * Formats draw it themselves ({@link SvgPlot} for HTML and Markdown, {@link PgfPlot} for LaTeX),
 * so text stays text and the fonts are the document's. Beneath the curves, where both a numeric
 * solution and a closed form were sampled at the same points, a second panel shows how far apart
 * they are ({@link #residual}).
 *
 * @param x      the horizontal axis (the coordinate of a profile, or the first quantity of a sweep)
 * @param y      the vertical axis
 * @param series the curves, values in the axes' units; at most one of each kind, all sampled at the same x
 */
public record Plot(Axis x, Axis y, List<Series> series) {

    public Plot {
        series = List.copyOf(series);
        if (series.isEmpty()) throw new IllegalArgumentException("a plot needs a curve");
        for (Series s : series) {
            if (!java.util.Arrays.equals(s.x, series.get(0).x)) throw new IllegalArgumentException("curves sampled at different points");
        }
    }

    /**
     * What an axis shows: {@code quantity} in plumb's own notation (typeset by each format, e.g.
     * {@code rho_c} or {@code m(R)}), in the unit written as in the file ({@code GPa}, {@code g/cm^3});
     * a unit of "1" or null means dimensionless.
     */
    public record Axis(String quantity, String unit) {
        public boolean dimensionless() {
            return unit == null || unit.isBlank() || unit.equals("1");
        }
    }

    /** Which computation a curve comes from; each has its own colour and dash, so print in grey keeps them apart. */
    public enum Kind {
        NUMERIC("numeric solution"), CLOSED_FORM("closed form");

        public final String legend;

        Kind(String legend) {
            this.legend = legend;
        }
    }

    /** One curve; NaN marks a sample that could not be computed (the curve breaks there). */
    public record Series(Kind kind, double[] x, double[] y) {
        public Series {
            if (x.length != y.length) throw new IllegalArgumentException("x and y differ in length");
            x = x.clone();
            y = y.clone();
        }

        @Override
        public double[] x() {
            return x.clone();
        }

        @Override
        public double[] y() {
            return y.clone();
        }
    }

    public Series series(Kind kind) {
        return series.stream().filter(s -> s.kind() == kind).findFirst().orElse(null);
    }

    /**
     * (numeric − closed form) / max|closed form| at each sample, when there are both curves; null
     * otherwise. Dividing by the largest value rather than pointwise keeps the
     * residual finite where the profile passes through zero (a pressure at a free surface).
     */
    public double[] residual() {
        Series n = series(Kind.NUMERIC), c = series(Kind.CLOSED_FORM);
        if (n == null || c == null) return null;
        double scale = 0;
        for (double v : c.y) if (Double.isFinite(v)) scale = Math.max(scale, Math.abs(v));
        double[] r = new double[n.y.length];
        for (int i = 0; i < r.length; i++) r[i] = scale > 0 ? (n.y[i] - c.y[i]) / scale : Double.NaN;
        return r;
    }

    /** The residual panel's axis title, in words every format typesets the same way. */
    static final String RESIDUAL_TITLE = "rel. diff.";
}
