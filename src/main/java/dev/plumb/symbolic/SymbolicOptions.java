package dev.plumb.symbolic;

/**
 * How the symbolic engine may spend its time.
 *
 * @param timeoutSeconds CPU-time limit for each single computer-algebra call, in seconds (a wall-clock limit
 *                       twelve times as long stays as a safety stop)
 */
public record SymbolicOptions(double timeoutSeconds) {

    public SymbolicOptions {
        if (!(timeoutSeconds > 0)) throw new IllegalArgumentException("the symbolic time limit must be positive");
    }

    public static SymbolicOptions defaults() {
        return new SymbolicOptions(5);
    }
}
