package dev.plumb.symbolic;

/**
 * How the symbolic engine may spend its time.
 *
 * @param timeoutSeconds wall-clock limit for each single computer-algebra call, in seconds
 */
public record SymbolicOptions(double timeoutSeconds) {

    public SymbolicOptions {
        if (!(timeoutSeconds > 0)) throw new IllegalArgumentException("the symbolic time limit must be positive");
    }

    public static SymbolicOptions defaults() {
        return new SymbolicOptions(5);
    }
}
