package dev.plumb.numeric;

import dev.plumb.lang.Expr;
import dev.plumb.lang.Stmt;
import dev.plumb.model.ConstantEvaluator;
import dev.plumb.model.Model;
import dev.plumb.model.Symbol;
import dev.plumb.units.Dimension;
import dev.plumb.units.Rational;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Set;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.RealVector;
import org.apache.commons.math3.linear.SingularValueDecomposition;

/**
 * A starting magnitude for an unknown from the balance the relations express: the product of
 * powers of the quantities that the relations, the boundaries and the interval use (through their
 * definitions, with the case's values) that has the unknown's dimension. For a star of mass M and
 * radius R held by G the central pressure guess is G M^2 / R^4; for a degenerate gas of pressure
 * constant K at central density rho_c the length is sqrt(K/G) rho_c^(-1/3).
 *
 * <p>Only what the balance uses enters: a built-in constant counts when a relation, a boundary or
 * a definition they call names it, and a constant definition (a polytropic K built from hbar, c
 * and m_u) counts as one quantity, so an unrelated {@code let} or {@code show} elsewhere in the
 * file never changes a guess. The exponents are the least-squares (minimum-norm) solution, so an
 * unknown whose dimension these quantities cannot make gets no guess.
 */
final class ScalingGuess {

    /** One quantity of the balance: its magnitude (natural log) and its dimension. */
    private record Input(double logValue, double[] dimension) { }

    private final Map<String, Input> inputs = new LinkedHashMap<>();

    /**
     * @param values  SI values of the case's free parameters (and overrides of fixed ones)
     * @param guesses SI values the file gives with {@code guess} for unknown constants, by name
     */
    ScalingGuess(Model model, Map<String, Double> values, Map<String, Double> guesses) {
        ConstantEvaluator constants = new ConstantEvaluator(n -> model.symbols().get(n), values);
        Collector c = new Collector(model, values, constants);
        for (Stmt.Relation r : model.relations()) c.equation(r.equation());
        for (Stmt.Boundary b : model.boundaries()) c.equation(b.equation());
        model.coordinate().ifPresent(coord -> {
            c.visit(coord.from());
            c.visit(coord.to());
        });
        for (Map.Entry<String, Double> g : guesses.entrySet()) {
            Symbol s = model.symbols().get(g.getKey());
            if (s != null) c.add(g.getKey(), g.getValue(), s.dimension());
        }
    }

    /** Walks the balance's expressions and records each quantity it uses once, in the order met. */
    private final class Collector {
        private final Model model;
        private final Map<String, Double> values;
        private final ConstantEvaluator constants;
        private final Set<String> visiting = new HashSet<>();

        Collector(Model model, Map<String, Double> values, ConstantEvaluator constants) {
            this.model = model;
            this.values = values;
            this.constants = constants;
        }

        void equation(Stmt.Equation eq) {
            visit(eq.lhs());
            visit(eq.rhs());
        }

        void visit(Expr e) {
            dev.plumb.model.References.walk(e, x -> {
                if (x instanceof Expr.Quantity q) {
                    try {
                        add(q.text() + " [" + q.unit() + "]", constants.evaluate(q), model.dimensionOf(q));
                    } catch (ConstantEvaluator.NotConstant ignored) {
                        // A unit the catalogue does not know was reported by the unit check.
                    }
                } else if (x instanceof Expr.Name n) {
                    name(n.id());
                } else if (x instanceof Expr.Call call && model.symbols().get(call.callee()) instanceof Symbol.Definition d
                        && visiting.add(d.name())) {
                    visit(d.body());
                    visiting.remove(d.name());
                }
            });
        }

        private void name(String id) {
            Symbol s = model.symbols().get(id);
            if (s instanceof Symbol.FreeParam || s instanceof Symbol.FixedParam) {
                Double given = values.get(id);
                add(id, given != null ? given : s instanceof Symbol.FixedParam f ? f.value() : Double.NaN, s.dimension());
            } else if (s instanceof Symbol.Builtin b) {
                add(id, b.constant().value(), s.dimension());
            } else if (s instanceof Symbol.Definition d && d.params().isEmpty() && !inputs.containsKey(id) && visiting.add(id)) {
                // A constant definition is one quantity of the balance; one that varies is looked through.
                if (Formulation.mentionsUnknown(model, d.body()) || mentionsCoordinate(d.body())) {
                    visit(d.body());
                } else {
                    try {
                        add(id, constants.evaluate(d.body()), d.dimension());
                    } catch (ConstantEvaluator.NotConstant notFixed) {
                        visit(d.body());
                    }
                }
                visiting.remove(id);
            }
        }

        private boolean mentionsCoordinate(Expr e) {
            String x = model.coordinate().map(Symbol::name).orElse(null);
            return x != null && dev.plumb.model.References.names(e).contains(x);
        }

        void add(String name, double value, Dimension d) {
            if (d.isNone() || !(Math.abs(value) > 0) || !Double.isFinite(value) || inputs.containsKey(name)) return;
            inputs.put(name, new Input(Math.log(Math.abs(value)), vector(d)));
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

    /** The names of the quantities a guess is built from, in the order the balance meets them. */
    Set<String> inputs() {
        return inputs.keySet();
    }

    /** A positive magnitude with dimension {@code d}, or NaN when the balance's quantities cannot make it. */
    double guess(Dimension d) {
        if (d.isNone()) return 1.0;
        if (inputs.isEmpty()) return Double.NaN;
        double[] target = vector(d);
        int rows = target.length, cols = inputs.size();
        double[][] a = new double[rows][cols];
        double[] logs = new double[cols];
        int j = 0;
        for (Input in : inputs.values()) {
            for (int i = 0; i < rows; i++) a[i][j] = in.dimension()[i];
            logs[j++] = in.logValue();
        }
        var svd = new SingularValueDecomposition(new Array2DRowRealMatrix(a, false));
        RealVector x = svd.getSolver().solve(new ArrayRealVector(target, false));
        RealVector back = new Array2DRowRealMatrix(a, false).operate(x);
        if (back.subtract(new ArrayRealVector(target, false)).getLInfNorm() > 1e-9) return Double.NaN;
        double log = 0;
        for (int k = 0; k < cols; k++) log += x.getEntry(k) * logs[k];
        return Math.exp(log);
    }
}
