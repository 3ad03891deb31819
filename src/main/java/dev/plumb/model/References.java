package dev.plumb.model;

import dev.plumb.lang.Expr;
import dev.plumb.lang.Stmt;
import java.util.LinkedHashSet;
import java.util.Set;

/** The names an expression or statement mentions (variables and called functions alike). */
public final class References {
    private References() {
    }

    public static Set<String> names(Expr e) {
        Set<String> out = new LinkedHashSet<>();
        collect(e, out);
        return out;
    }

    public static Set<String> names(Stmt s) {
        Set<String> out = new LinkedHashSet<>();
        if (s instanceof Stmt.Param p) {
            if (p.value() != null) collect(p.value(), out);
            p.bounds().forEach(b -> collect(b.value(), out));
        } else if (s instanceof Stmt.Coord c) {
            collect(c.from(), out);
            collect(c.to(), out);
        } else if (s instanceof Stmt.Let l) {
            collect(l.body(), out);
        } else if (s instanceof Stmt.Relation r) {
            equation(r.equation(), out);
        } else if (s instanceof Stmt.Boundary b) {
            equation(b.equation(), out);
        } else if (s instanceof Stmt.Step st) {
            equation(st.equation(), out);
        } else if (s instanceof Stmt.Claim c) {
            equation(c.equation(), out);
        } else if (s instanceof Stmt.Scaling sc) {
            collect(sc.lhs(), out);
            collect(sc.rhs(), out);
        } else if (s instanceof Stmt.Expect e) {
            collect(e.lhs(), out);
            collect(e.expected(), out);
        } else if (s instanceof Stmt.Show sh) {
            collect(sh.expr(), out);
        } else if (s instanceof Stmt.Typeset t) {
            out.add(t.name());
        } else if (s instanceof Stmt.Guess g) {
            collect(g.target(), out);
            collect(g.value(), out);
        } else if (s instanceof Stmt.Sweep sw) {
            out.add(sw.param());
            collect(sw.from(), out);
            collect(sw.to(), out);
            sw.others().forEach(a -> collect(a.value(), out));
        } else if (s instanceof Stmt.Case c) {
            c.assignments().forEach(a -> {
                collect(a.value(), out);
                if (a.uncertainty() != null) collect(a.uncertainty(), out);
            });
        }
        return out;
    }

    private static void equation(Stmt.Equation eq, Set<String> out) {
        collect(eq.lhs(), out);
        collect(eq.rhs(), out);
    }

    private static void collect(Expr e, Set<String> out) {
        walk(e, x -> {
            if (x instanceof Expr.Name n) out.add(n.id());
            if (x instanceof Expr.Call c) out.add(c.callee());
        });
    }

    /** Whether either side of the equation takes a derivative ({@code P'(r)}). */
    public static boolean hasDerivative(Stmt.Equation eq) {
        boolean[] found = {false};
        java.util.function.Consumer<Expr> look = x -> found[0] |= x instanceof Expr.Call c && c.order() > 0;
        walk(eq.lhs(), look);
        walk(eq.rhs(), look);
        return found[0];
    }

    /** Visits {@code e} and every expression inside it, the operands of an {@code if} condition included. */
    public static void walk(Expr e, java.util.function.Consumer<Expr> visit) {
        visit.accept(e);
        if (e instanceof Expr.Call c) {
            c.args().forEach(a -> walk(a, visit));
        } else if (e instanceof Expr.Neg n) {
            walk(n.operand(), visit);
        } else if (e instanceof Expr.Binary b) {
            walk(b.left(), visit);
            walk(b.right(), visit);
        } else if (e instanceof Expr.If i) {
            walk(i.condition().left(), visit);
            walk(i.condition().right(), visit);
            walk(i.then(), visit);
            walk(i.otherwise(), visit);
        }
    }
}
