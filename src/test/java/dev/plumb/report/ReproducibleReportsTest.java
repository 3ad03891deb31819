package dev.plumb.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;

/**
 * A report is a function of its input: two runs, each in a JVM of its own, write the same files
 * with the same bytes, in every format (Markdown, LaTeX, HTML, JSON, the CSV data and every figure).
 */
class ReproducibleReportsTest {

    @Test
    void twoRunsInSeparateJvmsWriteTheSameFilesByteForByte() throws Exception {
        ReportRuns.Run one = ReportRuns.first();
        ReportRuns.Run two = ReportRuns.second();
        for (Path input : ReportRuns.TWICE) {
            assertEquals(one.statuses().get(input), two.statuses().get(input), "exit status of " + input);
            assertTrue(one.statuses().get(input) <= 1, () -> input + " was not reported: status " + one.statuses().get(input));
            Path a = one.reportOf(input);
            Path b = two.reportOf(input);
            List<String> names = names(a);
            assertEquals(names, names(b), "the files written for " + input);
            String base = ReportBatch.folder(input);
            for (String ext : List.of(".md", ".tex", ".html", ".json")) {
                assertTrue(names.contains(base + ext), () -> base + ext + " among " + names);
            }
            assertTrue(names.stream().anyMatch(n -> n.startsWith("case-") && n.endsWith(".csv")), () -> "case data among " + names);
            for (String name : names) same(a.resolve(name), b.resolve(name));
        }
        List<String> sweep = names(one.reportOf(ReportRuns.SWEEP));
        assertTrue(sweep.contains("sweep-masses.csv") && sweep.contains("profile-base-P.csv"), sweep::toString);
    }

    private static List<String> names(Path dir) throws IOException {
        try (Stream<Path> s = Files.list(dir)) {
            return s.map(p -> p.getFileName().toString()).sorted().toList();
        }
    }

    private static void same(Path a, Path b) throws IOException {
        byte[] x = Files.readAllBytes(a);
        byte[] y = Files.readAllBytes(b);
        int n = Math.min(x.length, y.length);
        for (int i = 0; i < n; i++) {
            if (x[i] != y[i]) fail(a.getFileName() + " differs from byte " + i + ": " + around(x, i) + " / " + around(y, i));
        }
        assertEquals(x.length, y.length, () -> a.getFileName() + ": the same up to the end of the shorter file, lengths differ");
    }

    private static String around(byte[] bytes, int i) {
        int from = Math.max(0, i - 40);
        int to = Math.min(bytes.length, i + 40);
        return "'" + new String(bytes, from, to - from, StandardCharsets.UTF_8).replace("\n", "\\n") + "'";
    }
}
