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
import dev.plumb.numeric.NumericOptions;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/**
 * Scaling verdicts by the routes that decide: a quantity that depends on a free dimensionless
 * group is not passed as a power law, and true power laws still hold. The numeric route solves the
 * relations here (no closed forms are handed in), as plumb does when no closed form is found.
 */
class ScalingVerdictsTest {

    // Sea water: rho0 = 1025 kg/m^3 and bulk modulus Kb = 2.2e9 Pa are common-practice values
    // (no source); g_n = 9.80665 m/s^2 is standard gravity (exact by definition).
    static final double RHO0 = 1025;
    static final double KB = 2.2e9;
    static final double G_N = 9.80665;

    static final String OCEAN = """
            title "Compressible ocean, z downward"
            param rho0 = 1025 [kg/m^3]
            param Kb = 2.2e9 [Pa]
            param g = 9.80665 [m/s^2]
            param D [m] > 0
            coord z [m] from 0 to D
            unknown P(z) [Pa]
            relation balance: P'(z) = rho0*g*exp(P(z)/Kb)
            boundary top: P(0) = 0
            scaling a: P(D) ~ (rho0*g*D)^1.1*Kb^(-0.1)
            scaling b: P(D) ~ rho0*g*D
            case shelf: D = 1 [km]
            case trench: D = 11 [km]
            """;

    static Model model(String text) {
        Diagnostics d = new Diagnostics();
        Model m = Checker.check(Parser.parse(new SourceFile("test.plumb", text), d), d);
        assertFalse(m.hasErrors(), () -> "unexpected errors: " + m.diagnostics());
        return m;
    }

    /** Every scaling check of a model, the numeric route solving the relations at the sweep tolerance plumb uses. */
    static List<Check> checks(Model m) {
        NumericOptions sweep = new NumericOptions(1e-10, 1e-12, false);
        return new ScalingChecker(m, Map.of(), e -> Optional.of(new SolvedQuantity(m, e, sweep))).checkAll();
    }

    static Check named(List<Check> checks, String label) {
        return checks.stream().filter(c -> c.label().equals(label)).findFirst().orElseThrow();
    }

    /**
     * d ln P / d ln D of the separated solution P(D) = -Kb ln(1 - x), x = rho0 g D / Kb:
     * x / ((1 - x)(-ln(1 - x))), written with log1p so that small x keeps its digits.
     */
    static double oceanExponent(double depth) {
        double x = RHO0 * G_N * depth / KB;
        return x / ((1 - x) * -Math.log1p(-x));
    }

    /** The two numbers of "the exponent of NAME goes from A to B" in a message. */
    static double[] drift(String message, String name) {
        Matcher m = Pattern.compile("the exponent of " + name + " goes from ([-0-9.]+) to ([-0-9.]+)").matcher(message);
        assertTrue(m.find(), message);
        return new double[] {Double.parseDouble(m.group(1)), Double.parseDouble(m.group(2))};
    }

    @Test
    void compressibleOceanIsNotAPowerLawInDepth() {
        List<Check> checks = checks(model(OCEAN));
        for (String label : List.of("a", "b")) {
            Check c = named(checks, label);
            assertEquals(Status.FAILS, c.status(), c.message());
            assertTrue(c.message().contains("numeric sweep: not a power law over the sweep"), c.message());
            // The sweep runs between the two cases' depths, 1 km and 11 km: the exponent of D
            // climbs from 1.0023 to 1.0260 there (the separated solution, above).
            double[] ab = drift(c.message(), "D");
            assertEquals(oceanExponent(1000), ab[0], 2e-5, c.message());
            assertEquals(oceanExponent(11000), ab[1], 2e-5, c.message());
            // rho0*g*D/Kb is free: dimensions leave the verdict to the other routes.
            assertTrue(c.message().contains("dimensions alone do not fix the exponents"), c.message());
        }
    }

    @Test
    void theSeparatedSolutionWrittenOutIsNotAPowerLawEither() {
        // The closed form as a definition: the closed-form route sweeps it, since it is no product of powers.
        Model m = model("""
                param rho0 = 1025 [kg/m^3]
                param Kb = 2.2e9 [Pa]
                param g = 9.80665 [m/s^2]
                param D [m] > 0
                let PD = -Kb*log(1 - rho0*g*D/Kb)
                scaling a: PD ~ (rho0*g*D)^1.1*Kb^(-0.1)
                scaling b: PD ~ rho0*g*D
                case shelf: D = 1 [km]
                case trench: D = 11 [km]
                """);
        for (Check c : checks(m)) {
            assertEquals(Status.FAILS, c.status(), c.message());
            assertTrue(c.message().contains("closed form: not a power law over the sweep"), c.message());
            double[] ab = drift(c.message(), "D");
            assertEquals(oceanExponent(1000), ab[0], 2e-5, c.message());
            assertEquals(oceanExponent(11000), ab[1], 2e-5, c.message());
        }
    }

    @Test
    void anExponentOfOnePointOneFailsWhereTheTruthIsNotAPowerLaw() {
        // A single case: the sweep spans two decades around 4 km, 400 m to 40 km, where the
        // local exponent runs from oceanExponent(400) to oceanExponent(40000), about 1.0009 to 1.10.
        Check c = named(checks(model(OCEAN.replace("case shelf: D = 1 [km]\ncase trench: D = 11 [km]\n", "case mid: D = 4 [km]\n"))), "a");
        assertEquals(Status.FAILS, c.status(), c.message());
        double[] ab = drift(c.message(), "D");
        assertEquals(oceanExponent(400), ab[0], 2e-5, c.message());
        assertEquals(oceanExponent(40000), ab[1], 2e-5, c.message());
    }

    @Test
    void aLengthWrittenAsALiteralIsAScaleDimensionsCannotIgnore() {
        // Density falling off over 1 km: P(D) = rho0 g L (1 - exp(-D/L)), L = 1 km, so
        // d ln P / d ln D = x / (e^x - 1) with x = D/L. Without the literal among the inputs,
        // dimensions would take rho0*g*D as forced and pass the claim.
        Model m = model("""
                param rho0 [kg/m^3] > 0
                param g [m/s^2] > 0
                param D [m] > 0
                coord z [m] from 0 to D
                unknown P(z) [Pa]
                relation balance: P'(z) = rho0*g*exp(-z/(1 [km]))
                boundary top: P(0) = 0
                scaling s: P(D) ~ rho0*g*D
                case c: rho0 = 1025 [kg/m^3], g = 9.80665 [m/s^2], D = 3 [km]
                """);
        Check c = checks(m).get(0);
        assertEquals(Status.FAILS, c.status(), c.message());
        assertTrue(c.message().contains("(1 [km])"), c.message());
        assertTrue(c.message().contains("dimensions alone do not fix the exponents"), c.message());
        double[] ab = drift(c.message(), "D");
        assertEquals(0.3 / Math.expm1(0.3), ab[0], 2e-5, c.message());
        assertEquals(30 / Math.expm1(30), ab[1], 2e-5, c.message());
    }

    @Test
    void polytropeThreeCentralPressureHoldsByHomology() throws Exception {
        // Homology: polytropes of one index are scaled copies, so P(0) = C_n G M^2 / R^4 with a
        // pure number C_n (Chandrasekhar 1939, ch. IV): exponents 1, 2, -4, exactly.
        Model m = model(Files.readString(Path.of("derivations/polytrope.plumb")));
        Check c = named(checks(m), "central_scaling");
        assertEquals(Status.HOLDS, c.status(), c.message());
        @SuppressWarnings("unchecked")
        Map<String, Object> found = (Map<String, Object>) c.extra().get("exponents");
        assertEquals(2.0, ((Number) found.get("M")).doubleValue(), LogLogSweep.TOLERANCE);
        assertEquals(-4.0, ((Number) found.get("R")).doubleValue(), LogLogSweep.TOLERANCE);
    }

    @Test
    void aWrongPowerOfRFailsNumericallyWithTheDifference() throws Exception {
        String text = Files.readString(Path.of("derivations/polytrope.plumb"))
                .replace("scaling central_scaling: P(0) ~ G*M^2/R^4", "scaling central_scaling: P(0) ~ G*M^2/R^3");
        Check c = named(checks(model(text)), "central_scaling");
        assertEquals(Status.FAILS, c.status(), c.message());
        assertTrue(c.message().contains("dimensions: exponent of R is -4, claimed -3"), c.message());
        Matcher off = Pattern.compile("numeric sweep: exponent of R is ([-0-9.]+), claimed -3: off by ([-0-9.e]+)").matcher(c.message());
        assertTrue(off.find(), c.message());
        assertEquals(-4.0, Double.parseDouble(off.group(1)), LogLogSweep.TOLERANCE);
        assertEquals(-1.0, Double.parseDouble(off.group(2)), 1e-3);
        assertFalse(c.message().contains("exponent of M"), c.message());
    }

    @Test
    void routesThatContradictEachOtherLeaveTheClaimUndecidedAndSaySo() throws Exception {
        // A closed form with a wrong power of R, as if the symbolic side had erred: dimensions and
        // the numeric solve of the uniform sphere both find R^-4, so the claim cannot be settled.
        Model m = model(Files.readString(Path.of("derivations/uniform-sphere.plumb")));
        Map<String, dev.plumb.lang.Expr> wrong = Map.of("P(0)", Parser.parseExpression("3/(8*pi)*G*M^2/R^3"));
        NumericOptions sweep = new NumericOptions(1e-10, 1e-12, false);
        Check c = new ScalingChecker(m, wrong, e -> Optional.of(new SolvedQuantity(m, e, sweep))).checkAll().get(0);
        assertEquals(Status.UNDECIDED, c.status(), c.message());
        assertEquals(Boolean.TRUE, c.extra().get("contradiction"));
        assertTrue(c.message().startsWith("the routes contradict each other"), c.message());
        assertTrue(c.message().contains("dimensions and numeric sweep find the claimed exponents, but closed form: exponent of R is -3, claimed -4"),
                c.message());
    }

    @Test
    void isothermalScaleHeightAndThePressureThereHold() throws Exception {
        // H = k_B T / (mu m_u g) is the scale height, and P(H) = P0/e: P(H) goes as P0 alone.
        String text = Files.readString(Path.of("derivations/isothermal-atmosphere.plumb"))
                + "\nscaling at_height: P(H) ~ P0\nscaling wrong: P(H) ~ P0*T^0.01\n"
                + "case air: T = 288.15 [K], mu = 28.9644, g = 9.80665 [m/s^2], P0 = 101325 [Pa]\n";
        List<Check> checks = checks(model(text));
        Check h = named(checks, "height");
        assertEquals(Status.HOLDS, h.status(), h.message());
        assertTrue(h.message().contains("by closed form and numeric sweep"), h.message());
        Check p = named(checks, "at_height");
        assertEquals(Status.HOLDS, p.status(), p.message());
        Check w = named(checks, "wrong");
        assertEquals(Status.FAILS, w.status(), w.message());
        assertTrue(w.message().contains("exponent of T is"), w.message());
    }
}
