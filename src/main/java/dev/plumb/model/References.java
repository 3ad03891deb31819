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
        if (s instanceof Stmt.Param p && p.value() != null) {
            collect(p.value(), out);
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
        } else if (s instanceof Stmt.Guess g) {
            collect(g.target(), out);
            collect(g.value(), out);
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
        if (e instanceof Expr.Name n) {
            out.add(n.id());
        } else if (e instanceof Expr.Call c) {
            out.add(c.callee());
            c.args().forEach(a -> collect(a, out));
        } else if (e instanceof Expr.Neg n) {
            collect(n.operand(), out);
        } else if (e instanceof Expr.Binary b) {
            collect(b.left(), out);
            collect(b.right(), out);
        } else if (e instanceof Expr.If i) {
            collect(i.condition().left(), out);
            collect(i.condition().right(), out);
            collect(i.then(), out);
            collect(i.otherwise(), out);
        }
    }
}
