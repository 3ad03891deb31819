package dev.plumb.cli;

import static org.junit.jupiter.api.Assertions.assertInstanceOf;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;

/**
 * A derivation text run through {@code plumb check --format json} as a user would run a file, with
 * the case numbers read back in SI. A case that was not solved, or input that was not understood,
 * turns into an assertion failure that quotes plumb's own words.
 */
record CheckedText(String name, Run run, Map<String, Object> root) {

    @SuppressWarnings("unchecked")
    static CheckedText of(String name, String text) {
        try {
            Path dir = Files.createTempDirectory("plumb-test");
            Path file = dir.resolve(name + ".plumb");
            Files.writeString(file, text);
            try {
                Run run = Run.of("check", "--format", "json", file.toString());
                if (run.status() == 2) throw new AssertionError(name + ": plumb could not understand the input:\n" + run.all());
                Object doc = JsonReader.read(run.out());
                return new CheckedText(name, run, (Map<String, Object>) assertInstanceOf(Map.class, doc, run::all));
            } finally {
                Files.deleteIfExists(file);
                Files.deleteIfExists(dir);
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    @SuppressWarnings("unchecked")
    List<Map<String, Object>> list(String key) {
        return (List<Map<String, Object>>) assertInstanceOf(List.class, root.get(key), name + ": " + key);
    }

    @SuppressWarnings("unchecked")
    Map<String, Object> caseRow(String label) {
        Map<String, Object> row = list("cases").stream().filter(c -> label.equals(c.get("label"))).findFirst()
                .orElseThrow(() -> new AssertionError(name + ": no case '" + label + "' in " + root.get("cases")));
        if (row.get("failure") != null) {
            throw new AssertionError(name + ": case '" + label + "' was not solved: " + row.get("failure"));
        }
        return row;
    }

    /** The numeric value of a shown quantity in a case, in SI base units. */
    @SuppressWarnings("unchecked")
    double numeric(String caseLabel, String expr) {
        for (Object q : (List<Object>) caseRow(caseLabel).get("quantities")) {
            Map<String, Object> m = (Map<String, Object>) q;
            if (expr.equals(m.get("expr"))) {
                Object v = m.get("numeric");
                if (v instanceof Double d) return d;
                throw new AssertionError(name + ": " + expr + " in case '" + caseLabel + "' has no numeric value: " + m);
            }
        }
        throw new AssertionError(name + ": no quantity " + expr + " in case '" + caseLabel + "': " + caseRow(caseLabel));
    }
}
