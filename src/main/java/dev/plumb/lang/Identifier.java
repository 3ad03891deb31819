package dev.plumb.lang;

/** How an identifier reads in typeset mathematics: {@code rho_c} is ρ with subscript c, {@code T0} is T with subscript 0. */
public final class Identifier {
    private Identifier() {
    }

    /** The base name and its subscript (null when there is none). */
    public record Parts(String base, String subscript) { }

    public static Parts split(String id) {
        int us = id.indexOf('_');
        if (us > 0 && us < id.length() - 1) return new Parts(id.substring(0, us), id.substring(us + 1));
        int i = id.length();
        while (i > 1 && Character.isDigit(id.charAt(i - 1))) i--;
        if (i < id.length()) return new Parts(id.substring(0, i), id.substring(i));
        return new Parts(id, null);
    }
}
