package dev.plumb.numeric;

import dev.plumb.model.Model;
import dev.plumb.model.Symbol;
import dev.plumb.units.Dimension;
import dev.plumb.units.Rational;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.RealVector;
import org.apache.commons.math3.linear.SingularValueDecomposition;

/**
 * A starting value for an unknown from dimensional analysis alone: the product of powers of the
 * case's dimensional parameters and the constants the file uses that has the unknown's
 * dimension (for a star of mass M and radius R, a central pressure guess G M^2 / R^4). The
 * exponents are the least-squares solution, so an unknown whose dimension the inputs cannot
 * make gets no guess.
 */
final class ScalingGuess {

    private final List<String> names = new ArrayList<>();
    private final List<Double> logValues = new ArrayList<>();
    private final List<double[]> dims = new ArrayList<>();

    ScalingGuess(Model model, Map<String, Double> values) {
        for (Symbol s : model.symbols().values()) {
            double v;
            if (s instanceof Symbol.FreeParam || s instanceof Symbol.FixedParam) {
                Double given = values.get(s.name());
                v = given != null ? given : s instanceof Symbol.FixedParam f ? f.value() : Double.NaN;
            } else if (s instanceof Symbol.Builtin b) {
                v = b.constant().value();
            } else {
                continue;
            }
            if (s.dimension().isNone() || !(Math.abs(v) > 0) || !Double.isFinite(v)) continue;
            names.add(s.name());
            logValues.add(Math.log(Math.abs(v)));
            dims.add(vector(s.dimension()));
        }
    }

    static double[] vector(Dimension d) {
        Dimension.Base[] bases = Dimension.Base.values();
        double[] out = new double[bases.length];
        for (int i = 0; i < bases.length; i++) {
            Rational r = d.exponent(bases[i]);
            out[i] = (double) r.num() / r.den();
        }
        return out;
    }

    /** A positive magnitude with dimension {@code d}, or NaN when the inputs cannot make it. */
    double guess(Dimension d) {
        if (d.isNone()) return 1.0;
        if (names.isEmpty()) return Double.NaN;
        double[] target = vector(d);
        int rows = target.length, cols = names.size();
        double[][] a = new double[rows][cols];
        for (int j = 0; j < cols; j++) for (int i = 0; i < rows; i++) a[i][j] = dims.get(j)[i];
        var svd = new SingularValueDecomposition(new Array2DRowRealMatrix(a, false));
        RealVector x = svd.getSolver().solve(new ArrayRealVector(target, false));
        RealVector back = new Array2DRowRealMatrix(a, false).operate(x);
        if (back.subtract(new ArrayRealVector(target, false)).getLInfNorm() > 1e-9) return Double.NaN;
        double log = 0;
        for (int j = 0; j < cols; j++) log += x.getEntry(j) * logValues.get(j);
        return Math.exp(log);
    }
}
