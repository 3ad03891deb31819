package dev.plumb.model;

import dev.plumb.lang.Expr;
import dev.plumb.lang.Span;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.function.Function;
import java.util.function.Predicate;

/**
 * The derivative of a definition of one argument, {@code rho'(r)} for {@code let rho(r) = ...}, as
 * a plumb expression in that argument, made by the rules of differentiation applied to the
 * definition's tree: the numeric side evaluates it exactly where it evaluates any definition (no
 * finite differences), and the checker uses it to tell a definition that does not depend on its
 * argument.
 *
 * <p>Conventions. The derivative is taken with respect to the definition's own parameter. Calls
 * of other definitions of one argument become their derivatives by the chain rule
 * ({@code g'(a)*a'}), profiles likewise ({@code P'(a)*a'}), so a body that uses {@code P(r)} has a
 * derivative that uses {@code P'(r)}. When the parameter bears the coordinate's name, the
 * definition is a function of the coordinate, and definitions without parameters that mention
 * the coordinate ({@code let rho = ...r...}) are written out inside it, so that they vary with it
 * too; the symbolic side makes the same choice.
 */
public final class LetDerivative {

    /** A definition as the differentiation sees it: parameter names and body. */
    public record Definition(List<String> params, Expr body) {
        public Definition {
            params = List.copyOf(params);
        }
    }

    /** The derivative cannot be written (it would need a built-in function the file redefines, say). */
    public static final class NotDifferentiable extends Exception {
        public NotDifferentiable(String message) {
            super(message, null, false, false);
        }
    }

    private final Function<String, Definition> definitions;
    private final Predicate<String> declared;
    private final String coordinate;
    private final Span span;
    private final Map<String, Boolean> dependence = new HashMap<>();
    private final Set<String> visiting = new HashSet<>();

    /**
     * @param definitions the definition a name stands for, or null when it is not one
     * @param declared    whether the file declares a name (which then shadows a built-in function)
     * @param coordinate  the coordinate's name, or null
     * @param span        where the derivative was asked for: every node made carries it, so a failure points there
     */
    public LetDerivative(Function<String, Definition> definitions, Predicate<String> declared, String coordinate, Span span) {
        this.definitions = definitions;
        this.declared = declared;
        this.coordinate = coordinate;
        this.span = span;
    }

    /** For a checked model. */
    public static LetDerivative of(Model model, Span span) {
        return new LetDerivative(name -> model.symbols().get(name) instanceof Symbol.Definition d ? new Definition(d.params(), d.body()) : null,
                name -> model.symbols().containsKey(name) && !(model.symbols().get(name) instanceof Symbol.Builtin),
                model.coordinate().map(Symbol::name).orElse(null), span);
    }

    /**
     * The {@code order}-th derivative of the definition {@code name} (of one parameter) as an
     * expression in that parameter; the number 0 when it does not depend on it.
     */
    public Expr derivative(String name, int order) throws NotDifferentiable {
        Definition d = definitions.apply(name);
        if (d == null || d.params().size() != 1) throw new NotDifferentiable("'" + name + "' is not a definition of one argument");
        String x = d.params().get(0);
        Expr e = expand(d.body(), x);
        for (int k = 0; k < order; k++) {
            e = differentiate(e, x);
            if (e == null) return zero();
        }
        return e;
    }

    /** Whether the definition {@code name} of one parameter varies with it. */
    public boolean dependsOnArgument(String name) throws NotDifferentiable {
        Boolean known = dependence.get(name);
        if (known != null) return known;
        Definition d = definitions.apply(name);
        if (d == null || d.params().size() != 1) return true;
        // A cycle of definitions is reported by the checker; counting it as dependent ends the recursion.
        if (!visiting.add(name)) return true;
        try {
            String x = d.params().get(0);
            boolean depends = differentiate(expand(d.body(), x), x) != null;
            dependence.put(name, depends);
            return depends;
        } finally {
            visiting.remove(name);
        }
    }

    // ---- expansion of definitions without parameters that vary with the coordinate ------------------

    /** The body with every definition without parameters that mentions the coordinate written out, when x is the coordinate. */
    private Expr expand(Expr e, String x) {
        if (coordinate == null || !x.equals(coordinate)) return e;
        return expandNames(e, new HashSet<>());
    }

    private Expr expandNames(Expr e, Set<String> seen) {
        if (e instanceof Expr.Name n) {
            Definition d = definitions.apply(n.id());
            if (d != null && d.params().isEmpty() && mentionsCoordinate(d.body(), new HashSet<>()) && seen.add(n.id())) {
                try {
                    return expandNames(d.body(), seen);
                } finally {
                    seen.remove(n.id());
                }
            }
            return e;
        }
        if (e instanceof Expr.Neg n) return new Expr.Neg(expandNames(n.operand(), seen), n.span());
        if (e instanceof Expr.Binary b) return new Expr.Binary(b.op(), expandNames(b.left(), seen), expandNames(b.right(), seen), b.span());
        if (e instanceof Expr.Call c) {
            return new Expr.Call(c.callee(), c.calleeSpan(), c.order(), c.args().stream().map(a -> expandNames(a, seen)).toList(), c.span());
        }
        if (e instanceof Expr.If i) {
            Expr.Condition c = i.condition();
            return new Expr.If(new Expr.Condition(c.op(), expandNames(c.left(), seen), expandNames(c.right(), seen), c.span()),
                    expandNames(i.then(), seen), expandNames(i.otherwise(), seen), i.span());
        }
        return e;
    }

    private boolean mentionsCoordinate(Expr e, Set<String> seen) {
        boolean[] found = {false};
        References.walk(e, x -> {
            if (found[0] || !(x instanceof Expr.Name n)) return;
            if (n.id().equals(coordinate)) {
                found[0] = true;
                return;
            }
            Definition d = definitions.apply(n.id());
            if (d != null && d.params().isEmpty() && seen.add(n.id()) && mentionsCoordinate(d.body(), seen)) found[0] = true;
        });
        return found[0];
    }

    // ---- the rules -----------------------------------------------------------------------------

    /** d e / d x, or null when it is identically zero. */
    private Expr differentiate(Expr e, String x) throws NotDifferentiable {
        if (e instanceof Expr.Num || e instanceof Expr.Quantity) return null;
        if (e instanceof Expr.Name n) return n.id().equals(x) ? one() : null;
        if (e instanceof Expr.Neg n) return neg(differentiate(n.operand(), x));
        if (e instanceof Expr.If i) {
            Expr t = differentiate(i.then(), x);
            Expr o = differentiate(i.otherwise(), x);
            if (t == null && o == null) return null;
            return new Expr.If(i.condition(), orZero(t), orZero(o), span);
        }
        if (e instanceof Expr.Binary b) return binary(b, x);
        return call((Expr.Call) e, x);
    }

    private Expr binary(Expr.Binary b, String x) throws NotDifferentiable {
        Expr u = b.left(), v = b.right();
        Expr du = differentiate(u, x), dv = differentiate(v, x);
        return switch (b.op()) {
            case ADD -> du == null ? dv : dv == null ? du : op(Expr.BinaryOp.ADD, du, dv);
            case SUB -> dv == null ? du : du == null ? neg(dv) : op(Expr.BinaryOp.SUB, du, dv);
            case MUL -> add(mul(du, v), mul(u, dv));
            case DIV -> {
                if (dv == null) yield du == null ? null : op(Expr.BinaryOp.DIV, du, v);
                Expr second = op(Expr.BinaryOp.DIV, mul(u, dv), op(Expr.BinaryOp.POW, v, number(2)));
                yield du == null ? neg(second) : op(Expr.BinaryOp.SUB, op(Expr.BinaryOp.DIV, du, v), second);
            }
            case POW -> {
                if (du == null && dv == null) yield null;
                // A constant exponent: n u^(n-1) u', which stays real for a negative base (no log of it).
                if (dv == null) yield mul(mul(v, op(Expr.BinaryOp.POW, u, lessOne(v))), du);
                Expr logU = builtin("log", u);
                if (du == null) yield mul(mul(b, logU), dv);
                yield mul(b, add(mul(dv, logU), op(Expr.BinaryOp.DIV, mul(v, du), u)));
            }
        };
    }

    private Expr call(Expr.Call c, String x) throws NotDifferentiable {
        Definition d = definitions.apply(c.callee());
        if (d != null && d.params().size() != 1) {
            if (c.order() > 0) throw new NotDifferentiable("'" + c.callee() + "' takes " + d.params().size() + " arguments and has no derivative");
            return differentiate(substitute(d, c), x);
        }
        if (c.args().size() != 1) throw new NotDifferentiable("'" + c.callee() + "' takes one argument");
        Expr a = c.args().get(0);
        Expr da = differentiate(a, x);
        if (da == null) return null;
        var fn = BuiltinFunction.lookup(c.callee());
        if (d == null && fn.isPresent() && !declared.test(c.callee())) {
            if (c.order() > 0) throw new NotDifferentiable("'" + c.callee() + "' is a built-in function; write its derivative out");
            return mul(function(fn.get(), a), da);
        }
        // A definition of one argument (f'(a) a', unless it does not depend on it) or a profile (P'(a) a').
        if (d != null && !dependsOnArgument(c.callee())) return null;
        return mul(new Expr.Call(c.callee(), span, c.order() + 1, List.of(a), span), da);
    }

    /** f'(u) for a built-in function f: the factor that multiplies u'. */
    private Expr function(BuiltinFunction f, Expr u) throws NotDifferentiable {
        return switch (f) {
            case SQRT -> op(Expr.BinaryOp.DIV, one(), op(Expr.BinaryOp.MUL, number(2), builtin("sqrt", u)));
            case EXP -> builtin("exp", u);
            case LOG, LN -> op(Expr.BinaryOp.DIV, one(), u);
            case LOG10 -> op(Expr.BinaryOp.DIV, one(), op(Expr.BinaryOp.MUL, u, new Expr.Num(Math.log(10), "2.302585092994046", span)));
            case SIN -> builtin("cos", u);
            case COS -> neg(builtin("sin", u));
            case TAN -> op(Expr.BinaryOp.DIV, one(), op(Expr.BinaryOp.POW, builtin("cos", u), number(2)));
            case ASIN -> op(Expr.BinaryOp.DIV, one(), builtin("sqrt", op(Expr.BinaryOp.SUB, one(), square(u))));
            case ACOS -> neg(op(Expr.BinaryOp.DIV, one(), builtin("sqrt", op(Expr.BinaryOp.SUB, one(), square(u)))));
            case ATAN -> op(Expr.BinaryOp.DIV, one(), op(Expr.BinaryOp.ADD, one(), square(u)));
            case SINH -> builtin("cosh", u);
            case COSH -> builtin("sinh", u);
            case TANH -> op(Expr.BinaryOp.DIV, one(), op(Expr.BinaryOp.POW, builtin("cosh", u), number(2)));
            case ASINH -> op(Expr.BinaryOp.DIV, one(), builtin("sqrt", op(Expr.BinaryOp.ADD, square(u), one())));
            // sqrt(u-1)*sqrt(u+1), not sqrt(u^2-1): no cancellation near u = 1.
            case ACOSH -> op(Expr.BinaryOp.DIV, one(), op(Expr.BinaryOp.MUL, builtin("sqrt", op(Expr.BinaryOp.SUB, u, one())),
                    builtin("sqrt", op(Expr.BinaryOp.ADD, u, one()))));
            case ATANH -> op(Expr.BinaryOp.DIV, one(), op(Expr.BinaryOp.SUB, one(), square(u)));
            // The sign of u; at u = 0 the slope from the right.
            case ABS -> new Expr.If(new Expr.Condition(Expr.CompareOp.LT, u, number(0), span), number(-1), one(), span);
        };
    }

    /** A call of a built-in function that the derivative needs, refused when the file gives the name another meaning. */
    private Expr builtin(String name, Expr arg) throws NotDifferentiable {
        if (declared.test(name)) {
            throw new NotDifferentiable("the derivative needs the built-in function '" + name + "', which this file declares as something else");
        }
        return new Expr.Call(name, span, 0, List.of(arg), span);
    }

    /** The body of a definition of several arguments with the arguments put in. */
    private Expr substitute(Definition d, Expr.Call c) throws NotDifferentiable {
        if (d.params().size() != c.args().size()) throw new NotDifferentiable("'" + c.callee() + "' takes " + d.params().size() + " arguments");
        Map<String, Expr> bound = new HashMap<>();
        for (int i = 0; i < d.params().size(); i++) bound.put(d.params().get(i), c.args().get(i));
        return replace(d.body(), bound);
    }

    private static Expr replace(Expr e, Map<String, Expr> bound) {
        if (e instanceof Expr.Name n) return bound.getOrDefault(n.id(), n);
        if (e instanceof Expr.Neg n) return new Expr.Neg(replace(n.operand(), bound), n.span());
        if (e instanceof Expr.Binary b) return new Expr.Binary(b.op(), replace(b.left(), bound), replace(b.right(), bound), b.span());
        if (e instanceof Expr.Call c) return new Expr.Call(c.callee(), c.calleeSpan(), c.order(), c.args().stream().map(a -> replace(a, bound)).toList(), c.span());
        if (e instanceof Expr.If i) {
            Expr.Condition c = i.condition();
            return new Expr.If(new Expr.Condition(c.op(), replace(c.left(), bound), replace(c.right(), bound), c.span()),
                    replace(i.then(), bound), replace(i.otherwise(), bound), i.span());
        }
        return e;
    }

    // ---- building the tree, dropping zeros and unit factors -------------------------------------

    private Expr add(Expr a, Expr b) {
        if (a == null) return b;
        if (b == null) return a;
        return op(Expr.BinaryOp.ADD, a, b);
    }

    private Expr mul(Expr a, Expr b) {
        if (a == null || b == null) return null;
        if (isOne(a)) return b;
        if (isOne(b)) return a;
        return op(Expr.BinaryOp.MUL, a, b);
    }

    private Expr neg(Expr a) {
        if (a == null) return null;
        if (a instanceof Expr.Neg n) return n.operand();
        return new Expr.Neg(a, span);
    }

    private Expr square(Expr u) {
        return op(Expr.BinaryOp.POW, u, number(2));
    }

    /** n - 1 for an exponent n: a number when n is one. */
    private Expr lessOne(Expr n) {
        if (n instanceof Expr.Num k) return number(k.value() - 1);
        return op(Expr.BinaryOp.SUB, n, one());
    }

    private Expr op(Expr.BinaryOp op, Expr a, Expr b) {
        return new Expr.Binary(op, a, b, span);
    }

    private Expr orZero(Expr e) {
        return e == null ? zero() : e;
    }

    private static boolean isOne(Expr e) {
        return e instanceof Expr.Num n && n.value() == 1.0;
    }

    private Expr one() {
        return number(1);
    }

    private Expr zero() {
        return number(0);
    }

    private Expr number(double v) {
        String text = v == Math.rint(v) && Math.abs(v) < 1e15 ? Long.toString((long) v) : Double.toString(v);
        return v < 0 ? new Expr.Neg(new Expr.Num(-v, text.substring(1), span), span) : new Expr.Num(v, text, span);
    }
}
