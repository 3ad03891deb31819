package dev.plumb.model;

import dev.plumb.lang.Diagnostics;
import dev.plumb.lang.Expr;
import dev.plumb.lang.ExprPrinter;
import dev.plumb.lang.Names;
import dev.plumb.lang.Span;
import dev.plumb.lang.Stmt;
import dev.plumb.units.Constants;
import dev.plumb.units.Dimension;
import dev.plumb.units.Rational;
import dev.plumb.units.UnitException;
import dev.plumb.units.UnitParser;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * Infers the dimension of every expression and reports where units disagree: operands of
 * {@code +} and {@code -}, arguments of functions, exponents, both branches of an {@code if},
 * and (through {@link #requireEqual}) the two sides of every statement.
 */
final class UnitInference {

    final DimensionSolver solver = new DimensionSolver();
    final Map<Expr, DimForm> forms = new IdentityHashMap<>();
    private final Map<String, Stmt> declarations;
    private final Map<String, DimForm> symbolForms = new HashMap<>();
    private final Set<String> inProgress = new HashSet<>();
    private final Diagnostics diagnostics;
    private final ConstantEvaluator constants;
    private final String coordinate;
    /** Let parameters in scope while a definition body is inferred. */
    private Map<String, DimForm> scope = Map.of();

    UnitInference(Map<String, Stmt> declarations, String coordinate, ConstantEvaluator constants, Diagnostics diagnostics) {
        this.declarations = declarations;
        this.coordinate = coordinate;
        this.constants = constants;
        this.diagnostics = diagnostics;
    }

    /** The dimension form of a declared name, inferring a definition's body on first use. */
    DimForm symbolForm(String name) {
        DimForm known = symbolForms.get(name);
        if (known != null) return known;
        Stmt decl = declarations.get(name);
        DimForm f;
        if (decl instanceof Stmt.Param p) {
            f = p.unit() != null ? unit(p.unit().text(), p.unit().span())
                    : p.value() != null ? inScope(Map.of(), p.value()) : DimForm.NONE;
        } else if (decl instanceof Stmt.Coord c) {
            f = c.unit() != null ? unit(c.unit().text(), c.unit().span()) : DimForm.NONE;
        } else if (decl instanceof Stmt.Unknown u) {
            f = u.unit() != null ? unit(u.unit().text(), u.unit().span()) : solver.fresh(u.name());
        } else if (decl instanceof Stmt.Let l) {
            f = definition(l);
        } else {
            f = Constants.lookup(name).map(c -> DimForm.of(c.unit().dimension())).orElse(DimForm.NONE);
        }
        symbolForms.put(name, f);
        return f;
    }

    private DimForm definition(Stmt.Let l) {
        if (!inProgress.add(l.name())) return DimForm.NONE; // cycles are reported by the checker
        try {
            return inScope(paramForms(l), l.body());
        } finally {
            inProgress.remove(l.name());
        }
    }

    /** The dimension of each parameter of a definition: the coordinate's when it shares its name. */
    List<DimForm> letParams(Stmt.Let l) {
        Map<String, DimForm> m = paramForms(l);
        return l.params().stream().map(m::get).toList();
    }

    private final Map<Stmt.Let, Map<String, DimForm>> paramCache = new IdentityHashMap<>();

    private Map<String, DimForm> paramForms(Stmt.Let l) {
        return paramCache.computeIfAbsent(l, k -> {
            Map<String, DimForm> m = new HashMap<>();
            for (String p : l.params()) {
                m.put(p, p.equals(coordinate) ? symbolForm(coordinate) : solver.fresh(p + " in " + l.name()));
            }
            return m;
        });
    }

    private DimForm inScope(Map<String, DimForm> params, Expr body) {
        Map<String, DimForm> saved = scope;
        scope = params;
        try {
            return infer(body);
        } finally {
            scope = saved;
        }
    }

    DimForm unit(String text, Span span) {
        try {
            return DimForm.of(UnitParser.parse(text).dimension());
        } catch (UnitException e) {
            int col = span.column() + 1 + e.offset();
            diagnostics.error(new Span(span.line(), col, span.line(), col + Math.max(1, e.length())), e.getMessage());
            return solver.wildcard();
        }
    }

    DimForm infer(Expr e) {
        DimForm f;
        if (e instanceof Expr.Num n) {
            f = n.value() == 0.0 ? solver.wildcard() : DimForm.NONE;
        } else if (e instanceof Expr.Quantity q) {
            f = unit(q.unit(), q.unitSpan());
        } else if (e instanceof Expr.Name n) {
            f = name(n);
        } else if (e instanceof Expr.Neg n) {
            f = infer(n.operand());
        } else if (e instanceof Expr.Binary b) {
            f = binary(b);
        } else if (e instanceof Expr.If i) {
            DimForm l = infer(i.condition().left());
            DimForm r = infer(i.condition().right());
            mismatch(l, r, i.condition().span(), "the two sides of the comparison have different units",
                    i.condition().left(), i.condition().right());
            DimForm a = infer(i.then());
            DimForm b = infer(i.otherwise());
            mismatch(a, b, i.span(), "the 'then' and 'else' branches have different units", i.then(), i.otherwise());
            f = isWildcardZero(i.then()) ? b : a;
        } else {
            f = call((Expr.Call) e);
        }
        forms.put(e, f);
        return f;
    }

    private DimForm name(Expr.Name n) {
        DimForm local = scope.get(n.id());
        if (local != null) return local;
        Stmt decl = declarations.get(n.id());
        if (decl instanceof Stmt.Unknown u && u.isProfile()) {
            diagnostics.error(n.span(), "'" + n.id() + "' is a profile: give the point, e.g. " + n.id() + "(" + u.args().get(0) + ")");
            return solver.wildcard();
        }
        if (decl instanceof Stmt.Let l && !l.params().isEmpty()) {
            diagnostics.error(n.span(), "'" + n.id() + "' is a function of " + String.join(", ", l.params())
                    + ": call it, e.g. " + n.id() + "(" + String.join(", ", l.params()) + ")");
            return solver.wildcard();
        }
        if (decl == null && Constants.lookup(n.id()).isEmpty()) {
            undefined(n.id(), n.span());
            return solver.wildcard();
        }
        return symbolForm(n.id());
    }

    void undefined(String id, Span span) {
        List<String> candidates = new ArrayList<>(declarations.keySet());
        candidates.addAll(scope.keySet());
        candidates.addAll(Constants.all().keySet());
        String hint = Names.closest(id, candidates).map(s -> "; did you mean '" + s + "'?").orElse("");
        diagnostics.error(span, "'" + id + "' is not defined" + hint,
                "declare it with 'param', 'let' or 'unknown' before using it in a relation");
    }

    private DimForm binary(Expr.Binary b) {
        DimForm l = infer(b.left());
        DimForm r = infer(b.right());
        return switch (b.op()) {
            case ADD, SUB -> {
                mismatch(l, r, b.span(), "the operands of '" + b.op().symbol + "' have different units", b.left(), b.right());
                yield isWildcardZero(b.left()) ? r : l;
            }
            case MUL -> l.mul(r);
            case DIV -> l.div(r);
            case POW -> power(b, l, r);
        };
    }

    private static boolean isWildcardZero(Expr e) {
        return e instanceof Expr.Num n && n.value() == 0.0;
    }

    private DimForm power(Expr.Binary b, DimForm base, DimForm exponent) {
        if (solver.unify(exponent, DimForm.NONE).isPresent()) {
            diagnostics.failure(b.right().span(), "an exponent must be dimensionless, found " + solver.describe(exponent));
            return solver.wildcard();
        }
        Optional<Dimension> baseKnown = solver.known(base);
        if (baseKnown.isPresent() && baseKnown.get().isNone()) return DimForm.NONE;
        try {
            double p = constants.evaluate(b.right());
            Optional<Rational> q = Rational.approximate(p, 10_000);
            if (q.isEmpty()) {
                diagnostics.failure(b.right().span(), "the exponent " + p + " of a quantity with a unit is not a ratio of small integers");
                return solver.wildcard();
            }
            return base.pow(q.get());
        } catch (ConstantEvaluator.NotConstant ex) {
            diagnostics.failure(b.right().span(), "the exponent of a quantity with a unit must be a fixed number",
                    "the base has unit " + solver.describe(base) + ", so its power must not depend on parameters, the coordinate or unknowns");
            return solver.wildcard();
        }
    }

    private DimForm call(Expr.Call c) {
        List<DimForm> args = c.args().stream().map(this::infer).toList();
        Optional<BuiltinFunction> builtin = BuiltinFunction.lookup(c.callee());
        Stmt decl = declarations.get(c.callee());
        if (builtin.isPresent() && decl == null) {
            if (c.order() > 0) {
                diagnostics.error(c.calleeSpan(), "only unknown profiles can be differentiated; '" + c.callee() + "' is a built-in function");
                return solver.wildcard();
            }
            if (args.size() != 1) {
                diagnostics.error(c.span(), "'" + c.callee() + "' takes one argument, found " + args.size());
                return solver.wildcard();
            }
            DimForm a = args.get(0);
            return switch (builtin.get()) {
                case SQRT -> a.pow(Rational.of(1, 2));
                case ABS -> a;
                default -> {
                    if (solver.unify(a, DimForm.NONE).isPresent()) {
                        diagnostics.failure(c.args().get(0).span(), "the argument of '" + c.callee() + "' must be dimensionless, found "
                                + solver.describe(a), hint(c.callee()));
                    }
                    yield DimForm.NONE;
                }
            };
        }
        if (decl instanceof Stmt.Unknown u && u.isProfile()) {
            if (args.size() != 1) {
                diagnostics.error(c.span(), "'" + c.callee() + "' is a profile of one coordinate; found " + args.size() + " arguments");
                return solver.wildcard();
            }
            mismatch(args.get(0), symbolForm(coordinate), c.args().get(0).span(),
                    "the point where '" + c.callee() + "' is taken must have the unit of the coordinate", c.args().get(0), null);
            DimForm f = symbolForm(c.callee());
            return f.div(symbolForm(coordinate).pow(Rational.of(c.order())));
        }
        if (c.order() > 0 && decl instanceof Stmt.Let l) return letDerivative(c, l, args);
        if (c.order() > 0) {
            String what = decl == null ? "not declared" : "not a function of the coordinate";
            String at = coordinate != null ? coordinate
                    : c.args().size() == 1 && c.args().get(0) instanceof Expr.Name n ? n.id() : "r";
            diagnostics.error(c.calleeSpan(), "only unknown profiles and definitions of the coordinate can be differentiated; '"
                    + c.callee() + "' is " + what, (coordinate == null ? "declare a coordinate (coord " + at + " ... from ... to ...), then " : "")
                    + "e.g. unknown " + c.callee() + "(" + at + ") [Pa] with its relation, or let " + c.callee() + "(" + at + ") = ...");
            return solver.wildcard();
        }
        if (decl instanceof Stmt.Let l) {
            if (l.params().size() != args.size()) {
                diagnostics.error(c.span(), "'" + l.name() + "' takes " + l.params().size() + " argument"
                        + (l.params().size() == 1 ? "" : "s") + ", found " + args.size());
                return solver.wildcard();
            }
            List<DimForm> params = letParams(l);
            for (int i = 0; i < args.size(); i++) {
                mismatch(args.get(i), params.get(i), c.args().get(i).span(),
                        "argument " + (i + 1) + " of '" + l.name() + "' has the wrong unit", c.args().get(i), null);
            }
            return symbolForm(l.name());
        }
        if (decl == null) {
            undefined(c.callee(), c.calleeSpan());
        } else {
            diagnostics.error(c.calleeSpan(), "'" + c.callee() + "' is not a function or a profile and cannot be called");
        }
        return solver.wildcard();
    }

    /**
     * {@code rho'(r)} for {@code let rho(r) = ...}: the definition's unit over its argument's, once per
     * prime. A definition without an argument has no derivative (an error); one that does not vary
     * with its argument has the derivative 0 (a warning, as it is likely a slip).
     */
    private DimForm letDerivative(Expr.Call c, Stmt.Let l, List<DimForm> args) {
        String primes = "'".repeat(c.order());
        if (l.params().isEmpty()) {
            diagnostics.error(c.calleeSpan(), "'" + l.name() + "' is not a function: it is defined without an argument (line "
                    + l.span().line() + "), so " + ExprPrinter.print(c) + " has no meaning",
                    "to differentiate it, define it as a function of the coordinate: let " + l.name() + "("
                            + (coordinate == null ? "r" : coordinate) + ") = ...");
            return solver.wildcard();
        }
        if (l.params().size() != 1) {
            diagnostics.error(c.calleeSpan(), "'" + l.name() + "' takes " + l.params().size()
                    + " arguments; only a definition of one argument can be differentiated");
            return solver.wildcard();
        }
        if (args.size() != 1) {
            diagnostics.error(c.span(), "'" + l.name() + "' takes 1 argument, found " + args.size());
            return solver.wildcard();
        }
        DimForm param = letParams(l).get(0);
        mismatch(args.get(0), param, c.args().get(0).span(),
                "the point where " + l.name() + primes + " is taken must have the unit of its argument '" + l.params().get(0) + "'",
                c.args().get(0), null);
        try {
            LetDerivative d = new LetDerivative(n -> declarations.get(n) instanceof Stmt.Let let
                    ? new LetDerivative.Definition(let.params(), let.body()) : null, declarations::containsKey, coordinate, c.span());
            if (!d.dependsOnArgument(l.name())) {
                diagnostics.warning(c.calleeSpan(), "'" + l.name() + "' does not depend on its argument '" + l.params().get(0)
                        + "', so " + ExprPrinter.print(c) + " is 0", "is the definition on line " + l.span().line() + " the one meant?");
            }
        } catch (LetDerivative.NotDifferentiable e) {
            diagnostics.error(c.calleeSpan(), l.name() + primes + " cannot be written out: " + e.getMessage());
        }
        return symbolForm(l.name()).div(param.pow(Rational.of(c.order())));
    }

    /** Reports a mismatch of two forms at {@code span}; returns true when they differ. */
    boolean mismatch(DimForm a, DimForm b, Span span, String message, Expr left, Expr right) {
        return mismatch(a, b, span, message, left, right, false);
    }

    /**
     * Unifies the two unit forms; when they differ, reports it at {@code span} and returns true. With
     * {@code request} set the difference is an error in what the file asks for (a value shown in a unit
     * of another kind, a declaration or a case value of the wrong unit): the run cannot honour it.
     * Otherwise it is a failing unit check of a relation, a step or a claim.
     */
    boolean mismatch(DimForm a, DimForm b, Span span, String message, Expr left, Expr right, boolean request) {
        Optional<DimForm> ratio = solver.unify(a, b);
        if (ratio.isEmpty()) return false;
        List<String> details = new ArrayList<>();
        details.add(String.format("%-6s %-22s %s", "left", abbreviate(left), solver.describe(a)));
        details.add(String.format("%-6s %-22s %s", right == null ? "needs" : "right", right == null ? "" : abbreviate(right),
                solver.describe(b)));
        details.add(hint(ratio.get()));
        if (request) {
            diagnostics.error(span, message, details.toArray(String[]::new));
        } else {
            diagnostics.failure(span, message, details.toArray(String[]::new));
        }
        return true;
    }

    private String hint(DimForm ratio) {
        DimForm coord = symbolForm(coordinate == null ? "" : coordinate);
        String c = coordinate;
        if (c != null && solver.known(coord).isPresent() && !solver.known(coord).get().isNone() && ratio.isKnown()) {
            Dimension r = ratio.known();
            Dimension cd = solver.known(coord).get();
            if (r.equals(cd)) return "(left/right = " + r + ": is a 1/" + c + " missing on the left, or an extra 1/" + c + " on the right?)";
            if (r.equals(cd.inverse())) return "(right/left = " + cd + ": is a 1/" + c + " missing on the right, or an extra 1/" + c + " on the left?)";
        }
        return "(they differ by a factor of " + solver.describe(ratio) + ")";
    }

    private String abbreviate(Expr e) {
        if (e == null) return "";
        String s = ExprPrinter.print(e);
        return s.length() > 22 ? s.substring(0, 19) + "..." : s;
    }

    /** How to make a function's argument dimensionless, with an example of that very function. */
    private static String hint(String function) {
        String example = switch (function) {
            case "exp" -> "exp(-z/H)";
            case "log", "ln" -> "log(P/P0)";
            case "sin", "cos", "tan" -> function + "(k*r), with k in 1/m";
            default -> function + "(x/x0)";
        };
        return "divide by a reference value of the same unit (or multiply by its inverse), e.g. " + example;
    }
}
