package dev.plumb.numeric;

import dev.plumb.lang.Expr;

/** One solved case: any expression of the file can be evaluated on it, in SI. */
public interface Solution {

    /** The value in SI of an expression such as {@code P(0)}, {@code m(R)}, {@code K} or {@code P(11 [km])}. */
    double evaluate(Expr quantity) throws SolveException;

    /** How it was solved: integrator, tolerances, start, shooting. */
    String method();
}
