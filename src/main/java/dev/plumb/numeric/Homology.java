package dev.plumb.numeric;

import dev.plumb.lang.Expr;
import dev.plumb.model.Model;
import dev.plumb.model.Symbol;
import dev.plumb.units.Dimension;
import dev.plumb.units.UnitException;
import dev.plumb.units.UnitParser;
import java.util.ArrayList;
import java.util.BitSet;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.WeakHashMap;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.SingularValueDecomposition;

/**
 * The shooting Jacobian from the scalings the relations allow, with no integration. Relations
 * whose units balance are unchanged by a change of units that leaves every dimensional constant
 * they use alone (for a polytrope with only G: length L, mass M and time T with L^3 = M T^2); such
 * a change maps a solution to a solution, with each unknown and each boundary value multiplied by
 * its unit's factor. In log coordinates that gives the change of every mismatch along those
 * directions exactly, and when they span the unknowns, the whole Jacobian (the homology of
 * polytropes, read off the units).
 */
final class Homology {

    private Homology() {
    }

    /**
     * The Jacobian of the mismatches {@code f} at the unknowns {@code z} for the trajectory {@code t},
     * or null when the scalings do not determine it (a dimensional constant too many, a condition at
     * an interior point, a start away from the origin).
     */
    static double[][] jacobian(CaseProblem p, Trajectory t, double[] f) {
        if (p.a != 0.0) return null;
        Model model = p.form.model;
        List<double[]> directions = directions(p);
        if (directions == null) return null;
        int k = p.unknowns.size();
        if (directions.size() < k) return null;
        double[][] dz = new double[k][directions.size()];
        double[][] df = new double[f.length][directions.size()];
        double[] y0 = t.states.firstEntry().getValue();
        int extra = p.fixedSurface ? 1 : 0;
        for (int d = 0; d < directions.size(); d++) {
            double[] delta = directions.get(d);
            for (int u = 0; u < k; u++) {
                CaseProblem.Unknown un = p.unknowns.get(u);
                Dimension dim = un.component() >= 0 ? p.componentDimension(un.component())
                        : p.form.constants.get(un.constant()).dimension();
                double rate = dot(ScalingGuess.vector(dim), delta);
                if (un.log()) {
                    dz[u][d] = rate;
                } else {
                    double v = un.component() >= 0 ? y0[un.component()] : t.constants[un.constant()];
                    dz[u][d] = rate * v / (un.component() >= 0 ? p.scale[un.component()] : 1.0);
                }
            }
            if (p.fixedSurface) df[0][d] = dot(ScalingGuess.vector(p.form.coordinate.dimension()), delta);
            for (int c = 0; c < p.conditions.size(); c++) {
                CaseProblem.Condition cond = p.conditions.get(c);
                Expr lhs = cond.boundary().equation().lhs(), rhs = cond.boundary().equation().rhs();
                if (!scalesWithSolution(p, lhs) || Formulation.mentionsUnknown(model, rhs)) return null;
                double rate = dot(ScalingGuess.vector(model.dimensionOf(lhs)), delta);
                if (cond.log()) {
                    df[c + extra][d] = rate;
                } else {
                    // f = (l - target)/scale with l scaling as e^(rate): df = l rate / scale, l read back from f.
                    double target = cond.target();
                    if (!Double.isFinite(target)) return null;
                    df[c + extra][d] = (f[c + extra] * cond.scale() + target) * rate / cond.scale();
                }
            }
        }
        // J dz = df on the scaling directions; with as many independent directions as unknowns, J = df dz^+.
        RealMatrix z = new Array2DRowRealMatrix(dz, false);
        if (f.length != k) return null;
        SingularValueDecomposition svd = new SingularValueDecomposition(z);
        if (svd.getRank() < k || svd.getConditionNumber() > 1e8) return null;
        RealMatrix j = new Array2DRowRealMatrix(df, false).multiply(svd.getSolver().getInverse());
        double[][] out = j.getData();
        try {
            new LUDecomposition(j, 1e-14).getSolver().getInverse();
        } catch (RuntimeException singular) {
            return null;
        }
        return out;
    }

    /** Directions per formulation and per choice of the boundaries measured as mismatches: they depend on nothing else. */
    private static final Map<Formulation, Map<BitSet, List<double[]>>> CACHE = new WeakHashMap<>();

    /** The scalings of units that leave the relations and the start values alone, or null when units cannot be read. */
    private static List<double[]> directions(CaseProblem p) {
        Model model = p.form.model;
        BitSet measured = new BitSet();
        for (int b = 0; b < model.boundaries().size(); b++) if (p.conditionsInclude(model.boundaries().get(b))) measured.set(b);
        synchronized (CACHE) {
            List<double[]> known = CACHE.computeIfAbsent(p.form, f -> new HashMap<>()).get(measured);
            if (known != null) return known;
        }
        Set<Dimension> fixed = new HashSet<>();
        try {
            for (var r : p.form.relationOf) {
                constants(model, r.equation().lhs(), fixed, new HashSet<>());
                constants(model, r.equation().rhs(), fixed, new HashSet<>());
            }
            for (int b = 0; b < model.boundaries().size(); b++) {
                // Start values and targets that are not scaled themselves must be left alone by the scaling.
                if (measured.get(b)) continue;
                var bd = model.boundaries().get(b);
                constants(model, bd.equation().lhs(), fixed, new HashSet<>());
                constants(model, bd.equation().rhs(), fixed, new HashSet<>());
            }
        } catch (UnitException e) {
            return null;
        }
        List<double[]> out = List.copyOf(invariantDirections(fixed));
        synchronized (CACHE) {
            CACHE.get(p.form).put(measured, out);
        }
        return out;
    }

    /** Whether a condition's left side is a value on the solution that a scaling multiplies by its unit's factor. */
    private static boolean scalesWithSolution(CaseProblem p, Expr lhs) {
        if (lhs instanceof Expr.Name n) {
            Symbol s = p.form.model.symbols().get(n.id());
            return s instanceof Symbol.UnknownConstant;
        }
        if (!(lhs instanceof Expr.Call c) || c.args().size() != 1 || p.form.profileIndex(c.callee()) < 0) return false;
        Expr arg = c.args().get(0);
        if (arg instanceof Expr.Name n && p.form.freeEnd != null && n.id().equals(p.form.freeEnd.name())) return true;
        double at = p.pointOrNaN(arg);
        // At the centre the point stays put; at a fixed surface the condition is read at the surface, wherever it lies.
        return at == p.a || (p.fixedSurface && at == p.b);
    }

    /** Dimensions of the parameters, built-in constants and quantity literals {@code e} uses (through definitions). */
    private static void constants(Model model, Expr e, Set<Dimension> out, Set<String> visiting) throws UnitException {
        if (e instanceof Expr.Quantity q) {
            out.add(UnitParser.parse(q.unit()).dimension());
        } else if (e instanceof Expr.Name n) {
            Symbol s = model.symbols().get(n.id());
            if (s instanceof Symbol.FreeParam || s instanceof Symbol.FixedParam || s instanceof Symbol.Builtin) {
                out.add(s.dimension());
            } else if (s instanceof Symbol.Definition d && visiting.add(d.name())) {
                constants(model, d.body(), out, visiting);
            }
        } else if (e instanceof Expr.Call c) {
            if (model.symbols().get(c.callee()) instanceof Symbol.Definition d && visiting.add(d.name())) {
                constants(model, d.body(), out, visiting);
            }
            for (Expr a : c.args()) constants(model, a, out, visiting);
        } else if (e instanceof Expr.Neg n) {
            constants(model, n.operand(), out, visiting);
        } else if (e instanceof Expr.Binary b) {
            constants(model, b.left(), out, visiting);
            constants(model, b.right(), out, visiting);
        } else if (e instanceof Expr.If i) {
            constants(model, i.condition().left(), out, visiting);
            constants(model, i.condition().right(), out, visiting);
            constants(model, i.then(), out, visiting);
            constants(model, i.otherwise(), out, visiting);
        }
    }

    /** A basis of the changes of units (log factor per base unit) that leave every dimension in {@code fixed} unchanged. */
    private static List<double[]> invariantDirections(Set<Dimension> fixed) {
        int bases = Dimension.Base.values().length;
        List<double[]> rows = new ArrayList<>();
        for (Dimension d : fixed) if (!d.isNone()) rows.add(ScalingGuess.vector(d));
        List<double[]> out = new ArrayList<>();
        if (rows.isEmpty()) {
            for (int b = 0; b < bases; b++) {
                double[] e = new double[bases];
                e[b] = 1;
                out.add(e);
            }
            return out;
        }
        // The null space of the constraint rows, from the SVD of the square matrix padded with zero rows.
        double[][] a = new double[Math.max(rows.size(), bases)][bases];
        for (int r = 0; r < rows.size(); r++) a[r] = rows.get(r);
        SingularValueDecomposition svd = new SingularValueDecomposition(new Array2DRowRealMatrix(a, false));
        double[] sv = svd.getSingularValues();
        RealMatrix v = svd.getV();
        for (int c = 0; c < bases; c++) {
            if (sv[c] <= 1e-10 * sv[0]) out.add(v.getColumn(c));
        }
        return out;
    }

    private static double dot(double[] a, double[] b) {
        double s = 0;
        for (int i = 0; i < a.length; i++) s += a[i] * b[i];
        return s;
    }
}
