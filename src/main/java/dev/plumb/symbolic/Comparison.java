package dev.plumb.symbolic;

import dev.plumb.model.Status;
import dev.plumb.units.Rational;
import java.math.BigDecimal;
import java.math.MathContext;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.matheclipse.core.expression.F;
import org.matheclipse.core.expression.S;
import org.matheclipse.core.interfaces.IExpr;
import org.matheclipse.core.interfaces.ISymbol;

/**
 * Decides whether two expressions are identically equal, two ways that must agree: symbolic
 * simplification of the difference under the assumptions, and a randomized identity test at
 * {@value #POINTS} points in high precision. When they differ it says how: the constant ratio
 * claimed/true (identified exactly: 2, -1, 3/2, 8*pi/3, ...), or the quantities the ratio
 * depends on, or that the difference is free of the coordinate.
 */
final class Comparison {

    static final int POINTS = 12;
    private static final BigDecimal ZERO_TOLERANCE = new BigDecimal("1e-30");
    private static final BigDecimal SAME_TOLERANCE = new BigDecimal("1e-25");

    /** The verdict; {@code factor} is the exact constant ratio claimed/true when there is one. */
    record Verdict(Status status, String message, String factor, Optional<BigDecimal> ratio) {
        boolean holds() {
            return status == Status.HOLDS;
        }
    }

    private final Symja symja;
    private final Translation translation;
    private final Sampler sampler;
    private final IExpr assumptions;

    Comparison(Symja symja, Translation translation, Sampler sampler, IExpr assumptions) {
        this.symja = symja;
        this.translation = translation;
        this.sampler = sampler;
        this.assumptions = assumptions;
    }

    /**
     * Compares a claimed expression with the true one. Both are first written in the basis of
     * the 2019 SI ({@link SymbolTable#inBasis}), so that R_gas and N_A*k_B are the same thing.
     */
    Verdict compare(IExpr claimedAsWritten, IExpr truthAsWritten) {
        IExpr claimed = translation.table().inBasis(claimedAsWritten);
        IExpr truth = translation.table().inBasis(truthAsWritten);
        String symbolic;
        Boolean symbolicZero;
        IExpr difference = null;
        try {
            IExpr d = symja.eval(F.Simplify(F.Subtract(claimed, truth), assumptions));
            difference = d;
            // PowerExpand ((a b)^k = a^k b^k, log(a/b) = log a - log b) holds for positive bases only: not
            // used where a symbol that may be negative or zero appears.
            boolean positive = translation.table().signed().stream().noneMatch(s -> claimed.has(s, true) || truth.has(s, true));
            if (!d.isZero() && positive && d.has(S.Log, true)) {
                // Logarithms of quotients written two ways (-K log(1 - u/K) against K log(K/(K - u))): each
                // argument brought over one denominator and the logarithms split, as the exponential route
                // below does; cheap where the general simplification can spend its whole budget.
                IExpr split = symja.eval(F.Together(F.PowerExpand(F.ReplaceAll(d, F.RuleDelayed(F.Log(F.x_), F.Log(F.Together(F.x)))))));
                if (split.isZero()) d = split;
            }
            if (!d.isZero() && positive) d = symja.eval(F.Simplify(F.PowerExpand(F.Together(d)), assumptions));
            if (!d.isZero() && positive) {
                // Exponential profiles compare better through their logarithms; PowerExpand is sound
                // here because every base is positive under the assumptions, and the numeric test must agree.
                IExpr logs = symja.eval(F.Simplify(F.Subtract(F.PowerExpand(F.Log(F.Together(claimed))),
                        F.PowerExpand(F.Log(F.Together(truth)))), assumptions));
                if (logs.isZero()) d = logs;
            }
            symbolicZero = d.isZero();
            symbolic = symbolicZero ? "the difference simplifies to 0" : "the difference does not simplify to 0";
        } catch (Symja.Failure f) {
            symbolicZero = null;
            symbolic = f.getMessage();
        }
        List<BigDecimal[]> samples = new ArrayList<>();
        List<Map<ISymbol, IExpr>> points = new ArrayList<>();
        for (int tries = 0; samples.size() < POINTS && tries < 4 * POINTS && sampler.gaveUp() == null; tries++) {
            Map<ISymbol, IExpr> p = sampler.point(translation);
            BigDecimal l = sampler.value(claimed, p);
            BigDecimal r = sampler.value(truth, p);
            if (l == null || r == null) continue;
            samples.add(new BigDecimal[] {l, r});
            points.add(p);
        }
        if (samples.size() < POINTS / 2) {
            String why = sampler.gaveUp() != null ? "the numeric identity test could not evaluate the two sides: " + sampler.gaveUp()
                    : "the numeric identity test found too few points where both sides are real numbers";
            if (Boolean.TRUE.equals(symbolicZero)) return new Verdict(Status.UNDECIDED, symbolic + ", but " + why, null, Optional.empty());
            return new Verdict(Status.UNDECIDED, why + "; " + symbolic, null, Optional.empty());
        }
        boolean numericZero = samples.stream().allMatch(s -> same(s[0], s[1], ZERO_TOLERANCE));
        String numeric = "numeric identity test at " + samples.size() + " random points (" + Sampler.DIGITS + " digits)";
        if (numericZero && Boolean.TRUE.equals(symbolicZero)) {
            return new Verdict(Status.HOLDS, symbolic + "; " + numeric + " agrees", null, Optional.empty());
        }
        if (numericZero) {
            return new Verdict(Status.UNDECIDED, numeric + " finds no difference, but " + symbolic, null, Optional.empty());
        }
        if (Boolean.TRUE.equals(symbolicZero)) {
            return new Verdict(Status.UNDECIDED, "the symbolic and numeric tests disagree: " + symbolic + ", but the "
                    + numeric + " finds a difference", null, Optional.empty());
        }
        List<String> mentioned = translation.table().all().entrySet().stream()
                .filter(e -> claimedAsWritten.has(e.getValue(), true) || truthAsWritten.has(e.getValue(), true)).map(Map.Entry::getKey).toList();
        Verdict verdict = diagnose(claimed, truth, samples, points, mentioned);
        if (verdict.status() != Status.FAILS) return verdict;
        String more = onlyWherePositive(claimed, truth, samples, points);
        if (more == null && verdict.factor() == null) more = flippedTerm(claimed, truth);
        if (more == null && verdict.factor() == null && difference != null && !difference.isZero() && difference.leafCount() <= 12
                && translation.table().signed().stream().noneMatch(difference::has)) {
            more = print(difference).map(p -> "claimed - true = " + p).orElse(null);
        }
        return more == null ? verdict : new Verdict(verdict.status(), verdict.message() + "; " + more, verdict.factor(), verdict.ratio());
    }

    /**
     * When the claim differs from the truth by one term of the truth taken with the wrong sign
     * (claimed - true = -2 t, t a term of the true side), a sentence naming that term; else null.
     */
    private String flippedTerm(IExpr claimed, IExpr truth) {
        try {
            IExpr half = symja.eval(F.Expand(F.Times(F.CN1D2, F.Subtract(claimed, truth))));
            IExpr terms = symja.eval(F.Expand(truth));
            if (half.isZero() || !terms.isPlus()) return flippedExponent(claimed, truth);
            for (IExpr t : (org.matheclipse.core.interfaces.IAST) terms) {
                if (symja.eval(F.Subtract(t, half)).isZero()) {
                    return print(t).map(p -> "the term " + p + " has the wrong sign").orElse(null);
                }
            }
        } catch (Symja.Failure ignored) {
            // Without the term, the verdict's own words stand.
        }
        return flippedExponent(claimed, truth);
    }

    /**
     * The same for an exponent: when log(claimed) - log(true) = -2 t with t a term of log(true) that holds
     * the variables (an exponential profile with its exponent's sign flipped), a sentence naming it; else
     * null. Only where every symbol is positive, since the logarithms are split.
     */
    private String flippedExponent(IExpr claimed, IExpr truth) {
        if (!truth.has(S.E, true) || translation.table().signed().stream().anyMatch(s -> claimed.has(s, true) || truth.has(s, true))) return null;
        try {
            IExpr logTruth = symja.eval(F.Expand(F.PowerExpand(F.Log(truth))));
            IExpr half = symja.eval(F.Expand(F.Times(F.CN1D2, F.Subtract(F.PowerExpand(F.Log(claimed)), logTruth))));
            if (half.isZero() || half.isNumber()) return null;
            List<IExpr> terms = new ArrayList<>();
            if (logTruth.isPlus()) {
                for (IExpr t : (org.matheclipse.core.interfaces.IAST) logTruth) terms.add(t);
            } else {
                terms.add(logTruth);
            }
            IExpr sum = F.C0;
            for (IExpr t : terms) if (!t.isAST(S.Log)) sum = F.Plus(sum, t);
            IExpr exponent = symja.eval(sum);
            if (!exponent.isZero() && symja.eval(F.Subtract(exponent, half)).isZero()) {
                return print(exponent).map(p -> "the exponent " + p + " has the wrong sign").orElse(null);
            }
        } catch (Symja.Failure ignored) {
            // Without the term, the verdict's own words stand.
        }
        return null;
    }

    /**
     * When the two sides agree at every sample point where the symbols that may be negative are positive,
     * and differ only where one is negative: a sentence that says so and how to declare them positive; else null.
     */
    private String onlyWherePositive(IExpr claimed, IExpr truth, List<BigDecimal[]> samples, List<Map<ISymbol, IExpr>> points) {
        List<ISymbol> signed = translation.table().signed().stream().filter(s -> claimed.has(s, true) || truth.has(s, true)).toList();
        if (signed.isEmpty()) return null;
        int positive = 0;
        for (int i = 0; i < samples.size(); i++) {
            Map<ISymbol, IExpr> p = points.get(i);
            boolean allPositive = signed.stream().allMatch(s -> p.get(s) == null || Sampler.decimal(p.get(s)) == null || Sampler.decimal(p.get(s)).signum() > 0);
            if (!allPositive) continue;
            if (!same(samples.get(i)[0], samples.get(i)[1], ZERO_TOLERANCE)) return null;
            positive++;
        }
        if (positive < 2) return null;
        List<String> names = signed.stream().map(s -> translation.table().name(s)).toList();
        String list = String.join(", ", names);
        return "the two sides agree wherever " + list + (names.size() == 1 ? " is" : " are") + " positive and differ for negative values; "
                + list + (names.size() == 1 ? " is" : " are") + " declared without '> 0' (add it if " + (names.size() == 1 ? "it is" : "they are") + " positive)";
    }

    /** {@code mentioned}: the names the two sides use as written, before the rewriting into the basis. */
    private Verdict diagnose(IExpr claimed, IExpr truth, List<BigDecimal[]> samples, List<Map<ISymbol, IExpr>> points,
                             List<String> mentioned) {
        ConstantValues values = new ConstantValues(symja, translation.table(), sampler, assumptions);
        if (samples.stream().allMatch(s -> s[1].signum() == 0)) {
            return new Verdict(Status.FAILS, "it should be 0 but is not", null, Optional.empty());
        }
        List<BigDecimal> ratios = new ArrayList<>();
        for (BigDecimal[] s : samples) {
            if (s[1].signum() != 0) ratios.add(s[0].divide(s[1], Sampler.MC));
        }
        BigDecimal first = ratios.get(0);
        boolean constant = ratios.stream().allMatch(q -> same(q, first, SAME_TOLERANCE));
        if (constant) {
            if (first.signum() == 0) return new Verdict(Status.FAILS, "it is 0 but should not be", null, Optional.empty());
            Optional<String> exact = ExactNumber.identify(first, symja).flatMap(this::print);
            if (exact.isEmpty() && ConstantValues.nearOne(first)) return values.nearOne(claimed, truth, first, samples.size(), false);
            String f = exact.orElse(first.round(new MathContext(8)).toString());
            String msg = f.equals("-1") ? "the sign is wrong: claimed/true = -1"
                    : "off by a constant factor: claimed/true = " + f + (exact.isEmpty() ? " (not identified exactly)" : "");
            return new Verdict(Status.FAILS, msg, f, Optional.of(first));
        }
        Dependence d = dependence(claimed, truth, points.get(0));
        if (d == null) return new Verdict(Status.FAILS, "the two sides differ", null, Optional.empty());
        Optional<Verdict> byValue = values.judge(claimed, truth, points, d, mentioned, samples.size());
        return byValue.orElseGet(() -> new Verdict(Status.FAILS, describe(d), null, Optional.empty()));
    }

    /**
     * How the ratio claimed/true varies at a sample point: the exponent of each quantity it
     * varies with as a power, the quantities it varies with otherwise, and the coordinate when
     * the difference is free of it (else null).
     */
    record Dependence(Map<String, Rational> powers, List<String> other, String differenceFreeOf) {
    }

    /** How the ratio claimed/true varies: a power of each quantity it depends on, or not a power law; null when it has no value. */
    private Dependence dependence(IExpr claimed, IExpr truth, Map<ISymbol, IExpr> base) {
        BigDecimal r0 = ratio(claimed, truth, base);
        if (r0 == null) return null;
        Map<String, Rational> powers = new LinkedHashMap<>();
        List<String> other = new ArrayList<>();
        for (var entry : translation.table().all().entrySet()) {
            ISymbol v = entry.getValue();
            if (!base.containsKey(v) || !(claimed.has(v, true) || truth.has(v, true))) continue;
            BigDecimal r2 = ratio(claimed, truth, scaled(base, v, 2));
            BigDecimal r3 = ratio(claimed, truth, scaled(base, v, 3));
            if (r2 == null || r3 == null) continue;
            if (same(r2, r0, SAME_TOLERANCE) && same(r3, r0, SAME_TOLERANCE)) continue;
            double q2 = r2.divide(r0, Sampler.MC).doubleValue();
            double q3 = r3.divide(r0, Sampler.MC).doubleValue();
            double a2 = q2 > 0 ? Math.log(q2) / Math.log(2) : Double.NaN;
            double a3 = q3 > 0 ? Math.log(q3) / Math.log(3) : Double.NaN;
            var exponent = Rational.approximate(a2, 12);
            // An exponent of 0 is a ratio that varies, only too little for the power test: not a power law.
            if (!Double.isNaN(a2) && Math.abs(a2 - a3) < 1e-9 && exponent.isPresent() && exponent.get().toDouble() != 0
                    && Math.abs(exponent.get().toDouble() - a2) < 1e-9) {
                powers.put(entry.getKey(), exponent.get());
            } else {
                other.add(entry.getKey());
            }
        }
        String coord = translation.table().name(translation.table().coordinate);
        boolean freeOfCoordinate = !powers.containsKey(coord) && other.contains(coord) && differenceFreeOf(claimed, truth, base);
        return new Dependence(powers, other, freeOfCoordinate ? coord : null);
    }

    static String describe(Dependence d) {
        List<String> parts = new ArrayList<>();
        if (!d.powers().isEmpty()) parts.add("differs by a factor proportional to " + monomial(d.powers()));
        if (!d.other().isEmpty()) {
            parts.add("claimed/true depends on " + String.join(", ", d.other()) + (d.powers().isEmpty() ? "" : " in a way that is not a power law"));
        }
        if (d.differenceFreeOf() != null) {
            parts.add("the difference does not depend on " + d.differenceFreeOf() + " (a constant of integration or a boundary value is off)");
        }
        return parts.isEmpty() ? "the two sides differ" : String.join("; ", parts);
    }

    /** {@code G^(-1)*M^2}: the powers in plumb's syntax. */
    static String monomial(Map<String, Rational> powers) {
        List<String> f = new ArrayList<>();
        powers.forEach((n, r) -> {
            String e = r.toString();
            f.add(e.equals("1") ? n : n + "^" + (e.contains("/") || e.startsWith("-") ? "(" + e + ")" : e));
        });
        return String.join("*", f);
    }

    private boolean differenceFreeOf(IExpr claimed, IExpr truth, Map<ISymbol, IExpr> base) {
        ISymbol x = translation.table().coordinate;
        BigDecimal d0 = difference(claimed, truth, base);
        BigDecimal d1 = difference(claimed, truth, scaled(base, x, 2));
        BigDecimal d2 = difference(claimed, truth, scaled(base, x, 3));
        return d0 != null && d1 != null && d2 != null && same(d0, d1, SAME_TOLERANCE) && same(d0, d2, SAME_TOLERANCE);
    }

    private BigDecimal difference(IExpr claimed, IExpr truth, Map<ISymbol, IExpr> p) {
        BigDecimal l = sampler.value(claimed, p);
        BigDecimal r = sampler.value(truth, p);
        return l == null || r == null ? null : l.subtract(r);
    }

    private BigDecimal ratio(IExpr claimed, IExpr truth, Map<ISymbol, IExpr> p) {
        BigDecimal l = sampler.value(claimed, p);
        BigDecimal r = sampler.value(truth, p);
        return l == null || r == null || r.signum() == 0 ? null : l.divide(r, Sampler.MC);
    }

    private static Map<ISymbol, IExpr> scaled(Map<ISymbol, IExpr> base, ISymbol v, int factor) {
        Map<ISymbol, IExpr> p = new LinkedHashMap<>(base);
        p.put(v, F.Times(base.get(v), F.ZZ(factor)));
        return p;
    }

    private Optional<String> print(IExpr e) {
        try {
            return Optional.of(new PlumbForm(translation.table()).print(e));
        } catch (Translation.Untranslatable ex) {
            return Optional.empty();
        }
    }

    static boolean same(BigDecimal a, BigDecimal b, BigDecimal tolerance) {
        BigDecimal scale = a.abs().max(b.abs());
        if (scale.signum() == 0) return true;
        return a.subtract(b).abs().compareTo(scale.multiply(tolerance)) <= 0;
    }
}
