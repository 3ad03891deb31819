package dev.plumb.numeric;

import dev.plumb.lang.Expr;
import dev.plumb.lang.Stmt;
import dev.plumb.model.Symbol;
import java.util.Arrays;
import java.util.BitSet;
import java.util.List;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.ode.FirstOrderDifferentialEquations;

/**
 * The relations of one case as a first-order system y' = f(x, y), compiled to {@link Evaluator}s.
 * A relation written as {@code P'(r) = ...} is evaluated directly; one written any other way
 * (scaled, with the derivative on the right, or coupled to another highest derivative) is solved
 * for the highest derivatives as a linear system, which is exact because the relations are linear
 * in them. Not thread-safe: it owns its frame; compile one per solve.
 */
final class RelationSystem implements FirstOrderDifferentialEquations {

    /** Returned for every derivative when the relations are not finite, so the integrator rejects the step. */
    static final double REJECT = 1e50;

    final Formulation form;
    final double[] frame;
    private final Evaluator[] explicit;
    private final Evaluator[] residual;
    private final boolean allExplicit;
    private final int h;
    private boolean lastFinite = true;
    private boolean nonFiniteSinceCheck;

    RelationSystem(Formulation form, double[] frame, Evaluator[] explicit, Evaluator[] residual) {
        this.form = form;
        this.frame = frame;
        this.explicit = explicit;
        this.residual = residual;
        this.h = form.profiles.size();
        boolean all = true;
        for (Evaluator e : explicit) all &= e != null;
        this.allExplicit = all;
    }

    /** Compiles the relations of a formulation with a compiler bound to one case's values. */
    static RelationSystem compile(Formulation form, ExprCompiler compiler, java.util.function.Supplier<double[]> frame)
            throws SolveException {
        int h = form.profiles.size();
        Evaluator[] explicit = new Evaluator[h];
        Evaluator[] residual = new Evaluator[h];
        BitSet derivativeSlots = new BitSet();
        for (int j = 0; j < h; j++) derivativeSlots.set(form.derivativeSlot(j));
        for (int j = 0; j < h; j++) {
            Stmt.Relation r = form.relationOf.get(j);
            Expr lhs = r.equation().lhs(), rhs = r.equation().rhs();
            Evaluator l = compiler.compile(lhs), rr = compiler.compile(rhs);
            Symbol.Profile p = form.profiles.get(j);
            if (isHighest(lhs, p, form.order[j]) && !compiler.depsOf(rr).intersects(derivativeSlots)) {
                explicit[j] = rr;
            } else if (isHighest(rhs, p, form.order[j]) && !compiler.depsOf(l).intersects(derivativeSlots)) {
                explicit[j] = l;
            }
            residual[j] = new Evaluator.Sub(l, rr);
        }
        return new RelationSystem(form, frame.get(), explicit, residual);
    }

    private static boolean isHighest(Expr e, Symbol.Profile p, int order) {
        return e instanceof Expr.Call c && c.callee().equals(p.name()) && c.order() == order;
    }

    @Override
    public int getDimension() {
        return form.stateSize;
    }

    @Override
    public void computeDerivatives(double x, double[] y, double[] yDot) {
        double[] f = frame;
        f[0] = x;
        System.arraycopy(y, 0, f, 1, y.length);
        int[] order = form.order, base = form.base;
        for (int j = 0; j < h; j++) {
            for (int k = 0; k < order[j] - 1; k++) yDot[base[j] + k] = y[base[j] + k + 1];
        }
        boolean finite = true;
        if (allExplicit) {
            for (int j = 0; j < h; j++) {
                double d = explicit[j].at(f);
                finite &= Double.isFinite(d);
                yDot[base[j] + order[j] - 1] = d;
            }
        } else {
            double[] d = solveHighest(f);
            for (int j = 0; j < h; j++) {
                finite &= Double.isFinite(d[j]);
                yDot[base[j] + order[j] - 1] = d[j];
            }
        }
        lastFinite = finite;
        if (!finite) {
            nonFiniteSinceCheck = true;
            Arrays.fill(yDot, REJECT);
        }
    }

    /** Whether any evaluation since the last call was not finite; clears the record. */
    boolean takeNonFinite() {
        boolean was = nonFiniteSinceCheck;
        nonFiniteSinceCheck = false;
        return was;
    }

    /** Whether the last evaluation was finite (false: the integrator was told to reject the step). */
    boolean lastFinite() {
        return lastFinite;
    }

    private double[] solveHighest(double[] f) {
        int first = form.derivativeSlot(0);
        for (int j = 0; j < h; j++) f[first + j] = 0.0;
        double[] f0 = new double[h];
        for (int i = 0; i < h; i++) f0[i] = residual[i].at(f);
        double[][] jac = new double[h][h];
        for (int j = 0; j < h; j++) {
            f[first + j] = 1.0;
            for (int i = 0; i < h; i++) jac[i][j] = residual[i].at(f) - f0[i];
            f[first + j] = 0.0;
        }
        double[] d = new double[h];
        if (h == 1) {
            d[0] = -f0[0] / jac[0][0];
        } else {
            try {
                var sol = new LUDecomposition(new Array2DRowRealMatrix(jac, false)).getSolver()
                        .solve(new ArrayRealVector(f0, false));
                for (int j = 0; j < h; j++) d[j] = -sol.getEntry(j);
            } catch (RuntimeException singular) {
                Arrays.fill(d, Double.NaN);
            }
        }
        for (int j = 0; j < h; j++) f[first + j] = d[j];
        return d;
    }

    /** The derivatives at one point, in a fresh array (NaN where the relations are not finite). */
    double[] derivatives(double x, double[] y) {
        double[] out = new double[y.length];
        computeDerivatives(x, y, out);
        if (!lastFinite) Arrays.fill(out, Double.NaN);
        return out;
    }

    List<String> componentNames() {
        return java.util.stream.IntStream.range(0, form.stateSize).mapToObj(form::componentName).toList();
    }
}
