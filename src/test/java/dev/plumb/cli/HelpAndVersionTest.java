package dev.plumb.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/** {@code --help} and {@code --version} on the top command and on every subcommand. */
class HelpAndVersionTest {

    private static String[] args(String command, String option) {
        List<String> a = new ArrayList<>();
        if (!command.isEmpty()) a.add(command);
        a.add(option);
        return a.toArray(String[]::new);
    }

    @ParameterizedTest
    @ValueSource(strings = {"", "check", "units"})
    void help(String command) {
        Run run = Run.of(args(command, "--help"));
        assertEquals(0, run.status(), run::all);
        String usage = command.isEmpty() ? "Usage: plumb " : "Usage: plumb " + command + " ";
        assertTrue(run.out().startsWith(usage), run.out());
        assertTrue(run.out().contains("--version"), run.out());
        if (command.equals("check")) assertTrue(run.out().contains("--format"), run.out());
        if (command.equals("units")) assertTrue(run.out().contains("--in=UNIT"), run.out());
        if (command.isEmpty()) assertTrue(run.out().contains("check") && run.out().contains("units"), run.out());
    }

    @ParameterizedTest
    @ValueSource(strings = {"", "check", "units"})
    void version(String command) {
        Run run = Run.of(args(command, "--version"));
        assertEquals(0, run.status(), run::all);
        assertTrue(run.out().matches("(?s)plumb \\d+\\.\\d+\\.\\d+.*"), run.out());
        assertTrue(run.out().contains("GPL-3.0-or-later"), run.out());
    }

    @ParameterizedTest
    @ValueSource(strings = {"check", "units"})
    void helpCommandShowsTheSubcommandsUsage(String command) {
        Run run = Run.of("help", command);
        assertEquals(0, run.status(), run::all);
        assertTrue(run.out().startsWith("Usage: plumb " + command + " "), run.out());
    }

    @org.junit.jupiter.api.Test
    void noArgumentsPrintsUsage() {
        Run run = Run.of();
        assertEquals(0, run.status(), run::all);
        assertTrue(run.out().startsWith("Usage: plumb "), run.out());
    }
}
