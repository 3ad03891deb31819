package dev.plumb.symbolic;

import dev.plumb.lang.Expr;
import dev.plumb.model.Check;
import java.util.List;
import java.util.Map;

/**
 * What the symbolic stage found for one model.
 *
 * @param checks    verdicts of kind "claim" and "step", in file order
 * @param derived   closed forms of profiles, point values and unknown constants
 * @param profiles  unknown profile name to its closed form in the coordinate (absent when none was found)
 * @param constants unknown constant name to its closed form (absent when none was found)
 * @param notes     sentences about what could not be done symbolically, and why
 */
public record SymbolicResult(List<Check> checks, List<Derived> derived, Map<String, Expr> profiles,
                             Map<String, Expr> constants, List<String> notes) {
    public SymbolicResult {
        checks = List.copyOf(checks);
        derived = List.copyOf(derived);
        profiles = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(profiles));
        constants = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(constants));
        // Passes over the relations can meet the same obstacle more than once; a reader needs it once.
        notes = notes.stream().distinct().toList();
    }
}
