package dev.plumb.symbolic;

import dev.plumb.units.Rational;
import java.math.BigDecimal;
import java.util.Optional;
import org.matheclipse.core.expression.F;
import org.matheclipse.core.interfaces.IExpr;

/**
 * Names a high-precision number exactly when it is a small rational times a small power of pi
 * ({@code 2}, {@code -1}, {@code 3/2}, {@code 8*pi/3}, {@code 1/(4*pi^2)}): the usual shapes of
 * a dropped or doubled factor in a hand derivation.
 */
final class ExactNumber {
    private static final int[] PI_POWERS = {0, 1, -1, 2, -2, 3, -3};
    private static final BigDecimal TOLERANCE = new BigDecimal("1e-24");

    private ExactNumber() {
    }

    /**
     * Whether the number is a small rational (numerator and denominator at most 100) times a
     * small power of pi: the shape of a structural factor (2, 3/8, 1/(2*pi)), as opposed to a
     * typed value such as 6.674e-11, or a unit's 1000 as in 1 g/mol typed for N_A*m_u.
     */
    static boolean isSmall(BigDecimal v, Symja symja) {
        if (v.signum() == 0) return true;
        BigDecimal pi = Sampler.decimal(symja.eval(F.N(F.Pi, F.ZZ(Sampler.DIGITS + 10))));
        for (int k : PI_POWERS) {
            BigDecimal scaled = k >= 0 ? v.divide(pi.pow(k), Sampler.MC) : v.multiply(pi.pow(-k), Sampler.MC);
            Optional<Rational> q = Rational.approximate(scaled.doubleValue(), 100);
            if (q.isEmpty() || Math.abs(q.get().num()) > 100) continue;
            BigDecimal exact = new BigDecimal(q.get().num()).divide(new BigDecimal(q.get().den()), Sampler.MC);
            if (Comparison.same(exact, scaled, TOLERANCE)) return true;
        }
        return false;
    }

    static Optional<IExpr> identify(BigDecimal v, Symja symja) {
        return identify(v, symja, TOLERANCE);
    }

    /** As {@link #identify(BigDecimal, Symja)}, for a number known only to relative {@code tolerance}. */
    static Optional<IExpr> identify(BigDecimal v, Symja symja, BigDecimal tolerance) {
        if (v.signum() == 0) return Optional.of(F.C0);
        BigDecimal pi = Sampler.decimal(symja.eval(F.N(F.Pi, F.ZZ(Sampler.DIGITS + 10))));
        for (int k : PI_POWERS) {
            BigDecimal scaled = k >= 0 ? v.divide(pi.pow(k), Sampler.MC) : v.multiply(pi.pow(-k), Sampler.MC);
            Optional<Rational> q = Rational.approximate(scaled.doubleValue(), tolerance.compareTo(TOLERANCE) > 0 ? 100 : 10_000);
            if (q.isEmpty()) continue;
            BigDecimal exact = new BigDecimal(q.get().num()).divide(new BigDecimal(q.get().den()), Sampler.MC);
            if (Comparison.same(exact, scaled, tolerance)) {
                return Optional.of(symja.eval(F.Times(F.QQ(q.get().num(), q.get().den()), F.Power(F.Pi, F.ZZ(k)))));
            }
        }
        return Optional.empty();
    }
}
