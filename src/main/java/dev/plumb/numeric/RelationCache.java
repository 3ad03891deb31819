package dev.plumb.numeric;

import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Set;

/**
 * Compiled relations kept across solves: the relations of a formulation depend on a case only
 * through the parameter values they fold in (for a polytrope of given M and R, only n), so a sweep
 * over the others compiles once per value of those. Keyed by the formulation (by identity; the
 * engine keeps one per model) and the values of exactly the parameters the compiler read. The
 * parts are stateless, so the cache is shared by all threads; each solve gets its own frame.
 */
final class RelationCache {

    private record Key(Formulation form, Map<String, Double> values) { }

    private static final int SIZE = 256;
    private static final Map<Key, RelationSystem.Parts> PARTS = new LinkedHashMap<>(64, 0.75f, true) {
        @Override protected boolean removeEldestEntry(Map.Entry<Key, RelationSystem.Parts> eldest) {
            return size() > SIZE;
        }
    };
    /** The parameters each formulation's relations read: the same for every case, since compiling visits every subtree. */
    private static final Map<Formulation, Set<String>> READS = new java.util.WeakHashMap<>();

    private RelationCache() {
    }

    /** The parts compiled before for these values, or null. */
    static RelationSystem.Parts find(Formulation form, Map<String, Double> values) {
        synchronized (PARTS) {
            Set<String> names = READS.get(form);
            return names == null ? null : PARTS.get(new Key(form, restrict(names, values)));
        }
    }

    static void keep(Formulation form, Map<String, Double> values, Set<String> read, RelationSystem.Parts parts) {
        synchronized (PARTS) {
            Set<String> known = READS.get(form);
            // A formulation whose relations read different parameters for different cases is not cached at all.
            if (known != null && !known.equals(read)) return;
            READS.put(form, read);
            PARTS.put(new Key(form, restrict(read, values)), parts);
        }
    }

    private static Map<String, Double> restrict(Set<String> names, Map<String, Double> values) {
        Map<String, Double> out = new HashMap<>();
        for (String n : names) out.put(n, values.get(n));
        return out;
    }
}
