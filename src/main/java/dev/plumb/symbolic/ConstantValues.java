package dev.plumb.symbolic;

import dev.plumb.model.Status;
import dev.plumb.units.Constants;
import dev.plumb.units.ExactRelations;
import dev.plumb.units.Rational;
import java.math.BigDecimal;
import java.math.MathContext;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.matheclipse.core.expression.F;
import org.matheclipse.core.interfaces.IExpr;
import org.matheclipse.core.interfaces.ISymbol;

/**
 * Judges a claim that differs from the truth only through the built-in constants: a number
 * typed where the derivation has a constant ({@code 6.674e-8 [cm^3/(g s^2)]} for G). The random
 * points scale every constant, so such a claim is not identically true; with the constants at
 * their own values, claimed/true is one number. Within {@value #HOLDS_WITHIN_TEXT} of 1 the claim
 * holds (a value typed with 12 or more correct digits is the constant: the exact c of the 2019 SI,
 * or G as CODATA 2018 prints it); otherwise it fails with that number, naming the constant whose
 * value is off.
 */
final class ConstantValues {

    private static final String HOLDS_WITHIN_TEXT = "1e-12";
    /**
     * Far below the relative uncertainty of any measured constant here (2.2e-5 for G, 3e-10 for
     * m_e), far above the rounding of {@value Sampler#DIGITS}-digit arithmetic and of a double.
     */
    private static final BigDecimal HOLDS_WITHIN = new BigDecimal(HOLDS_WITHIN_TEXT);
    private static final BigDecimal SAME_TOLERANCE = new BigDecimal("1e-25");

    private final Symja symja;
    private final SymbolTable table;
    private final Sampler sampler;
    private final IExpr assumptions;

    ConstantValues(Symja symja, SymbolTable table, Sampler sampler, IExpr assumptions) {
        this.symja = symja;
        this.table = table;
        this.sampler = sampler;
        this.assumptions = assumptions;
    }

    static boolean nearOne(BigDecimal ratio) {
        return ratio.subtract(BigDecimal.ONE).abs().compareTo(HOLDS_WITHIN) <= 0;
    }

    /**
     * A verdict when claimed/true varies only with built-in constants ({@code dependence} at one
     * point, over the sides already written in the basis); empty when something else varies too.
     * A ratio that is a power of constants times a small exact number (a dropped G, m_u for m_p)
     * is described as that dependence, with its value; any other number in front of the constants
     * was typed for them, and the verdict names the constant.
     *
     * @param mentioned the names the two sides use as written, which name a constant first
     * @param tested    how many random points the identity test used
     */
    Optional<Comparison.Verdict> judge(IExpr claimed, IExpr truth, List<Map<ISymbol, IExpr>> points, Comparison.Dependence dependence,
                                       List<String> mentioned, int tested) {
        List<String> varying = new ArrayList<>(dependence.powers().keySet());
        varying.addAll(dependence.other());
        if (varying.isEmpty() || !varying.stream().allMatch(table::isBuiltin)) return Optional.empty();
        BigDecimal ratio = ratioAtValues(claimed, truth, points);
        if (ratio == null) return Optional.empty();
        if (nearOne(ratio)) return Optional.of(nearOne(claimed, truth, ratio, tested, true));
        boolean monomial = dependence.other().isEmpty();
        if (monomial) {
            BigDecimal number = numberTimes(claimed, truth, points.get(0));
            if (number == null) return Optional.empty();
            if (ExactNumber.isSmall(number, symja)) {
                // m_u where the derivation has m_p: a different constant, not a different value of one.
                return Optional.of(new Comparison.Verdict(Status.FAILS, Comparison.describe(dependence)
                        + "; with the built-in constants at their values claimed/true = " + factor(ratio), null, Optional.empty()));
            }
        }
        String factor = factor(ratio);
        String why = monomial ? valueUsed(dependence.powers(), ratio, mentioned)
                : "with the built-in constants at their values; claimed/true depends on " + String.join(", ", varying)
                + " in a way that is not a power law";
        return Optional.of(new Comparison.Verdict(Status.FAILS, "off by a numeric factor " + factor + ": " + why, factor, Optional.of(ratio)));
    }

    /**
     * The verdict for a ratio claimed/true (with the constants at their values) within
     * {@value #HOLDS_WITHIN_TEXT} of 1: it holds when the computer algebra confirms that, with the
     * constants' values put in, the difference is 0 or the ratio is a number.
     */
    Comparison.Verdict nearOne(IExpr claimed, IExpr truth, BigDecimal ratio, int tested, boolean throughConstants) {
        String values = throughConstants ? valuesPutIn(claimed, truth) : "";
        String numeric = "numeric identity test at " + tested + " random points (" + Sampler.DIGITS + " digits)";
        try {
            IExpr c = atValues(claimed);
            IExpr t = atValues(truth);
            if (!values.isEmpty() && symja.eval(F.Simplify(F.Subtract(c, t), assumptions)).isZero()) {
                return new Comparison.Verdict(Status.HOLDS, "with " + values + " put in, the difference simplifies to 0; "
                        + numeric + " agrees", null, Optional.empty());
            }
            IExpr q = symja.eval(F.Simplify(F.Together(F.Divide(c, t)), assumptions));
            if (q.isFree(x -> x.isSymbol() && table.name((ISymbol) x) != null, true)) {
                BigDecimal off = ratio.subtract(BigDecimal.ONE).round(new MathContext(2));
                return new Comparison.Verdict(Status.HOLDS, "claimed/true is 1 " + (off.signum() < 0 ? "- " : "+ ") + scientific(off.abs())
                        + (values.isEmpty() ? "" : " with " + values + " put in") + " (it simplifies to this number), within the "
                        + HOLDS_WITHIN_TEXT + " that counts as equal (a value typed with 12 or more correct digits); " + numeric + " agrees",
                        null, Optional.empty());
            }
        } catch (Symja.Failure f) {
            return new Comparison.Verdict(Status.UNDECIDED, "claimed/true is 1 to " + HOLDS_WITHIN_TEXT + " at " + tested
                    + " random points, but the computer algebra could not confirm it: " + f.getMessage(), null, Optional.empty());
        }
        return new Comparison.Verdict(Status.UNDECIDED, "claimed/true is 1 to " + HOLDS_WITHIN_TEXT + " at " + tested
                + " random points, but the computer algebra does not confirm that it is a constant", null, Optional.empty());
    }

    /** claimed/true with the constants at their values; null unless it is one number at every point. */
    private BigDecimal ratioAtValues(IExpr claimed, IExpr truth, List<Map<ISymbol, IExpr>> points) {
        List<BigDecimal> ratios = new ArrayList<>();
        for (Map<ISymbol, IExpr> p : points) {
            BigDecimal r = ratio(claimed, truth, sampler.atConstantValues(p));
            if (r != null) ratios.add(r);
        }
        if (ratios.size() < Comparison.POINTS / 2) return null;
        BigDecimal first = ratios.get(0);
        return ratios.stream().allMatch(r -> Comparison.same(r, first, SAME_TOLERANCE)) ? first : null;
    }

    /** The number a monomial claimed/true = number * prod(constant^power) carries: its value with every constant at 1. */
    private BigDecimal numberTimes(IExpr claimed, IExpr truth, Map<ISymbol, IExpr> point) {
        Map<ISymbol, IExpr> ones = new LinkedHashMap<>(point);
        table.all().forEach((name, sym) -> {
            if (table.isBuiltin(name)) ones.put(sym, F.C1);
        });
        return ratio(claimed, truth, ones);
    }

    private BigDecimal ratio(IExpr claimed, IExpr truth, Map<ISymbol, IExpr> p) {
        BigDecimal l = sampler.value(claimed, p);
        BigDecimal r = sampler.value(truth, p);
        return l == null || r == null || r.signum() == 0 ? null : l.divide(r, Sampler.MC);
    }

    private IExpr atValues(IExpr e) {
        List<IExpr> rules = new ArrayList<>();
        table.all().forEach((name, sym) -> table.constantValue(name).ifPresent(v -> rules.add(F.Rule(sym, Translation.rational(v)))));
        return rules.isEmpty() ? e : symja.eval(F.ReplaceAll(e, F.ListAlloc(rules)));
    }

    /** "G = 6.67430e-11 (CODATA 2018), c = 299792458 (exact)": the constants the two sides use. */
    private String valuesPutIn(IExpr claimed, IExpr truth) {
        List<String> out = new ArrayList<>();
        table.all().forEach((name, sym) -> {
            if (!table.isBuiltin(name) || !(claimed.has(sym, true) || truth.has(sym, true))) return;
            out.add(name + " = " + Constants.published(name).orElse("?") + (ExactRelations.isExact(name) ? " (exact)" : " (CODATA 2018)"));
        });
        return String.join(", ", out);
    }

    /**
     * Which constant's value is off: a built-in constant Q (as written, or a basis constant)
     * whose powers, raised to some n, are those of the ratio inverted; then a number v was used
     * for Q, with claimed/true = (v/Q)^n.
     */
    private String valueUsed(Map<String, Rational> powers, BigDecimal ratio, List<String> mentioned) {
        List<String> candidates = new ArrayList<>(mentioned);
        table.all().keySet().stream().filter(n -> !candidates.contains(n)).forEach(candidates::add);
        for (String q : candidates) {
            if (!table.isBuiltin(q)) continue;
            Map<String, Integer> basis = basisOf(q);
            Optional<Rational> n = commonPower(powers, basis);
            if (n.isEmpty()) continue;
            BigDecimal value = table.constantValue(q).orElseThrow();
            BigDecimal used = n.get().equals(Rational.ONE) ? value.multiply(ratio, Sampler.MC)
                    : value.multiply(new BigDecimal(Math.pow(ratio.doubleValue(), 1 / n.get().toDouble())), Sampler.MC);
            String unit = Constants.lookup(q).map(c -> c.unit().dimension().toString()).orElse("1");
            return "the value used for " + q + " (" + scientific(used.round(new MathContext(10))) + (unit.equals("1") ? "" : " " + unit)
                    + ") differs from " + reference(q);
        }
        return "with the built-in constants at their values (claimed/true is " + Comparison.monomial(powers)
                + " times a number: a number stands where the other side has these constants)";
    }

    /** The powers of basis constants a built-in constant stands for: {N_A: 1, k_B: 1} for R_gas when it was rewritten, else itself. */
    private Map<String, Integer> basisOf(String name) {
        ISymbol sym = table.symbol(name);
        Optional<ExactRelations.Relation> r = ExactRelations.of(name);
        if (r.isPresent() && sym != null && !table.inBasis(sym).equals(sym)) return r.get().powers();
        return Map.of(name, 1);
    }

    /** n with powers = -n * basis, exponent by exponent, or empty. */
    private static Optional<Rational> commonPower(Map<String, Rational> powers, Map<String, Integer> basis) {
        if (!powers.keySet().equals(basis.keySet())) return Optional.empty();
        Rational n = null;
        for (var e : basis.entrySet()) {
            Rational k = powers.get(e.getKey()).div(Rational.of(-e.getValue()));
            if (n != null && !n.equals(k)) return Optional.empty();
            n = k;
        }
        return Optional.ofNullable(n).filter(k -> !k.isZero());
    }

    private static String reference(String name) {
        String published = Constants.published(name).orElse("?");
        if (name.equals("g_n")) return "its defined value " + published;
        if (ExactRelations.isExact(name)) return "its exact value in the 2019 SI, " + published;
        return "CODATA 2018's " + published;
    }

    /**
     * The ratio to five significant digits, or, close to 1, to the second significant digit of
     * its difference from 1 (0.999955, 0.99999999965): how far off a typed value is, is the news.
     */
    static String factor(BigDecimal ratio) {
        BigDecimal shown = ratio.round(new MathContext(5));
        BigDecimal off = ratio.subtract(BigDecimal.ONE).abs();
        if (off.signum() != 0 && off.compareTo(new BigDecimal("1e-3")) < 0) {
            int firstDigit = off.precision() - off.scale() - 1;
            shown = ratio.setScale(1 - firstDigit, java.math.RoundingMode.HALF_EVEN);
        }
        return scientific(shown);
    }

    /** Plain for moderate magnitudes (0.99996, 1000), else 6.674e-11; trailing zeros dropped. */
    static String scientific(BigDecimal v) {
        BigDecimal s = v.stripTrailingZeros();
        BigDecimal a = s.abs();
        if (a.signum() == 0 || (a.compareTo(new BigDecimal("1e-4")) >= 0 && a.compareTo(new BigDecimal("1e6")) < 0)) return s.toPlainString();
        int exponent = s.precision() - s.scale() - 1;
        return s.movePointLeft(exponent).toPlainString() + "e" + exponent;
    }
}
