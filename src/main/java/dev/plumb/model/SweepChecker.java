package dev.plumb.model;

import dev.plumb.lang.Diagnostics;
import dev.plumb.lang.Expr;
import dev.plumb.lang.ExprPrinter;
import dev.plumb.lang.Program;
import dev.plumb.lang.Stmt;
import dev.plumb.units.UnitException;
import dev.plumb.units.UnitParser;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Function;

/**
 * Checks each {@code sweep} as a case is checked (the swept name is a free parameter, every other
 * free parameter gets a value, the units agree, the values are finite, every point keeps the
 * declared signs and orders) and spreads its points in SI.
 */
final class SweepChecker {

    private final Program program;
    private final Map<String, Stmt> declarations;
    private final UnitInference inference;
    private final Diagnostics diagnostics;
    private final Function<String, Symbol> constants;

    SweepChecker(Program program, Map<String, Stmt> declarations, UnitInference inference, Diagnostics diagnostics,
                 Function<String, Symbol> constants) {
        this.program = program;
        this.declarations = declarations;
        this.inference = inference;
        this.diagnostics = diagnostics;
        this.constants = constants;
    }

    List<SweepSpec> sweeps() {
        List<SweepSpec> out = new ArrayList<>();
        for (Stmt.Sweep s : program.all(Stmt.Sweep.class)) {
            SweepSpec spec = sweep(s);
            if (spec != null) out.add(spec);
        }
        return out;
    }

    private SweepSpec sweep(Stmt.Sweep s) {
        String name = s.label().name();
        List<String> free = declarations.values().stream()
                .filter(d -> d instanceof Stmt.Param p && p.value() == null).map(d -> ((Stmt.Param) d).name()).toList();
        if (!(declarations.get(s.param()) instanceof Stmt.Param swept) || swept.value() != null) {
            Stmt decl = declarations.get(s.param());
            String why = decl instanceof Stmt.Param ? "is fixed by its declaration" : decl == null ? "is not declared" : "is not a parameter";
            diagnostics.error(s.paramSpan(), "sweep '" + name + "' varies '" + s.param() + "', which " + why,
                    free.isEmpty() ? "a sweep varies a free parameter, declared e.g. param M [kg] > 0"
                            : "a sweep varies one of the free parameters (" + String.join(", ", free) + ")");
            return null;
        }
        DimForm want = inference.symbolForm(s.param());
        boolean ok = !inference.mismatch(inference.infer(s.from()), want, s.from().span(),
                "the first value of '" + s.param() + "' does not have its unit", s.from(), null, true);
        ok &= !inference.mismatch(inference.infer(s.to()), want, s.to().span(),
                "the last value of '" + s.param() + "' does not have its unit", s.to(), null, true);
        Map<String, Double> ends = new LinkedHashMap<>();
        ConstantEvaluator evaluator = new ConstantEvaluator(constants, Map.of());
        ok &= value(evaluator, s.from(), "from", ends) & value(evaluator, s.to(), "to", ends);
        Map<String, Double> others = new LinkedHashMap<>();
        for (Stmt.Assignment a : s.others()) {
            Stmt decl = declarations.get(a.name());
            if (a.name().equals(s.param())) {
                diagnostics.error(a.nameSpan(), "sweep '" + name + "' varies '" + a.name() + "'; it cannot also fix it");
                ok = false;
            } else if (!(decl instanceof Stmt.Param p) || p.value() != null) {
                String why = decl instanceof Stmt.Param ? "is fixed by its declaration" : decl == null ? "is not declared" : "is not a parameter";
                diagnostics.error(a.nameSpan(), "sweep '" + name + "' sets '" + a.name() + "', which " + why);
                ok = false;
            } else if (others.containsKey(a.name())) {
                diagnostics.error(a.nameSpan(), "sweep '" + name + "' sets '" + a.name() + "' twice");
                ok = false;
            } else {
                ok &= !inference.mismatch(inference.infer(a.value()), inference.symbolForm(a.name()), a.value().span(),
                        "the value of '" + a.name() + "' does not have its unit", a.value(), null, true);
                ok &= value(evaluator, a.value(), a.name(), others);
            }
        }
        if (!ok) return null;
        List<String> missing = free.stream().filter(n -> !n.equals(s.param()) && !others.containsKey(n)).toList();
        if (!missing.isEmpty()) {
            diagnostics.error(s.label().span(), "sweep '" + name + "' gives no value for " + String.join(", ", missing),
                    "add them after the range as in a case, e.g. ..., " + missing.get(0) + " = ...");
            return null;
        }
        double a = ends.get("from"), b = ends.get("to");
        if (a == b) {
            diagnostics.error(s.from().span().to(s.to().span()), "sweep '" + name + "' runs from a value to the same value");
            return null;
        }
        if (s.log() && !(a > 0 && b > 0)) {
            diagnostics.error((a > 0 ? s.to() : s.from()).span(), "a 'log' sweep needs values above 0; use 'linear' for a range through 0 or below it");
            return null;
        }
        double[] values = new double[s.count()];
        for (int i = 0; i < values.length; i++) {
            double t = (double) i / (values.length - 1);
            values[i] = i == 0 ? a : i == values.length - 1 ? b : s.log() ? Math.exp(Math.log(a) + t * (Math.log(b) - Math.log(a))) : a + t * (b - a);
        }
        if (!keepsAssumptions(s, swept, values, others)) return null;
        String unit = null;
        double factor = 1.0;
        if (s.from() instanceof Expr.Quantity q) {
            try {
                factor = UnitParser.parse(q.unit()).factor();
                unit = q.unit();
            } catch (UnitException e) {
                // Already reported by the unit check of the range.
            }
        }
        return new SweepSpec(name, s.span(), s.param(), values, s.log(), others, unit, factor);
    }

    /** Every point keeps the declared sign and order of the swept parameter and of the others. */
    private boolean keepsAssumptions(Stmt.Sweep s, Stmt.Param swept, double[] values, Map<String, Double> others) {
        for (Stmt.Assignment a : s.others()) {
            Stmt.Param p = (Stmt.Param) declarations.get(a.name());
            if (!sign(p, others.get(a.name()))) {
                diagnostics.error(a.value().span(), "sweep '" + s.label().name() + "' gives " + a.name() + " = " + ExprPrinter.print(a.value())
                        + ", but '" + a.name() + "' is declared " + p.assumption().text);
                return false;
            }
        }
        for (double v : values) {
            Map<String, Double> point = new LinkedHashMap<>(others);
            point.put(s.param(), v);
            if (!sign(swept, v)) {
                diagnostics.error(s.from().span().to(s.to().span()), "sweep '" + s.label().name() + "' reaches " + s.param() + " = "
                        + String.format(java.util.Locale.ROOT, "%.6g", v) + " (SI), but '" + s.param() + "' is declared " + swept.assumption().text);
                return false;
            }
            ConstantEvaluator at = new ConstantEvaluator(constants, point);
            for (String name : point.keySet()) {
                Stmt.Param p = (Stmt.Param) declarations.get(name);
                for (Stmt.Bound b : p.bounds()) {
                    try {
                        double other = at.evaluate(b.value());
                        if (!b.op().test(point.get(name), other)) {
                            diagnostics.error(name.equals(s.param()) ? s.from().span().to(s.to().span()) : s.span(),
                                    "sweep '" + s.label().name() + "' breaks '" + name + " " + b.text() + "' at " + s.param() + " = "
                                            + String.format(java.util.Locale.ROOT, "%.6g", v) + " (SI)");
                            return false;
                        }
                    } catch (ConstantEvaluator.NotConstant e) {
                        // An order on something that is not fixed in a case is the checker's business elsewhere.
                    }
                }
            }
        }
        return true;
    }

    private static boolean sign(Stmt.Param p, double v) {
        return !(p.assumption() == Stmt.Assumption.POSITIVE && !(v > 0) || p.assumption() == Stmt.Assumption.NON_NEGATIVE && !(v >= 0));
    }

    private boolean value(ConstantEvaluator evaluator, Expr e, String name, Map<String, Double> into) {
        try {
            double v = evaluator.evaluate(e);
            if (!Double.isFinite(v)) {
                diagnostics.error(e.span(), "this value is not a finite number in SI units (it overflows, or divides by zero)");
                return false;
            }
            into.put(name, v);
            return true;
        } catch (ConstantEvaluator.NotConstant ex) {
            diagnostics.error(ex.where.span(), "a sweep value must be a fixed number: " + ex.getMessage());
            return false;
        }
    }
}
