package dev.plumb.lang;

import java.util.Collection;
import java.util.Optional;

/** Spelling suggestions for names that were not found. */
public final class Names {
    private Names() {
    }

    /** The closest candidate within a small edit distance, or one differing only in case. */
    public static Optional<String> closest(String name, Collection<String> candidates) {
        String best = null;
        int bestDistance = Integer.MAX_VALUE;
        int allowed = name.length() <= 3 ? 1 : 2;
        for (String c : candidates) {
            // Names that differ in length by more than the allowance are never close (and a name of megabytes costs nothing).
            if (Math.abs(c.length() - name.length()) > allowed) continue;
            int d = c.equalsIgnoreCase(name) ? 0 : editDistance(c, name);
            if (d < bestDistance) {
                best = c;
                bestDistance = d;
            }
        }
        return bestDistance <= allowed ? Optional.ofNullable(best) : Optional.empty();
    }

    public static int editDistance(String a, String b) {
        int[] prev = new int[b.length() + 1];
        int[] cur = new int[b.length() + 1];
        for (int j = 0; j <= b.length(); j++) prev[j] = j;
        for (int i = 1; i <= a.length(); i++) {
            cur[0] = i;
            for (int j = 1; j <= b.length(); j++) {
                int cost = a.charAt(i - 1) == b.charAt(j - 1) ? 0 : 1;
                cur[j] = Math.min(Math.min(cur[j - 1] + 1, prev[j] + 1), prev[j - 1] + cost);
            }
            int[] t = prev;
            prev = cur;
            cur = t;
        }
        return prev[b.length()];
    }
}
