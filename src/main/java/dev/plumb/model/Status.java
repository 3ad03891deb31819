package dev.plumb.model;

/** The verdict of one check. */
public enum Status {
    HOLDS, FAILS, UNDECIDED, NOT_EVALUATED;

    public String word() {
        return switch (this) {
            case HOLDS -> "holds";
            case FAILS -> "fails";
            case UNDECIDED -> "undecided";
            case NOT_EVALUATED -> "not evaluated";
        };
    }
}
