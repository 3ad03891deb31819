package dev.plumb.model;

import dev.plumb.lang.Expr;
import dev.plumb.units.UnitException;
import dev.plumb.units.UnitParser;
import java.util.Map;
import java.util.function.Function;

/**
 * Evaluates an expression that involves no unknown and no coordinate (a fixed parameter, a case
 * value, a tolerance) to a double in SI base units.
 */
public final class ConstantEvaluator extends ExprEvaluator<ConstantEvaluator.NotConstant> {

    /** Raised when the expression needs something that is not a constant. */
    public static final class NotConstant extends Exception {
        public final Expr where;

        NotConstant(Expr where, String message) {
            super(message, null, false, false);
            this.where = where;
        }
    }

    private final Function<String, Symbol> lookup;
    private final Map<String, Double> bindings;

    /**
     * @param lookup   resolves a name to its symbol (null when unknown)
     * @param bindings values (SI) that take precedence: free parameters of a case, let arguments
     */
    public ConstantEvaluator(Function<String, Symbol> lookup, Map<String, Double> bindings) {
        this.lookup = lookup;
        this.bindings = bindings;
    }

    @Override
    protected double quantity(Expr.Quantity q) throws NotConstant {
        try {
            return q.value() * UnitParser.parse(q.unit()).factor();
        } catch (UnitException ex) {
            throw new NotConstant(q, ex.getMessage());
        }
    }

    @Override
    protected double name(Expr.Name n) throws NotConstant {
        Double bound = bindings.get(n.id());
        if (bound != null) return bound;
        Symbol s = lookup.apply(n.id());
        if (s instanceof Symbol.FixedParam p) return p.value();
        if (s instanceof Symbol.Builtin b) return b.constant().value();
        if (s instanceof Symbol.Definition d && d.params().isEmpty()) return evaluate(d.body());
        if (s == null) throw new NotConstant(n, "'" + n.id() + "' is not defined");
        throw new NotConstant(n, "'" + n.id() + "' has no fixed value here");
    }

    @Override
    protected double call(Expr.Call c) throws NotConstant {
        Symbol s = lookup.apply(c.callee());
        // A declaration of the same name shadows a built-in function.
        if (s == null && c.order() == 0 && BuiltinFunction.lookup(c.callee()).isPresent() && c.args().size() == 1) {
            return BuiltinFunction.lookup(c.callee()).get().apply(evaluate(c.args().get(0)));
        }
        if (s instanceof Symbol.Definition d && d.params().size() == c.args().size()) {
            Expr body = d.body();
            if (c.order() > 0) {
                try {
                    body = new LetDerivative(n -> lookup.apply(n) instanceof Symbol.Definition f ? new LetDerivative.Definition(f.params(), f.body()) : null,
                            n -> lookup.apply(n) != null && !(lookup.apply(n) instanceof Symbol.Builtin), null, c.span()).derivative(d.name(), c.order());
                } catch (LetDerivative.NotDifferentiable ex) {
                    throw new NotConstant(c, ex.getMessage());
                }
            }
            Map<String, Double> inner = new java.util.HashMap<>(bindings);
            for (int i = 0; i < d.params().size(); i++) inner.put(d.params().get(i), evaluate(c.args().get(i)));
            return new ConstantEvaluator(lookup, inner).evaluate(body);
        }
        throw new NotConstant(c, "'" + c.callee() + "(...)' has no fixed value here");
    }
}
