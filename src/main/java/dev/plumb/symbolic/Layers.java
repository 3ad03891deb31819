package dev.plumb.symbolic;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.matheclipse.core.expression.F;
import org.matheclipse.core.expression.S;
import org.matheclipse.core.interfaces.IAST;
import org.matheclipse.core.interfaces.IASTMutable;
import org.matheclipse.core.interfaces.IExpr;
import org.matheclipse.core.interfaces.ISymbol;

/**
 * A first-order relation with piecewise definitions ({@code if z < 11 [km] then ... else ...}):
 * the interval is split at the break points, each layer is integrated on its own, and the
 * profile is made continuous across every break — the layer holding the boundary point comes
 * first, and each neighbour, outward in both directions, starts from the value its inner
 * neighbour reaches at the shared break. Symja's own integral of a Piecewise is not continuous,
 * so it is never used. Break points must be free of the coordinate; their order is read at
 * random points of the parameter domain and must be the same at each.
 */
final class Layers {

    private static final int ORDER_SAMPLES = 5;

    private final Symja symja;
    private final SymbolTable table;
    private final ClosedForms closedForms;
    private final FirstOrder firstOrder;

    Layers(Symja symja, SymbolTable table, ClosedForms closedForms, FirstOrder firstOrder) {
        this.symja = symja;
        this.table = table;
        this.closedForms = closedForms;
        this.firstOrder = firstOrder;
    }

    /** Whether the tree holds a Piecewise whose condition depends on the coordinate. */
    boolean isLayered(IExpr e) {
        return e.has(p -> p.isAST(S.Piecewise) && p.first().has(table.coordinate, true), true);
    }

    /**
     * The piecewise closed form, or null when a layer is none of the kinds {@link FirstOrder}
     * integrates; a {@link Symja.Failure} says why the layers cannot be set out.
     */
    FirstOrder.Solution solve(FirstOrder.Relation rel, FirstOrder.Start b, Translation t, IExpr from, IExpr to) {
        ISymbol x = table.coordinate;
        List<IExpr> breaks = breakPoints(rel.equation(), t, from, to);
        if (breaks.isEmpty()) throw new Symja.Failure("the piecewise definitions do not change inside the interval", false);
        List<IExpr> ends = new ArrayList<>();
        ends.add(from);
        ends.addAll(breaks);
        ends.add(to);
        Map<ISymbol, IExpr> sample = new Sampler(symja, table, 11).point(t);
        int layers = ends.size() - 1;
        int first = layerOf(b.point(), ends, sample);
        List<TrailStep> trail = new ArrayList<>();
        trail.add(new TrailStep("split the interval at the break points of the piecewise definitions",
                table.name(x) + " = " + String.join(", ", breaks.stream().map(closedForms::print).toList())));
        IExpr[] closed = new IExpr[layers];
        closed[first] = layer(rel, b, t, ends, first, sample, trail);
        for (int i = first + 1; i < layers; i++) {
            closed[i] = layer(rel, continuity(closed[i - 1], ends.get(i)), t, ends, i, sample, trail);
        }
        for (int i = first - 1; i >= 0; i--) {
            closed[i] = layer(rel, continuity(closed[i + 1], ends.get(i + 1)), t, ends, i, sample, trail);
        }
        IExpr otherwise = closed[layers - 1];
        List<IExpr> cases = new ArrayList<>();
        for (int i = 0; i < layers - 1; i++) cases.add(F.list(closed[i], F.Less(x, ends.get(i + 1))));
        IExpr whole = F.Piecewise(F.ListAlloc(cases), otherwise);
        trail.add(new TrailStep("join the layers", rel.px() + " = " + closedForms.print(whole)));
        return new FirstOrder.Solution(whole, trail);
    }

    private FirstOrder.Start continuity(IExpr inner, IExpr at) {
        IExpr value = closedForms.simplify(Points.at(symja, inner, table.coordinate, at));
        return new FirstOrder.Start("of continuity at " + table.name(table.coordinate) + " = " + closedForms.print(at), at, value);
    }

    private IExpr layer(FirstOrder.Relation rel, FirstOrder.Start b, Translation t, List<IExpr> ends, int i,
                        Map<ISymbol, IExpr> sample, List<TrailStep> trail) {
        IExpr lo = ends.get(i);
        IExpr hi = ends.get(i + 1);
        IExpr middle = symja.eval(F.Times(F.C1D2, F.Plus(number(lo, sample), number(hi, sample))));
        IExpr equation = symja.eval(chosen(rel.equation(), sample, middle));
        FirstOrder.Relation inLayer = new FirstOrder.Relation(equation, rel.y(), rel.yp(), rel.profileAtX(), rel.px(), rel.dpx());
        FirstOrder.Solution s = firstOrder.solve(inLayer, b, t);
        if (s == null) throw new Symja.Failure("the layer from " + closedForms.print(lo) + " to " + closedForms.print(hi)
                + " is not a relation plumb integrates in closed form", false);
        IExpr simple = closedForms.simplify(s.closed());
        String where = "layer " + closedForms.print(lo) + " < " + table.name(table.coordinate) + " < " + closedForms.print(hi) + ": ";
        s.trail().forEach(step -> trail.add(new TrailStep(where + step.action(), step.result())));
        trail.add(new TrailStep(where + "simplify", rel.px() + " = " + closedForms.print(simple)));
        return simple;
    }

    /** The tree with every Piecewise replaced by the branch that holds at {@code x = middle} (parameters at the sample). */
    private IExpr chosen(IExpr e, Map<ISymbol, IExpr> sample, IExpr middle) {
        if (!(e instanceof IAST a)) return e;
        if (a.isAST(S.Piecewise) && a.first().isList() && a.first().has(table.coordinate, true)) {
            for (IExpr c : (IAST) a.first()) {
                if (c.isList() && ((IAST) c).argSize() == 2 && truth(((IAST) c).arg2(), sample, middle)) {
                    return chosen(((IAST) c).arg1(), sample, middle);
                }
            }
            return a.argSize() > 1 ? chosen(a.arg2(), sample, middle) : F.C0;
        }
        IASTMutable copy = a.copy();
        for (int i = 1; i <= a.argSize(); i++) copy.set(i, chosen(a.get(i), sample, middle));
        return copy;
    }

    private boolean truth(IExpr condition, Map<ISymbol, IExpr> sample, IExpr middle) {
        List<IExpr> rules = new ArrayList<>();
        sample.forEach((k, v) -> {
            if (k != table.coordinate) rules.add(F.Rule(k, v));
        });
        rules.add(F.Rule(table.coordinate, middle));
        IExpr v = symja.eval(F.N(F.ReplaceAll(condition, F.ListAlloc(rules)), F.ZZ(Sampler.DIGITS)));
        if (v.isTrue()) return true;
        if (v.isFalse()) return false;
        throw new Symja.Failure("a piecewise condition could not be decided inside a layer", false);
    }

    /** The break points strictly inside the interval, in increasing order, each once. */
    private List<IExpr> breakPoints(IExpr e, Translation t, IExpr from, IExpr to) {
        List<IExpr> candidates = new ArrayList<>();
        collect(e, candidates);
        List<Map<ISymbol, IExpr>> samples = new ArrayList<>();
        Sampler sampler = new Sampler(symja, table, 3);
        for (int i = 0; i < ORDER_SAMPLES; i++) samples.add(sampler.point(t));
        List<IExpr> inside = new ArrayList<>();
        for (IExpr c : candidates) {
            int where = 0;
            for (Map<ISymbol, IExpr> s : samples) {
                BigDecimal v = value(c, s);
                int here = v.compareTo(value(from, s)) > 0 && v.compareTo(value(to, s)) < 0 ? 1 : -1;
                if (where != 0 && here != where) throw new Symja.Failure("whether a break point lies inside the interval "
                        + "depends on the parameters", false);
                where = here;
            }
            if (where > 0 && inside.stream().noneMatch(o -> same(o, c, samples))) inside.add(c);
        }
        inside.sort((p, q) -> value(p, samples.get(0)).compareTo(value(q, samples.get(0))));
        for (Map<ISymbol, IExpr> s : samples) {
            for (int i = 1; i < inside.size(); i++) {
                if (value(inside.get(i - 1), s).compareTo(value(inside.get(i), s)) >= 0) {
                    throw new Symja.Failure("the order of the break points depends on the parameters", false);
                }
            }
        }
        return inside;
    }

    private boolean same(IExpr p, IExpr q, List<Map<ISymbol, IExpr>> samples) {
        return samples.stream().allMatch(s -> Comparison.same(value(p, s), value(q, s), new BigDecimal("1e-40")));
    }

    /** Where each condition in the coordinate changes: the roots in x of its two sides' difference. */
    private void collect(IExpr e, List<IExpr> out) {
        if (!(e instanceof IAST a)) return;
        if (a.isAST(S.Piecewise) && a.first().isList()) {
            for (IExpr c : (IAST) a.first()) {
                if (!c.isList() || ((IAST) c).argSize() != 2) continue;
                IExpr cond = ((IAST) c).arg2();
                if (!(cond instanceof IAST ca) || ca.argSize() != 2 || !cond.has(table.coordinate, true)) continue;
                IExpr difference = symja.eval(F.Subtract(ca.arg1(), ca.arg2()));
                IExpr roots = symja.eval(F.Solve(F.Equal(difference, F.C0), table.coordinate));
                boolean found = false;
                if (roots.isList()) {
                    for (IExpr r : (IAST) roots) {
                        if (r.isList() && ((IAST) r).argSize() == 1 && ((IAST) r).arg1().isRuleAST()) {
                            IExpr root = ((IAST) r).arg1().second();
                            if (!root.has(table.coordinate, true) && root.isFree(IExpr::isComplex, true)) {
                                out.add(root);
                                found = true;
                            }
                        }
                    }
                }
                if (!found) throw new Symja.Failure("a piecewise condition has no break point plumb can find", false);
            }
        }
        for (IExpr arg : a) collect(arg, out);
    }

    private BigDecimal value(IExpr e, Map<ISymbol, IExpr> sample) {
        BigDecimal v = new Sampler(symja, table, 0).value(e, sample);
        if (v == null) throw new Symja.Failure("a break point or an end of the interval is not a real number", false);
        return v;
    }

    private IExpr number(IExpr e, Map<ISymbol, IExpr> sample) {
        return Translation.rational(value(e, sample));
    }

    /** The layer that holds the point: the last whose start is at or below it. */
    private int layerOf(IExpr point, List<IExpr> ends, Map<ISymbol, IExpr> sample) {
        BigDecimal p = value(point, sample);
        int layer = 0;
        for (int i = 1; i < ends.size() - 1; i++) {
            if (value(ends.get(i), sample).compareTo(p) <= 0) layer = i;
        }
        return layer;
    }
}
