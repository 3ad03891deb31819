package dev.plumb.model;

import dev.plumb.lang.Expr;
import dev.plumb.lang.ExprPrinter;
import dev.plumb.lang.Stmt;
import dev.plumb.units.Dimension;
import dev.plumb.units.Rational;
import dev.plumb.units.Unit;
import dev.plumb.units.UnitCatalog;
import dev.plumb.units.UnitException;
import dev.plumb.units.UnitParser;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;

/**
 * The units a file itself works in, for echoing values back to its author: a file written in cgs or
 * in km reads its results in cgs or in km, with SI beside.
 *
 * <p>The unit chosen for a value, most specific first:
 * <ul>
 *   <li>a place along the coordinate: the coordinate's declared unit;</li>
 *   <li>a quantity: the unit of a {@code show} of it, else of an {@code expect} of it; a declared symbol's
 *       own unit;</li>
 *   <li>else the first unit the file writes for that dimension in a {@code param}, {@code coord} or
 *       {@code unknown} declaration, a case value, a sweep range or a guess (in the order of the file);</li>
 *   <li>else a unit the file shows or expects another quantity of that dimension in;</li>
 *   <li>else SI.</li>
 * </ul>
 * Pure numbers are always shown bare.
 */
public final class FileUnits {

    private final Model model;
    private final Unit coordinate;
    private final Map<String, Unit> bySymbol = new HashMap<>();
    private final Map<String, Unit> byShow = new LinkedHashMap<>();
    private final Map<String, Unit> byExpect = new LinkedHashMap<>();
    private final Map<Dimension, Unit> declared = new LinkedHashMap<>();
    private final Map<Dimension, Unit> shown = new LinkedHashMap<>();

    private FileUnits(Model model) {
        this.model = model;
        Unit coord = null;
        for (Stmt s : model.program().statements()) {
            if (s instanceof Stmt.Param p) {
                symbol(p.name(), p.unit() != null ? parse(p.unit().text()) : written(p.value()));
            } else if (s instanceof Stmt.Coord c) {
                Unit u = c.unit() != null ? parse(c.unit().text()) : null;
                symbol(c.name(), u);
                if (model.coordinate().isPresent() && model.coordinate().get().name().equals(c.name())) coord = u;
            } else if (s instanceof Stmt.Unknown u) {
                symbol(u.name(), u.unit() != null ? parse(u.unit().text()) : null);
            } else if (s instanceof Stmt.Case c) {
                for (Stmt.Assignment a : c.assignments()) declare(written(a.value()));
            } else if (s instanceof Stmt.Sweep w) {
                declare(written(w.from()));
                declare(written(w.to()));
                for (Stmt.Assignment a : w.others()) declare(written(a.value()));
            } else if (s instanceof Stmt.Guess g) {
                declare(written(g.value()));
            } else if (s instanceof Stmt.Show sh && sh.unit() != null) {
                quantity(ExprPrinter.print(sh.expr()), parse(sh.unit().text()));
            }
        }
        // An expectation's unit counts after every show: the show is what the author asked to see.
        for (Stmt.Expect e : model.caseExpects()) {
            Unit u = written(e.expected());
            if (u != null) byExpect.putIfAbsent(ExprPrinter.print(e.lhs()), u);
            if (u != null && !u.dimension().isNone()) shown.putIfAbsent(u.dimension(), u);
        }
        this.coordinate = coord;
    }

    /** The units of a checked model's file. */
    public static FileUnits of(Model model) {
        return new FileUnits(model);
    }

    private void symbol(String name, Unit u) {
        if (u == null) return;
        bySymbol.putIfAbsent(name, u);
        declare(u);
    }

    private void declare(Unit u) {
        if (u != null && !u.dimension().isNone()) declared.putIfAbsent(u.dimension(), u);
    }

    private void quantity(String printed, Unit u) {
        if (u == null) return;
        byShow.putIfAbsent(printed, u);
        if (!u.dimension().isNone()) shown.putIfAbsent(u.dimension(), u);
    }

    /** The unit of a value written as a quantity ({@code 5.5 [g/cm^3]}, or its negative), or null. */
    public static Unit written(Expr e) {
        if (e instanceof Expr.Neg n) return written(n.operand());
        return e instanceof Expr.Quantity q ? parse(q.unit()) : null;
    }

    private static Unit parse(String text) {
        try {
            return UnitParser.parse(text);
        } catch (UnitException e) {
            // Reported at its place by the unit check; here it only means no unit of the file's to echo in.
            return null;
        }
    }

    /** The coherent SI unit of a dimension, named as the JSON "unit" field names it. */
    public static Unit si(Dimension d) {
        return d.isNone() ? Unit.ONE : new Unit(UnitCatalog.siName(d), 1.0, d);
    }

    /** The unit the file uses for a dimension (see the class comment), SI when it uses none. */
    public Unit forDimension(Dimension d) {
        if (d.isNone()) return Unit.ONE;
        Unit u = declared.get(d);
        if (u == null) u = shown.get(d);
        return u != null ? u : si(d);
    }

    /** The unit of a place along the coordinate: the coordinate's declared unit. */
    public Unit coordinate() {
        if (coordinate != null) return coordinate;
        return model.coordinate().map(c -> forDimension(c.dimension())).orElse(Unit.ONE);
    }

    /** The unit of a declared symbol: its own declared unit, else the file's unit for its dimension. */
    public Unit forSymbol(String name) {
        Unit u = bySymbol.get(name);
        if (u != null) return u;
        Symbol s = model.symbols().get(name);
        return s == null ? Unit.ONE : forDimension(s.dimension());
    }

    /** The unit of the {@code order}-th derivative of a profile in the coordinate: its unit over the coordinate's to that power. */
    public Unit forDerivative(String profile, int order, Dimension dimension) {
        if (order == 0) return forSymbol(profile);
        Unit declaredForIt = declared.get(dimension);
        if (declaredForIt != null) return declaredForIt;
        Unit u = forSymbol(profile).over(coordinate().pow(Rational.of(order)));
        return u.dimension().equals(dimension) ? u : forDimension(dimension);
    }

    /**
     * The unit of a quantity of the file ({@code P(0)}, {@code m(R)}, {@code R}): the unit a show or an
     * expectation of it uses, a symbol's own unit for the symbol or a profile's value, else the file's
     * unit for its dimension.
     */
    public Unit forQuantity(Expr e) {
        Unit u = matching(byShow, e);
        return u != null ? u : forUnshown(e);
    }

    /**
     * The unit of a {@code show} line that names none: as {@link #forQuantity}, except that another show of
     * the same quantity does not count (that one has its own row in its own unit).
     */
    public Unit forUnshown(Expr e) {
        Unit u = matching(byExpect, e);
        if (u != null) return u;
        Dimension d = model.dimensionOf(e);
        if (e instanceof Expr.Name n && model.symbols().get(n.id()) != null) return forSymbol(n.id());
        if (e instanceof Expr.Call c && c.order() == 0 && model.symbols().get(c.callee()) instanceof Symbol.Profile) {
            Unit own = forSymbol(c.callee());
            if (own.dimension().equals(d)) return own;
        }
        return forDimension(d);
    }

    private Unit matching(Map<String, Unit> units, Expr e) {
        Unit u = units.get(ExprPrinter.print(e));
        // A node the unit check never saw (built after it) has no dimension of its own to compare with.
        return u != null && (u.dimension().equals(model.dimensionOf(e)) || !model.dimensions().containsKey(e)) ? u : null;
    }

    /** A number format for {@link #format}: a whole number as it is (11000, not 11000.0), any other to six figures. */
    public static final String SHORT = "short";

    /**
     * A value given in SI, in {@code unit}, with SI beside when the numbers differ: "1.716346e+12 dyn/cm^2
     * (1.716346e+11 Pa)". Zero is "0" in any unit.
     *
     * @param numberFormat a {@link String#format} conversion such as "%.10g", or {@link #SHORT}
     */
    public static String format(double si, Unit unit, String numberFormat) {
        if (si == 0 || unit.dimension().isNone() && unit.factor() == 1.0) return number(si, numberFormat);
        String inUnit = number(si / unit.factor(), numberFormat) + " " + unit.text();
        if (unit.factor() == 1.0) return inUnit;
        return inUnit + " (" + number(si, numberFormat) + withSpace(UnitCatalog.siName(unit.dimension())) + ")";
    }

    /** A value given in SI, in {@code unit}, without SI beside: for tables and dense lines that name SI elsewhere. */
    public static String plain(double si, Unit unit, String numberFormat) {
        return number(si / unit.factor(), numberFormat) + withSpace(unit.text());
    }

    /** A place along the coordinate (SI), in the coordinate's unit with SI beside. */
    public String position(double si, String numberFormat) {
        return format(si, coordinate(), numberFormat);
    }

    /** A value of a quantity of the given dimension (SI), in the file's unit for it with SI beside. */
    public String value(double si, Dimension d, String numberFormat) {
        return format(si, forDimension(d), numberFormat);
    }

    /** A declared symbol's value (SI), in its unit with SI beside. */
    public String symbolValue(double si, String name, String numberFormat) {
        return format(si, forSymbol(name), numberFormat);
    }

    private static String number(double v, String numberFormat) {
        if (v == 0) return "0";
        if (numberFormat.equals(SHORT)) {
            return v == Math.rint(v) && Math.abs(v) < 1e15 ? Long.toString((long) v) : String.format(Locale.ROOT, "%.6g", v);
        }
        return String.format(Locale.ROOT, numberFormat, v);
    }

    private static String withSpace(String unit) {
        return unit.isEmpty() || unit.equals("1") ? "" : " " + unit;
    }
}
