package dev.plumb.model;

import java.util.Arrays;
import java.util.Optional;
import java.util.function.DoubleUnaryOperator;

/** The built-in functions of the language; all take one argument. */
public enum BuiltinFunction {
    SQRT("sqrt", Math::sqrt), EXP("exp", Math::exp), LOG("log", Math::log), LOG10("log10", Math::log10),
    SIN("sin", Math::sin), COS("cos", Math::cos), TAN("tan", Math::tan),
    ASIN("asin", Math::asin), ACOS("acos", Math::acos), ATAN("atan", Math::atan),
    SINH("sinh", Math::sinh), COSH("cosh", Math::cosh), TANH("tanh", Math::tanh), ABS("abs", Math::abs);

    public final String word;
    private final DoubleUnaryOperator f;

    BuiltinFunction(String word, DoubleUnaryOperator f) {
        this.word = word;
        this.f = f;
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
}
