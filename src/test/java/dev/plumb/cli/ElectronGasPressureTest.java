package dev.plumb.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * The pressure of the zero-temperature electron gas, P = A f(x) with
 * f(x) = x(2x^2 - 3) sqrt(1 + x^2) + 3 asinh(x) (Chandrasekhar 1935; 1939, ch. X), written with the
 * built-in asinh. Its derivative is checked symbolically against the known f'(x) = 8x^4/sqrt(1 + x^2),
 * and the numbers against the test's own limits: the Maclaurin series f = 8/5 x^5 - 4/7 x^7 + 1/3 x^9
 * - 5/22 x^11 + ... for small x (from the series of asinh and sqrt(1 + x^2), multiplied out by hand) and the
 * expansion f = 2x^4 - 2x^2 + 3 ln(2x) - 7/4 + O(1/x^2) for large x (likewise). No published table
 * value of f was at hand to compare with.
 */
class ElectronGasPressureTest {

    private static final String TEXT = """
            title "Chandrasekhar's f(x), and F integrated back from f'(x)"
            coord x from 0 to 100
            let f(x) = x*(2*x^2 - 3)*sqrt(1 + x^2) + 3*asinh(x)
            unknown F(x)
            relation integral: F'(x) = f'(x)
            boundary start: F(0) = 0
            claim slope: f'(x) = 8*x^4/sqrt(1 + x^2)
            claim wrong_slope: f'(x) = 8*x^4/sqrt(2 + x^2)
            show f(0.05)
            show F(0.05)
            show f(100)
            show F(100)
            show f'(100)
            """;

    private static CheckedText run;

    private static synchronized CheckedText run() {
        if (run == null) run = CheckedText.of("electron-gas-pressure", TEXT);
        return run;
    }

    private static Map<String, Object> claim(String label) {
        for (Map<String, Object> c : run().list("checks")) {
            if ("claim".equals(c.get("kind")) && label.equals(c.get("label"))) return c;
        }
        throw new AssertionError("no claim '" + label + "' in " + run().root().get("checks"));
    }

    private static double small(double x) {
        return 8.0 / 5 * Math.pow(x, 5) - 4.0 / 7 * Math.pow(x, 7) + 1.0 / 3 * Math.pow(x, 9) - 5.0 / 22 * Math.pow(x, 11);
    }

    private static double large(double x) {
        return 2 * Math.pow(x, 4) - 2 * x * x + 3 * Math.log(2 * x) - 7.0 / 4;
    }

    @Test
    void theDerivativeIsEightXToTheFourthOverTheRoot() {
        assertEquals("holds", claim("slope").get("status"), run().run()::out);
        assertEquals("fails", claim("wrong_slope").get("status"), run().run()::out);
    }

    @Test
    void smallXTendsToEightFifthsXToTheFifth() {
        double x = 0.05;
        // f is a difference of terms near 3x: its rounding is 1e-16 * 0.15 against f = 5e-7, below 1e-10 relative.
        // F integrates f' taken term by term, a difference of terms near 3 whose rounding (about 3e-16) the
        // integration carries along: 1e-15 absolute is allowed for it. The series' first neglected term
        // (x^13) is about 4e-12 of f.
        Map<String, Double> allowed = Map.of("f(0.05)", 2e-10 * small(x), "F(0.05)", 1e-15);
        for (String q : new String[]{"f(0.05)", "F(0.05)"}) {
            double v = run().numeric("fixed", q);
            assertEquals(small(x), v, allowed.get(q), q);
            // The limit itself: f / (8/5 x^5) = 1 - 5/14 x^2 + ..., within x^2 of 1.
            assertTrue(Math.abs(v / (1.6 * Math.pow(x, 5)) - 1) < x * x, q);
        }
    }

    @Test
    void largeXTendsToTwiceXToTheFourth() {
        double x = 100;
        for (String q : new String[]{"f(100)", "F(100)"}) {
            double v = run().numeric("fixed", q);
            // The O(1/x^2) remainder is about 1e-4 against f = 2e8.
            assertEquals(large(x), v, 1e-11 * large(x), q);
            assertTrue(Math.abs(v / (2 * Math.pow(x, 4)) - 1) < 2 / (x * x), q);
        }
        assertEquals(8 * Math.pow(x, 4) / Math.sqrt(1 + x * x), run().numeric("fixed", "f'(100)"), 1e-13 * 8 * Math.pow(x, 3));
    }
}
