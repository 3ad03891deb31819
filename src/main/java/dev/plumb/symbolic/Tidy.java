package dev.plumb.symbolic;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.matheclipse.core.expression.F;
import org.matheclipse.core.interfaces.IAST;
import org.matheclipse.core.interfaces.IExpr;
import org.matheclipse.core.interfaces.ISymbol;

/**
 * Rewrites a closed form the way it is written by hand: the common factor of a polynomial
 * numerator in front ({@code 3*G*M^2*(R^2 - r^2)/(8*pi*R^6)}), powers with opposite exponents
 * merged ({@code P0*(1 - L*z/T0)^k}), a constant taken inside a fractional power, a product of
 * roots as one root ({@code (3*M/(4*pi*rho))^(1/3)}). Some of these hold only for positive bases, so every rewrite is a
 * candidate that the caller keeps only after comparing it with the original at random points.
 */
final class Tidy {

    private final Symja symja;
    private final ISymbol coordinate;

    Tidy(Symja symja, ISymbol coordinate) {
        this.symja = symja;
        this.coordinate = coordinate;
    }

    /** Candidate rewrites of {@code e}; any of them may fail to evaluate and is then skipped. */
    List<IExpr> candidates(IExpr e) {
        List<IExpr> out = new ArrayList<>();
        add(out, () -> commonFactor(e));
        add(out, () -> mergedPowers(e));
        add(out, () -> insidePower(e));
        add(out, () -> oneRoot(e));
        add(out, () -> commonRoot(e));
        List<IExpr> more = new ArrayList<>();
        for (IExpr c : out) add(more, () -> commonFactor(c));
        out.addAll(more);
        return out;
    }

    private interface Rewrite {
        IExpr apply();
    }

    private void add(List<IExpr> out, Rewrite r) {
        try {
            IExpr c = r.apply();
            if (c != null) out.add(c);
        } catch (Symja.Failure | ClassCastException | IndexOutOfBoundsException ignored) {
            // A rewrite that does not apply leaves the other candidates.
        }
    }

    /** Numerator over denominator, with the polynomial GCD of the numerator's terms (and their numeric content) in front. */
    private IExpr commonFactor(IExpr e) {
        IExpr together = symja.eval(F.Together(e));
        IExpr numerator = symja.eval(F.Numerator(together));
        IExpr denominator = symja.eval(F.Denominator(together));
        IExpr expanded = symja.eval(F.Expand(numerator));
        if (!expanded.isPlus()) return null;
        IExpr gcd = symja.eval(((IAST) expanded).setAtCopy(0, F.PolynomialGCD));
        IExpr rest = symja.eval(F.FactorTerms(F.Expand(F.Divide(expanded, gcd))));
        return F.Times(gcd, rest, F.Power(denominator, F.CN1));
    }

    /** {@code a^k * b^(-k)} as {@code (a/b)^k} with the base expanded, for every symbolic exponent k. */
    private IExpr mergedPowers(IExpr e) {
        if (!e.isTimes()) return null;
        Map<IExpr, IExpr> byExponent = new LinkedHashMap<>();
        List<IExpr> others = new ArrayList<>();
        boolean merged = false;
        for (IExpr f : (IAST) e) {
            if (!f.isPower() || f.exponent().isNumber()) {
                others.add(f);
                continue;
            }
            IExpr key = null;
            boolean inverse = false;
            for (IExpr k : byExponent.keySet()) {
                if (symja.eval(F.Subtract(k, f.exponent())).isZero()) key = k;
                else if (symja.eval(F.Plus(k, f.exponent())).isZero()) {
                    key = k;
                    inverse = true;
                }
            }
            if (key == null) {
                byExponent.put(f.exponent(), f.base());
            } else {
                byExponent.put(key, F.Times(byExponent.get(key), inverse ? F.Power(f.base(), F.CN1) : f.base()));
                merged = true;
            }
        }
        if (!merged) return null;
        List<IExpr> factors = new ArrayList<>(others);
        // Written with the positive-looking exponent: (1 - L*z/T0)^k, not (T0/(T0 - L*z))^(-k).
        byExponent.forEach((k, base) -> {
            boolean flip = k.isTimes() && k.first().isNumber() && k.first().isNegative();
            IExpr exponent = flip ? symja.eval(F.Negate(k)) : k;
            IExpr b = flip ? F.Power(base, F.CN1) : base;
            factors.add(F.Power(symja.eval(F.Expand(b)), exponent));
        });
        return F.Times(factors.toArray(IExpr[]::new));
    }

    /** {@code c*B^p}, with B in the coordinate and c free of it, as {@code (c^(1/p)*B)^p}. */
    private IExpr insidePower(IExpr e) {
        if (!e.isTimes()) return null;
        IExpr power = null;
        IExpr constant = F.C1;
        for (IExpr f : (IAST) e) {
            if (f.isPower() && f.base().has(coordinate, true) && f.exponent().isFraction()) {
                if (power != null) return null;
                power = f;
            } else if (f.has(coordinate, true)) {
                return null;
            } else {
                constant = F.Times(constant, f);
            }
        }
        if (power == null) return null;
        IExpr scale = F.PowerExpand(F.Power(constant, F.Power(power.exponent(), F.CN1)));
        // PowerExpand leaves (1/K)^(2/5)*K^(2/5) alone in one pass; a second pass cancels it.
        IExpr base = symja.eval(F.Expand(F.PowerExpand(F.Expand(F.PowerExpand(F.Times(scale, power.base()))))));
        return F.Power(base, power.exponent());
    }

    /** A product holding square roots as the square root of the product's square. */
    private IExpr oneRoot(IExpr e) {
        if (!e.isTimes()) return null;
        int roots = 0;
        for (IExpr f : (IAST) e) {
            if (f.isPower() && f.exponent().isFraction() && f.exponent().abs().equals(F.C1D2)) roots++;
        }
        if (roots < 2) return null;
        IExpr square = symja.eval(F.Together(F.PowerExpand(F.Power(e, F.C2))));
        IExpr root = F.Power(square, F.C1D2);
        return e.isNegative() ? F.Negate(root) : root;
    }

    /**
     * The factors with fractional exponents as one root of their common degree, the whole part
     * of each exponent left outside: {@code pi^(1/3)*G*rho^(4/3)*M^(2/3)/6^(1/3)} as
     * {@code G*rho*(pi*rho*M^2/6)^(1/3)}.
     */
    private IExpr commonRoot(IExpr e) {
        if (!e.isTimes()) return null;
        List<IExpr> outside = new ArrayList<>();
        List<IExpr> inside = new ArrayList<>();
        java.math.BigInteger degree = java.math.BigInteger.ONE;
        for (IExpr f : (IAST) e) {
            if (f.isPower() && f.exponent() instanceof org.matheclipse.core.interfaces.IFraction q) {
                java.math.BigInteger num = q.toBigNumerator();
                java.math.BigInteger den = q.toBigDenominator();
                java.math.BigInteger whole = num.divide(den);
                if (whole.signum() != 0) outside.add(F.Power(f.base(), F.ZZ(whole)));
                inside.add(F.Power(f.base(), F.QQ(F.ZZ(num.subtract(whole.multiply(den))), F.ZZ(den))));
                degree = degree.divide(degree.gcd(den)).multiply(den);
            } else {
                outside.add(f);
            }
        }
        if (inside.size() < 2) return null;
        IExpr radicand = symja.eval(F.Together(F.PowerExpand(F.Power(F.Times(inside.toArray(IExpr[]::new)), F.ZZ(degree)))));
        IExpr root = F.Power(radicand, F.QQ(F.C1, F.ZZ(degree)));
        if (outside.isEmpty()) return root;
        outside.add(root);
        return F.Times(outside.toArray(IExpr[]::new));
    }
}
