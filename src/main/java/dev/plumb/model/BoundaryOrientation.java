package dev.plumb.model;

import dev.plumb.lang.Stmt;
import java.util.List;
import java.util.Set;

/**
 * Puts the unknown on the left of each boundary, so that {@code 0 = P(R)} reaches the later
 * stages as {@code P(R) = 0}: they look for the profile value on the left, as most people write
 * it, and an equation reads the same either way round.
 */
final class BoundaryOrientation {
    private BoundaryOrientation() {
    }

    /** The boundaries with sides swapped where only the right side mentions one of {@code unknowns}. */
    static List<Stmt.Boundary> orient(List<Stmt.Boundary> boundaries, Set<String> unknowns) {
        return boundaries.stream().map(b -> orient(b, unknowns)).toList();
    }

    private static Stmt.Boundary orient(Stmt.Boundary b, Set<String> unknowns) {
        Stmt.Equation eq = b.equation();
        if (mentions(eq.lhs(), unknowns) || !mentions(eq.rhs(), unknowns)) return b;
        return new Stmt.Boundary(b.label(), new Stmt.Equation(eq.rhs(), eq.lhs(), eq.span()), b.span());
    }

    private static boolean mentions(dev.plumb.lang.Expr e, Set<String> unknowns) {
        return References.names(e).stream().anyMatch(unknowns::contains);
    }
}
