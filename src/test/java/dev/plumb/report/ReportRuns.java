package dev.plumb.report;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;

/**
 * Two runs of {@code plumb report} in every format, each in a JVM of its own, shared by the tests
 * that read reports back: the first over every shipped derivation and example (and a sweep), the
 * second over a few of them, to be compared byte for byte with the first.
 */
final class ReportRuns {
    static final Path ROOT = Path.of("target", "report-runs");
    /** A sequence of models, which no shipped file has: its CSV and plot must be reproducible too. */
    static final Path SWEEP = ROOT.resolve("inputs").resolve("invented-sweep.plumb");
    static final String SWEEP_TEXT = """
            # Invented test data: a family of uniform planets of one radius and growing mass.
            title "Invented sweep of uniform planets"
            param M [kg] > 0
            param R [m] > 0
            coord r [m] from 0 to R
            let rho = M/(4/3*pi*R^3)
            unknown P(r) [Pa]
            relation balance: P'(r) = -G*(4/3*pi*r^3*rho)*rho/r^2
            boundary surface: P(R) = 0
            case base: M = 1 [Mearth], R = 1 [Rearth]
            show rho in [g/cm^3]
            show P(0) in [GPa]
            sweep masses: M from 0.5 [Mearth] to 5 [Mearth] log 5, R = 1 [Rearth]
            """;
    /** The files reported twice: the five of the issue, uncertainties, a scaling failure, a sweep. */
    static final List<Path> TWICE = List.of(Path.of("derivations/uniform-sphere.plumb"), Path.of("derivations/polytrope.plumb"),
            Path.of("derivations/standard-atmosphere-1976.plumb"), Path.of("examples/wrong-moonlet.plumb"),
            Path.of("examples/corvel-core-and-mantle.plumb"), Path.of("examples/ilex-uncertain-mass.plumb"),
            Path.of("examples/cale-wrong-scaling.plumb"), SWEEP);

    /** A run: the folder holding one folder of report files per input, and each input's exit status. */
    record Run(Path folder, Map<Path, Integer> statuses) {
        Path reportOf(Path input) {
            return folder.resolve(ReportBatch.folder(input));
        }
    }

    private static Run first;
    private static Run second;

    private ReportRuns() {
    }

    /** Every derivation and example, and the sweep. */
    static synchronized Run first() throws IOException, InterruptedException {
        if (first == null) {
            List<Path> all = new ArrayList<>();
            all.addAll(plumbFiles(Path.of("derivations")));
            all.addAll(plumbFiles(Path.of("examples")));
            all.add(SWEEP);
            first = run("first", all);
        }
        return first;
    }

    /** {@link #TWICE} again, in another JVM. */
    static synchronized Run second() throws IOException, InterruptedException {
        first();
        if (second == null) second = run("second", TWICE);
        return second;
    }

    static List<Path> plumbFiles(Path dir) throws IOException {
        try (Stream<Path> s = Files.list(dir)) {
            return s.filter(p -> p.toString().endsWith(".plumb")).sorted().toList();
        }
    }

    private static Run run(String name, List<Path> files) throws IOException, InterruptedException {
        Files.createDirectories(SWEEP.getParent());
        Files.writeString(SWEEP, SWEEP_TEXT);
        Path folder = ROOT.resolve(name);
        delete(folder);
        Files.createDirectories(folder);
        List<String> command = new ArrayList<>(List.of(ProcessHandle.current().info().command().orElse("java"), "-Xss16m",
                "-cp", System.getProperty("java.class.path"), ReportBatch.class.getName(), folder.toString()));
        files.forEach(f -> command.add(f.toString()));
        Path log = ROOT.resolve(name + ".log");
        Process p = new ProcessBuilder(command).redirectErrorStream(true).redirectOutput(log.toFile()).start();
        int exit = p.waitFor();
        String out = Files.readString(log, StandardCharsets.UTF_8);
        assertEquals(0, exit, () -> "the report run '" + name + "' stopped: " + out);
        Map<Path, Integer> statuses = new LinkedHashMap<>();
        for (String line : out.split("\n")) {
            if (line.matches("\\d+ .*")) statuses.put(Path.of(line.substring(line.indexOf(' ') + 1)), Integer.parseInt(line.split(" ")[0]));
        }
        assertEquals(files.size(), statuses.size(), () -> "every file reported in run '" + name + "': " + out);
        return new Run(folder, statuses);
    }

    private static void delete(Path dir) throws IOException {
        if (!Files.exists(dir)) return;
        try (Stream<Path> s = Files.walk(dir)) {
            for (Path p : s.sorted(Comparator.reverseOrder()).toList()) Files.delete(p);
        }
    }
}
