package dev.plumb.model;

import dev.plumb.units.Dimension;
import dev.plumb.units.Rational;
import java.util.Map;
import java.util.TreeMap;

/**
 * A dimension that may still contain unknowns: a known part times a product of dimension
 * variables raised to rational powers. In log space this is linear, which is what lets unit
 * inference solve for the units of undeclared unknowns by elimination.
 */
record DimForm(Dimension known, Map<Integer, Rational> vars) {

    DimForm {
        TreeMap<Integer, Rational> clean = new TreeMap<>();
        vars.forEach((k, v) -> {
            if (!v.isZero()) clean.put(k, v);
        });
        vars = java.util.Collections.unmodifiableMap(clean);
    }

    static final DimForm NONE = new DimForm(Dimension.NONE, Map.of());

    static DimForm of(Dimension d) {
        return new DimForm(d, Map.of());
    }

    static DimForm variable(int id) {
        return new DimForm(Dimension.NONE, Map.of(id, Rational.ONE));
    }

    boolean isKnown() {
        return vars.isEmpty();
    }

    DimForm mul(DimForm o) {
        TreeMap<Integer, Rational> m = new TreeMap<>(vars);
        o.vars.forEach((k, v) -> m.merge(k, v, Rational::add));
        return new DimForm(known.mul(o.known), m);
    }

    DimForm pow(Rational p) {
        TreeMap<Integer, Rational> m = new TreeMap<>();
        vars.forEach((k, v) -> m.put(k, v.mul(p)));
        return new DimForm(known.pow(p), m);
    }

    DimForm div(DimForm o) {
        return mul(o.pow(Rational.of(-1)));
    }

    /** Replaces variable {@code id} by {@code value}. */
    DimForm substitute(int id, DimForm value) {
        Rational c = vars.get(id);
        if (c == null) return this;
        TreeMap<Integer, Rational> m = new TreeMap<>(vars);
        m.remove(id);
        return new DimForm(known, m).mul(value.pow(c));
    }
}
