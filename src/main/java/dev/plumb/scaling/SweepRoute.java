package dev.plumb.scaling;

import dev.plumb.model.CaseValues;
import dev.plumb.model.Model;
import dev.plumb.model.Symbol;
import dev.plumb.units.UnitCatalog;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Judges a scaling claim by log–log sweeps of a quantity over each free parameter in turn: the
 * claim holds only where every sweep is straight (a power law) and its slope is the claimed
 * exponent; a curved sweep fails with the local exponent at both ends.
 */
final class SweepRoute {

    /** Points per sweep: eight local slopes, enough to see a drift or a kink. */
    static final int POINTS = 9;

    private final Model model;

    SweepRoute(Model model) {
        this.model = model;
    }

    /**
     * @param route the route's name ("numeric sweep", "closed form")
     * @param q     the quantity, evaluated at SI parameter values
     * @param want  the claimed exponent of each free parameter
     */
    RouteFinding judge(String route, ParameterSensitivity.Quantity q, Map<String, Double> want) {
        CaseValues base = model.cases().get(0);
        List<String> parts = new ArrayList<>();
        List<String> differences = new ArrayList<>();
        List<String> unswept = new ArrayList<>();
        Map<String, Object> exponents = new LinkedHashMap<>();
        for (Map.Entry<String, Double> w : want.entrySet()) {
            String p = w.getKey();
            String unit = unit(p);
            LogLogSweep s = null;
            String why = "";
            for (double[] r : ranges(p)) {
                try {
                    s = LogLogSweep.of(q, base.values(), p, r[0], r[1], POINTS);
                    break;
                } catch (Exception ex) {
                    why = ex.getMessage() == null ? ex.getClass().getSimpleName() : ex.getMessage();
                }
            }
            if (s == null) {
                unswept.add(p);
                parts.add(p + " could not be swept (" + why + ")");
                continue;
            }
            String range = p + " from " + range(p, s.from(), s.to(), unit);
            if (!s.straight()) {
                double a = endExponent(q, base, s, s.from(), s.localSlopes()[0]);
                double b = endExponent(q, base, s, s.to(), s.localSlopes()[s.localSlopes().length - 1]);
                String drift = String.format(Locale.ROOT, "the exponent of %s goes from %.5f to %.5f", p, a, b);
                if (s.lowest() < Math.min(a, b) || s.highest() > Math.max(a, b)) {
                    drift += String.format(Locale.ROOT, " (local slopes between %.5f and %.5f)", s.lowest(), s.highest());
                }
                differences.add(String.format(Locale.ROOT, "not a power law over the sweep: %s (%s; a power law keeps it within %.1g)",
                        drift, range, s.straightnessAllowance()));
                parts.add(range + ": not straight, local exponent " + String.format(Locale.ROOT, "%.5f to %.5f", a, b));
                continue;
            }
            exponents.put(p, s.slope());
            parts.add(String.format(Locale.ROOT, "%s: exponent %s±%.1e, straight within %.1g", range, exponent(s.slope()),
                    Math.max(s.standardError(), s.slopeNoise()), s.straightnessAllowance()));
            double off = s.slope() - w.getValue();
            if (Math.abs(off) > s.exponentAllowance()) {
                differences.add(String.format(Locale.ROOT, "exponent of %s is %s, claimed %s: off by %.3g, more than the %.1g allowed",
                        p, exponent(s.slope()), ScalingChecker.fmt(w.getValue()), off, s.exponentAllowance()));
            }
        }
        String finding = "around case " + base.label() + ", " + POINTS + " points per sweep: " + String.join("; ", parts);
        if (differences.isEmpty() && !unswept.isEmpty()) return RouteFinding.undecided(route, finding);
        return RouteFinding.judged(route, finding, differences, exponents);
    }

    /** d ln Q/d ln p at an end of the sweep; the end's local slope if the quantity cannot be evaluated just beyond it. */
    private static double endExponent(ParameterSensitivity.Quantity q, CaseValues base, LogLogSweep s, double at, double fallback) {
        try {
            double e = LogLogSweep.localExponent(q, base.values(), s.parameter(), at);
            return Double.isFinite(e) ? e : fallback;
        } catch (Exception ex) {
            return fallback;
        }
    }

    /**
     * The ranges to try, widest first: from the smallest to the largest value the cases give the
     * parameter (when they differ by a factor of two or more), two decades around the first case,
     * half a decade around it. A range where the model cannot be solved at every point gives way
     * to the next.
     */
    private List<double[]> ranges(String p) {
        List<double[]> out = new ArrayList<>();
        double v = model.cases().get(0).values().get(p);
        double lo = v;
        double hi = v;
        for (CaseValues c : model.cases()) {
            Double x = c.values().get(p);
            if (x == null || !(x > 0)) continue;
            lo = Math.min(lo, x);
            hi = Math.max(hi, x);
        }
        if (hi >= 2 * lo) out.add(new double[] {lo, hi});
        out.add(new double[] {v / 10, v * 10});
        out.add(new double[] {v / Math.pow(10, 0.25), v * Math.pow(10, 0.25)});
        return out;
    }

    /** A fitted exponent to six decimals, without the minus sign of a rounded-away negative zero. */
    private static String exponent(double e) {
        String out = String.format(Locale.ROOT, "%.6f", e);
        return out.equals("-0.000000") ? "0.000000" : out;
    }

    /** A parameter value to four digits, plain where it reads so (11000 rather than 1.100e+04). */
    private static String value(double v) {
        double a = Math.abs(v);
        if (a >= 1e-3 && a < 1e7) {
            return new java.math.BigDecimal(v).round(new java.math.MathContext(4)).stripTrailingZeros().toPlainString();
        }
        return String.format(Locale.ROOT, "%.4g", v);
    }

    /** A swept range in the file's unit for the parameter, with SI beside when that unit is not SI. */
    private String range(String p, double from, double to, String siUnit) {
        dev.plumb.units.Unit u = dev.plumb.model.FileUnits.of(model).forSymbol(p);
        String si = value(from) + " to " + value(to) + siUnit;
        if (u.factor() == 1.0 || u.dimension().isNone()) return si;
        return value(from / u.factor()) + " to " + value(to / u.factor()) + " " + u.text() + " (" + si + ")";
    }

    private String unit(String p) {
        return model.symbol(p).filter(s -> s instanceof Symbol.FreeParam).map(s -> s.dimension().isNone() ? ""
                : " " + UnitCatalog.siName(s.dimension())).orElse("");
    }
}
