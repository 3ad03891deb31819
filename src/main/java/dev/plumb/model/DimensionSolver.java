package dev.plumb.model;

import dev.plumb.units.Dimension;
import dev.plumb.units.Rational;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * Solves equalities between dimensions with unknown parts by incremental elimination. Each
 * equality is taken in source order, so the first one that contradicts the ones before it is
 * the one reported.
 */
final class DimensionSolver {

    private final List<String> names = new ArrayList<>();
    private final List<Boolean> wildcard = new ArrayList<>();
    private final Map<Integer, DimForm> solved = new HashMap<>();

    /** A new variable standing for the unknown unit of {@code name}. */
    DimForm fresh(String name) {
        names.add(name);
        wildcard.add(false);
        return DimForm.variable(names.size() - 1);
    }

    /** A new variable for a literal 0, which is compatible with any unit. */
    DimForm wildcard() {
        names.add("0");
        wildcard.add(true);
        return DimForm.variable(names.size() - 1);
    }

    DimForm resolve(DimForm f) {
        DimForm cur = f;
        boolean changed = true;
        while (changed) {
            changed = false;
            for (Integer v : List.copyOf(cur.vars().keySet())) {
                DimForm value = solved.get(v);
                if (value != null) {
                    cur = cur.substitute(v, value);
                    changed = true;
                }
            }
        }
        return cur;
    }

    /**
     * Requires {@code a} and {@code b} to be equal. Returns empty when they are (or can be made
     * so), otherwise the ratio a/b that is left over.
     */
    Optional<DimForm> unify(DimForm a, DimForm b) {
        DimForm d = resolve(a.div(b));
        if (d.isKnown()) return d.known().isNone() ? Optional.empty() : Optional.of(d);
        int pivot = d.vars().keySet().stream().filter(wildcard::get).findFirst()
                .orElse(d.vars().keySet().iterator().next());
        Rational c = d.vars().get(pivot);
        DimForm rest = d.substitute(pivot, DimForm.NONE);
        solved.put(pivot, rest.pow(Rational.ONE.neg().div(c)));
        return Optional.empty();
    }

    /** The dimension if fully known after everything so far. */
    Optional<Dimension> known(DimForm f) {
        DimForm r = resolve(f);
        return r.isKnown() ? Optional.of(r.known()) : Optional.empty();
    }

    /** Readable form, with unknown units named: "kg m^-3 [unit of K]^(3/4)". */
    String describe(DimForm f) {
        DimForm r = resolve(f);
        if (r.vars().keySet().stream().allMatch(wildcard::get)) {
            String named = dev.plumb.units.UnitCatalog.siName(r.known());
            return named.equals(r.known().toString()) ? named : named + " (" + r.known() + ")";
        }
        StringBuilder out = new StringBuilder();
        if (!r.known().isNone() || r.vars().isEmpty()) out.append(r.known());
        r.vars().forEach((v, p) -> {
            if (wildcard.get(v)) return;
            if (out.length() > 0) out.append(' ');
            out.append("[unit of ").append(names.get(v)).append(']');
            if (!p.equals(Rational.ONE)) out.append('^').append(p.isInteger() ? p.toString() : "(" + p + ")");
        });
        return out.length() == 0 ? "1" : out.toString();
    }
}
