package dev.plumb.model;

import java.util.Arrays;
import java.util.Optional;
import java.util.function.DoubleUnaryOperator;

/** The built-in functions of the language; all take one argument. */
public enum BuiltinFunction {
    SQRT("sqrt", "square root", Math::sqrt, "Math.sqrt"),
    EXP("exp", "exponential", Math::exp, "Math.exp"),
    LOG("log", "natural logarithm", Math::log, "Math.log"),
    LN("ln", "natural logarithm", Math::log, "Math.log"),
    LOG10("log10", "decimal logarithm", Math::log10, "Math.log10"),
    SIN("sin", "sine", Math::sin, "Math.sin"), COS("cos", "cosine", Math::cos, "Math.cos"),
    TAN("tan", "tangent", Math::tan, "Math.tan"),
    ASIN("asin", "inverse sine", Math::asin, "Math.asin"), ACOS("acos", "inverse cosine", Math::acos, "Math.acos"),
    ATAN("atan", "inverse tangent", Math::atan, "Math.atan"),
    SINH("sinh", "hyperbolic sine", Math::sinh, "Math.sinh"), COSH("cosh", "hyperbolic cosine", Math::cosh, "Math.cosh"),
    TANH("tanh", "hyperbolic tangent", Math::tanh, "Math.tanh"),
    ASINH("asinh", "inverse hyperbolic sine", BuiltinFunction::asinh, "dev.plumb.model.BuiltinFunction.asinh"),
    ACOSH("acosh", "inverse hyperbolic cosine", BuiltinFunction::acosh, "dev.plumb.model.BuiltinFunction.acosh"),
    ATANH("atanh", "inverse hyperbolic tangent", BuiltinFunction::atanh, "dev.plumb.model.BuiltinFunction.atanh"),
    ABS("abs", "absolute value", Math::abs, "Math.abs");

    public final String word;
    /** What it is, for messages ("natural logarithm"). */
    public final String description;
    /** The static Java method that computes it, for generated code. */
    public final String javaMethod;
    private final DoubleUnaryOperator f;

    BuiltinFunction(String word, String description, DoubleUnaryOperator f, String javaMethod) {
        this.word = word;
        this.description = description;
        this.f = f;
        this.javaMethod = javaMethod;
    }

    public double apply(double x) {
        return f.applyAsDouble(x);
    }

    /** Whether the argument must be dimensionless (all but sqrt and abs). */
    public boolean needsDimensionless() {
        return this != SQRT && this != ABS;
    }

    public static Optional<BuiltinFunction> lookup(String word) {
        return Arrays.stream(values()).filter(b -> b.word.equals(word)).findFirst();
    }

    /** Past this size x² + 1 is x² to double precision (and x² overflows past 1.3e154): ln(2x) is exact to rounding. */
    private static final double LARGE = 1e8;
    private static final double LN2 = Math.log(2);

    /**
     * The inverse hyperbolic sine, ln(x + √(x² + 1)), written as log1p(|x| + x²/(1 + √(1 + x²))) so
     * that it keeps full precision near 0 (where x + √(x² + 1) is 1 + x) and odd symmetry exactly;
     * {@code java.lang.Math} has none.
     */
    public static double asinh(double x) {
        double a = Math.abs(x);
        double r = a > LARGE ? Math.log(a) + LN2 : Math.log1p(a + a * a / (1 + Math.sqrt(1 + a * a)));
        return Math.copySign(r, x);
    }

    /** The inverse hyperbolic cosine, ln(x + √(x² − 1)) for x ≥ 1 (NaN below), as log1p(t + √(t(t + 2))) with t = x − 1. */
    public static double acosh(double x) {
        if (!(x >= 1)) return Double.NaN;
        if (x > LARGE) return Math.log(x) + LN2;
        double t = x - 1;
        return Math.log1p(t + Math.sqrt(t * (t + 2)));
    }

    /** The inverse hyperbolic tangent, ½ ln((1 + x)/(1 − x)) for |x| ≤ 1 (NaN beyond), as ½ log1p(2|x|/(1 − |x|)). */
    public static double atanh(double x) {
        double a = Math.abs(x);
        if (!(a <= 1)) return Double.NaN;
        return Math.copySign(0.5 * Math.log1p(2 * a / (1 - a)), x);
    }
}
