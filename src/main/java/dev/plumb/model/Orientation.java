package dev.plumb.model;

import dev.plumb.lang.Expr;
import dev.plumb.lang.Stmt;
import java.util.List;
import java.util.Set;

/**
 * Puts the unknown on the left of each boundary, step, claim and scaling, so that
 * {@code 0 = P(R)} reaches the later stages as {@code P(R) = 0}: they read the left side as the
 * quantity and the right side as its value (a wrong claim's factor is claimed/true), as most
 * people write it, and an equation means the same either way round.
 */
final class Orientation {
    private final Set<String> unknowns;

    /** {@code unknowns}: the names of the unknown profiles and constants of the file. */
    Orientation(Set<String> unknowns) {
        this.unknowns = unknowns;
    }

    List<Stmt.Boundary> boundaries(List<Stmt.Boundary> all) {
        return all.stream().map(b -> swaps(b.equation()) ? new Stmt.Boundary(b.label(), swapped(b.equation()), b.span()) : b)
                .toList();
    }

    List<Stmt.Step> steps(List<Stmt.Step> all) {
        return all.stream().map(s -> swaps(s.equation()) ? new Stmt.Step(s.label(), swapped(s.equation()), s.span()) : s)
                .toList();
    }

    List<Stmt.Claim> claims(List<Stmt.Claim> all) {
        return all.stream().map(c -> swaps(c.equation()) ? new Stmt.Claim(c.label(), swapped(c.equation()), c.span()) : c)
                .toList();
    }

    List<Stmt.Scaling> scalings(List<Stmt.Scaling> all) {
        return all.stream().map(s -> swaps(s.lhs(), s.rhs()) ? new Stmt.Scaling(s.label(), s.rhs(), s.lhs(), s.span()) : s)
                .toList();
    }

    private boolean swaps(Stmt.Equation eq) {
        return swaps(eq.lhs(), eq.rhs());
    }

    private boolean swaps(Expr lhs, Expr rhs) {
        return !mentions(lhs) && mentions(rhs);
    }

    private static Stmt.Equation swapped(Stmt.Equation eq) {
        return new Stmt.Equation(eq.rhs(), eq.lhs(), eq.span());
    }

    private boolean mentions(Expr e) {
        return References.names(e).stream().anyMatch(unknowns::contains);
    }
}
