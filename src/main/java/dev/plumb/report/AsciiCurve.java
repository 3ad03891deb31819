package dev.plumb.report;

import java.util.Locale;

/**
 * A curve drawn in text for the terminal: one quantity against another on a grid of characters,
 * each axis logarithmic when every value is positive and they span more than two decades.
 */
final class AsciiCurve {

    private static final int WIDTH = 60, HEIGHT = 16;

    private AsciiCurve() {
    }

    /** The plot as lines (indented by {@code indent}), or an empty string when fewer than two points have both values. */
    static String draw(double[] x, double[] y, String xLabel, String yLabel, String indent) {
        int n = 0;
        for (int i = 0; i < x.length; i++) if (Double.isFinite(x[i]) && Double.isFinite(y[i])) n++;
        if (n < 2) return "";
        Axis ax = Axis.of(x, y), ay = Axis.of(y, x);
        if (ax.lo == ax.hi || ay.lo == ay.hi) return "";
        char[][] grid = new char[HEIGHT][WIDTH];
        for (char[] row : grid) java.util.Arrays.fill(row, ' ');
        int prevC = -1, prevR = -1;
        for (int i = 0; i < x.length; i++) {
            if (!Double.isFinite(x[i]) || !Double.isFinite(y[i])) {
                prevC = -1;
                continue;
            }
            int c = (int) Math.round(ax.fraction(x[i]) * (WIDTH - 1));
            int r = HEIGHT - 1 - (int) Math.round(ay.fraction(y[i]) * (HEIGHT - 1));
            if (prevC >= 0) {
                // Join consecutive points with dots so the order of the sequence reads from the picture.
                int steps = Math.max(Math.abs(c - prevC), Math.abs(r - prevR));
                for (int s = 1; s < steps; s++) {
                    int cc = prevC + (int) Math.round((double) (c - prevC) * s / steps);
                    int rr = prevR + (int) Math.round((double) (r - prevR) * s / steps);
                    if (grid[rr][cc] == ' ') grid[rr][cc] = '.';
                }
            }
            grid[r][c] = '*';
            prevC = c;
            prevR = r;
        }
        StringBuilder out = new StringBuilder();
        String top = num(ay.hi), bottom = num(ay.lo);
        int margin = Math.max(top.length(), bottom.length());
        out.append(indent).append(yLabel).append(ay.log ? "  (log scale)" : "").append('\n');
        for (int r = 0; r < HEIGHT; r++) {
            String tick = r == 0 ? top : r == HEIGHT - 1 ? bottom : "";
            out.append(indent).append(" ".repeat(margin - tick.length())).append(tick).append(" |").append(new String(grid[r]).stripTrailing())
                    .append('\n');
        }
        out.append(indent).append(" ".repeat(margin)).append(" +").append("-".repeat(WIDTH)).append('\n');
        String left = num(ax.lo), right = num(ax.hi);
        out.append(indent).append(" ".repeat(margin + 2)).append(left)
                .append(" ".repeat(Math.max(1, WIDTH - left.length() - right.length()))).append(right).append('\n');
        out.append(indent).append(" ".repeat(margin + 2)).append(xLabel).append(ax.log ? "  (log scale)" : "").append('\n');
        return out.toString();
    }

    private static String num(double v) {
        return String.format(Locale.ROOT, "%.4g", v);
    }

    /** One axis: its range over the points where both values are finite, and whether it is logarithmic. */
    private record Axis(double lo, double hi, boolean log) {
        static Axis of(double[] v, double[] other) {
            double lo = Double.POSITIVE_INFINITY, hi = Double.NEGATIVE_INFINITY;
            for (int i = 0; i < v.length; i++) {
                if (!Double.isFinite(v[i]) || !Double.isFinite(other[i])) continue;
                lo = Math.min(lo, v[i]);
                hi = Math.max(hi, v[i]);
            }
            return new Axis(lo, hi, lo > 0 && hi / lo > 100);
        }

        double fraction(double v) {
            return log ? Math.log(v / lo) / Math.log(hi / lo) : (v - lo) / (hi - lo);
        }
    }
}
