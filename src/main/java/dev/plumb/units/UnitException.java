package dev.plumb.units;

import java.util.Optional;

/**
 * Thrown for a malformed or unknown unit; offset/length are 0-based within the text passed to
 * parse.
 *
 * <p>At the end of the text the offset is the text's length and the length 0. The message is a
 * complete sentence fit to show the user as it stands; {@link #suggestion()} holds the
 * replacement text alone when there is one, for editors that offer a fix.
 */
public final class UnitException extends Exception {
  private final int offset;
  private final int length;
  private final String suggestion;

  public UnitException(String message, int offset, int length) {
    this(message, offset, length, null);
  }

  public UnitException(String message, int offset, int length, String suggestion) {
    super(message, null, false, false);
    this.offset = offset;
    this.length = length;
    this.suggestion = suggestion;
  }

  public int offset() {
    return offset;
  }

  public int length() {
    return length;
  }

  /** The text that would probably fix the span, such as "kg s" for "kgs". */
  public Optional<String> suggestion() {
    return Optional.ofNullable(suggestion);
  }
}
