package dev.plumb.numeric;

/**
 * The highest derivatives of a relation system as one generated Java method, compiled to bytecode
 * at run time so the hot loop runs at the speed of hand-written code. Public only because the
 * generated class, in its own class loader, must implement it.
 */
public interface RelationKernel {

    /** Writes the highest derivative of each profile into {@code out}, reading the frame {@code f}. */
    void derivatives(double[] f, double[] out);
}
