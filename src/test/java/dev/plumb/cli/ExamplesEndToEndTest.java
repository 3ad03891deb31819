package dev.plumb.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.util.List;
import java.util.Map;
import java.util.Set;
import org.junit.jupiter.api.Test;

/**
 * Every file in {@code examples/} run through {@code plumb check --format json}, as a user would:
 * the exit status, the verdict of the checks that matter, the factor of a wrong claim, and the
 * numbers. Values computed by hand from the closed forms use CODATA 2018 G, k_B, m_u and the IAU
 * 2015 Resolution B3 nominal values, as the files' comments say.
 */
class ExamplesEndToEndTest {

    private static final Set<String> KINDS = Set.of("units", "step", "claim", "scaling", "expect", "boundary", "relation");
    private static final Set<String> STATUSES = Set.of("holds", "fails", "undecided");

    /** One example's JSON document, checked for the shape of the design brief on the way in. */
    private record Doc(String file, Map<String, Object> root) {

        @SuppressWarnings("unchecked")
        List<Map<String, Object>> list(String key) {
            return (List<Map<String, Object>>) assertInstanceOf(List.class, root.get(key), file + ": " + key);
        }

        Map<String, Object> check(String kind, String label) {
            return list("checks").stream().filter(c -> kind.equals(c.get("kind")) && label.equals(c.get("label"))).findFirst()
                    .orElseThrow(() -> new AssertionError(file + ": no " + kind + " check '" + label + "' in " + root.get("checks")));
        }

        void holds(String kind, String... labels) {
            for (String l : labels) assertEquals("holds", check(kind, l).get("status"), () -> file + ": " + check(kind, l));
        }

        void fails(String kind, String label, String factor) {
            Map<String, Object> c = check(kind, label);
            assertEquals("fails", c.get("status"), () -> file + ": " + c);
            if (factor != null) assertEquals(factor, c.get("factor"), () -> file + ": " + c);
        }

        String closedForm(String expr) {
            return list("derived").stream().filter(d -> expr.equals(d.get("expr"))).findFirst()
                    .map(d -> (String) d.get("closed_form"))
                    .orElseThrow(() -> new AssertionError(file + ": no closed form of " + expr + " in " + root.get("derived")));
        }

        @SuppressWarnings("unchecked")
        Map<String, Object> quantity(String caseLabel, String expr) {
            for (Map<String, Object> c : list("cases")) {
                if (!caseLabel.equals(c.get("label"))) continue;
                for (Object q : (List<Object>) c.get("quantities")) {
                    Map<String, Object> m = (Map<String, Object>) q;
                    if (expr.equals(m.get("expr"))) return m;
                }
            }
            throw new AssertionError(file + ": no quantity " + expr + " in case " + caseLabel + ": " + root.get("cases"));
        }

        /** The numeric value in SI, within {@code rel} of {@code expected}. */
        void numeric(String caseLabel, String expr, double expected, double rel) {
            double v = (Double) quantity(caseLabel, expr).get("numeric");
            assertEquals(expected, v, Math.abs(expected) * rel, () -> file + ": " + expr + " in case " + caseLabel);
        }
    }

    @SuppressWarnings("unchecked")
    private static Doc run(String name, int status) {
        String file = "examples/" + name + ".plumb";
        Run run = Run.of("check", "--format", "json", file);
        assertEquals(status, run.status(), run::all);
        assertEquals("", run.err(), file + ": nothing but JSON may reach the user");
        for (String noise : List.of("internal error", "Exception", "\tat ", "log4j", "SLF4J", "TimeConstrained")) {
            assertFalse(run.out().contains(noise), () -> file + " printed '" + noise + "': " + run.out());
        }
        Map<String, Object> root = (Map<String, Object>) assertInstanceOf(Map.class, JsonReader.read(run.out()));
        Doc doc = new Doc(file, root);
        assertEquals(file, root.get("file"));
        assertEquals(status == 0, root.get("ok"), file);
        for (String key : List.of("diagnostics", "checks", "derived", "cases")) doc.list(key);
        for (Map<String, Object> d : doc.list("diagnostics")) {
            assertTrue(Set.of("error", "warning", "note").contains(d.get("severity")), () -> file + ": " + d);
            assertTrue(d.get("message") instanceof String, () -> file + ": " + d);
            if (!"error".equals(d.get("severity"))) continue;
            assertTrue((Double) d.get("line") >= 1 && (Double) d.get("column") >= 1, () -> file + ": an error without a place: " + d);
        }
        for (Map<String, Object> c : doc.list("checks")) {
            assertTrue(KINDS.contains(c.get("kind")) && STATUSES.contains(c.get("status")), () -> file + ": " + c);
            assertTrue(c.get("label") instanceof String && (Double) c.get("line") >= 1 && c.get("message") instanceof String,
                    () -> file + ": " + c);
        }
        return doc;
    }

    private static void error(Doc doc, int line, int column, String words) {
        for (Map<String, Object> d : doc.list("diagnostics")) {
            if ("error".equals(d.get("severity")) && (Double) d.get("line") == line && (Double) d.get("column") == column
                    && ((String) d.get("message")).contains(words)) return;
        }
        fail(doc.file() + ": no error at " + line + ":" + column + " saying '" + words + "': " + doc.root().get("diagnostics"));
    }

    // ---- examples that hold ------------------------------------------------------------------

    @Test
    void derivativeOnTheRightAndBoundaryReversed() {
        Doc d = run("orrin-derivative-on-the-right", 0);
        d.holds("claim", "central");
        d.holds("expect", "centre");
        // 3/(8 pi) G M^2/R^4 with CODATA 2018 G and IAU 2015 B3 nominal Earth GM and equatorial radius
        d.numeric("orrin", "P(0)", 1.71706144e11, 1e-7);
        assertEquals("3*G*M^2/(8*pi*R^4)", d.closedForm("P(0)"));
    }

    @Test
    void everyEquationWrittenRightToLeft() {
        Doc d = run("faro-sides-swapped", 1);
        d.holds("step", "s");
        d.holds("claim", "central");
        d.holds("scaling", "central_scaling");
        d.fails("claim", "doubled", "2");
    }

    @Test
    void multipliedThroughAndUnknownMass() {
        Doc teth = run("teth-multiplied-through", 0);
        teth.holds("step", "s1");
        teth.holds("claim", "central");
        teth.holds("scaling", "central_scaling");
        // 2/3 pi G rho^2 R^2 with rho = 2900 kg/m^3, R = 800 km (CODATA 2018 G): 7.523853e8 Pa
        teth.numeric("teth", "P(0)", 7.523853e8, 1e-6);

        Doc pell = run("pell-unknown-mass", 0);
        pell.holds("claim", "total", "central");
        assertEquals("4*pi*rho*r^3/3", pell.closedForm("m(r)"));
        // 4/3 pi rho R^3 with rho = 2200 kg/m^3, R = 260 km: 1.619688e20 kg
        pell.numeric("pell", "m(R)", 1.619688e20, 1e-6);
    }

    @Test
    void densityLawsLinearParabolicAndLayered() {
        // P has a double zero at the surface in both: the numeric side must still meet the closed form.
        // CODATA 2018 G; IAU 2015 Resolution B3 nominal solar GM and radius, Jupiter GM and equatorial radius.
        double g = 6.67430e-11, msun = 1.3271244e20 / g, rsun = 6.957e8, mjup = 1.2668653e17 / g, rjup = 7.1492e7;
        Doc amsel = run("amsel-linear-density", 0);
        amsel.holds("claim", "mass", "central", "central_rho");
        amsel.holds("expect", "centre");
        // Linear law: P(0) = 5 pi G rho_c^2 R^2 / 36 with rho_c = 3 M / (pi R^3)
        double rhoC = 3 * msun / (Math.PI * Math.pow(rsun, 3));
        amsel.numeric("amsel", "P(0)", 5 * Math.PI * g * rhoC * rhoC * rsun * rsun / 36, 1e-9);
        Doc brask = run("brask-parabolic-density", 0);
        brask.holds("claim", "total", "central");
        brask.holds("expect", "centre_value");
        assertEquals("15*G*M^2/(16*pi*R^4)", brask.closedForm("P(0)"));
        brask.numeric("brask", "P(0)", 15 / (16 * Math.PI) * g * mjup * mjup / Math.pow(rjup, 4), 1e-9);

        Doc corvel = run("corvel-core-and-mantle", 0);
        corvel.holds("claim", "central");
        corvel.holds("expect", "centre_value");
        // pi G R^2 (rho_1^2 + rho_1 rho_2 + 2 rho_2^2)/6, by hand: 8.5240234e10 Pa
        corvel.numeric("corvel", "P(0)", 8.5240234e10, 1e-7);
    }

    @Test
    void atmospheresAndALake() {
        Doc nemre = run("nemre-isothermal-air", 0);
        nemre.holds("claim", "profile");
        nemre.holds("expect", "height", "one_height", "eight_km");

        Doc tamsin = run("tamsin-lapse-rate-in-h", 0);
        tamsin.holds("claim", "profile");
        tamsin.holds("expect", "tropopause", "five_km");
        // U.S. Standard Atmosphere, 1976: 22632.06 Pa at 11 km geopotential altitude
        tamsin.numeric("fixed", "P(11 [km])", 22632.06, 1e-6);
        assertTrue(tamsin.list("diagnostics").stream().anyMatch(x -> "warning".equals(x.get("severity"))
                && ((String) x.get("message")).contains("shadows the built-in constant h")), tamsin.file());

        Doc lake = run("lake-depth-downward", 0);
        lake.holds("claim", "profile");
        lake.holds("expect", "ten_m", "ten_m_exact");
        // 1 atm = 101325 Pa (NIST SP 811) plus 1000 kg/m^3 * 9.80665 m/s^2 (by definition) * 10 m
        lake.numeric("fixed", "P(10 [m])", 199391.5, 1e-12);
    }

    @Test
    void freeSurfaces() {
        Doc ulmo = run("ulmo-water-world", 0);
        ulmo.holds("claim", "radius");
        ulmo.holds("expect", "radius_value", "centre_value");
        // (3 M/(4 pi rho))^(1/3) with M = 0.1 nominal Earth masses (IAU 2015 B3): 5224.136 km
        ulmo.numeric("fixed", "R", 5.224136e6, 1e-6);

        Doc sif = run("sif-free-surface", 0);
        sif.holds("claim", "radius");
        sif.holds("scaling", "radius_scaling");
        // sqrt(3 P_c/(2 pi G rho0^2)) with P_c = 10 GPa, rho0 = 3000 kg/m^3: 2819.334 km
        sif.numeric("sif", "R", 2.819334e6, 1e-6);
    }

    @Test
    void laneEmdenAndPolytropes() {
        Doc five = run("lane-emden-five-halves-names", 0);
        five.holds("expect", "first_zero", "mass");
        // Chandrasekhar (1939), table of polytropes, n = 2.5 (from memory): xi1 = 5.35528
        five.numeric("fixed", "E", 5.35528, 1e-5);

        Doc one = run("lane-emden-one-exact", 0);
        one.holds("expect", "zero_value", "mass", "half");
        // Analytic: theta = sin(xi)/xi, first zero pi, found from the second-order form too.
        one.holds("claim", "zero");
        one.numeric("fixed", "xi1", Math.PI, 1e-9);

        Doc daro = run("daro-n1-polytrope", 0);
        daro.holds("scaling", "central_scaling");
        daro.holds("expect", "centre_value", "concentration");
        // n = 1: P(0) = pi/8 G M^2/R^4 (W_1 = 0.3927 in Chandrasekhar's table, from memory) for the nominal Sun
        daro.numeric("daro", "P(0)", Math.PI / 8 * 6.67430e-11 * Math.pow(1.3271244e20 / 6.67430e-11, 2) / Math.pow(6.957e8, 4), 1e-7);

        Doc wenn = run("wenn-rational-unit-constant", 0);
        wenn.holds("expect", "radius", "total");
    }

    @Test
    void cgsUncertaintyAndOddNames() {
        Doc kestra = run("kestra-cgs-units", 0);
        kestra.holds("claim", "central");
        Map<String, Object> q = kestra.quantity("kestra", "P(0)");
        assertEquals("Pa", q.get("unit"), "numbers in cases are SI");
        // 2/3 pi G rho^2 R^2 with rho = 5.5 g/cm^3, R = 6371 km: 1.7163463e11 Pa = 1.7163463e12 dyn/cm^2
        assertEquals(1.7163463e11, (Double) q.get("numeric"), 1e4);

        Doc ilex = run("ilex-uncertain-mass", 0);
        ilex.holds("expect", "as_fraction", "as_quantity", "in_other_unit");
        @SuppressWarnings("unchecked")
        Map<String, Object> u = (Map<String, Object>) ilex.quantity("ilex", "P(0)").get("uncertainty");
        // P(0) goes as M^2: a 2 % mass uncertainty is a 4 % pressure uncertainty to first order
        assertEquals(0.04, (Double) u.get("first_order") / (Double) ilex.quantity("ilex", "P(0)").get("numeric"), 1e-6);

        Doc ivo = run("ivo-sea-with-odd-names", 0);
        ivo.holds("claim", "profile");
        ivo.holds("expect", "floor");
        assertEquals("101325 + E*I*D", ivo.closedForm("P(D)"));
    }

    @Test
    void inventedInteriorsAndASequenceHold() {
        Doc tessaly = run("tessaly-rocky-planet-three-ways", 0);
        tessaly.holds("claim", "uniform_centre", "layered_total", "layered_centre");
        tessaly.holds("expect", "poly_over_uniform");
        Doc orvanth = run("orvanth-gas-giant-polytrope", 0);
        orvanth.holds("expect", "concentration", "central_coefficient");
        orvanth.holds("scaling", "central");
        run("pellucid-dwarfs-sweep", 0).holds("expect", "smallest", "largest");
    }

    // ---- examples that fail, as their comments say --------------------------------------------

    @Test
    void wrongFactorsAreNamed() {
        Doc d = run("asker-wrong-factors", 1);
        d.fails("claim", "doubled", "2");
        d.fails("claim", "negated", "-1");
        d.fails("claim", "three_halves", "3/2");
        d.fails("claim", "eight_pi_thirds", "8*pi/3");
    }

    @Test
    void aHandDerivationFailsExactlyOnItsThreeMistakes() {
        Doc d = run("quillon-hand-derivation-mistakes", 1);
        d.fails("step", "mass_wrong", null);
        assertTrue(((String) d.check("step", "mass_wrong").get("message")).contains("relation 'mass' is not met"));
        d.fails("step", "gradient_sign", "-1");
        d.fails("claim", "central_halved", "1/2");
        d.holds("step", "mass_right", "gradient");
        d.holds("claim", "central");
    }

    @Test
    void aScalingCheckBeforeASimulationCatchesTheWrongDensityLaw() {
        Doc d = run("hollin-scaling-before-simulation", 1);
        d.holds("scaling", "pressure", "temperature");
        d.fails("scaling", "wrong_density", null);
        assertTrue(((String) d.check("scaling", "wrong_density").get("message")).contains("exponent of R is -3.000000, claimed -2"),
                () -> d.check("scaling", "wrong_density").toString());
    }

    @Test
    void wrongStepsSayWhatIsWrong() {
        Doc d = run("bode-wrong-steps", 1);
        d.fails("step", "flipped", "-1");
        d.fails("step", "no_boundary", null);
        assertTrue(((String) d.check("step", "no_boundary").get("message")).contains("boundary 'surface' is not met"));
        d.holds("step", "right");
    }

    @Test
    void wrongScalingUnitsAndExpectation() {
        Doc cale = run("cale-wrong-scaling", 1);
        cale.fails("scaling", "wrong_power", null);
        @SuppressWarnings("unchecked")
        Map<String, Object> exps = (Map<String, Object>) cale.check("scaling", "wrong_power").get("exponents");
        assertEquals(-4.0, exps.get("R"));

        Doc dree = run("dree-wrong-units", 1);
        dree.fails("units", "balance", null);
        error(dree, 9, 27, "the two sides of relation 'balance' have different units");

        Doc eske = run("eske-wrong-expect", 1);
        eske.fails("expect", "centre", null);
        eske.holds("expect", "centre_ok");
    }

    @Test
    void brokenInputIsPlacedAndExitsTwo() {
        error(run("broken-syntax", 2), 6, 30, "expected an expression");
        error(run("broken-unknown-unit", 2), 3, 10, "unknown unit 'furlong'");
        error(run("broken-undefined-name", 2), 6, 39, "'rho' is not defined");
    }
}
