package dev.plumb.symbolic;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumb.model.Check;
import dev.plumb.model.Status;
import java.math.BigDecimal;
import java.math.MathContext;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Claims that rest on the exact relations of the 2019 SI among the built-in constants, and
 * claims that type a number where the derivation has a constant.
 */
class ConstantRelationsTest {

    /** The relations themselves, as claims about a temperature (no profile involved). */
    private static final String RELATIONS = """
            title "Exact relations of the 2019 SI"
            param T [K] > 0
            param m [kg] > 0
            claim gas_constant: R_gas*T = N_A*k_B*T
            claim reduced_planck: hbar*2*pi = h
            claim stefan_boltzmann: sigma_SB = 2*pi^5*k_B^4/(15*h^3*c^2)
            claim rest_energy: m*c^2 = m*(299792458 [m/s])^2
            claim printed_R: R_gas*T = 8.314462618 [J/(mol K)]*T
            """;

    static SymbolicResult relations;
    static SymbolicResult sphere;

    @BeforeAll
    static void analyze() {
        relations = Fixtures.analyze(Fixtures.model("relations.plumb", RELATIONS));
        sphere = Fixtures.analyze(Fixtures.file("examples/vessa-typed-constants.plumb"));
    }

    @Test
    void theGasConstantIsAvogadroTimesBoltzmann() {
        // SI Brochure (9th ed.): R = N_A k exactly, both being defining constants.
        Check c = Fixtures.check(relations, "gas_constant");
        assertEquals(Status.HOLDS, c.status(), c.message());
    }

    @Test
    void hbarTimesTwoPiIsPlancksConstant() {
        // SI Brochure (9th ed.): hbar = h/(2 pi).
        Check c = Fixtures.check(relations, "reduced_planck");
        assertEquals(Status.HOLDS, c.status(), c.message());
    }

    @Test
    void theStefanBoltzmannConstantFollowsFromKhAndC() {
        // SI Brochure (9th ed.) lists sigma = 2 pi^5 k^4/(15 h^3 c^2) among the exact derived constants.
        Check c = Fixtures.check(relations, "stefan_boltzmann");
        assertEquals(Status.HOLDS, c.status(), c.message());
    }

    @Test
    void theSpeedOfLightTypedWithAllItsDigitsIsTheConstant() {
        // SI Brochure (9th ed.): c = 299 792 458 m/s exactly.
        Check c = Fixtures.check(relations, "rest_energy");
        assertEquals(Status.HOLDS, c.status(), c.message());
    }

    @Test
    void theGasConstantTypedToCodatasTenPrintedDigitsIsOffByItsTruncation() {
        // CODATA 2018 prints R = 8.314 462 618... J mol^-1 K^-1, a truncation of N_A k = 8.314 462 618 153 24
        // (6.022 140 76e23 * 1.380 649e-23, SI Brochure 9th ed.): the ratio is computed here independently.
        BigDecimal exact = new BigDecimal("6.02214076e23").multiply(new BigDecimal("1.380649e-23"));
        double ratio = new BigDecimal("8.314462618").divide(exact, MathContext.DECIMAL64).doubleValue();
        Check c = Fixtures.check(relations, "printed_R");
        assertEquals(Status.FAILS, c.status(), c.message());
        // The factor is shown to the second significant digit of its difference from 1: half a unit in that place.
        assertEquals(ratio, Double.parseDouble(c.factor()), 5e-13, c.message());
        assertTrue(c.message().contains("the value used for R_gas"), c.message());
    }

    @Test
    void gravitationalConstantTypedInCgsGetsItsNumericRatioAndIsNamed() {
        // CODATA 2018: G = 6.67430e-11 m^3 kg^-1 s^-2; 6.674e-8 cm^3 g^-1 s^-2 is 6.674e-11 in SI (NIST SP 811).
        double ratio = 6.674e-11 / 6.67430e-11;
        Check c = Fixtures.check(sphere, "cgs_G");
        assertEquals(Status.FAILS, c.status(), c.message());
        // Shown as 0.999955 (to the second significant digit of its difference from 1): half a unit in the last place.
        assertEquals(ratio, Double.parseDouble(c.factor()), 5e-7, c.message());
        assertTrue(c.message().contains("the value used for G (6.674e-11 m^3 kg^-1 s^-2)"), c.message());
        assertTrue(c.message().contains("6.67430e-11"), c.message());
    }

    @Test
    void gravitationalConstantTypedAsCodataPrintsItHolds() {
        // CODATA 2018: G = 6.67430e-11 m^3 kg^-1 s^-2.
        Check c = Fixtures.check(sphere, "codata_G");
        assertEquals(Status.HOLDS, c.status(), c.message());
    }

    @Test
    void aWrongFactorOfTwoIsStillTwo() {
        Check c = Fixtures.check(sphere, "doubled");
        assertEquals(Status.FAILS, c.status(), c.message());
        assertEquals("2", c.factor(), c.message());
    }

    @Test
    void aTrulyDifferentPowerOfAConstantIsADependence() {
        Check c = Fixtures.check(sphere, "stray_mass_ratio");
        assertEquals(Status.FAILS, c.status(), c.message());
        assertNull(c.factor(), c.message());
        assertTrue(c.message().contains("proportional to m_e*m_p^(-1)"), c.message());
        // CODATA 2018: m_p/m_e = 1836.15267343, so the ratio at the constants' values is its inverse.
        String value = c.message().replaceAll(".*claimed/true = ([0-9.e-]+).*", "$1");
        // Shown to five significant digits (0.00054462): half a unit in the last place.
        assertEquals(1 / 1836.15267343, Double.parseDouble(value), 5e-9, c.message());
    }

    @Test
    void theGasConstantPerMoleIsTheBoltzmannConstantPerMolecule() {
        // SI Brochure (9th ed.): R = N_A k exactly.
        Check c = Fixtures.check(sphere, "per_mole");
        assertEquals(Status.HOLDS, c.status(), c.message());
    }

    @Test
    void oneGramPerMoleIsNotExactlyTheMolarMassConstant() {
        // CODATA 2018: M_u = N_A m_u = 0.999 999 999 65(30)e-3 kg/mol, no longer exactly 1 g/mol since the 2019 SI.
        Check c = Fixtures.check(sphere, "one_gram_per_mole");
        assertEquals(Status.FAILS, c.status(), c.message());
        assertEquals(0.99999999965, Double.parseDouble(c.factor()), 5e-12, c.message());
        assertTrue(c.message().contains("(claimed/true is m_u*N_A times a number"), c.message());
        assertTrue(c.message().contains("N_A") && c.message().contains("m_u"), c.message());
    }
}
