package dev.plumb.scaling;

import java.util.HashMap;
import java.util.Locale;
import java.util.Map;
import java.util.stream.IntStream;
import org.apache.commons.math3.stat.regression.SimpleRegression;

/**
 * A quantity swept over one free parameter (the others held) and read on log–log axes: the
 * least-squares slope with its standard error, the local slopes between neighbouring points, and
 * the noise those local slopes carry from the evaluations' own error estimates. A power law is a
 * straight line here; anything else shows as local slopes that drift by more than the noise.
 *
 * @param parameter     the swept parameter
 * @param from          the first value of the parameter (SI)
 * @param to            the last value of the parameter (SI)
 * @param slope         the least-squares slope of ln|Q| against ln p
 * @param standardError the slope's standard error
 * @param localSlopes   (ln|Q| difference) / (ln p difference) between each pair of neighbouring points
 * @param slopeNoise    the largest error a local slope can carry from the evaluations' error estimates
 */
public record LogLogSweep(String parameter, double from, double to, double slope, double standardError,
                          double[] localSlopes, double slopeNoise) {

    /**
     * The stated tolerance on exponents and on the drift of the local slopes, absolute. The
     * sweeps solve at relative tolerances of 1e-10 and 1e-12, which puts errors of order 1e-9 on
     * a slope over the step of a sweep (about 0.3 in ln p); 1e-6 sits well above that and well
     * below any difference between exponents a derivation would claim, so a power law is never
     * refused for solver noise and a curved law (the compressible ocean's drifts by 1e-3 to 1e-1)
     * is never passed.
     */
    public static final double TOLERANCE = 1e-6;

    /** Agreement is asked within this many standard errors (or noise bounds) when that is wider than {@link #TOLERANCE}. */
    static final double SIGMAS = 4;

    /** Sweeps {@code parameter} over {@code points} log-spaced values from {@code from} to {@code to}, the others at {@code base}. */
    public static LogLogSweep of(ParameterSensitivity.Quantity q, Map<String, Double> base, String parameter, double from, double to,
                                 int points) throws Exception {
        double[] lnP = new double[points];
        double[] lnQ = new double[points];
        double[] rel = new double[points];
        double[] sign = new double[points];
        Exception[] failure = new Exception[1];
        IntStream.range(0, points).parallel().forEach(i -> {
            double value = from * Math.pow(to / from, (double) i / (points - 1));
            Map<String, Double> at = new HashMap<>(base);
            at.put(parameter, value);
            try {
                ParameterSensitivity.Estimate e = q.estimate(at);
                lnP[i] = Math.log(value);
                lnQ[i] = Math.log(Math.abs(e.value()));
                rel[i] = Math.abs(e.error() / e.value());
                sign[i] = Math.signum(e.value());
            } catch (Exception ex) {
                synchronized (failure) {
                    if (failure[0] == null) failure[0] = ex;
                }
            }
        });
        if (failure[0] != null) throw failure[0];
        for (int i = 0; i < points; i++) {
            // A zero or a change of sign has no logarithm: no power law can pass through it.
            if (!Double.isFinite(lnQ[i]) || !Double.isFinite(rel[i]) || sign[i] != sign[0]) {
                throw new IllegalStateException(String.format(Locale.ROOT,
                        "the quantity is zero, not finite or changes sign at %s = %.6g", parameter, Math.exp(lnP[i])));
            }
        }
        SimpleRegression reg = new SimpleRegression(true);
        for (int i = 0; i < points; i++) reg.addData(lnP[i], lnQ[i]);
        double[] local = new double[points - 1];
        double noise = 0;
        for (int i = 0; i + 1 < points; i++) {
            double step = lnP[i + 1] - lnP[i];
            local[i] = (lnQ[i + 1] - lnQ[i]) / step;
            noise = Math.max(noise, (rel[i] + rel[i + 1]) / step);
        }
        double se = reg.getSlopeStdErr();
        return new LogLogSweep(parameter, from, to, reg.getSlope(), Double.isFinite(se) ? se : 0.0, local, noise);
    }

    /** The smallest local slope. */
    public double lowest() {
        double m = Double.POSITIVE_INFINITY;
        for (double s : localSlopes) m = Math.min(m, s);
        return m;
    }

    /** The largest local slope. */
    public double highest() {
        double m = Double.NEGATIVE_INFINITY;
        for (double s : localSlopes) m = Math.max(m, s);
        return m;
    }

    /** The drift of the local slopes allowed before the sweep is called curved. */
    public double straightnessAllowance() {
        return Math.max(TOLERANCE, SIGMAS * slopeNoise);
    }

    /** Whether the log–log sweep is a straight line within {@link #straightnessAllowance()}. */
    public boolean straight() {
        return highest() - lowest() <= straightnessAllowance();
    }

    /** How far the fitted slope may lie from a claimed exponent and still agree. */
    public double exponentAllowance() {
        return Math.max(TOLERANCE, SIGMAS * Math.max(standardError, slopeNoise));
    }

    /**
     * d ln|Q| / d ln p at {@code value} by central differences a thousandth apart in ln p; the
     * truncation error (about 2e-7 times the third derivative) and the noise (the relative error
     * over 1e-3) both stay far below the drifts this number is shown for.
     */
    public static double localExponent(ParameterSensitivity.Quantity q, Map<String, Double> base, String parameter, double value)
            throws Exception {
        double h = 1e-3;
        Map<String, Double> up = new HashMap<>(base);
        Map<String, Double> down = new HashMap<>(base);
        up.put(parameter, value * Math.exp(h));
        down.put(parameter, value * Math.exp(-h));
        return (Math.log(Math.abs(q.estimate(up).value())) - Math.log(Math.abs(q.estimate(down).value()))) / (2 * h);
    }
}
