package dev.plumb.model;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.apache.commons.math3.util.FastMath;
import org.junit.jupiter.api.Test;

/**
 * The inverse hyperbolic functions that {@code java.lang.Math} lacks, and {@code ln}, checked
 * against their logarithmic definitions computed with {@code Math.log} and {@code Math.sqrt},
 * against Apache Commons Math's independent {@code FastMath} implementation, and against their
 * Maclaurin and asymptotic series where those are exact to double precision.
 */
class BuiltinFunctionTest {

    private static final double[] MODERATE = {0.05, 0.3, 0.8813735870195430, 1, 1.7, 3, 12.5, 250, 4.2e3};

    @Test
    void lnIsTheNaturalLogarithmOfJavaLangMath() {
        for (double x : new double[]{1e-300, 0.5, 1, Math.E, 2, 10, 1e300}) {
            assertEquals(Math.log(x), BuiltinFunction.LN.apply(x), 0.0, "ln " + x);
            assertEquals(Math.log(x), BuiltinFunction.LOG.apply(x), 0.0, "log " + x);
        }
        assertTrue(Double.isNaN(BuiltinFunction.LN.apply(-1)));
    }

    @Test
    void asinhAgreesWithItsLogarithmAndWithCommonsMath() {
        for (double x : MODERATE) {
            // ln(x + sqrt(x^2 + 1)): exact mathematics, rounding-limited only for moderate x > 0.
            double byLog = Math.log(x + Math.sqrt(x * x + 1));
            assertEquals(byLog, BuiltinFunction.asinh(x), 4e-16 * Math.max(1, byLog), "asinh " + x);
            assertEquals(FastMath.asinh(x), BuiltinFunction.asinh(x), 4e-16 * Math.abs(byLog), "FastMath.asinh " + x);
            assertEquals(-BuiltinFunction.asinh(x), BuiltinFunction.asinh(-x), 0.0, "odd symmetry at " + x);
        }
        // ln(1 + sqrt 2) = 0.881373587019543025... (value from memory; the line above checks it through the logarithm).
        assertEquals(0.881373587019543025, BuiltinFunction.asinh(1), 2e-16);
    }

    @Test
    void asinhKeepsFullPrecisionNearZeroAndForHugeArguments() {
        // Maclaurin series x - x^3/6 + 3x^5/40: the next term, 15x^7/336, is below 1e-30 relative here.
        double x = 1e-4;
        assertEquals(x - x * x * x / 6 + 3 * Math.pow(x, 5) / 40, BuiltinFunction.asinh(x), 1e-20);
        assertEquals(1e-200, BuiltinFunction.asinh(1e-200), 0.0);
        // asinh x = ln(2x) + 1/(4x^2) - ...: at 1e200 the correction is 1e-400, so ln 2 + 200 ln 10 to rounding.
        assertEquals(Math.log(2) + 200 * Math.log(10), BuiltinFunction.asinh(1e200), 1e-13);
        assertEquals(Math.log(2) + Math.log(1e9) + 1 / (4 * 1e18), BuiltinFunction.asinh(1e9), 1e-14);
    }

    @Test
    void acoshAgreesWithItsLogarithmAndWithCommonsMath() {
        for (double x : MODERATE) {
            double u = 1 + x;
            double byLog = Math.log(u + Math.sqrt(u * u - 1));
            assertEquals(byLog, BuiltinFunction.acosh(u), 4e-16 * Math.max(1, byLog) + 2e-16, "acosh " + u);
            assertEquals(FastMath.acosh(u), BuiltinFunction.acosh(u), 4e-16 * Math.max(1, byLog) + 2e-16, "FastMath.acosh " + u);
        }
        // ln(2 + sqrt 3) = 1.316957896924816708... (value from memory; checked through the logarithm above).
        assertEquals(1.316957896924816708, BuiltinFunction.acosh(2), 3e-16);
        assertEquals(0.0, BuiltinFunction.acosh(1), 0.0);
        // Near 1, acosh(1 + t) = sqrt(2t) (1 - t/12 + ...): the t/12 term is 1e-13 relative at t = 1e-12.
        double t = 1e-12;
        assertEquals(Math.sqrt(2 * t) * (1 - t / 12), BuiltinFunction.acosh(1 + t), 1e-4 * Math.sqrt(2 * t));
        assertEquals(Math.log(2) + 200 * Math.log(10), BuiltinFunction.acosh(1e200), 1e-13);
        assertTrue(Double.isNaN(BuiltinFunction.acosh(0.5)));
    }

    @Test
    void atanhAgreesWithItsLogarithmAndWithCommonsMath() {
        for (double x : new double[]{0.01, 0.2, 0.5, 0.75, 0.9, 0.999}) {
            double byLog = 0.5 * Math.log((1 + x) / (1 - x));
            assertEquals(byLog, BuiltinFunction.atanh(x), 5e-16 * Math.max(1, byLog), "atanh " + x);
            assertEquals(FastMath.atanh(x), BuiltinFunction.atanh(x), 5e-16 * Math.max(1, byLog), "FastMath.atanh " + x);
            assertEquals(-BuiltinFunction.atanh(x), BuiltinFunction.atanh(-x), 0.0, "odd symmetry at " + x);
        }
        // ln(3)/2 = 0.549306144334054845... (value from memory; checked through the logarithm above).
        assertEquals(0.549306144334054845, BuiltinFunction.atanh(0.5), 2e-16);
        // Maclaurin series x + x^3/3 + x^5/5: the next term is 1e-28 relative at x = 1e-4.
        double x = 1e-4;
        assertEquals(x + x * x * x / 3 + Math.pow(x, 5) / 5, BuiltinFunction.atanh(x), 1e-20);
        assertEquals(Double.POSITIVE_INFINITY, BuiltinFunction.atanh(1), 0.0);
        assertTrue(Double.isNaN(BuiltinFunction.atanh(1.5)));
    }

    @Test
    void inverseHyperbolicFunctionsUndoTheirFunctions() {
        for (double x : new double[]{-3, -0.4, 0.01, 0.6, 2, 7}) {
            assertEquals(x, BuiltinFunction.asinh(Math.sinh(x)), 1e-15 * Math.max(1, Math.abs(x)), "asinh(sinh " + x + ")");
            // tanh x carries a rounding of 1e-16 that atanh amplifies by 1/(1 - tanh^2 x) = cosh^2 x: the test allows that.
            double c2 = Math.cosh(x) * Math.cosh(x);
            assertEquals(x, BuiltinFunction.atanh(Math.tanh(x)), 2e-16 * c2 + 1e-15 * Math.abs(x), "atanh(tanh " + x + ")");
            // cosh x likewise: acosh amplifies it by cosh x / sinh x.
            double amplification = Math.cosh(x) / Math.abs(Math.sinh(x));
            assertEquals(Math.abs(x), BuiltinFunction.acosh(Math.cosh(x)), 4e-16 * amplification * Math.max(1, Math.abs(x)),
                    "acosh(cosh " + x + ")");
        }
    }
}
