package dev.plumb.scaling;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumb.lang.Diagnostics;
import dev.plumb.lang.Parser;
import dev.plumb.lang.SourceFile;
import dev.plumb.model.Check;
import dev.plumb.model.Checker;
import dev.plumb.model.Model;
import dev.plumb.model.Status;
import dev.plumb.units.Dimension;
import dev.plumb.units.Rational;
import dev.plumb.units.UnitParser;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;

class ScalingTest {

    static Model model(String text) {
        Diagnostics d = new Diagnostics();
        Model m = Checker.check(Parser.parse(new SourceFile("test.plumb", text), d), d);
        assertFalse(m.hasErrors(), () -> "unexpected errors: " + m.diagnostics());
        return m;
    }

    static Dimension dim(String unit) throws Exception {
        return UnitParser.parse(unit).dimension();
    }

    @Test
    void uniformSphereCentralPressureIsFixedByDimensions() throws Exception {
        // P(0) from G, M, R: rank 3, three inputs, so P R^4 / (G M^2) is the one group and the
        // exponents (G 1, M 2, R -4) are forced (3 G M^2 / (8 pi R^4) has exactly these).
        Map<String, Dimension> inputs = new LinkedHashMap<>();
        inputs.put("G", dim("m^3 kg^-1 s^-2"));
        inputs.put("M", dim("kg"));
        inputs.put("R", dim("m"));
        DimensionalAnalysis da = DimensionalAnalysis.of(dim("Pa"), inputs);
        assertTrue(da.unique());
        assertEquals(3, da.rank());
        assertEquals(Rational.ONE, da.exponents().get().get("G"));
        assertEquals(Rational.of(2), da.exponents().get().get("M"));
        assertEquals(Rational.of(-4), da.exponents().get().get("R"));
        assertEquals(1, da.groupCountWithQuantity());
    }

    @Test
    void shippedUniformSphereScalingHoldsAndAWrongOneFailsOnR() throws Exception {
        String text = Files.readString(Path.of("derivations/uniform-sphere.plumb"));
        Model good = model(text);
        List<Check> checks = new ScalingChecker(good, Map.of(), e -> Optional.empty()).checkAll();
        assertEquals(1, checks.size());
        assertEquals(Status.HOLDS, checks.get(0).status(), checks.get(0).message());
        @SuppressWarnings("unchecked")
        Map<String, Object> found = (Map<String, Object>) checks.get(0).extra().get("exponents");
        assertEquals(2L, found.get("M"));
        assertEquals(-4L, found.get("R"));

        Model wrong = model(text.replace("scaling central_scaling: P(0) ~ G*M^2/R^4", "scaling central_scaling: P(0) ~ G*M^2/R^3"));
        Check c = new ScalingChecker(wrong, Map.of(), e -> Optional.empty()).checkAll().get(0);
        assertEquals(Status.FAILS, c.status());
        assertTrue(c.message().contains("exponent of R is -4, claimed -3"), c.message());
        assertFalse(c.message().contains("exponent of M"), c.message());
    }

    @Test
    void isothermalScaleHeightIsTheOneLengthOfTheRelation() throws Exception {
        // H = k_B T / (mu m_u g): the textbook isothermal scale height. Among the dimensional
        // inputs of the relation (k_B, T, m_u, g; mu is a pure number) exactly one length exists.
        Map<String, Dimension> inputs = new LinkedHashMap<>();
        inputs.put("k_B", dim("J/K"));
        inputs.put("T", dim("K"));
        inputs.put("mu", Dimension.NONE);
        inputs.put("m_u", dim("kg"));
        inputs.put("g", dim("m/s^2"));
        DimensionalAnalysis da = DimensionalAnalysis.of(dim("m"), inputs);
        Map<String, Rational> e = da.exponents().orElseThrow();
        assertEquals(Rational.ONE, e.get("k_B"));
        assertEquals(Rational.ONE, e.get("T"));
        assertEquals(Rational.of(-1), e.get("m_u"));
        assertEquals(Rational.of(-1), e.get("g"));
        assertEquals(1, da.groups().size(), "mu is the one free group");
        assertEquals(Map.of("mu", Rational.ONE), da.groups().get(0));
    }

    @Test
    void firstOrderUncertaintyOfAPowerLawAgreesWithMonteCarlo() throws Exception {
        // P ∝ M^2 R^-4 with 1 % on each: first order gives sqrt(2^2 + 4^2) % = 4.472 %.
        ParameterSensitivity.Quantity q = p -> p.get("M") * p.get("M") / Math.pow(p.get("R"), 4);
        Map<String, Double> base = Map.of("M", 2.0e30, "R", 7.0e8);
        Map<String, Double> sigma = Map.of("M", 2.0e28, "R", 7.0e6);
        Map<String, Double> s = ParameterSensitivity.sensitivities(q, base, List.of("M", "R"), 1e-4);
        assertEquals(2.0, s.get("M"), 1e-7);
        assertEquals(-4.0, s.get("R"), 1e-7);
        ParameterSensitivity.Uncertainty u = ParameterSensitivity.propagate(q, base, sigma, s, 20_000, 12345L);
        double rel = u.firstOrder() / u.value();
        assertEquals(Math.sqrt(20) / 100, rel, 1e-9);
        assertEquals(u.firstOrder(), u.monteCarlo(), 4 * u.samplingError() + 0.01 * u.firstOrder());
        ParameterSensitivity.Uncertainty again = ParameterSensitivity.propagate(q, base, sigma, s, 20_000, 12345L);
        assertEquals(u.monteCarlo(), again.monteCarlo(), 0.0, "seeded runs are reproducible");
    }

    @Test
    void sweepRecoversPowerLawSlopesAndSeesTheLineStraight() throws Exception {
        ParameterSensitivity.Quantity q = p -> 3.0 * Math.pow(p.get("a"), 1.5) / p.get("b");
        Map<String, Double> base = Map.of("a", 2.0, "b", 5.0);
        LogLogSweep a = LogLogSweep.of(q, base, "a", 0.2, 20.0, 9);
        LogLogSweep b = LogLogSweep.of(q, base, "b", 0.5, 50.0, 9);
        assertEquals(1.5, a.slope(), 1e-12);
        assertEquals(-1.0, b.slope(), 1e-12);
        assertTrue(a.straight() && b.straight());
    }

    @Test
    void aCurvedLogLogLineIsNotStraight() throws Exception {
        // Q = p + p^2 bends from slope 1 to slope 2: d ln Q / d ln p = (1 + 2p)/(1 + p).
        ParameterSensitivity.Quantity q = p -> p.get("p") + p.get("p") * p.get("p");
        LogLogSweep s = LogLogSweep.of(q, Map.of("p", 1.0), "p", 0.1, 10.0, 9);
        assertFalse(s.straight());
        assertEquals((1 + 2 * 0.1) / (1 + 0.1), LogLogSweep.localExponent(q, Map.of("p", 1.0), "p", 0.1), 1e-6);
        assertEquals((1 + 2 * 10.0) / (1 + 10.0), LogLogSweep.localExponent(q, Map.of("p", 1.0), "p", 10.0), 1e-6);
    }

    @Test
    void letDefinitionsExpandIntoMonomials() {
        Model m = model("""
                param T [K] > 0
                param mu > 0
                param g [m/s^2] > 0
                let H = k_B*T/(mu*m_u*g)
                scaling h: H ~ T/(mu*g)
                scaling wrong: H ~ T/g
                """);
        List<Check> checks = new ScalingChecker(m, Map.of(), e -> Optional.empty()).checkAll();
        assertEquals(Status.HOLDS, checks.get(0).status(), checks.get(0).message());
        assertEquals(Status.FAILS, checks.get(1).status());
        assertTrue(checks.get(1).message().contains("exponent of mu is -1, claimed 0"), checks.get(1).message());
    }

    @Test
    void isothermalRelationGivesTheScaleHeightWithItsMolecularWeight() {
        // P'(z) = -mu m_u g P / (k_B T) has the e-folding length H = k_B T / (mu m_u g).
        Model m = model("""
                param T [K] > 0
                param mu > 0
                param g [m/s^2] > 0
                param P0 [Pa] > 0
                coord z [m] from 0 to 50 [km]
                unknown P(z) [Pa]
                let H = k_B*T/(mu*m_u*g)
                relation balance: P'(z) = -mu*m_u*g*P(z)/(k_B*T)
                """);
        List<ScaleLength> scales = ScaleLength.find(m);
        assertEquals(1, scales.size());
        Map<String, Rational> e = scales.get(0).scale();
        assertEquals(Map.of("k_B", Rational.ONE, "T", Rational.ONE, "mu", Rational.of(-1), "m_u", Rational.of(-1),
                "g", Rational.of(-1)), e);
        assertEquals(Optional.of("H"), scales.get(0).matches());
    }

    @Test
    void aSphereHasNoConstantScaleLength() throws Exception {
        Model m = model(Files.readString(Path.of("derivations/uniform-sphere.plumb")));
        assertTrue(ScaleLength.find(m).isEmpty());
    }
}
