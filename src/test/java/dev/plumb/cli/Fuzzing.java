package dev.plumb.cli;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.TimeoutException;
import java.util.regex.Pattern;

/**
 * Runs fuzz inputs through {@link Main#run} in this process, one at a time on a worker thread with a
 * wall-clock guard against a hang, and judges each run by what any input must give: an exit status of
 * 0, 1 or 2, no trace of an internal failure, and a file, line and column on every error.
 */
final class Fuzzing implements AutoCloseable {

    /** What one input did: its exit status (-1 for a hang, -2 for an exception out of Main.run) and what is wrong. */
    record Outcome(FuzzInputs.Input input, int status, double seconds, List<String> problems, String output) {
        boolean ok() {
            return problems.isEmpty();
        }
    }

    /** Text that only an internal failure prints: a stack trace, an exception's name, the internal-error note. */
    private static final List<Pattern> FORBIDDEN = List.of(
            Pattern.compile("internal error"), Pattern.compile("(?i)please report"),
            Pattern.compile("\\bat dev\\.plumb"), Pattern.compile("\\bat (java|org|picocli)\\."),
            Pattern.compile("Exception"), Pattern.compile("java\\.lang"), Pattern.compile("[a-z]Error\\b"));

    private final Path dir;
    private final double symbolicTimeout;
    private final long guardSeconds;
    private ExecutorService worker = newWorker();

    Fuzzing(double symbolicTimeout, long guardSeconds) {
        try {
            this.dir = Files.createTempDirectory("plumb-fuzz");
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        this.symbolicTimeout = symbolicTimeout;
        this.guardSeconds = guardSeconds;
    }

    private static ExecutorService newWorker() {
        return Executors.newSingleThreadExecutor(r -> {
            // The JVM's default stack (-Xss), as the command's own main thread has.
            Thread t = new Thread(r, "fuzz-worker");
            t.setDaemon(true);
            return t;
        });
    }

    Outcome run(FuzzInputs.Input input) {
        Path file = dir.resolve("fuzz.plumb");
        try {
            Files.write(file, input.bytes());
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        List<String> args = new ArrayList<>(List.of("check", "--symbolic-timeout", Double.toString(symbolicTimeout)));
        args.addAll(input.args());
        args.add(file.toString());
        long start = System.nanoTime();
        double cpuStart = FuzzRun.cpuSeconds();
        Future<Run> future = worker.submit(() -> Run.of(args.toArray(String[]::new)));
        Run run;
        try {
            while (true) {
                try {
                    run = future.get(1, TimeUnit.SECONDS);
                    break;
                } catch (TimeoutException e) {
                    // A hang is judged by the CPU time the process spends on the input, so that a machine
                    // shared with other builds (its load at 30 on 2 cores) does not turn slow into hung; the
                    // clock, at ten times as long, catches an input that waits forever without computing.
                    double cpu = FuzzRun.cpuSeconds() - cpuStart, wall = seconds(start);
                    if (cpu > guardSeconds || wall > 10.0 * guardSeconds) {
                        future.cancel(true);
                        // The stuck thread cannot be stopped from here; later inputs get a fresh worker.
                        worker.shutdownNow();
                        worker = newWorker();
                        return new Outcome(input, -1, wall, List.of(String.format(Locale.ROOT,
                                "no answer after %.0f s of CPU time and %.0f s by the clock (a hang)", cpu, wall)), "");
                    }
                }
            }
        } catch (ExecutionException e) {
            return new Outcome(input, -2, seconds(start), List.of("Main.run threw " + e.getCause()), "");
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException(e);
        }
        return new Outcome(input, run.status(), seconds(start), problems(run, file.toString(), input.args().contains("json")), run.all());
    }

    /** Everything wrong with one run; empty when the run is as every input's run must be. */
    static List<String> problems(Run run, String path, boolean json) {
        List<String> problems = new ArrayList<>();
        if (run.status() < 0 || run.status() > 2) problems.add("exit status " + run.status());
        for (Pattern p : FORBIDDEN) {
            if (p.matcher(run.all()).find()) problems.add("output contains '" + p.pattern() + "'");
        }
        Pattern located = Pattern.compile("^" + Pattern.quote(path) + ":[1-9]\\d*:[1-9]\\d*: error: ");
        boolean anyError = false;
        for (String line : run.all().split("\n", -1)) {
            // Quoted source lines and details are indented; a diagnostic's first line is not.
            if (line.startsWith(" ") || !line.contains("error:")) continue;
            anyError = true;
            if (!located.matcher(line).find()) problems.add("an error without file:line:col: " + line);
        }
        if (json) anyError |= jsonProblems(run.out(), problems);
        if (anyError && run.status() == 0) problems.add("an error was printed but the exit status is 0");
        return problems;
    }

    /** Checks the JSON document: it parses, and every error diagnostic has a line and column. */
    @SuppressWarnings("unchecked")
    private static boolean jsonProblems(String out, List<String> problems) {
        Object doc;
        try {
            doc = JsonReader.read(out.strip());
        } catch (RuntimeException e) {
            problems.add("the JSON does not parse: " + e.getMessage());
            return false;
        }
        boolean anyError = false;
        if (!(doc instanceof Map<?, ?> root) || !(root.get("diagnostics") instanceof List<?> diagnostics)) {
            problems.add("the JSON has no diagnostics list");
            return false;
        }
        for (Object o : diagnostics) {
            Map<String, Object> d = (Map<String, Object>) o;
            if (!"error".equals(d.get("severity"))) continue;
            anyError = true;
            if (!(d.get("line") instanceof Double l && l >= 1 && d.get("column") instanceof Double c && c >= 1)) {
                problems.add("a JSON error without line and column: " + d);
            }
        }
        return anyError;
    }

    private static double seconds(long start) {
        return (System.nanoTime() - start) / 1e9;
    }

    /** A failing input written where it can be read and run again by hand. */
    static Path keep(Outcome o, Path folder) throws IOException {
        Files.createDirectories(folder);
        Path f = folder.resolve(String.format(Locale.ROOT, "fuzz-%d.plumb", o.input().index()));
        Files.write(f, o.input().bytes());
        Files.writeString(folder.resolve(f.getFileName() + ".txt"), o.input().kind() + " " + o.input().args()
                + "\nstatus " + o.status() + " in " + String.format(Locale.ROOT, "%.1f", o.seconds()) + " s\n"
                + String.join("\n", o.problems()) + "\n\n" + o.output());
        return f;
    }

    @Override
    public void close() {
        worker.shutdownNow();
        try (var files = Files.list(dir)) {
            for (Path f : files.toList()) Files.deleteIfExists(f);
            Files.deleteIfExists(dir);
        } catch (IOException e) {
            // A temporary folder left behind is not worth failing a run over.
        }
    }
}
