package dev.plumb.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code report --format csv} and the profile samples of the JSON, against closed forms computed
 * here independently and against unit factors from NIST SP 811.
 */
class DataExportTest {

    /** CODATA 2018 recommended value of the Newtonian constant of gravitation, m^3 kg^-1 s^-2. */
    private static final double G = 6.67430e-11;
    /** IAU 2015 Resolution B3: nominal solar GM (m^3 s^-2) and radius (m); plumb's Msun is GM/G. */
    private static final double MSUN = 1.3271244e20 / G;
    private static final double RSUN = 6.957e8;
    /** NIST SP 811: 1 dyn/cm^2 = 0.1 Pa, 1 cm = 0.01 m, 1 g/cm^3 = 1000 kg/m^3. */
    private static final double DYN_PER_CM2 = 0.1;

    @TempDir
    Path dir;

    private static List<String[]> csv(Path file) throws IOException {
        // No cell of these files holds a comma or a quote, so a plain split reads them.
        return Files.readAllLines(file).stream().map(l -> l.split(",", -1)).toList();
    }

    private static List<String> written(Run run) {
        return run.out().lines().filter(l -> l.startsWith("wrote ")).map(l -> Path.of(l.substring(6)).getFileName().toString()).toList();
    }

    @SuppressWarnings("unchecked")
    private static Map<String, Object> map(Object o) {
        return (Map<String, Object>) assertInstanceOf(Map.class, o);
    }

    @SuppressWarnings("unchecked")
    private static List<Object> list(Object o) {
        return (List<Object>) assertInstanceOf(List.class, o);
    }

    private static double[] doubles(Object o) {
        return list(o).stream().mapToDouble(x -> (Double) x).toArray();
    }

    private static void close(double want, double got, double tolerance, String what) {
        assertTrue(Math.abs(got - want) <= tolerance, () -> what + ": want " + want + ", got " + got + " (tolerance " + tolerance + ")");
    }

    /**
     * Kestra (an invented planet written in cgs): uniform density, so P(r) = 2/3 π G ρ² (R² − r²);
     * the file declares r in cm and P in dyn/cm^2, so the CSV gives those with SI beside.
     */
    @Test
    void csvGivesTheCaseTableAndTheProfileInTheFilesUnitsWithSiBeside() throws IOException {
        Run run = Run.of("report", "examples/kestra-cgs-units.plumb", "--format", "csv,json", "--out", dir.toString());
        assertEquals(0, run.status(), run::all);
        // In the order of --format: the data first, then the JSON.
        assertEquals(List.of("case-kestra.csv", "profile-kestra-P.csv", "kestra-cgs-units.json"), written(run));
        double rho = 5.5 * 1000;
        double radius = 6.371e8 * 0.01;
        double p0 = 2.0 / 3 * Math.PI * G * rho * rho * radius * radius;

        List<String[]> table = csv(dir.resolve("case-kestra.csv"));
        assertEquals(List.of("quantity", "unit", "closed form", "numeric", "relative difference", "error estimate", "SI unit",
                "closed form (SI)", "numeric (SI)", "error estimate (SI)", "d ln Q/d ln rho", "d ln Q/d ln R"), Arrays.asList(table.get(0)));
        // Two rows: the file shows P(0) twice, in dyn/cm^2 and in Mbar, and every show line is a row.
        assertEquals(3, table.size());
        assertEquals("Mbar", table.get(2)[1]);
        String[] row = table.get(1);
        assertEquals("P(0)", row[0]);
        assertEquals("dyn/cm^2", row[1]);
        close(p0 / DYN_PER_CM2, Double.parseDouble(row[2]), 1e-11 * p0 / DYN_PER_CM2, "closed form in dyn/cm^2");
        close(p0 / DYN_PER_CM2, Double.parseDouble(row[3]), 1e-10 * p0 / DYN_PER_CM2, "numeric in dyn/cm^2");
        assertEquals("Pa", row[6]);
        close(p0, Double.parseDouble(row[7]), 1e-13 * p0, "closed form in Pa");
        close(p0, Double.parseDouble(row[8]), 1e-10 * p0, "numeric in Pa");
        // P(0) goes as rho^2 R^2.
        close(2.0, Double.parseDouble(row[10]), 1e-9, "d ln P(0)/d ln rho");
        close(2.0, Double.parseDouble(row[11]), 1e-9, "d ln P(0)/d ln R");

        List<String[]> profile = csv(dir.resolve("profile-kestra-P.csv"));
        assertEquals(List.of("r [cm]", "r [m] (SI)", "P(r) numeric [dyn/cm^2]", "P(r) numeric [Pa] (SI)", "P(r) closed form [dyn/cm^2]",
                "P(r) closed form [Pa] (SI)"), Arrays.asList(profile.get(0)));
        List<String[]> points = profile.subList(1, profile.size());
        assertTrue(points.size() >= 50, "samples: " + points.size());
        close(0, Double.parseDouble(points.get(0)[1]), 0, "the first sample is at the centre");
        close(radius, Double.parseDouble(points.get(points.size() - 1)[1]), 1e-12 * radius, "the last sample is at the surface");
        for (String[] p : points) {
            double r = Double.parseDouble(p[1]);
            double want = 2.0 / 3 * Math.PI * G * rho * rho * (radius * radius - r * r);
            close(r, 0.01 * Double.parseDouble(p[0]), 1e-11 * radius, "r in cm against r in m");
            close(want, Double.parseDouble(p[3]), 1e-10 * p0, "numeric P at r = " + r);
            close(Double.parseDouble(p[3]) / DYN_PER_CM2, Double.parseDouble(p[2]), 1e-11 * p0 / DYN_PER_CM2, "numeric P in dyn/cm^2");
            close(want, Double.parseDouble(p[5]), 1e-13 * p0, "closed-form P at r = " + r);
            close(Double.parseDouble(p[5]) / DYN_PER_CM2, Double.parseDouble(p[4]), 1e-11 * p0 / DYN_PER_CM2, "closed-form P in dyn/cm^2");
        }

        // The JSON holds the same samples, in SI, and every double reads back to the CSV's exactly.
        Map<String, Object> kase = map(list(map(JsonReader.read(Files.readString(dir.resolve("kestra-cgs-units.json")))).get("cases")).get(0));
        Map<String, Object> json = map(list(kase.get("profiles")).get(0));
        assertEquals("P", json.get("profile"));
        assertEquals("Pa", json.get("unit"));
        assertEquals("r", json.get("coordinate"));
        assertEquals("m", json.get("coordinate_unit"));
        double[] x = doubles(json.get("coordinate_values"));
        double[] numeric = doubles(json.get("numeric"));
        double[] closed = doubles(json.get("closed_form"));
        assertEquals(points.size(), x.length);
        for (int i = 0; i < x.length; i++) {
            assertEquals(Double.parseDouble(points.get(i)[1]), x[i], 0.0);
            assertEquals(Double.parseDouble(points.get(i)[3]), numeric[i], 0.0);
            assertEquals(Double.parseDouble(points.get(i)[5]), closed[i], 0.0);
        }
    }

    /**
     * Ilex (an invented star) has M = 1.00 ± 0.02 Msun and an exact R; P(0) goes as M², so to first
     * order its relative uncertainty is 2 × 0.02, and for a normal M the standard deviation of M² is
     * sqrt(4 μ² σ² + 2 σ⁴), which the Monte Carlo column must meet within its sampling error.
     */
    @Test
    void csvCarriesPropagatedUncertaintiesInTheShownUnit() throws IOException {
        Run run = Run.of("report", "examples/ilex-uncertain-mass.plumb", "--format", "csv", "--out", dir.toString());
        assertEquals(0, run.status(), run::all);
        List<String[]> table = csv(dir.resolve("case-ilex.csv"));
        // The one header cell with a comma is quoted (RFC 4180).
        assertTrue(String.join(",", table.get(0)).endsWith(",\"uncertainty, first order\",\"uncertainty, Monte Carlo\","
                + "Monte Carlo sampling error,Monte Carlo samples"), () -> String.join(",", table.get(0)));
        String[] row = table.get(1);
        assertEquals("TPa", row[1]);
        double p0 = 3 * G * MSUN * MSUN / (8 * Math.PI * Math.pow(RSUN, 4));
        double shown = p0 / 1e12;
        close(shown, Double.parseDouble(row[2]), 1e-11 * shown, "closed form in TPa");
        int n = row.length;
        // The split above cut the two quoted header cells in two; the rows have no quotes.
        close(2 * 0.02 * shown, Double.parseDouble(row[n - 4]), 1e-9 * shown, "first-order uncertainty in TPa");
        double sd = Math.sqrt(4 * 0.02 * 0.02 + 2 * Math.pow(0.02, 4)) * shown;
        double samplingError = Double.parseDouble(row[n - 2]);
        assertTrue(samplingError > 0 && samplingError < 0.05 * sd, "sampling error " + samplingError);
        close(sd, Double.parseDouble(row[n - 3]), 4 * samplingError, "Monte Carlo uncertainty in TPa");
        assertEquals("20000", row[n - 1]);
    }

    /** {@code check --format json --profiles}: the profiles of every case; without the option, none (see CheckCommandTest). */
    @Test
    void checkJsonCarriesProfilesOnRequest() {
        Run run = Run.of("check", "--format", "json", "--profiles", "derivations/uniform-sphere.plumb");
        assertEquals(0, run.status(), run::all);
        List<Object> cases = list(map(JsonReader.read(run.out())).get("cases"));
        assertEquals(2, cases.size());
        Map<String, Object> sun = map(cases.get(0));
        assertEquals("sun", sun.get("label"));
        Map<String, Object> p = map(list(sun.get("profiles")).get(0));
        double[] r = doubles(p.get("coordinate_values"));
        double[] numeric = doubles(p.get("numeric"));
        double[] closed = doubles(p.get("closed_form"));
        double p0 = 3 * G * MSUN * MSUN / (8 * Math.PI * Math.pow(RSUN, 4));
        close(RSUN, r[r.length - 1], 1e-12 * RSUN, "the last sample is at the surface");
        for (int i = 0; i < r.length; i++) {
            double want = p0 * (1 - (r[i] / RSUN) * (r[i] / RSUN));
            close(want, closed[i], 1e-12 * p0, "closed form at r = " + r[i]);
            close(want, numeric[i], 1e-10 * p0, "numeric at r = " + r[i]);
        }
        assertEquals(2, Stream.of(cases.get(0), cases.get(1)).filter(c -> map(c).containsKey("profiles")).count());
    }
}
