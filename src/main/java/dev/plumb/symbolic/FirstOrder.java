package dev.plumb.symbolic;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.matheclipse.core.expression.F;
import org.matheclipse.core.expression.S;
import org.matheclipse.core.interfaces.IAST;
import org.matheclipse.core.interfaces.IExpr;
import org.matheclipse.core.interfaces.ISymbol;

/**
 * Integrates one first-order relation {@code y' = g(x, y)} from a value at a known point: by direct
 * integration when g is free of y, as a linear relation (isothermal and constant-lapse-rate
 * atmospheres), or by separating the variables, {@code y' = f(x) h(y)}, then solving
 * {@code ∫dy/h = ∫f dx} for y. A root of that last equation is kept only if it meets the relation
 * and the boundary at random points, because Solve returns every branch of a fractional power.
 */
final class FirstOrder {

    /** A closed form and how it was found; the boundary is already applied. */
    record Solution(IExpr closed, List<TrailStep> trail) { }

    /** The relation in placeholders: {@code y} for the profile, {@code yp} for its first derivative. */
    record Relation(IExpr equation, ISymbol y, ISymbol yp, IExpr profileAtX, String px, String dpx) { }

    /** A boundary value {@code y(point) = value}. */
    record Start(String label, IExpr point, IExpr value) { }

    private static final BigDecimal RESIDUAL_TOLERANCE = new BigDecimal("1e-20");

    private final Symja symja;
    private final SymbolTable table;
    private final IExpr assumptions;
    private final ClosedForms closedForms;

    FirstOrder(Symja symja, SymbolTable table, IExpr assumptions, ClosedForms closedForms) {
        this.symja = symja;
        this.table = table;
        this.assumptions = assumptions;
        this.closedForms = closedForms;
    }

    /** The closed form, or null when the relation is none of the three kinds. */
    Solution solve(Relation rel, Start b, Translation t) {
        ISymbol x = table.coordinate;
        ISymbol y = rel.y();
        List<TrailStep> trail = new ArrayList<>();
        IExpr g = derivative(rel);
        if (g == null) return null;
        IExpr closed;
        if (!g.has(y, true)) {
            trail.add(new TrailStep("solve for " + rel.dpx(), rel.dpx() + " = " + closedForms.print(g)));
            IExpr antiderivative = integrate(g, x);
            trail.add(new TrailStep("integrate", rel.px() + " = " + closedForms.print(antiderivative) + " + C"));
            closed = symja.eval(F.Plus(b.value(), antiderivative, F.Negate(Points.at(symja, antiderivative, x, b.point()))));
        } else {
            IExpr a = symja.eval(F.Simplify(F.D(g, y)));
            if (!a.has(y, true)) {
                closed = linear(rel, b, g, a, trail);
            } else {
                return separable(rel, b, g, t);
            }
        }
        trail.add(new TrailStep("apply boundary " + b.label(), rel.px() + " = " + closedForms.print(closed)));
        return new Solution(closed, trail);
    }

    /** {@code y'} from the relation: read off when the relation is {@code y' = ...}, else solved for. */
    private IExpr derivative(Relation rel) {
        IExpr eq = rel.equation();
        IExpr direct = symja.eval(F.Subtract(rel.yp(), eq));
        if (!direct.has(rel.yp(), true)) return direct;
        IExpr solutions = symja.eval(F.Solve(F.Equal(eq, F.C0), rel.yp()));
        if (!solutions.isList() || ((IAST) solutions).argSize() != 1) return null;
        IExpr rules = ((IAST) solutions).arg1();
        if (!rules.isList() || ((IAST) rules).argSize() != 1) return null;
        IExpr rule = ((IAST) rules).arg1();
        if (!rule.isRuleAST() || !rule.first().equals(rel.yp())) return null;
        return rule.second();
    }

    private IExpr linear(Relation rel, Start b, IExpr g, IExpr a, List<TrailStep> trail) {
        ISymbol x = table.coordinate;
        IExpr rest = symja.eval(F.Simplify(F.ReplaceAll(g, F.Rule(rel.y(), F.C0))));
        trail.add(new TrailStep("solve for " + rel.dpx() + " (linear in " + rel.px() + ")", rel.dpx() + " = "
                + closedForms.print(symja.eval(F.ReplaceAll(g, F.Rule(rel.y(), rel.profileAtX()))))));
        IExpr ia = integrate(a, x);
        trail.add(new TrailStep("integrate the coefficient of " + rel.px(), closedForms.print(ia)));
        IExpr phase = symja.eval(F.Subtract(ia, Points.at(symja, ia, x, b.point())));
        IExpr closed;
        if (rest.isZero()) {
            // exp(k*log(u)) becomes u^k only when the exponential is simplified on its own.
            IExpr growth = symja.eval(F.Simplify(F.Exp(ia), assumptions));
            closed = symja.eval(F.Times(b.value(), F.Divide(growth, Points.at(symja, growth, x, b.point()))));
        } else {
            IExpr inner = integrate(symja.eval(F.Times(rest, F.Exp(F.Negate(phase)))), x);
            closed = symja.eval(F.Times(F.Exp(phase), F.Plus(b.value(), inner, F.Negate(Points.at(symja, inner, x, b.point())))));
        }
        trail.add(new TrailStep("integrate", rel.px() + " = " + closedForms.print(closed)));
        return closed;
    }

    private Solution separable(Relation rel, Start b, IExpr g, Translation t) {
        ISymbol x = table.coordinate;
        ISymbol y = rel.y();
        IExpr[] parts = separate(g, x, y);
        if (parts == null) return null;
        List<TrailStep> trail = new ArrayList<>();
        trail.add(new TrailStep("separate the variables", rel.dpx() + " = (" + closedForms.print(parts[0]) + ")*("
                + closedForms.print(symja.eval(F.ReplaceAll(parts[1], F.Rule(y, rel.profileAtX())))) + ")"));
        IExpr left = integrate(symja.eval(F.Power(parts[1], F.CN1)), y);
        IExpr right = integrate(parts[0], x);
        IExpr equation = F.Equal(F.Subtract(left, F.ReplaceAll(left, F.Rule(y, b.value()))),
                F.Subtract(right, Points.at(symja, right, x, b.point())));
        trail.add(new TrailStep("integrate both sides from boundary " + b.label(), closedForms.print(symja.eval(
                F.ReplaceAll(F.Subtract(equation.first(), equation.second()), F.Rule(y, rel.profileAtX())))) + " = 0"));
        IExpr roots = symja.eval(F.Solve(equation, y));
        if (!roots.isList()) return null;
        for (IExpr r : (IAST) roots) {
            if (!r.isList() || ((IAST) r).argSize() != 1 || !((IAST) r).arg1().isRuleAST()) continue;
            IExpr candidate = principalBranch(((IAST) r).arg1().second());
            if (candidate.has(y, true) || !meets(candidate, g, y, b, t)) continue;
            trail.add(new TrailStep("solve for " + rel.px() + " (the root that meets the relation and boundary "
                    + b.label() + ")", rel.px() + " = " + closedForms.print(candidate)));
            return new Solution(candidate, trail);
        }
        throw new Symja.Failure("no root of the separated relation meets it at random points", false);
    }

    /**
     * The antiderivative of one factor in v: {@code u^k} with u linear in v (u = a v + b, so v itself too;
     * {@code u^(k+1)/(a (k+1))}, or {@code log(u)/a} for k = -1) or {@code exp(u)} ({@code exp(u)/a}); else null.
     */
    private IExpr single(IExpr f, ISymbol v) {
        IExpr base = f;
        IExpr k = F.C1;
        if (f.isPower()) {
            base = f.base();
            k = f.exponent();
        }
        if (base.equals(S.E)) {
            IExpr a = linearRate(k, v);
            return a == null ? null : F.Times(f, F.Power(a, F.CN1));
        }
        if (!k.isRational()) return null;
        IExpr a = linearRate(base, v);
        if (a == null) return null;
        IExpr raised = symja.eval(F.Plus(k, F.C1));
        if (raised.isZero()) return F.Times(F.Log(base), F.Power(a, F.CN1));
        return F.Times(F.Power(base, raised), F.Power(F.Times(a, raised), F.CN1));
    }

    /** {@code a} when {@code e = a v + b} with a nonzero {@code a} free of v, else null. */
    private IExpr linearRate(IExpr e, ISymbol v) {
        IExpr a = symja.eval(F.D(e, v));
        if (a.isZero() || a.has(v, true)) return null;
        return a;
    }

    /**
     * A root that holds on a condition over integer constants C(k) (the branches of a logarithm or an
     * inverse function, as Symja solves {@code exp(y) = u}): its principal branch, every C(k) = 0. The
     * caller still decides by {@link #meets} whether it solves the relation; evaluated with the condition
     * left in, each sample point cost seconds of exact arithmetic.
     */
    private IExpr principalBranch(IExpr root) {
        if (!root.isAST(S.ConditionalExpression, 3)) return root;
        return symja.eval(F.ReplaceAll(root.first(), F.Rule(F.unaryAST1(S.C, F.$b()), F.C0)));
    }

    /** {f(x), h(y)} with g = f*h, or null: factor by factor, first as written, then factored, then with powers expanded. */
    private IExpr[] separate(IExpr g, ISymbol x, ISymbol y) {
        for (IExpr form : List.of(g, F.Factor(g), F.PowerExpand(g))) {
            IExpr e;
            try {
                e = symja.eval(form);
            } catch (Symja.Failure f) {
                continue;
            }
            List<IExpr> factors = new ArrayList<>();
            if (e.isTimes()) {
                for (IExpr f : (IAST) e) factors.add(f);
            } else {
                factors.add(e);
            }
            IExpr fx = F.C1;
            IExpr hy = F.C1;
            boolean ok = true;
            for (IExpr f : factors) {
                if (!f.has(y, true)) fx = F.Times(fx, f);
                else if (!f.has(x, true)) hy = F.Times(hy, f);
                else ok = false;
            }
            if (ok) return new IExpr[] {symja.eval(fx), symja.eval(hy)};
        }
        return null;
    }

    /** Whether {@code c(x)} meets {@code y' = g} and the boundary at random points of the domain (where both are real). */
    private boolean meets(IExpr c, IExpr g, ISymbol y, Start b, Translation t) {
        ISymbol x = table.coordinate;
        IExpr residualLeft = symja.eval(F.D(c, x));
        IExpr residualRight = F.ReplaceAll(g, F.Rule(y, c));
        IExpr startLeft = F.ReplaceAll(c, F.Rule(x, b.point()));
        Sampler sampler = new Sampler(symja, table, 7);
        int real = 0;
        for (int i = 0; i < 16 && real < 4; i++) {
            Map<ISymbol, IExpr> p = sampler.point(t);
            BigDecimal l = sampler.value(residualLeft, p);
            BigDecimal r = sampler.value(residualRight, p);
            BigDecimal s = sampler.value(startLeft, p);
            BigDecimal v = sampler.value(b.value(), p);
            if (l == null || r == null || s == null || v == null) continue;
            if (!Comparison.same(l, r, RESIDUAL_TOLERANCE) || !Comparison.same(s, v, RESIDUAL_TOLERANCE)) return false;
            real++;
        }
        return real >= 2;
    }

    private IExpr integrate(IExpr g, ISymbol v) {
        IExpr powers = powerSum(g, v);
        if (powers != null) return powers;
        Symja.loadIntegrationRules();
        IExpr result = symja.eval(F.Integrate(g, v));
        if (result.has(S.Integrate, true)) throw new Symja.Failure("Symja found no antiderivative", false);
        return result;
    }

    /**
     * The antiderivative of a sum of powers {@code c u^k} (c free of v, u = a v + b, k rational; log u for
     * k = -1) and exponentials {@code c exp(a v + b)}, term by term, or null for any other integrand. Most hydrostatic
     * integrands are of this kind (the uniform sphere's is a polynomial, an isothermal layer's an
     * exponential), and they need none of the algebra system's integration rules, whose
     * loading costs more than the rest of such a file's symbolic work. The result is accepted only when
     * its derivative expands to the integrand.
     */
    private IExpr powerSum(IExpr g, ISymbol v) {
        try {
            IExpr asWritten = termwise(g, v);
            if (asWritten != null || !expandable(g)) return asWritten;
            return termwise(symja.eval(F.Expand(g)), v);
        } catch (Symja.Failure f) {
            return null;
        }
    }

    /** Whether expanding {@code e} stays small: no integer power above 16 (a (1 + x)^1000000 is left whole). */
    private static boolean expandable(IExpr e) {
        if (e.isPower() && e.exponent().isInteger() && Math.abs(e.exponent().evalDouble()) > 16) return false;
        if (e instanceof IAST ast) {
            for (IExpr arg : ast) if (!expandable(arg)) return false;
        }
        return true;
    }

    private IExpr termwise(IExpr expanded, ISymbol v) {
        List<IExpr> terms = new ArrayList<>();
        if (expanded.isPlus()) {
            for (IExpr term : (IAST) expanded) terms.add(term);
        } else {
            terms.add(expanded);
        }
        List<IExpr> integrated = new ArrayList<>();
        for (IExpr term : terms) {
            IExpr coefficient = F.C1;
            IExpr varying = null;
            List<IExpr> factors = new ArrayList<>();
            if (term.isTimes()) {
                for (IExpr f : (IAST) term) factors.add(f);
            } else {
                factors.add(term);
            }
            for (IExpr f : factors) {
                if (!f.has(v, true)) coefficient = F.Times(coefficient, f);
                else if (varying == null) varying = f;
                else return null;
            }
            IExpr antiderivative = varying == null ? v : single(varying, v);
            if (antiderivative == null) return null;
            integrated.add(F.Times(coefficient, antiderivative));
        }
        IExpr result = symja.eval(F.Plus(integrated.toArray(IExpr[]::new)));
        IExpr check = symja.eval(F.Subtract(F.D(result, v), expanded));
        if (!check.isZero() && expandable(check)) check = symja.eval(F.Expand(check));
        if (!check.isZero() && expandable(check)) check = symja.eval(F.Together(check));
        return check.isZero() ? result : null;
    }
}
