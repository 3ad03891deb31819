package dev.plumb.cli;

import static dev.plumb.cli.Codata2018.G;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * Derivatives of definitions ({@code rho'(r)} for {@code let rho(r) = ...}) through the whole run:
 * claims and steps about them decided symbolically, shown values computed both from the closed
 * form and numerically, and relations written through them solved. Check values are derivatives
 * worked by hand and the analytic n = 1 polytrope (Lane–Emden n = 1, theta = sin(xi)/xi, xi1 = pi;
 * Chandrasekhar 1939, ch. IV).
 */
class LetDerivativeEndToEndTest {

    private static Map<String, Object> check(CheckedText t, String kind, String label) {
        for (Map<String, Object> c : t.list("checks")) {
            if (kind.equals(c.get("kind")) && label.equals(c.get("label"))) return c;
        }
        throw new AssertionError("no " + kind + " '" + label + "' in " + t.root().get("checks"));
    }

    private static Map<String, Object> derived(CheckedText t, String expr) {
        return t.list("derived").stream().filter(d -> expr.equals(d.get("expr"))).findFirst()
                .orElseThrow(() -> new AssertionError("no closed form of " + expr + " in " + t.root().get("derived")));
    }

    @Test
    void claimsAndShownValuesOfDerivativesOfALinearDensity() {
        CheckedText t = CheckedText.of("linear-density-derivatives", """
                param rho_c [kg/m^3] > 0
                param R [m] > 0
                coord r [m] from 0 to R
                let rho(r) = rho_c*(1 - r/R)
                let m(r) = 4*pi*rho_c*(r^3/3 - r^4/(4*R))
                unknown P(r) [Pa]
                relation balance: P'(r) = -G*m(r)*rho(r)/r^2
                boundary surface: P(R) = 0
                claim slope: rho'(r) = -rho_c/R
                claim shell: m'(r) = 4*pi*r^2*rho(r)
                claim doubled: m'(r) = 8*pi*r^2*rho(r)
                step curvature: m''(r) = 8*pi*r*rho_c - 12*pi*rho_c*r^2/R
                case planet: rho_c = 5000 [kg/m^3], R = 6000 [km]
                show m'(R/2)
                show rho'(R/3) in [kg/m^4]
                """);
        assertEquals("holds", check(t, "claim", "slope").get("status"), t.run()::out);
        assertEquals("holds", check(t, "claim", "shell").get("status"), t.run()::out);
        assertEquals("holds", check(t, "step", "curvature").get("status"), t.run()::out);
        Map<String, Object> doubled = check(t, "claim", "doubled");
        assertEquals("fails", doubled.get("status"), doubled::toString);
        assertEquals("2", doubled.get("factor"), doubled::toString);
        // By hand: m'(r) = 4 pi r^2 rho_c (1 - r/R), at R/2 pi rho_c R^2 / 2; rho' = -rho_c/R.
        double rhoC = 5000, r = 6.0e6;
        assertEquals(Math.PI * rhoC * r * r / 2, t.numeric("planet", "m'(R/2)"), 1e-12 * Math.PI * rhoC * r * r / 2);
        assertEquals(-rhoC / r, t.numeric("planet", "rho'(R/3)"), 1e-15 * rhoC / r);
        Map<String, Object> d = derived(t, "m'(R/2)");
        assertEquals("pi*rho_c*R^2/2", d.get("closed_form"), d::toString);
        @SuppressWarnings("unchecked")
        List<Map<String, Object>> trail = (List<Map<String, Object>>) d.get("trail");
        assertEquals("differentiate the definition of m", trail.get(0).get("action"), trail::toString);
    }

    /** The n = 1 polytrope with its pressure a definition, P = K rho^2, and the balance written for P'(r). */
    @Test
    void aRelationWrittenThroughTheDerivativeOfADefinitionIsSolved() {
        CheckedText t = CheckedText.of("n1-through-a-definition", """
                param K [m^5/(kg s^2)] > 0
                param rho_c [kg/m^3] > 0
                coord r [m] from 0 to R
                unknown R [m]
                unknown rho(r) [kg/m^3]
                unknown m(r) [kg]
                let P(r) = K*rho(r)^2
                relation balance: P'(r) = -G*m(r)*rho(r)/r^2
                relation mass: m'(r) = 4*pi*r^2*rho(r)
                boundary rho(0) = rho_c
                boundary m(0) = 0
                boundary rho(R) = 0
                case a: K = 5e4 [m^5/(kg s^2)], rho_c = 1000 [kg/m^3]
                show R
                show m(R)
                show P'(R/2)
                """);
        double k = 5e4, rhoC = 1000;
        // n = 1: a^2 = (n+1) K / (4 pi G) = K / (2 pi G); R = pi a; M = 4 pi a^3 rho_c pi.
        double a = Math.sqrt(k / (2 * Math.PI * G));
        assertEquals(Math.PI * a, t.numeric("a", "R"), 1e-9 * Math.PI * a);
        assertEquals(4 * Math.PI * a * a * a * rhoC * Math.PI, t.numeric("a", "m(R)"), 1e-9 * 4 * Math.PI * a * a * a * rhoC * Math.PI);
        // P' = 2 K rho rho', with rho = rho_c sin(xi)/xi and rho' = (rho_c/a)(cos xi/xi - sin xi/xi^2): at xi = pi/2,
        // rho = 2 rho_c/pi and rho' = -4 rho_c/(pi^2 a).
        double expected = 2 * k * (2 * rhoC / Math.PI) * (-4 * rhoC / (Math.PI * Math.PI * a));
        assertEquals(expected, t.numeric("a", "P'(R/2)"), 1e-9 * Math.abs(expected));
    }

    /** A file without free parameters: its one case is 'fixed', which 'at' may name. */
    @Test
    void theImplicitCaseIsNamedFixedAndAtAcceptsIt() {
        CheckedText t = CheckedText.of("water-column", """
                param g = 9.80665 [m/s^2]
                param rho0 = 1000 [kg/m^3]
                coord z [m] from 0 to 100 [m]
                unknown P(z) [Pa]
                let Q(z) = 2*P(z)
                relation balance: Q'(z) = 2*rho0*g
                boundary top: P(0) = 101325 [Pa]
                expect named: P(100 [m]) at fixed = 1081990 [Pa] within 1e-9
                expect unnamed: P(100 [m]) = 1081990 [Pa] within 1e-9
                """);
        // P(100 m) = 101325 Pa + 1000 kg/m^3 * 9.80665 m/s^2 * 100 m = 1081990 Pa exactly.
        assertEquals("holds", check(t, "expect", "named").get("status"), t.run()::out);
        assertEquals("holds", check(t, "expect", "unnamed").get("status"), t.run()::out);
        assertEquals("fixed", check(t, "expect", "named").get("case"));
        assertEquals(0, t.run().status(), t.run()::out);
    }

    @Test
    void aDefinitionWithoutArgumentHasNoDerivativeAndTheMessageSaysWhere() throws Exception {
        java.nio.file.Path dir = java.nio.file.Files.createTempDirectory("plumb-test");
        java.nio.file.Path file = dir.resolve("flat.plumb");
        java.nio.file.Files.writeString(file, "param M [kg] > 0\nparam R [m] > 0\ncoord r [m] from 0 to R\n"
                + "let rho = M/(4/3*pi*R^3)\nshow rho'(R)\n");
        try {
            Run run = Run.of("check", file.toString());
            assertEquals(2, run.status(), run::all);
            assertTrue(run.all().contains(file + ":5:6: error: 'rho' is not a function"), run::all);
            assertTrue(!run.all().contains("Exception"), run::all);
        } finally {
            java.nio.file.Files.deleteIfExists(file);
            java.nio.file.Files.deleteIfExists(dir);
        }
    }
}
