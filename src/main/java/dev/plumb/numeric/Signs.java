package dev.plumb.numeric;

import dev.plumb.lang.Diagnostic;
import dev.plumb.lang.Stmt;
import dev.plumb.model.FileUnits;
import dev.plumb.model.Model;
import dev.plumb.model.Symbol;
import dev.plumb.units.Dimension;
import dev.plumb.units.UnitException;
import dev.plumb.units.UnitParser;
import java.util.List;
import java.util.Map;

/**
 * Warns when a solved profile that must not be negative goes negative inside the interval: one
 * declared {@code > 0} or {@code >= 0}, or an absolute quantity by its unit (a pressure, a
 * density, a temperature or a mass). A negative central pressure too low to hold the body up, or
 * a sign flipped in a relation, shows up here instead of as a plausible-looking number.
 */
final class Signs {

    /** Below this fraction of the profile's own scale a negative value is rounding near a zero, not a sign. */
    private static final double NOISE = 1e-9;

    private Signs() {
    }

    static void check(Model model, String caseLabel, boolean implicitCase, Solution solution, List<Diagnostic> into) {
        FileUnits units = null;
        for (Map.Entry<String, double[]> e : solution.lowest().entrySet()) {
            if (!(model.symbols().get(e.getKey()) instanceof Symbol.Profile p)) continue;
            String why = assumedPositive(p);
            double lowest = e.getValue()[0], at = e.getValue()[1], scale = e.getValue()[2];
            if (why == null || !(lowest < -NOISE * scale)) continue;
            Symbol.Coordinate x = model.coordinate().orElseThrow();
            if (units == null) units = FileUnits.of(model);
            into.add(Diagnostic.warning(p.span(), (implicitCase ? "" : "case '" + caseLabel + "': ") + p.name() + " goes negative inside "
                            + "the interval, though " + why,
                    String.format("lowest value %s = %s at %s = %s", p.name(), units.symbolValue(lowest, p.name(), "%.6g"),
                            x.name(), units.position(at, "%.9g")),
                    "check the signs of the relations and the boundary values; a start value too small to hold the body up "
                            + "also does this"));
        }
    }

    /** Why the profile must not be negative, or null when it may be. */
    static String assumedPositive(Symbol.Profile p) {
        if (p.assumption() == Stmt.Assumption.POSITIVE) return "it is declared > 0";
        if (p.assumption() == Stmt.Assumption.NON_NEGATIVE) return "it is declared >= 0";
        Dimension d = p.dimension();
        if (d.equals(unit("Pa"))) return "it is a pressure";
        if (d.equals(unit("kg/m^3"))) return "it is a density";
        if (d.equals(unit("K"))) return "it is a temperature";
        if (d.equals(unit("kg"))) return "it is a mass";
        return null;
    }

    private static Dimension unit(String text) {
        try {
            return UnitParser.parse(text).dimension();
        } catch (UnitException e) {
            throw new IllegalStateException("the unit catalogue lacks " + text, e);
        }
    }
}
