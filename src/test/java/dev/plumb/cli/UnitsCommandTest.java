package dev.plumb.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/** {@code plumb units}: the calculator, checked against published values. */
class UnitsCommandTest {

    /** CODATA 2018 recommended value of the Newtonian constant of gravitation, m^3 kg^-1 s^-2. */
    private static final double G = 6.67430e-11;
    /** IAU 2015 Resolution B3: nominal solar mass parameter GM, m^3 s^-2. */
    private static final double GM_SUN = 1.3271244e20;
    /** IAU 2015 Resolution B3: nominal solar radius, m. */
    private static final double R_SUN = 6.957e8;

    /** The number on the {@code = VALUE UNIT} line. */
    private static double converted(Run run, String unit) {
        Matcher m = Pattern.compile("(?m)^= (\\S+) " + Pattern.quote(unit) + "$").matcher(run.out());
        assertTrue(m.find(), run::all);
        return Double.parseDouble(m.group(1));
    }

    @Test
    void centralPressureOfAUniformSun() {
        Run run = Run.of("units", "3/(8*pi)*G*(1 [Msun])^2/(1 [Rsun])^4", "--in", "GPa");
        assertEquals(0, run.status(), run::all);
        // 3 G M^2 / (8 pi R^4) with M = GM_sun / G, in GPa.
        double expected = 3 * GM_SUN * GM_SUN / (8 * Math.PI * G * Math.pow(R_SUN, 4)) / 1e9;
        double shown = converted(run, "GPa");
        assertEquals(expected, shown, expected * 1e-5);
        assertEquals(1.3447e5, shown, 0.0001e5);
        assertTrue(run.out().startsWith("1.34"), run.out());
        assertTrue(run.out().contains(" Pa"), run.out());
    }

    @Test
    void listsTheConstantsItUsedWithTheirSource() {
        Run run = Run.of("units", "G*(1 [kg])/(1 [m])");
        assertEquals(0, run.status(), run::all);
        assertTrue(run.out().contains("G = 6.67430e-11"), run.out());
        assertTrue(run.out().contains("CODATA 2018"), run.out());
    }

    @Test
    void pressureConversions() {
        // NIST SP 811 (2008), Appendix B: 1 atm = 101325 Pa, 1 bar = 1e5 Pa, 1 dyn/cm^2 = 0.1 Pa.
        assertEquals(1.01325, converted(Run.of("units", "1 [atm]", "--in", "bar"), "bar"), 1e-9);
        assertEquals(0.1, converted(Run.of("units", "1 [dyn/cm^2]", "--in", "Pa"), "Pa"), 1e-12);
        assertEquals(760.0, converted(Run.of("units", "1 [atm]", "--in", "[Torr]"), "Torr"), 1e-6);
    }

    @Test
    void freshWaterColumnOfTenMetresIsAboutOneAtmosphere() {
        // Common practice, no source: about 10 m of fresh water adds about one atmosphere.
        double atm = converted(Run.of("units", "1000 [kg/m^3] * g_n * 10 [m]", "--in", "atm"), "atm");
        assertEquals(1.0, atm, 0.05);
    }

    @Test
    void incompatibleTargetUnitFailsClearly() {
        Run run = Run.of("units", "1 [m]", "--in", "Pa");
        assertEquals(1, run.status(), run::all);
        assertTrue(run.err().contains("cannot express 1 [m] in Pa"), run.err());
        assertTrue(run.err().contains("the value is m, Pa is kg m^-1 s^-2"), run.err());
        assertFalse(run.out().contains("= "), run.out());
        assertFalse(run.all().contains("Exception"), run::all);
    }

    @Test
    void unknownTargetUnitExitsTwo() {
        Run run = Run.of("units", "1 [m]", "--in", "furlongs");
        assertEquals(2, run.status(), run::all);
        assertTrue(run.err().contains("--in furlongs"), run.err());
    }

    @Test
    void malformedExpressionPointsAtThePlace() {
        Run run = Run.of("units", "1 [m] +");
        assertEquals(2, run.status(), run::all);
        assertTrue(run.err().contains("<expression>:1:8: error: expected an expression"), run.err());
        assertFalse(run.all().contains("Exception"), run::all);
    }

    @Test
    void unitMismatchInsideTheExpressionFails() {
        Run run = Run.of("units", "1 [m] + 1 [s]");
        assertEquals(1, run.status(), run::all);
        assertTrue(run.err().contains("the operands of '+' have different units"), run.err());
    }

    @Test
    void undefinedNameExitsTwo() {
        Run run = Run.of("units", "2*Gg");
        assertEquals(2, run.status(), run::all);
        assertTrue(run.err().contains("'Gg' is not defined; did you mean 'G'?"), run.err());
    }
}
