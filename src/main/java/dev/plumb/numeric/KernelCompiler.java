package dev.plumb.numeric;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.codehaus.janino.SimpleCompiler;

/**
 * Turns compiled {@link Evaluator} trees into Java source for a {@link RelationKernel} and compiles
 * it with Janino. Shared definition values become local variables computed once; constants stay
 * the SI literals the trees already folded. Kernels are cached by their source, so a sweep that
 * varies only parameters the relations do not use (or repeats a value) compiles once.
 */
final class KernelCompiler {

    private static final int CACHE_SIZE = 256;
    private static final Map<String, Class<?>> CACHE = new LinkedHashMap<>(64, 0.75f, true) {
        @Override protected boolean removeEldestEntry(Map.Entry<String, Class<?>> eldest) {
            return size() > CACHE_SIZE;
        }
    };

    private final int stateSize;

    private KernelCompiler(int stateSize) {
        this.stateSize = stateSize;
    }

    /** A kernel for the given explicit right-hand sides, or null when it cannot be generated or compiled. */
    static RelationKernel compile(Evaluator[] explicit, int[] highestIndex, int[] copyFrom, int stateSize) {
        String source;
        try {
            source = source(explicit, highestIndex, copyFrom, stateSize);
        } catch (IllegalArgumentException unsupported) {
            return null;
        }
        try {
            Class<?> k;
            synchronized (CACHE) {
                k = CACHE.get(source);
            }
            if (k == null) {
                SimpleCompiler c = new SimpleCompiler();
                c.setParentClassLoader(RelationKernel.class.getClassLoader());
                c.cook(source);
                k = c.getClassLoader().loadClass("dev.plumb.numeric.generated.Kernel");
                synchronized (CACHE) {
                    CACHE.put(source, k);
                }
            }
            return (RelationKernel) k.getDeclaredConstructor().newInstance();
        } catch (Exception | LinkageError failed) {
            // The interpreted trees compute the same values; a kernel is only an acceleration.
            return null;
        }
    }

    /**
     * @param highestIndex state index of each profile's highest derivative
     * @param copyFrom     for each state index, the index whose value is its derivative (a lower
     *                     derivative of a higher-order profile), or -1
     */
    static String source(Evaluator[] explicit, int[] highestIndex, int[] copyFrom, int stateSize) {
        KernelCompiler gen = new KernelCompiler(stateSize);
        List<Evaluator.Shared> shared = new ArrayList<>();
        for (Evaluator e : explicit) collectShared(e, shared);
        StringBuilder sb = new StringBuilder();
        sb.append("package dev.plumb.numeric.generated;\n");
        sb.append("public final class Kernel implements dev.plumb.numeric.RelationKernel {\n");
        sb.append("  public void derivatives(double x, double[] y, double[] f, double[] yDot) {\n");
        for (int i = 0; i < copyFrom.length; i++) {
            if (copyFrom[i] >= 0) sb.append("    yDot[").append(i).append("] = y[").append(copyFrom[i]).append("];\n");
        }
        for (Evaluator.Shared s : shared) sb.append("    double s").append(s.value).append(" = ").append(gen.java(s.body)).append(";\n");
        for (int j = 0; j < explicit.length; j++) {
            sb.append("    yDot[").append(highestIndex[j]).append("] = ").append(gen.java(explicit[j])).append(";\n");
        }
        sb.append("  }\n");
        sb.append("  private static double sq(double x) { return x * x; }\n");
        sb.append("  private static double cube(double x) { return x * x * x; }\n}\n");
        return sb.toString();
    }

    /** Shared nodes in an order where each comes after the shared nodes it uses. */
    private static void collectShared(Evaluator e, List<Evaluator.Shared> out) {
        for (Evaluator c : children(e)) collectShared(c, out);
        if (e instanceof Evaluator.Shared s && !out.contains(s)) {
            collectShared(s.body, out);
            out.add(s);
        }
    }

    private static Evaluator[] children(Evaluator e) {
        if (e instanceof Evaluator.Add n) return new Evaluator[]{n.a, n.b};
        if (e instanceof Evaluator.Sub n) return new Evaluator[]{n.a, n.b};
        if (e instanceof Evaluator.Mul n) return new Evaluator[]{n.a, n.b};
        if (e instanceof Evaluator.Div n) return new Evaluator[]{n.a, n.b};
        if (e instanceof Evaluator.Pow n) return new Evaluator[]{n.a, n.b};
        if (e instanceof Evaluator.Scale n) return new Evaluator[]{n.a};
        if (e instanceof Evaluator.SlotTimes n) return new Evaluator[]{n.b};
        if (e instanceof Evaluator.OverSlotSquare n) return new Evaluator[]{n.a};
        if (e instanceof Evaluator.Neg n) return new Evaluator[]{n.a};
        if (e instanceof Evaluator.Square n) return new Evaluator[]{n.a};
        if (e instanceof Evaluator.Cube n) return new Evaluator[]{n.a};
        if (e instanceof Evaluator.Reciprocal n) return new Evaluator[]{n.a};
        if (e instanceof Evaluator.PowConst n) return new Evaluator[]{n.a};
        if (e instanceof Evaluator.Sqrt n) return new Evaluator[]{n.a};
        if (e instanceof Evaluator.Exp n) return new Evaluator[]{n.a};
        if (e instanceof Evaluator.Function n) return new Evaluator[]{n.a};
        if (e instanceof Evaluator.Branch n) return new Evaluator[]{n.left, n.right, n.then, n.otherwise};
        return new Evaluator[0];
    }

    /** Frame slot 0 is the coordinate and slots 1..n the state: the kernel reads those from its arguments. */
    private String slot(int i) {
        if (i == 0) return "x";
        if (i <= stateSize) return "y[" + (i - 1) + "]";
        return "f[" + i + "]";
    }

    private static String lit(double v) {
        if (Double.isNaN(v)) return "Double.NaN";
        if (v == Double.POSITIVE_INFINITY) return "Double.POSITIVE_INFINITY";
        if (v == Double.NEGATIVE_INFINITY) return "Double.NEGATIVE_INFINITY";
        return "(" + Double.toString(v) + ")";
    }

    private String java(Evaluator e) {
        if (e instanceof Evaluator.Const n) return lit(n.v);
        if (e instanceof Evaluator.Slot n) return slot(n.i);
        if (e instanceof Evaluator.Shared n) return "s" + n.value;
        if (e instanceof Evaluator.Add n) return "(" + java(n.a) + " + " + java(n.b) + ")";
        if (e instanceof Evaluator.Sub n) return "(" + java(n.a) + " - " + java(n.b) + ")";
        if (e instanceof Evaluator.Mul n) return "(" + java(n.a) + " * " + java(n.b) + ")";
        if (e instanceof Evaluator.Div n) return "(" + java(n.a) + " / " + java(n.b) + ")";
        if (e instanceof Evaluator.Scale n) return "(" + lit(n.c) + " * " + java(n.a) + ")";
        if (e instanceof Evaluator.SlotTimes n) return "(" + slot(n.i) + " * " + java(n.b) + ")";
        if (e instanceof Evaluator.SlotSquare n) return "(" + slot(n.i) + " * " + slot(n.i) + ")";
        if (e instanceof Evaluator.OverSlotSquare n) return "(" + java(n.a) + " / (" + slot(n.i) + " * " + slot(n.i) + "))";
        if (e instanceof Evaluator.SlotRatio n) return "(" + slot(n.i) + " / " + slot(n.j) + ")";
        if (e instanceof Evaluator.Neg n) return "(-" + java(n.a) + ")";
        if (e instanceof Evaluator.Square n) return "sq(" + java(n.a) + ")";
        if (e instanceof Evaluator.Cube n) return "cube(" + java(n.a) + ")";
        if (e instanceof Evaluator.Reciprocal n) return "(1.0 / " + java(n.a) + ")";
        if (e instanceof Evaluator.PowConst n) return "Math.pow(" + java(n.a) + ", " + lit(n.c) + ")";
        if (e instanceof Evaluator.Pow n) return "Math.pow(" + java(n.a) + ", " + java(n.b) + ")";
        if (e instanceof Evaluator.Sqrt n) return "Math.sqrt(" + java(n.a) + ")";
        if (e instanceof Evaluator.Exp n) return "Math.exp(" + java(n.a) + ")";
        if (e instanceof Evaluator.Function n) return n.fn.javaMethod + "(" + java(n.a) + ")";
        if (e instanceof Evaluator.Branch n) {
            String cond = "(" + java(n.left) + " " + n.op.symbol + " " + java(n.right) + ")";
            String free = "(" + cond + " ? " + java(n.then) + " : " + java(n.otherwise) + ")";
            if (n.lockSlot < 0) return free;
            String lock = "f[" + n.lockSlot + "]";
            return "(" + lock + " == 1.0 ? " + java(n.then) + " : " + lock + " == 0.0 ? " + java(n.otherwise) + " : " + free + ")";
        }
        throw new IllegalArgumentException("no Java form for " + e.getClass().getSimpleName());
    }
}
