package dev.plumb.units;

import java.util.Optional;

/**
 * An exact rational number, always normalised (den > 0, gcd 1).
 *
 * <p>Used for dimension exponents, where {@code kg^(-4/3)} must stay exactly -4/3 so that
 * products of exponents cancel to zero rather than to a rounding residue. Arithmetic throws
 * {@link ArithmeticException} on a zero denominator or on {@code long} overflow.
 */
public record Rational(long num, long den) implements Comparable<Rational> {
  public static final Rational ZERO = new Rational(0, 1);
  public static final Rational ONE = new Rational(1, 1);

  /** Relative (or, near zero, absolute) tolerance within which {@link #approximate} accepts a fraction. */
  private static final double TOLERANCE = 1e-9;

  /** Normalises sign and common factors, so that equal values are equal records. */
  public Rational {
    if (den == 0) {
      throw new ArithmeticException("zero denominator in " + num + "/" + den);
    }
    if (den < 0) {
      num = Math.negateExact(num);
      den = Math.negateExact(den);
    }
    long g = gcd(Math.abs(num), den);
    if (g > 1) {
      num /= g;
      den /= g;
    }
  }

  public static Rational of(long n) {
    return new Rational(n, 1);
  }

  public static Rational of(long n, long d) {
    return new Rational(n, d);
  }

  /**
   * Nearest rational with denominator <= maxDen if within 1e-9 relative/absolute, else empty
   * (continued fractions).
   *
   * <p>Returns the first continued-fraction convergent that lies within tolerance, which is
   * the fraction with the smallest denominator that does: 0.333333333333 gives 1/3, not a
   * closer fraction with a large denominator that only fits the rounding noise.
   */
  public static Optional<Rational> approximate(double x, long maxDen) {
    if (!Double.isFinite(x) || maxDen < 1 || Math.abs(x) >= 0x1p62) {
      return Optional.empty();
    }
    double allowed = TOLERANCE * Math.max(1.0, Math.abs(x));
    // Convergents h/k of the continued fraction of x: h_n = a_n h_{n-1} + h_{n-2}, likewise k.
    long hPrev = 1, kPrev = 0;
    long h = (long) Math.floor(x), k = 1;
    double rest = x - Math.floor(x);
    for (int i = 0; i < 64; i++) {
      if (Math.abs(x - (double) h / k) <= allowed) {
        return Optional.of(new Rational(h, k));
      }
      if (rest < 1e-300) {
        return Optional.empty();
      }
      double inverse = 1.0 / rest;
      double a = Math.floor(inverse);
      rest = inverse - a;
      if (a > 0x1p62) {
        return Optional.empty();
      }
      try {
        long hNext = Math.addExact(Math.multiplyExact((long) a, h), hPrev);
        long kNext = Math.addExact(Math.multiplyExact((long) a, k), kPrev);
        if (kNext > maxDen) {
          return Optional.empty();
        }
        hPrev = h;
        kPrev = k;
        h = hNext;
        k = kNext;
      } catch (ArithmeticException overflow) {
        return Optional.empty();
      }
    }
    return Optional.empty();
  }

  public Rational add(Rational o) {
    long g = gcd(den, o.den);
    long scale = o.den / g;
    return new Rational(
        Math.addExact(Math.multiplyExact(num, scale), Math.multiplyExact(o.num, den / g)),
        Math.multiplyExact(den, scale));
  }

  public Rational sub(Rational o) {
    return add(o.neg());
  }

  public Rational mul(Rational o) {
    // Cross-cancel first so that small results of large operands do not overflow.
    long g1 = gcd(Math.abs(num), o.den);
    long g2 = gcd(Math.abs(o.num), den);
    return new Rational(
        Math.multiplyExact(num / g1, o.num / g2), Math.multiplyExact(den / g2, o.den / g1));
  }

  public Rational div(Rational o) {
    if (o.isZero()) {
      throw new ArithmeticException("division of " + this + " by zero");
    }
    return mul(new Rational(o.den, o.num));
  }

  public Rational neg() {
    return new Rational(Math.negateExact(num), den);
  }

  public boolean isZero() {
    return num == 0;
  }

  public boolean isInteger() {
    return den == 1;
  }

  /** -1, 0 or 1 as this number is negative, zero or positive. */
  public int signum() {
    return Long.signum(num);
  }

  public double toDouble() {
    return (double) num / den;
  }

  @Override
  public int compareTo(Rational o) {
    // Compare num/den with o.num/o.den as 128-bit cross products, so no operand can overflow.
    long highA = Math.multiplyHigh(num, o.den);
    long highB = Math.multiplyHigh(o.num, den);
    return highA != highB
        ? Long.compare(highA, highB)
        : Long.compareUnsigned(num * o.den, o.num * den);
  }

  /** "2", "-4/3". */
  @Override
  public String toString() {
    return den == 1 ? Long.toString(num) : num + "/" + den;
  }

  private static long gcd(long a, long b) {
    while (b != 0) {
      long t = a % b;
      a = b;
      b = t;
    }
    return a == 0 ? 1 : a;
  }
}
