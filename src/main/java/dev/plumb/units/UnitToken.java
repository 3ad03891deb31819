package dev.plumb.units;

/**
 * One token of unit text, with its 0-based offset and length in that text.
 *
 * <p>For {@link Kind#SUPERSCRIPT} tokens (such as "⁻¹"), {@code text} holds the exponent in
 * ASCII ("-1").
 */
record UnitToken(Kind kind, String text, int offset, int length) {
  enum Kind { SYMBOL, NUMBER, STAR, SLASH, CARET, MINUS, PLUS, LEFT_PAREN, RIGHT_PAREN, SUPERSCRIPT, END }

  /** How the token is named in a message: "'kg'", "the end of the unit". */
  String describe() {
    return switch (kind) {
      case END -> "the end of the unit";
      case NUMBER -> "the number '" + text + "'";
      default -> "'" + text + "'";
    };
  }

  /** Whether nothing but the token's own characters separate it from {@code previous}. */
  boolean touches(UnitToken previous) {
    return previous.offset + previous.length == offset;
  }
}
