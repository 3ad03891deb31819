package dev.plumb.symbolic;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.plumb.model.Status;
import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import org.junit.jupiter.api.Test;

/**
 * Names that mean something to Symja (Euler's E, the imaginary I, N, D, C, Run, Import, a case-folded
 * Mm/mm pair) are plain quantities in plumb, and nothing reaches standard output.
 */
class HostileNamesTest {

    private static final String FILE = """
            param E > 0
            param I > 0
            param N > 0
            param D > 0
            param C > 0
            param Mm > 0
            param mm > 0
            param Run > 0
            param Import > 0
            claim commute: E*I + N*D + C = C + D*N + I*E
            claim not_euler: log(E) = 1
            claim not_imaginary: I^2 = -1
            claim case_matters: Mm = mm
            claim inert: Run + Import = Import + Run
            claim not_a_command: Run = Import
            """;

    @Test
    void symjaNamesAreOrdinaryQuantities() {
        PrintStream saved = System.out;
        ByteArrayOutputStream captured = new ByteArrayOutputStream();
        SymbolicResult r;
        try {
            System.setOut(new PrintStream(captured));
            r = Fixtures.analyze(Fixtures.model("hostile.plumb", FILE));
        } finally {
            System.setOut(saved);
        }
        assertEquals(Status.HOLDS, Fixtures.check(r, "commute").status());
        assertEquals(Status.FAILS, Fixtures.check(r, "not_euler").status());
        assertEquals(Status.FAILS, Fixtures.check(r, "not_imaginary").status());
        assertEquals(Status.FAILS, Fixtures.check(r, "case_matters").status());
        assertEquals(Status.HOLDS, Fixtures.check(r, "inert").status());
        assertEquals(Status.FAILS, Fixtures.check(r, "not_a_command").status());
        assertEquals("", captured.toString());
    }
}
