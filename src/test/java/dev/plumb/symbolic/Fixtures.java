package dev.plumb.symbolic;

import static org.junit.jupiter.api.Assertions.assertFalse;

import dev.plumb.lang.Diagnostics;
import dev.plumb.lang.Parser;
import dev.plumb.lang.Program;
import dev.plumb.lang.SourceFile;
import dev.plumb.model.Check;
import dev.plumb.model.Checker;
import dev.plumb.model.Model;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;

/** Parses, checks and analyses plumb text for the tests. */
final class Fixtures {
    private Fixtures() {
    }

    static Model model(String path, String text) {
        Diagnostics d = new Diagnostics();
        Program p = Parser.parse(new SourceFile(path, text), d);
        Model m = Checker.check(p, d);
        assertFalse(m.hasErrors(), () -> "errors in " + path + ": " + m.diagnostics());
        return m;
    }

    /** As {@link #model}, for a file whose only errors are failed unit checks. */
    static Model modelWithUnitErrors(String path, String text) {
        Diagnostics d = new Diagnostics();
        Model m = Checker.check(Parser.parse(new SourceFile(path, text), d), d);
        assertFalse(d.hasInputErrors(), () -> "input errors in " + path + ": " + m.diagnostics());
        return m;
    }

    static Model file(String path) {
        try {
            return model(path, Files.readString(Path.of(path)));
        } catch (IOException e) {
            throw new AssertionError(e);
        }
    }

    static SymbolicResult analyze(Model m) {
        return SymbolicEngine.analyze(m, SymbolicOptions.defaults());
    }

    static Check check(SymbolicResult r, String label) {
        return r.checks().stream().filter(c -> c.label().equals(label)).findFirst()
                .orElseThrow(() -> new AssertionError("no check " + label + " in " + r.checks()));
    }

    static Derived derived(SymbolicResult r, String expr) {
        return r.derived().stream().filter(d -> d.expr().equals(expr)).findFirst()
                .orElseThrow(() -> new AssertionError("nothing derived for " + expr + " in " + r.derived() + "; notes " + r.notes()));
    }
}
