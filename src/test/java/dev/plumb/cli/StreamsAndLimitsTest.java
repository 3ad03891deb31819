package dev.plumb.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Where `check` writes what, the run's own time limit, and one message per mistake. */
class StreamsAndLimitsTest {

    @TempDir
    Path dir;

    private Path write(String name, String text) throws IOException {
        return Files.writeString(dir.resolve(name), text);
    }

    @Test
    void diagnosticsGoToStandardErrorAndResultsToStandardOutput() throws IOException {
        Path f = write("split.plumb", "param M [kg] > 0\nparam R [m] > 0\nclaim same: M/R = M/R\nclaim wrong: M = R\n");
        Run run = Run.of("check", "--no-color", f.toString());
        assertEquals(1, run.status(), run::all);
        assertTrue(run.err().contains(f + ":4:"), run.err());
        assertFalse(run.out().contains(": error:"), run.out());
        assertTrue(run.out().contains("claim     same"), run.out());
        assertFalse(run.err().contains("claim     same"), run.err());
    }

    @Test
    void aTimeoutThatHasPassedLeavesTheStagesUndecidedAndFailsTheRun() throws IOException {
        Path f = write("late.plumb", "param M [kg] > 0\nparam R [m] > 0\nclaim c: M/R^2 = M*R^(-2)\n");
        Run run = Run.of("check", "--no-color", "--timeout", "0.000001", f.toString());
        assertEquals(1, run.status(), run::all);
        assertTrue(run.err().contains(f + ":1:1: error: the run reached its --timeout of 1.0E-6 s before the symbolic"), run.err());
        assertTrue(run.out().contains("undecided"), run.out());
        Run without = Run.of("check", "--no-color", f.toString());
        assertEquals(0, without.status(), without::all);
    }

    @Test
    void aTimeoutMustBePositive() throws IOException {
        Path f = write("t.plumb", "param M [kg] > 0\n");
        Run run = Run.of("check", "--timeout", "-3", f.toString());
        assertEquals(2, run.status(), run::all);
        assertTrue(run.err().contains("--timeout must be a number of seconds above 0"), run.err());
    }

    @Test
    void anUnknownUnitInACaseIsReportedOnceWithAPlausibleReading() throws IOException {
        Path f = write("unit.plumb", "param M [kg] > 0\ncase a: M = 3 [kgg]\nclaim c: M = M\n");
        Run run = Run.of("check", "--no-color", f.toString());
        assertEquals(2, run.status(), run::all);
        assertEquals(1, run.err().split(": error:", -1).length - 1, run.err());
        assertTrue(run.err().contains(f + ":2:16: error: unknown unit 'kgg'; did you mean 'kg'?"), run.err());
    }

    @Test
    void anUnclosedUnitIsOneMessageSayingWhereItOpenedAndWhereItStopped() throws IOException {
        Path f = write("open.plumb", "param M [kg] > 0\nparam R [m] > 0\nlet y = 3 [m\nclaim c: R = R + y\ncase a: M = 1 [kg, R = 2 [m]\n");
        Run run = Run.of("check", "--no-color", f.toString());
        assertEquals(2, run.status(), run::all);
        assertEquals(2, run.err().split(": error:", -1).length - 1, run.err());
        assertTrue(run.err().contains(f + ":3:11: error: unit not closed: '[' at column 11 needs a ']' before the end of the line"),
                run.err());
        assertTrue(run.err().contains(f + ":5:15: error: unit not closed: '[' at column 15 needs a ']' before the ',' at column 18"),
                run.err());
    }

    @Test
    void debugShowsTheTraceOfAStageThatStopsAndOnlyThen() {
        // No input makes a stage stop on a defect any more (that is the point), so this checks only that
        // the option is accepted and that without it no trace appears on a normal run.
        Run run = Run.of("check", "--no-color", "--debug", "derivations/uniform-sphere.plumb");
        assertEquals(0, run.status(), run::all);
        assertFalse(run.all().contains("\tat dev.plumb"), run.all());
    }

    @Test
    void textThatIsNotUtf8IsLocatedAtItsFirstBadByte() throws IOException {
        Path f = dir.resolve("latin1.plumb");
        byte[] head = "param M [kg] > 0\nclaim c: M = M ".getBytes(java.nio.charset.StandardCharsets.UTF_8);
        byte[] bytes = java.util.Arrays.copyOf(head, head.length + 2);
        bytes[head.length] = (byte) 0xB5; // ISO 8859-1 micro sign, not UTF-8 on its own
        bytes[head.length + 1] = '\n';
        Files.write(f, bytes);
        Run run = Run.of("check", "--no-color", f.toString());
        assertEquals(2, run.status(), run::all);
        assertTrue(run.err().contains(f + ":2:16: error: the file is not UTF-8 text (byte 0xB5"), run.err());
    }

    @Test
    void aDirectorySaysSo() {
        Run run = Run.of("check", "--no-color", dir.toString());
        assertEquals(2, run.status(), run::all);
        assertTrue(run.err().contains(dir + ": error: this is a directory, not a plumb file"), run.err());
    }
}
