package dev.plumb.lang;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;

/** Malformed input: each error points at a line and column, and parsing goes on after it. */
class ParseErrorTest {

    /** The only error of {@code text}. */
    private static Diagnostic onlyError(String text) {
        List<Diagnostic> errors = Parsing.of(text).errors();
        assertEquals(1, errors.size(), () -> "errors for " + text + ": " + errors);
        return errors.get(0);
    }

    private static void assertAt(Diagnostic d, int line, int column) {
        assertEquals(line, d.span().line(), () -> "line of: " + d.message());
        assertEquals(column, d.span().column(), () -> "column of: " + d.message());
    }

    @Test
    void missingEqualsInARelation() {
        String line = "relation balance: P'(r) G*m(r)";
        Diagnostic d = onlyError(line);
        assertAt(d, 1, line.indexOf("G*") + 1);
        assertTrue(d.message().contains("expected '=' in the relation"), d.message());
    }

    @Test
    void unexpectedCharacter() {
        String text = "param M [kg] > 0\nlet x = M $ 2\n";
        Diagnostic d = onlyError(text);
        assertAt(d, 2, "let x = M ".length() + 1);
        assertTrue(d.message().contains("unexpected character '$'"), d.message());
    }

    @Test
    void unitNotClosed() {
        String text = "\n\nparam M [kg > 0\n";
        Diagnostic d = onlyError(text);
        assertAt(d, 3, "param M ".length() + 1);
        assertTrue(d.message().contains("needs a ']' before the end of the line"), d.message());
    }

    @Test
    void anUnclosedParenthesisIsReportedWhereItOpened() {
        Diagnostic d = onlyError("param M [kg] > 0\nclaim c: (M + 1 [kg]\nclaim d: M = M\n");
        assertAt(d, 2, 10);
        assertTrue(d.message().contains("this '(' is never closed"), d.message());
    }

    @Test
    void aConstraintAfterACommaMustBeAComparison() {
        // 'param Rc [m] > 0, < R' orders parameters; after the comma a comparison must follow.
        Diagnostic d = onlyError("param M [kg] > 0, 3");
        assertAt(d, 1, 19);
        assertTrue(d.message().contains("expected a comparison such as < R"), d.message());
    }

    @Test
    void misspelledStatementKeywordGetsASuggestion() {
        Diagnostic d = onlyError("param M [kg] > 0\n  relaton b: M = M\n");
        assertAt(d, 2, 3);
        assertTrue(d.message().contains("did you mean 'relation'?"), d.message());
    }

    @Test
    void caseWithoutName() {
        Diagnostic d = onlyError("case M = 1 [kg]");
        assertAt(d, 1, 6);
        assertTrue(d.message().contains("a case needs a name"), d.message());
    }

    @Test
    void expectWithoutTolerance() {
        String line = "expect v: P(0) at sun = 1 [Pa]";
        Diagnostic d = onlyError(line);
        assertAt(d, 1, line.length() + 1);
        assertTrue(d.message().contains("expected 'within'"), d.message());
    }

    @Test
    void ifWithoutElse() {
        String line = "let T(z) = if z < 1 then 2";
        Diagnostic d = onlyError(line);
        assertAt(d, 1, line.length() + 1);
        assertTrue(d.message().contains("expected 'else'"), d.message());
    }

    @Test
    void uncertaintyOutsideACase() {
        String line = "let x = 1 +- 2";
        Diagnostic d = onlyError(line);
        assertAt(d, 1, line.indexOf("+-") + 1);
        assertTrue(d.message().contains("only allowed in a case"), d.message());
    }

    @Test
    void trailingTokensAfterAStatement() {
        String line = "show P(0) in [GPa] extra";
        Diagnostic d = onlyError(line);
        assertAt(d, 1, line.indexOf("extra") + 1);
        assertTrue(d.message().contains("expected the end of the statement"), d.message());
    }

    @Test
    void primeWithoutAPoint() {
        String line = "relation b: P' = 0";
        Diagnostic d = onlyError(line);
        assertAt(d, 1, line.indexOf("= 0") + 1);
        assertTrue(d.message().contains("expected '(' after P'"), d.message());
    }

    @Test
    void stringNotClosed() {
        Diagnostic d = onlyError("title \"Uniform sphere");
        assertAt(d, 1, 7);
        assertTrue(d.message().contains("string not closed"), d.message());
    }

    @Test
    void threeBrokenLinesGiveThreeErrorsAndTheRestStillParses() {
        String text = """
                title "Recovery"
                param M [kg] > 0
                param R [m] >
                coord r [m] from 0 to R
                let rho = M / * R^3
                unknown P(r) [Pa]
                relation balance P'(r) = 0
                boundary surface: P(R) = 0
                """;
        Parsing p = Parsing.of(text);
        List<Diagnostic> errors = p.errors();
        assertEquals(3, errors.size(), errors::toString);
        assertAt(errors.get(0), 3, "param R [m] >".length() + 1);
        assertAt(errors.get(1), 5, "let rho = M / ".length() + 1);
        assertAt(errors.get(2), 7, "relation balance ".length() + 1);
        List<Stmt> statements = p.program.statements();
        assertEquals(5, statements.size());
        assertInstanceOf(Stmt.Boundary.class, statements.get(statements.size() - 1));
        assertEquals(8, statements.get(statements.size() - 1).span().line());
    }

    @Test
    void aSecondDecimalPointStartsAnotherNumberInsteadOfFailingTheLexer() {
        // Found by the fuzzing test: ".512.5" made the lexer hand "multiple points" to Double.parseDouble.
        Diagnostics d = new Diagnostics();
        Parser.parse(new SourceFile("t.plumb", "param x > 0\nexpect e: x at .512.5 = 1 within 1%\n"), d);
        assertTrue(d.hasErrors(), "a located syntax error, not an exception");
    }
}
