package dev.plumb.cli;

import static dev.plumb.cli.Codata2018.C;
import static dev.plumb.cli.Codata2018.H;
import static dev.plumb.cli.Codata2018.K_B;
import static dev.plumb.cli.Codata2018.M_U;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.DynamicTest;
import org.junit.jupiter.api.TestFactory;
import org.junit.jupiter.api.io.TempDir;

/**
 * Every shipped derivation gives the same numbers when definitions it never uses are appended: a
 * constant built from built-ins, a function of the file's own coordinate, and a `show` of each. Case
 * numbers, expect values and verdicts must stay as they were (exactly, or within 1e-12 relative);
 * the appended quantities must come out right too.
 */
class UnrelatedLetMatrixTest {

    // coord NAME [unit]? from A to B   # comment?
    private static final Pattern COORD =
            Pattern.compile("(?m)^coord\\s+(\\w+)(?:\\s*\\[[^\\]]*\\])?\\s+from\\s+(.+?)\\s+to\\s+(.+?)\\s*(?:#.*)?$");

    // Second radiation constant c2 = h c / k_B = 1.438776877e-2 m K (CODATA 2018; exact, shown to ten figures).
    private static final double C2 = 1.438776877e-2;

    static String augmented(String text) {
        StringBuilder s = new StringBuilder(text);
        if (!text.endsWith("\n")) s.append('\n');
        s.append("# unrelated lines appended by the test\n");
        s.append("let T_unrelated = h*c/k_B\n");
        Matcher m = COORD.matcher(text);
        if (m.find()) {
            String x = m.group(1), end = m.group(3);
            s.append("let extra(").append(x).append(") = k_B*m_u*").append(x).append("^2\n");
            s.append("show extra(").append(end).append(")/(").append(end).append(")^2\n");
        }
        s.append("show T_unrelated\n");
        return s.toString();
    }

    @SuppressWarnings("unchecked")
    static List<Map<String, Object>> checkAll(List<Path> files) {
        List<String> args = new ArrayList<>(List.of("check", "--format", "json"));
        files.forEach(f -> args.add(f.toString()));
        Run run = Run.of(args.toArray(String[]::new));
        Object doc = JsonReader.read(run.out());
        return (List<Map<String, Object>>) assertInstanceOf(List.class, doc, run::all);
    }

    @TestFactory
    Stream<DynamicTest> everyShippedDerivationGivesTheSameNumbers(@TempDir Path dir) throws IOException {
        List<Path> shipped;
        try (Stream<Path> s = Files.list(Path.of("derivations"))) {
            shipped = s.filter(p -> p.toString().endsWith(".plumb")).sorted().toList();
        }
        assertTrue(shipped.size() >= 10, "expected the shipped library under derivations/, found " + shipped);
        List<Path> copies = new ArrayList<>();
        for (Path p : shipped) {
            Path copy = dir.resolve(p.getFileName());
            Files.writeString(copy, augmented(Files.readString(p)));
            copies.add(copy);
        }
        List<Map<String, Object>> before = checkAll(shipped), after = checkAll(copies);
        return java.util.stream.IntStream.range(0, shipped.size()).mapToObj(i -> DynamicTest.dynamicTest(
                shipped.get(i).getFileName().toString(), () -> compare(shipped.get(i).toString(), before.get(i), after.get(i))));
    }

    @SuppressWarnings("unchecked")
    private static List<Map<String, Object>> list(Map<String, Object> doc, String key) {
        return (List<Map<String, Object>>) doc.get(key);
    }

    private static void compare(String file, Map<String, Object> before, Map<String, Object> after) {
        for (Map<String, Object> d : list(after, "diagnostics")) {
            assertTrue(!"error".equals(d.get("severity")), () -> file + " with unrelated lines appended: " + d);
        }
        for (Map<String, Object> c : list(before, "checks")) {
            Map<String, Object> a = list(after, "checks").stream().filter(x -> Objects.equals(x.get("kind"), c.get("kind"))
                    && Objects.equals(x.get("label"), c.get("label")) && Objects.equals(x.get("line"), c.get("line")))
                    .findFirst().orElseThrow(() -> new AssertionError(file + ": check lost after appending: " + c));
            // A symbolic verdict may be undecided on one run and decided on the next when the machine is busy (a time
            // limit); holds and fails must never trade places, and numeric verdicts must not move at all.
            boolean symbolic = !"expect".equals(c.get("kind")) && !"boundary".equals(c.get("kind"));
            boolean timing = symbolic && ("undecided".equals(c.get("status")) || "undecided".equals(a.get("status")));
            if (!timing) {
                assertEquals(c.get("status"), a.get("status"), () -> file + ": verdict changed\n before " + c + "\n after  " + a);
            }
            same(file + ": " + c.get("kind") + " " + c.get("label"), c.get("numeric"), a.get("numeric"));
        }
        for (Map<String, Object> c : list(after, "checks")) {
            if (list(before, "checks").stream().noneMatch(x -> Objects.equals(x.get("line"), c.get("line")))) {
                assertEquals("holds", c.get("status"), () -> file + ": a check on an appended line does not hold: " + c);
            }
        }
        List<Map<String, Object>> casesBefore = list(before, "cases"), casesAfter = list(after, "cases");
        assertEquals(casesBefore.size(), casesAfter.size(), file + ": number of cases");
        for (int i = 0; i < casesBefore.size(); i++) {
            Map<String, Object> b = casesBefore.get(i), a = casesAfter.get(i);
            String where = file + ": case " + b.get("label");
            assertEquals(b.get("label"), a.get("label"), where);
            assertEquals(b.get("failure") == null, a.get("failure") == null, () -> where + ": appending unrelated lines changed"
                    + " whether it is solved\n before: " + Objects.requireNonNullElse(b.get("failure"), "solved")
                    + "\n after:  " + Objects.requireNonNullElse(a.get("failure"), "solved"));
            for (Map<String, Object> q : list(b, "quantities")) {
                Map<String, Object> qa = list(a, "quantities").stream().filter(x -> Objects.equals(x.get("expr"), q.get("expr")))
                        .findFirst().orElseThrow(() -> new AssertionError(where + ": quantity lost after appending: " + q));
                same(where + ", " + q.get("expr") + " numeric", q.get("numeric"), qa.get("numeric"));
                same(where + ", " + q.get("expr") + " closed form", q.get("closed_form"), qa.get("closed_form"));
            }
            if (a.get("failure") == null) appendedQuantitiesAreRight(where, list(a, "quantities"));
        }
        assertEquals(before.get("exit_status"), after.get("exit_status"), file + ": exit status changed");
    }

    private static void appendedQuantitiesAreRight(String where, List<Map<String, Object>> quantities) {
        for (Map<String, Object> q : quantities) {
            String expr = (String) q.get("expr");
            if (expr.startsWith("T_unrelated")) {
                double v = (Double) q.get("numeric");
                assertEquals(C2, v, 1e-9 * C2, where + ": h*c/k_B should be the second radiation constant (m K)");
                assertEquals(H * C / K_B, v, 1e-14 * v, where + ": h*c/k_B from CODATA 2018");
            } else if (expr.startsWith("extra(")) {
                double v = (Double) q.get("numeric");
                assertEquals(K_B * M_U, v, 1e-14 * K_B * M_U, () -> where + ": " + expr + " should be k_B*m_u");
            }
        }
        assertTrue(quantities.stream().anyMatch(q -> ((String) q.get("expr")).startsWith("T_unrelated")),
                () -> where + ": the appended show T_unrelated is missing: " + quantities);
    }

    /** Equal, or within 1e-12 relative; both absent counts as equal. */
    private static void same(String what, Object before, Object after) {
        if (before == null && after == null) return;
        assertTrue(before instanceof Double && after instanceof Double, () -> what + ": " + before + " then " + after);
        double b = (Double) before, a = (Double) after;
        if (a == b) return;
        assertEquals(b, a, 1e-12 * Math.max(Math.abs(a), Math.abs(b)), () -> what + " changed by " + (a / b - 1) + " relative");
    }
}
