package dev.plumb.units;

import java.util.ArrayList;
import java.util.List;

/** Splits unit text into tokens, accepting the Unicode spellings people paste (·, −, ², ⁻¹). */
final class UnitLexer {
  private static final String SUPERSCRIPT_DIGITS = "⁰¹²³⁴⁵⁶⁷⁸⁹";

  private final String text;
  private int pos;

  private UnitLexer(String text) {
    this.text = text;
  }

  static List<UnitToken> tokens(String text) throws UnitException {
    return new UnitLexer(text).all();
  }

  private List<UnitToken> all() throws UnitException {
    List<UnitToken> out = new ArrayList<>();
    while (true) {
      while (pos < text.length() && Character.isWhitespace(text.charAt(pos))) {
        pos++;
      }
      if (pos >= text.length()) {
        out.add(new UnitToken(UnitToken.Kind.END, "", text.length(), 0));
        return out;
      }
      out.add(next());
    }
  }

  private UnitToken next() throws UnitException {
    int start = pos;
    char c = text.charAt(pos);
    if (Character.isLetter(c) || c == '_') {
      while (pos < text.length() && (Character.isLetter(text.charAt(pos)) || text.charAt(pos) == '_')) {
        pos++;
      }
      return token(UnitToken.Kind.SYMBOL, start);
    }
    if (Character.isDigit(c) || c == '.') {
      return number(start);
    }
    if (c == '⁻' || c == '⁺' || SUPERSCRIPT_DIGITS.indexOf(c) >= 0) {
      return superscript(start);
    }
    pos++;
    return switch (c) {
      case '*', '·', '⋅', '×' -> token(UnitToken.Kind.STAR, start);
      case '/' -> token(UnitToken.Kind.SLASH, start);
      case '^' -> token(UnitToken.Kind.CARET, start);
      case '-', '−' -> token(UnitToken.Kind.MINUS, start);
      case '+' -> token(UnitToken.Kind.PLUS, start);
      case '(' -> token(UnitToken.Kind.LEFT_PAREN, start);
      case ')' -> token(UnitToken.Kind.RIGHT_PAREN, start);
      case '[', ']' -> throw new UnitException(
          "unexpected '" + c + "' inside a unit: units are written between one pair of square brackets",
          start, 1);
      default -> throw new UnitException("unexpected character '" + c + "' in a unit", start, 1);
    };
  }

  /** Digits with an optional fraction and decimal exponent; only "1" survives the parser. */
  private UnitToken number(int start) {
    digits();
    if (pos < text.length() && text.charAt(pos) == '.') {
      pos++;
      digits();
    }
    if (pos < text.length() && (text.charAt(pos) == 'e' || text.charAt(pos) == 'E')) {
      int mark = pos++;
      if (pos < text.length() && (text.charAt(pos) == '+' || text.charAt(pos) == '-')) {
        pos++;
      }
      if (pos < text.length() && Character.isDigit(text.charAt(pos))) {
        digits();
      } else {
        pos = mark; // "1erg" is the number 1 next to the symbol erg, not an exponent
      }
    }
    return token(UnitToken.Kind.NUMBER, start);
  }

  private UnitToken superscript(int start) {
    StringBuilder ascii = new StringBuilder();
    while (pos < text.length()) {
      char c = text.charAt(pos);
      if (c == '⁻') {
        ascii.append('-');
      } else if (c == '⁺') {
        ascii.append('+');
      } else if (SUPERSCRIPT_DIGITS.indexOf(c) >= 0) {
        ascii.append(SUPERSCRIPT_DIGITS.indexOf(c));
      } else {
        break;
      }
      pos++;
    }
    return new UnitToken(UnitToken.Kind.SUPERSCRIPT, ascii.toString(), start, pos - start);
  }

  private void digits() {
    while (pos < text.length() && Character.isDigit(text.charAt(pos))) {
      pos++;
    }
  }

  private UnitToken token(UnitToken.Kind kind, int start) {
    return new UnitToken(kind, text.substring(start, pos), start, pos - start);
  }
}
