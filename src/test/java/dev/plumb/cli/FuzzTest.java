package dev.plumb.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Fuzzing through the command line's entry point: mutated shipped derivations and random streams of the
 * language's words. Whatever the input, the run ends with exit status 0, 1 or 2, prints no trace of an
 * internal failure, and locates every error at a file, line and column. The inputs are fixed (a seeded
 * loop, the same on every run); {@code -Dplumb.fuzz.count=N} and {@code -Dplumb.fuzz.seed=S} run
 * others, and {@link FuzzRun} runs a long batch outside the suite.
 */
class FuzzTest {

    /** Symbolic work per call is cut short: the fuzz is after crashes and hangs, not after verdicts. */
    static final double SYMBOLIC_TIMEOUT = 0.5;
    /**
     * Most inputs are streams of random words, cheap and stopped by the parser or the checker; mutated and
     * freshly written derivations reach the symbolic and numeric stages more often, and cost more.
     */
    static final FuzzInputs.Mix MIX = new FuzzInputs.Mix(0.05, 0.05);
    /**
     * A run that takes this much CPU time, or ten times as long by the clock, is a hang: a quiet machine
     * answers any of these inputs in seconds.
     */
    private static final long GUARD_SECONDS = 60;

    @Test
    void seededInputsNeverCrashHangOrLoseTheirPlace() throws IOException {
        long count = Long.getLong("plumb.fuzz.count", 2000);
        long seed = Long.getLong("plumb.fuzz.seed", 20240601);
        FuzzInputs inputs = new FuzzInputs(FuzzInputs.shippedDerivations(), seed);
        List<String> failures = new ArrayList<>();
        java.util.Map<Integer, Integer> statuses = new java.util.TreeMap<>();
        long start = System.nanoTime();
        double cpu = FuzzRun.cpuSeconds();
        try (Fuzzing fuzzing = new Fuzzing(SYMBOLIC_TIMEOUT, GUARD_SECONDS)) {
            for (long i = 0; i < count && failures.size() < 10; i++) {
                Fuzzing.Outcome out = fuzzing.run(inputs.input(i, MIX));
                statuses.merge(out.status(), 1, Integer::sum);
                if (!out.ok()) {
                    Path kept = Fuzzing.keep(out, Path.of("target", "fuzz-failures"));
                    failures.add("input " + i + " (" + out.input().kind() + "), kept as " + kept + ": " + out.problems());
                }
            }
        }
        System.out.printf(java.util.Locale.ROOT, "fuzz: %d inputs (seed %d) in %.0f s, process CPU %.0f s; exit statuses %s%n",
                count, seed, (System.nanoTime() - start) / 1e9, FuzzRun.cpuSeconds() - cpu, statuses);
        assertTrue(failures.isEmpty(), () -> "seed " + seed + ":\n" + String.join("\n", failures));
    }

    /** Inputs with which the fuzzing found a defect, cut down by hand, judged as every fuzz input is. */
    @ParameterizedTest
    @ValueSource(strings = {
        // The algebra system's overflow reached the user as the name of a Java exception class.
        "param a > 0\nstep c0: tanh(7.3e22) = a\n",
        // A claimed value of 0 where the numeric value is not: the relative difference unboxed a null.
        "param a = 2\nclaim z: a = 0\n",
        // A sample value with a million digits was written out and read back digit by digit: a hang.
        "param a > 0\nclaim c: exp(a)^1e6 = a\n",
    })
    void foundByFuzzing(String text) {
        try (Fuzzing fuzzing = new Fuzzing(SYMBOLIC_TIMEOUT, GUARD_SECONDS)) {
            Fuzzing.Outcome out = fuzzing.run(new FuzzInputs.Input(0, "found before", text.getBytes(StandardCharsets.UTF_8),
                    List.of("--no-color")));
            assertTrue(out.ok(), () -> out.problems() + "\n" + out.output());
        }
    }

    @Test
    void theGeneratorIsRepeatableAndMakesEveryKind() {
        FuzzInputs a = new FuzzInputs(FuzzInputs.shippedDerivations(), 7);
        FuzzInputs b = new FuzzInputs(FuzzInputs.shippedDerivations(), 7);
        java.util.Set<String> kinds = new java.util.TreeSet<>();
        for (long i = 0; i < 200; i++) {
            FuzzInputs.Input x = a.input(i, new FuzzInputs.Mix(0.3, 0.3));
            assertEquals(x.text(), b.input(i, new FuzzInputs.Mix(0.3, 0.3)).text(), "input " + i);
            kinds.add(x.kind().split(" ")[0]);
        }
        assertEquals(java.util.Set.of("mutated", "written", "tokens"), kinds);
    }

    /** The judge itself: each thing it must catch, written out by hand, is caught; a clean run passes. */
    @Test
    void theJudgeCatchesWhatItLooksFor() {
        String f = "/tmp/x/fuzz.plumb";
        assertTrue(Fuzzing.problems(new Run(0, "/tmp/x/fuzz.plumb\n  claim c holds\n", ""), f, false).isEmpty());
        assertTrue(Fuzzing.problems(new Run(2, "", f + ":3:7: error: 'x' is not defined\n    claim c: x = 1\n"), f, false).isEmpty());
        assertFalse(Fuzzing.problems(new Run(3, "", "plumb: internal error: java.lang.ClassCastException"), f, false).isEmpty());
        assertFalse(Fuzzing.problems(new Run(1, "  note: the numeric stage stopped (NullPointerException). Please report this.", ""),
                f, false).isEmpty());
        assertFalse(Fuzzing.problems(new Run(2, "", "\tat dev.plumb.lang.Parser.expression(Parser.java:12)\n"), f, false).isEmpty());
        assertFalse(Fuzzing.problems(new Run(2, "", f + ": error: the file is not UTF-8 text\n"), f, false).isEmpty());
        assertFalse(Fuzzing.problems(new Run(0, "", f + ":1:1: error: something\n"), f, false).isEmpty(), "an error with exit 0");
        assertFalse(Fuzzing.problems(new Run(2, "{\"diagnostics\": [{\"severity\": \"error\", \"line\": 0, \"column\": 0}]}", ""),
                f, true).isEmpty());
        assertFalse(Fuzzing.problems(new Run(2, "{\"diagnostics\": [", ""), f, true).isEmpty(), "JSON that does not parse");
    }
}
