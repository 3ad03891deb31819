package dev.plumb.lang;

/** One token: its kind, its text as written (for a unit, the text inside the brackets) and where it is. */
public record Token(TokenType type, String text, Span span) {

    public boolean is(TokenType t) {
        return type == t;
    }

    public boolean isWord(String word) {
        return type == TokenType.IDENT && text.equals(word);
    }

    /** How a token reads in an error message. */
    public String describe() {
        return switch (type) {
            case NEWLINE -> "end of line";
            case EOF -> "end of file";
            case UNIT -> "unit [" + text + "]";
            case STRING -> "string \"" + text + "\"";
            default -> "'" + text + "'";
        };
    }
}
