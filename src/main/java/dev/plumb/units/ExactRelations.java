package dev.plumb.units;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.function.ToDoubleFunction;

/**
 * The exact relations of the 2019 SI among the built-in constants (SI Brochure, 9th ed., 2019):
 * each derived constant is a number times a power of pi times a product of powers of basis
 * constants. Since c, h, k_B and N_A have exact defined values, so do hbar, R_gas and sigma_SB;
 * G, m_u, m_e and m_p are measured and stand in no exact relation with the others.
 */
public final class ExactRelations {

  /**
   * {@code derived = coefficient * pi^piPower * prod(basis^power)}; {@code formula} is the right
   * side in plumb's own syntax, for messages.
   */
  public record Relation(String derived, Rational coefficient, int piPower, Map<String, Integer> powers, String formula) {
    public Relation {
      powers = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(powers));
    }

    /** The value from the values of the basis constants, in double precision. */
    public double value(ToDoubleFunction<String> basis) {
      double v = coefficient.toDouble() * Math.pow(Math.PI, piPower);
      for (var e : powers.entrySet()) {
        v *= Math.pow(basis.applyAsDouble(e.getKey()), e.getValue());
      }
      return v;
    }
  }

  private static final List<Relation> ALL = List.of(
      // hbar is h/(2 pi) by its definition.
      new Relation("hbar", Rational.of(1, 2), -1, Map.of("h", 1), "h/(2*pi)"),
      // The molar gas constant is N_A k: both factors are defining constants of the 2019 SI.
      new Relation("R_gas", Rational.ONE, 0, ordered("N_A", 1, "k_B", 1), "N_A*k_B"),
      // Planck's law integrated over frequency and solid angle: sigma = 2 pi^5 k^4 / (15 h^3 c^2).
      new Relation("sigma_SB", Rational.of(2, 15), 5, ordered("k_B", 4, "h", -3, "c", -2), "2*pi^5*k_B^4/(15*h^3*c^2)"));

  /** Constants whose value is exact: mathematical, defining constants of the 2019 SI, and defined ones. */
  private static final Set<String> EXACT = Set.of("pi", "e", "c", "h", "k_B", "N_A", "hbar", "R_gas", "sigma_SB", "g_n");

  private ExactRelations() {}

  public static List<Relation> all() {
    return ALL;
  }

  public static Optional<Relation> of(String derived) {
    return ALL.stream().filter(r -> r.derived().equals(derived)).findFirst();
  }

  /** Whether the constant's value is exact (no measurement uncertainty) in the 2019 SI. */
  public static boolean isExact(String name) {
    return EXACT.contains(name);
  }

  private static Map<String, Integer> ordered(Object... pairs) {
    Map<String, Integer> m = new LinkedHashMap<>();
    for (int i = 0; i < pairs.length; i += 2) {
      m.put((String) pairs[i], (Integer) pairs[i + 1]);
    }
    return m;
  }
}
