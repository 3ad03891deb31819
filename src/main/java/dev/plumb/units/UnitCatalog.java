package dev.plumb.units;

import java.util.ArrayList;
import java.util.Collections;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import javax.measure.MetricPrefix;

/**
 * The unit symbols plumb understands: named units, and SI-prefixed forms of those that take
 * prefixes. Symbols are case-sensitive.
 *
 * <p>Where a symbol reads both as a named unit and as a prefixed one, the named unit wins:
 * {@code min} is the minute, {@code cd} the candela, {@code h} the hour, {@code d} the day.
 */
public final class UnitCatalog {
  /** An SI prefix as written before a unit symbol. */
  record Prefix(String symbol, MetricPrefix jsr) {}

  /** All prefix spellings, longest first so that "da" is tried before "d". */
  static final List<Prefix> PREFIXES = prefixes();

  /** Units already looked up: asking Indriya for a converter each time would be wasted work. */
  private static final Map<String, Unit> FOUND = new ConcurrentHashMap<>();

  private UnitCatalog() {}

  /** The unit written {@code symbol} ("km", "Pa", "Msun", "dyn", "GPa", "mmHg" ...), if known. */
  public static Optional<Unit> lookup(String symbol) {
    Unit cached = FOUND.get(symbol);
    if (cached != null) {
      return Optional.of(cached);
    }
    NamedUnits.NamedUnit named = NamedUnits.ALL.get(symbol);
    List<Unit> readings = named != null ? List.of(named.unit()) : prefixedReadings(symbol);
    if (readings.isEmpty()) {
      return Optional.empty();
    }
    FOUND.put(symbol, readings.get(0));
    return Optional.of(readings.get(0));
  }

  /** Where the value of a unit comes from, for reports; for a prefixed unit, its named unit's source. */
  public static Optional<String> source(String symbol) {
    NamedUnits.NamedUnit named = NamedUnits.ALL.get(symbol);
    if (named != null) {
      return Optional.of(named.source());
    }
    for (Prefix p : PREFIXES) {
      if (symbol.startsWith(p.symbol())) {
        NamedUnits.NamedUnit base = NamedUnits.ALL.get(symbol.substring(p.symbol().length()));
        if (base != null && base.prefixable()) {
          return Optional.of(base.source() + "; SI prefix " + p.symbol());
        }
      }
    }
    return Optional.empty();
  }

  /** The named symbols, without prefixed forms, in catalog order. */
  public static Set<String> namedSymbols() {
    return NamedUnits.ALL.keySet();
  }

  /** Whether SI prefixes apply to the named symbol ("m" yes, "min" no). */
  public static boolean takesPrefixes(String namedSymbol) {
    NamedUnits.NamedUnit named = NamedUnits.ALL.get(namedSymbol);
    return named != null && named.prefixable();
  }

  /**
   * A readable SI name for a dimension where a named coherent SI unit exists ("Pa", "N", "J",
   * "W", "kg/m^3", "m/s^2"), else Dimension.toString(). Used for the JSON "unit" field.
   *
   * <p>Every name returned parses with {@link UnitParser} to factor 1 and the same dimension.
   */
  public static String siName(Dimension d) {
    return SiNames.BY_DIMENSION.getOrDefault(d, d.toString());
  }

  /** Every way of reading {@code symbol} as prefix + prefixable named unit (normally 0 or 1). */
  static List<Unit> prefixedReadings(String symbol) {
    List<Unit> out = new ArrayList<>();
    for (Prefix p : PREFIXES) {
      if (symbol.length() > p.symbol().length() && symbol.startsWith(p.symbol())) {
        NamedUnits.NamedUnit base = NamedUnits.ALL.get(symbol.substring(p.symbol().length()));
        if (base != null && base.prefixable()) {
          out.add(IndriyaUnits.toUnit(symbol, base.jsr().prefix(p.jsr())));
        }
      }
    }
    return out;
  }

  /** Every symbol the catalog accepts, named and prefixed; for suggestions and tests. */
  static Set<String> allSymbols() {
    return SiNames.ALL_SYMBOLS;
  }

  private static List<Prefix> prefixes() {
    List<Prefix> out = new ArrayList<>();
    for (MetricPrefix p : MetricPrefix.values()) {
      out.add(new Prefix(p.getSymbol(), p));
    }
    // Indriya writes micro as U+00B5 MICRO SIGN; accept the Greek letter mu and ASCII "u" too.
    out.add(new Prefix("\u03bc", MetricPrefix.MICRO));
    out.add(new Prefix("u", MetricPrefix.MICRO));
    out.sort(Comparator.comparingInt((Prefix p) -> -p.symbol().length()));
    return Collections.unmodifiableList(out);
  }

  /** Tables built on first use, after the catalog itself is ready, because they parse unit text. */
  private static final class SiNames {
    /** Later entries lose to earlier ones of the same dimension. */
    private static final String[] NAMES = {
      "N", "Pa", "J", "W", "C", "V", "kg/m^3", "m/s", "m/s^2", "Pa/m", "J/kg", "J/K", "J/(kg K)",
      "J/(mol K)", "W/m^2", "kg/m^2", "kg/mol", "J s"
    };

    static final Map<Dimension, String> BY_DIMENSION = byDimension();
    static final Set<String> ALL_SYMBOLS = allSymbols();

    private static Map<Dimension, String> byDimension() {
      Map<Dimension, String> m = new LinkedHashMap<>();
      for (String name : NAMES) {
        try {
          m.putIfAbsent(UnitParser.parse(name).dimension(), name);
        } catch (UnitException e) {
          throw new IllegalStateException("bad SI name in the catalog: " + name, e);
        }
      }
      return Collections.unmodifiableMap(m);
    }

    private static Set<String> allSymbols() {
      Set<String> s = new LinkedHashSet<>(NamedUnits.ALL.keySet());
      for (NamedUnits.NamedUnit n : NamedUnits.ALL.values()) {
        if (n.prefixable()) {
          for (Prefix p : PREFIXES) {
            s.add(p.symbol() + n.symbol());
          }
        }
      }
      return Collections.unmodifiableSet(s);
    }
  }
}
