package dev.plumb.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;

/** The invented examples behave as their comments say. */
class ExamplesTest {

    @Test
    void wrongUnitsBalanceFailsOnItsRelation() throws IOException {
        Path file = Path.of("examples/wrong-units-balance.plumb");
        List<String> lines = Files.readAllLines(file);
        int line = 1 + lines.indexOf(lines.stream().filter(l -> l.startsWith("relation balance:")).findFirst().orElseThrow());
        int column = lines.get(line - 1).indexOf("-G") + 1;
        Run run = Run.of("check", "--no-color", file.toString());
        assertEquals(1, run.status(), run::all);
        assertTrue(run.err().contains(file + ":" + line + ":" + column + ": error: the two sides of relation 'balance'"), run.err());
    }

    @Test
    void polytropeInfersItsConstant() {
        Run run = Run.of("check", "--no-color", "examples/polytrope-inferred-constant.plumb");
        assertEquals(0, run.status(), run::all);
        assertTrue(run.err().contains("note: the unit of 'K' is inferred: "), run.err());
        assertTrue(run.err().contains("m^3 kg^(-1/3) s^-2"), run.err());
    }
}
