package dev.plumb.scaling;

import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import java.util.stream.IntStream;

/**
 * Numeric scaling: quantities of the free parameters, local logarithmic sensitivities, and propagation
 * of parameter uncertainties, all on a quantity computed as a function of the free parameters.
 */
public final class ParameterSensitivity {
    private ParameterSensitivity() {
    }

    /**
     * A quantity as a function of the free parameters (SI values); may solve the model each call.
     * {@link #estimate} adds an estimate of the value's error, which a numeric solve can give by
     * solving twice; a direct evaluation is taken to carry rounding only.
     */
    public interface Quantity {
        double at(Map<String, Double> parameters) throws Exception;

        default Estimate estimate(Map<String, Double> parameters) throws Exception {
            double v = at(parameters);
            return new Estimate(v, Math.abs(v) * ROUNDING);
        }
    }

    /** The relative error assumed for a direct evaluation: rounding, with room for a few cancellations. */
    static final double ROUNDING = 1e-13;

    /** A value and an estimate of its absolute error. */
    public record Estimate(double value, double error) { }

    /** ∂ln Q/∂ln p for each parameter, by central differences in ln p (step {@code h}). */
    public static Map<String, Double> sensitivities(Quantity q, Map<String, Double> base, List<String> parameters, double h)
            throws Exception {
        Map<String, Double> out = new LinkedHashMap<>();
        for (String p : parameters) {
            Map<String, Double> up = new HashMap<>(base);
            Map<String, Double> down = new HashMap<>(base);
            up.put(p, base.get(p) * Math.exp(h));
            down.put(p, base.get(p) * Math.exp(-h));
            out.put(p, (Math.log(Math.abs(q.at(up))) - Math.log(Math.abs(q.at(down)))) / (2 * h));
        }
        return out;
    }

    /**
     * First-order and Monte Carlo propagation of independent Gaussian parameter uncertainties.
     *
     * @param firstOrder      σ_Q from the sensitivities: Q·sqrt(Σ (S_p σ_p / p)²)
     * @param monteCarlo      sample standard deviation of Q over {@code samples} draws
     * @param samplingError   the standard error of {@code monteCarlo} itself, σ/sqrt(2(N−1))
     */
    public record Uncertainty(double value, double firstOrder, double monteCarloMean, double monteCarlo,
                              double samplingError, int samples, long seed) { }

    public static Uncertainty propagate(Quantity q, Map<String, Double> base, Map<String, Double> sigmas,
                                        Map<String, Double> sensitivities, int samples, long seed) throws Exception {
        double value = q.at(base);
        double rel2 = 0;
        for (Map.Entry<String, Double> s : sigmas.entrySet()) {
            double rel = sensitivities.getOrDefault(s.getKey(), 0.0) * s.getValue() / base.get(s.getKey());
            rel2 += rel * rel;
        }
        double firstOrder = Math.abs(value) * Math.sqrt(rel2);
        double[] draws = new double[samples];
        Exception[] failure = new Exception[1];
        // One generator per sample, split deterministically from the seed, so the draws do not
        // depend on how the parallel stream schedules them.
        SplittableRandom root = new SplittableRandom(seed);
        SplittableRandom[] rngs = new SplittableRandom[samples];
        for (int i = 0; i < samples; i++) rngs[i] = root.split();
        IntStream.range(0, samples).parallel().forEach(i -> {
            Map<String, Double> at = new HashMap<>(base);
            for (Map.Entry<String, Double> s : sigmas.entrySet()) {
                at.put(s.getKey(), base.get(s.getKey()) + s.getValue() * gaussian(rngs[i]));
            }
            try {
                draws[i] = q.at(at);
            } catch (Exception e) {
                synchronized (failure) {
                    failure[0] = e;
                }
            }
        });
        if (failure[0] != null) throw failure[0];
        double mean = 0;
        for (double d : draws) mean += d;
        mean /= samples;
        double var = 0;
        for (double d : draws) var += (d - mean) * (d - mean);
        double sd = Math.sqrt(var / (samples - 1));
        return new Uncertainty(value, firstOrder, mean, sd, sd / Math.sqrt(2.0 * (samples - 1)), samples, seed);
    }

    private static double gaussian(SplittableRandom r) {
        // Box–Muller; SplittableRandom has no nextGaussian in Java 17.
        double u = 1.0 - r.nextDouble();
        double v = r.nextDouble();
        return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
    }
}
