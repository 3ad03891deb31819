package dev.plumb.units;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Optional;

/** The physical constants every plumb file may use by name, with CODATA 2018 values. */
public final class Constants {
  private static final String CODATA = "CODATA 2018 recommended value";
  private static final String CODATA_EXACT = "CODATA 2018, exact (SI 2019 defining constant)";

  private static final String EXACT_RELATION = "exact in the 2019 SI: ";

  /** Each value as its source prints it (6.67430e-11, not 6.6743e-11), for messages that compare with it. */
  private static final Map<String, String> PUBLISHED = new LinkedHashMap<>();

  private static final Map<String, Constant> ALL = build();

  private Constants() {}

  /** Ordered: pi, e, G, c, h, hbar, k_B, m_u, m_e, m_p, N_A, R_gas, sigma_SB, g_n. */
  public static Map<String, Constant> all() {
    return ALL;
  }

  public static Optional<Constant> lookup(String name) {
    return Optional.ofNullable(ALL.get(name));
  }

  private static Map<String, Constant> build() {
    Map<String, Constant> m = new LinkedHashMap<>();
    put(m, "pi", Math.PI, "1", "ratio of a circle's circumference to its diameter", "mathematical constant");
    put(m, "e", Math.E, "1", "Euler's number, the base of the natural logarithm", "mathematical constant");
    put(m, "G", "6.67430e-11", "m^3 kg^-1 s^-2", "Newtonian constant of gravitation", CODATA);
    put(m, "c", "299792458", "m/s", "speed of light in vacuum", CODATA_EXACT);
    put(m, "h", "6.62607015e-34", "J s", "Planck constant", CODATA_EXACT);
    derived(m, "hbar", "J s", "reduced Planck constant h/(2 pi)");
    put(m, "k_B", "1.380649e-23", "J/K", "Boltzmann constant", CODATA_EXACT);
    put(m, "m_u", "1.66053906660e-27", "kg", "atomic mass constant", CODATA);
    put(m, "m_e", "9.1093837015e-31", "kg", "electron mass", CODATA);
    put(m, "m_p", "1.67262192369e-27", "kg", "proton mass", CODATA);
    put(m, "N_A", "6.02214076e23", "mol^-1", "Avogadro constant", CODATA_EXACT);
    // Computed from their exact relations rather than typed from CODATA's 10 printed digits, so
    // that the numeric solve and the symbolic checks (which rewrite them) use the same value.
    derived(m, "R_gas", "J/(mol K)", "molar gas constant N_A k_B");
    derived(m, "sigma_SB", "W m^-2 K^-4", "Stefan-Boltzmann constant");
    put(m, "g_n", "9.80665", "m/s^2", "standard acceleration of gravity", "3rd CGPM (1901), by definition");
    return Collections.unmodifiableMap(m);
  }

  /**
   * The value as its source prints it ("6.67430e-11"); for a constant computed from an exact
   * relation, the relation and its value ("N_A*k_B = 8.31446261815324").
   */
  public static Optional<String> published(String name) {
    return Optional.ofNullable(PUBLISHED.get(name));
  }

  private static void put(Map<String, Constant> m, String name, String published, String unit, String description, String source) {
    PUBLISHED.put(name, published);
    put(m, name, Double.parseDouble(published), unit, description, source);
  }

  private static void derived(Map<String, Constant> m, String name, String unit, String description) {
    ExactRelations.Relation r = ExactRelations.of(name).orElseThrow();
    double value = r.value(basis -> m.get(basis).value());
    PUBLISHED.put(name, r.formula() + " = " + new java.math.BigDecimal(value).round(new java.math.MathContext(15)).stripTrailingZeros().toString().replace("E+", "e").replace("E", "e"));
    put(m, name, value, unit, description, EXACT_RELATION + name + " = " + r.formula() + " (SI Brochure, 9th ed.)");
  }

  private static void put(Map<String, Constant> m, String name, double value, String unit, String description, String source) {
    try {
      m.put(name, new Constant(name, value, UnitParser.parse(unit), description, source));
    } catch (UnitException e) {
      throw new IllegalStateException("bad unit for constant " + name + ": " + unit, e);
    }
  }
}
