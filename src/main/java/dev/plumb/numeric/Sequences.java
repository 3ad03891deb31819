package dev.plumb.numeric;

import dev.plumb.lang.Expr;
import dev.plumb.lang.ExprPrinter;
import dev.plumb.lang.Stmt;
import dev.plumb.model.Check;
import dev.plumb.model.ConstantEvaluator;
import dev.plumb.model.FileUnits;
import dev.plumb.model.Model;
import dev.plumb.model.Status;
import dev.plumb.model.SweepSpec;
import dev.plumb.units.Dimension;
import dev.plumb.units.Unit;
import dev.plumb.units.UnitCatalog;
import dev.plumb.units.UnitException;
import dev.plumb.units.UnitParser;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.apache.commons.math3.exception.TooManyEvaluationsException;
import org.apache.commons.math3.optim.MaxEval;
import org.apache.commons.math3.optim.nonlinear.scalar.GoalType;
import org.apache.commons.math3.optim.univariate.BrentOptimizer;
import org.apache.commons.math3.optim.univariate.SearchInterval;
import org.apache.commons.math3.optim.univariate.UnivariateObjectiveFunction;
import org.apache.commons.math3.optim.univariate.UnivariatePointValuePair;

/**
 * Sequences of models ({@code sweep} statements): every point solved (the points split between the
 * cores in contiguous runs, each point started from its neighbour's solution), every {@code show}
 * quantity tabulated, and each {@code expect ... max/min ... over} located between the samples by
 * Brent's bracketing method and checked.
 */
public final class Sequences {

    private Sequences() {
    }

    /** One column of a sequence table: a shown quantity, in SI and in the unit the file shows it in. */
    public record Column(String expr, Expr quantity, String unit, String shownUnit, double shownFactor) { }

    /** One model of the sequence: the swept value (SI), each column's value (SI, NaN when not evaluated), or why it failed. */
    public record Point(double value, double[] quantities, String failure) {
        public Point {
            quantities = quantities.clone();
        }

        @Override
        public double[] quantities() {
            return quantities.clone();
        }
    }

    /**
     * The extremum an expectation asks for: where it lies (SI), its value (SI), whether it is at an end of
     * the range (then it is the largest or smallest value sampled, and may lie beyond), and how it was found.
     */
    public record Extremum(String expectLabel, boolean max, String expr, double at, double value, boolean atEnd, String how) { }

    /** A whole sequence with its table and extrema. */
    public record Result(SweepSpec spec, String paramUnit, List<Column> columns, List<Point> points, List<Extremum> extrema) {
        public Result {
            columns = List.copyOf(columns);
            points = List.copyOf(points);
            extrema = List.copyOf(extrema);
        }

        public long solved() {
            return points.stream().filter(p -> p.failure() == null).count();
        }
    }

    /** Runs every sweep of the model; the extremum expectations' checks are added to {@code checks}. */
    public static List<Result> run(Model model, Map<String, Expr> closedForms, NumericOptions options, List<Check> checks,
                                   java.util.function.Consumer<String> progress) {
        List<Result> out = new ArrayList<>();
        for (SweepSpec spec : model.sweeps()) {
            progress.accept("sweep " + spec.label() + " (" + spec.size() + " models)");
            out.add(run(model, spec, closedForms, options, checks));
        }
        return out;
    }

    private static Result run(Model model, SweepSpec spec, Map<String, Expr> closedForms, NumericOptions options, List<Check> checks) {
        List<Stmt.Expect> expects = model.expects().stream()
                .filter(e -> e.extremum() != null && e.extremum().sweep().equals(spec.label())).toList();
        List<Column> columns = columns(model, expects);
        List<Point> points = solveAll(model, spec, columns, closedForms, options);
        String paramUnit = spec.unit() != null ? spec.unit() : UnitCatalog.siName(model.freeParams().stream()
                .filter(p -> p.name().equals(spec.param())).findFirst().map(p -> p.dimension()).orElse(dev.plumb.units.Dimension.NONE));
        List<Extremum> extrema = new ArrayList<>();
        for (Stmt.Expect e : expects) {
            int column = indexOf(columns, ExprPrinter.print(e.lhs()));
            Extremum x = extremum(model, spec, e, column, columns.get(column), points, closedForms, options);
            if (x != null) extrema.add(x);
            checks.add(check(model, spec, e, columns.get(column), x, points));
        }
        return new Result(spec, paramUnit, columns, points, extrema);
    }

    /**
     * Every shown quantity (each show line its own column, in its unit or else the file's unit for the
     * quantity), then each extremum's quantity not shown already (in the expectation's unit).
     */
    private static List<Column> columns(Model model, List<Stmt.Expect> expects) {
        FileUnits units = FileUnits.of(model);
        List<Column> out = new ArrayList<>();
        for (Stmt.Show s : model.shows()) {
            Unit shown = null;
            if (s.unit() != null) {
                try {
                    shown = UnitParser.parse(s.unit().text());
                } catch (UnitException e) {
                    // Reported by the unit check; the file's unit for the quantity stands in.
                }
            }
            out.add(column(model, s.expr(), shown != null ? shown : units.forUnshown(s.expr())));
        }
        for (Stmt.Expect e : expects) {
            if (indexOf(out, ExprPrinter.print(e.lhs())) >= 0) continue;
            Unit shown = FileUnits.written(e.expected());
            if (shown == null || !shown.dimension().equals(model.dimensionOf(e.lhs()))) shown = units.forQuantity(e.lhs());
            out.add(column(model, e.lhs(), shown));
        }
        return out;
    }

    /** A column shown in {@code shown}; a column in SI names no second unit. */
    private static Column column(Model model, Expr quantity, Unit shown) {
        String unit = UnitCatalog.siName(model.dimensionOf(quantity));
        boolean inSi = shown.factor() == 1.0 && (shown.text().equals(unit) || shown.dimension().isNone());
        return new Column(ExprPrinter.print(quantity), quantity, unit, inSi ? null : shown.text(), inSi ? 1.0 : shown.factor());
    }

    private static int indexOf(List<Column> columns, String expr) {
        for (int i = 0; i < columns.size(); i++) if (columns.get(i).expr().equals(expr)) return i;
        return -1;
    }

    /** Solves every point: the range cut into one contiguous run per core, each marched from its first point. */
    private static List<Point> solveAll(Model model, SweepSpec spec, List<Column> columns, Map<String, Expr> closedForms,
                                        NumericOptions options) {
        Point[] out = new Point[spec.size()];
        int threads = Math.max(1, Math.min(Runtime.getRuntime().availableProcessors(), spec.size() / 4));
        ExecutorService pool = Executors.newFixedThreadPool(threads, r -> {
            Thread t = new Thread(null, r, "plumb-sequence", 16L << 20);
            t.setDaemon(true);
            return t;
        });
        try {
            List<Future<?>> work = new ArrayList<>();
            for (int c = 0; c < threads; c++) {
                int from = (int) ((long) spec.size() * c / threads), to = (int) ((long) spec.size() * (c + 1) / threads);
                work.add(pool.submit(() -> {
                    Continuation near = new Continuation();
                    for (int i = from; i < to; i++) out[i] = point(model, spec.point(i), spec.values()[i], columns, closedForms, options, near);
                }));
            }
            for (Future<?> f : work) {
                try {
                    f.get();
                } catch (ExecutionException e) {
                    if (e.getCause() instanceof RuntimeException r) throw r;
                    throw new IllegalStateException("a sequence worker failed", e.getCause());
                }
            }
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted while solving a sequence", e);
        } finally {
            pool.shutdownNow();
        }
        return List.of(out);
    }

    /**
     * One model, started from the continuation's prediction and, when that fails, from the file's own
     * guesses, so whether a point solves never depends on its neighbours.
     */
    private static Point point(Model model, Map<String, Double> values, double value, List<Column> columns,
                               Map<String, Expr> closedForms, NumericOptions options, Continuation near) {
        double[] predicted = near.predict(values);
        SolveException last = null;
        for (double[] start : predicted == null ? new double[][]{null} : new double[][]{predicted, null}) {
            try {
                Solution s = NumericEngine.solve(model, values, options, closedForms, start);
                near.record(values, s);
                double[] q = new double[columns.size()];
                for (int k = 0; k < q.length; k++) {
                    try {
                        q[k] = s.evaluate(columns.get(k).quantity());
                    } catch (SolveException ex) {
                        q[k] = Double.NaN;
                    }
                }
                return new Point(value, q, null);
            } catch (SolveException failed) {
                last = failed;
            }
        }
        return new Point(value, new double[columns.size()], last == null ? "not solved" : last.getMessage());
    }

    /**
     * The extremum of one column: the best sample, then, when it has a solved neighbour on each side,
     * Brent's method on the bracket they make (in the logarithm of the parameter for a log sweep) to
     * the solver's accuracy. Null when no point of the column has a value.
     */
    private static Extremum extremum(Model model, SweepSpec spec, Stmt.Expect e, int column, Column col, List<Point> points,
                                     Map<String, Expr> closedForms, NumericOptions options) {
        boolean max = e.extremum().max();
        int best = -1;
        for (int i = 0; i < points.size(); i++) {
            double v = points.get(i).quantities()[column];
            if (points.get(i).failure() != null || !Double.isFinite(v)) continue;
            if (best < 0 || (max ? v > points.get(best).quantities()[column] : v < points.get(best).quantities()[column])) best = i;
        }
        if (best < 0) return null;
        String label = e.label().present() ? e.label().name() : "line " + e.span().line();
        double sampled = points.get(best).quantities()[column];
        double at = points.get(best).value();
        if (best == 0 || best == points.size() - 1) {
            return new Extremum(label, max, col.expr(), at, sampled, true, "the " + (max ? "largest" : "smallest")
                    + " value sampled lies at the " + (best == 0 ? "first" : "last") + " point of the sweep; widen the range to bracket it");
        }
        boolean log = spec.log();
        double lo = t(points.get(best - 1).value(), log), hi = t(points.get(best + 1).value(), log);
        if (lo > hi) {
            double swap = lo;
            lo = hi;
            hi = swap;
        }
        Continuation near = new Continuation();
        for (int i = best - 1; i <= best + 1; i++) {
            // Starts for the refinement: the bracketing samples solved again are cheap and give the continuation its memory.
            try {
                near.record(spec.point(i), NumericEngine.solve(model, spec.point(i), options, closedForms, null));
            } catch (SolveException ignored) {
                // A neighbour that does not solve leaves the refinement to start from the guesses.
            }
        }
        int[] evaluations = {0};
        double[] failures = {0};
        UnivariateObjectiveFunction f = new UnivariateObjectiveFunction(t -> {
            evaluations[0]++;
            Map<String, Double> values = spec.at(x(t, log));
            try {
                Solution s = NumericEngine.solve(model, values, options.withoutErrorEstimate(), closedForms, near.predict(values));
                near.record(values, s);
                double v = s.evaluate(col.quantity());
                if (Double.isFinite(v)) return v;
            } catch (SolveException ex) {
                // Scored as the worst value below.
            }
            failures[0]++;
            return max ? Double.NEGATIVE_INFINITY : Double.POSITIVE_INFINITY;
        });
        try {
            // Relative 1e-8 in the bracket's variable: the solver's 1e-12 puts the flat top's location no closer than about 1e-6.
            UnivariatePointValuePair found = new BrentOptimizer(1e-8, 1e-14 * Math.max(1, Math.abs(hi))).optimize(new MaxEval(200), f,
                    max ? GoalType.MAXIMIZE : GoalType.MINIMIZE, new SearchInterval(lo, hi, t(at, log)));
            double v = found.getValue();
            if (Double.isFinite(v) && (max ? v >= sampled : v <= sampled)) {
                return new Extremum(label, max, col.expr(), x(found.getPoint(), log), v, false, String.format(Locale.ROOT,
                        "located between samples %d and %d of %d by Brent's method in %d solves%s", best, best + 2, points.size(),
                        evaluations[0], failures[0] > 0 ? " (" + (int) failures[0] + " of them not solved)" : ""));
            }
        } catch (TooManyEvaluationsException ex) {
            // Falls back to the best sample below.
        }
        return new Extremum(label, max, col.expr(), at, sampled, false, "the best sample (sample " + (best + 1) + " of " + points.size()
                + "); the refinement between its neighbours did not improve on it");
    }

    private static double t(double x, boolean log) {
        return log ? Math.log(x) : x;
    }

    private static double x(double t, boolean log) {
        return log ? Math.exp(t) : t;
    }

    private static Check check(Model model, SweepSpec spec, Stmt.Expect e, Column col, Extremum x, List<Point> points) {
        String label = e.label().present() ? e.label().name() : "line " + e.span().line();
        String what = e.extremum().word() + " " + col.expr() + " over " + spec.label();
        if (x == null) {
            long failed = points.stream().filter(p -> p.failure() != null).count();
            return Check.of("expect", label, e.span(), Status.FAILS, what + ": no point of the sweep gave a value ("
                    + failed + " of " + points.size() + " not solved)").with("sweep", spec.label());
        }
        Double expected = constant(model, e.expected(), spec.point(0));
        if (expected == null || expected.isNaN()) {
            return Check.of("expect", label, e.span(), Status.FAILS, "the expected value is not a fixed number").with("sweep", spec.label());
        }
        String unit = col.unit();
        // In the expectation's own unit (else the column's), SI beside, as every other echoed value.
        Unit shown = FileUnits.written(e.expected());
        if (shown == null || !shown.dimension().equals(model.dimensionOf(e.lhs()))) {
            shown = col.shownUnit() != null ? new Unit(col.shownUnit(), col.shownFactor(), model.dimensionOf(e.lhs()))
                    : FileUnits.si(model.dimensionOf(e.lhs()));
        }
        double allowed;
        String tolText;
        if (e.tolerance().isRelative()) {
            allowed = e.tolerance().relative() * Math.abs(expected);
            tolText = String.format(Locale.ROOT, "%.3g relative", e.tolerance().relative());
        } else {
            Double abs = constant(model, e.tolerance().absolute(), spec.point(0));
            allowed = abs == null ? Double.NaN : Math.abs(abs);
            tolText = FileUnits.format(allowed, shown, "%.6g") + " absolute";
        }
        double diff = Math.abs(x.value() - expected);
        double rel = expected != 0 ? diff / Math.abs(expected) : diff;
        // Within the sequence's nominal resolution of the tolerance's edge the value cannot decide either way.
        double resolution = RESOLUTION * Math.abs(x.value());
        boolean unresolved = diff + resolution > allowed && diff - resolution <= allowed;
        Status status = unresolved ? Status.UNDECIDED : diff <= allowed ? Status.HOLDS : Status.FAILS;
        Dimension paramDimension = model.symbol(spec.param()).map(dev.plumb.model.Symbol::dimension).orElse(Dimension.NONE);
        Unit paramIn = spec.unit() != null ? new Unit(spec.unit(), spec.factor(), paramDimension) : FileUnits.si(paramDimension);
        String message = String.format(Locale.ROOT, "%s: %s at %s = %s, expected %s, relative difference %.3g (allowed %s); %s",
                what, FileUnits.format(x.value(), shown, "%.10g"), spec.param(), FileUnits.format(x.at(), paramIn, "%.10g"),
                FileUnits.format(expected, shown, "%.10g"), rel, tolText, x.how())
                + (unresolved ? String.format(Locale.ROOT, "; the difference is within the sequence's resolution (%.0e relative) of the"
                        + " tolerance's edge, so it cannot decide this", RESOLUTION) : "");
        return Check.of("expect", label, e.span(), status, message).with("sweep", spec.label()).with("extremum", e.extremum().word())
                .with("numeric", x.value()).with("expected", expected).with("rel_diff", rel).with("unit", unit)
                .with("at", x.at()).with("at_end", x.atEnd());
    }

    /**
     * The relative accuracy an extremum along a sequence is taken to have: each solve is integrated at a relative
     * tolerance of 1e-12 and shot to a mismatch of about that, and the optimiser's error in location changes the
     * value only to second order; a thousand times the solver's tolerance leaves room for all of it.
     */
    static final double RESOLUTION = 1e-9;

    private static Double constant(Model model, Expr e, Map<String, Double> values) {
        try {
            return new ConstantEvaluator(n -> model.symbols().get(n), values).evaluate(e);
        } catch (ConstantEvaluator.NotConstant ex) {
            return Double.NaN;
        }
    }

    /** A shown value in the column's unit (for tables): SI divided by the shown unit's factor. */
    public static double shown(Column c, double si) {
        return c.shownUnit() != null ? si / c.shownFactor() : si;
    }

    /** The sequences as JSON-ready maps: parameter, unit, points with every quantity (SI), extrema. */
    public static Map<String, Object> toMap(Result r) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("label", r.spec().label());
        m.put("parameter", r.spec().param());
        m.put("spacing", r.spec().log() ? "log" : "linear");
        m.put("unit", r.paramUnit());
        List<Object> cols = new ArrayList<>();
        for (Column c : r.columns()) {
            Map<String, Object> cm = new LinkedHashMap<>();
            cm.put("quantity", c.expr());
            cm.put("unit", c.unit());
            if (c.shownUnit() != null) cm.put("shown_unit", c.shownUnit());
            cols.add(cm);
        }
        m.put("quantities", cols);
        List<Object> pts = new ArrayList<>();
        for (Point p : r.points()) {
            Map<String, Object> pm = new LinkedHashMap<>();
            pm.put("value", p.value());
            if (p.failure() != null) {
                pm.put("failure", p.failure());
            } else {
                Map<String, Object> q = new LinkedHashMap<>();
                for (int k = 0; k < r.columns().size(); k++) {
                    double v = p.quantities()[k];
                    q.put(r.columns().get(k).expr(), Double.isFinite(v) ? v : null);
                }
                pm.put("quantities", q);
            }
            pts.add(pm);
        }
        m.put("points", pts);
        List<Object> ext = new ArrayList<>();
        for (Extremum x : r.extrema()) {
            Map<String, Object> xm = new LinkedHashMap<>();
            xm.put("expect", x.expectLabel());
            xm.put("kind", x.max() ? "max" : "min");
            xm.put("quantity", x.expr());
            xm.put("value", x.value());
            xm.put("at", x.at());
            xm.put("at_end", x.atEnd());
            xm.put("how", x.how());
            ext.add(xm);
        }
        m.put("extrema", ext);
        return m;
    }
}
