package dev.plumb.scaling;

import java.util.List;
import java.util.Map;

/**
 * What one route of a scaling check found: whether it decides (and which way), a sentence on how
 * it got there, the differences it found, and the exponents it read (name → number), if any.
 *
 * @param route       the route's name as shown: "closed form", "dimensions", "numeric sweep"
 * @param decision    {@code HOLDS} or {@code FAILS} when the route decides, {@code NONE} when it cannot
 * @param finding     one sentence for the report
 * @param differences one sentence per exponent that differs or per parameter that is not a power law
 * @param exponents   the exponents the route read, when it read any (else empty)
 */
record RouteFinding(String route, Decision decision, String finding, List<String> differences,
                    Map<String, Object> exponents) {

    enum Decision { HOLDS, FAILS, NONE }

    RouteFinding {
        differences = List.copyOf(differences);
    }

    static RouteFinding undecided(String route, String finding) {
        return new RouteFinding(route, Decision.NONE, finding, List.of(), Map.of());
    }

    static RouteFinding judged(String route, String finding, List<String> differences, Map<String, Object> exponents) {
        return new RouteFinding(route, differences.isEmpty() ? Decision.HOLDS : Decision.FAILS, finding, differences, exponents);
    }

    boolean decides() {
        return decision != Decision.NONE;
    }

    /** The route's name and finding, for the list of routes in a message. */
    String shown() {
        return route + ": " + finding;
    }
}
