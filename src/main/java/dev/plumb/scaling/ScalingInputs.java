package dev.plumb.scaling;

import dev.plumb.lang.Expr;
import dev.plumb.lang.Stmt;
import dev.plumb.model.Model;
import dev.plumb.model.References;
import dev.plumb.model.Symbol;
import dev.plumb.units.Dimension;
import dev.plumb.units.UnitException;
import dev.plumb.units.UnitParser;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * The dimensional inputs a quantity can depend on, for dimensional analysis: constants, fixed
 * and free parameters, and every quantity literal with a unit (a {@code 100 [km]} in an interval
 * or an {@code if} is a scale of its own, and leaving it out would make dimensions look as if
 * they fixed exponents they do not).
 */
final class ScalingInputs {
    private ScalingInputs() {
    }

    static Map<String, Dimension> of(Model model, Expr quantity) {
        // A quantity that needs no solving depends only on what it mentions (through definitions);
        // a profile value or an unknown constant depends on everything the relations and boundaries mention.
        List<Expr> roots = new ArrayList<>(List.of(quantity));
        Set<String> names = transitive(model, References.names(quantity), roots);
        boolean solved = names.stream().anyMatch(n -> model.symbol(n).orElse(null) instanceof Symbol.Profile
                || model.symbol(n).orElse(null) instanceof Symbol.UnknownConstant);
        if (solved) {
            for (Stmt s : model.program().statements()) {
                if (s instanceof Stmt.Relation || s instanceof Stmt.Boundary || s instanceof Stmt.Let || s instanceof Stmt.Coord) {
                    names.addAll(References.names(s));
                    roots.addAll(expressions(s));
                }
            }
        }
        // Constants first, then fixed and free parameters: monomials then read as G*M^2*R^(-4).
        Map<String, Dimension> out = new LinkedHashMap<>();
        for (Symbol s : model.symbols(Symbol.Builtin.class)) {
            if (!s.dimension().isNone() && names.contains(s.name())) out.put(s.name(), s.dimension());
        }
        for (Symbol s : model.symbols(Symbol.FixedParam.class)) {
            if (!s.dimension().isNone() && names.contains(s.name())) out.put(s.name(), s.dimension());
        }
        for (Expr root : roots) literals(root, out);
        for (Symbol.FreeParam p : model.freeParams()) {
            if (names.contains(p.name())) out.put(p.name(), p.dimension());
        }
        return out;
    }

    private static Set<String> transitive(Model model, Set<String> start, List<Expr> bodies) {
        Set<String> out = new LinkedHashSet<>();
        ArrayDeque<String> todo = new ArrayDeque<>(start);
        while (!todo.isEmpty()) {
            String n = todo.pop();
            if (!out.add(n)) continue;
            if (model.symbol(n).orElse(null) instanceof Symbol.Definition d) {
                todo.addAll(References.names(d.body()));
                bodies.add(d.body());
            }
        }
        return out;
    }

    private static List<Expr> expressions(Stmt s) {
        if (s instanceof Stmt.Relation r) return List.of(r.equation().lhs(), r.equation().rhs());
        if (s instanceof Stmt.Boundary b) return List.of(b.equation().lhs(), b.equation().rhs());
        if (s instanceof Stmt.Let l) return List.of(l.body());
        if (s instanceof Stmt.Coord c) return List.of(c.from(), c.to());
        return List.of();
    }

    /** Every literal with a dimension, named as written in parentheses ({@code (100 [km])}) so that a power of it reads. */
    private static void literals(Expr e, Map<String, Dimension> out) {
        References.walk(e, x -> {
            if (!(x instanceof Expr.Quantity q)) return;
            try {
                Dimension d = UnitParser.parse(q.unit()).dimension();
                if (!d.isNone()) out.putIfAbsent("(" + q.text() + " [" + q.unit() + "])", d);
            } catch (UnitException ex) {
                // An unknown unit is reported where it is written; here it only cannot count.
            }
        });
    }
}
