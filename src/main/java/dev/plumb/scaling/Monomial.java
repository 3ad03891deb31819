package dev.plumb.scaling;

import dev.plumb.lang.Expr;
import dev.plumb.model.ConstantEvaluator;
import dev.plumb.model.Symbol;
import dev.plumb.units.Rational;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Optional;
import java.util.function.Function;

/**
 * Reads an expression as a power-law monomial (a constant times a product of names raised to
 * fixed powers), giving the exponent of each name. Definitions without parameters are expanded.
 */
public final class Monomial {
    private final Function<String, Symbol> lookup;
    private final boolean profileAtoms;

    public Monomial(Function<String, Symbol> lookup) {
        this(lookup, false);
    }

    /**
     * @param profileAtoms treat a profile value such as {@code P(z)} as an atom named after the
     *                     profile, and expand calls of definitions at the coordinate
     */
    public Monomial(Function<String, Symbol> lookup, boolean profileAtoms) {
        this.lookup = lookup;
        this.profileAtoms = profileAtoms;
    }

    /** The exponent of every name in {@code e}, or empty when {@code e} is not a monomial. */
    public Optional<Map<String, Rational>> exponents(Expr e) {
        Map<String, Rational> out = new LinkedHashMap<>();
        return collect(e, Rational.ONE, out) ? Optional.of(out) : Optional.empty();
    }

    private boolean collect(Expr e, Rational power, Map<String, Rational> out) {
        if (e instanceof Expr.Num || e instanceof Expr.Quantity) return true;
        if (e instanceof Expr.Neg n) return collect(n.operand(), power, out);
        if (e instanceof Expr.Name n) {
            Symbol s = lookup.apply(n.id());
            if (s instanceof Symbol.Definition d && d.params().isEmpty()) return collect(d.body(), power, out);
            if (s instanceof Symbol.FixedParam && s.dimension().isNone()) return true;
            if (s instanceof Symbol.Builtin b && b.dimension().isNone()) return true;
            out.merge(n.id(), power, Rational::add);
            out.values().removeIf(Rational::isZero);
            return true;
        }
        if (e instanceof Expr.Binary b) {
            switch (b.op()) {
                case MUL:
                    return collect(b.left(), power, out) && collect(b.right(), power, out);
                case DIV:
                    return collect(b.left(), power, out) && collect(b.right(), power.neg(), out);
                case POW:
                    try {
                        double p = new ConstantEvaluator(lookup, Map.of()).evaluate(b.right());
                        Optional<Rational> q = Rational.approximate(p, 10_000);
                        return q.isPresent() && collect(b.left(), power.mul(q.get()), out);
                    } catch (ConstantEvaluator.NotConstant ex) {
                        return false;
                    }
                default:
                    return isConstant(b);
            }
        }
        if (profileAtoms && e instanceof Expr.Call c && c.order() == 0) {
            Symbol s = lookup.apply(c.callee());
            if (s instanceof Symbol.Profile) {
                out.merge(c.callee(), power, Rational::add);
                out.values().removeIf(Rational::isZero);
                return true;
            }
            if (s instanceof Symbol.Definition d && d.params().size() == c.args().size() && sameNames(d.params(), c.args())) {
                return collect(d.body(), power, out);
            }
        }
        if (e instanceof Expr.Call c && c.callee().equals("sqrt") && c.args().size() == 1 && lookup.apply("sqrt") == null) {
            return collect(c.args().get(0), power.mul(Rational.of(1, 2)), out);
        }
        return isConstant(e);
    }

    private static boolean sameNames(java.util.List<String> params, java.util.List<Expr> args) {
        for (int i = 0; i < params.size(); i++) {
            if (!(args.get(i) instanceof Expr.Name n) || !n.id().equals(params.get(i))) return false;
        }
        return true;
    }

    private boolean isConstant(Expr e) {
        try {
            new ConstantEvaluator(lookup, Map.of()).evaluate(e);
            return true;
        } catch (ConstantEvaluator.NotConstant ex) {
            return false;
        }
    }
}
