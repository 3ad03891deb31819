package dev.plumb.lang;

import dev.plumb.lang.Expr.BinaryOp;
import dev.plumb.lang.Expr.CompareOp;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;

/**
 * The expression grammar of the plumb language, by recursive descent with one method per rule
 * ({@code expression}, {@code additive}, {@code term}, {@code unary}, {@code power}, {@code primary},
 * {@code call}, {@code ifExpression}), and the token helpers the statement rules of {@link Parser}
 * share with it. It bounds each statement's operations and nesting, so no later tree walk can run
 * out of stack.
 */
public abstract class ExpressionParser {

    private static final Set<String> RESERVED = Set.of("if", "then", "else", "from", "to", "at", "within", "in");

    private final List<Token> tokens;
    private final Diagnostics diagnostics;
    private int current;
    /** Set while the value of a case assignment is parsed, where {@code +-} may follow it. */
    boolean uncertaintyAllowed;

    static final class ParseError extends RuntimeException {
        ParseError() {
            super(null, null, false, false);
        }
    }

    ExpressionParser(List<Token> tokens, Diagnostics diagnostics) {
        this.tokens = tokens;
        this.diagnostics = diagnostics;
    }

    /**
     * Bounds on one statement's expressions, so that no later tree walk can run out of stack: a
     * derivation line never needs more, and past them the message says how to split the line.
     */
    private static final int MAX_OPERATIONS = 1000, MAX_NESTING = 100;
    private int operations, nesting;

    private void operation(Token at) {
        if (++operations > MAX_OPERATIONS) {
            throw error(at, "this statement has more than " + MAX_OPERATIONS + " operations; split it with 'let' definitions");
        }
    }

    /** Starts the bounds afresh: they count per statement. */
    void resetBounds() {
        operations = 0;
        nesting = 0;
    }

    private void open(Token at) {
        if (++nesting > MAX_NESTING) {
            throw error(at, "parentheses and calls nest more than " + MAX_NESTING + " deep here; split the expression with 'let' definitions");
        }
    }

    // ---- expressions ------------------------------------------------------------------------

    public Expr expression() {
        return additive();
    }

    private Expr additive() {
        Expr left = term();
        while (check(TokenType.PLUS) || check(TokenType.MINUS)) {
            Token op = advance();
            operation(op);
            Expr right = term();
            left = new Expr.Binary(op.is(TokenType.PLUS) ? BinaryOp.ADD : BinaryOp.SUB, left, right, left.span().to(right.span()));
        }
        if (check(TokenType.PLUS_MINUS) && !uncertaintyAllowed) {
            throw error(peek(), "'+-' gives an uncertainty and is only allowed in a case, e.g. case a: M = 1.0 +- 0.02 [Msun]");
        }
        return left;
    }

    private Expr term() {
        Expr left = unary();
        while (check(TokenType.STAR) || check(TokenType.SLASH)) {
            Token op = advance();
            operation(op);
            Expr right = unary();
            left = new Expr.Binary(op.is(TokenType.STAR) ? BinaryOp.MUL : BinaryOp.DIV, left, right, left.span().to(right.span()));
        }
        return left;
    }

    Expr unary() {
        if (check(TokenType.MINUS)) {
            Token minus = advance();
            operation(minus);
            open(minus);
            Expr operand = unary();
            nesting--;
            return new Expr.Neg(operand, minus.span().to(operand.span()));
        }
        if (check(TokenType.PLUS)) {
            operation(advance());
            return unary();
        }
        return power();
    }

    private Expr power() {
        Expr base = primary();
        if (check(TokenType.CARET)) {
            Token caret = advance();
            operation(caret);
            open(caret);
            Expr exponent = unary();
            nesting--;
            return new Expr.Binary(BinaryOp.POW, base, exponent, base.span().to(exponent.span()));
        }
        return base;
    }

    private Expr primary() {
        Token t = peek();
        if (t.is(TokenType.NUMBER)) {
            advance();
            double value = Double.parseDouble(t.text());
            if (Double.isInfinite(value)) {
                throw error(t, "the number " + t.text() + " is beyond the range of double precision (about 1.8e308)");
            }
            if (value != 0 && Math.abs(value) < Double.MIN_NORMAL || value == 0 && t.text().matches("[0-9.]*[1-9].*[eE]-.*")) {
                throw error(t, "the number " + t.text() + " is too small to compute with (below about 2.2e-308, it would lose its "
                        + "digits or become 0)");
            }
            if (check(TokenType.UNIT)) {
                Token u = advance();
                return new Expr.Quantity(value, t.text(), u.text(), u.span(), t.span().to(u.span()));
            }
            return new Expr.Num(value, t.text(), t.span());
        }
        if (t.isWord("if")) return ifExpression();
        if (t.is(TokenType.IDENT)) {
            if (RESERVED.contains(t.text())) throw error(t, "expected an expression, found the keyword '" + t.text() + "'");
            advance();
            int order = 0;
            Span primes = t.span();
            while (check(TokenType.PRIME)) {
                primes = primes.to(advance().span());
                order++;
            }
            if (check(TokenType.LPAREN)) return call(t, order);
            if (order > 0) throw error(peek(), "expected '(' after " + t.text() + "'".repeat(order) + ": write the point, e.g. " + t.text() + "'(r)");
            return new Expr.Name(t.text(), t.span());
        }
        if (t.is(TokenType.LPAREN)) {
            advance();
            open(t);
            Expr inner = expression();
            nesting--;
            Token next = peek();
            if (!next.is(TokenType.RPAREN) && next.span().line() > t.span().line() && next.span().column() == 1
                    && next.is(TokenType.IDENT) && Parser.STATEMENTS.contains(next.text())) {
                // The line went on inside the open '(' and ran into the next statement: the mistake is the '('.
                throw error(t, "this '(' is never closed: the statement runs on to the next one, '" + next.text() + "' on line "
                        + next.span().line());
            }
            consume(TokenType.RPAREN, "expected ')' to close the '(' at column " + t.span().column());
            return inner;
        }
        if (t.is(TokenType.UNIT)) {
            throw error(t, "a unit must follow a number, e.g. 1 [" + t.text() + "]");
        }
        if (t.is(TokenType.ERROR)) throw new ParseError();
        throw error(t, "expected an expression, found " + t.describe());
    }

    private Expr call(Token callee, int order) {
        open(callee);
        consume(TokenType.LPAREN, "expected '('");
        List<Expr> args = new ArrayList<>();
        if (!check(TokenType.RPAREN)) {
            do {
                args.add(expression());
            } while (match(TokenType.COMMA));
        }
        Token close = consume(TokenType.RPAREN, "expected ')' or ',' in the call of '" + callee.text() + "'");
        nesting--;
        return new Expr.Call(callee.text(), callee.span(), order, args, callee.span().to(close.span()));
    }

    boolean isComparison() {
        return check(TokenType.LESS) || check(TokenType.LESS_EQUAL) || check(TokenType.GREATER) || check(TokenType.GREATER_EQUAL);
    }

    static CompareOp compareOp(Token t) {
        return switch (t.type()) {
            case LESS -> CompareOp.LT;
            case LESS_EQUAL -> CompareOp.LE;
            case GREATER -> CompareOp.GT;
            default -> CompareOp.GE;
        };
    }

    private Expr ifExpression() {
        Token ifToken = advance();
        Expr left = additive();
        CompareOp op = switch (peek().type()) {
            case LESS -> CompareOp.LT;
            case LESS_EQUAL -> CompareOp.LE;
            case GREATER -> CompareOp.GT;
            case GREATER_EQUAL -> CompareOp.GE;
            default -> throw error(peek(), "expected a comparison (<, <=, >, >=) after 'if', found " + peek().describe());
        };
        advance();
        Expr right = additive();
        Expr.Condition condition = new Expr.Condition(op, left, right, left.span().to(right.span()));
        expectWord("then", "expected 'then' after the condition");
        Expr then = expression();
        expectWord("else", "expected 'else': every 'if' needs both branches");
        Expr otherwise = expression();
        return new Expr.If(condition, then, otherwise, ifToken.span().to(otherwise.span()));
    }

    // ---- helpers ----------------------------------------------------------------------------

    Token identifier(String message) {
        if (check(TokenType.IDENT) && !RESERVED.contains(peek().text())) return advance();
        throw error(peek(), message + ", found " + peek().describe());
    }

    void expectWord(String word, String message) {
        if (!matchWord(word)) throw error(peek(), message + ", found " + peek().describe());
    }

    boolean matchWord(String word) {
        if (peek().isWord(word)) {
            advance();
            return true;
        }
        return false;
    }

    boolean match(TokenType type) {
        if (check(type)) {
            advance();
            return true;
        }
        return false;
    }

    boolean check(TokenType type) {
        return peek().is(type);
    }

    Token consume(TokenType type, String message) {
        if (check(type)) return advance();
        throw error(peek(), message + ", found " + peek().describe());
    }

    Token advance() {
        Token t = tokens.get(current);
        if (!t.is(TokenType.EOF)) current++;
        return t;
    }

    Token peek() {
        return tokens.get(current);
    }

    /** Whether a token can begin an expression (after {@code max} or {@code min} in an expectation). */
    static boolean startsExpression(Token t) {
        return t.is(TokenType.NUMBER) || t.is(TokenType.LPAREN) || t.is(TokenType.MINUS)
                || t.is(TokenType.IDENT) && !RESERVED.contains(t.text());
    }

    Token peekNext() {
        return tokens.get(Math.min(current + 1, tokens.size() - 1));
    }

    ParseError error(Token at, String message) {
        // The lexer has already reported the bad character, unclosed unit or unclosed string.
        if (!at.is(TokenType.ERROR)) diagnostics.error(at.span(), message);
        return new ParseError();
    }

    void synchronize() {
        while (!check(TokenType.NEWLINE) && !check(TokenType.EOF)) advance();
    }
}
