package dev.plumb.symbolic;

import dev.plumb.lang.Expr;
import dev.plumb.lang.ExprPrinter;
import dev.plumb.lang.Span;
import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.matheclipse.core.expression.S;
import org.matheclipse.core.interfaces.IAST;
import org.matheclipse.core.interfaces.IExpr;
import org.matheclipse.core.interfaces.IFraction;
import org.matheclipse.core.interfaces.IInteger;
import org.matheclipse.core.interfaces.INum;
import org.matheclipse.core.interfaces.ISymbol;

/**
 * Turns a Symja tree back into a plumb expression through the symbol table, written the way a
 * person would: numerator over denominator, subtraction instead of adding a negative, roots as
 * {@code sqrt}. Printing goes through plumb's own printer, never Symja's, which folds case.
 */
final class PlumbForm {

    private static final Map<ISymbol, String> FUNCTIONS = Map.ofEntries(
            Map.entry(S.Sin, "sin"), Map.entry(S.Cos, "cos"), Map.entry(S.Tan, "tan"),
            Map.entry(S.ArcSin, "asin"), Map.entry(S.ArcCos, "acos"), Map.entry(S.ArcTan, "atan"),
            Map.entry(S.Sinh, "sinh"), Map.entry(S.Cosh, "cosh"), Map.entry(S.Tanh, "tanh"),
            Map.entry(S.ArcSinh, "asinh"), Map.entry(S.ArcCosh, "acosh"), Map.entry(S.ArcTanh, "atanh"),
            Map.entry(S.Abs, "abs"), Map.entry(S.Exp, "exp"), Map.entry(S.Sqrt, "sqrt"));

    private final SymbolTable table;

    PlumbForm(SymbolTable table) {
        this.table = table;
    }

    String print(IExpr e) throws Translation.Untranslatable {
        return ExprPrinter.print(readable(e));
    }

    /** The plumb form as a reader wants it. */
    Expr readable(IExpr e) throws Translation.Untranslatable {
        return tidy(expr(e));
    }

    Expr expr(IExpr e) throws Translation.Untranslatable {
        if (e instanceof IInteger i) return integer(i.toBigNumerator());
        if (e instanceof IFraction q) {
            Expr f = new Expr.Binary(Expr.BinaryOp.DIV, num(q.toBigNumerator().abs()), num(q.toBigDenominator()), Span.NONE);
            return q.toBigNumerator().signum() < 0 ? neg(f) : f;
        }
        if (e instanceof INum n) {
            double v = n.doubleValue();
            Expr f = new Expr.Num(Math.abs(v), Double.toString(Math.abs(v)), Span.NONE);
            return v < 0 ? neg(f) : f;
        }
        if (e instanceof ISymbol s) return symbol(s);
        if (e instanceof IAST a && a.head() instanceof ISymbol h && a.argSize() == 1 && table.name(h) != null
                && table.model().symbols().get(table.name(h)) instanceof dev.plumb.model.Symbol.Profile) {
            return new Expr.Call(table.name(h), Span.NONE, 0, List.of(expr(a.arg1())), Span.NONE);
        }
        if (e.isPlus()) return plus((IAST) e);
        if (e.isTimes()) return times((IAST) e);
        if (e.isPower()) return power((IAST) e);
        if (e instanceof IAST a && a.head() instanceof ISymbol h) {
            String word = FUNCTIONS.get(h);
            if (word != null && a.argSize() == 1) return call(word, expr(a.arg1()));
            if (h == S.Log && a.argSize() == 1) return call("log", expr(a.arg1()));
            if (h == S.Log && a.argSize() == 2) {
                return new Expr.Binary(Expr.BinaryOp.DIV, call("log", expr(a.arg2())), call("log", expr(a.arg1())), Span.NONE);
            }
            if (h == S.Piecewise) return piecewise(a);
        }
        throw new Translation.Untranslatable("no plumb form for a result of kind " + e.head());
    }

    private Expr symbol(ISymbol s) throws Translation.Untranslatable {
        if (s == S.Pi) return new Expr.Name("pi", Span.NONE);
        if (s == S.E) return eulerNumber();
        String name = table.name(s);
        if (name == null) throw new Translation.Untranslatable("the result mentions a symbol that is not in the file");
        return new Expr.Name(name, Span.NONE);
    }

    /** Euler's number is written {@code e}, unless the file declares an {@code e} of its own: then {@code exp(1)}. */
    private Expr eulerNumber() {
        var declared = table.model().symbols().get("e");
        return declared == null || declared instanceof dev.plumb.model.Symbol.Builtin
                ? new Expr.Name("e", Span.NONE) : call("exp", num(BigInteger.ONE));
    }

    private Expr plus(IAST a) throws Translation.Untranslatable {
        List<IExpr> terms = new ArrayList<>();
        for (IExpr t : a) terms.add(t);
        // A sum reads better starting with a positive term: R^2 - r^2, not -r^2 + R^2.
        for (int i = 0; i < terms.size(); i++) {
            if (!isNegative(terms.get(i))) {
                terms.add(0, terms.remove(i));
                break;
            }
        }
        Expr acc = expr(terms.get(0));
        for (IExpr t : terms.subList(1, terms.size())) {
            if (isNegative(t)) {
                acc = new Expr.Binary(Expr.BinaryOp.SUB, acc, magnitude(t), Span.NONE);
            } else {
                acc = new Expr.Binary(Expr.BinaryOp.ADD, acc, expr(t), Span.NONE);
            }
        }
        return acc;
    }

    private static boolean isNegative(IExpr t) {
        if (t.isNumber()) return t.isNegative();
        return t.isTimes() && t.first().isReal() && t.first().isNegative();
    }

    /** The plumb form of {@code -t} for a term that {@link #isNegative}. */
    private Expr magnitude(IExpr t) throws Translation.Untranslatable {
        Expr e = expr(t);
        if (e instanceof Expr.Neg n) return n.operand();
        throw new Translation.Untranslatable("cannot take the sign off a term");
    }

    private Expr times(IAST a) throws Translation.Untranslatable {
        List<Expr> numerator = new ArrayList<>();
        List<Expr> denominator = new ArrayList<>();
        boolean negative = false;
        for (IExpr f : a) {
            if (f instanceof IInteger i) {
                negative ^= i.signum() < 0;
                BigInteger m = i.toBigNumerator().abs();
                if (!m.equals(BigInteger.ONE)) numerator.add(num(m));
            } else if (f instanceof IFraction q) {
                negative ^= q.toBigNumerator().signum() < 0;
                BigInteger n = q.toBigNumerator().abs();
                if (!n.equals(BigInteger.ONE)) numerator.add(num(n));
                denominator.add(num(q.toBigDenominator()));
            } else if (f instanceof INum n && n.doubleValue() < 0) {
                negative = !negative;
                numerator.add(expr(n.negate()));
            } else if (f.isPower() && f.exponent().isReal() && f.exponent().isNegative()) {
                insert(denominator, powerOf(f.base(), f.exponent().negate()), f.base() == S.Pi);
            } else {
                insert(numerator, expr(f), f == S.Pi || (f.isPower() && f.base() == S.Pi));
            }
        }
        Expr top = numerator.isEmpty() ? num(BigInteger.ONE) : product(numerator);
        Expr whole = denominator.isEmpty() ? top : new Expr.Binary(Expr.BinaryOp.DIV, top, product(denominator), Span.NONE);
        return negative ? neg(whole) : whole;
    }

    /** Numbers first, then pi, then the rest in Symja's order (constants, then the file's names). */
    private static void insert(List<Expr> factors, Expr f, boolean isPi) {
        if (!isPi) {
            factors.add(f);
            return;
        }
        int i = 0;
        while (i < factors.size() && factors.get(i) instanceof Expr.Num) i++;
        factors.add(i, f);
    }

    /** Writes {@code -(3*G*M)/(4*R)} as {@code -3*G*M/(4*R)}: the sign goes onto the leading number. */
    static Expr tidy(Expr e) {
        if (e instanceof Expr.Neg n && n.operand() instanceof Expr.Binary b
                && (b.op() == Expr.BinaryOp.MUL || b.op() == Expr.BinaryOp.DIV)) {
            Expr signed = negateLeadingNumber(b);
            if (signed != null) return signed;
        }
        if (e instanceof Expr.Binary b) return new Expr.Binary(b.op(), tidy(b.left()), tidy(b.right()), b.span());
        if (e instanceof Expr.Neg n) return new Expr.Neg(tidy(n.operand()), n.span());
        if (e instanceof Expr.Call c) return new Expr.Call(c.callee(), c.calleeSpan(), c.order(), c.args().stream().map(PlumbForm::tidy).toList(), c.span());
        if (e instanceof Expr.If i) return new Expr.If(i.condition(), tidy(i.then()), tidy(i.otherwise()), i.span());
        return e;
    }

    private static Expr negateLeadingNumber(Expr e) {
        if (e instanceof Expr.Num n) return new Expr.Num(-n.value(), "-" + n.text(), n.span());
        if (e instanceof Expr.Binary b && (b.op() == Expr.BinaryOp.MUL || b.op() == Expr.BinaryOp.DIV)) {
            Expr left = negateLeadingNumber(b.left());
            return left == null ? null : new Expr.Binary(b.op(), tidy(left), tidy(b.right()), b.span());
        }
        return null;
    }

    private static Expr product(List<Expr> factors) {
        Expr acc = factors.get(0);
        for (Expr f : factors.subList(1, factors.size())) acc = new Expr.Binary(Expr.BinaryOp.MUL, acc, f, Span.NONE);
        return acc;
    }

    private Expr power(IAST a) throws Translation.Untranslatable {
        IExpr base = a.base();
        IExpr exponent = a.exponent();
        if (exponent.isReal() && exponent.isNegative()) {
            return new Expr.Binary(Expr.BinaryOp.DIV, num(BigInteger.ONE), powerOf(base, exponent.negate()), Span.NONE);
        }
        return powerOf(base, exponent);
    }

    private Expr powerOf(IExpr base, IExpr exponent) throws Translation.Untranslatable {
        if (exponent.isOne()) return expr(base);
        if (base == S.E) return call("exp", expr(exponent));
        if (exponent instanceof IFraction q && q.toBigNumerator().equals(BigInteger.ONE) && q.toBigDenominator().equals(BigInteger.TWO)) {
            return call("sqrt", expr(base));
        }
        return new Expr.Binary(Expr.BinaryOp.POW, expr(base), expr(exponent), Span.NONE);
    }

    private Expr piecewise(IAST a) throws Translation.Untranslatable {
        IAST cases = (IAST) a.arg1();
        Expr otherwise = a.argSize() > 1 ? expr(a.arg2()) : num(BigInteger.ZERO);
        for (int i = cases.argSize(); i >= 1; i--) {
            IAST c = (IAST) cases.get(i);
            otherwise = new Expr.If(condition(c.arg2()), expr(c.arg1()), otherwise, Span.NONE);
        }
        return otherwise;
    }

    private Expr.Condition condition(IExpr c) throws Translation.Untranslatable {
        Expr.CompareOp op;
        if (c.isAST(S.Less, 3)) op = Expr.CompareOp.LT;
        else if (c.isAST(S.LessEqual, 3)) op = Expr.CompareOp.LE;
        else if (c.isAST(S.Greater, 3)) op = Expr.CompareOp.GT;
        else if (c.isAST(S.GreaterEqual, 3)) op = Expr.CompareOp.GE;
        else throw new Translation.Untranslatable("a condition plumb cannot write");
        return new Expr.Condition(op, expr(c.first()), expr(c.second()), Span.NONE);
    }

    private static Expr call(String f, Expr arg) {
        return new Expr.Call(f, Span.NONE, 0, List.of(arg), Span.NONE);
    }

    private static Expr num(BigInteger n) {
        return new Expr.Num(n.doubleValue(), n.toString(), Span.NONE);
    }

    private static Expr integer(BigInteger n) {
        return n.signum() < 0 ? neg(num(n.negate())) : num(n);
    }

    private static Expr neg(Expr e) {
        return new Expr.Neg(e, Span.NONE);
    }
}
