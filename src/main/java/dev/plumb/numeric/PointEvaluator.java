package dev.plumb.numeric;

import dev.plumb.lang.Expr;
import dev.plumb.lang.ExprPrinter;
import dev.plumb.model.BuiltinFunction;
import dev.plumb.model.ExprEvaluator;
import dev.plumb.model.Model;
import dev.plumb.model.Symbol;
import java.util.HashMap;
import java.util.Map;

/**
 * Evaluates an expression of the file (a boundary side, a shown quantity, an expectation) on a
 * solved or trial trajectory: profile calls are read at their (constant) argument, unknown
 * constants take their solved values and the free end of the interval is where the surface was
 * found. This runs a handful of times per solve, so it walks the tree directly.
 */
final class PointEvaluator {

    /** What the evaluator needs from a trajectory. */
    interface States {
        /** The state at a point of the interval. */
        double[] stateAt(double x, Expr.Call where) throws SolveException;

        /** The derivatives of the state at a point. */
        double[] derivativesAt(double x, double[] state, Expr.Call where) throws SolveException;

        double constant(int k);

        /** The free end of the interval (NaN when the interval has none). */
        double freeEnd();
    }

    private final Formulation form;
    private final Map<String, Double> values;
    private final States states;

    PointEvaluator(Formulation form, Map<String, Double> values, States states) {
        this.form = form;
        this.values = values;
        this.states = states;
    }

    double evaluate(Expr e) throws SolveException {
        return eval(e, Map.of(), 0);
    }

    private double eval(Expr e, Map<String, Double> args, int depth) throws SolveException {
        if (depth > 200) throw new SolveException(e.span(), "definitions nest too deeply");
        return new Scope(args, depth).evaluate(e);
    }

    /** One level of definition calls: the arguments bound there and how deep the calls nest. */
    private final class Scope extends ExprEvaluator<SolveException> {
        private final Map<String, Double> args;
        private final int depth;

        Scope(Map<String, Double> args, int depth) {
            this.args = args;
            this.depth = depth;
        }

        @Override
        protected double quantity(Expr.Quantity q) throws SolveException {
            return q.value() * ExprCompiler.unitFactor(q);
        }

        @Override
        protected double name(Expr.Name n) throws SolveException {
            return PointEvaluator.this.name(n, args, depth);
        }

        @Override
        protected double call(Expr.Call c) throws SolveException {
            return PointEvaluator.this.call(c, args, depth);
        }
    }

    private double name(Expr.Name n, Map<String, Double> args, int depth) throws SolveException {
        Double bound = args.get(n.id());
        if (bound != null) return bound;
        Model model = form.model;
        Symbol s = model.symbols().get(n.id());
        if (s instanceof Symbol.FreeParam || s instanceof Symbol.FixedParam) {
            Double v = values.get(n.id());
            if (v != null) return v;
            if (s instanceof Symbol.FixedParam f) return f.value();
            throw new SolveException(n.span(), "the free parameter '" + n.id() + "' has no value in this case");
        }
        if (s instanceof Symbol.Builtin b) return b.constant().value();
        if (s instanceof Symbol.UnknownConstant u) {
            if (u == form.freeEnd || u.equals(form.freeEnd)) return states.freeEnd();
            return states.constant(form.constants.indexOf(u));
        }
        if (s instanceof Symbol.Definition d && d.params().isEmpty()) return eval(d.body(), Map.of(), depth + 1);
        if (s instanceof Symbol.Coordinate c) {
            throw new SolveException(n.span(), "the coordinate '" + c.name() + "' has no single value here: evaluate the "
                    + "profiles at a point, e.g. P(0)");
        }
        throw new SolveException(n.span(), "'" + n.id() + "' cannot be evaluated numerically");
    }

    private double call(Expr.Call c, Map<String, Double> args, int depth) throws SolveException {
        Symbol s = form.model.symbols().get(c.callee());
        if (s instanceof Symbol.Definition d) {
            Expr body = c.order() > 0 ? ExprCompiler.derivative(form.model, d, c) : d.body();
            Map<String, Double> inner = new HashMap<>();
            for (int i = 0; i < d.params().size() && i < c.args().size(); i++) {
                inner.put(d.params().get(i), eval(c.args().get(i), args, depth));
            }
            return eval(body, inner, depth + 1);
        }
        if (s instanceof Symbol.Profile p) {
            double x = eval(c.args().get(0), args, depth);
            int j = form.profileIndex(p.name());
            if (c.order() > form.order[j]) {
                throw new SolveException(c.span(), ExprPrinter.print(c) + " is a higher derivative than the relations give");
            }
            double[] y = states.stateAt(x, c);
            if (c.order() < form.order[j]) return y[form.base[j] + c.order()];
            double v = states.derivativesAt(x, y, c)[form.base[j] + form.order[j] - 1];
            if (!Double.isFinite(v)) {
                throw new SolveException(c.span(), ExprPrinter.print(c) + " is not finite at " + form.coordinate.name() + " = "
                        + form.position(x, dev.plumb.model.FileUnits.SHORT) + " (a singular point of the relations)");
            }
            return v;
        }
        var fn = BuiltinFunction.lookup(c.callee());
        if (fn.isPresent() && c.args().size() == 1) return fn.get().apply(eval(c.args().get(0), args, depth));
        throw new SolveException(c.calleeSpan(), "'" + c.callee() + "' cannot be evaluated numerically");
    }
}
