package dev.plumb.numeric;

/**
 * How tightly to integrate: {@code relTol} is the relative tolerance of every state component,
 * {@code absTolScale} times a component's typical magnitude is its absolute tolerance, and
 * {@code errorEstimate} asks for a second solve at a tighter tolerance to estimate the error.
 */
public record NumericOptions(double relTol, double absTolScale, boolean errorEstimate) {

    public NumericOptions {
        if (!(relTol > 0 && relTol < 1)) throw new IllegalArgumentException("relTol must be in (0, 1): " + relTol);
        if (!(absTolScale > 0 && absTolScale < 1)) throw new IllegalArgumentException("absTolScale must be in (0, 1): " + absTolScale);
    }

    /** Relative tolerance 1e-12, absolute 1e-12 of each component's scale, with an error estimate. */
    public static NumericOptions defaults() {
        return new NumericOptions(1e-12, 1e-12, true);
    }

    /** The same options at a tolerance a hundred times tighter (not below what doubles can carry). */
    public NumericOptions tighter() {
        return new NumericOptions(Math.max(relTol * 1e-2, 1e-14), Math.max(absTolScale * 1e-2, 1e-15), false);
    }

    public NumericOptions withoutErrorEstimate() {
        return new NumericOptions(relTol, absTolScale, false);
    }
}
