package dev.plumb.model;

import dev.plumb.lang.Expr;

/**
 * The arithmetic walk over an expression tree shared by the evaluators of plumb: numbers, negation,
 * the binary operators and conditionals are evaluated here; quantities, names and calls, whose
 * meaning depends on what is being evaluated (a constant, a point of a trajectory), are left to
 * the subclass. Values are doubles in SI base units.
 *
 * @param <X> the exception a hook raises when the expression cannot be evaluated
 */
public abstract class ExprEvaluator<X extends Exception> {

    /** The value of {@code e}, in SI base units. */
    public double evaluate(Expr e) throws X {
        if (e instanceof Expr.Num n) return n.value();
        if (e instanceof Expr.Quantity q) return quantity(q);
        if (e instanceof Expr.Name n) return name(n);
        if (e instanceof Expr.Neg n) return -evaluate(n.operand());
        if (e instanceof Expr.Binary b) {
            double l = evaluate(b.left());
            double r = evaluate(b.right());
            return switch (b.op()) {
                case ADD -> l + r;
                case SUB -> l - r;
                case MUL -> l * r;
                case DIV -> l / r;
                case POW -> Math.pow(l, r);
            };
        }
        if (e instanceof Expr.If i) {
            return i.condition().op().test(evaluate(i.condition().left()), evaluate(i.condition().right()))
                    ? evaluate(i.then()) : evaluate(i.otherwise());
        }
        return call((Expr.Call) e);
    }

    /** A number with a unit, in SI base units. */
    protected abstract double quantity(Expr.Quantity q) throws X;

    /** The value of a name. */
    protected abstract double name(Expr.Name n) throws X;

    /** The value of a call: a definition, a profile, a built-in function. */
    protected abstract double call(Expr.Call c) throws X;
}
