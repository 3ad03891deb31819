package dev.plumb.units;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.List;
import org.junit.jupiter.api.Test;

class ConstantsTest {
  private static double value(String name) {
    return Constants.lookup(name).orElseThrow().value();
  }

  private static Dimension dimension(String name) {
    return Constants.lookup(name).orElseThrow().unit().dimension();
  }

  @Test
  void namesComeInTheDocumentedOrder() {
    assertEquals(
        List.of("pi", "e", "G", "c", "h", "hbar", "k_B", "m_u", "m_e", "m_p", "N_A", "R_gas", "sigma_SB", "g_n"),
        List.copyOf(Constants.all().keySet()));
    assertFalse(Constants.lookup("E").isPresent());
  }

  @Test
  void valuesAreCodata2018() {
    // CODATA 2018 recommended values (NIST, May 2019), as quoted from memory.
    assertEquals(6.67430e-11, value("G"), 0.0);
    assertEquals(299792458.0, value("c"), 0.0);
    assertEquals(6.62607015e-34, value("h"), 0.0);
    assertEquals(1.380649e-23, value("k_B"), 0.0);
    assertEquals(1.66053906660e-27, value("m_u"), 0.0);
    assertEquals(9.1093837015e-31, value("m_e"), 0.0);
    assertEquals(1.67262192369e-27, value("m_p"), 0.0);
    assertEquals(6.02214076e23, value("N_A"), 0.0);
    // 3rd CGPM (1901): standard acceleration of gravity 9.80665 m/s^2 by definition.
    assertEquals(9.80665, value("g_n"), 0.0);
  }

  @Test
  void derivedConstantsAgreeWithTheirDefinitions() {
    // CODATA 2018: hbar = 1.054571817e-34 J s (shown to 10 digits).
    assertEquals(1.054571817e-34, value("hbar"), 1e-9 * 1.054571817e-34);
    // SI 2019: R = N_A k exactly; CODATA 2018 prints 8.314462618 J mol^-1 K^-1.
    assertEquals(value("N_A") * value("k_B"), value("R_gas"), 1e-9 * value("R_gas"));
    // sigma = 2 pi^5 k^4 / (15 h^3 c^2); CODATA 2018 prints 5.670374419e-8 W m^-2 K^-4.
    double k = value("k_B");
    double sigma = 2 * Math.pow(Math.PI, 5) * Math.pow(k, 4) / (15 * Math.pow(value("h"), 3) * Math.pow(value("c"), 2));
    assertEquals(sigma, value("sigma_SB"), 1e-9 * sigma);
    // CODATA 2018: m_p / m_e = 1836.15267343.
    assertEquals(1836.15267343, value("m_p") / value("m_e"), 1e-9 * 1836.15267343);
  }

  @Test
  void exactRelationsOfThe2019SiAgreeWithCodatasPrintedDigits() {
    // SI Brochure (9th ed.): h = 6.626 070 15e-34 J s, k = 1.380 649e-23 J/K, N_A = 6.022 140 76e23 /mol and
    // c = 299 792 458 m/s exactly, so R = N_A k, hbar = h/(2 pi) and sigma = 2 pi^5 k^4/(15 h^3 c^2) are exact.
    // CODATA 2018 prints them cut off after ten digits with an ellipsis (truncated, not rounded):
    // R = 8.314 462 618... J mol^-1 K^-1, hbar = 1.054 571 817...e-34 J s, sigma = 5.670 374 419...e-8 W m^-2 K^-4.
    MathContext ten = new MathContext(10, RoundingMode.DOWN);
    BigDecimal h = new BigDecimal("6.62607015e-34");
    BigDecimal k = new BigDecimal("1.380649e-23");
    BigDecimal c = new BigDecimal("299792458");
    BigDecimal pi = new BigDecimal("3.14159265358979323846264338327950288");
    BigDecimal r = new BigDecimal("6.02214076e23").multiply(k);
    BigDecimal hbar = h.divide(pi.add(pi), MathContext.DECIMAL128);
    BigDecimal sigma = pi.pow(5).multiply(k.pow(4)).multiply(BigDecimal.valueOf(2))
        .divide(h.pow(3).multiply(c.pow(2)).multiply(BigDecimal.valueOf(15)), MathContext.DECIMAL128);
    assertEquals(new BigDecimal("8.314462618"), r.round(ten));
    assertEquals(new BigDecimal("1.054571817e-34"), hbar.round(ten));
    assertEquals(new BigDecimal("5.670374419e-8"), sigma.round(ten));
    // The values plumb uses are those exact ones to double precision, not the ten printed digits.
    assertEquals(r.doubleValue(), value("R_gas"), 2e-16 * r.doubleValue());
    assertEquals(hbar.doubleValue(), value("hbar"), 4e-16 * hbar.doubleValue());
    assertEquals(sigma.doubleValue(), value("sigma_SB"), 1e-15 * sigma.doubleValue());
    for (ExactRelations.Relation rel : ExactRelations.all()) {
      assertTrue(ExactRelations.isExact(rel.derived()), rel.derived());
      rel.powers().keySet().forEach(b -> assertTrue(ExactRelations.isExact(b), b));
    }
    // Measured in CODATA 2018, so in no exact relation: G, m_u, m_e, m_p.
    for (String measured : List.of("G", "m_u", "m_e", "m_p")) assertFalse(ExactRelations.isExact(measured), measured);
  }

  @Test
  void publishedValuesKeepTheirPrintedDigits() {
    // CODATA 2018: G = 6.674 30(15)e-11 m^3 kg^-1 s^-2, printed with its trailing zero.
    assertEquals("6.67430e-11", Constants.published("G").orElseThrow());
    assertEquals(value("G"), Double.parseDouble(Constants.published("G").orElseThrow()), 0.0);
    assertTrue(Constants.published("R_gas").orElseThrow().startsWith("N_A*k_B = 8.314462618"));
  }

  @Test
  void unitsAreCoherentSiWithTheRightDimensions() throws UnitException {
    for (Constant c : Constants.all().values()) {
      assertEquals(1.0, c.unit().factor(), 0.0, c.name());
      assertFalse(c.source().isBlank(), c.name());
      assertFalse(c.description().isBlank(), c.name());
    }
    assertTrue(dimension("pi").isNone());
    assertEquals(UnitParser.parse("N m^2 kg^-2").dimension(), dimension("G"));
    assertEquals(UnitParser.parse("m s^-1").dimension(), dimension("c"));
    assertEquals(UnitParser.parse("kg m^2 s^-1").dimension(), dimension("hbar"));
    assertEquals(UnitParser.parse("J K^-1").dimension(), dimension("k_B"));
    assertEquals(UnitParser.parse("kg m^2 s^-2 mol^-1 K^-1").dimension(), dimension("R_gas"));
    assertEquals(UnitParser.parse("kg s^-3 K^-4").dimension(), dimension("sigma_SB"));
    assertEquals(UnitParser.parse("mol^-1").dimension(), dimension("N_A"));
    assertEquals(UnitParser.parse("m/s^2").dimension(), dimension("g_n"));
  }
}
