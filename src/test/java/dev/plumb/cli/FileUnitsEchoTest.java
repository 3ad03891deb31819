package dev.plumb.cli;

import static dev.plumb.cli.Codata2018.G;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Values come back in the units the file works in: expectations in their own unit, case rows in the
 * show's unit (else the file's unit for the quantity), places along the coordinate in its declared
 * unit, each with SI beside; every show line is a row of its own; JSON numbers stay SI.
 *
 * <p>Conversion factors, NIST SP 811 (2008) appendix B and the SI Brochure (9th ed.): 1 cm = 0.01 m,
 * 1 g/cm^3 = 1000 kg/m^3, 1 dyn/cm^2 = 0.1 Pa, 1 bar = 1e5 Pa (so 1 Mbar = 1e11 Pa), 1 km = 1000 m.
 * Earth's mass: IAU 2015 Resolution B3 nominal GM = 3.986004e14 m^3 s^-2, divided by CODATA 2018 G.
 */
class FileUnitsEchoTest {

    private static final double CM = 0.01, DYN_PER_CM2 = 0.1, BAR = 1e5, KM = 1000;
    private static final double MEARTH = 3.986004e14 / G;

    /** A number as plumb prints it. */
    private static final String NUM = "(-?[0-9.]+(?:e[-+][0-9]+)?)";

    @TempDir
    Path dir;

    private static Matcher find(String regex, String text) {
        Matcher m = Pattern.compile(regex).matcher(text);
        assertTrue(m.find(), () -> "no match for " + regex + " in:\n" + text);
        return m;
    }

    private static double d(Matcher m, int group) {
        return Double.parseDouble(m.group(group));
    }

    private static double num(Object o) {
        return ((Number) o).doubleValue();
    }

    @SuppressWarnings("unchecked")
    private static List<Map<String, Object>> list(Map<String, Object> m, String key) {
        return (List<Map<String, Object>>) m.get(key);
    }

    @SuppressWarnings("unchecked")
    private static Map<String, Object> json(Run run) {
        return (Map<String, Object>) JsonReader.read(run.out());
    }

    private static Map<String, Object> check(Map<String, Object> root, String label) {
        return list(root, "checks").stream().filter(c -> label.equals(c.get("label")) && "expect".equals(c.get("kind"))).findFirst()
                .orElseThrow(() -> new AssertionError("no expect check " + label + " in " + root.get("checks")));
    }

    // ---- a file in cgs: examples/kestra-cgs-units.plumb (an invented planet) ---------------------------

    /** Uniform density: P(0) = 2/3 pi G rho^2 R^2 (hydrostatic balance integrated by hand), here in SI. */
    private static final double KESTRA_P0 = 2.0 / 3 * Math.PI * G * Math.pow(5.5e3, 2) * Math.pow(6.371e8 * CM, 2);

    @Test
    void aCgsFileHearsItsExpectationInDynPerSquareCentimetreWithPascalBeside() {
        Run run = Run.of("check", "--no-color", "examples/kestra-cgs-units.plumb");
        assertEquals(0, run.status(), run::all);
        Matcher m = find("P\\(0\\) at kestra: numeric " + NUM + " dyn/cm\\^2 \\(" + NUM + " Pa\\), expected " + NUM
                + " dyn/cm\\^2 \\(" + NUM + " Pa\\)", run.out());
        assertEquals(KESTRA_P0 / DYN_PER_CM2, d(m, 1), 1e-9 * KESTRA_P0 / DYN_PER_CM2);
        assertEquals(KESTRA_P0, d(m, 2), 1e-9 * KESTRA_P0);
        // The file writes 1.716346e12 [dyn/cm^2]: echoed as written, and as 1.716346e11 Pa beside.
        assertEquals(1.716346e12, d(m, 3), 1e-3);
        assertEquals(1.716346e11, d(m, 4), 1e-3);
    }

    @Test
    void aCgsFileHasItsSeriesStartInCentimetresAndEachShowLineItsOwnRow() {
        Run run = Run.of("check", "--no-color", "examples/kestra-cgs-units.plumb");
        Matcher start = find("series start on \\[0, 0\\+" + NUM + "\\] cm \\(length " + NUM + " m;", run.out());
        // The same length twice, to the three figures each is printed with.
        assertEquals(d(start, 2), d(start, 1) * CM, 0.006 * d(start, 2));
        assertTrue(d(start, 2) < 6.371e6 / 10, "a series start is short beside the radius: " + start.group());

        Matcher dyn = find("(?m)^    P\\(0\\) +" + NUM + " +" + NUM + " .* dyn/cm\\^2$", run.out());
        Matcher mbar = find("(?m)^    P\\(0\\) +" + NUM + " +" + NUM + " .* Mbar$", run.out());
        assertEquals(KESTRA_P0 / DYN_PER_CM2, d(dyn, 2), 1e-6 * KESTRA_P0 / DYN_PER_CM2);
        assertEquals(KESTRA_P0 / (1e6 * BAR), d(mbar, 2), 1e-6 * KESTRA_P0 / (1e6 * BAR));
        assertEquals(1, Pattern.compile("d ln P\\(0\\) / d ln p").matcher(run.out()).results().count(),
                "the sensitivities of one quantity are printed once: " + run.out());
    }

    @Test
    void jsonKeepsSiNumbersAndGivesEveryShowLineItsRowWithItsUnit() {
        Run run = Run.of("check", "--format", "json", "examples/kestra-cgs-units.plumb");
        Map<String, Object> root = json(run);
        List<Map<String, Object>> rows = list(list(root, "cases").get(0), "quantities");
        assertEquals(2, rows.size(), rows::toString);
        assertEquals(List.of("dyn/cm^2", "Mbar"), rows.stream().map(r -> r.get("shown_unit")).toList());
        for (Map<String, Object> r : rows) {
            assertEquals("P(0)", r.get("expr"));
            assertEquals("Pa", r.get("unit"), "numbers in cases are SI");
            assertEquals(KESTRA_P0, num(r.get("numeric")), 1e-9 * KESTRA_P0);
        }
        assertEquals(KESTRA_P0 / DYN_PER_CM2, num(rows.get(0).get("shown_value")), 1e-9 * KESTRA_P0 / DYN_PER_CM2);
        assertEquals(KESTRA_P0 / 1e11, num(rows.get(1).get("shown_value")), 1e-9 * KESTRA_P0 / 1e11);
        Map<String, Object> expect = check(root, "centre");
        assertEquals("Pa", expect.get("unit"));
        assertEquals(KESTRA_P0, num(expect.get("numeric")), 1e-9 * KESTRA_P0);
        assertEquals(1.716346e11, num(expect.get("expected")), 1e-2);
        assertEquals("dyn/cm^2", expect.get("shown_unit"));
        assertEquals(1.716346e12, num(expect.get("shown_expected")), 1e-1);
    }

    @Test
    void theReportTabulatesBothShowLinesOfOneQuantity() throws IOException {
        int status = Main.run(new String[]{"report", "examples/kestra-cgs-units.plumb", "--format", "md", "--out", dir.toString()},
                new java.io.PrintWriter(new java.io.StringWriter()), new java.io.PrintWriter(new java.io.StringWriter()));
        assertEquals(0, status);
        String md = Files.readString(dir.resolve("kestra-cgs-units.md"));
        // The quantity and its unit are typeset: LaTeX between dollars.
        List<String> rows = md.lines().filter(l -> l.startsWith("| $`P{\\left(0\\right)}`$ |")).toList();
        assertEquals(2, rows.size(), md);
        assertTrue(rows.get(0).contains("dyn/cm^{2}") && rows.get(1).contains("Mbar"), rows::toString);
    }

    @Test
    void aNegativePressureIsReportedInTheFilesUnitsAtItsPlaceInCentimetres() throws IOException {
        // Invented body: the uniform planet above with its centre given too low a pressure, 1e12 dyn/cm^2.
        Path f = Files.writeString(dir.resolve("low.plumb"), """
                # Invented body: a uniform planet in cgs with too low a central pressure.
                param rho = 5.5 [g/cm^3]
                param R = 6.371e8 [cm]
                coord r [cm] from 0 to R
                let m(r) = 4/3*pi*r^3*rho
                unknown P(r) [dyn/cm^2]
                relation balance: P'(r) = -G*m(r)*rho/r^2
                boundary centre: P(0) = 1e12 [dyn/cm^2]
                show P(R)
                """);
        Run run = Run.of("check", "--no-color", f.toString());
        // P(r) = P(0) - 2/3 pi G rho^2 r^2 falls all the way, so its lowest value is at r = R.
        double lowest = 1e12 * DYN_PER_CM2 - KESTRA_P0;
        Matcher m = find("lowest value P = " + NUM + " dyn/cm\\^2 \\(" + NUM + " Pa\\) at r = " + NUM + " cm \\(" + NUM + " m\\)", run.all());
        assertEquals(lowest / DYN_PER_CM2, d(m, 1), 1e-5 * Math.abs(lowest / DYN_PER_CM2));
        assertEquals(lowest, d(m, 2), 1e-5 * Math.abs(lowest));
        assertEquals(6.371e8, d(m, 3), 1e-9 * 6.371e8);
        assertEquals(6.371e6, d(m, 4), 1e-9 * 6.371e6);
        // The row of a show without a unit is in the file's unit for P: the one its declaration gives.
        Matcher row = find("(?m)^    P\\(R\\) +" + NUM + " +" + NUM + " .* dyn/cm\\^2$", run.out());
        assertEquals(lowest / DYN_PER_CM2, d(row, 2), 1e-6 * Math.abs(lowest / DYN_PER_CM2));
    }

    @Test
    void aSweepTabulatesAnUnshownQuantityInTheFilesUnitAndEchoesItsExtremumInIt() throws IOException {
        Path f = Files.writeString(dir.resolve("family.plumb"), """
                # Invented bodies: uniform planets of one density and radii from 1000 km to 10000 km, all in cgs.
                param rho [g/cm^3] > 0
                param R [cm] > 0
                coord r [cm] from 0 to R
                let m(r) = 4/3*pi*r^3*rho
                unknown P(r) [dyn/cm^2]
                relation balance: P'(r) = -G*m(r)*rho/r^2
                boundary surface: P(R) = 0
                show P(0)
                sweep sizes: R from 1e8 [cm] to 1e9 [cm] log 3, rho = 5.5 [g/cm^3]
                expect biggest: max P(0) over sizes = 4.2286e12 [dyn/cm^2] within 1e-3
                """);
        Run run = Run.of("check", "--no-color", f.toString());
        assertEquals(0, run.status(), run::all);
        assertTrue(run.out().contains("P(0) [dyn/cm^2]"), run.out());
        // The largest central pressure of the range is at its largest radius, 1e9 cm = 1e7 m.
        double top = 2.0 / 3 * Math.PI * G * Math.pow(5.5e3, 2) * Math.pow(1e7, 2);
        Matcher m = find("max P\\(0\\) over sizes: " + NUM + " dyn/cm\\^2 \\(" + NUM + " Pa\\) at R = " + NUM + " cm \\(" + NUM + " m\\)",
                run.out());
        assertEquals(top / DYN_PER_CM2, d(m, 1), 1e-8 * top / DYN_PER_CM2);
        assertEquals(top, d(m, 2), 1e-8 * top);
        assertEquals(1e9, d(m, 3), 1e-3);
        assertEquals(1e7, d(m, 4), 1e-5);
    }

    // ---- a file in km, bar and Earth masses: examples/tarn-km-units.plumb (an invented planet) -----------

    /** Lane-Emden n = 1 (analytic: theta = sin(xi)/xi, xi_1 = pi): R = pi sqrt(K/(2 pi G)). */
    private static final double TARN_K = 2.1e5, TARN_RHO_C = 1.2e3;
    private static final double TARN_R = Math.PI * Math.sqrt(TARN_K / (2 * Math.PI * G));
    /** n = 1: M = 4 pi rho_c a^3 (-xi^2 theta')(xi_1) = 4 pi^2 rho_c a^3 with a = R/pi. */
    private static final double TARN_M = 4 * Math.PI * Math.PI * TARN_RHO_C * Math.pow(TARN_R / Math.PI, 3);

    @Test
    void aKmFileHearsItsRadiusAndSurfaceInKilometresWithMetresBeside() {
        Run run = Run.of("check", "--no-color", "examples/tarn-km-units.plumb");
        assertEquals(0, run.status(), run::all);
        Matcher expect = find("R: numeric " + NUM + " km \\(" + NUM + " m\\), expected " + NUM + " km \\(" + NUM + " m\\)", run.out());
        assertEquals(TARN_R / KM, d(expect, 1), 1e-9 * TARN_R / KM);
        assertEquals(TARN_R, d(expect, 2), 1e-9 * TARN_R);
        assertEquals(70303, d(expect, 3), 1e-9);
        assertEquals(70303000, d(expect, 4), 1e-6);
        Matcher surface = find("surface P\\(R\\) = 0 found at r = " + NUM + " km \\(" + NUM + " m\\)", run.out());
        assertEquals(TARN_R / KM, d(surface, 1), 1e-9 * TARN_R / KM);
        assertEquals(TARN_R, d(surface, 2), 1e-9 * TARN_R);
        find("series start on \\[0, 0\\+" + NUM + "\\] km \\(length " + NUM + " m;", run.out());
    }

    @Test
    void aKmFileTabulatesEachQuantityInItsOwnUnitAndEachShowLineOnce() {
        Run run = Run.of("check", "--no-color", "examples/tarn-km-units.plumb");
        String out = run.out();
        // show R, show m(R), show P(0) name no unit: R in its declared km, m in Mearth, P in bar.
        assertEquals(TARN_R / KM, d(find("(?m)^    R +- +" + NUM + " .* km$", out), 1), 1e-6 * TARN_R / KM);
        assertEquals(TARN_M / MEARTH, d(find("(?m)^    m\\(R\\) +- +" + NUM + " .* Mearth$", out), 1), 1e-6 * TARN_M / MEARTH);
        double p0 = TARN_K * TARN_RHO_C * TARN_RHO_C;
        assertEquals(p0 / BAR, d(find("(?m)^    P\\(0\\) +- +" + NUM + " .* bar$", out), 1), 1e-6 * p0 / BAR);
        // show P(0) in [Pa] is its own row, in pascals.
        assertEquals(p0, d(find("(?m)^    P\\(0\\) +- +" + NUM + " .* Pa$", out), 1), 1e-6 * p0);
    }

    @Test
    void aKmFilesJsonStaysSi() {
        Map<String, Object> root = json(Run.of("check", "--format", "json", "examples/tarn-km-units.plumb"));
        List<Map<String, Object>> rows = list(list(root, "cases").get(0), "quantities");
        assertEquals(List.of("R", "m(R)", "P(0)", "P(0)"), rows.stream().map(r -> r.get("expr")).toList());
        assertEquals("m", rows.get(0).get("unit"));
        assertEquals(TARN_R, num(rows.get(0).get("numeric")), 1e-9 * TARN_R);
        assertEquals("km", rows.get(0).get("shown_unit"));
        assertEquals(TARN_R / KM, num(rows.get(0).get("shown_value")), 1e-9 * TARN_R / KM);
        assertEquals("kg", rows.get(1).get("unit"));
        assertEquals(TARN_M, num(rows.get(1).get("numeric")), 1e-8 * TARN_M);
        assertEquals("Mearth", rows.get(1).get("shown_unit"));
        assertEquals("bar", rows.get(2).get("shown_unit"));
        assertNull(rows.get(3).get("shown_unit"), "a row shown in SI names no second unit");
        assertEquals(num(rows.get(2).get("numeric")), num(rows.get(3).get("numeric")));
        Map<String, Object> expect = check(root, "radius");
        assertEquals("m", expect.get("unit"));
        assertEquals(TARN_R, num(expect.get("numeric")), 1e-9 * TARN_R);
        assertEquals(70303000, num(expect.get("expected")), 1e-6);
        assertEquals("km", expect.get("shown_unit"));
    }
}
