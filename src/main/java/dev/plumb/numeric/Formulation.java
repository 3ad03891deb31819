package dev.plumb.numeric;

import dev.plumb.lang.Expr;
import dev.plumb.lang.ExprPrinter;
import dev.plumb.lang.Span;
import dev.plumb.lang.Stmt;
import dev.plumb.model.FileUnits;
import dev.plumb.model.Model;
import dev.plumb.model.Symbol;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * The first-order system a model's relations make, independent of any case: which profiles are
 * integrated and to what order, which relation gives the highest derivative of which profile,
 * and where each quantity sits in the evaluation frame
 * {@code [x, state..., highest derivatives..., unknown constants..., branch locks...]}.
 */
final class Formulation {

    final Model model;
    final Symbol.Coordinate coordinate;
    /** Profiles integrated, in declaration order, with their order (highest derivative in the relations). */
    final List<Symbol.Profile> profiles;
    final int[] order;
    /** State index of each profile's value; derivative k sits at {@code base[j] + k}. */
    final int[] base;
    final int stateSize;
    /** The relation that gives profile j's highest derivative. */
    final List<Stmt.Relation> relationOf;
    /** Unknown constants fixed by the boundaries (not the free end of the interval). */
    final List<Symbol.UnknownConstant> constants;
    /** The unknown constant that is the free end of the interval, or null. */
    final Symbol.UnknownConstant freeEnd;
    /** The units the file works in, for the values messages echo. */
    final FileUnits units;

    private Formulation(Model model, Symbol.Coordinate coordinate, List<Symbol.Profile> profiles, int[] order,
                        List<Stmt.Relation> relationOf, List<Symbol.UnknownConstant> constants,
                        Symbol.UnknownConstant freeEnd) {
        this.model = model;
        this.coordinate = coordinate;
        this.profiles = List.copyOf(profiles);
        this.order = order;
        this.base = new int[order.length];
        int n = 0;
        for (int j = 0; j < order.length; j++) {
            base[j] = n;
            n += order[j];
        }
        this.stateSize = n;
        this.relationOf = List.copyOf(relationOf);
        this.constants = List.copyOf(constants);
        this.freeEnd = freeEnd;
        this.units = FileUnits.of(model);
    }

    int derivativeSlot(int j) {
        return 1 + stateSize + j;
    }

    int constantSlot(int k) {
        return 1 + stateSize + profiles.size() + k;
    }

    int firstLockSlot() {
        return 1 + stateSize + profiles.size() + constants.size();
    }

    int profileIndex(String name) {
        for (int j = 0; j < profiles.size(); j++) if (profiles.get(j).name().equals(name)) return j;
        return -1;
    }

    /** A place along the coordinate (SI) in the file's unit for it, SI beside. */
    String position(double x, String numberFormat) {
        return units.position(x, numberFormat);
    }

    /** A value of state component {@code stateIndex} (SI) in the file's unit for it, SI beside. */
    String componentValue(int stateIndex, double v, String numberFormat) {
        for (int j = profiles.size() - 1; j >= 0; j--) {
            if (stateIndex >= base[j]) {
                int k = stateIndex - base[j];
                Symbol.Profile p = profiles.get(j);
                dev.plumb.units.Dimension d = p.dimension().div(coordinate.dimension().pow(dev.plumb.units.Rational.of(k)));
                return FileUnits.format(v, units.forDerivative(p.name(), k, d), numberFormat);
            }
        }
        return String.format(java.util.Locale.ROOT, numberFormat, v);
    }

    /** How a state component is written: P, P', theta''... */
    String componentName(int stateIndex) {
        for (int j = profiles.size() - 1; j >= 0; j--) {
            if (stateIndex >= base[j]) return profiles.get(j).name() + "'".repeat(stateIndex - base[j]);
        }
        return "?";
    }

    static Formulation of(Model model) throws SolveException {
        if (model.coordinate().isEmpty()) {
            throw new SolveException(Span.NONE, "there is nothing to integrate: the file declares no coordinate");
        }
        Symbol.Coordinate coord = model.coordinate().get();
        List<Symbol.Profile> all = model.profiles();
        if (all.isEmpty()) throw new SolveException(coord.span(), "there is nothing to integrate: the file declares no unknown profile");
        if (model.relations().isEmpty()) {
            throw new SolveException(all.get(0).span(), "the unknown '" + all.get(0).name() + "' has no relation to integrate");
        }
        // Highest derivative order of every profile in every relation, looking through definitions.
        List<Map<String, Integer>> perRelation = new ArrayList<>();
        Map<String, Integer> overall = new LinkedHashMap<>();
        for (Stmt.Relation r : model.relations()) {
            Map<String, Integer> orders = new LinkedHashMap<>();
            collectOrders(model, r.equation().lhs(), orders, new HashSet<>());
            collectOrders(model, r.equation().rhs(), orders, new HashSet<>());
            perRelation.add(orders);
            orders.forEach((p, k) -> overall.merge(p, k, Math::max));
        }
        for (Symbol.Profile p : all) {
            int k = overall.getOrDefault(p.name(), -1);
            if (k < 1) {
                throw new SolveException(p.span(), "the unknown '" + p.name() + "' appears in no relation as a derivative"
                        + (k == 0 ? " (only algebraically)" : "")
                        + ": the numeric engine integrates relations that give a derivative such as " + p.name() + "'("
                        + coord.name() + "); an algebraic unknown can be written as a 'let' instead");
            }
        }
        int[] order = all.stream().mapToInt(p -> overall.get(p.name())).toArray();
        List<Stmt.Relation> relationOf = match(model, all, order, perRelation);
        List<Symbol.UnknownConstant> constants = new ArrayList<>();
        Symbol.UnknownConstant freeEnd = null;
        for (Symbol.UnknownConstant u : model.unknownConstants()) {
            if (u.endOfInterval()) {
                if (coord.from() instanceof Expr.Name n && n.id().equals(u.name())) {
                    throw new SolveException(u.span(), "the start of the interval is the unknown '" + u.name()
                            + "': integrate from a known point towards the free surface instead");
                }
                freeEnd = u;
            } else {
                constants.add(u);
            }
        }
        return new Formulation(model, coord, all, order, relationOf, constants, freeEnd);
    }

    /** Assigns each profile the relation that gives its highest derivative (a bipartite matching). */
    private static List<Stmt.Relation> match(Model model, List<Symbol.Profile> profiles, int[] order,
                                             List<Map<String, Integer>> perRelation) throws SolveException {
        List<Stmt.Relation> relations = model.relations();
        if (relations.size() != profiles.size()) {
            String names = String.join(", ", profiles.stream().map(Symbol::name).toList());
            throw new SolveException(relations.size() > profiles.size() ? relations.get(profiles.size()).span() : profiles.get(0).span(),
                    "the system is " + (relations.size() > profiles.size() ? "over" : "under") + "-determined: "
                            + relations.size() + " relation(s) for " + profiles.size() + " unknown profile(s) (" + names + ")");
        }
        int[] relationFor = new int[profiles.size()];
        Arrays.fill(relationFor, -1);
        for (int i = 0; i < relations.size(); i++) {
            if (!augment(i, new boolean[profiles.size()], relationFor, profiles, order, perRelation)) {
                throw new SolveException(relations.get(i).span(), "relation " + describe(relations.get(i))
                        + " gives no highest derivative that another relation does not already give; each relation must give "
                        + "the highest derivative of one unknown (e.g. " + profiles.get(0).name() + "'".repeat(order[0]) + "(r) = ...)");
            }
        }
        List<Stmt.Relation> out = new ArrayList<>();
        for (int j = 0; j < profiles.size(); j++) out.add(relations.get(relationFor[j]));
        return out;
    }

    private static boolean augment(int rel, boolean[] seen, int[] relationFor, List<Symbol.Profile> profiles, int[] order,
                                   List<Map<String, Integer>> perRelation) {
        // Prefer the profile written on the left of the relation by trying candidates in order of appearance.
        for (Map.Entry<String, Integer> e : perRelation.get(rel).entrySet()) {
            int j = indexOf(profiles, e.getKey());
            if (j < 0 || e.getValue() != order[j] || seen[j]) continue;
            seen[j] = true;
            if (relationFor[j] < 0 || augment(relationFor[j], seen, relationFor, profiles, order, perRelation)) {
                relationFor[j] = rel;
                return true;
            }
        }
        return false;
    }

    private static int indexOf(List<Symbol.Profile> profiles, String name) {
        for (int j = 0; j < profiles.size(); j++) if (profiles.get(j).name().equals(name)) return j;
        return -1;
    }

    static String describe(Stmt.Relation r) {
        return r.label().present() ? "'" + r.label().name() + "'" : "on line " + r.span().line();
    }

    /** Records, for each profile called in {@code e} (through definitions), the highest derivative order. */
    static void collectOrders(Model model, Expr e, Map<String, Integer> into, Set<String> visiting) {
        if (e instanceof Expr.Call c) {
            Symbol s = model.symbols().get(c.callee());
            if (s instanceof Symbol.Profile) into.merge(c.callee(), c.order(), Math::max);
            if (s instanceof Symbol.Definition d && visiting.add(d.name())) {
                Expr body = d.body();
                if (c.order() > 0) {
                    // The derivative of a definition that uses P(r) uses P'(r).
                    try {
                        body = ExprCompiler.derivative(model, d, c);
                    } catch (SolveException notWritten) {
                        // Reported where it is evaluated; the body's own orders stand in meanwhile.
                    }
                }
                collectOrders(model, body, into, visiting);
                visiting.remove(d.name());
            }
            c.args().forEach(a -> collectOrders(model, a, into, visiting));
        } else if (e instanceof Expr.Name n) {
            if (model.symbols().get(n.id()) instanceof Symbol.Definition d && d.params().isEmpty() && visiting.add(d.name())) {
                collectOrders(model, d.body(), into, visiting);
                visiting.remove(d.name());
            }
        } else if (e instanceof Expr.Neg n) {
            collectOrders(model, n.operand(), into, visiting);
        } else if (e instanceof Expr.Binary b) {
            collectOrders(model, b.left(), into, visiting);
            collectOrders(model, b.right(), into, visiting);
        } else if (e instanceof Expr.If i) {
            collectOrders(model, i.condition().left(), into, visiting);
            collectOrders(model, i.condition().right(), into, visiting);
            collectOrders(model, i.then(), into, visiting);
            collectOrders(model, i.otherwise(), into, visiting);
        }
    }

    /** Whether {@code e} mentions a profile or an unknown constant (through definitions). */
    static boolean mentionsUnknown(Model model, Expr e) {
        Map<String, Integer> orders = new LinkedHashMap<>();
        collectOrders(model, e, orders, new HashSet<>());
        if (!orders.isEmpty()) return true;
        for (String name : dev.plumb.model.References.names(e)) {
            Symbol s = model.symbols().get(name);
            if (s instanceof Symbol.UnknownConstant) return true;
            if (s instanceof Symbol.Definition d && mentionsUnknown(model, d.body())) return true;
        }
        return false;
    }

    static String print(Expr e) {
        return ExprPrinter.print(e);
    }
}
