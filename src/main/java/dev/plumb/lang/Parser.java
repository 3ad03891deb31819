package dev.plumb.lang;

import dev.plumb.lang.Stmt.Assumption;
import dev.plumb.lang.Stmt.Equation;
import dev.plumb.lang.Stmt.Label;
import dev.plumb.lang.Stmt.Tolerance;
import dev.plumb.lang.Stmt.UnitText;
import java.util.ArrayList;
import java.util.List;

/**
 * Recursive-descent parser for the plumb language: one method per grammar rule, the statement
 * rules here and the expression rules in {@link ExpressionParser}. After an error it skips to the
 * end of the line, so one run reports every malformed statement.
 */
public final class Parser extends ExpressionParser {

    /** The statement keywords, in the order the language reference lists them. */
    public static final List<String> STATEMENTS = List.of("title", "param", "coord", "let", "unknown",
            "relation", "boundary", "step", "claim", "scaling", "case", "sweep", "expect", "show", "guess", "typeset");

    public Parser(List<Token> tokens, Diagnostics diagnostics) {
        super(tokens, diagnostics);
    }

    /** Lexes and parses a whole file. */
    public static Program parse(SourceFile source, Diagnostics diagnostics) {
        List<Token> tokens = new Lexer(source.text(), diagnostics).tokens();
        return new Parser(tokens, diagnostics).program(source);
    }

    public Program program(SourceFile source) {
        List<Stmt> statements = new ArrayList<>();
        while (!check(TokenType.EOF)) {
            if (match(TokenType.NEWLINE)) continue;
            try {
                statements.add(statement());
                if (!check(TokenType.NEWLINE) && !check(TokenType.EOF)) {
                    throw error(peek(), "expected the end of the statement, found " + peek().describe());
                }
            } catch (ParseError e) {
                synchronize();
            }
        }
        return new Program(source, statements);
    }

    // ---- statements -------------------------------------------------------------------------

    private Stmt statement() {
        resetBounds();
        Token keyword = peek();
        if (keyword.is(TokenType.ERROR)) throw new ParseError();
        if (!keyword.is(TokenType.IDENT) || !STATEMENTS.contains(keyword.text())) {
            throw error(keyword, "expected a statement (" + String.join(", ", STATEMENTS) + "), found "
                    + keyword.describe() + suggestion(keyword));
        }
        advance();
        return switch (keyword.text()) {
            case "title" -> title(keyword);
            case "param" -> param(keyword);
            case "coord" -> coord(keyword);
            case "let" -> let(keyword);
            case "unknown" -> unknown(keyword);
            case "relation" -> {
                Label label = label();
                Equation eq = equation("relation");
                yield new Stmt.Relation(label, eq, keyword.span().to(eq.span()));
            }
            case "boundary" -> {
                Label label = label();
                Equation eq = equation("boundary condition");
                yield new Stmt.Boundary(label, eq, keyword.span().to(eq.span()));
            }
            case "step" -> {
                Label label = label();
                Equation eq = equation("step");
                yield new Stmt.Step(label, eq, keyword.span().to(eq.span()));
            }
            case "claim" -> {
                Label label = label();
                Equation eq = equation("claim");
                yield new Stmt.Claim(label, eq, keyword.span().to(eq.span()));
            }
            case "scaling" -> scaling(keyword);
            case "case" -> caseStatement(keyword);
            case "sweep" -> sweep(keyword);
            case "expect" -> expect(keyword);
            case "show" -> show(keyword);
            case "guess" -> guess(keyword);
            case "typeset" -> typeset(keyword);
            default -> throw new IllegalStateException(keyword.text());
        };
    }

    private static String suggestion(Token t) {
        if (!t.is(TokenType.IDENT)) return "";
        String lower = t.text().toLowerCase(java.util.Locale.ROOT);
        for (String s : STATEMENTS) {
            if (s.equals(lower) || Names.editDistance(s, lower) == 1) return "; did you mean '" + s + "'?";
        }
        return "";
    }

    private Stmt title(Token keyword) {
        Token text = consume(TokenType.STRING, "expected the title in double quotes, e.g. title \"Uniform sphere\"");
        return new Stmt.Title(text.text(), keyword.span().to(text.span()));
    }

    private Stmt param(Token keyword) {
        Token name = identifier("expected the parameter's name after 'param'");
        UnitText unit = optionalUnit();
        Assumption assumption = null;
        List<Stmt.Bound> bounds = new ArrayList<>();
        Expr value = null;
        Span end = unit != null ? unit.span() : name.span();
        if (isComparison()) {
            // Constraints separated by commas: '> 0' or '>= 0' is the sign, anything else an order (< R).
            do {
                if (!isComparison()) throw error(peek(), "expected a comparison such as < R after ','");
                Token op = advance();
                Expr bound = expression();
                boolean zero = bound instanceof Expr.Num n && n.value() == 0.0;
                if (zero && op.is(TokenType.GREATER) && assumption == null) {
                    assumption = Assumption.POSITIVE;
                } else if (zero && op.is(TokenType.GREATER_EQUAL) && assumption == null) {
                    assumption = Assumption.NON_NEGATIVE;
                } else {
                    bounds.add(new Stmt.Bound(compareOp(op), bound, op.span().to(bound.span())));
                }
                end = bound.span();
            } while (match(TokenType.COMMA));
        } else if (match(TokenType.EQUALS)) {
            value = expression();
            if (unit != null && value instanceof Expr.Num n) {
                value = new Expr.Quantity(n.value(), n.text(), unit.text(), unit.span(), n.span());
            }
            end = value.span();
        }
        return new Stmt.Param(name.text(), name.span(), unit, assumption, bounds, value, keyword.span().to(end));
    }

    private Stmt coord(Token keyword) {
        Token name = identifier("expected the coordinate's name after 'coord'");
        UnitText unit = optionalUnit();
        expectWord("from", "expected 'from' and the interval, e.g. coord r [m] from 0 to R");
        Expr from = expression();
        expectWord("to", "expected 'to' and the end of the interval");
        Expr to = expression();
        return new Stmt.Coord(name.text(), name.span(), unit, from, to, keyword.span().to(to.span()));
    }

    private Stmt let(Token keyword) {
        Token name = identifier("expected the name being defined after 'let'");
        List<String> params = new ArrayList<>();
        if (match(TokenType.LPAREN)) {
            do {
                params.add(identifier("expected a parameter name").text());
            } while (match(TokenType.COMMA));
            consume(TokenType.RPAREN, "expected ')' after the parameters of '" + name.text() + "'");
        }
        consume(TokenType.EQUALS, "expected '=' and the definition of '" + name.text() + "'");
        Expr body = expression();
        return new Stmt.Let(name.text(), name.span(), params, body, keyword.span().to(body.span()));
    }

    private Stmt unknown(Token keyword) {
        Token name = identifier("expected the unknown's name after 'unknown'");
        List<String> args = new ArrayList<>();
        Span end = name.span();
        if (match(TokenType.LPAREN)) {
            do {
                args.add(identifier("expected the coordinate the profile depends on").text());
            } while (match(TokenType.COMMA));
            end = consume(TokenType.RPAREN, "expected ')'").span();
        }
        UnitText unit = optionalUnit();
        if (unit != null) end = unit.span();
        Assumption assumption = null;
        if (!args.isEmpty() && (check(TokenType.GREATER) || check(TokenType.GREATER_EQUAL))) {
            Token op = advance();
            Token zero = consume(TokenType.NUMBER, "expected 0 after '" + op.text() + "': a profile may be declared > 0 or >= 0");
            if (Double.parseDouble(zero.text()) != 0.0) {
                throw error(zero, "only '> 0' and '>= 0' are supported for a profile, found " + op.text() + " " + zero.text());
            }
            assumption = op.is(TokenType.GREATER) ? Assumption.POSITIVE : Assumption.NON_NEGATIVE;
            end = zero.span();
        }
        return new Stmt.Unknown(name.text(), name.span(), args, unit, assumption, keyword.span().to(end));
    }

    private Stmt scaling(Token keyword) {
        Label label = label();
        Expr lhs = expression();
        consume(TokenType.TILDE, "expected '~' in a scaling claim, e.g. scaling s: P(0) ~ G*M^2/R^4");
        Expr rhs = expression();
        return new Stmt.Scaling(label, lhs, rhs, keyword.span().to(rhs.span()));
    }

    private Stmt caseStatement(Token keyword) {
        Label label = label();
        if (!label.present()) {
            throw error(peek(), "a case needs a name, e.g. case sun: M = 1 [Msun], R = 1 [Rsun]");
        }
        List<Stmt.Assignment> assignments = new ArrayList<>();
        do {
            assignments.add(assignment());
        } while (match(TokenType.COMMA));
        return new Stmt.Case(label, assignments, keyword.span().to(assignments.get(assignments.size() - 1).span()));
    }

    private Stmt.Assignment assignment() {
        Token name = identifier("expected a parameter name and its value, e.g. M = 1 [Msun]");
        consume(TokenType.EQUALS, "expected '=' after '" + name.text() + "'");
        Expr value;
        uncertaintyAllowed = true;
        try {
            value = expression();
        } finally {
            uncertaintyAllowed = false;
        }
        Expr uncertainty = null;
        if (match(TokenType.PLUS_MINUS)) {
            uncertainty = expression();
            // "1.0 +- 0.02 [Msun]": the unit written once at the end applies to both numbers.
            if (value instanceof Expr.Num n && uncertainty instanceof Expr.Quantity q) {
                value = new Expr.Quantity(n.value(), n.text(), q.unit(), q.unitSpan(), n.span());
            }
        }
        Span end = uncertainty != null ? uncertainty.span() : value.span();
        return new Stmt.Assignment(name.text(), name.span(), value, uncertainty, name.span().to(end));
    }

    private Stmt sweep(Token keyword) {
        Label label = label();
        if (!label.present()) {
            throw error(peek(), "a sweep needs a name, e.g. sweep family: rho_c from 1e17 [kg/m^3] to 1e20 [kg/m^3] log 40");
        }
        Token param = identifier("expected the parameter to vary, e.g. sweep family: rho_c from 1e17 [kg/m^3] to 1e20 [kg/m^3] log 40");
        expectWord("from", "expected 'from' and the first value of '" + param.text() + "'");
        Expr from = expression();
        expectWord("to", "expected 'to' and the last value of '" + param.text() + "'");
        Expr to = expression();
        boolean log;
        if (matchWord("log")) {
            log = true;
        } else if (matchWord("linear")) {
            log = false;
        } else {
            throw error(peek(), "expected 'log N' or 'linear N' (N points), found " + peek().describe());
        }
        Token n = peek();
        if (!n.is(TokenType.NUMBER) || !n.text().matches("[0-9]+")) {
            throw error(n, "expected the number of points, a whole number from 2 to " + MAX_SWEEP_POINTS + ", found " + n.describe());
        }
        advance();
        int count;
        try {
            count = Integer.parseInt(n.text());
        } catch (NumberFormatException e) {
            count = Integer.MAX_VALUE;
        }
        if (count < 2 || count > MAX_SWEEP_POINTS) {
            throw error(n, "a sweep has from 2 to " + MAX_SWEEP_POINTS + " points, found " + n.text());
        }
        List<Stmt.Assignment> others = new ArrayList<>();
        while (match(TokenType.COMMA)) others.add(assignment());
        Span end = others.isEmpty() ? n.span() : others.get(others.size() - 1).span();
        return new Stmt.Sweep(label, param.text(), param.span(), from, to, log, count, n.span(), others, keyword.span().to(end));
    }

    /** The most points one sweep may have: a sequence is for curves and extrema, not for brute force. */
    public static final int MAX_SWEEP_POINTS = 10_000;

    private Stmt expect(Token keyword) {
        Label label = label();
        Stmt.Extremum extremum = null;
        Token kind = peek();
        if (kind.is(TokenType.IDENT) && (kind.text().equals("max") || kind.text().equals("min")) && startsExpression(peekNext())) {
            advance();
            Expr quantity = expression();
            expectWord("over", "expected 'over' and the name of a sweep, e.g. expect " + (label.present() ? label.name() : "top")
                    + ": " + kind.text() + " m(R) over family = 2.0 [Msun] within 0.1%");
            Token sweep = identifier("expected the name of a sweep after 'over'");
            extremum = new Stmt.Extremum(kind.text().equals("max"), kind.span(), sweep.text(), sweep.span());
            consume(TokenType.EQUALS, "expected '=' and the expected value, e.g. expect top: max m(R) over family = 2.0 [Msun] within 0.1%");
            Expr expected = expression();
            expectWord("within", "expected 'within' and a tolerance, e.g. within 0.1%");
            Tolerance tolerance = tolerance();
            return new Stmt.Expect(label, quantity, null, Span.NONE, expected, tolerance, keyword.span().to(tolerance.span()), extremum);
        }
        Expr lhs = expression();
        String caseName = null;
        Span caseSpan = Span.NONE;
        if (matchWord("at")) {
            Token c = identifier("expected the name of a case after 'at'");
            caseName = c.text();
            caseSpan = c.span();
        }
        consume(TokenType.EQUALS, "expected '=' and the expected value, e.g. expect v: P(0) at sun = 1.3e14 [Pa] within 0.1%");
        Expr expected = expression();
        expectWord("within", "expected 'within' and a tolerance, e.g. within 0.1%");
        Tolerance tolerance = tolerance();
        return new Stmt.Expect(label, lhs, caseName, caseSpan, expected, tolerance, keyword.span().to(tolerance.span()));
    }

    private Tolerance tolerance() {
        Expr amount = unary();
        if (check(TokenType.PERCENT)) {
            Token pct = advance();
            if (!(amount instanceof Expr.Num n)) throw error(pct, "a percentage tolerance must be a plain number, e.g. 0.1%");
            return new Tolerance(n.value() / 100.0, null, amount.span().to(pct.span()));
        }
        if (amount instanceof Expr.Num n) return new Tolerance(n.value(), null, n.span());
        return new Tolerance(Double.NaN, amount, amount.span());
    }

    private Stmt guess(Token keyword) {
        Expr target = expression();
        consume(TokenType.EQUALS, "expected '=' and a value, e.g. guess R = 3000 [km]");
        Expr value = expression();
        return new Stmt.Guess(target, value, keyword.span().to(value.span()));
    }

    private Stmt show(Token keyword) {
        Expr expr = expression();
        UnitText unit = null;
        if (matchWord("in")) {
            unit = optionalUnit();
            if (unit == null) throw error(peek(), "expected a unit in brackets after 'in', e.g. show P(0) in [GPa]");
        }
        return new Stmt.Show(expr, unit, keyword.span().to(unit != null ? unit.span() : expr.span()));
    }

    private Stmt typeset(Token keyword) {
        Token name = identifier("expected the name to typeset after 'typeset', e.g. typeset Rstar as \"R_\\star\"");
        expectWord("as", "expected 'as' and the TeX in double quotes after the name, e.g. typeset " + name.text() + " as \"R_\\star\"");
        Token tex = consume(TokenType.STRING, "expected the TeX in double quotes after 'as', e.g. typeset " + name.text() + " as \"R_\\star\"");
        return new Stmt.Typeset(name.text(), name.span(), tex.text(), tex.span(), keyword.span().to(tex.span()));
    }

    private Label label() {
        if (check(TokenType.IDENT) && peekNext().is(TokenType.COLON)) {
            Token name = advance();
            advance();
            return new Label(name.text(), name.span());
        }
        return Label.NONE;
    }

    private Equation equation(String what) {
        Expr lhs = expression();
        if (!check(TokenType.EQUALS)) {
            throw error(peek(), "expected '=' in the " + what + ", found " + peek().describe());
        }
        advance();
        Expr rhs = expression();
        return new Equation(lhs, rhs, lhs.span().to(rhs.span()));
    }

    private UnitText optionalUnit() {
        if (check(TokenType.UNIT)) {
            Token u = advance();
            return new UnitText(u.text(), u.span());
        }
        return null;
    }

    // ---- lone expressions -------------------------------------------------------------------

    /** Parses the text of one expression, such as {@code P(0)}; null when it is not one. */
    public static Expr parseExpression(String text) {
        Diagnostics d = new Diagnostics();
        Expr e = new Parser(new Lexer(text, d).tokens(), d).expressionOnly();
        return d.hasErrors() ? null : e;
    }

    /** Parses a lone expression that must fill the whole input (the {@code units} calculator); null after an error. */
    public Expr expressionOnly() {
        try {
            Expr e = expression();
            while (match(TokenType.NEWLINE)) { }
            if (!check(TokenType.EOF)) throw error(peek(), "expected the end of the expression, found " + peek().describe());
            return e;
        } catch (ParseError ex) {
            return null;
        }
    }
}
