package dev.plumb.lang;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;

import java.util.List;

/** Parses test input and hands back the program together with what the parser said about it. */
final class Parsing {
    final Program program;
    final Diagnostics diagnostics = new Diagnostics();

    private Parsing(String text) {
        program = Parser.parse(new SourceFile("test.plumb", text), diagnostics);
    }

    static Parsing of(String text) {
        return new Parsing(text);
    }

    /** Parses text that must be free of errors and returns its statements. */
    static List<Stmt> clean(String text) {
        Parsing p = new Parsing(text);
        assertEquals(List.of(), p.errors(), "unexpected diagnostics for:\n" + text);
        return p.program.statements();
    }

    /** The single statement of an error-free line, of the given kind. */
    static <T extends Stmt> T only(String text, Class<T> kind) {
        List<Stmt> all = clean(text);
        assertEquals(1, all.size(), "statements in: " + text);
        return assertInstanceOf(kind, all.get(0));
    }

    /** The expression of {@code show EXPR}, parsed without errors. */
    static Expr expr(String text) {
        return only("show " + text, Stmt.Show.class).expr();
    }

    List<Diagnostic> errors() {
        return diagnostics.sorted().stream().filter(d -> d.severity() == Severity.ERROR).toList();
    }
}
