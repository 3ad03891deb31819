package dev.plumb.units;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/** Builds the "unknown unit" error, with the nearest reading of what the user probably meant. */
final class UnitSuggestions {
  /** Spellings people write for units that have a different symbol here. */
  private static final Map<String, String> ALIASES = Map.ofEntries(
      Map.entry("sec", "s"), Map.entry("secs", "s"), Map.entry("hr", "h"), Map.entry("hrs", "h"),
      Map.entry("l", "L"), Map.entry("y", "yr"), Map.entry("yrs", "yr"), Map.entry("year", "yr"),
      Map.entry("Msol", "Msun"), Map.entry("Rsol", "Rsun"), Map.entry("Lsol", "Lsun"),
      Map.entry("M_sun", "Msun"), Map.entry("R_sun", "Rsun"), Map.entry("L_sun", "Lsun"),
      Map.entry("M_earth", "Mearth"), Map.entry("R_earth", "Rearth"),
      Map.entry("M_jup", "Mjup"), Map.entry("R_jup", "Rjup"), Map.entry("Mjupiter", "Mjup"),
      Map.entry("gram", "g"), Map.entry("metre", "m"), Map.entry("meter", "m"),
      Map.entry("second", "s"), Map.entry("kelvin", "K"), Map.entry("pascal", "Pa"),
      Map.entry("newton", "N"), Map.entry("joule", "J"), Map.entry("watt", "W"),
      Map.entry("dyne", "dyn"), Map.entry("ergs", "erg"), Map.entry("Kelvin", "K"),
      Map.entry("degK", "K"), Map.entry("micron", "µm"), Map.entry("kph", "km/h"));

  /** Longer than any unit symbol or two run together: no suggestion is looked for. */
  private static final int LONGEST_SYMBOL = 40;

  private UnitSuggestions() {}

  /** The error for the unknown symbol {@code symbol} found at {@code offset}. */
  static UnitException unknown(String symbol, int offset) {
    // No unit symbol is near one this long, and the searches below grow with its square.
    if (symbol.length() > LONGEST_SYMBOL) {
      return new UnitException("unknown unit '" + symbol + "'", offset, symbol.length());
    }
    List<String> near = likelyReadings(symbol);
    if (near.isEmpty()) {
      String prefixProblem = prefixProblem(symbol);
      if (prefixProblem != null) {
        return new UnitException("unknown unit '" + symbol + "': " + prefixProblem, offset, symbol.length());
      }
      near = typos(symbol);
    }
    if (near.isEmpty()) {
      near = splits(symbol, false);
    }
    if (near.isEmpty()) {
      return new UnitException("unknown unit '" + symbol + "'", offset, symbol.length());
    }
    String options = String.join("' or '", near);
    return new UnitException(
        "unknown unit '" + symbol + "'; did you mean '" + options + "'?", offset, symbol.length(), near.get(0));
  }

  /**
   * The readings most likely meant, best first, at most three: a known misspelling, a named
   * unit in other case ("Pa" for "pa"), two everyday units run together ("kg s" for "kgs",
   * "N m" for "Nm"), or a prefixed unit in other case ("mm" for "MM").
   */
  static List<String> likelyReadings(String symbol) {
    String alias = ALIASES.get(symbol);
    if (alias != null) {
      return List.of(alias);
    }
    List<String> named = caseVariants(symbol, UnitCatalog.namedSymbols());
    if (!named.isEmpty()) {
      return named;
    }
    List<String> everyday = splits(symbol, true);
    if (!everyday.isEmpty()) {
      return everyday;
    }
    return caseVariants(symbol, UnitCatalog.allSymbols());
  }

  private static List<String> caseVariants(String symbol, Iterable<String> pool) {
    List<String> out = new ArrayList<>();
    for (String known : pool) {
      if (known.equalsIgnoreCase(symbol)) {
        out.add(known);
      }
    }
    return first(out, 3);
  }

  /**
   * Cuts of the symbol into two known units, longest left part first. With {@code everyday},
   * both parts must be named units or kg, so that "Msum" is not read as "Ms um".
   */
  private static List<String> splits(String symbol, boolean everyday) {
    List<String> out = new ArrayList<>();
    for (int i = symbol.length() - 1; i >= 1; i--) {
      String left = symbol.substring(0, i);
      String right = symbol.substring(i);
      if ((everyday ? isEveryday(left) && isEveryday(right)
          : UnitCatalog.lookup(left).isPresent() && UnitCatalog.lookup(right).isPresent())
          && !sameKind(left, right)) {
        out.add(left + " " + right);
      }
    }
    return first(out, 2);
  }

  /** Two units of one kind run together ("kg g", "m km") are a typo, not a product anyone means. */
  private static boolean sameKind(String left, String right) {
    return UnitCatalog.lookup(left).map(Unit::dimension).equals(UnitCatalog.lookup(right).map(Unit::dimension));
  }

  private static boolean isEveryday(String symbol) {
    return symbol.equals("kg") || UnitCatalog.namedSymbols().contains(symbol);
  }

  /** Named units one edit away (two for longer symbols), such as "Msun" for "Msum". */
  private static List<String> typos(String symbol) {
    List<String> typo = new ArrayList<>();
    int allowed = symbol.length() >= 5 ? 2 : symbol.length() >= 3 ? 1 : 0;
    java.util.Set<String> pool = new java.util.TreeSet<>(UnitCatalog.namedSymbols());
    pool.add("kg");
    for (String known : pool) {
      if (editDistance(symbol, known) <= allowed) {
        typo.add(known);
      }
    }
    return first(typo, 3);
  }

  /** Why a prefixed-looking symbol is not a unit, or null if it does not look prefixed. */
  private static String prefixProblem(String symbol) {
    for (UnitCatalog.Prefix p : UnitCatalog.PREFIXES) {
      if (symbol.length() > p.symbol().length() && symbol.startsWith(p.symbol())) {
        String rest = symbol.substring(p.symbol().length());
        if (UnitCatalog.namedSymbols().contains(rest) && !UnitCatalog.takesPrefixes(rest)) {
          return "SI prefixes do not apply to '" + rest + "'";
        }
        if (!UnitCatalog.namedSymbols().contains(rest) && UnitCatalog.lookup(rest).isPresent()) {
          return "'" + rest + "' already has a prefix, and SI prefixes do not combine";
        }
      }
    }
    return null;
  }

  private static List<String> first(List<String> list, int n) {
    return List.copyOf(list.subList(0, Math.min(n, list.size())));
  }

  /** Levenshtein distance: the fewest single-character edits turning one string into the other. */
  static int editDistance(String a, String b) {
    int[] row = new int[b.length() + 1];
    for (int j = 0; j <= b.length(); j++) {
      row[j] = j;
    }
    for (int i = 1; i <= a.length(); i++) {
      int diagonal = row[0];
      row[0] = i;
      for (int j = 1; j <= b.length(); j++) {
        int above = row[j];
        int cost = a.charAt(i - 1) == b.charAt(j - 1) ? 0 : 1;
        row[j] = Math.min(Math.min(row[j] + 1, row[j - 1] + 1), diagonal + cost);
        diagonal = above;
      }
    }
    return row[b.length()];
  }
}
