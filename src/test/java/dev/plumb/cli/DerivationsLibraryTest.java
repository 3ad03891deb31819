package dev.plumb.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Every shipped derivation holds: each file in derivations/ runs clean through {@code plumb check}
 * (exit 0, no check that fails, none left undecided), so the library never ships a claim plumb does not confirm.
 */
class DerivationsLibraryTest {

    static Stream<Path> derivations() throws IOException {
        try (Stream<Path> files = Files.list(Path.of("derivations"))) {
            return files.filter(f -> f.toString().endsWith(".plumb")).sorted().toList().stream();
        }
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("derivations")
    void holds(Path file) {
        Run run = Run.of("check", "--no-color", file.toString());
        assertEquals(0, run.status(), () -> file + " did not hold:\n" + run.all());
        assertFalse(run.out().contains(" fails "), () -> file + " has a failing check:\n" + run.out());
        assertFalse(run.out().contains(" undecided "), () -> file + " has an undecided check:\n" + run.out());
    }
}
