package dev.plumb.units;

import static dev.plumb.units.Dimension.Base.LENGTH;
import static dev.plumb.units.Dimension.Base.MASS;
import static dev.plumb.units.Dimension.Base.TIME;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Optional;
import org.junit.jupiter.api.Test;

class UnitParserTest {
  private static Dimension dim(String text) throws UnitException {
    return UnitParser.parse(text).dimension();
  }

  private static Dimension base(int kg, int m, int s) {
    return Dimension.of(MASS, Rational.of(kg)).mul(Dimension.of(LENGTH, Rational.of(m))).mul(Dimension.of(TIME, Rational.of(s)));
  }

  @Test
  void productsBySpaceOrStar() throws UnitException {
    assertEquals(base(1, -3, 0), dim("kg m^-3"));
    assertEquals(base(1, -3, 0), dim("kg*m^-3"));
    assertEquals(base(1, 1, 0), dim("kg·m"));
    assertEquals(base(1, -3, 0), dim("kg m⁻³"));
  }

  @Test
  void divisionIsLeftAssociativeAndPowersBindTighter() throws UnitException {
    assertEquals(base(0, 1, -2), dim("m/s^2"));
    assertEquals(base(1, -1, -1), dim("kg/m/s"));
    assertEquals(base(1, -1, -1), dim("kg/(m s)"));
    assertEquals(base(0, 2, -2), dim("(m/s)^2"));
    // Read left to right, "J/mol K" multiplies by K; the molar gas constant needs J/(mol K).
    assertNotEquals(dim("J/(mol K)"), dim("J/mol K"));
    assertEquals(dim("J K/mol"), dim("J/mol K"));
  }

  @Test
  void exponentsMayBeSignedIntegersOrFractionsInParentheses() throws UnitException {
    assertEquals(base(0, 0, -2), dim("s^-2"));
    assertEquals(base(0, 0, -2), dim("s^ -2"));
    assertEquals(base(0, 0, -2), dim("s ^ (-2)"));
    assertEquals(base(0, 0, 2), dim("s^+2"));
    Dimension polytrope = dim("kg^(-4/3) m^3");
    assertEquals(Rational.of(-4, 3), polytrope.exponent(MASS));
    assertEquals(Rational.of(3), polytrope.exponent(LENGTH));
    assertEquals(Rational.of(1, 2), dim("m^(1/2)").exponent(LENGTH));
    assertEquals(Rational.of(1, 2), dim("m^(2/4)").exponent(LENGTH));
    assertEquals(Rational.of(-1, 2), dim("m^(1/-2)").exponent(LENGTH));
  }

  @Test
  void rationalPowersScaleTheFactor() throws UnitException {
    // (1 km)^(1/2) = sqrt(1000) m^(1/2); (1 g)^(-4/3) = (1e-3 kg)^(-4/3) = 1e4 kg^(-4/3).
    assertEquals(Math.sqrt(1000), UnitParser.parse("km^(1/2)").factor(), 1e-12);
    assertEquals(1e4, UnitParser.parse("g^(-4/3)").factor(), 1e-8);
  }

  @Test
  void oneIsTheDimensionlessUnit() throws UnitException {
    Unit one = UnitParser.parse("1");
    assertEquals(1.0, one.factor(), 0.0);
    assertTrue(one.dimension().isNone());
    assertEquals(base(0, 0, -1), dim("1/s"));
    assertTrue(dim("m/m").isNone());
  }

  @Test
  void cgsAndPrefixedUnitsCombine() throws UnitException {
    // NIST SP 811 App. B.8: 1 g/cm^3 = 1000 kg/m^3; 1 dyn/cm^2 = 0.1 Pa.
    assertEquals(1000.0, UnitParser.parse("g/cm^3").factor(), 1e-12);
    assertEquals(0.1, UnitParser.parse("dyn/cm^2").factor(), 1e-15);
    assertEquals(dim("Pa"), dim("dyn/cm^2"));
    assertEquals(dim("kg m^-3"), dim("g/cm^3"));
    // NIST SP 811 App. B.8: 1 erg/s = 1e-7 W.
    assertEquals(1e-7, UnitParser.parse("erg/s").factor(), 1e-22);
  }

  @Test
  void keepsTheUsersSpellingTidied() throws UnitException {
    assertEquals("kg m^-3", UnitParser.parse("  kg   m^-3 ").text());
    assertEquals("Msun", UnitParser.parse("Msun").text());
  }

  @Test
  void composedTextParsesBackToTheSameUnit() throws UnitException {
    Unit km = UnitParser.parse("km");
    Unit s = UnitParser.parse("s");
    Unit kg = UnitParser.parse("kg");
    Unit[] composed = {
      km.over(s.times(s)), kg.times(km.over(s)).pow(Rational.of(-4, 3)), Unit.ONE.over(km.pow(Rational.of(2))),
      km.over(s).over(kg.over(s)), kg.pow(Rational.of(1, 2)).times(s.pow(Rational.of(-3)))
    };
    for (Unit u : composed) {
      Unit back = UnitParser.parse(u.text());
      assertEquals(u.dimension(), back.dimension(), u.text());
      assertEquals(u.factor(), back.factor(), 1e-12 * u.factor(), u.text());
    }
  }

  @Test
  void convertsToAndFromSi() throws UnitException {
    Unit gpa = UnitParser.parse("GPa");
    assertEquals(134.47, gpa.fromSI(1.3447e11), 1e-9);
    assertEquals(2.5e9, gpa.toSI(2.5), 0.0);
    assertTrue(gpa.isCompatible(UnitParser.parse("dyn/cm^2")));
    assertTrue(!gpa.isCompatible(UnitParser.parse("J")));
  }

  @Test
  void incompleteExponentPointsAtTheEnd() {
    UnitException e = assertThrows(UnitException.class, () -> UnitParser.parse("kg m^"));
    assertEquals(5, e.offset());
    assertEquals(0, e.length());
    assertTrue(e.getMessage().contains("expected an exponent"), e.getMessage());
    assertTrue(e.getMessage().contains("the end of the unit"), e.getMessage());
  }

  @Test
  void zeroDenominatorPointsAtTheDenominator() {
    UnitException e = assertThrows(UnitException.class, () -> UnitParser.parse("kg^(1/0)"));
    assertEquals(6, e.offset());
    assertEquals(1, e.length());
    assertTrue(e.getMessage().contains("zero denominator"), e.getMessage());
  }

  @Test
  void unknownSymbolPointsAtTheSymbol() {
    // The front end passes the text inside "[foo]", i.e. "foo".
    UnitException e = assertThrows(UnitException.class, () -> UnitParser.parse("foo"));
    assertEquals(0, e.offset());
    assertEquals(3, e.length());
    assertEquals("unknown unit 'foo'", e.getMessage());
    UnitException later = assertThrows(UnitException.class, () -> UnitParser.parse("kg foo/s"));
    assertEquals(3, later.offset());
    assertEquals(3, later.length());
  }

  @Test
  void unknownSymbolsSuggestANearName() {
    UnitException glued = assertThrows(UnitException.class, () -> UnitParser.parse("kgs"));
    assertEquals("unknown unit 'kgs'; did you mean 'kg s'?", glued.getMessage());
    assertEquals(Optional.of("kg s"), glued.suggestion());
    UnitException lower = assertThrows(UnitException.class, () -> UnitParser.parse("m pa"));
    assertEquals("unknown unit 'pa'; did you mean 'Pa'?", lower.getMessage());
    assertEquals(2, lower.offset());
    assertEquals("unknown unit 'MM'; did you mean 'Mm' or 'mm'?",
        assertThrows(UnitException.class, () -> UnitParser.parse("MM")).getMessage());
    assertTrue(assertThrows(UnitException.class, () -> UnitParser.parse("Msum")).getMessage().contains("'Msun'"));
    assertTrue(assertThrows(UnitException.class, () -> UnitParser.parse("sec")).getMessage().contains("'s'"));
    assertTrue(assertThrows(UnitException.class, () -> UnitParser.parse("N m kgs")).getMessage().contains("'kg s'"));
    assertTrue(assertThrows(UnitException.class, () -> UnitParser.parse("kau")).getMessage()
        .contains("SI prefixes do not apply to 'au'"));
  }

  @Test
  void numbersOtherThanOneAreRejected() {
    UnitException factor = assertThrows(UnitException.class, () -> UnitParser.parse("1e3 m"));
    assertEquals(0, factor.offset());
    assertEquals(3, factor.length());
    UnitException glued = assertThrows(UnitException.class, () -> UnitParser.parse("kg m2"));
    assertEquals(4, glued.offset());
    assertTrue(glued.getMessage().contains("'m^2'"), glued.getMessage());
  }

  @Test
  void decimalExponentsAreToldTheFraction() {
    UnitException e = assertThrows(UnitException.class, () -> UnitParser.parse("m^-1.5"));
    assertEquals(3, e.offset());
    assertTrue(e.getMessage().contains("^(-3/2)"), e.getMessage());
  }

  @Test
  void structuralErrorsPointAtTheOffendingToken() {
    UnitException unclosed = assertThrows(UnitException.class, () -> UnitParser.parse("(kg m"));
    assertEquals(5, unclosed.offset());
    assertTrue(unclosed.getMessage().contains("')'"), unclosed.getMessage());
    assertEquals(2, assertThrows(UnitException.class, () -> UnitParser.parse("kg)")).offset());
    assertEquals(3, assertThrows(UnitException.class, () -> UnitParser.parse("m^2^3")).offset());
    assertEquals(2, assertThrows(UnitException.class, () -> UnitParser.parse("kg%")).offset());
    assertEquals(3, assertThrows(UnitException.class, () -> UnitParser.parse("kg/")).offset());
    assertEquals(0, assertThrows(UnitException.class, () -> UnitParser.parse("[foo]")).offset());
    UnitException empty = assertThrows(UnitException.class, () -> UnitParser.parse("  "));
    assertEquals(2, empty.offset());
    assertTrue(empty.getMessage().contains("[1]"), empty.getMessage());
  }

  @Test
  void outOfRangeIsAnErrorNotACrash() {
    UnitException e = assertThrows(UnitException.class, () -> UnitParser.parse("km^400"));
    assertTrue(e.getMessage().contains("too large"), e.getMessage());
    assertThrows(UnitException.class, () -> UnitParser.parse("m^99999999999999999999"));
  }
}
