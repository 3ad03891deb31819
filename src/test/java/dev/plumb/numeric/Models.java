package dev.plumb.numeric;

import static org.junit.jupiter.api.Assertions.assertFalse;

import dev.plumb.lang.Diagnostics;
import dev.plumb.lang.Expr;
import dev.plumb.lang.Parser;
import dev.plumb.lang.SourceFile;
import dev.plumb.model.Checker;
import dev.plumb.model.Model;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;

/** Test input: shipped derivations and inline files, parsed and checked without errors. */
final class Models {
    private Models() {
    }

    static Model of(String text) {
        Diagnostics d = new Diagnostics();
        Model m = Checker.check(Parser.parse(new SourceFile("test.plumb", text), d), d);
        assertFalse(m.hasErrors(), () -> "test input has errors: " + m.diagnostics());
        return m;
    }

    static Model derivation(String name) {
        try {
            Path p = Path.of("derivations", name);
            Diagnostics d = new Diagnostics();
            Model m = Checker.check(Parser.parse(new SourceFile(p.toString(), Files.readString(p)), d), d);
            assertFalse(m.hasErrors(), () -> name + " has errors: " + m.diagnostics());
            return m;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** An expression parsed in the context of a model's file (for quantities to evaluate). */
    static Expr expr(String text) {
        Diagnostics d = new Diagnostics();
        var program = Parser.parse(new SourceFile("q.plumb", "show " + text), d);
        return ((dev.plumb.lang.Stmt.Show) program.statements().get(0)).expr();
    }
}
