package dev.plumb.units;

import static dev.plumb.units.Dimension.Base.AMOUNT;
import static dev.plumb.units.Dimension.Base.LENGTH;
import static dev.plumb.units.Dimension.Base.MASS;
import static dev.plumb.units.Dimension.Base.TEMPERATURE;
import static dev.plumb.units.Dimension.Base.TIME;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import org.junit.jupiter.api.Test;

class DimensionTest {
  private static final Dimension L = Dimension.of(LENGTH);
  private static final Dimension M = Dimension.of(MASS);
  private static final Dimension T = Dimension.of(TIME);
  private static final Dimension PRESSURE = M.div(L).div(T.pow(Rational.of(2)));

  @Test
  void arithmeticAddsAndScalesExponents() {
    assertEquals(Rational.of(-1), PRESSURE.exponent(LENGTH));
    assertEquals(Rational.ONE, PRESSURE.exponent(MASS));
    assertEquals(Rational.of(-2), PRESSURE.exponent(TIME));
    assertEquals(Rational.ZERO, PRESSURE.exponent(TEMPERATURE));
    assertEquals(Dimension.NONE, PRESSURE.mul(PRESSURE.inverse()));
    assertTrue(PRESSURE.div(PRESSURE).isNone());
    assertFalse(PRESSURE.isNone());
    assertEquals(Map.of(MASS, Rational.ONE, LENGTH, Rational.of(-1), TIME, Rational.of(-2)), PRESSURE.exponents());
  }

  @Test
  void rationalPowersCancelExactly() {
    Dimension root = L.pow(Rational.of(1, 3));
    assertEquals(L, root.mul(root).mul(root));
    // Polytrope constant for n = 3: K = P / rho^(4/3), worked by hand: kg^(-1/3) m^3 s^-2.
    Dimension density = M.div(L.pow(Rational.of(3)));
    Dimension k = PRESSURE.div(density.pow(Rational.of(4, 3)));
    assertEquals(Rational.of(-1, 3), k.exponent(MASS));
    assertEquals(Rational.of(3), k.exponent(LENGTH));
    assertEquals(Rational.of(-2), k.exponent(TIME));
  }

  @Test
  void equalByValue() {
    Dimension a = M.mul(L);
    Dimension b = L.mul(M);
    assertEquals(a, b);
    assertEquals(a.hashCode(), b.hashCode());
    assertNotEquals(a, M.div(L));
    assertEquals(Dimension.NONE, L.pow(Rational.ZERO));
  }

  @Test
  void printsInSiBaseForm() {
    assertEquals("kg m^-1 s^-2", PRESSURE.toString());
    assertEquals("m^3 kg^-1 s^-2", L.pow(Rational.of(3)).div(M).div(T.pow(Rational.of(2))).toString());
    assertEquals("m^(1/2)", L.pow(Rational.of(1, 2)).toString());
    assertEquals("m^3 kg^(-4/3)", M.pow(Rational.of(-4, 3)).mul(L.pow(Rational.of(3))).toString());
    assertEquals("1", Dimension.NONE.toString());
    assertEquals("kg m^2 s^-2 K^-1 mol^-1",
        PRESSURE.mul(L.pow(Rational.of(3))).div(Dimension.of(TEMPERATURE)).div(Dimension.of(AMOUNT)).toString());
  }

  @Test
  void printedFormParsesBack() throws UnitException {
    Dimension[] samples = {
      PRESSURE, L.pow(Rational.of(1, 2)), M.pow(Rational.of(-4, 3)).mul(L.pow(Rational.of(3))), Dimension.NONE,
      PRESSURE.div(Dimension.of(TEMPERATURE).pow(Rational.of(-7, 2)))
    };
    for (Dimension d : samples) {
      Unit u = UnitParser.parse(d.toString());
      assertEquals(d, u.dimension(), d.toString());
      assertEquals(1.0, u.factor(), 0.0, d.toString());
    }
  }
}
