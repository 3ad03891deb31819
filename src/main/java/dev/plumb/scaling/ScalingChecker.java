package dev.plumb.scaling;

import dev.plumb.lang.Expr;
import dev.plumb.lang.ExprPrinter;
import dev.plumb.lang.Stmt;
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
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.function.Function;

/**
 * Checks {@code scaling A ~ B} lines three ways — from the closed form, by dimensional analysis,
 * and by numeric sweeps — and reports them side by side. A claim holds when A and B have the same
 * exponent in every free parameter. A route that decides (holds or fails) outweighs one that
 * cannot; routes that decide both ways leave the claim undecided and say that they contradict
 * each other, since one of them is then wrong and the user should know which way each went.
 */
public final class ScalingChecker {

    private final Model model;
    private final Map<String, Expr> closedForms;
    private final Function<Expr, Optional<ParameterSensitivity.Quantity>> numeric;
    private final Function<String, Symbol> lookup;

    /**
     * @param closedForms quantity as printed ("P(0)") → closed form in parameters and constants
     * @param numeric     a numeric evaluator of a quantity for given parameters, when the model can be solved
     */
    public ScalingChecker(Model model, Map<String, Expr> closedForms, Function<Expr, Optional<ParameterSensitivity.Quantity>> numeric) {
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

    /** The dimensional inputs a quantity can depend on: constants, fixed and free parameters, literals with units. */
    public Map<String, Dimension> inputs(Expr quantity) {
        return ScalingInputs.of(model, quantity);
    }

    private Check check(Stmt.Scaling s) {
        String label = s.label().present() ? s.label().name() : "line " + s.span().line();
        List<String> free = model.freeParams().stream().map(Symbol.FreeParam::name).toList();
        Optional<Map<String, Rational>> claimed = new Monomial(lookup).exponents(s.rhs());
        if (claimed.isEmpty()) {
            return Check.of("scaling", label, s.span(), Status.UNDECIDED,
                    "the right side " + ExprPrinter.print(s.rhs()) + " is not a power law (a product of powers)");
        }
        Map<String, Rational> want = new LinkedHashMap<>();
        for (String p : free) want.put(p, claimed.get().getOrDefault(p, Rational.ZERO));

        DimensionalAnalysis da = DimensionalAnalysis.of(model.dimensionOf(s.lhs()), inputs(s.lhs()));
        List<RouteFinding> findings = new ArrayList<>();
        findings.add(closedFormRoute(s.lhs(), want));
        findings.add(dimensionalRoute(da, s.lhs(), want));
        findings.add(numericRoute(s.lhs(), want));

        List<String> routes = findings.stream().map(RouteFinding::shown).toList();
        String side = " (" + String.join("; ", routes) + ")";
        List<RouteFinding> deciding = findings.stream().filter(RouteFinding::decides).toList();
        boolean anyHolds = deciding.stream().anyMatch(f -> f.decision() == RouteFinding.Decision.HOLDS);
        boolean anyFails = deciding.stream().anyMatch(f -> f.decision() == RouteFinding.Decision.FAILS);
        List<String> deciders = deciding.stream().map(RouteFinding::route).toList();
        List<String> differences = new ArrayList<>();
        for (RouteFinding f : deciding) f.differences().forEach(d -> differences.add(f.route() + ": " + d));

        Status status;
        String message;
        if (deciding.isEmpty()) {
            status = Status.UNDECIDED;
            message = "no route decided" + side;
        } else if (anyHolds && anyFails) {
            status = Status.UNDECIDED;
            List<String> holding = deciding.stream().filter(f -> f.decision() == RouteFinding.Decision.HOLDS).map(RouteFinding::route).toList();
            message = "the routes contradict each other, to be investigated before trusting either: " + String.join(" and ", holding)
                    + " find the claimed exponents, but " + String.join("; ", differences) + side;
        } else if (anyFails) {
            status = Status.FAILS;
            message = String.join("; ", differences) + side;
        } else {
            status = Status.HOLDS;
            message = "exponents agree in " + String.join(", ", free) + " by " + String.join(" and ", deciders) + side;
        }
        Check c = Check.of("scaling", label, s.span(), status, message).with("claimed", exactOnFree(claimed.get(), free))
                .with("routes", routes)
                .with("dimensional_analysis", da.describe(ExprPrinter.print(s.lhs())));
        if (anyHolds && anyFails) c = c.with("contradiction", true);
        Optional<Map<String, Object>> found = deciding.stream().map(RouteFinding::exponents).filter(e -> !e.isEmpty()).findFirst();
        return found.isEmpty() ? c : c.with("exponents", found.get());
    }

    /**
     * A closed form that is a product of powers gives the exponents exactly; any other closed form
     * (such as -Kb*log(1 - rho0*g*D/Kb)) is swept like a numeric answer, evaluated directly.
     */
    private RouteFinding closedFormRoute(Expr lhs, Map<String, Rational> want) {
        Optional<Expr> form = closedForm(lhs);
        if (form.isEmpty()) return RouteFinding.undecided("closed form", "none found");
        Optional<Map<String, Rational>> exact = new Monomial(lookup).exponents(form.get());
        if (exact.isPresent()) {
            List<String> free = List.copyOf(want.keySet());
            return RouteFinding.judged("closed form", DimensionalAnalysis.monomial(onFree(exact.get(), free)),
                    exactDifferences(exact.get(), want), exactOnFree(exact.get(), free));
        }
        String printed = ExprPrinter.print(form.get()) + " is not a product of powers";
        if (model.cases().isEmpty() || want.isEmpty()) {
            return RouteFinding.undecided("closed form", printed + ", and there is no case to sweep it around");
        }
        RouteFinding swept = new SweepRoute(model).judge("closed form", closedFormQuantity(form.get()), doubles(want));
        return new RouteFinding(swept.route(), swept.decision(), printed + "; swept " + swept.finding(), swept.differences(),
                swept.exponents());
    }

    /**
     * Dimensions decide only when they fix the exponents of every free parameter: a dimensionless
     * group that holds one (rho0*g*D/Kb) lets the quantity be any function of it, and then the
     * verdict is left to the routes that can see that function.
     */
    private RouteFinding dimensionalRoute(DimensionalAnalysis da, Expr lhs, Map<String, Rational> want) {
        String described = da.describe(ExprPrinter.print(lhs));
        List<String> free = List.copyOf(want.keySet());
        if (da.fixesExponentsOf(free)) {
            if (!da.groups().isEmpty()) described += "; no group holds a free parameter, so the exponents in them are fixed";
            return RouteFinding.judged("dimensions", described, exactDifferences(da.exponents().get(), want),
                    exactOnFree(da.exponents().get(), free));
        }
        if (da.exponents().isEmpty()) return RouteFinding.undecided("dimensions", described + "; dimensions cannot decide");
        List<String> groups = da.groupsHolding(free).stream().map(DimensionalAnalysis::monomial).toList();
        return RouteFinding.undecided("dimensions", described + "; " + String.join(", ", groups)
                + (groups.size() == 1 ? " holds" : " hold") + " a free parameter, so dimensions alone do not fix the exponents:"
                + " the verdict is left to the other routes");
    }

    private RouteFinding numericRoute(Expr lhs, Map<String, Rational> want) {
        if (want.isEmpty()) return RouteFinding.undecided("numeric sweep", "no free parameter to sweep");
        if (model.cases().isEmpty()) return RouteFinding.undecided("numeric sweep", "no case to sweep around");
        Optional<ParameterSensitivity.Quantity> q = numeric.apply(lhs);
        if (q.isEmpty()) return RouteFinding.undecided("numeric sweep", "the model cannot be solved numerically");
        return new SweepRoute(model).judge("numeric sweep", q.get(), doubles(want));
    }

    private Optional<Expr> closedForm(Expr lhs) {
        Set<String> refs = References.names(lhs);
        boolean direct = refs.stream().noneMatch(n -> model.symbol(n).orElse(null) instanceof Symbol.Profile
                || model.symbol(n).orElse(null) instanceof Symbol.UnknownConstant);
        return direct ? Optional.of(lhs) : Optional.ofNullable(closedForms.get(ExprPrinter.print(lhs)));
    }

    private static List<String> exactDifferences(Map<String, Rational> found, Map<String, Rational> want) {
        List<String> out = new ArrayList<>();
        want.forEach((p, w) -> {
            Rational f = found.getOrDefault(p, Rational.ZERO);
            if (!f.equals(w)) out.add("exponent of " + p + " is " + fmt(f.toDouble()) + ", claimed " + fmt(w.toDouble()));
        });
        return out;
    }

    private static Map<String, Double> doubles(Map<String, Rational> want) {
        Map<String, Double> out = new LinkedHashMap<>();
        want.forEach((p, r) -> out.put(p, r.toDouble()));
        return out;
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

    static String fmt(double v) {
        return v == Math.rint(v) ? Long.toString((long) v) : String.format(Locale.ROOT, "%.6g", v);
    }

    /** The value of a closed form at given parameter values (SI). */
    public ParameterSensitivity.Quantity closedFormQuantity(Expr form) {
        return params -> new ConstantEvaluator(lookup, params).evaluate(form);
    }
}
