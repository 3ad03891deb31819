package dev.plumb.scaling;

import dev.plumb.lang.Expr;
import dev.plumb.lang.ExprPrinter;
import dev.plumb.lang.Stmt;
import dev.plumb.model.CaseValues;
import dev.plumb.model.Check;
import dev.plumb.model.ConstantEvaluator;
import dev.plumb.model.Model;
import dev.plumb.model.References;
import dev.plumb.model.Status;
import dev.plumb.model.Symbol;
import dev.plumb.units.Dimension;
import dev.plumb.units.Rational;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.function.Function;

/**
 * Checks {@code scaling A ~ B} lines three ways — from the closed form, by dimensional analysis,
 * and by numeric sweeps — and reports them side by side. A claim holds when A and B have the same
 * exponent in every free parameter.
 */
public final class ScalingChecker {

    /** Numeric slopes agree with a claimed exponent within this, or four standard errors if larger. */
    static final double SLOPE_TOLERANCE = 1e-4;

    private final Model model;
    private final Map<String, Expr> closedForms;
    private final Function<Expr, Optional<Sweep.Quantity>> numeric;
    private final Function<String, Symbol> lookup;

    /**
     * @param closedForms quantity as printed ("P(0)") → closed form in parameters and constants
     * @param numeric     a numeric evaluator of a quantity for given parameters, when the model can be solved
     */
    public ScalingChecker(Model model, Map<String, Expr> closedForms, Function<Expr, Optional<Sweep.Quantity>> numeric) {
        this.model = model;
        this.closedForms = closedForms;
        this.numeric = numeric;
        this.lookup = name -> model.symbol(name).orElse(null);
    }

    public List<Check> checkAll() {
        List<Check> out = new ArrayList<>();
        for (Stmt.Scaling s : model.scalings()) out.add(check(s));
        return out;
    }

    /** The dimensional inputs a quantity can depend on: free and dimensional fixed parameters, constants. */
    public Map<String, Dimension> inputs(Expr quantity) {
        // A quantity that needs no solving depends only on what it mentions (through definitions);
        // a profile value or an unknown constant depends on everything the relations and boundaries mention.
        Set<String> names = transitive(References.names(quantity));
        boolean solved = names.stream().anyMatch(n -> model.symbol(n).orElse(null) instanceof Symbol.Profile
                || model.symbol(n).orElse(null) instanceof Symbol.UnknownConstant);
        if (solved) {
            for (Stmt s : model.program().statements()) {
                if (s instanceof Stmt.Relation || s instanceof Stmt.Boundary || s instanceof Stmt.Let || s instanceof Stmt.Coord) {
                    names.addAll(References.names(s));
                }
            }
        }
        // Constants first, then fixed and free parameters: monomials then read as G*M^2*R^(-4).
        Map<String, Dimension> out = new LinkedHashMap<>();
        for (Symbol s : model.symbols(Symbol.Builtin.class)) {
            if (!s.dimension().isNone() && names.contains(s.name())) out.put(s.name(), s.dimension());
        }
        for (Symbol s : model.symbols(Symbol.FixedParam.class)) {
            if (!s.dimension().isNone() && names.contains(s.name())) out.put(s.name(), s.dimension());
        }
        for (Symbol.FreeParam p : model.freeParams()) {
            if (names.contains(p.name())) out.put(p.name(), p.dimension());
        }
        return out;
    }

    private Set<String> transitive(Set<String> start) {
        Set<String> out = new LinkedHashSet<>();
        java.util.ArrayDeque<String> todo = new java.util.ArrayDeque<>(start);
        while (!todo.isEmpty()) {
            String n = todo.pop();
            if (!out.add(n)) continue;
            if (model.symbol(n).orElse(null) instanceof Symbol.Definition d) todo.addAll(References.names(d.body()));
        }
        return out;
    }

    private Check check(Stmt.Scaling s) {
        String label = s.label().present() ? s.label().name() : "line " + s.span().line();
        List<String> free = model.freeParams().stream().map(Symbol.FreeParam::name).toList();
        Optional<Map<String, Rational>> claimed = new Monomial(lookup).exponents(s.rhs());
        if (claimed.isEmpty()) {
            return Check.of("scaling", label, s.span(), Status.UNDECIDED,
                    "the right side " + ExprPrinter.print(s.rhs()) + " is not a power law (a product of powers)");
        }
        Map<String, Double> want = new LinkedHashMap<>();
        for (String p : free) want.put(p, claimed.get().getOrDefault(p, Rational.ZERO).toDouble());

        List<String> routes = new ArrayList<>();
        List<String> differences = new ArrayList<>();
        Map<String, Object> found = null;

        Optional<Map<String, Rational>> exact = closedFormExponents(s.lhs());
        if (exact.isPresent()) {
            Map<String, Object> e = exactOnFree(exact.get(), free);
            found = e;
            routes.add("closed form: " + DimensionalAnalysis.monomial(onFree(exact.get(), free)));
            compare("closed form", e, want, 0.0, Map.of(), differences);
        }

        DimensionalAnalysis da = DimensionalAnalysis.of(model.dimensionOf(s.lhs()), inputs(s.lhs()));
        if (da.unique() && da.exponents().isPresent()) {
            Map<String, Object> e = exactOnFree(da.exponents().get(), free);
            if (found == null) found = e;
            routes.add("dimensions: " + da.describe(ExprPrinter.print(s.lhs())));
            compare("dimensional analysis", e, want, 0.0, Map.of(), differences);
        } else {
            routes.add("dimensions: " + da.describe(ExprPrinter.print(s.lhs())));
        }

        Optional<Sweep.Quantity> q = numeric.apply(s.lhs());
        if (q.isPresent() && !model.cases().isEmpty() && !free.isEmpty()) {
            CaseValues base = model.cases().get(0);
            try {
                Map<String, Sweep.Fit> fits = Sweep.slopes(q.get(), base.values(), free, 7, 2.0);
                Map<String, Object> e = new LinkedHashMap<>();
                Map<String, Double> errors = new LinkedHashMap<>();
                StringBuilder text = new StringBuilder("numeric sweep around case " + base.label() + ":");
                fits.forEach((p, f) -> {
                    e.put(p, f.slope());
                    errors.put(p, f.standardError());
                    text.append(String.format(Locale.ROOT, " %s %.6f±%.1e", p, f.slope(), f.standardError()));
                });
                if (found == null) found = e;
                routes.add(text.toString());
                compare("numeric sweep", e, want, SLOPE_TOLERANCE, errors, differences);
            } catch (Exception ex) {
                routes.add("numeric sweep: not possible (" + ex.getMessage() + ")");
            }
        } else if (model.cases().isEmpty() && !free.isEmpty()) {
            routes.add("numeric sweep: no case to sweep around");
        }

        Status status = differences.isEmpty() ? (found == null ? Status.UNDECIDED : Status.HOLDS) : Status.FAILS;
        String message = switch (status) {
            case HOLDS -> "exponents agree in " + String.join(", ", free) + " (" + String.join("; ", routes) + ")";
            case FAILS -> String.join("; ", differences) + " (" + String.join("; ", routes) + ")";
            default -> "no route decided (" + String.join("; ", routes) + ")";
        };
        Check c = Check.of("scaling", label, s.span(), status, message).with("claimed", exactOnFree(claimed.get(), free))
                .with("routes", routes)
                .with("dimensional_analysis", da.describe(ExprPrinter.print(s.lhs())));
        return found == null ? c : c.with("exponents", found);
    }

    private Optional<Map<String, Rational>> closedFormExponents(Expr lhs) {
        Set<String> refs = References.names(lhs);
        boolean direct = refs.stream().noneMatch(n -> model.symbol(n).orElse(null) instanceof Symbol.Profile
                || model.symbol(n).orElse(null) instanceof Symbol.UnknownConstant);
        Monomial monomial = new Monomial(lookup);
        if (direct) return monomial.exponents(lhs);
        Expr form = closedForms.get(ExprPrinter.print(lhs));
        return form == null ? Optional.empty() : monomial.exponents(form);
    }

    private static Map<String, Rational> onFree(Map<String, Rational> e, List<String> free) {
        Map<String, Rational> out = new LinkedHashMap<>(e);
        for (String p : free) out.putIfAbsent(p, Rational.ZERO);
        return out;
    }

    /** Every name with a non-zero exponent (constants such as G included), and every free parameter. */
    private static Map<String, Object> exactOnFree(Map<String, Rational> e, List<String> free) {
        Map<String, Object> out = new LinkedHashMap<>();
        e.forEach((name, r) -> {
            if (!r.isZero()) out.put(name, number(r));
        });
        for (String p : free) out.putIfAbsent(p, 0L);
        return out;
    }

    private static Object number(Rational r) {
        return r.isInteger() ? (Object) r.num() : (Object) r.toDouble();
    }

    private static void compare(String route, Map<String, Object> found, Map<String, Double> want, double tol,
                                Map<String, Double> errors, List<String> differences) {
        for (Map.Entry<String, Double> w : want.entrySet()) {
            double f = ((Number) found.get(w.getKey())).doubleValue();
            double allowed = Math.max(tol, 4 * errors.getOrDefault(w.getKey(), 0.0));
            if (Math.abs(f - w.getValue()) > allowed + 1e-12) {
                differences.add(String.format(Locale.ROOT, "%s: exponent of %s is %s, claimed %s", route, w.getKey(),
                        fmt(f), fmt(w.getValue())));
            }
        }
    }

    private static String fmt(double v) {
        return v == Math.rint(v) ? Long.toString((long) v) : String.format(Locale.ROOT, "%.6g", v);
    }

    /** The value of a closed form at given parameter values (SI). */
    public Sweep.Quantity closedFormQuantity(Expr form) {
        return params -> new ConstantEvaluator(lookup, params).evaluate(form);
    }
}
