package dev.plumb.units;

import java.util.Objects;

/**
 * A unit: a scale factor to coherent SI base units and a dimension. value_SI = value * factor.
 *
 * <p>{@code text} is how the unit is written for people, in the syntax {@link UnitParser}
 * reads; units made by {@link #times}, {@link #over} and {@link #pow} get a text that parses
 * back to the same factor and dimension. Only multiplicative units exist here: degrees Celsius
 * and other offset scales are deliberately absent.
 */
public record Unit(String text, double factor, Dimension dimension) {
  /** The dimensionless unit, written "1". */
  public static final Unit ONE = new Unit("1", 1.0, Dimension.NONE);

  public Unit {
    Objects.requireNonNull(text, "text");
    Objects.requireNonNull(dimension, "dimension");
    if (!(factor > 0) || Double.isInfinite(factor)) {
      throw new IllegalArgumentException("unit factor must be positive and finite: " + factor);
    }
  }

  public Unit times(Unit o) {
    if (isOne()) {
      return o;
    }
    if (o.isOne()) {
      return this;
    }
    // Juxtaposition and '/' share one left-associative level, so "a/b c" already means (a/b) c.
    return new Unit(text + " " + grouped(o.text, true), factor * o.factor, dimension.mul(o.dimension));
  }

  public Unit over(Unit o) {
    if (o.isOne()) {
      return this;
    }
    String head = isOne() ? "1" : text;
    return new Unit(head + "/" + grouped(o.text, false), factor / o.factor, dimension.div(o.dimension));
  }

  public Unit pow(Rational p) {
    if (p.equals(Rational.ONE)) {
      return this;
    }
    if (p.isZero() || isOne()) {
      return ONE;
    }
    String base = isSingleSymbol(text) ? text : "(" + text + ")";
    return new Unit(base + Dimension.exponentSuffix(p), Math.pow(factor, p.toDouble()), dimension.pow(p));
  }

  /** The value in coherent SI base units of {@code value} in this unit. */
  public double toSI(double value) {
    return value * factor;
  }

  /** The value in this unit of {@code valueSI}, given in coherent SI base units. */
  public double fromSI(double valueSI) {
    return valueSI / factor;
  }

  /** Whether quantities in the two units can be added or converted into each other. */
  public boolean isCompatible(Unit o) {
    return dimension.equals(o.dimension);
  }

  private boolean isOne() {
    return factor == 1.0 && dimension.isNone() && text.equals("1");
  }

  /** Wraps a right operand in parentheses when writing it bare would regroup it. */
  private static String grouped(String s, boolean afterProduct) {
    boolean compound = s.indexOf(' ') >= 0 || s.indexOf('*') >= 0 || s.indexOf('/') >= 0;
    return compound && !afterProduct ? "(" + s + ")" : s;
  }

  private static boolean isSingleSymbol(String s) {
    return s.codePoints().allMatch(c -> Character.isLetter(c) || c == '_');
  }
}
