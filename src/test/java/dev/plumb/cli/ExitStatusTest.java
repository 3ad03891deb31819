package dev.plumb.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/**
 * The exit status of each kind of outcome: 2 when the input cannot be understood or honoured, 1
 * when a check fails, 0 otherwise; a run that prints "error:" never exits 0, and the summary line
 * counts what the status says.
 */
class ExitStatusTest {

    private static final String SPHERE = """
            param M [kg] > 0
            param R [m] > 0
            coord r [m] from 0 to R
            let rho = M / (4/3*pi*R^3)
            let m(r) = 4/3*pi*r^3*rho
            unknown P(r) [Pa]
            relation balance: P'(r) = -G*m(r)*rho/r^2
            boundary surface: P(R) = 0
            claim central: P(0) = 3/(8*pi)*G*M^2/R^4
            case sun: M = 1 [Msun], R = 1 [Rsun]
            """;

    private static Run check(String text) throws IOException {
        Path dir = Files.createTempDirectory("plumb-exit");
        Path file = dir.resolve("exit.plumb");
        Files.writeString(file, text);
        try {
            return Run.of("check", "--no-color", file.toString());
        } finally {
            Files.deleteIfExists(file);
            Files.deleteIfExists(dir);
        }
    }

    private static void status(int expected, String text) throws IOException {
        Run run = check(text);
        assertEquals(expected, run.status(), run.all());
        if (run.all().contains("error:")) assertTrue(run.status() != 0, "an error was printed: " + run.all());
        Matcher summary = Pattern.compile("(\\d+) hold, (\\d+) fail, (\\d+) undecided(, (\\d+) errors?)?").matcher(run.out());
        if (summary.find()) {
            boolean failing = Integer.parseInt(summary.group(2)) > 0 || summary.group(5) != null;
            assertEquals(expected != 0, failing, "the summary must agree with the exit status: " + summary.group());
        }
    }

    @Test
    void everythingHolds() throws IOException {
        status(0, SPHERE);
    }

    @Test
    void syntaxUnknownNameAndUnknownUnitAreTwo() throws IOException {
        status(2, SPHERE + "claim broken: P(0) = = 1\n");
        status(2, SPHERE + "show Q(0)\n");
        status(2, SPHERE + "show P(0) in [furlong]\n");
    }

    @Test
    void numbersOutsideDoublePrecisionAndNameClashesAreLocatedErrors() throws IOException {
        Run huge = check("param a = 1e999\n");
        assertTrue(huge.all().contains("exit.plumb:1:11: error: the number 1e999 is beyond the range"), huge.all());
        assertEquals(2, huge.status());
        Run tiny = check("param b = 1e-999\n");
        assertTrue(tiny.all().contains("exit.plumb:1:11: error: the number 1e-999 is too small"), tiny.all());
        assertEquals(2, tiny.status());
        Run overflow = check("param M = 1e308 [Mearth]\n");
        assertTrue(overflow.all().contains("exit.plumb:1:11: error: the value of parameter 'M' is not a finite number"), overflow.all());
        assertEquals(2, overflow.status());
        Run clash = check("param r > 0\ncoord r [m] from 0 to 1 [m]\n");
        assertTrue(clash.all().contains("exit.plumb:2:7: error: 'r' is declared twice"), clash.all());
        assertEquals(2, clash.status(), "no internal error: " + clash.all());
    }

    @Test
    void deepAndWideExpressionsAreLocatedErrorsNotCrashes() throws IOException {
        Run deep = check("param x > 0\nclaim c: " + "(".repeat(1500) + "x" + ")".repeat(1500) + " = x\n");
        assertTrue(deep.all().contains("exit.plumb:2:") && deep.all().contains("nest more than 100 deep"), deep.all().substring(0, 300));
        assertEquals(2, deep.status());
        Run wide = check("param x > 0\nclaim c: x" + " + x".repeat(3000) + " = 3001*x\n");
        assertTrue(wide.all().contains("more than 1000 operations"), wide.all().substring(0, 300));
        assertEquals(2, wide.status());
        Run signs = check("param x > 0\nclaim c: " + "-".repeat(5000) + "x = x\n");
        assertEquals(2, signs.status());
    }

    @Test
    void aFileWithNothingToCheckIsTwo() throws IOException {
        status(2, "");
        status(2, "# only a comment\n\n");
    }

    @Test
    void aRequestThatCannotBeHonouredIsTwo() throws IOException {
        status(2, SPHERE + "show P(0) in [K]\n");
        status(2, SPHERE + "show P(3*R)\n");
        status(2, SPHERE.replace("R = 1 [Rsun]", "R = -1 [Rsun]"));
    }

    @Test
    void aFailingCheckIsOne() throws IOException {
        status(1, SPHERE.replace("claim central: P(0) = 3/(8*pi)", "claim central: P(0) = 3/(4*pi)"));
        status(1, SPHERE.replace("relation balance: P'(r) = -G*m(r)*rho/r^2", "relation balance: P'(r) = -G*m(r)*rho/r"));
        status(1, SPHERE + "expect v: P(0) at sun = 1 [Pa] within 1%\n");
    }

    @Test
    void aCaseThatCannotBeSolvedIsAFailingCheck() throws IOException {
        // An isothermal atmosphere has no top: a boundary that asks for one cannot be met.
        status(1, """
                param H = 8 [km]
                unknown top [m]
                coord z [m] from 0 to top
                unknown P(z) [Pa]
                relation hydrostatic: P'(z) = -P(z)/H
                boundary ground: P(0) = 1 [atm]
                boundary vacuum: P(top) = 0
                show top
                """);
    }
}
