package dev.plumb.numeric;

/**
 * A compiled double-precision formula: reads its variables from a frame of slots (the
 * coordinate, the state, the highest derivatives, the unknown constants) with every constant
 * already folded in SI. Node classes are small and final so the JIT can inline a whole tree.
 */
public abstract class Evaluator {

    /** The value of the formula for the variables in {@code frame}. */
    public abstract double at(double[] frame);

    /** Whether the value depends on no slot (so it can be folded). */
    boolean isConstant() {
        return false;
    }

    /** The slot this node reads directly, or -1 when it is not a plain slot read. */
    int slot() {
        return -1;
    }

    static Evaluator constant(double v) {
        return new Const(v);
    }

    static Evaluator slot(int i) {
        return new Slot(i);
    }

    /** Starts a new evaluation of the frame's formulas: values shared between them are recomputed once. */
    static void newEvaluation(double[] frame, int epochSlot) {
        frame[epochSlot] += 1.0;
    }

    /**
     * A definition called with the same arguments in several relations ({@code rho(r)} in both the
     * balance and the mass relation): computed once per evaluation of the frame and kept in a slot,
     * stamped with the evaluation it belongs to.
     */
    static final class Shared extends Evaluator {
        final Evaluator body;
        final int value, stamp, epoch;

        Shared(Evaluator body, int value, int stamp, int epoch) {
            this.body = body;
            this.value = value;
            this.stamp = stamp;
            this.epoch = epoch;
        }

        @Override public double at(double[] f) {
            double e = f[epoch];
            if (f[stamp] == e) return f[value];
            double v = body.at(f);
            f[value] = v;
            f[stamp] = e;
            return v;
        }
    }

    static final class Const extends Evaluator {
        final double v;

        Const(double v) {
            this.v = v;
        }

        @Override public double at(double[] f) {
            return v;
        }

        @Override boolean isConstant() {
            return true;
        }
    }

    static final class Slot extends Evaluator {
        final int i;

        Slot(int i) {
            this.i = i;
        }

        @Override public double at(double[] f) {
            return f[i];
        }

        @Override int slot() {
            return i;
        }
    }

    static final class Add extends Evaluator {
        final Evaluator a, b;

        Add(Evaluator a, Evaluator b) {
            this.a = a;
            this.b = b;
        }

        @Override public double at(double[] f) {
            return a.at(f) + b.at(f);
        }
    }

    static final class Sub extends Evaluator {
        final Evaluator a, b;

        Sub(Evaluator a, Evaluator b) {
            this.a = a;
            this.b = b;
        }

        @Override public double at(double[] f) {
            return a.at(f) - b.at(f);
        }
    }

    static final class Mul extends Evaluator {
        final Evaluator a, b;

        Mul(Evaluator a, Evaluator b) {
            this.a = a;
            this.b = b;
        }

        @Override public double at(double[] f) {
            return a.at(f) * b.at(f);
        }
    }

    /** A constant times a sub-formula: the commonest shape after folding ({@code -G*m}). */
    static final class Scale extends Evaluator {
        final double c;
        final Evaluator a;

        Scale(double c, Evaluator a) {
            this.c = c;
            this.a = a;
        }

        @Override public double at(double[] f) {
            return c * a.at(f);
        }
    }

    /** A slot times a sub-formula: saves one dispatch in the commonest product, {@code m(r)*rho(r)}. */
    static final class SlotTimes extends Evaluator {
        final int i;
        final Evaluator b;

        SlotTimes(int i, Evaluator b) {
            this.i = i;
            this.b = b;
        }

        @Override public double at(double[] f) {
            return f[i] * b.at(f);
        }
    }

    /** The square of a slot, {@code r^2}. */
    static final class SlotSquare extends Evaluator {
        final int i;

        SlotSquare(int i) {
            this.i = i;
        }

        @Override public double at(double[] f) {
            double x = f[i];
            return x * x;
        }
    }

    /** A sub-formula over the square of a slot, {@code .../r^2}. */
    static final class OverSlotSquare extends Evaluator {
        final Evaluator a;
        final int i;

        OverSlotSquare(Evaluator a, int i) {
            this.a = a;
            this.i = i;
        }

        @Override public double at(double[] f) {
            double x = f[i];
            return a.at(f) / (x * x);
        }
    }

    /** One slot over another, {@code P(r)/K}. */
    static final class SlotRatio extends Evaluator {
        final int i, j;

        SlotRatio(int i, int j) {
            this.i = i;
            this.j = j;
        }

        @Override public double at(double[] f) {
            return f[i] / f[j];
        }
    }

    static final class Div extends Evaluator {
        final Evaluator a, b;

        Div(Evaluator a, Evaluator b) {
            this.a = a;
            this.b = b;
        }

        @Override public double at(double[] f) {
            return a.at(f) / b.at(f);
        }
    }

    static final class Neg extends Evaluator {
        final Evaluator a;

        Neg(Evaluator a) {
            this.a = a;
        }

        @Override public double at(double[] f) {
            return -a.at(f);
        }
    }

    static final class Square extends Evaluator {
        final Evaluator a;

        Square(Evaluator a) {
            this.a = a;
        }

        @Override public double at(double[] f) {
            double x = a.at(f);
            return x * x;
        }
    }

    static final class Cube extends Evaluator {
        final Evaluator a;

        Cube(Evaluator a) {
            this.a = a;
        }

        @Override public double at(double[] f) {
            double x = a.at(f);
            return x * x * x;
        }
    }

    static final class Reciprocal extends Evaluator {
        final Evaluator a;

        Reciprocal(Evaluator a) {
            this.a = a;
        }

        @Override public double at(double[] f) {
            return 1.0 / a.at(f);
        }
    }

    /** {@code x^c} for a constant exponent that is not a small integer. */
    static final class PowConst extends Evaluator {
        final Evaluator a;
        final double c;

        PowConst(Evaluator a, double c) {
            this.a = a;
            this.c = c;
        }

        @Override public double at(double[] f) {
            return Math.pow(a.at(f), c);
        }
    }

    static final class Pow extends Evaluator {
        final Evaluator a, b;

        Pow(Evaluator a, Evaluator b) {
            this.a = a;
            this.b = b;
        }

        @Override public double at(double[] f) {
            return Math.pow(a.at(f), b.at(f));
        }
    }

    static final class Sqrt extends Evaluator {
        final Evaluator a;

        Sqrt(Evaluator a) {
            this.a = a;
        }

        @Override public double at(double[] f) {
            return Math.sqrt(a.at(f));
        }
    }

    static final class Exp extends Evaluator {
        final Evaluator a;

        Exp(Evaluator a) {
            this.a = a;
        }

        @Override public double at(double[] f) {
            return Math.exp(a.at(f));
        }
    }

    /** Any other built-in function of one argument. */
    static final class Function extends Evaluator {
        final dev.plumb.model.BuiltinFunction fn;
        final Evaluator a;

        Function(dev.plumb.model.BuiltinFunction fn, Evaluator a) {
            this.fn = fn;
            this.a = a;
        }

        @Override public double at(double[] f) {
            return fn.apply(a.at(f));
        }
    }

    /**
     * {@code if COND then A else B}. When {@code lockSlot} is not -1 the condition depends on the
     * coordinate only, and a piecewise integration may lock the branch for a whole segment through
     * that slot (1 then, 0 else, NaN free) so a stage that lands exactly on a break uses the
     * segment's own branch.
     */
    static final class Branch extends Evaluator {
        final dev.plumb.lang.Expr.CompareOp op;
        final Evaluator left, right, then, otherwise;
        final int lockSlot;

        Branch(dev.plumb.lang.Expr.CompareOp op, Evaluator left, Evaluator right, Evaluator then, Evaluator otherwise,
               int lockSlot) {
            this.op = op;
            this.left = left;
            this.right = right;
            this.then = then;
            this.otherwise = otherwise;
            this.lockSlot = lockSlot;
        }

        @Override public double at(double[] f) {
            if (lockSlot >= 0) {
                double lock = f[lockSlot];
                if (lock == 1.0) return then.at(f);
                if (lock == 0.0) return otherwise.at(f);
            }
            return op.test(left.at(f), right.at(f)) ? then.at(f) : otherwise.at(f);
        }
    }
}
