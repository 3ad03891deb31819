package dev.plumb.units;

import dev.plumb.units.UnitToken.Kind;
import java.util.List;
import java.util.Optional;

/**
 * Reads unit text, the part of a plumb file between square brackets, into a {@link Unit}.
 *
 * <p>Grammar, one method per rule:
 * <pre>
 *   unit     = product END
 *   product  = power { ("*" | "/" | juxtaposition) power }     (left-associative)
 *   power    = primary [ "^" exponent | SUPERSCRIPT ]
 *   exponent = ["-" | "+"] INTEGER | "(" ["-" | "+"] INTEGER [ "/" ["-" | "+"] INTEGER ] ")"
 *   primary  = SYMBOL | "1" | "(" product ")"
 * </pre>
 * So {@code m/s^2} is m s^-2 and {@code kg/m/s} is kg m^-1 s^-1. Note that {@code J/mol K},
 * read left to right, is J K mol^-1: write {@code J/(mol K)} for the molar gas constant.
 */
public final class UnitParser {
  private final List<UnitToken> tokens;
  private int current;

  private UnitParser(List<UnitToken> tokens) {
    this.tokens = tokens;
  }

  /** Parses the text between the square brackets, e.g. "kg m^-3", "m/s^2", "kg^(-4/3) m^3", "1", "g/cm^3", "km", "Msun". */
  public static Unit parse(String text) throws UnitException {
    Unit u;
    try {
      u = new UnitParser(UnitLexer.tokens(text)).unit();
    } catch (ArithmeticException | IllegalArgumentException outOfRange) {
      // An exponent or factor beyond long or double range, such as km^400.
      throw new UnitException("unit too large or too small to represent: '" + text.strip() + "'", 0, text.length());
    }
    // Keep the user's spelling, tidied, rather than a reconstruction from the parts.
    return new Unit(text.strip().replaceAll("\\s+", " "), u.factor(), u.dimension());
  }

  private Unit unit() throws UnitException {
    if (check(Kind.END)) {
      throw new UnitException("empty unit: write [1] for a dimensionless quantity", peek().offset(), 0, "1");
    }
    Unit u = product();
    if (!check(Kind.END)) {
      UnitToken t = peek();
      String message = switch (t.kind()) {
        case RIGHT_PAREN -> "unexpected ')' without a matching '('";
        case CARET -> "a power cannot be raised again here: group it first, as in (m^2)^3";
        case SUPERSCRIPT -> "a power cannot be raised again here: group it first, as in (m^2)^3";
        default -> "expected '*', '/', another unit or the end of the unit, but found " + t.describe();
      };
      throw new UnitException(message, t.offset(), t.length());
    }
    return u;
  }

  private Unit product() throws UnitException {
    Unit u = power();
    while (true) {
      if (match(Kind.STAR)) {
        u = u.times(power());
      } else if (match(Kind.SLASH)) {
        u = u.over(power());
      } else if (check(Kind.SYMBOL) || check(Kind.LEFT_PAREN) || check(Kind.NUMBER)) {
        u = u.times(power());
      } else {
        return u;
      }
    }
  }

  private Unit power() throws UnitException {
    Unit base = primary();
    if (match(Kind.CARET)) {
      return base.pow(exponent());
    }
    if (check(Kind.SUPERSCRIPT)) {
      UnitToken t = advance();
      return base.pow(integer(t, t.text()));
    }
    return base;
  }

  private Rational exponent() throws UnitException {
    if (match(Kind.LEFT_PAREN)) {
      UnitToken open = previous();
      Rational num = signedInteger("a whole number such as -4 in a fraction like (-4/3)");
      Rational den = Rational.ONE;
      if (match(Kind.SLASH)) {
        UnitToken at = peek();
        den = signedInteger("a whole-number denominator after '/'");
        if (den.isZero()) {
          throw new UnitException("zero denominator in the exponent", at.offset(), previous().offset() + previous().length() - at.offset());
        }
      }
      consume(Kind.RIGHT_PAREN, "')' to close the exponent opened at offset " + open.offset());
      return num.div(den);
    }
    return signedInteger("an exponent after '^': a whole number such as 2 or -2, or a fraction in parentheses such as (1/2)");
  }

  private Rational signedInteger(String expected) throws UnitException {
    boolean negative = match(Kind.MINUS);
    if (!negative) {
      match(Kind.PLUS);
    }
    if (!check(Kind.NUMBER)) {
      throw expected(expected);
    }
    UnitToken t = advance();
    return integer(t, negative ? "-" + t.text() : t.text());
  }

  /** The integer {@code digits} stands for; a decimal gets told the fraction to write instead. */
  private static Rational integer(UnitToken t, String digits) throws UnitException {
    try {
      return Rational.of(Long.parseLong(digits));
    } catch (NumberFormatException notInteger) {
      Optional<Rational> fraction = parseDecimal(digits).flatMap(x -> Rational.approximate(x, 1000));
      String hint = fraction.map(f -> "; write it as a fraction in parentheses, ^(" + f + ")").orElse("");
      throw new UnitException(
          "an exponent must be a whole number or a fraction, but found '" + digits + "'" + hint,
          t.offset(), t.length());
    }
  }

  private static Optional<Double> parseDecimal(String digits) {
    try {
      return Optional.of(Double.parseDouble(digits));
    } catch (NumberFormatException e) {
      return Optional.empty();
    }
  }

  private Unit primary() throws UnitException {
    if (match(Kind.SYMBOL)) {
      UnitToken t = previous();
      Optional<Unit> u = UnitCatalog.lookup(t.text());
      if (u.isEmpty()) {
        throw UnitSuggestions.unknown(t.text(), t.offset());
      }
      return u.get();
    }
    if (match(Kind.NUMBER)) {
      return one(previous());
    }
    if (match(Kind.LEFT_PAREN)) {
      UnitToken open = previous();
      Unit inner = product();
      consume(Kind.RIGHT_PAREN, "')' to close the '(' at offset " + open.offset());
      return inner;
    }
    throw expected("a unit symbol, '1' or '('");
  }

  /** "1" is the dimensionless unit; other numbers are factors that belong outside the brackets. */
  private Unit one(UnitToken t) throws UnitException {
    if (t.text().equals("1")) {
      return Unit.ONE;
    }
    UnitToken before = current >= 2 ? tokens.get(current - 2) : null;
    if (before != null && before.kind() == Kind.SYMBOL && t.touches(before) && t.text().matches("\\d+")) {
      throw new UnitException(
          "numbers cannot stand in a unit; did you mean '" + before.text() + "^" + t.text() + "'?",
          t.offset(), t.length(), "^" + t.text());
    }
    throw new UnitException(
        "numbers other than 1 cannot stand in a unit, but found '" + t.text()
            + "': write numeric factors outside the brackets",
        t.offset(), t.length());
  }

  private boolean match(Kind kind) {
    if (check(kind)) {
      advance();
      return true;
    }
    return false;
  }

  private boolean check(Kind kind) {
    return peek().kind() == kind;
  }

  private UnitToken advance() {
    UnitToken t = peek();
    if (t.kind() != Kind.END) {
      current++;
    }
    return t;
  }

  private UnitToken consume(Kind kind, String expected) throws UnitException {
    if (check(kind)) {
      return advance();
    }
    throw expected(expected);
  }

  private UnitException expected(String what) {
    UnitToken t = peek();
    return new UnitException("expected " + what + ", but found " + t.describe(), t.offset(), t.length());
  }

  private UnitToken peek() {
    return tokens.get(current);
  }

  private UnitToken previous() {
    return tokens.get(current - 1);
  }
}
