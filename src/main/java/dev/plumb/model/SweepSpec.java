package dev.plumb.model;

import dev.plumb.lang.Span;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * A checked sequence of models: the parameter that varies, its values in SI (evenly spaced in the
 * logarithm or linearly), the other free parameters' SI values, and the unit the file wrote the
 * range in (for echoing values back in the file's own unit).
 *
 * @param unit   the unit written on the range ({@code kg/m^3}), or null for a pure number or SI
 * @param factor SI value of one {@code unit}
 */
public record SweepSpec(String label, Span span, String param, double[] values, boolean log, Map<String, Double> others,
                        String unit, double factor) {
    public SweepSpec {
        values = values.clone();
        others = Collections.unmodifiableMap(new LinkedHashMap<>(others));
    }

    @Override
    public double[] values() {
        return values.clone();
    }

    public int size() {
        return values.length;
    }

    /** The SI parameter values of point {@code i}: every free parameter, as a case gives them. */
    public Map<String, Double> point(int i) {
        return at(values[i]);
    }

    /** The SI parameter values with the swept parameter at {@code value}. */
    public Map<String, Double> at(double value) {
        Map<String, Double> out = new LinkedHashMap<>(others);
        out.put(param, value);
        return out;
    }
}
