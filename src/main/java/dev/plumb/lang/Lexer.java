package dev.plumb.lang;

import java.util.ArrayList;
import java.util.List;

/**
 * Turns source text into tokens. Newlines end statements except inside open parentheses, where
 * a statement may continue; a {@code [ ... ]} unit is one token holding the text inside.
 */
public final class Lexer {
    private final String src;
    private final Diagnostics diagnostics;
    private final List<Token> tokens = new ArrayList<>();
    private int pos;
    private int line = 1;
    private int lineStart;
    private int parenDepth;

    public Lexer(String src, Diagnostics diagnostics) {
        this.src = src;
        this.diagnostics = diagnostics;
    }

    public List<Token> tokens() {
        while (pos < src.length()) {
            scanToken();
        }
        add(TokenType.NEWLINE, "", pos);
        add(TokenType.EOF, "", pos);
        return List.copyOf(tokens);
    }

    private void scanToken() {
        int start = pos;
        char ch = src.charAt(pos++);
        switch (ch) {
            case ' ', '\t', '\r' -> { }
            case '\n' -> newline(start);
            case '#' -> { while (pos < src.length() && src.charAt(pos) != '\n') pos++; }
            case '(' -> { parenDepth++; add(TokenType.LPAREN, "(", start); }
            case ')' -> { parenDepth = Math.max(0, parenDepth - 1); add(TokenType.RPAREN, ")", start); }
            case ',' -> add(TokenType.COMMA, ",", start);
            case ':' -> add(TokenType.COLON, ":", start);
            case '=' -> add(TokenType.EQUALS, "=", start);
            case '~' -> add(TokenType.TILDE, "~", start);
            case '%' -> add(TokenType.PERCENT, "%", start);
            case '\'' -> add(TokenType.PRIME, "'", start);
            case '*' -> add(TokenType.STAR, "*", start);
            case '/' -> add(TokenType.SLASH, "/", start);
            case '^' -> add(TokenType.CARET, "^", start);
            case '±' -> add(TokenType.PLUS_MINUS, "+-", start);
            case '+' -> {
                if (peek() == '-') { pos++; add(TokenType.PLUS_MINUS, "+-", start); }
                else add(TokenType.PLUS, "+", start);
            }
            case '-' -> add(TokenType.MINUS, "-", start);
            case '<' -> {
                if (peek() == '=') { pos++; add(TokenType.LESS_EQUAL, "<=", start); }
                else add(TokenType.LESS, "<", start);
            }
            case '>' -> {
                if (peek() == '=') { pos++; add(TokenType.GREATER_EQUAL, ">=", start); }
                else add(TokenType.GREATER, ">", start);
            }
            case '[' -> unit(start);
            case '"' -> string(start);
            default -> {
                int cp = src.codePointAt(start);
                if (isDigit(ch) || (ch == '.' && isDigit(peek()))) number(start);
                else if (isIdentStart(cp)) {
                    pos = start + Character.charCount(cp);
                    identifier(start);
                } else {
                    // A run of characters the language has no use for (binary bytes, a terminal escape) is one mistake.
                    pos = start + Character.charCount(cp);
                    for (boolean more = true; more; ) {
                        if (src.charAt(pos - 1) == '\u001b' && peek() == '[') controlSequence();
                        more = pos < src.length() && unexpected(src.charAt(pos));
                        if (more) pos++;
                    }
                    error(start, pos - start, pos - start == Character.charCount(cp) ? "unexpected character '" + Character.toString(cp) + "'"
                            : (pos - start) + " unexpected characters in a row, the first '" + Character.toString(cp) + "'");
                }
            }
        }
    }

    private void newline(int start) {
        if (parenDepth == 0) add(TokenType.NEWLINE, "\n", start);
        line++;
        lineStart = pos;
    }

    private void number(int start) {
        while (isDigit(peek())) pos++;
        // One decimal point: a number that began with '.' (".5") has had it already, so ".512.5" is two numbers.
        boolean pointSeen = src.charAt(start) == '.';
        if (!pointSeen && (peek() == '.' && isDigit(peekAt(1)) || peek() == '.' && !isIdentStart(peekAt(1)))) {
            pos++;
            while (isDigit(peek())) pos++;
        }
        if ((peek() == 'e' || peek() == 'E')
                && (isDigit(peekAt(1)) || ((peekAt(1) == '-' || peekAt(1) == '+') && isDigit(peekAt(2))))) {
            pos += 2;
            while (isDigit(peek())) pos++;
        }
        add(TokenType.NUMBER, src.substring(start, pos), start);
    }

    /**
     * A name: letters of any script (ρ, λ, Γ, é...), digits and underscores, with combining marks
     * (ρ̄). The Greek letter π alone is the constant pi.
     */
    private void identifier(int start) {
        while (pos < src.length() && isIdentPart(src.codePointAt(pos))) pos += Character.charCount(src.codePointAt(pos));
        String text = src.substring(start, pos);
        add(TokenType.IDENT, text.equals("\u03c0") ? "pi" : text, start);
    }

    /**
     * A unit runs to its ']'. One left open is reported once, where it opened and where it stopped
     * (the end of the line, or a ',', '[', '=' or ':' that cannot stand in a unit), and what it held up
     * to there is still read as the unit, so the rest of the statement raises no follow-on errors.
     */
    private void unit(int start) {
        int close = pos;
        while (close < src.length() && src.charAt(close) != ']' && !endsOpenUnit(src.charAt(close))) close++;
        if (close >= src.length() || src.charAt(close) != ']') {
            boolean lineEnd = close >= src.length() || src.charAt(close) == '\n' || src.charAt(close) == '\r';
            int stop = close;
            while (stop > pos && Character.isWhitespace(src.charAt(stop - 1))) stop--;
            String where = lineEnd ? "before the end of the line" : "before the '" + src.charAt(close) + "' at column " + (close - lineStart + 1);
            diagnostics.error(Span.at(line, start - lineStart + 1, Math.max(1, stop - start)),
                    "unit not closed: '[' at column " + (start - lineStart + 1) + " needs a ']' " + where);
            // Keep as the unit only what can be part of one ("kg" of "[kg > 0"); the rest is read as
            // the statement's own text, so "> 0" is still the constraint and no follow-on error comes.
            int cut = pos;
            while (cut < stop && isUnitChar(src.charAt(cut))) cut++;
            int end = cut;
            while (end > pos && Character.isWhitespace(src.charAt(end - 1))) end--;
            if (end > pos) {
                tokens.add(new Token(TokenType.UNIT, src.substring(pos, end), new Span(line, start - lineStart + 1, line, end - lineStart + 1)));
            }
            pos = cut < stop ? cut : close;
            return;
        }
        tokens.add(new Token(TokenType.UNIT, src.substring(pos, close),
                new Span(line, start - lineStart + 1, line, close + 1 - lineStart + 1)));
        pos = close + 1;
    }

    /** A character a unit can hold: letters, digits, spaces, superscripts and the unit operators. */
    private static boolean isUnitChar(char c) {
        return Character.isLetterOrDigit(c) || c == ' ' || c == '\t' || c == '_' || c == '.' || "*·⋅×/^-−+()⁻⁺⁰¹²³⁴⁵⁶⁷⁸⁹".indexOf(c) >= 0;
    }

    private static boolean endsOpenUnit(char c) {
        return c == '\n' || c == '\r' || c == ',' || c == '[' || c == '=' || c == ':' || c == '"';
    }

    private void string(int start) {
        int close = pos;
        while (close < src.length() && src.charAt(close) != '"' && src.charAt(close) != '\n') close++;
        if (close >= src.length() || src.charAt(close) != '"') {
            error(start, close - start, "string not closed: expected '\"' before the end of the line");
            pos = close;
            return;
        }
        tokens.add(new Token(TokenType.STRING, src.substring(pos, close),
                new Span(line, start - lineStart + 1, line, close + 1 - lineStart + 1)));
        pos = close + 1;
    }

    private void add(TokenType type, String text, int start) {
        int length = Math.max(1, pos - start);
        tokens.add(new Token(type, text, Span.at(line, start - lineStart + 1, length)));
    }

    private void error(int start, int length, String message) {
        Span span = Span.at(line, start - lineStart + 1, length);
        diagnostics.error(span, message);
        tokens.add(new Token(TokenType.ERROR, src.substring(start, Math.min(src.length(), start + Math.max(1, length))), span));
    }

    private char peek() {
        return peekAt(0);
    }

    private char peekAt(int ahead) {
        int i = pos + ahead;
        return i < src.length() ? src.charAt(i) : '\0';
    }

    /** The rest of a terminal control sequence after ESC: '[', parameter and intermediate bytes, one final byte (ECMA-48). */
    private void controlSequence() {
        pos++;
        while (pos < src.length() && src.charAt(pos) >= 0x20 && src.charAt(pos) <= 0x3F) pos++;
        if (pos < src.length() && src.charAt(pos) >= 0x40 && src.charAt(pos) <= 0x7E) pos++;
    }

    /** Whether a character can start no token and is not white space. */
    private static boolean unexpected(char c) {
        return "(),:=~%'*/^±+-<>[\"#. \t\r\n".indexOf(c) < 0 && !isDigit(c) && !isIdentStart(c);
    }

    private static boolean isDigit(char c) {
        return c >= '0' && c <= '9';
    }

    private static boolean isIdentStart(int c) {
        return Character.isLetter(c) || c == '_';
    }

    private static boolean isIdentPart(int c) {
        int type = Character.getType(c);
        return Character.isLetterOrDigit(c) || c == '_' || type == Character.NON_SPACING_MARK || type == Character.COMBINING_SPACING_MARK;
    }
}
