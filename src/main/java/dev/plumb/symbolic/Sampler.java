package dev.plumb.symbolic;

import dev.plumb.model.CaseValues;
import dev.plumb.model.Symbol;
import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.apfloat.Apfloat;
import org.matheclipse.core.expression.F;
import org.matheclipse.core.interfaces.IExpr;
import org.matheclipse.core.interfaces.IFraction;
import org.matheclipse.core.interfaces.IInteger;
import org.matheclipse.core.interfaces.INum;
import org.matheclipse.core.interfaces.ISymbol;

/**
 * Random points of the parameter domain and high-precision evaluation there. Parameters are
 * drawn as exact rationals (around a case value when the file has cases, so scales are
 * physical), built-in constants are scaled by a random factor (an identity must not hold only
 * for G's value; the comparison has already written R_gas, hbar and sigma_SB in the basis of the
 * 2019 SI, so the constants left are independent), fixed parameters keep their value, and the
 * coordinate falls inside its interval. Evaluation runs at {@value #DIGITS} digits, so cancellation cannot fake a zero.
 */
final class Sampler {

    static final int DIGITS = 60;
    static final MathContext MC = new MathContext(DIGITS, RoundingMode.HALF_EVEN);

    private final Symja symja;
    private final SymbolTable table;
    private final Random random;

    Sampler(Symja symja, SymbolTable table, long seed) {
        this.symja = symja;
        this.table = table;
        this.random = new Random(seed);
    }

    /**
     * One random point: a value for every private symbol but the profile heads, inside the orders the
     * file declares between parameters ({@code Rc < R}); drawn again until it is, at most 50 times.
     */
    Map<ISymbol, IExpr> point(Translation t) {
        Map<ISymbol, IExpr> p = anyPoint(t);
        for (int tries = 0; tries < 50 && !ordered(t, p); tries++) p = anyPoint(t);
        return p;
    }

    private boolean ordered(Translation t, Map<ISymbol, IExpr> values) {
        for (Symbol.FreeParam param : table.model().freeParams()) {
            ISymbol sym = table.all().get(param.name());
            if (sym == null || param.bounds().isEmpty()) continue;
            BigDecimal v = Sampler.decimal(values.get(sym));
            for (dev.plumb.lang.Stmt.Bound b : param.bounds()) {
                BigDecimal other = bound(t, b.value(), values, null);
                if (v == null || other == null) continue;
                if (!b.op().test(v.doubleValue(), other.doubleValue())) return false;
            }
        }
        return true;
    }

    private Map<ISymbol, IExpr> anyPoint(Translation t) {
        Map<ISymbol, IExpr> values = new LinkedHashMap<>();
        List<CaseValues> cases = table.model().cases();
        CaseValues around = cases.isEmpty() ? null : cases.get(random.nextInt(cases.size()));
        Symbol.Coordinate coordinate = null;
        for (var entry : table.all().entrySet()) {
            Symbol s = table.model().symbols().get(entry.getKey());
            ISymbol sym = entry.getValue();
            if (s instanceof Symbol.Profile) continue;
            if (s instanceof Symbol.Coordinate c) {
                coordinate = c;
                continue;
            }
            var fixed = table.fixedValue(entry.getKey());
            var constant = table.constantValue(entry.getKey());
            if (s instanceof Symbol.FixedParam && fixed.isPresent()) {
                values.put(sym, Translation.rational(fixed.get()));
            } else if (constant.isPresent()) {
                values.put(sym, Translation.rational(constant.get().multiply(uniform(0.5, 2)).round(MC)));
            } else if (around != null && around.values().containsKey(entry.getKey())) {
                values.put(sym, Translation.rational(new BigDecimal(around.values().get(entry.getKey())).multiply(uniform(0.5, 2))
                        .multiply(sign(sym)).round(MC)));
            } else {
                values.put(sym, Translation.rational(uniform(0.5, 3).multiply(sign(sym))));
            }
        }
        if (coordinate != null) {
            IExpr x = table.coordinate;
            BigDecimal from = bound(t, coordinate.from(), values, BigDecimal.ZERO);
            BigDecimal to = bound(t, coordinate.to(), values, from.add(BigDecimal.ONE));
            BigDecimal u = uniform(0.05, 0.95);
            values.put((ISymbol) x, Translation.rational(from.add(to.subtract(from).multiply(u)).round(MC)));
        }
        return values;
    }

    /**
     * The point with every built-in constant at its own value instead of a random multiple (the
     * other quantities as they were): where a claim is compared with the constants' values.
     */
    Map<ISymbol, IExpr> atConstantValues(Map<ISymbol, IExpr> point) {
        Map<ISymbol, IExpr> values = new LinkedHashMap<>(point);
        for (var entry : table.all().entrySet()) {
            table.constantValue(entry.getKey()).ifPresent(v -> values.put(entry.getValue(), Translation.rational(v)));
        }
        return values;
    }

    private BigDecimal bound(Translation t, dev.plumb.lang.Expr e, Map<ISymbol, IExpr> values, BigDecimal fallback) {
        try {
            BigDecimal v = value(t.plain(e), values);
            return v == null ? fallback : v;
        } catch (Translation.Untranslatable ex) {
            return fallback;
        }
    }

    /**
     * -1 half the time for a symbol that may be negative ({@link SymbolTable#signed}), else 1: a claim must
     * hold for every value its declarations allow, and sqrt(a^2) = a holds only for half of them.
     */
    private BigDecimal sign(ISymbol sym) {
        return table.signed().contains(sym) && random.nextBoolean() ? BigDecimal.ONE.negate() : BigDecimal.ONE;
    }

    private BigDecimal uniform(double lo, double hi) {
        double v = lo + (hi - lo) * random.nextDouble();
        return new BigDecimal(v).round(new MathContext(12));
    }

    /** The value of {@code e} at the point, or null when it is not a finite real number there. */
    BigDecimal value(IExpr e, Map<ISymbol, IExpr> values) {
        try {
            return HighPrecision.value(e, values);
        } catch (HighPrecision.NotReal notReal) {
            return null;
        } catch (HighPrecision.Declined | ArithmeticException | IllegalArgumentException | org.apfloat.ApfloatRuntimeException declined) {
            // A NaN among the numbers, an exponent out of range: Symja says what such a value is.
            return symjaValue(e, values);
        }
    }

    /** The value by Symja's own evaluation: exact first, then numeric. */
    BigDecimal symjaValue(IExpr e, Map<ISymbol, IExpr> values) {
        if (gaveUp != null) return null;
        List<IExpr> rules = new ArrayList<>();
        values.forEach((k, v) -> rules.add(F.Rule(k, v)));
        IExpr n;
        try {
            n = symja.eval(F.N(F.ReplaceAll(e, F.ListAlloc(rules)), F.ZZ(DIGITS)));
        } catch (Symja.Failure f) {
            // One value given up on (out of time, a number past the size limit) means the others would be too:
            // stop asking, and let the caller say why.
            gaveUp = f.getMessage();
            return null;
        }
        if (n instanceof INum num && outOfRange(num.apfloatValue())) {
            gaveUp = "a value beyond 1e" + MAX_EXPONENT + " in size (or below 1e-" + MAX_EXPONENT + ") at a sample point";
            return null;
        }
        return decimal(n);
    }

    /**
     * The largest decimal exponent a sample value may have. Far past any physical quantity, and it keeps
     * a value such as exp(x)^1e6 from being written out digit by digit (a million digits, read back in
     * time quadratic in their number).
     */
    static final int MAX_EXPONENT = 10_000;

    private static boolean outOfRange(Apfloat a) {
        return a.signum() != 0 && Math.abs(a.scale()) > MAX_EXPONENT;
    }

    private String gaveUp;

    /** Why the computer algebra system gave up on a value (out of time, too large a number), or null. */
    String gaveUp() {
        return gaveUp;
    }

    static BigDecimal decimal(IExpr n) {
        if (n instanceof IInteger i) return new BigDecimal(i.toBigNumerator());
        if (n instanceof IFraction q) return new BigDecimal(q.toBigNumerator()).divide(new BigDecimal(q.toBigDenominator()), MC);
        if (n instanceof INum num) {
            Apfloat a = num.apfloatValue();
            if (outOfRange(a)) return null;
            try {
                return new BigDecimal(a.toString(true));
            } catch (NumberFormatException ex) {
                return null;
            }
        }
        return null;
    }
}
