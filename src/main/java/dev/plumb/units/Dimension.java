package dev.plumb.units;

import java.util.Arrays;
import java.util.Collections;
import java.util.EnumMap;
import java.util.Map;

/**
 * Exponents of the seven SI base dimensions (m, kg, s, A, K, mol, cd), as exact rationals.
 *
 * <p>Immutable; equal by value. Rational exponents are what polytropes need: the constant of
 * {@code P = K rho^(4/3)} has dimension {@code kg^(-1/3) m^3 s^-2}.
 */
public final class Dimension {
  /** The seven SI base dimensions with the symbol of their coherent SI base unit. */
  public enum Base {
    LENGTH("m"), MASS("kg"), TIME("s"), CURRENT("A"), TEMPERATURE("K"), AMOUNT("mol"),
    LUMINOUS("cd");

    public final String symbol;

    Base(String symbol) {
      this.symbol = symbol;
    }
  }

  private static final Base[] BASES = Base.values();

  /**
   * The order in which {@link #toString} writes factors: mass first, then the rest as in the
   * SI Brochure's list, so that a pressure reads "kg m^-1 s^-2" in the usual way.
   */
  private static final Base[] PRINT_ORDER = {
    Base.MASS, Base.LENGTH, Base.TIME, Base.CURRENT, Base.TEMPERATURE, Base.AMOUNT, Base.LUMINOUS
  };

  public static final Dimension NONE = new Dimension(filled(Rational.ZERO));

  private final Rational[] exponents;

  private Dimension(Rational[] exponents) {
    this.exponents = exponents;
  }

  /** {@code b^1}. */
  public static Dimension of(Base b) {
    return of(b, Rational.ONE);
  }

  /** {@code b^e}. */
  public static Dimension of(Base b, Rational e) {
    Rational[] x = filled(Rational.ZERO);
    x[b.ordinal()] = e;
    return new Dimension(x);
  }

  public Rational exponent(Base b) {
    return exponents[b.ordinal()];
  }

  /** The non-zero exponents, in base order; empty when dimensionless. */
  public Map<Base, Rational> exponents() {
    Map<Base, Rational> m = new EnumMap<>(Base.class);
    for (Base b : BASES) {
      if (!exponent(b).isZero()) {
        m.put(b, exponent(b));
      }
    }
    return Collections.unmodifiableMap(m);
  }

  public Dimension mul(Dimension o) {
    Rational[] x = new Rational[BASES.length];
    for (int i = 0; i < x.length; i++) {
      x[i] = exponents[i].add(o.exponents[i]);
    }
    return new Dimension(x);
  }

  public Dimension div(Dimension o) {
    return mul(o.inverse());
  }

  public Dimension pow(Rational p) {
    Rational[] x = new Rational[BASES.length];
    for (int i = 0; i < x.length; i++) {
      x[i] = exponents[i].mul(p);
    }
    return new Dimension(x);
  }

  public Dimension inverse() {
    return pow(Rational.ONE.neg());
  }

  public boolean isNone() {
    return equals(NONE);
  }

  /**
   * SI base form, e.g. "kg m^-1 s^-2", "m^(1/2)", "1" for dimensionless.
   *
   * <p>Positive exponents come before negative ones (so G reads "m^3 kg^-1 s^-2", as CODATA
   * writes it), each group in the order kg m s A K mol cd. The text parses back with
   * {@link UnitParser} to this same dimension.
   */
  @Override
  public String toString() {
    StringBuilder sb = new StringBuilder();
    for (int sign : new int[] {1, -1}) {
      for (Base b : PRINT_ORDER) {
        Rational e = exponent(b);
        if (e.signum() == sign) {
          if (sb.length() > 0) {
            sb.append(' ');
          }
          sb.append(b.symbol).append(exponentSuffix(e));
        }
      }
    }
    return sb.length() == 0 ? "1" : sb.toString();
  }

  /** "" for 1, "^-2" for integers, "^(1/2)" for fractions: the exponent syntax of unit text. */
  static String exponentSuffix(Rational e) {
    if (e.equals(Rational.ONE)) {
      return "";
    }
    return e.isInteger() ? "^" + e : "^(" + e + ")";
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof Dimension d && Arrays.equals(exponents, d.exponents);
  }

  @Override
  public int hashCode() {
    return Arrays.hashCode(exponents);
  }

  private static Rational[] filled(Rational r) {
    Rational[] x = new Rational[BASES.length];
    Arrays.fill(x, r);
    return x;
  }
}
