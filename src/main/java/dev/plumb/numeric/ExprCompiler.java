package dev.plumb.numeric;

import dev.plumb.lang.Expr;
import dev.plumb.lang.ExprPrinter;
import dev.plumb.model.BuiltinFunction;
import dev.plumb.model.Model;
import dev.plumb.model.Symbol;
import dev.plumb.units.UnitException;
import dev.plumb.units.UnitParser;
import java.util.ArrayList;
import java.util.BitSet;
import java.util.HashMap;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;

/**
 * Compiles checked plumb expressions into {@link Evaluator} trees for one set of parameter
 * values: every parameter, built-in constant and quantity literal is converted to SI and folded
 * once here, definitions are inlined, and what varies during a solve (the coordinate, the state,
 * the unknown constants) becomes a slot of the frame.
 */
final class ExprCompiler {

    /** Where the varying quantities live in the frame; decided by the {@link Formulation}. */
    interface Slots {
        int COORDINATE = 0;

        /** The slot of derivative {@code order} of a profile evaluated at the coordinate. */
        int profile(Symbol.Profile p, int order, Expr.Call call) throws SolveException;

        /** The slot of an unknown constant. */
        int constant(Symbol.UnknownConstant u, Expr.Name at) throws SolveException;

        /** A fresh slot for locking the branch of a coordinate-only {@code if}. */
        int newLock();

        /** Two fresh slots (value, stamp) for a shared definition value, or -1 when sharing is off. */
        int newShared();

        /** The slot counting evaluations, or -1 when sharing is off. */
        int epoch();

        /** Whether a tree reading these slots may be shared within one evaluation (it must not read the slots solved for). */
        boolean shareable(BitSet reads);
    }

    /** A condition {@code g(x) <op> 0} that depends on the coordinate alone: a break of a piecewise relation. */
    record CoordinateCondition(Evaluator g, Expr.CompareOp op, int lockSlot, dev.plumb.lang.Span span) { }

    private final Model model;
    private final Map<String, Double> values;
    private final Slots slots;
    private final Map<Evaluator, BitSet> deps = new IdentityHashMap<>();
    private final List<CoordinateCondition> conditions = new ArrayList<>();
    private final Map<String, Evaluator> shared = new HashMap<>();
    private final java.util.Set<String> parametersRead = new java.util.LinkedHashSet<>();
    private int depth;

    /**
     * @param values SI values of the free parameters, and of any fixed parameter to override
     */
    ExprCompiler(Model model, Map<String, Double> values, Slots slots) {
        this.model = model;
        this.values = values;
        this.slots = slots;
    }

    /** The parameters whose values the trees compiled so far have folded in. */
    java.util.Set<String> parametersRead() {
        return java.util.Set.copyOf(parametersRead);
    }

    List<CoordinateCondition> conditions() {
        return List.copyOf(conditions);
    }

    Evaluator compile(Expr e) throws SolveException {
        return compile(e, Map.of());
    }

    private Evaluator compile(Expr e, Map<String, Evaluator> args) throws SolveException {
        if (e instanceof Expr.Num n) return constant(n.value());
        if (e instanceof Expr.Quantity q) return constant(q.value() * unitFactor(q));
        if (e instanceof Expr.Name n) return name(n, args);
        if (e instanceof Expr.Neg n) {
            Evaluator a = compile(n.operand(), args);
            if (a.isConstant()) return constant(-a.at(null));
            if (a instanceof Evaluator.Scale s) return track(new Evaluator.Scale(-s.c, s.a), s.a);
            return track(new Evaluator.Neg(a), a);
        }
        if (e instanceof Expr.Binary b) return binary(b.op(), compile(b.left(), args), compile(b.right(), args));
        if (e instanceof Expr.If i) return branch(i, args);
        return call((Expr.Call) e, args);
    }

    static double unitFactor(Expr.Quantity q) throws SolveException {
        try {
            return UnitParser.parse(q.unit()).factor();
        } catch (UnitException ex) {
            throw new SolveException(q.unitSpan(), "unknown unit [" + q.unit() + "]: " + ex.getMessage());
        }
    }

    private Evaluator name(Expr.Name n, Map<String, Evaluator> args) throws SolveException {
        Evaluator bound = args.get(n.id());
        if (bound != null) return bound;
        Symbol s = model.symbols().get(n.id());
        if (s instanceof Symbol.Coordinate) return slot(Slots.COORDINATE);
        if (s instanceof Symbol.FreeParam || s instanceof Symbol.FixedParam) {
            parametersRead.add(n.id());
            Double v = values.get(n.id());
            if (v != null) return constant(v);
            if (s instanceof Symbol.FixedParam f) return constant(f.value());
            throw new SolveException(n.span(), "the free parameter '" + n.id() + "' has no value in this case");
        }
        if (s instanceof Symbol.Builtin b) return constant(b.constant().value());
        if (s instanceof Symbol.UnknownConstant u) return slot(slots.constant(u, n));
        if (s instanceof Symbol.Definition d && d.params().isEmpty()) return share(d.name(), inline(d, d.body(), Map.of(), n));
        if (s instanceof Symbol.Profile p) {
            throw new SolveException(n.span(), "the profile '" + p.name() + "' needs its argument here, e.g. " + p.name() + "("
                    + model.coordinate().map(Symbol::name).orElse("r") + ")");
        }
        throw new SolveException(n.span(), "'" + n.id() + "' cannot be evaluated numerically here");
    }

    private Evaluator inline(Symbol.Definition d, Expr body, Map<String, Evaluator> args, Expr at) throws SolveException {
        // The checker rejects definition cycles; the depth guard keeps a missed one from overflowing the stack.
        if (++depth > 200) throw new SolveException(at.span(), "definitions nest too deeply at '" + d.name() + "'");
        try {
            return compile(body, args);
        } finally {
            depth--;
        }
    }

    private Evaluator call(Expr.Call c, Map<String, Evaluator> args) throws SolveException {
        Symbol s = model.symbols().get(c.callee());
        if (s instanceof Symbol.Definition d) {
            Expr body = c.order() > 0 ? derivative(model, d, c) : d.body();
            if (d.params().size() != c.args().size()) {
                throw new SolveException(c.span(), "'" + d.name() + "' takes " + d.params().size() + " argument(s)");
            }
            Map<String, Evaluator> inner = new HashMap<>();
            StringBuilder key = new StringBuilder(d.name()).append("'".repeat(c.order())).append('(');
            for (int i = 0; i < d.params().size(); i++) {
                Evaluator a = compile(c.args().get(i), args);
                inner.put(d.params().get(i), a);
                key.append(a.isConstant() ? "c" + a.at(null) : a.slot() >= 0 ? "s" + a.slot() : "@" + System.identityHashCode(a)).append(',');
            }
            String k = key.toString();
            Evaluator known = shared.get(k);
            return known != null ? known : share(k, inline(d, body, inner, c));
        }
        if (s instanceof Symbol.Profile p) {
            if (c.args().size() != 1) throw new SolveException(c.span(), "'" + p.name() + "' takes one argument");
            Evaluator arg = compile(c.args().get(0), args);
            if (arg.slot() != Slots.COORDINATE) {
                throw new SolveException(c.span(), ExprPrinter.print(c) + " inside a relation must be taken at the coordinate '"
                        + model.coordinate().map(Symbol::name).orElse("?") + "', not at a fixed point");
            }
            return slot(slots.profile(p, c.order(), c));
        }
        var fn = BuiltinFunction.lookup(c.callee());
        if (fn.isPresent() && c.order() == 0 && c.args().size() == 1) {
            Evaluator a = compile(c.args().get(0), args);
            if (a.isConstant()) return constant(fn.get().apply(a.at(null)));
            Evaluator out = switch (fn.get()) {
                case SQRT -> new Evaluator.Sqrt(a);
                case EXP -> new Evaluator.Exp(a);
                default -> new Evaluator.Function(fn.get(), a);
            };
            return track(out, a);
        }
        throw new SolveException(c.calleeSpan(), "'" + c.callee() + "' cannot be called numerically here");
    }

    /** The body of {@code f'(a)}, {@code f''(a)}... for {@code let f(x) = ...}: the definition differentiated, to be evaluated like it. */
    static Expr derivative(Model model, Symbol.Definition d, Expr.Call c) throws SolveException {
        try {
            return dev.plumb.model.LetDerivative.of(model, c.span()).derivative(d.name(), c.order());
        } catch (dev.plumb.model.LetDerivative.NotDifferentiable ex) {
            throw new SolveException(c.span(), ExprPrinter.print(c) + " cannot be evaluated: " + ex.getMessage());
        }
    }

    /** Wraps a compiled definition so repeated uses in one evaluation compute it once. */
    private Evaluator share(String key, Evaluator body) {
        if (body.isConstant() || body.slot() >= 0 || !slots.shareable(depsOf(body))) return body;
        Evaluator known = shared.get(key);
        if (known != null) return known;
        int base = slots.newShared();
        if (base < 0) return body;
        Evaluator e = track(new Evaluator.Shared(body, base, base + 1, slots.epoch()), body);
        shared.put(key, e);
        return e;
    }

    private Evaluator branch(Expr.If i, Map<String, Evaluator> args) throws SolveException {
        Evaluator l = compile(i.condition().left(), args);
        Evaluator r = compile(i.condition().right(), args);
        Evaluator t = compile(i.then(), args);
        Evaluator o = compile(i.otherwise(), args);
        if (l.isConstant() && r.isConstant()) return i.condition().op().test(l.at(null), r.at(null)) ? t : o;
        BitSet condDeps = new BitSet();
        condDeps.or(depsOf(l));
        condDeps.or(depsOf(r));
        int lock = -1;
        if (condDeps.cardinality() == 1 && condDeps.get(Slots.COORDINATE)) {
            lock = slots.newLock();
            conditions.add(new CoordinateCondition(binary(Expr.BinaryOp.SUB, l, r), i.condition().op(), lock, i.condition().span()));
        }
        return track(new Evaluator.Branch(i.condition().op(), l, r, t, o, lock), l, r, t, o);
    }

    private Evaluator binary(Expr.BinaryOp op, Evaluator a, Evaluator b) {
        if (a.isConstant() && b.isConstant()) {
            double x = a.at(null), y = b.at(null);
            return constant(switch (op) {
                case ADD -> x + y;
                case SUB -> x - y;
                case MUL -> x * y;
                case DIV -> x / y;
                case POW -> Math.pow(x, y);
            });
        }
        return switch (op) {
            case ADD -> isZero(a) ? b : isZero(b) ? a : track(new Evaluator.Add(a, b), a, b);
            case SUB -> isZero(b) ? a : isZero(a) ? negate(b) : track(new Evaluator.Sub(a, b), a, b);
            case MUL -> a.isConstant() ? scale(a.at(null), b) : b.isConstant() ? scale(b.at(null), a)
                    : a.slot() >= 0 ? track(new Evaluator.SlotTimes(a.slot(), b), a, b)
                    : b.slot() >= 0 ? track(new Evaluator.SlotTimes(b.slot(), a), a, b)
                    : track(new Evaluator.Mul(a, b), a, b);
            case DIV -> b.isConstant() ? scale(1.0 / b.at(null), a)
                    : a.slot() >= 0 && b.slot() >= 0 ? track(new Evaluator.SlotRatio(a.slot(), b.slot()), a, b)
                    : b instanceof Evaluator.SlotSquare sq ? track(new Evaluator.OverSlotSquare(a, sq.i), a, b)
                    : a.isConstant() && a.at(null) == 1.0 ? track(new Evaluator.Reciprocal(b), b)
                    : a.isConstant() ? scale(a.at(null), track(new Evaluator.Reciprocal(b), b))
                    : track(new Evaluator.Div(a, b), a, b);
            case POW -> b.isConstant() ? power(a, b.at(null)) : track(new Evaluator.Pow(a, b), a, b);
        };
    }

    private Evaluator power(Evaluator a, double c) {
        if (c == 1.0) return a;
        if (c == 0.0) return constant(1.0);
        if (c == 2.0) return track(a.slot() >= 0 ? new Evaluator.SlotSquare(a.slot()) : new Evaluator.Square(a), a);
        if (c == 3.0) return track(new Evaluator.Cube(a), a);
        if (c == 0.5) return track(new Evaluator.Sqrt(a), a);
        if (c == -1.0) return track(new Evaluator.Reciprocal(a), a);
        if (c == -2.0) return track(new Evaluator.Reciprocal(track(new Evaluator.Square(a), a)), a);
        return track(new Evaluator.PowConst(a, c), a);
    }

    private Evaluator scale(double c, Evaluator a) {
        if (c == 1.0) return a;
        if (c == -1.0) return negate(a);
        if (a instanceof Evaluator.Scale s) return scale(c * s.c, s.a);
        return track(new Evaluator.Scale(c, a), a);
    }

    private Evaluator negate(Evaluator a) {
        if (a instanceof Evaluator.Scale s) return scale(-s.c, s.a);
        return track(new Evaluator.Neg(a), a);
    }

    private static boolean isZero(Evaluator e) {
        return e.isConstant() && e.at(null) == 0.0;
    }

    private Evaluator constant(double v) {
        return Evaluator.constant(v);
    }

    private Evaluator slot(int i) {
        Evaluator e = Evaluator.slot(i);
        BitSet d = new BitSet();
        d.set(i);
        deps.put(e, d);
        return e;
    }

    private Evaluator track(Evaluator e, Evaluator... children) {
        BitSet d = new BitSet();
        for (Evaluator c : children) d.or(depsOf(c));
        deps.put(e, d);
        return e;
    }

    /** The slots a compiled tree reads. */
    BitSet depsOf(Evaluator e) {
        BitSet d = deps.get(e);
        return d == null ? new BitSet() : d;
    }
}
