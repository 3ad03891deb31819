package dev.plumb.symbolic;

import dev.plumb.lang.Expr;
import dev.plumb.units.Dimension;
import java.util.List;

/**
 * A closed form the engine derived.
 *
 * @param expr       the quantity in plumb syntax: "P(r)", "P(0)", "m(R)", "xi1"
 * @param closedForm the closed form as a plumb expression in free parameters, fixed parameters and
 *                   built-in constants (and the coordinate, for a profile)
 * @param printed    the closed form printed in plumb syntax
 * @param dimension  the dimension of the quantity
 * @param trail      how it was obtained, in order
 */
public record Derived(String expr, Expr closedForm, String printed, Dimension dimension, List<TrailStep> trail) {
    public Derived {
        trail = List.copyOf(trail);
    }
}
