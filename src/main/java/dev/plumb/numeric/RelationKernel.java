package dev.plumb.numeric;

/**
 * The highest derivatives of a relation system as one generated Java method, compiled to bytecode
 * at run time so the hot loop runs at the speed of hand-written code. Public only because the
 * generated class, in its own class loader, must implement it.
 */
public interface RelationKernel {

    /**
     * Writes y' into {@code yDot} for coordinate {@code x} and state {@code y}, reading the unknown
     * constants and branch locks from the frame {@code f}.
     */
    void derivatives(double x, double[] y, double[] f, double[] yDot);
}
