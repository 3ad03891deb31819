package dev.plumb.units;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Optional;
import org.junit.jupiter.api.Test;

class RationalTest {
  @Test
  void normalisesSignAndCommonFactors() {
    Rational r = Rational.of(6, -8);
    assertEquals(-3, r.num());
    assertEquals(4, r.den());
    assertEquals(Rational.of(-3, 4), r);
    assertEquals(Rational.ZERO, Rational.of(0, -5));
    assertEquals(1, Rational.of(0, -5).den());
  }

  @Test
  void printsIntegersBareAndFractionsWithSlash() {
    assertEquals("2", Rational.of(4, 2).toString());
    assertEquals("-4/3", Rational.of(4, -3).toString());
    assertEquals("0", Rational.ZERO.toString());
  }

  @Test
  void arithmeticIsExact() {
    Rational third = Rational.of(1, 3);
    assertEquals(Rational.ONE, third.add(third).add(third));
    assertEquals(Rational.of(-1, 6), Rational.of(1, 6).sub(Rational.of(1, 3)));
    assertEquals(Rational.of(-4, 9), Rational.of(-4, 3).mul(third));
    assertEquals(Rational.of(-4), Rational.of(-4, 3).div(third));
    assertEquals(Rational.of(4, 3), Rational.of(-4, 3).neg());
    assertTrue(Rational.of(-4, 3).add(Rational.of(4, 3)).isZero());
    assertTrue(Rational.of(6, 3).isInteger());
    assertFalse(Rational.of(1, 2).isInteger());
    assertEquals(-1.0 / 3.0, Rational.of(-1, 3).toDouble(), 0.0);
  }

  @Test
  void zeroDenominatorAndOverflowAreErrors() {
    assertThrows(ArithmeticException.class, () -> Rational.of(1, 0));
    assertThrows(ArithmeticException.class, () -> Rational.ONE.div(Rational.ZERO));
    assertThrows(ArithmeticException.class, () -> Rational.of(Long.MAX_VALUE).add(Rational.ONE));
  }

  @Test
  void comparesByValueEvenWhenCrossProductsOverflow() {
    assertTrue(Rational.of(1, 3).compareTo(Rational.of(1, 2)) < 0);
    assertTrue(Rational.of(-1, 2).compareTo(Rational.of(-1, 3)) < 0);
    assertEquals(0, Rational.of(2, 4).compareTo(Rational.of(1, 2)));
    Rational big = Rational.of(Long.MAX_VALUE - 1, Long.MAX_VALUE);
    Rational bigger = Rational.of(Long.MAX_VALUE - 2, Long.MAX_VALUE - 1);
    // (M-1)/M > (M-2)/(M-1) because (M-1)^2 > M(M-2).
    assertTrue(big.compareTo(bigger) > 0);
    assertTrue(bigger.compareTo(big) < 0);
  }

  @Test
  void approximatesDoublesThatAreFractions() {
    assertEquals(Optional.of(Rational.of(1, 3)), Rational.approximate(1.0 / 3.0, 100));
    assertEquals(Optional.of(Rational.of(-4, 3)), Rational.approximate(-4.0 / 3.0, 100));
    assertEquals(Optional.of(Rational.of(2)), Rational.approximate(2.0, 1));
    assertEquals(Optional.of(Rational.ZERO), Rational.approximate(1e-12, 10));
    assertEquals(Optional.of(Rational.of(3, 2)), Rational.approximate(1.5 + 1e-12, 10));
    assertEquals(Optional.of(Rational.of(355, 113)), Rational.approximate(355.0 / 113.0, 200));
  }

  @Test
  void refusesWhatNoSmallFractionMatches() {
    // 22/7 and 355/113 miss pi by more than 1e-9; the next convergent's denominator exceeds 1000.
    assertEquals(Optional.empty(), Rational.approximate(Math.PI, 1000));
    assertEquals(Optional.empty(), Rational.approximate(0.5 + 1e-6, 100));
    assertEquals(Optional.empty(), Rational.approximate(1.0 / 3.0, 2));
    assertEquals(Optional.empty(), Rational.approximate(Double.NaN, 100));
    assertEquals(Optional.empty(), Rational.approximate(Double.POSITIVE_INFINITY, 100));
  }
}
