package dev.plumb.report;

import dev.plumb.lang.Diagnostic;
import dev.plumb.model.Check;
import dev.plumb.model.Status;
import java.util.Locale;

/** The human-readable summary that {@code plumb check} prints for one file. */
public final class TextReport {
    private final Style style;

    public TextReport(Style style) {
        this.style = style;
    }

    /** Past this many, the diagnostics of a file are counted rather than printed. */
    static final int MAX_DIAGNOSTICS = 50;

    /** The whole summary: the diagnostics, then the results. */
    public String render(Analysis a, boolean strict) {
        return diagnostics(a) + results(a, strict);
    }

    /** The located messages about the file (for standard error), at most {@link #MAX_DIAGNOSTICS} of them. */
    public String diagnostics(Analysis a) {
        StringBuilder out = new StringBuilder();
        DiagnosticPrinter printer = new DiagnosticPrinter(style);
        int shown = 0;
        for (Diagnostic d : a.diagnostics()) {
            if (shown++ == MAX_DIAGNOSTICS) {
                out.append("... and ").append(a.diagnostics().size() - MAX_DIAGNOSTICS)
                        .append(" more diagnostics not shown (all of them are in --format json)\n");
                break;
            }
            out.append(printer.print(a.source(), d));
        }
        if (!a.diagnostics().isEmpty()) out.append('\n');
        return out.toString();
    }

    /** The verdicts, closed forms, case tables and summary line (for standard output). */
    public String results(Analysis a, boolean strict) {
        return results(a, strict, false);
    }

    /**
     * As {@link #results(Analysis, boolean)}; with {@code unitsShown} the header and the unit checks were
     * printed already, as they came ({@link #header} and {@link #check}), and are left out.
     */
    public String results(Analysis a, boolean strict, boolean unitsShown) {
        StringBuilder out = new StringBuilder();
        if (!unitsShown) out.append(header(a.source().path(), a.model()));
        if (a.hasInputErrors()) {
            out.append("  the input could not be understood; fix the errors reported for it and run again\n");
            return out.toString();
        }
        for (Check c : a.checks()) {
            if (unitsShown && c.kind().equals("units")) continue;
            out.append(check(c));
        }
        if (!a.derived().isEmpty()) {
            out.append("\n  closed forms\n");
            for (Analysis.DerivedForm d : a.derived()) {
                out.append(String.format(Locale.ROOT, "    %s = %s   [%s]%n", d.expr(), d.closedForm(), d.unit()));
            }
        }
        for (Analysis.CaseTable t : a.cases()) {
            if (t.rows().isEmpty() && t.failure() == null && t.profiles().isEmpty()) continue;
            out.append('\n').append("  case ").append(style.bold(t.label()));
            if (t.method() != null) out.append(style.dim("  (" + t.method() + ")"));
            out.append('\n');
            if (t.failure() != null) {
                out.append("    ").append(style.red("not solved: ")).append(t.failure()).append('\n');
                continue;
            }
            if (t.rows().isEmpty()) continue;
            // The quantity column is as wide as its longest entry, so long expressions keep the columns aligned.
            int width = Math.max(14, t.rows().stream().mapToInt(r -> r.expr().length()).max().orElse(0));
            String row = "    %-" + width + "s %-14s %-14s %-10s %-10s %s%n";
            out.append(String.format(Locale.ROOT, row, "quantity", "closed form", "numeric", "rel. diff", "est. error", "unit"));
            // A quantity shown in two units has a row in each; its sensitivities and uncertainty are printed once.
            java.util.Set<String> explained = new java.util.HashSet<>();
            for (Analysis.Row r : t.rows()) {
                double f = r.shownUnit() != null ? r.shownFactor() : 1.0;
                String unit = r.shownUnit() != null ? r.shownUnit() : r.unit();
                out.append(String.format(Locale.ROOT, row, r.expr(),
                        num(r.closedForm(), f), num(r.numeric(), f), small(r.relDiff()), relative(r.errorEstimate(), r.numeric()), unit));
                if (!explained.add(r.expr())) continue;
                if (!r.sensitivities().isEmpty()) {
                    StringBuilder sb = new StringBuilder();
                    r.sensitivities().forEach((p, v) -> sb.append(String.format(Locale.ROOT, "  %s %.4f", p, Math.abs(v) < 5e-9 ? 0.0 : v)));
                    out.append(style.dim("      d ln " + r.expr() + " / d ln p:" + sb)).append('\n');
                }
                if (r.uncertainty() != null && r.numeric() != null && r.numeric() != 0) {
                    double v = Math.abs(r.numeric());
                    out.append(style.dim(String.format(Locale.ROOT,
                            "      uncertainty: +-%.3g%% first order, +-%.3g%% Monte Carlo (%d samples, +-%.2g%% sampling error, seed %d)",
                            100 * r.uncertainty().firstOrder() / v, 100 * r.uncertainty().monteCarlo() / v, r.uncertainty().samples(),
                            100 * r.uncertainty().samplingError() / v, r.uncertainty().seed()))).append('\n');
                }
            }
        }
        for (dev.plumb.numeric.Sequences.Result r : a.sweeps()) sweep(out, r);
        for (String scale : a.scales()) out.append("  ").append(scale).append('\n');
        for (String note : a.notes()) out.append("  note: ").append(Style.inert(note)).append('\n');
        out.append('\n').append(summary(a, strict)).append('\n');
        return out.toString();
    }

    /** Past this many points a sequence's table shows every k-th one (all of them are in JSON and CSV). */
    static final int MAX_SWEEP_ROWS = 40;

    private void sweep(StringBuilder out, dev.plumb.numeric.Sequences.Result r) {
        var spec = r.spec();
        double pf = spec.unit() != null ? spec.factor() : 1.0;
        out.append('\n').append("  sweep ").append(style.bold(Style.inert(spec.label())))
                .append(style.dim(String.format(Locale.ROOT, "  (%s from %.6g to %.6g%s, %s, %d points, %d solved)", spec.param(),
                        spec.values()[0] / pf, spec.values()[spec.size() - 1] / pf, r.paramUnit().equals("1") ? "" : " " + r.paramUnit(),
                        spec.log() ? "log" : "linear",
                        spec.size(), r.solved()))).append('\n');
        java.util.List<String> heads = new java.util.ArrayList<>();
        heads.add(spec.param() + " [" + r.paramUnit() + "]");
        for (var c : r.columns()) heads.add(c.expr() + " [" + (c.shownUnit() != null ? c.shownUnit() : c.unit()) + "]");
        // A shown column that repeats the swept parameter in its unit is left out of the table (the curve still uses it).
        boolean[] repeats = new boolean[r.columns().size()];
        for (int k = 0; k < repeats.length; k++) repeats[k] = heads.get(k + 1).equals(heads.get(0));
        StringBuilder head = new StringBuilder("   ");
        for (int k = 0; k < heads.size(); k++) {
            if (k == 0 || !repeats[k - 1]) head.append(String.format(Locale.ROOT, " %-16s", Style.inert(heads.get(k))));
        }
        out.append(head.toString().stripTrailing()).append('\n');
        int step = Math.max(1, (int) Math.ceil(spec.size() / (double) MAX_SWEEP_ROWS));
        for (int i = 0; i < spec.size(); i++) {
            if (i % step != 0 && i != spec.size() - 1) continue;
            var p = r.points().get(i);
            StringBuilder row = new StringBuilder("   ").append(String.format(Locale.ROOT, " %-16.6e", p.value() / pf));
            if (p.failure() != null) {
                row.append(' ').append(style.red("not solved: ")).append(Style.inert(p.failure()));
            } else {
                for (int k = 0; k < r.columns().size(); k++) {
                    if (repeats[k]) continue;
                    double v = dev.plumb.numeric.Sequences.shown(r.columns().get(k), p.quantities()[k]);
                    row.append(String.format(Locale.ROOT, " %-16s", Double.isFinite(v) ? String.format(Locale.ROOT, "%.6e", v) : "-"));
                }
            }
            out.append(row.toString().stripTrailing()).append('\n');
        }
        if (step > 1) out.append(style.dim("    (every " + step + "th point shown; all " + spec.size() + " are in --format json)")).append('\n');
        if (!r.columns().isEmpty()) {
            int n = spec.size();
            double[] x = new double[n], y = new double[n];
            var yc = r.columns().size() >= 2 ? r.columns().get(1) : r.columns().get(0);
            int yk = r.columns().size() >= 2 ? 1 : 0;
            for (int i = 0; i < n; i++) {
                var p = r.points().get(i);
                boolean ok = p.failure() == null;
                x[i] = !ok ? Double.NaN : r.columns().size() >= 2 ? dev.plumb.numeric.Sequences.shown(r.columns().get(0), p.quantities()[0]) : p.value() / pf;
                y[i] = !ok ? Double.NaN : dev.plumb.numeric.Sequences.shown(yc, p.quantities()[yk]);
            }
            String xLabel = r.columns().size() >= 2 ? heads.get(1) : heads.get(0);
            String yLabel = r.columns().size() >= 2 ? heads.get(2) : heads.get(1);
            String curve = AsciiCurve.draw(x, y, Style.inert(xLabel), Style.inert(yLabel) + " against " + Style.inert(xLabel), "    ");
            if (!curve.isEmpty()) out.append('\n').append(curve);
        }
    }

    /** The file's first line: its path and title. */
    public String header(String path, dev.plumb.model.Model model) {
        String title = Style.inert(model != null ? model.title() : "");
        return style.bold(path) + (title.isEmpty() || title.equals(path) ? "" : "  " + title) + "\n";
    }

    /** One check's line. */
    public String check(Check c) {
        return String.format(Locale.ROOT, "  %-9s %-22s %s  %s%n", c.kind(), Style.inert(c.label()), status(c.status()),
                Style.inert(c.message()) + (c.factor() != null && !c.message().contains("factor") ? " (factor " + c.factor() + ")" : ""));
    }

    private String summary(Analysis a, boolean strict) {
        long holds = a.count(Status.HOLDS);
        long fails = a.count(Status.FAILS);
        long undecided = a.count(Status.UNDECIDED);
        long pending = a.count(Status.NOT_EVALUATED);
        long errors = a.errorCount();
        String s = String.format(Locale.ROOT, "  %d hold, %d fail, %d undecided%s%s", holds, fails, undecided,
                pending > 0 ? ", " + pending + " not evaluated yet" : "", errors > 0 ? ", " + errors + " error" + (errors > 1 ? "s" : "") : "");
        return a.ok(strict) ? style.green(s) : style.red(s);
    }

    private String status(Status s) {
        String w = String.format(Locale.ROOT, "%-9s", s.word());
        return switch (s) {
            case HOLDS -> style.green(w);
            case FAILS -> style.red(w);
            case UNDECIDED, NOT_EVALUATED -> style.yellow(w);
        };
    }

    private static String num(Double v, double factor) {
        return v == null ? "-" : String.format(Locale.ROOT, "%.6e", v / factor);
    }

    /** An absolute error estimate as a fraction of the value, which reads the same in any unit. */
    private static String relative(Double error, Double value) {
        if (error == null || value == null) return "-";
        return value == 0 ? small(error) : small(Math.abs(error / value));
    }

    private static String small(Double v) {
        return v == null ? "-" : String.format(Locale.ROOT, "%.1e", v);
    }
}
