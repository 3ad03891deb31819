package dev.plumb.lang;

/** The kinds of token in a plumb file. Keywords are ordinary identifiers, recognised by place. */
public enum TokenType {
    IDENT, NUMBER, STRING, UNIT,
    PLUS, MINUS, STAR, SLASH, CARET, PLUS_MINUS,
    LPAREN, RPAREN, COMMA, COLON, EQUALS, TILDE, PERCENT, PRIME,
    LESS, LESS_EQUAL, GREATER, GREATER_EQUAL,
    NEWLINE, EOF, ERROR
}
