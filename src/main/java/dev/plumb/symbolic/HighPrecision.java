package dev.plumb.symbolic;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.Map;
import org.apfloat.Apfloat;
import org.apfloat.ApfloatMath;
import org.matheclipse.core.expression.S;
import org.matheclipse.core.interfaces.IAST;
import org.matheclipse.core.interfaces.IExpr;
import org.matheclipse.core.interfaces.IFraction;
import org.matheclipse.core.interfaces.IInteger;
import org.matheclipse.core.interfaces.INum;
import org.matheclipse.core.interfaces.ISymbol;

/**
 * Evaluates a Symja tree at one point in {@value #PRECISION}-digit arithmetic, without Symja:
 * the random-point identity test evaluates the same few trees hundreds of times, and Symja's own
 * evaluation costs milliseconds each. Sums and products of rationals stay exact, as they do in
 * Symja. Where the answer would rest on cancellation (a sum far smaller than its terms,
 * {@code sin} of a multiple of pi) or on a form this class does not know, it declines and the
 * caller asks Symja, whose exact evaluation decides such cases; it never answers differently
 * from Symja by more than rounding.
 */
final class HighPrecision {

    static final int PRECISION = 90;
    /** Past this many bits an exact rational becomes a decimal: the work then stays bounded by the precision. */
    private static final int EXACT_BITS = 4096;
    private static final MathContext MC = new MathContext(PRECISION + 10, RoundingMode.HALF_EVEN);
    private static final BigDecimal CANCELLATION = new BigDecimal("1e-50");
    private static final BigDecimal PI = new BigDecimal(ApfloatMath.pi(PRECISION + 20).toString(true));
    private static final BigDecimal LN2 = new BigDecimal(ApfloatMath.log(new Apfloat(2, PRECISION + 20)).toString(true));
    private static final BigDecimal TWO = BigDecimal.valueOf(2);

    /** The tree holds a form, or a near-cancellation, that is left to Symja. */
    static final class Declined extends Exception {
        Declined() {
            super(null, null, false, false);
        }
    }

    /** The value is not a finite real number (a negative base under a root, a log of a negative, a pole). */
    static final class NotReal extends Exception {
        NotReal() {
            super(null, null, false, false);
        }
    }

    /** A value: an exact rational while only sums, products and whole powers of rationals made it, else a decimal. */
    private record Value(BigInteger num, BigInteger den, BigDecimal decimal) {
        static Value exact(BigInteger n, BigInteger d) {
            if (d.signum() < 0) {
                n = n.negate();
                d = d.negate();
            }
            if (d.signum() != 0 && n.bitLength() + d.bitLength() > EXACT_BITS) return of(new BigDecimal(n).divide(new BigDecimal(d), MC));
            BigInteger g = n.gcd(d);
            return g.signum() == 0 || g.equals(BigInteger.ONE) ? new Value(n, d, null) : new Value(n.divide(g), d.divide(g), null);
        }

        static Value of(BigDecimal d) {
            return new Value(null, null, d);
        }

        boolean isExact() {
            return decimal == null;
        }

        BigDecimal big() {
            return isExact() ? new BigDecimal(num).divide(new BigDecimal(den), MC) : decimal;
        }

        int signum() {
            return isExact() ? num.signum() : decimal.signum();
        }
    }

    private final Map<ISymbol, IExpr> values;

    private HighPrecision(Map<ISymbol, IExpr> values) {
        this.values = values;
    }

    /** The value at the point, to {@link Sampler#DIGITS} digits. */
    static BigDecimal value(IExpr e, Map<ISymbol, IExpr> values) throws Declined, NotReal {
        return new HighPrecision(values).eval(e).big().round(Sampler.MC);
    }

    private Value eval(IExpr e) throws Declined, NotReal {
        if (e instanceof IInteger i) return Value.exact(i.toBigNumerator(), BigInteger.ONE);
        if (e instanceof IFraction q) return Value.exact(q.toBigNumerator(), q.toBigDenominator());
        if (e instanceof INum n) return Value.of(new BigDecimal(n.doubleValue()));
        if (e instanceof ISymbol s) {
            if (s == S.Pi) return Value.of(PI);
            if (s == S.E) return Value.of(exp(BigDecimal.ONE));
            IExpr v = values.get(s);
            if (v == null || v instanceof ISymbol) throw new Declined();
            return eval(v);
        }
        if (!(e instanceof IAST a)) throw new Declined();
        if (a.isPlus()) return plus(a);
        if (a.isTimes()) {
            Value p = Value.exact(BigInteger.ONE, BigInteger.ONE);
            for (IExpr f : a) p = multiply(p, eval(f));
            return p;
        }
        if (a.isPower()) return power(a.base(), a.exponent());
        if (a.isAST(S.Piecewise)) return piecewise(a);
        if (a.argSize() == 2 && a.isAST(S.Log)) return Value.of(log(positive(eval(a.arg2()))).divide(log(positive(eval(a.arg1()))), MC));
        if (a.argSize() != 1) throw new Declined();
        return function(a.head(), eval(a.arg1()));
    }

    private Value plus(IAST a) throws Declined, NotReal {
        Value sum = Value.exact(BigInteger.ZERO, BigInteger.ONE);
        BigDecimal largest = BigDecimal.ZERO;
        for (IExpr t : a) {
            Value v = eval(t);
            if (sum.isExact() && v.isExact()) {
                sum = Value.exact(sum.num.multiply(v.den).add(v.num.multiply(sum.den)), sum.den.multiply(v.den));
            } else {
                sum = Value.of(sum.big().add(v.big(), MC));
            }
            largest = largest.max(v.big().abs());
        }
        if (!sum.isExact()) nearZero(sum.decimal, largest);
        return sum;
    }

    private static Value multiply(Value p, Value q) {
        if (p.isExact() && q.isExact()) return Value.exact(p.num.multiply(q.num), p.den.multiply(q.den));
        return Value.of(p.big().multiply(q.big(), MC));
    }

    private Value power(IExpr base, IExpr exponent) throws Declined, NotReal {
        if (base == S.E) return Value.of(exp(eval(exponent).big()));
        Value b = eval(base);
        Value x = eval(exponent);
        if (x.isExact() && x.den.equals(BigInteger.ONE)) {
            if (x.num.bitLength() > 16) throw new Declined();
            int k = x.num.intValue();
            if (b.signum() == 0 && k < 0) throw new NotReal();
            // An exact power stays exact only while it stays small: (4709/10000)^65535 would have a million bits.
            if (b.isExact() && (long) (b.num.bitLength() + b.den.bitLength()) * Math.abs(k) <= EXACT_BITS) {
                BigInteger n = b.num.pow(Math.abs(k));
                BigInteger d = b.den.pow(Math.abs(k));
                return k >= 0 ? Value.exact(n, d) : Value.exact(d, n);
            }
            BigDecimal d = b.big();
            return Value.of(k >= 0 ? d.pow(k, MC) : BigDecimal.ONE.divide(d.pow(-k, MC), MC));
        }
        if (b.signum() < 0) throw new NotReal();
        if (b.signum() == 0) {
            if (x.signum() > 0) return Value.exact(BigInteger.ZERO, BigInteger.ONE);
            throw new NotReal();
        }
        if (x.isExact() && x.den.bitLength() < 8 && x.num.bitLength() < 16) {
            BigDecimal root = root(b.big(), x.den.intValue());
            int k = x.num.intValue();
            return Value.of(k >= 0 ? root.pow(k, MC) : BigDecimal.ONE.divide(root.pow(-k, MC), MC));
        }
        return Value.of(exp(x.big().multiply(log(b.big()), MC)));
    }

    private Value function(IExpr head, Value x) throws Declined, NotReal {
        if (head == S.Abs) return x.isExact() ? Value.exact(x.num.abs(), x.den) : Value.of(x.decimal.abs());
        if (head == S.Log) {
            if (x.isExact() && x.num.equals(x.den)) return Value.exact(BigInteger.ZERO, BigInteger.ONE);
            BigDecimal v = log(positive(x));
            nearZero(v, BigDecimal.ONE);
            return Value.of(v);
        }
        BigDecimal f = x.big();
        BigDecimal d;
        if (head == S.Sin || head == S.Cos) {
            d = head == S.Sin ? sin(f) : sin(f.add(PI.divide(TWO, MC), MC));
        } else if (head == S.Tan || head == S.Cot || head == S.Sec || head == S.Csc) {
            BigDecimal sin = sin(f);
            BigDecimal cos = sin(f.add(PI.divide(TWO, MC), MC));
            BigDecimal denominator = head == S.Tan || head == S.Sec ? cos : sin;
            // At a pole Symja answers ComplexInfinity only when it sees the exact point.
            nearZero(denominator, BigDecimal.ONE);
            d = head == S.Tan ? sin.divide(cos, MC) : head == S.Cot ? cos.divide(sin, MC) : BigDecimal.ONE.divide(denominator, MC);
        } else if (head == S.Sinh || head == S.Cosh || head == S.Tanh) {
            BigDecimal up = exp(f);
            BigDecimal down = BigDecimal.ONE.divide(up, MC);
            BigDecimal sinh = up.subtract(down, MC).divide(TWO, MC);
            BigDecimal cosh = up.add(down, MC).divide(TWO, MC);
            d = head == S.Sinh ? sinh : head == S.Cosh ? cosh : sinh.divide(cosh, MC);
        } else if (head == S.ArcSin || head == S.ArcCos || head == S.ArcTan) {
            Apfloat a = new Apfloat(f, PRECISION);
            if (head != S.ArcTan && f.abs().compareTo(BigDecimal.ONE) > 0) throw new NotReal();
            Apfloat v = head == S.ArcSin ? ApfloatMath.asin(a) : head == S.ArcCos ? ApfloatMath.acos(a) : ApfloatMath.atan(a);
            d = new BigDecimal(v.toString(true));
        } else if (head == S.ArcSinh || head == S.ArcCosh || head == S.ArcTanh) {
            if (head == S.ArcCosh && f.compareTo(BigDecimal.ONE) < 0 || head == S.ArcTanh && f.abs().compareTo(BigDecimal.ONE) >= 0) {
                throw new NotReal();
            }
            Apfloat a = new Apfloat(f, PRECISION);
            Apfloat v = head == S.ArcSinh ? ApfloatMath.asinh(a) : head == S.ArcCosh ? ApfloatMath.acosh(a) : ApfloatMath.atanh(a);
            d = new BigDecimal(v.toString(true));
        } else {
            throw new Declined();
        }
        // sin(pi) and the like: Symja's exact evaluation knows whether such a value is 0.
        if (x.signum() != 0) nearZero(d, x.big().abs().max(BigDecimal.ONE));
        return Value.of(d);
    }

    private Value piecewise(IAST a) throws Declined, NotReal {
        if (!a.first().isList()) throw new Declined();
        for (IExpr c : (IAST) a.first()) {
            if (!c.isList() || c.argSize() != 2) throw new Declined();
            if (holds(c.second())) return eval(c.first());
        }
        return a.argSize() > 1 ? eval(a.second()) : Value.exact(BigInteger.ZERO, BigInteger.ONE);
    }

    private boolean holds(IExpr condition) throws Declined, NotReal {
        if (condition.isTrue()) return true;
        if (condition.isFalse()) return false;
        if (!(condition instanceof IAST c) || c.argSize() != 2) throw new Declined();
        Value l = eval(c.arg1());
        Value r = eval(c.arg2());
        int order;
        if (l.isExact() && r.isExact()) {
            order = l.num.multiply(r.den).compareTo(r.num.multiply(l.den));
        } else {
            BigDecimal d = l.big().subtract(r.big(), MC);
            // A point on the break itself is decided exactly by Symja.
            nearZero(d, l.big().abs().max(r.big().abs()));
            order = d.signum();
        }
        if (c.isAST(S.Less)) return order < 0;
        if (c.isAST(S.LessEqual)) return order <= 0;
        if (c.isAST(S.Greater)) return order > 0;
        if (c.isAST(S.GreaterEqual)) return order >= 0;
        throw new Declined();
    }

    private static BigDecimal positive(Value x) throws NotReal {
        if (x.signum() <= 0) throw new NotReal();
        return x.big();
    }

    private static void nearZero(BigDecimal v, BigDecimal scale) throws Declined {
        if (v.abs().compareTo(scale.multiply(CANCELLATION)) < 0) throw new Declined();
    }

    /** sin(a) from its Taylor series after reducing a to [-pi, pi]. */
    private static BigDecimal sin(BigDecimal a) throws Declined {
        if (a.abs().compareTo(BigDecimal.valueOf(1_000_000)) > 0) throw new Declined();
        BigDecimal turn = PI.multiply(TWO, MC);
        BigDecimal r = a.subtract(turn.multiply(a.divide(turn, 0, RoundingMode.HALF_EVEN), MC), MC);
        BigDecimal square = r.multiply(r, MC);
        BigDecimal term = r;
        BigDecimal sum = r;
        BigDecimal small = new BigDecimal("1e-" + (PRECISION + 8));
        for (int i = 1; i < 200 && term.abs().compareTo(small) > 0; i++) {
            term = term.multiply(square, MC).divide(BigDecimal.valueOf((2L * i) * (2L * i + 1)), MC).negate();
            sum = sum.add(term, MC);
        }
        return sum;
    }

    /** The positive n-th root by Newton steps from a double estimate. */
    private static BigDecimal root(BigDecimal a, int n) throws Declined {
        if (n == 2) return a.sqrt(MC);
        double estimate = Math.pow(a.doubleValue(), 1.0 / n);
        if (!Double.isFinite(estimate) || estimate == 0) throw new Declined();
        BigDecimal y = new BigDecimal(estimate);
        BigDecimal nn = BigDecimal.valueOf(n);
        BigDecimal close = new BigDecimal("1e-" + PRECISION);
        for (int i = 0; i < 12; i++) {
            BigDecimal next = y.multiply(nn.subtract(BigDecimal.ONE)).add(a.divide(y.pow(n - 1, MC), MC)).divide(nn, MC);
            boolean done = next.subtract(y).abs().compareTo(next.abs().multiply(close)) <= 0;
            y = next;
            if (done) return y;
        }
        throw new Declined();
    }

    /** exp(a) = 2^k exp(r), |r| <= ln 2 / 2, with exp(r) = exp(r/2^16)^(2^16) from a short Taylor series. */
    private static BigDecimal exp(BigDecimal a) throws Declined {
        if (a.abs().compareTo(BigDecimal.valueOf(100_000)) > 0) throw new Declined();
        BigDecimal k = a.divide(LN2, 0, RoundingMode.HALF_EVEN);
        BigDecimal r = a.subtract(k.multiply(LN2, MC), MC).divide(BigDecimal.valueOf(65536), MC);
        BigDecimal term = BigDecimal.ONE;
        BigDecimal sum = BigDecimal.ONE;
        BigDecimal small = new BigDecimal("1e-" + (PRECISION + 8));
        for (int i = 1; i < 100 && term.abs().compareTo(small) > 0; i++) {
            term = term.multiply(r, MC).divide(BigDecimal.valueOf(i), MC);
            sum = sum.add(term, MC);
        }
        for (int i = 0; i < 16; i++) sum = sum.multiply(sum, MC);
        int kk = k.intValueExact();
        return kk >= 0 ? sum.multiply(TWO.pow(kk), MC) : sum.divide(TWO.pow(-kk), MC);
    }

    /** log(a) = log(m) + e log 2 with m near 1, log(m) by Halley steps on exp(y) = m. */
    private static BigDecimal log(BigDecimal a) throws Declined {
        int e = (int) Math.floor((a.precision() - a.scale() - 1) * Math.log(10) / Math.log(2));
        BigDecimal m = e >= 0 ? a.divide(TWO.pow(e), MC) : a.multiply(TWO.pow(-e), MC);
        double start = Math.log(m.doubleValue());
        if (!Double.isFinite(start)) throw new Declined();
        BigDecimal y = new BigDecimal(start);
        BigDecimal close = new BigDecimal("1e-" + PRECISION);
        for (int i = 0; i < 8; i++) {
            BigDecimal ey = exp(y);
            BigDecimal step = TWO.multiply(m.subtract(ey), MC).divide(m.add(ey), MC);
            y = y.add(step, MC);
            if (step.abs().compareTo(close) <= 0) return y.add(LN2.multiply(BigDecimal.valueOf(e), MC), MC);
        }
        throw new Declined();
    }
}
