package dev.plumb.model;

import dev.plumb.lang.Diagnostics;
import dev.plumb.lang.Expr;
import dev.plumb.lang.ExprPrinter;
import dev.plumb.lang.Stmt;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * Finds the points at which a statement asks for a profile ({@code show P(2*R)}, {@code expect},
 * {@code claim}, {@code step}, {@code boundary}) that lie outside the coordinate's interval in some
 * case. A profile is known only on its interval: a value past either end would be an
 * extrapolation of relations that hold only inside, so such a request is an error, never a number.
 * Points and ends that depend on an unknown (a free surface) are checked after the solve instead.
 */
final class IntervalPoints {

    private final Map<String, Symbol> symbols;
    private final Symbol.Coordinate coord;
    private final Diagnostics diagnostics;

    /** The unit the coordinate is declared in, or null. */
    private final dev.plumb.units.Unit coordUnit;

    private IntervalPoints(Map<String, Symbol> symbols, Symbol.Coordinate coord, List<Stmt> statements, Diagnostics diagnostics) {
        this.symbols = symbols;
        this.coord = coord;
        this.diagnostics = diagnostics;
        dev.plumb.units.Unit declared = null;
        for (Stmt s : statements) {
            if (s instanceof Stmt.Coord c && c.name().equals(coord.name()) && c.unit() != null) {
                try {
                    declared = dev.plumb.units.UnitParser.parse(c.unit().text());
                } catch (dev.plumb.units.UnitException e) {
                    // Reported by the unit check; SI stands in.
                }
                break;
            }
        }
        this.coordUnit = declared;
    }

    /**
     * Checks every point in every case; a file without free parameters is checked once. A file with
     * free parameters but no case is checked at no values (its points are checked when it gets one).
     */
    static void check(Map<String, Symbol> symbols, Symbol.Coordinate coord, List<CaseValues> cases, List<Stmt> statements,
                      boolean hasFreeParams, Diagnostics diagnostics) {
        if (coord == null) return;
        IntervalPoints points = new IntervalPoints(symbols, coord, statements, diagnostics);
        List<CaseValues> all = new ArrayList<>(cases);
        if (all.isEmpty() && !hasFreeParams) all.add(new CaseValues("", dev.plumb.lang.Span.NONE, Map.of(), Map.of()));
        for (CaseValues c : all) {
            // Points are not checked against ends that are themselves wrong: that would be one mistake told twice.
            if (points.endsOutOfOrder(c)) return;
        }
        Set<Expr.Call> reported = new HashSet<>();
        for (Stmt s : statements) {
            List<Expr.Call> calls = new ArrayList<>();
            for (Expr e : requested(s)) points.collect(e, calls);
            for (Expr.Call call : calls) {
                for (CaseValues c : all) {
                    if (reported.contains(call)) break;
                    if (points.outside(call, c)) reported.add(call);
                }
            }
        }
    }

    /** The expressions of a statement whose profile calls are points of the interval. */
    private static List<Expr> requested(Stmt s) {
        if (s instanceof Stmt.Show sh) return List.of(sh.expr());
        if (s instanceof Stmt.Expect e) return List.of(e.lhs(), e.expected());
        if (s instanceof Stmt.Claim c) return List.of(c.equation().lhs(), c.equation().rhs());
        if (s instanceof Stmt.Step st) return List.of(st.equation().lhs(), st.equation().rhs());
        if (s instanceof Stmt.Boundary b) return List.of(b.equation().lhs(), b.equation().rhs());
        if (s instanceof Stmt.Scaling sc) return List.of(sc.lhs(), sc.rhs());
        return List.of();
    }

    /** Calls of a profile, or of a definition that reads a profile, whose argument does not name the coordinate. */
    private void collect(Expr e, List<Expr.Call> into) {
        References.walk(e, x -> {
            if (x instanceof Expr.Call c && c.args().size() == 1 && !References.names(c.args().get(0)).contains(coord.name())
                    && (symbols.get(c.callee()) instanceof Symbol.Profile || symbols.get(c.callee()) instanceof Symbol.Definition d
                    && !d.params().isEmpty() && readsProfile(d.body(), new HashSet<>()))) {
                into.add(c);
            }
        });
    }

    private static String number(double v) {
        return v == Math.rint(v) && Math.abs(v) < 1e15 ? Long.toString((long) v) : String.format("%.6g", v);
    }

    private boolean readsProfile(Expr e, Set<String> visiting) {
        for (String name : References.names(e)) {
            Symbol s = symbols.get(name);
            if (s instanceof Symbol.Profile) return true;
            if (s instanceof Symbol.Definition d && visiting.add(name) && readsProfile(d.body(), visiting)) return true;
        }
        return false;
    }

    /**
     * Reports an interval whose end is not past its start in case {@code c} (reversed, or empty); true
     * when it did. The ends are written smaller first: the direction of integration is plumb's choice,
     * and the relations, not the order of the ends, say which way a profile falls.
     */
    private boolean endsOutOfOrder(CaseValues c) {
        ConstantEvaluator values = new ConstantEvaluator(symbols::get, c.values());
        double a, b;
        try {
            a = values.evaluate(coord.from());
            b = values.evaluate(coord.to());
        } catch (ConstantEvaluator.NotConstant dependsOnAnUnknown) {
            return false;
        }
        if (!Double.isFinite(a) || !Double.isFinite(b) || b > a) return false;
        String where = c.label().isEmpty() ? "" : " in case '" + c.label() + "'";
        String unit = dev.plumb.units.UnitCatalog.siName(coord.dimension());
        unit = unit.equals("1") ? "" : " " + unit;
        String from = ExprPrinter.print(coord.from()), to = ExprPrinter.print(coord.to());
        dev.plumb.lang.Span ends = coord.from().span().to(coord.to().span());
        if (b == a) {
            diagnostics.error(ends, "the interval of '" + coord.name() + "' is empty: it starts and ends at " + number(a) + unit + where,
                    "a profile needs an interval to hold on; give the end a value past the start");
        } else {
            diagnostics.error(ends, "the interval of '" + coord.name() + "' runs backwards: from " + from + " = " + number(a) + unit
                            + " down to " + to + " = " + number(b) + unit + where,
                    "write the smaller end first: from " + to + " to " + from + " (the relations, not the order of the ends, say which way a profile falls)");
        }
        return true;
    }

    /** Reports the call when its point lies outside the interval in case {@code c}; true when it did. */
    private boolean outside(Expr.Call call, CaseValues c) {
        ConstantEvaluator values = new ConstantEvaluator(symbols::get, c.values());
        double x, a, b;
        try {
            x = values.evaluate(call.args().get(0));
            a = values.evaluate(coord.from());
            b = values.evaluate(coord.to());
        } catch (ConstantEvaluator.NotConstant dependsOnAnUnknown) {
            return false;
        }
        if (!Double.isFinite(x) || !Double.isFinite(a) || !Double.isFinite(b)) return false;
        double lo = Math.min(a, b), hi = Math.max(a, b), slack = 1e-12 * Math.max(Math.abs(a), Math.abs(b));
        if (x >= lo - slack && x <= hi + slack) return false;
        String where = c.label().isEmpty() ? "" : " in case '" + c.label() + "'";
        // In the coordinate's declared unit, as the file writes its points (SI beside when that differs).
        dev.plumb.units.Unit u = coordUnit != null && coordUnit.dimension().equals(coord.dimension()) ? coordUnit : FileUnits.si(coord.dimension());
        String unit = u.text().equals("1") ? "" : " " + u.text();
        String si = u.factor() == 1.0 ? "" : String.format(" (%s to %s %s)", number(lo), number(hi),
                dev.plumb.units.UnitCatalog.siName(coord.dimension()));
        diagnostics.error(call.args().get(0).span(), ExprPrinter.print(call) + " asks for a point outside the interval of '"
                        + coord.name() + "' (" + ExprPrinter.print(coord.from()) + " to " + ExprPrinter.print(coord.to()) + ")",
                String.format("%s = %s = %s%s%s, but the interval is [%s, %s]%s%s", coord.name(),
                        ExprPrinter.print(call.args().get(0)), number(x / u.factor()), unit, where, number(lo / u.factor()),
                        number(hi / u.factor()), unit, si),
                "a profile is known only where its relations hold; plumb does not extrapolate past the ends");
        return true;
    }
}
