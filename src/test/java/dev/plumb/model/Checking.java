package dev.plumb.model;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.fail;

import dev.plumb.lang.Diagnostic;
import dev.plumb.lang.Diagnostics;
import dev.plumb.lang.Parser;
import dev.plumb.lang.Severity;
import dev.plumb.lang.SourceFile;
import java.util.List;

/** Parses and checks test input; the parse itself must be clean so every diagnostic is the checker's. */
final class Checking {
    final Model model;

    private Checking(String text) {
        Diagnostics diagnostics = new Diagnostics();
        var program = Parser.parse(new SourceFile("test.plumb", text), diagnostics);
        assertEquals(0, diagnostics.errorCount(), () -> "syntax errors in test input: " + diagnostics.sorted());
        model = Checker.check(program, diagnostics);
    }

    static Checking of(String text) {
        return new Checking(text);
    }

    List<Diagnostic> all(Severity severity) {
        return model.diagnostics().stream().filter(d -> d.severity() == severity).toList();
    }

    List<Diagnostic> errors() {
        return all(Severity.ERROR);
    }

    /** The only error, which must contain {@code text}. */
    Diagnostic onlyError(String text) {
        List<Diagnostic> errors = errors();
        assertEquals(1, errors.size(), () -> "errors: " + errors);
        Diagnostic d = errors.get(0);
        if (!d.message().contains(text)) fail("expected an error containing \"" + text + "\", found: " + d.message());
        return d;
    }

    void assertNoErrors() {
        assertEquals(List.of(), errors());
    }

    /** Asserts a diagnostic's position: 1-based line and column. */
    static void assertAt(Diagnostic d, int line, int column) {
        assertEquals(line, d.span().line(), () -> "line of: " + d.message());
        assertEquals(column, d.span().column(), () -> "column of: " + d.message());
    }

    /** The 1-based column of the first occurrence of {@code part} in the 1-based {@code line} of {@code text}. */
    static int column(String text, int line, String part) {
        String l = text.lines().toList().get(line - 1);
        int i = l.indexOf(part);
        if (i < 0) fail("'" + part + "' is not on line " + line + ": " + l);
        return i + 1;
    }
}
