package dev.plumb.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardWatchEventKinds;
import java.nio.file.WatchService;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.TreeMap;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.locks.LockSupport;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code plumb report} stopped at random moments in a child JVM. After a termination signal the
 * output folder holds the complete old set of documents or the complete new one, byte for byte, and
 * nothing else of the run's. After a kill (SIGKILL: nothing runs on the way out) it holds the old
 * set or the new one, or, when the kill fell between two of the final moves, a mix together with
 * the journal of those moves, which the next report into the folder finishes first. The input is
 * never touched, and after the next run no temporary file is left. The two sets are made beforehand
 * by runs in this JVM, so every file of the folder can be told apart as old or new.
 */
class KillDuringReportTest {

    /** An invented pond, in two versions whose every document differs (title and density). */
    private static final String POND = """
            title "Invented: a still pond, %s"
            param rho = %s [kg/m^3]
            param g = 9.80665 [m/s^2]
            coord z [m] from 0 to 10 [m]
            unknown P(z) [Pa]
            relation hydrostatic: P'(z) = rho*g
            boundary top: P(0) = 1 [atm]
            claim bottom: P(10 [m]) = 1 [atm] + rho*g*(10 [m])
            show P(10 [m]) in [kPa]
            """;

    private static final String[] FORMATS = {"--format", "md,json,html"};

    @TempDir
    Path dir;

    @Test
    void aKilledReportLeavesTheOldSetOrTheNewSetAndNoTemporaryFiles() throws Exception {
        Path input = dir.resolve("src").resolve("pond.plumb");
        Files.createDirectories(input.getParent());
        Path out = dir.resolve("out");
        Path reference = dir.resolve("reference");

        Files.writeString(input, POND.formatted("first version", "1000"));
        report(input, out);
        Map<String, byte[]> old = contents(out);
        Files.writeString(input, POND.formatted("second version", "1025"));
        byte[] inputBytes = Files.readAllBytes(input);
        report(input, reference);
        Map<String, byte[]> neu = contents(reference);
        assertTrue(old.size() >= 3 && old.keySet().equals(neu.keySet()), () -> old.keySet() + " / " + neu.keySet());
        for (String name : old.keySet()) assertFalse(Arrays.equals(old.get(name), neu.get(name)), name + " is the same in both versions");

        Path broken = dir.resolve("broken").resolve("pond.plumb");
        Files.createDirectories(broken.getParent());
        Files.writeString(broken, "param rho = = 3\n");
        long seed = System.nanoTime();
        Random random = new Random(seed);
        List<String> outcomes = new ArrayList<>();
        // A kill (SIGKILL) at a random moment of start-up and analysis, two at random moments once writing has
        // begun, and a termination signal (SIGTERM, which the run may answer) once writing has begun.
        for (int k = 0; k < 4; k++) {
            boolean terminate = k == 3;
            restore(out, old);
            boolean finished;
            Process child;
            // Watched from before the child starts, so that its first file is not missed.
            try (WatchService watcher = out.getFileSystem().newWatchService()) {
                out.register(watcher, StandardWatchEventKinds.ENTRY_CREATE, StandardWatchEventKinds.ENTRY_MODIFY);
                child = childReport(input, out);
                if (k == 0) {
                    Thread.sleep(200 + random.nextInt(1500));
                } else {
                    awaitWriting(watcher, child);
                    LockSupport.parkNanos(TimeUnit.MICROSECONDS.toNanos(random.nextInt(15_000)));
                }
                finished = !child.isAlive();
                if (terminate) child.destroy();
                else child.destroyForcibly();
            }
            assertTrue(child.waitFor(60, TimeUnit.SECONDS), "the killed child did not end");

            Map<String, byte[]> now = contents(out);
            String context = "kill " + k + (terminate ? " by SIGTERM" : " by SIGKILL") + " (seed " + seed
                    + ", finished before the kill: " + finished + ")";
            assertArrayEquals(inputBytes, Files.readAllBytes(input), context + ": the input changed");
            String outcome = sameSet(now, old) ? "old" : sameSet(now, neu) ? "new" : null;
            if (finished) assertEquals("new", outcome, context + ": a run that ended must have written the new set");
            if (terminate) {
                assertTrue(outcome != null, () -> context + ": the folder holds a mix: " + describe(now, old, neu));
                assertEquals(List.of(), leftovers(out), context + ": a terminated run leaves nothing of its own behind");
            } else if (outcome == null) {
                // Killed between two moves: a mix is possible only with the journal of the moves, which the next
                // report into the folder finishes before anything else, even one that writes nothing.
                List<String> left = leftovers(out);
                assertTrue(left.stream().anyMatch(n -> n.endsWith(".journal")),
                        () -> context + ": a mix without a journal: " + describe(now, old, neu) + " " + left);
                for (Map.Entry<String, byte[]> f : now.entrySet()) {
                    assertTrue(Arrays.equals(f.getValue(), old.get(f.getKey())) || Arrays.equals(f.getValue(), neu.get(f.getKey())),
                            () -> context + ": a document that is neither old nor new: " + describe(now, old, neu));
                }
                Run next = Run.of("report", broken.toString(), "--out", out.toString());
                assertEquals(2, next.status(), next::all);
                Map<String, byte[]> finishedSet = contents(out);
                assertTrue(sameSet(finishedSet, neu), () -> context + ": not finished by the next run: " + describe(finishedSet, old, neu));
                assertEquals(List.of(), leftovers(out));
                outcome = "mix finished by the next run";
            }
            outcomes.add(outcome + (leftovers(out).isEmpty() ? "" : " + " + leftovers(out).size() + " temporary"));
        }
        System.out.println("KillDuringReportTest: outcomes " + outcomes + " (seed " + seed + ")");

        // The next run replaces whatever is there with the whole new set and clears what a killed run left.
        report(input, out);
        Map<String, byte[]> after = contents(out);
        assertTrue(sameSet(after, neu), () -> describe(after, old, neu));
        assertEquals(List.of(), leftovers(out));
        assertEquals(List.of(), leftovers(input.getParent()));
        assertArrayEquals(inputBytes, Files.readAllBytes(input));
    }

    private static void report(Path input, Path out) {
        List<String> args = new ArrayList<>(List.of("report", input.toString(), "--out", out.toString(), "--symbolic-timeout", "1"));
        args.addAll(List.of(FORMATS));
        Run run = Run.of(args.toArray(String[]::new));
        assertEquals(0, run.status(), run::all);
    }

    /** The same report in a JVM of its own, which can be killed without harm to this one. */
    private static Process childReport(Path input, Path out) throws IOException {
        String java = ProcessHandle.current().info().command()
                .orElse(Path.of(System.getProperty("java.home"), "bin", "java").toString());
        List<String> command = new ArrayList<>(List.of(java, "-XX:+UseSerialGC", "-XX:TieredStopAtLevel=1",
                "-cp", System.getProperty("java.class.path"), "dev.plumb.cli.Main",
                "report", input.toString(), "--out", out.toString(), "--symbolic-timeout", "1"));
        command.addAll(List.of(FORMATS));
        return new ProcessBuilder(command).redirectErrorStream(true).redirectOutput(ProcessBuilder.Redirect.DISCARD).start();
    }

    /** Waits until the child has begun writing into the folder (a file created or changed there), or has ended. */
    private static void awaitWriting(WatchService watcher, Process child) throws InterruptedException {
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(240);
        while (child.isAlive()) {
            if (watcher.poll(100, TimeUnit.MILLISECONDS) != null) return;
            if (System.nanoTime() > deadline) fail("the child report neither wrote nor ended in 240 s");
        }
    }

    /** What a run writes besides the documents: temporary files and journals, all named .plumb-*. */
    private static List<String> leftovers(Path folder) throws IOException {
        try (Stream<Path> files = Files.list(folder)) {
            return files.map(p -> p.getFileName().toString()).filter(n -> n.startsWith(".plumb-")).sorted().toList();
        }
    }

    /** The documents of a folder by name, temporary files left out. */
    private static Map<String, byte[]> contents(Path folder) throws IOException {
        Map<String, byte[]> m = new TreeMap<>();
        try (Stream<Path> files = Files.list(folder)) {
            for (Path p : files.toList()) {
                String name = p.getFileName().toString();
                if (!name.startsWith(".plumb-")) m.put(name, Files.readAllBytes(p));
            }
        }
        return m;
    }

    private static void restore(Path folder, Map<String, byte[]> set) throws IOException {
        try (Stream<Path> files = Files.list(folder)) {
            for (Path p : files.toList()) if (!set.containsKey(p.getFileName().toString())) Files.delete(p);
        }
        for (Map.Entry<String, byte[]> f : set.entrySet()) Files.write(folder.resolve(f.getKey()), f.getValue());
    }

    private static boolean sameSet(Map<String, byte[]> a, Map<String, byte[]> b) {
        if (!a.keySet().equals(b.keySet())) return false;
        for (String name : a.keySet()) if (!Arrays.equals(a.get(name), b.get(name))) return false;
        return true;
    }

    private static String describe(Map<String, byte[]> now, Map<String, byte[]> old, Map<String, byte[]> neu) {
        List<String> parts = new ArrayList<>();
        for (Map.Entry<String, byte[]> f : now.entrySet()) {
            String which = Arrays.equals(f.getValue(), old.get(f.getKey())) ? "old"
                    : Arrays.equals(f.getValue(), neu.get(f.getKey())) ? "new" : "neither (" + f.getValue().length + " bytes)";
            parts.add(f.getKey() + ": " + which);
        }
        return String.join(", ", parts);
    }
}
