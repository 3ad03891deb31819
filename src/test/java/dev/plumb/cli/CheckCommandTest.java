package dev.plumb.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code plumb check}: exit statuses, the compiler-style text and the JSON fields of the design brief. */
class CheckCommandTest {

    private static final Path SPHERE = Path.of("derivations/uniform-sphere.plumb");

    @TempDir
    Path dir;

    @SuppressWarnings("unchecked")
    private static Map<String, Object> json(Run run) {
        return (Map<String, Object>) assertInstanceOf(Map.class, JsonReader.read(run.out()));
    }

    @SuppressWarnings("unchecked")
    private static List<Map<String, Object>> list(Map<String, Object> doc, String key) {
        return (List<Map<String, Object>>) assertInstanceOf(List.class, doc.get(key), key);
    }

    private Path write(String name, String text) throws IOException {
        Path p = dir.resolve(name);
        Files.writeString(p, text);
        return p;
    }

    /** The shipped sphere with {@code /r^2} turned into {@code /r} on the balance relation. */
    private Path wrongBalance() throws IOException {
        List<String> lines = new ArrayList<>(Files.readAllLines(SPHERE));
        int i = 10;
        assertTrue(lines.get(i).startsWith("relation balance:") && lines.get(i).endsWith("/r^2"), lines.get(i));
        lines.set(i, lines.get(i).substring(0, lines.get(i).length() - 2));
        return write("uniform-wrong.plumb", String.join("\n", lines) + "\n");
    }

    @Test
    void shippedUniformSpherePasses() {
        Run run = Run.of("check", "--no-color", SPHERE.toString());
        assertEquals(0, run.status(), run::all);
        assertTrue(run.out().contains("uniform-sphere.plumb  Uniform-density sphere"), run.out());
        assertFalse(run.all().contains(": error:"), run.all());
    }

    @Test
    void jsonHasTheFieldsOfTheDesignBrief() {
        Run run = Run.of("check", "--format", "json", SPHERE.toString());
        assertEquals(0, run.status(), run::all);
        Map<String, Object> doc = json(run);
        assertEquals(SPHERE.toString(), doc.get("file"));
        assertEquals(Boolean.TRUE, doc.get("ok"));
        assertTrue(list(doc, "diagnostics").isEmpty(), doc.get("diagnostics")::toString);
        List<Map<String, Object>> checks = list(doc, "checks");
        List<Map<String, Object>> units = checks.stream().filter(c -> "units".equals(c.get("kind"))).toList();
        assertEquals(6, units.size(), checks::toString);
        for (Map<String, Object> c : checks) {
            for (String key : List.of("kind", "label", "line", "status", "message")) {
                assertTrue(c.containsKey(key), () -> key + " missing in " + c);
            }
        }
        assertTrue(units.stream().allMatch(c -> "holds".equals(c.get("status"))), units::toString);
        Map<String, Object> balance = units.stream().filter(c -> "balance".equals(c.get("label"))).findFirst().orElseThrow();
        assertEquals(11.0, balance.get("line"));
        assertTrue(doc.containsKey("derived") && doc.containsKey("cases"), doc.keySet()::toString);
        // Kept small by default: profile samples only with --profiles (DataExportTest).
        assertTrue(list(doc, "cases").stream().noneMatch(c -> c.containsKey("profiles")), doc.get("cases")::toString);
    }

    @Test
    void droppingAPowerOfRFailsAtThatLine() throws IOException {
        Path wrong = wrongBalance();
        String line = Files.readAllLines(wrong).get(10);
        int column = line.indexOf("-G*m(r)") + 1;
        assertEquals(27, column, "the issue names column 27; the text says " + column);

        Run run = Run.of("check", "--format", "json", wrong.toString());
        assertEquals(1, run.status(), run::all);
        Map<String, Object> doc = json(run);
        assertEquals(Boolean.FALSE, doc.get("ok"));
        List<Map<String, Object>> errors = list(doc, "diagnostics").stream().filter(d -> "error".equals(d.get("severity"))).toList();
        assertEquals(1, errors.size(), errors::toString);
        Map<String, Object> e = errors.get(0);
        assertEquals(11.0, e.get("line"));
        assertEquals((double) column, e.get("column"));
        assertTrue(((String) e.get("message")).contains("the two sides of relation 'balance' have different units"), e.toString());
        Map<String, Object> check = list(doc, "checks").stream()
                .filter(c -> "units".equals(c.get("kind")) && "balance".equals(c.get("label"))).findFirst().orElseThrow();
        assertEquals("fails", check.get("status"));
    }

    @Test
    void wrongUnitsInTextFollowTheGnuConvention() throws IOException {
        Path wrong = wrongBalance();
        Run run = Run.of("check", "--no-color", wrong.toString());
        assertEquals(1, run.status(), run::all);
        assertTrue(run.err().contains(wrong + ":11:27: error: the two sides of relation 'balance' have different units"), run.err());
        assertTrue(run.err().contains("    relation balance: P'(r) = -G*m(r)*rho/r\n" + " ".repeat(4 + 26) + "^^^^^^^^^^^^^\n"),
                run.err());
        assertTrue(run.err().contains("is a 1/r missing on the right"), run.err());
    }

    @Test
    void syntaxErrorExitsTwo() throws IOException {
        Path bad = write("bad.plumb", "param M [kg] > 0\nrelation b: M M\n");
        Run run = Run.of("check", "--format", "json", bad.toString());
        assertEquals(2, run.status(), run::all);
        Map<String, Object> doc = json(run);
        assertEquals(Boolean.FALSE, doc.get("ok"));
        Map<String, Object> d = list(doc, "diagnostics").get(0);
        assertEquals("error", d.get("severity"));
        assertEquals(2.0, d.get("line"));
        assertEquals(15.0, d.get("column"));
    }

    @Test
    void everyBrokenLineIsReportedOnce() throws IOException {
        Path bad = write("three.plumb", "param M [kg] > 0\nparam R [m] > 2\nlet x = M $ R\nshow M in [kg\nshow M\n");
        Run run = Run.of("check", "--format", "json", bad.toString());
        assertEquals(2, run.status(), run::all);
        List<Map<String, Object>> diags = list(json(run), "diagnostics");
        assertEquals(List.of(2.0, 3.0, 4.0), diags.stream().map(d -> d.get("line")).toList(), diags::toString);
        assertEquals(List.of(15.0, 11.0, 11.0), diags.stream().map(d -> d.get("column")).toList(), diags::toString);
    }

    @Test
    void unknownNameOrUnitExitsTwo() throws IOException {
        assertEquals(2, Run.of("check", write("name.plumb", "param M [kg] > 0\nshow M*Q\n").toString()).status());
        assertEquals(2, Run.of("check", write("unit.plumb", "param M [kilogramm] > 0\n").toString()).status());
    }

    @Test
    void missingFileIsASentenceNotAStackTrace() {
        Path missing = dir.resolve("no-such.plumb");
        Run run = Run.of("check", "--no-color", missing.toString());
        assertEquals(2, run.status(), run::all);
        assertTrue(run.all().contains(missing + ": error: no such file"), run::all);
        assertFalse(run.all().contains("Exception"), run::all);
        assertFalse(run.all().contains("\tat "), run::all);
    }

    @Test
    void worstStatusOfSeveralFilesWins() throws IOException {
        Path wrong = wrongBalance();
        Run run = Run.of("check", "--format", "json", SPHERE.toString(), wrong.toString());
        assertEquals(1, run.status(), run::all);
        List<?> docs = assertInstanceOf(List.class, JsonReader.read(run.out()));
        assertEquals(2, docs.size());
        assertEquals(2, Run.of("check", SPHERE.toString(), wrong.toString(), dir.resolve("gone.plumb").toString()).status());
    }

    @Test
    void badOptionsExitTwoWithAHint() {
        Run run = Run.of("check", "--format", "yaml", SPHERE.toString());
        assertEquals(2, run.status(), run::all);
        assertTrue(run.err().contains("try 'plumb check --help'"), run.err());
        assertEquals(2, Run.of("check").status());
        assertFalse(Run.of("check").all().contains("Exception"));
    }
}
