package dev.plumb.model;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumb.lang.Expr;
import dev.plumb.lang.Span;
import java.util.Map;
import java.util.function.DoubleUnaryOperator;
import org.junit.jupiter.api.Test;

/**
 * The derivative of a definition, {@code f'(x)}, evaluated through the checker's constant
 * evaluation (the same tree the numeric engine compiles), against the derivative worked out by
 * hand and written here as plain Java.
 */
class LetDerivativeTest {

    /** f^(order)(at) for {@code let f(x) = body} in a file with the given extra lines. */
    private static double derivative(String body, int order, double at, String... lines) {
        String text = String.join("\n", lines) + "\nlet f(x) = " + body + "\nparam d = f" + "'".repeat(order) + "(" + at + ")\n";
        Checking c = Checking.of(text);
        c.assertNoErrors();
        return ((Symbol.FixedParam) c.model.symbol("d").orElseThrow()).value();
    }

    private static void check(String body, DoubleUnaryOperator hand, double... points) {
        for (double x : points) {
            double expected = hand.applyAsDouble(x);
            assertEquals(expected, derivative(body, 1, x), 1e-13 * Math.max(1, Math.abs(expected)), body + " at " + x);
        }
    }

    @Test
    void polynomialsQuotientsAndPowers() {
        check("x^3 - 2*x", x -> 3 * x * x - 2, -1.5, 0, 2.25);
        check("1/(1 + x^2)", x -> -2 * x / Math.pow(1 + x * x, 2), -0.7, 0.3, 4);
        check("(1 - x)^(3/2)", x -> -1.5 * Math.sqrt(1 - x), 0.3, 0.99);
        check("x^x", x -> Math.pow(x, x) * (Math.log(x) + 1), 0.5, 2.5);
        check("2^x", x -> Math.pow(2, x) * Math.log(2), -1, 3);
        check("e^x", Math::exp, -2, 0.4);
        check("(x^2 + 1)/(x - 3)", x -> (2 * x * (x - 3) - (x * x + 1)) / Math.pow(x - 3, 2), -1, 2);
    }

    @Test
    void everyBuiltInFunction() {
        check("sqrt(x)", x -> 0.5 / Math.sqrt(x), 0.04, 9);
        check("exp(2*x)", x -> 2 * Math.exp(2 * x), -1, 0.5);
        check("log(x^2 + 1)", x -> 2 * x / (x * x + 1), -2, 0.5);
        check("ln(3*x)", x -> 1 / x, 0.2, 7);
        check("log10(x)", x -> 1 / (x * Math.log(10)), 0.5, 100);
        check("sin(x)*cos(x)", x -> Math.cos(2 * x), 0.3, 2);
        check("tan(x)", x -> 1 / Math.pow(Math.cos(x), 2), -1, 0.7);
        check("asin(x/2)", x -> 0.5 / Math.sqrt(1 - x * x / 4), -1.2, 0.7);
        check("acos(x/2)", x -> -0.5 / Math.sqrt(1 - x * x / 4), -1.2, 0.7);
        check("atan(x)", x -> 1 / (1 + x * x), -3, 0.5);
        check("sinh(x)", Math::cosh, -2, 1);
        check("cosh(x)", Math::sinh, -2, 1);
        check("tanh(x)", x -> 1 / Math.pow(Math.cosh(x), 2), -2, 1);
        check("asinh(x)", x -> 1 / Math.sqrt(x * x + 1), -2, 0, 30);
        check("acosh(x + 1)", x -> 1 / Math.sqrt((x + 1) * (x + 1) - 1), 0.01, 5);
        check("atanh(x/2)", x -> 0.5 / (1 - x * x / 4), -1, 0.5, 1.9);
        check("abs(x - 1)", x -> Math.signum(x - 1), 0.5, 1.3);
    }

    @Test
    void piecewiseDefinitionsDifferentiateBranchByBranch() {
        check("if x < 1 then x^2 else 2*x - 1", x -> x < 1 ? 2 * x : 2, 0.5, 1.5);
    }

    @Test
    void chainRuleThroughOtherDefinitionsAndParameters() {
        String[] g = {"let g(y) = y^2"};
        assertEquals(2 * Math.sin(0.8) * Math.cos(0.8), derivative("g(sin(x))", 1, 0.8, g), 1e-15);
        String[] h = {"let h(a, b) = a*b^2"};
        double x = 1.7;
        assertEquals((x + 1) * (x + 1) + 2 * x * (x + 1), derivative("h(x, x + 1)", 1, x, h), 1e-13);
        String[] k = {"param k = 3"};
        assertEquals(2 * 3 * 0.25, derivative("k*x^2", 1, 0.25, k), 1e-15);
        // A definition of the argument that does not vary: its derivative drops out of the chain.
        String[] flat = {"let c(y) = 5"};
        assertEquals(2 * 0.5, derivative("x^2 + c(x)", 1, 0.5, flat), 1e-15);
    }

    @Test
    void higherDerivatives() {
        assertEquals(12 * 1.5 * 1.5, derivative("x^4", 2, 1.5), 1e-13);
        assertEquals(24 * 1.5, derivative("x^4", 3, 1.5), 1e-13);
        assertEquals(-Math.sin(0.6), derivative("sin(x)", 2, 0.6), 1e-15);
        assertEquals(-Math.cos(0.6), derivative("sin(x)", 3, 0.6), 1e-15);
        // d2/dx2 asinh x = -x/(x^2 + 1)^(3/2).
        assertEquals(-2 / Math.pow(5, 1.5), derivative("asinh(x)", 2, 2), 1e-15);
        assertEquals(0.0, derivative("3*x + 1", 2, 4), 0.0);
    }

    @Test
    void aDefinitionOfTheCoordinateVariesWithItThroughDefinitionsWithoutArguments() throws Exception {
        // rho = 3 r mentions the coordinate: inside f(r) = r*rho, f = 3 r^2 and f' = 6 r (not 3 r).
        Checking c = Checking.of("coord r [m] from 0 to 1 [m]\nlet rho = 3*r\nlet f(r) = r*rho\nlet q(s) = s*rho\n");
        c.assertNoErrors();
        Expr fPrime = LetDerivative.of(c.model, Span.NONE).derivative("f", 1);
        assertEquals(12.0, new ConstantEvaluator(n -> c.model.symbols().get(n), Map.of("r", 2.0)).evaluate(fPrime), 1e-15);
        // A definition of another argument holds the coordinate fixed: q' = rho.
        Expr qPrime = LetDerivative.of(c.model, Span.NONE).derivative("q", 1);
        assertEquals(6.0, new ConstantEvaluator(n -> c.model.symbols().get(n), Map.of("r", 2.0, "s", 5.0)).evaluate(qPrime), 1e-15);
    }

    @Test
    void dependenceOnTheArgumentAndWhatCannotBeWritten() throws Exception {
        Checking c = Checking.of("param a = 2\nlet flat(x) = a^2\nlet g(x) = flat(x)*3\nlet s(x) = sin(x)\nlet sin(y) = y\n");
        LetDerivative d = LetDerivative.of(c.model, Span.NONE);
        assertFalse(d.dependsOnArgument("flat"));
        assertFalse(d.dependsOnArgument("g"), "g uses flat only");
        // sin is the file's own here, so d/dx sin(x) is its derivative, 1.
        assertTrue(d.dependsOnArgument("s"));
        Checking cos = Checking.of("let cos(y) = y\nlet s(x) = sqrt(1 + sin(x))\n");
        var thrown = assertThrows(LetDerivative.NotDifferentiable.class, () -> LetDerivative.of(cos.model, Span.NONE).derivative("s", 1));
        assertTrue(thrown.getMessage().contains("the built-in function 'cos'"), thrown.getMessage());
    }
}
