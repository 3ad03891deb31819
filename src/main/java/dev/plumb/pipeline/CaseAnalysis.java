package dev.plumb.pipeline;

import dev.plumb.lang.Expr;
import dev.plumb.lang.ExprPrinter;
import dev.plumb.lang.Span;
import dev.plumb.model.CaseValues;
import dev.plumb.model.ConstantEvaluator;
import dev.plumb.model.Model;
import dev.plumb.model.Symbol;
import dev.plumb.numeric.CaseResult;
import dev.plumb.numeric.NumericEngine;
import dev.plumb.numeric.NumericOptions;
import dev.plumb.numeric.QuantityRow;
import dev.plumb.numeric.Solution;
import dev.plumb.numeric.SolveException;
import dev.plumb.report.Analysis;
import dev.plumb.scaling.Monomial;
import dev.plumb.scaling.ParameterSensitivity;
import dev.plumb.scaling.SolvedQuantity;
import dev.plumb.units.Rational;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * Builds each case's table from the numeric result: the comparison rows with their logarithmic
 * sensitivities to every free parameter, propagated uncertainties where case values carry them,
 * and sampled profiles for plots.
 */
final class CaseAnalysis {

    /** Seed of the Monte Carlo propagation, fixed so that a report is reproducible. */
    static final long SEED = 20261201L;
    /** Tolerance of the extra solves behind sensitivities, sweeps and Monte Carlo samples. */
    static final NumericOptions SWEEP_OPTIONS = new NumericOptions(1e-10, 1e-12, false);

    private final Model model;
    private final Map<String, Expr> closedForms;
    private final List<String> notes;

    CaseAnalysis(Model model, Map<String, Expr> closedForms, List<String> notes) {
        this.model = model;
        this.closedForms = closedForms;
        this.notes = notes;
    }

    /** The quantity as a function of the free parameters, always by solving the relations numerically. */
    Optional<ParameterSensitivity.Quantity> numericQuantity(Expr e) {
        return Optional.of(new SolvedQuantity(model, e, SWEEP_OPTIONS));
    }

    /** The quantity as a function of the free parameters: its closed form when known, else a numeric solve. */
    Optional<ParameterSensitivity.Quantity> quantity(Expr e) {
        Expr form = closedForms.get(ExprPrinter.print(e));
        if (form != null) return Optional.of(p -> new ConstantEvaluator(n -> model.symbols().get(n), p).evaluate(form));
        if (model.profiles().isEmpty() && model.unknownConstants().isEmpty()) {
            return Optional.of(p -> new ConstantEvaluator(n -> model.symbols().get(n), p).evaluate(e));
        }
        return Optional.of(p -> NumericEngine.solve(model, p, SWEEP_OPTIONS).evaluate(e));
    }

    /**
     * For a closed form that is a power law, ∂ln Q/∂ln p is its exponent of p, exactly; other
     * quantities get central differences (of the closed form when there is one, else of solves).
     */
    private Optional<Map<String, Double>> exactSensitivities(String quantity, List<String> free) {
        Expr form = closedForms.get(quantity);
        if (form == null) return Optional.empty();
        Optional<Map<String, Rational>> e = new Monomial(n -> model.symbols().get(n)).exponents(form);
        if (e.isEmpty()) return Optional.empty();
        Map<String, Double> out = new LinkedHashMap<>();
        for (String p : free) out.put(p, e.get().getOrDefault(p, Rational.ZERO).toDouble());
        return Optional.of(out);
    }

    Analysis.CaseTable table(CaseResult result, boolean profiles) {
        CaseValues values = model.caseNamed(result.label()).orElse(null);
        List<Analysis.Row> rows = new ArrayList<>();
        // Two rows of one quantity (shown in two units) share its sensitivities and uncertainty, worked out once.
        Map<String, Analysis.Row> done = new LinkedHashMap<>();
        for (QuantityRow q : result.quantities()) {
            Analysis.Row same = done.get(q.expr());
            if (same != null) {
                rows.add(new Analysis.Row(q.expr(), q.unit(), q.closedForm(), Double.isFinite(q.numeric()) ? q.numeric() : null,
                        q.relDiff(), Double.isFinite(q.errorEstimate()) ? q.errorEstimate() : null, q.shownUnit(), q.shownFactor(),
                        same.sensitivities(), same.uncertainty()));
                continue;
            }
            Map<String, Double> sens = Map.of();
            Analysis.Uncertainty unc = null;
            if (values != null && !model.freeParams().isEmpty() && Double.isFinite(q.numeric())) {
                Expr e = dev.plumb.lang.Parser.parseExpression(q.expr());
                Optional<ParameterSensitivity.Quantity> f = e == null ? Optional.empty() : quantity(e);
                if (f.isPresent()) {
                    List<String> free = model.freeParams().stream().map(Symbol.FreeParam::name).toList();
                    try {
                        sens = exactSensitivities(q.expr(), free).orElse(null);
                        if (sens == null) sens = ParameterSensitivity.sensitivities(f.get(), values.values(), free, 1e-4);
                        if (!values.uncertainties().isEmpty()) {
                            boolean closed = closedForms.containsKey(q.expr()) || model.profiles().isEmpty();
                            int samples = closed ? 20_000 : 400;
                            ParameterSensitivity.Uncertainty u = ParameterSensitivity.propagate(f.get(), values.values(), values.uncertainties(), sens, samples, SEED);
                            unc = new Analysis.Uncertainty(u.firstOrder(), u.monteCarlo(), u.samplingError(), u.samples(), u.seed());
                        }
                    } catch (Exception ex) {
                        notes.add(casePrefix(result.label()) + "sensitivities of " + q.expr() + " not computed: " + ex.getMessage());
                    }
                }
            }
            Analysis.Row row = new Analysis.Row(q.expr(), q.unit(), q.closedForm(), Double.isFinite(q.numeric()) ? q.numeric() : null,
                    q.relDiff(), Double.isFinite(q.errorEstimate()) ? q.errorEstimate() : null, q.shownUnit(), q.shownFactor(),
                    sens, unc);
            rows.add(row);
            done.put(q.expr(), row);
        }
        List<Analysis.ProfileSample> samples = profiles && result.solved() ? samples(result.label(), values) : List.of();
        return new Analysis.CaseTable(result.label(), result.method(), result.failure(), rows, samples);
    }

    private List<Analysis.ProfileSample> samples(String label, CaseValues values) {
        Optional<Symbol.Coordinate> coord = model.coordinate();
        if (coord.isEmpty() || model.profiles().isEmpty()) return List.of();
        Map<String, Double> params = values == null ? Map.of() : values.values();
        List<Analysis.ProfileSample> out = new ArrayList<>();
        try {
            Solution s = NumericEngine.solve(model, params, SWEEP_OPTIONS);
            double a = s.evaluate(coord.get().from());
            double b = s.evaluate(coord.get().to());
            int n = 121;
            for (Symbol.Profile p : model.profiles()) {
                double[] x = new double[n];
                double[] y = new double[n];
                double[] c = closedForms.containsKey(p.name() + "(" + coord.get().name() + ")") ? new double[n] : null;
                Expr form = c == null ? null : closedForms.get(p.name() + "(" + coord.get().name() + ")");
                for (int i = 0; i < n; i++) {
                    x[i] = a + (b - a) * i / (n - 1);
                    y[i] = s.evaluate(new Expr.Call(p.name(), Span.NONE, 0, List.of(new Expr.Num(x[i], Double.toString(x[i]), Span.NONE)),
                            Span.NONE));
                    if (c != null) {
                        Map<String, Double> at = new LinkedHashMap<>(params);
                        at.put(coord.get().name(), x[i]);
                        c[i] = new ConstantEvaluator(nm -> model.symbols().get(nm), at).evaluate(form);
                    }
                }
                // Samples stay in SI: the plots and the CSV put them in the file's units themselves.
                out.add(new Analysis.ProfileSample(p.name(), coord.get().name(), dev.plumb.units.UnitCatalog.siName(coord.get().dimension()),
                        dev.plumb.units.UnitCatalog.siName(p.dimension()), x, y, c));
            }
        } catch (SolveException | ConstantEvaluator.NotConstant ex) {
            notes.add(casePrefix(label) + "profiles not sampled for plotting: " + ex.getMessage());
        }
        return out;
    }

    /** How a note about a case begins; a file without free parameters has one implicit case, and no label is named. */
    private String casePrefix(String label) {
        return model.cases().isEmpty() ? "" : "case '" + label + "': ";
    }
}
