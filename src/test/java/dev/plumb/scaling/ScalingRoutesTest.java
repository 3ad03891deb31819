package dev.plumb.scaling;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumb.lang.SourceFile;
import dev.plumb.model.Check;
import dev.plumb.model.Status;
import dev.plumb.pipeline.Analyzer;
import dev.plumb.report.Analysis;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** The three routes of a scaling check, and per-case sensitivities, on whole files. */
class ScalingRoutesTest {

    static Analysis analyze(String name, String text) {
        return new Analyzer(Analyzer.Options.defaults()).analyze(new SourceFile(name, text));
    }

    static Check scaling(Analysis a) {
        return a.checks().stream().filter(c -> c.kind().equals("scaling")).findFirst().orElseThrow();
    }

    @Test
    void uniformSphereExponentsAgreeByAllThreeRoutes() throws Exception {
        Analysis a = analyze("uniform-sphere.plumb", Files.readString(Path.of("derivations/uniform-sphere.plumb")));
        Check c = scaling(a);
        assertEquals(Status.HOLDS, c.status(), c.message());
        @SuppressWarnings("unchecked")
        List<String> routes = (List<String>) c.extra().get("routes");
        // G M^2 R^-4 (3 G M^2 / (8 pi R^4), the closed form for uniform density).
        assertTrue(routes.get(0).startsWith("closed form: G*M^2*R^(-4)"), routes.toString());
        assertTrue(routes.get(1).contains("fixed by dimensions alone"), routes.toString());
        assertTrue(routes.get(2).startsWith("numeric sweep"), routes.toString());
        // Each route decides on its own, and the sweep is straight in both parameters.
        assertTrue(c.message().contains("by closed form and dimensions and numeric sweep"), c.message());
        assertTrue(routes.get(2).contains("M from") && routes.get(2).contains("R from"), routes.toString());
        assertFalse(routes.get(2).contains("not straight"), routes.toString());
    }

    @Test
    void polytropeThreeCentralPressureStillGoesAsMSquaredOverRToTheFourth() throws Exception {
        // P(0) of an n = 3 polytrope of given M and R is 11.05 G M^2 / R^4 (Chandrasekhar 1939,
        // the structure constant; value from memory): exponents 2 and -4 exactly.
        String text = Files.readString(Path.of("derivations/polytrope.plumb"));
        if (!text.contains("scaling")) text += "\nscaling central_scaling: P(0) ~ G*M^2/R^4\n";
        Analysis a = analyze("polytrope.plumb", text);
        Check c = scaling(a);
        assertEquals(Status.HOLDS, c.status(), c.message());
        @SuppressWarnings("unchecked")
        Map<String, Object> found = (Map<String, Object>) c.extra().get("exponents");
        assertEquals(2.0, ((Number) found.get("M")).doubleValue(), 1e-4);
        assertEquals(-4.0, ((Number) found.get("R")).doubleValue(), 1e-4);

        Analysis.Row p0 = a.cases().get(0).rows().stream().filter(r -> r.expr().equals("P(0)")).findFirst().orElseThrow();
        assertEquals(2.0, p0.sensitivities().get("M"), 1e-4);
        assertEquals(-4.0, p0.sensitivities().get("R"), 1e-4);
    }

    @Test
    void uncertaintyOnCaseValuesPropagatesBothWays() throws Exception {
        String text = Files.readString(Path.of("derivations/uniform-sphere.plumb"))
                .replace("case earth: M = 5.972e24 [kg], R = 6371 [km]",
                        "case earth: M = 5.972e24 +- 5.972e22 [kg], R = 6371 +- 63.71 [km]");
        Analysis a = analyze("uniform-sphere.plumb", text);
        Analysis.CaseTable earth = a.cases().stream().filter(t -> t.label().equals("earth")).findFirst().orElseThrow();
        Analysis.Row p0 = earth.rows().get(0);
        assertNotNull(p0.uncertainty());
        // 1 % on M and 1 % on R, P ∝ M^2 R^-4: sqrt(2^2 + 4^2) % = 4.472 % to first order.
        assertEquals(Math.sqrt(20) / 100, p0.uncertainty().firstOrder() / p0.numeric(), 1e-6);
        assertEquals(p0.uncertainty().firstOrder(), p0.uncertainty().monteCarlo(),
                4 * p0.uncertainty().samplingError() + 0.01 * p0.uncertainty().firstOrder());
    }
}
