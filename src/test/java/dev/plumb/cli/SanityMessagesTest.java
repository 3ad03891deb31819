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
 * The numeric side says when a solution is not sane, at the line and column it concerns: a
 * pressure going negative, a point outside the interval, a surface never reached, a shooting that
 * does not converge; and a first guess given with {@code guess} is unit-checked like any line.
 */
class SanityMessagesTest {

    /** The uniform sphere with its central pressure given, so nothing adjusts it to meet P(R) = 0. */
    private static final String SPHERE = """
            title "Uniform sphere, central pressure given"
            param M [kg] > 0
            param R [m] > 0
            coord r [m] from 0 to R
            let rho = M / (4/3*pi*R^3)
            let m(r) = 4/3*pi*r^3*rho
            unknown P(r) [Pa]
            relation balance: P'(r) = -G*m(r)*rho/r^2
            boundary centre: P(0) = %s
            case sun: M = 1 [Msun], R = 1 [Rsun]
            show P(R) in [GPa]
            """;

    private static Run check(String text) throws IOException {
        Path dir = Files.createTempDirectory("plumb-sanity");
        Path file = dir.resolve("sanity.plumb");
        Files.writeString(file, text);
        try {
            return Run.of("check", "--no-color", file.toString());
        } finally {
            Files.deleteIfExists(file);
            Files.deleteIfExists(dir);
        }
    }

    /** The first "sanity.plumb:LINE:COL: severity: message" line of the output that mentions {@code words}. */
    private static int[] located(Run run, String severity, String words) {
        Matcher m = Pattern.compile("sanity\\.plumb:(\\d+):(\\d+): " + severity + ": ([^\\n]*)").matcher(run.all());
        while (m.find()) {
            if (m.group(3).contains(words)) return new int[]{Integer.parseInt(m.group(1)), Integer.parseInt(m.group(2))};
        }
        throw new AssertionError("no " + severity + " mentioning '" + words + "' in:\n" + run.all());
    }

    @Test
    void aPressureThatGoesNegativeIsAWarningAtItsDeclaration() throws IOException {
        // The uniform sphere needs P(0) = 3 G M^2/(8 pi R^4) = 1.3447e14 Pa for the Sun (closed form, checked
        // elsewhere against the numeric solve); 1e13 Pa is too low, so P turns negative before r = R.
        Run run = check(SPHERE.formatted("1e13 [Pa]"));
        int[] at = located(run, "warning", "P goes negative");
        assertEquals(7, at[0]);
        assertEquals(9, at[1]);
        assertTrue(run.all().contains("lowest value P = -1.24"), run.all());
    }

    @Test
    void aHighEnoughPressureGivesNoWarning() throws IOException {
        Run run = check(SPHERE.formatted("2e14 [Pa]"));
        assertTrue(!run.all().contains("goes negative"), run.all());
        assertEquals(0, run.status(), run.all());
    }

    @Test
    void aPointPastTheEndOfAFixedIntervalIsAnError() throws IOException {
        Run run = check(SPHERE.formatted("2e14 [Pa]") + "show P(2*R) in [GPa]\n");
        int[] at = located(run, "error", "outside the interval");
        assertEquals(12, at[0]);
        assertEquals(8, at[1]);
        assertEquals(2, run.status(), "a request that cannot be honoured is an input error");
        assertTrue(!run.out().contains("-5.27"), "no extrapolated value is printed: " + run.all());
    }

    @Test
    void aPointPastAFreeSurfaceIsAnErrorAfterTheSolve() throws IOException {
        // n = 1 polytrope with its radius unknown: the surface lies at pi sqrt(K/(2 pi G)) (analytic Lane-Emden n = 1).
        Run run = check("""
                param K = 2.1e5 [m^5/(kg s^2)]
                param rho_c = 1000 [kg/m^3]
                unknown R [m]
                coord r [m] from 0 to R
                unknown P(r) [Pa]
                unknown m(r) [kg]
                relation balance: P'(r) = -G*m(r)*sqrt(P(r)/K)/r^2
                relation mass: m'(r) = 4*pi*r^2*sqrt(P(r)/K)
                boundary P(0) = K*rho_c^2
                boundary m(0) = 0
                boundary P(R) = 0
                show P(1e9 [m])
                """);
        int[] at = located(run, "error", "beyond the surface");
        assertEquals(12, at[0]);
        assertEquals(6, at[1]);
        assertEquals(2, run.status(), run.all());
    }

    @Test
    void aSurfaceNeverReachedIsReportedAtItsBoundary() throws IOException {
        // An isothermal atmosphere thins out exponentially and never reaches P = 0.
        Run run = check("""
                param H = 8 [km]
                unknown top [m]
                coord z [m] from 0 to top
                unknown P(z) [Pa]
                relation hydrostatic: P'(z) = -P(z)/H
                boundary ground: P(0) = 1 [atm]
                boundary vacuum: P(top) = 0
                show top
                """);
        assertTrue(run.all().contains("sanity.plumb:7:1: the surface P(top) = 0 is never reached"), run.all());
        assertEquals(1, run.status(), run.all());
    }

    @Test
    void aShootingThatFailsNamesTheBoundaryItMissesAndTheLastGuessInTheFilesUnits() throws IOException {
        // Gravity's sign flipped: the pressure grows outward, so no central pressure and K meet P(R) = 0 and m(R) = M.
        Run run = check("""
                param M [kg] > 0
                param R [m] > 0
                param n = 3
                coord r [m] from 0 to R
                unknown P(r) [Pa]
                unknown m(r) [kg]
                unknown K
                let rho(r) = (P(r)/K)^(n/(n+1))
                relation balance: P'(r) = G*m(r)*rho(r)/r^2
                relation mass: m'(r) = 4*pi*r^2*rho(r)
                boundary centre: m(0) = 0
                boundary surface: P(R) = 0
                boundary total: m(R) = M
                case sun: M = 1 [Msun], R = 1 [Rsun]
                show P(0) in [GPa]
                """);
        String all = run.all();
        Matcher m = Pattern.compile("sanity\\.plumb:(1[23]):1: the shooting on P\\(0\\), K did not converge[^\\n]*").matcher(all);
        assertTrue(m.find(), all);
        String line = m.group();
        assertTrue(line.contains("boundary 'total' is missed by") || line.contains("boundary 'surface' is missed by"), line);
        assertTrue(line.contains(" Pa") && line.contains("last trial P(0) = "), line);
        assertEquals(1, run.status(), all);
    }

    @Test
    void aGuessIsUnitChecked() throws IOException {
        Run run = check(SPHERE.formatted("2e14 [Pa]") + "guess P(0) = 3 [km]\n");
        int[] at = located(run, "error", "different units");
        assertEquals(12, at[0]);
        assertEquals(1, run.status(), "a unit check that fails, as on any other line: " + run.all());
    }

    @Test
    void aGuessMustNameAnUnknown() throws IOException {
        Run run = check(SPHERE.formatted("2e14 [Pa]") + "guess M = 3 [kg]\n");
        int[] at = located(run, "error", "a guess is for an unknown constant");
        assertEquals(12, at[0]);
        assertEquals(7, at[1]);
        assertEquals(2, run.status(), run.all());
    }
}
