package dev.plumb.report;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;

/**
 * The tick marks of one plot axis: its limits, tick values at round numbers and their labels.
 *
 * <p>Linear axes step by 1, 2 or 5 times a power of ten (the "nice numbers" of Heckbert,
 * Graphics Gems, 1990). Each tick is the integer k times the step, made exactly in decimal and
 * only then turned into a double, so a label never reads 7.999999999999999E23. Labels are plain
 * decimals when the largest tick lies in [0.001, 10000); otherwise every label is divided by one
 * common power of ten, {@link #power}, which the axis label carries (as in "r [10⁸ m]").
 * Logarithmic axes put their ticks at whole decades and label them 10ⁿ.
 *
 * @param min    the lower end of the axis, in the axis unit
 * @param max    the upper end of the axis, in the axis unit
 * @param ticks  the tick positions, in the axis unit, ascending
 * @param labels one label per tick
 * @param power  the common power of ten divided out of the labels (0 when none)
 * @param log    whether the axis is logarithmic
 */
public record Ticks(double min, double max, List<Double> ticks, List<Label> labels, int power, boolean log) {

    public Ticks {
        ticks = List.copyOf(ticks);
        labels = List.copyOf(labels);
    }

    /**
     * A tick label: {@code mantissa} alone (for instance "0.5" or "-2"), or, when {@code decade} is
     * set, ten to that power (a logarithmic axis); minus signs are ASCII here, each format typesets them.
     */
    public record Label(String mantissa, Integer decade) {
        public String plain() {
            return decade == null ? mantissa : "10^" + decade;
        }
    }

    /** Below this ratio of largest to smallest (positive) value a logarithmic axis shows too few decades. */
    static final double LOG_RATIO = 1e3;

    /**
     * Ticks for data from {@code lo} to {@code hi}: about {@code target} of them on a linear axis.
     * With {@code loose} the axis is widened to the ticks just outside the data (for values);
     * without it the axis ends at the data and only ticks inside are drawn (for a coordinate).
     */
    public static Ticks linear(double lo, double hi, int target, boolean loose) {
        if (!(lo <= hi) || !Double.isFinite(lo) || !Double.isFinite(hi)) throw new IllegalArgumentException(lo + " .. " + hi);
        if (hi - lo <= 1e-9 * Math.max(Math.abs(lo), Math.abs(hi))) {
            // Values equal but for rounding (a quantity that does not change along a sweep) make a flat line, not
            // ticks in the fifteenth digit, whose labels run off the page.
            lo = hi = (lo + hi) / 2;
            double pad = lo == 0 ? 1 : Math.abs(lo) * 0.1;
            lo -= pad;
            hi += pad;
            loose = true;
        }
        Step step = Step.of(nice(nice(hi - lo, false).doubleValue() / Math.max(1, target - 1), true));
        long first = loose ? (long) Math.floor(lo / step.value() + 1e-9) : (long) Math.ceil(lo / step.value() - 1e-9);
        long last = loose ? (long) Math.ceil(hi / step.value() - 1e-9) : (long) Math.floor(hi / step.value() + 1e-9);
        List<BigDecimal> exact = new ArrayList<>();
        for (long k = first; k <= last; k++) exact.add(step.times(k));
        double max = 0;
        for (BigDecimal t : exact) max = Math.max(max, Math.abs(t.doubleValue()));
        boolean plain = max == 0 || (max >= 1e-3 && max < 1e4);
        int power = plain ? 0 : (int) Math.floor(Math.log10(max) + 1e-12);
        int decimals = Math.max(0, power - step.exponent());
        List<Double> values = new ArrayList<>();
        List<Label> labels = new ArrayList<>();
        for (BigDecimal t : exact) {
            values.add(t.doubleValue());
            String s = t.movePointLeft(power).setScale(decimals, java.math.RoundingMode.UNNECESSARY).toPlainString();
            labels.add(new Label(s.matches("-0(\\.0*)?") ? s.substring(1) : s, null));
        }
        double min = loose ? values.get(0) : lo;
        double top = loose ? values.get(values.size() - 1) : hi;
        return new Ticks(min, top, values, labels, power, false);
    }

    /**
     * Ticks at whole decades for positive data from {@code lo} to {@code hi}, every decade or every
     * few when there are many; {@code loose} as for {@link #linear}.
     */
    public static Ticks logarithmic(double lo, double hi, boolean loose) {
        if (!(lo > 0) || !(hi >= lo) || !Double.isFinite(hi)) throw new IllegalArgumentException(lo + " .. " + hi);
        // Math.log10 is exact at powers of ten, so 1e17 gives 17 and a decade end is not lost to rounding.
        int a = (int) (loose ? Math.floor(Math.log10(lo) + 1e-9) : Math.ceil(Math.log10(lo) - 1e-9));
        int b = (int) (loose ? Math.ceil(Math.log10(hi) - 1e-9) : Math.floor(Math.log10(hi) + 1e-9));
        int stride = Math.max(1, (int) Math.ceil((b - a) / 7.0));
        if (loose) {
            // A loose axis ends on ticks, so its ends move out to multiples of the stride.
            a = Math.floorDiv(a, stride) * stride;
            b = -Math.floorDiv(-b, stride) * stride;
        }
        List<Double> values = new ArrayList<>();
        List<Label> labels = new ArrayList<>();
        for (int k = Math.floorDiv(a + stride - 1, stride) * stride; k <= b; k += stride) {
            values.add(Double.parseDouble("1e" + k));
            labels.add(new Label("1", k));
        }
        double min = loose ? Double.parseDouble("1e" + a) : lo;
        double max = loose ? Double.parseDouble("1e" + b) : hi;
        return new Ticks(min, max, values, labels, 0, true);
    }

    /**
     * The axis for these values: logarithmic when every value is positive, they span at least three
     * decades and most of them would be squeezed into the lowest tenth of a linear axis (an
     * exponential atmosphere, a sweep spaced evenly in the logarithm); else linear with about
     * {@code target} ticks. A profile falling to zero at a free surface spans many decades too, but
     * most of it lies high on a linear axis, so it stays linear. Non-finite values are left out.
     */
    public static Ticks forData(double[] values, int target, boolean loose, boolean logAllowed) {
        double[] finite = java.util.Arrays.stream(values).filter(Double::isFinite).sorted().toArray();
        if (finite.length == 0) return linear(0, 1, target, true);
        double lo = finite[0], hi = finite[finite.length - 1];
        double median = finite[finite.length / 2];
        if (logAllowed && lo > 0 && hi / lo >= LOG_RATIO && median - lo < 0.1 * (hi - lo)) return logarithmic(lo, hi, loose);
        return linear(lo, hi, target, loose);
    }

    /** Heckbert's nice number near {@code x}: 1, 2, 5 or 10 times a power of ten (rounded, or at least x). */
    static BigDecimal nice(double x, boolean round) {
        int e = (int) Math.floor(Math.log10(x));
        double f = x / Math.pow(10, e);
        int m;
        if (round) m = f < 1.5 ? 1 : f < 3 ? 2 : f < 7 ? 5 : 10;
        else m = f <= 1 ? 1 : f <= 2 ? 2 : f <= 5 ? 5 : 10;
        return BigDecimal.valueOf(m).scaleByPowerOfTen(e);
    }

    /** A step m·10^e with m one of 1, 2, 5. */
    private record Step(BigDecimal exact, int exponent) {
        static Step of(BigDecimal v) {
            BigDecimal s = v.stripTrailingZeros();
            // m·10^e: the exponent is minus the scale once the unscaled value is a single digit.
            return new Step(s, -s.scale() + s.unscaledValue().toString().length() - 1);
        }

        double value() {
            return exact.doubleValue();
        }

        BigDecimal times(long k) {
            return exact.multiply(BigDecimal.valueOf(k));
        }
    }
}
