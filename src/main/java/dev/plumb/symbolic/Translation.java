package dev.plumb.symbolic;

import dev.plumb.lang.Expr;
import dev.plumb.model.BuiltinFunction;
import dev.plumb.model.Symbol;
import dev.plumb.units.UnitException;
import dev.plumb.units.UnitParser;
import java.math.BigDecimal;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.matheclipse.core.expression.F;
import org.matheclipse.core.expression.S;
import org.matheclipse.core.interfaces.IExpr;
import org.matheclipse.core.interfaces.ISymbol;

/**
 * Builds Symja trees from plumb expressions, with the {@code let} definitions substituted and,
 * where known, the closed forms of profiles and the values of unknown constants put in. Numbers
 * become exact rationals from their written digits, so {@code 1.5} is {@code 3/2}.
 */
final class Translation {

    /** Raised for an expression that has no Symja counterpart (a call of an undefined name, say). */
    static final class Untranslatable extends Exception {
        Untranslatable(String message) {
            super(message, null, false, false);
        }
    }

    private final SymbolTable table;
    private final Symja symja;
    private final Map<String, IExpr> profiles;
    private final Map<String, IExpr> constants;

    /**
     * @param profiles  closed forms of profiles in the coordinate symbol (may be empty)
     * @param constants values of unknown constants (may be empty)
     */
    Translation(SymbolTable table, Symja symja, Map<String, IExpr> profiles, Map<String, IExpr> constants) {
        this.table = table;
        this.symja = symja;
        this.profiles = profiles;
        this.constants = constants;
    }

    Translation with(Map<String, IExpr> moreProfiles) {
        Map<String, IExpr> p = new HashMap<>(profiles);
        p.putAll(moreProfiles);
        return new Translation(table, symja, p, constants);
    }

    SymbolTable table() {
        return table;
    }

    /** The Symja head that stands for an unknown profile whose closed form is not known. */
    ISymbol head(String profile) {
        return table.symbol(profile);
    }

    IExpr plain(Expr e) throws Untranslatable {
        return expr(e, Map.of());
    }

    private IExpr expr(Expr e, Map<String, IExpr> locals) throws Untranslatable {
        if (e instanceof Expr.Num n) return exact(n.text(), n.value());
        if (e instanceof Expr.Quantity q) return quantity(q);
        if (e instanceof Expr.Name n) return name(n.id(), locals);
        if (e instanceof Expr.Neg n) return F.Negate(expr(n.operand(), locals));
        if (e instanceof Expr.Binary b) {
            IExpr l = expr(b.left(), locals);
            IExpr r = expr(b.right(), locals);
            return switch (b.op()) {
                case ADD -> F.Plus(l, r);
                case SUB -> F.Subtract(l, r);
                case MUL -> F.Times(l, r);
                case DIV -> F.Divide(l, r);
                case POW -> F.Power(l, r);
            };
        }
        if (e instanceof Expr.If i) {
            IExpr cl = expr(i.condition().left(), locals);
            IExpr cr = expr(i.condition().right(), locals);
            IExpr cond = switch (i.condition().op()) {
                case LT -> F.Less(cl, cr);
                case LE -> F.LessEqual(cl, cr);
                case GT -> F.Greater(cl, cr);
                case GE -> F.GreaterEqual(cl, cr);
            };
            return F.Piecewise(F.list(F.list(expr(i.then(), locals), cond)), expr(i.otherwise(), locals));
        }
        return call((Expr.Call) e, locals);
    }

    static IExpr exact(String text, double value) {
        BigDecimal d;
        try {
            d = new BigDecimal(text);
        } catch (NumberFormatException ex) {
            d = new BigDecimal(value);
        }
        return rational(d);
    }

    static IExpr rational(BigDecimal d) {
        if (d.scale() <= 0) return F.ZZ(d.toBigIntegerExact());
        return F.fraction(d.unscaledValue(), java.math.BigInteger.TEN.pow(d.scale()));
    }

    private static IExpr quantity(Expr.Quantity q) throws Untranslatable {
        double factor;
        try {
            factor = UnitParser.parse(q.unit()).factor();
        } catch (UnitException ex) {
            throw new Untranslatable(ex.getMessage());
        }
        return F.Times(exact(q.text(), q.value()), rational(new BigDecimal(Double.toString(factor))));
    }

    private IExpr name(String id, Map<String, IExpr> locals) throws Untranslatable {
        IExpr local = locals.get(id);
        if (local != null) return local;
        Symbol s = table.model().symbols().get(id);
        if (s instanceof Symbol.Definition d && d.params().isEmpty()) return expr(d.body(), Map.of());
        if (s instanceof Symbol.Builtin b && b.name().equals("pi")) return S.Pi;
        if (s instanceof Symbol.Builtin b && b.name().equals("e")) return S.E;
        if (s instanceof Symbol.UnknownConstant && constants.containsKey(id)) return constants.get(id);
        var exact = table.exactValue(id);
        if (exact.isPresent()) return exact.get();
        ISymbol sym = table.symbol(id);
        if (sym == null) throw new Untranslatable("'" + id + "' is not defined");
        return sym;
    }

    private IExpr call(Expr.Call c, Map<String, IExpr> locals) throws Untranslatable {
        Symbol s = table.model().symbols().get(c.callee());
        List<IExpr> args = new java.util.ArrayList<>();
        for (Expr a : c.args()) args.add(expr(a, locals));
        if (s instanceof Symbol.Definition d && c.order() == 0 && d.params().size() == args.size()) {
            Map<String, IExpr> inner = new HashMap<>();
            for (int i = 0; i < args.size(); i++) inner.put(d.params().get(i), args.get(i));
            return expr(d.body(), inner);
        }
        if (s instanceof Symbol.Definition d && c.order() > 0 && d.params().size() == 1 && args.size() == 1) {
            return letDerivative(d, c.order(), args.get(0));
        }
        if (s instanceof Symbol.Profile p && args.size() == 1) return profile(p.name(), c.order(), args.get(0));
        var builtin = BuiltinFunction.lookup(c.callee());
        if (s == null && builtin.isPresent() && c.order() == 0 && args.size() == 1) return function(builtin.get(), args.get(0));
        throw new Untranslatable("'" + c.callee() + "' cannot be called here");
    }

    /**
     * {@code f^(order)(at)} for {@code let f(x) = ...}: the body in a fresh symbol, differentiated by
     * Symja and taken at the point. When the parameter bears the coordinate's name the definition is a
     * function of the coordinate, and whatever in it varies with the coordinate (a definition without
     * parameters that mentions it, a profile) varies with the argument too, as in {@link
     * dev.plumb.model.LetDerivative}.
     */
    private IExpr letDerivative(Symbol.Definition d, int order, IExpr at) throws Untranslatable {
        ISymbol t = F.Dummy("pzarg");
        IExpr body = expr(d.body(), Map.of(d.params().get(0), t));
        boolean ofCoordinate = table.model().coordinate().map(x -> x.name().equals(d.params().get(0))).orElse(false);
        if (ofCoordinate) body = body.replaceAll(x -> x == table.coordinate ? t : F.NIL).orElse(body);
        IExpr derivative = symja.eval(F.D(body, F.list(t, F.ZZ(order))));
        return Points.at(symja, derivative, t, at, table.assumptions(this));
    }

    private static IExpr function(BuiltinFunction f, IExpr a) {
        return switch (f) {
            case SQRT -> F.Sqrt(a);
            case EXP -> F.Exp(a);
            case LOG, LN -> F.Log(a);
            case LOG10 -> F.Divide(F.Log(a), F.Log(F.ZZ(10)));
            case SIN -> F.Sin(a);
            case COS -> F.Cos(a);
            case TAN -> F.Tan(a);
            case ASIN -> F.ArcSin(a);
            case ACOS -> F.ArcCos(a);
            case ATAN -> F.ArcTan(a);
            case SINH -> F.Sinh(a);
            case COSH -> F.Cosh(a);
            case TANH -> F.Tanh(a);
            case ASINH -> F.ArcSinh(a);
            case ACOSH -> F.ArcCosh(a);
            case ATANH -> F.ArcTanh(a);
            case ABS -> F.Abs(a);
        };
    }

    /** {@code P^(order)(at)}: from the closed form when known, else Symja's {@code Derivative[order][P][at]}. */
    IExpr profile(String name, int order, IExpr at) {
        IExpr x = table.coordinate;
        IExpr known = profiles.get(name);
        if (known == null) {
            ISymbol head = head(name);
            return order == 0 ? F.unaryAST1(head, at) : F.unaryAST1(F.unaryAST1(F.Derivative(F.ZZ(order)), head), at);
        }
        IExpr d = order == 0 ? known : symja.eval(F.D(known, F.list(x, F.ZZ(order))));
        return at.equals(x) ? d : Points.at(symja, d, table.coordinate, at, table.assumptions(this));
    }

    /** Whether the tree still mentions an unknown profile (its head symbol). */
    boolean mentionsUnknownProfile(IExpr e) {
        for (Symbol.Profile p : table.model().profiles()) {
            if (!profiles.containsKey(p.name()) && e.has(head(p.name()), true)) return true;
        }
        return false;
    }

    /** The unknown profiles the tree mentions. */
    List<String> unknownProfilesIn(IExpr e) {
        return table.model().profiles().stream().map(Symbol::name)
                .filter(n -> !profiles.containsKey(n) && e.has(head(n), true)).toList();
    }

    /** The unknown constants (without a known value) the tree mentions. */
    List<String> unknownConstantsIn(IExpr e) {
        return table.model().unknownConstants().stream().map(Symbol::name)
                .filter(n -> !constants.containsKey(n) && table.symbol(n) != null && e.has(table.symbol(n), true)).toList();
    }
}
