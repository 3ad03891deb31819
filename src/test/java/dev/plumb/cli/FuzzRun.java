package dev.plumb.cli;

import java.io.IOException;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;

/**
 * The long fuzzing run, outside the test suite: the same inputs as {@link FuzzTest}, as many as asked,
 * with counts of exit statuses, hangs and exceptions, and every failing input kept in a folder (inputs slower
 * than 10 s by the clock in its slow/ subfolder). {@code guard}
 * is the CPU time in seconds after which an input counts as a hang (or ten times that by the clock).
 *
 * <pre>
 * java -Xss16m -cp target/test-classes:target/classes:$(cat target/cp.txt) dev.plumb.cli.FuzzRun \
 *     [count=100000] [seed=1] [from=0] [mutated=0.1] [written=0.1] [guard=60] [timeout=0.5] [keep=target/fuzz-failures]
 * </pre>
 */
public final class FuzzRun {

    public static void main(String[] args) throws IOException {
        Map<String, String> o = new TreeMap<>();
        for (String a : args) {
            int eq = a.indexOf('=');
            if (eq < 0) throw new IllegalArgumentException("arguments are name=value, found " + a);
            o.put(a.substring(0, eq), a.substring(eq + 1));
        }
        long count = Long.parseLong(o.getOrDefault("count", "100000"));
        long seed = Long.parseLong(o.getOrDefault("seed", "1"));
        long from = Long.parseLong(o.getOrDefault("from", "0"));
        FuzzInputs.Mix mix = new FuzzInputs.Mix(Double.parseDouble(o.getOrDefault("mutated", Double.toString(FuzzTest.MIX.mutated()))),
                Double.parseDouble(o.getOrDefault("written", Double.toString(FuzzTest.MIX.written()))));
        long guard = Long.parseLong(o.getOrDefault("guard", "60"));
        double timeout = Double.parseDouble(o.getOrDefault("timeout", Double.toString(FuzzTest.SYMBOLIC_TIMEOUT)));
        Path keep = Path.of(o.getOrDefault("keep", "target/fuzz-failures"));

        FuzzInputs inputs = new FuzzInputs(FuzzInputs.shippedDerivations(), seed);
        Map<Integer, Long> statuses = new TreeMap<>();
        Map<String, Long> kinds = new TreeMap<>();
        Map<String, Double> kindSeconds = new TreeMap<>();
        long failing = 0, slow = 0;
        double slowest = 0, total = 0;
        long start = System.nanoTime();
        try (Fuzzing fuzzing = new Fuzzing(timeout, guard)) {
            for (long i = from; i < from + count; i++) {
                Fuzzing.Outcome out = fuzzing.run(inputs.input(i, mix));
                statuses.merge(out.status(), 1L, Long::sum);
                String kind = out.input().kind().startsWith("mutated") ? "mutated" : out.input().kind();
                kinds.merge(kind, 1L, Long::sum);
                kindSeconds.merge(kind, out.seconds(), Double::sum);
                total += out.seconds();
                slowest = Math.max(slowest, out.seconds());
                if (out.seconds() > 10) {
                    // Slow but correct inputs are kept too (under slow/), to be timed again on a quiet machine.
                    slow++;
                    Path f = Fuzzing.keep(out, keep.resolve("slow"));
                    System.out.printf(Locale.ROOT, "SLOW %d (%s): %.1f s -> %s%n", i, out.input().kind(), out.seconds(), f);
                }
                if (!out.ok()) {
                    failing++;
                    Path f = Fuzzing.keep(out, keep);
                    System.out.println("FAIL " + i + " (" + out.input().kind() + "): " + out.problems() + " -> " + f);
                }
                long done = i - from + 1;
                if (done % 500 == 0 || done == count) {
                    System.out.printf(Locale.ROOT, "%d inputs, %.0f s (process CPU %.0f s): statuses %s (-1 hang, -2 exception), failing %d,"
                                    + " over 10 s %d, slowest %.1f s, by kind %s, seconds by kind %s%n",
                            done, (System.nanoTime() - start) / 1e9, cpuSeconds(), statuses, failing, slow, slowest, kinds, rounded(kindSeconds));
                }
            }
        }
        System.out.printf(Locale.ROOT, "done: %d inputs from %d (seed %d), %.0f s of runs; statuses %s; failing %d%n",
                count, from, seed, total, statuses, failing);
        System.exit(failing == 0 ? 0 : 1);
    }

    /** CPU time of the whole process, every thread: less dependent on other work on the machine than the clock. */
    static double cpuSeconds() {
        var os = java.lang.management.ManagementFactory.getOperatingSystemMXBean();
        return os instanceof com.sun.management.OperatingSystemMXBean sun ? sun.getProcessCpuTime() / 1e9 : Double.NaN;
    }

    private static Map<String, Long> rounded(Map<String, Double> seconds) {
        Map<String, Long> out = new TreeMap<>();
        seconds.forEach((k, v) -> out.put(k, Math.round(v)));
        return out;
    }
}
