package dev.plumb.cli;

import static dev.plumb.cli.Codata2018.MSUN;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Sequences of models: {@code sweep} tabulates every shown quantity along a range, and
 * {@code expect ... max/min ... over} locates the extremum between the samples. Checked against
 * extrema known in closed form and against the test's own solve of the relativistic star.
 */
class SequencesTest {

    @TempDir
    Path dir;

    @SuppressWarnings("unchecked")
    private static Map<String, Object> sweep(Map<String, Object> root, int i) {
        return ((List<Map<String, Object>>) root.get("sweeps")).get(i);
    }

    @SuppressWarnings("unchecked")
    private static Map<String, Object> extremum(Map<String, Object> sweep, int i) {
        return ((List<Map<String, Object>>) sweep.get("extrema")).get(i);
    }

    @Test
    void theMaximumOfXTimesExpMinusXIsOneOverEAtOne() {
        // Calculus: d/dx (x e^-x) = (1 - x) e^-x vanishes at x = 1, where x e^-x = 1/e.
        CheckedText r = CheckedText.of("peak", """
                param x > 0
                let f = x*exp(-x)
                show f
                sweep s: x from 0.1 to 10 log 15
                expect top: max f over s = 0.36787944117144233 within 1e-9
                """);
        assertEquals(0, r.run().status(), r.run()::all);
        Map<String, Object> s = sweep(r.root(), 0);
        assertEquals("x", s.get("parameter"));
        assertEquals("log", s.get("spacing"));
        assertEquals(15, ((List<?>) s.get("points")).size());
        Map<String, Object> x = extremum(s, 0);
        assertEquals(Math.exp(-1), (Double) x.get("value"), 1e-14);
        assertEquals(1.0, (Double) x.get("at"), 1e-6);
        assertEquals(Boolean.FALSE, x.get("at_end"));
    }

    @Test
    void aToleranceFinerThanTheSequenceResolvesIsUndecided() {
        // The same peak, 1/e, asked to 1e-15: past what a sequence of solves can promise, whatever the value.
        CheckedText r = CheckedText.of("peak-tight", """
                param x > 0
                let f = x*exp(-x)
                sweep s: x from 0.1 to 10 log 15
                expect top: max f over s = 0.36787944117144233 within 1e-15
                """);
        Map<String, Object> top = r.list("checks").stream().filter(c -> "expect".equals(c.get("kind")) && "top".equals(c.get("label"))).findFirst().orElseThrow();
        assertEquals("undecided", top.get("status"), top.toString());
        assertTrue(String.valueOf(top.get("message")).contains("resolution"), top.toString());
    }

    @Test
    void theMinimumOfAParabolaIsFoundOnALinearSweepAndAWrongValueFails() throws IOException {
        // (x - 2)^2 + 3 is smallest at x = 2, where it is 3.
        Path f = Files.writeString(dir.resolve("bowl.plumb"), """
                param x [m]
                let f = (x - 2 [m])^2 + 3 [m^2]
                show f in [cm^2]
                sweep s: x from -5 [m] to 7 [m] linear 13
                expect low: min f over s = 3 [m^2] within 1e-9
                expect wrong: min f over s = 3.1 [m^2] within 1%
                """);
        Run run = Run.of("check", "--format", "json", f.toString());
        assertEquals(1, run.status(), run::all);
        @SuppressWarnings("unchecked")
        Map<String, Object> root = (Map<String, Object>) JsonReader.read(run.out());
        Map<String, Object> x = extremum(sweep(root, 0), 0);
        assertEquals(3.0, (Double) x.get("value"), 1e-12);
        assertEquals(2.0, (Double) x.get("at"), 1e-5);
        Run text = Run.of("check", "--no-color", f.toString());
        assertTrue(text.out().contains("expect    low                    holds      min f over s: 3.000000000 m^2 at x = 2.0000"), text.out());
        assertTrue(text.out().contains("expect    wrong                  fails"), text.out());
    }

    @Test
    void theMaximumMassOfTheRelativisticStarAgreesWithTheTestsOwnSolve() {
        // P = K rho0^2 with K = 100 (G = c = Msun = 1). The test's own Runge-Kutta solve and its own
        // golden-section search give the heaviest star of the family; from memory, about 1.637 Msun near
        // rho0_c = 3.2e-3 in those units, the usual figure for this test star.
        CheckedText r = CheckedText.of("tov-family", "title \"TOV family\"\n" + TolmanOppenheimerVolkoffTest.HEAD + """
                let rho0(r) = sqrt(P(r)/K)
                let rho(r) = rho0(r) + P(r)/c^2
                relation tov: P'(r) = -G*(rho(r) + P(r)/c^2)*(m(r) + 4*pi*r^3*P(r)/c^2)/(r^2*(1 - 2*G*m(r)/(r*c^2)))
                relation mass: m'(r) = 4*pi*r^2*rho(r)
                boundary centre: P(0) = K*rho_c^2
                boundary m(0) = 0
                boundary surface: P(R) = 0
                sweep family: q from 5e-4 to 8e-3 log 16
                expect heaviest: max m(R) over family = 1.637 [Msun] within 0.1%
                show R in [km]
                show m(R) in [Msun]
                """);
        assertEquals(0, r.run().status(), r.run()::all);
        Map<String, Object> x = extremum(sweep(r.root(), 0), 0);
        double a = 2e-3, b = 5e-3, g = (Math.sqrt(5) - 1) / 2;
        for (int i = 0; i < 30; i++) {
            double c = b - g * (b - a), d = a + g * (b - a);
            if (TolmanOppenheimerVolkoffTest.ownSolve(c, 1, 1e-4).mass() > TolmanOppenheimerVolkoffTest.ownSolve(d, 1, 1e-4).mass()) b = d;
            else a = c;
        }
        double qMax = (a + b) / 2;
        double mMax = TolmanOppenheimerVolkoffTest.reference(qMax, 1).mass();
        assertEquals(mMax, (Double) x.get("value"), 1e-7 * mMax, () -> "plumb " + x.get("value") + ", own " + mMax / MSUN + " Msun");
        assertEquals(qMax, (Double) x.get("at"), 2e-3 * qMax);
    }

    @Test
    void aPointThatDoesNotSolveIsReportedAndTheRestGoesOn() throws IOException {
        // y' = 1 - k falls to 0 at R = 1/(k - 1) only for k > 1.
        Path f = Files.writeString(dir.resolve("half.plumb"), """
                param k > 0
                unknown R [m]
                coord r [m] from 0 to R
                unknown y(r)
                relation slope: y'(r) = (1 - k)/(1 [m])
                boundary y(0) = 1
                boundary top: y(R) = 0
                show R
                sweep s: k from 0.5 to 3 linear 6
                expect shortest: min R over s = 0.5 [m] within 1e-6
                """);
        Run run = Run.of("check", "--format", "json", f.toString());
        @SuppressWarnings("unchecked")
        Map<String, Object> root = (Map<String, Object>) JsonReader.read(run.out());
        @SuppressWarnings("unchecked")
        List<Map<String, Object>> points = (List<Map<String, Object>>) sweep(root, 0).get("points");
        assertTrue(points.get(0).containsKey("failure"), points::toString);
        assertTrue(points.get(1).containsKey("failure"), points::toString);
        for (int i = 2; i < 6; i++) {
            double k = 0.5 + 0.5 * i;
            @SuppressWarnings("unchecked")
            Map<String, Object> q = (Map<String, Object>) points.get(i).get("quantities");
            assertEquals(1 / (k - 1), (Double) q.get("R"), 1e-9 / (k - 1), points::toString);
        }
        assertEquals(Boolean.TRUE, extremum(sweep(root, 0), 0).get("at_end"));
        assertEquals(0, run.status(), run::all);
    }

    @Test
    void mistakesInASweepAreLocated() throws IOException {
        Path f = Files.writeString(dir.resolve("bad.plumb"), """
                param M [kg] > 0
                param R [m] > 0
                sweep a: Q from 1 [kg] to 2 [kg] log 5, R = 1 [m]
                sweep b: M from -1 [kg] to 2 [kg] log 5, R = 1 [m]
                sweep c: M from 1 [kg] to 2 [kg] log 5
                sweep d: M from 1 [m] to 2 [m] linear 5, R = 1 [m]
                sweep e: M from 1 [kg] to 2 [kg] linear 1, R = 1 [m]
                expect x: max M/R over nowhere = 1 [kg/m] within 1%
                """);
        Run run = Run.of("check", "--no-color", f.toString());
        assertEquals(2, run.status(), run::all);
        String err = run.err();
        assertTrue(err.contains(f + ":3:10: error: sweep 'a' varies 'Q', which is not declared"), err);
        assertTrue(err.contains(f + ":4:17: error: a 'log' sweep needs values above 0"), err);
        assertTrue(err.contains(f + ":5:7: error: sweep 'c' gives no value for R"), err);
        assertTrue(err.contains(f + ":6:17: error: the first value of 'M' does not have its unit"), err);
        assertTrue(err.contains(f + ":7:41: error: a sweep has from 2 to 10000 points, found 1"), err);
        assertTrue(err.contains(f + ":8:24: error: there is no sweep named 'nowhere'"), err);
    }

    @Test
    void aReportCarriesTheSequenceAsATableAPlotAndCsvDataInTheFilesUnits() throws IOException {
        Path f = Files.writeString(dir.resolve("line.plumb"), """
                param x [km]
                let f = 2*x
                show f in [m]
                show x^2 in [km^2]
                sweep s: x from 1 [km] to 4 [km] linear 4
                """);
        Path out = dir.resolve("report");
        Run run = Run.of("report", f.toString(), "--format", "md", "--out", out.toString());
        assertEquals(0, run.status(), run::all);
        List<String> csv = Files.readAllLines(out.resolve("sweep-s.csv"));
        // f is shown in its SI unit already, so it has no second SI column.
        assertEquals("x [km],f [m],x^2 [km^2],x^2 [m^2] (SI),failure", csv.get(0));
        assertEquals(5, csv.size());
        for (int i = 1; i <= 4; i++) {
            String[] cells = csv.get(i).split(",", -1);
            double x = Double.parseDouble(cells[0]);
            assertEquals(i, x, 1e-12);
            assertEquals(2000 * x, Double.parseDouble(cells[1]), 1e-9);
            assertEquals(x * x, Double.parseDouble(cells[2]), 1e-9);
            assertEquals(1e6 * x * x, Double.parseDouble(cells[3]), 1e-3);
            assertEquals("", cells[4]);
        }
        String md = Files.readString(out.resolve("line.md"));
        assertTrue(md.contains("### Sweep s"), md);
        // Each heading is the quantity and the file's unit for it, typeset (LaTeX between dollars).
        assertTrue(md.contains("| $`x`$ \\[$`\\mathrm{km}`$] | $`f`$ \\[$`\\mathrm{m}`$] | $`{x}^{2}`$ \\[$`\\mathrm{km^{2}}`$] |"), md);
        assertTrue(Files.exists(out.resolve("sweep-s.svg")));
    }
}
