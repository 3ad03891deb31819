package dev.plumb.numeric;

import dev.plumb.lang.Expr;

/** One solved case: any expression of the file can be evaluated on it, in SI. */
public interface Solution {

    /** The value in SI of an expression such as {@code P(0)}, {@code m(R)}, {@code K} or {@code P(11 [km])}. */
    double evaluate(Expr quantity) throws SolveException;

    /** How it was solved: integrator, tolerances, start, shooting. */
    String method();

    /**
     * The lowest value the solution takes inside the interval for each profile (its value, not a
     * derivative), the coordinate where it does and the profile's scale, by profile name; empty when
     * nothing was integrated.
     */
    default java.util.Map<String, double[]> lowest() {
        return java.util.Map.of();
    }
}
