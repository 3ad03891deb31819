package dev.plumb.report;

import dev.plumb.lang.Expr;
import dev.plumb.lang.Stmt;
import dev.plumb.model.Check;
import dev.plumb.model.Model;
import dev.plumb.model.Status;
import dev.plumb.model.Symbol;
import dev.plumb.units.UnitCatalog;
import java.io.IOException;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.stream.Collectors;

/**
 * The derivation report: what was assumed, the relations, each check with its verdict, the closed
 * forms with the steps that produced them, the cases closed-form beside numeric, and where every
 * constant comes from. The same content goes to every format through {@link Markup}.
 */
public final class DerivationDocument {
    private final Analysis a;
    private final Markup m;
    private final Map<String, byte[]> files = new LinkedHashMap<>();

    public DerivationDocument(Analysis analysis, Markup markup) {
        this.a = analysis;
        this.m = markup;
    }

    /** The main document's text; figures the format keeps in separate files are in {@link #files()}. */
    public String render() throws IOException {
        Model model = a.model();
        m.heading(1, model.title());
        m.paragraph("Source: " + a.source().path() + ". Checked by plumb " + version() + ". " + summary() + ".");
        declarations(model);
        relations(model);
        checks("Units", "units");
        derived();
        checks("Hand-derivation steps", "step");
        checks("Claims", "claim");
        scaling();
        cases();
        sequences();
        checks("Expectations", "expect");
        if (!a.notes().isEmpty()) {
            // The notes say what could not be done (a closed form not found, a plot not drawn) and why.
            m.heading(2, "Notes");
            m.bullets(a.notes());
        }
        sources(model);
        m.footer("Caution: these results are estimates for checking derivations; where they could be applied to something that "
                + "can hurt someone (tanks, pressure vessels, diving, structures), follow the applicable codes and standards and "
                + "licensed engineering practice, not this report.");
        return m.finish();
    }

    public Map<String, byte[]> files() {
        return files;
    }

    private static String version() {
        String v = DerivationDocument.class.getPackage().getImplementationVersion();
        return v == null ? "0.1.0" : v;
    }

    private String summary() {
        return String.format(Locale.ROOT, "%d checks hold, %d fail, %d undecided", a.count(Status.HOLDS), a.count(Status.FAILS),
                a.count(Status.UNDECIDED));
    }

    private void declarations(Model model) {
        m.heading(2, "Declarations");
        List<List<Markup.Cell>> rows = new ArrayList<>();
        for (Symbol s : model.symbols().values()) {
            String kind;
            String detail = "";
            if (s instanceof Symbol.FreeParam p) {
                kind = "free parameter";
                detail = p.assumption() == null ? "" : p.assumption().text;
            } else if (s instanceof Symbol.FixedParam p) {
                kind = "fixed parameter";
                detail = "= " + fmt(p.value()) + " (SI)";
            } else if (s instanceof Symbol.Coordinate c) {
                kind = "coordinate";
                detail = "from " + dev.plumb.lang.ExprPrinter.print(c.from()) + " to " + dev.plumb.lang.ExprPrinter.print(c.to());
            } else if (s instanceof Symbol.Profile p) {
                kind = "unknown profile";
                detail = p.unitInferred() ? "unit inferred" : "";
            } else if (s instanceof Symbol.UnknownConstant c) {
                kind = c.endOfInterval() ? "unknown constant (free surface)" : "unknown constant";
                detail = c.unitInferred() ? "unit inferred" : "";
            } else if (s instanceof Symbol.Definition) {
                continue;
            } else {
                continue;
            }
            rows.add(List.of(Markup.Cell.math(new Expr.Name(s.name(), dev.plumb.lang.Span.NONE)), Markup.Cell.text(kind),
                    Markup.Cell.text(UnitCatalog.siName(s.dimension())), Markup.Cell.text(detail)));
        }
        m.table(List.of("symbol", "kind", "unit (SI)", "details"), rows);
        for (Stmt s : model.program().statements()) {
            if (s instanceof Stmt.Let l) {
                Expr lhs = l.params().isEmpty() ? new Expr.Name(l.name(), l.nameSpan())
                        : new Expr.Call(l.name(), l.nameSpan(), 0,
                        l.params().stream().<Expr>map(p -> new Expr.Name(p, dev.plumb.lang.Span.NONE)).toList(), l.span());
                m.equation("definition", lhs, "=", l.body());
            }
        }
    }

    private void relations(Model model) {
        m.heading(2, "Relations and boundary conditions");
        for (Stmt.Relation r : model.relations()) {
            m.equation(r.label().present() ? r.label().name() : null, r.equation().lhs(), "=", r.equation().rhs());
        }
        for (Stmt.Boundary b : model.boundaries()) {
            m.equation(b.label().present() ? b.label().name() : "boundary", b.equation().lhs(), "=", b.equation().rhs());
        }
        if (!model.guesses().isEmpty()) {
            m.paragraph("First guesses given for the numeric solve (they change where the search starts, not the answer):");
            for (Stmt.Guess g : model.guesses()) m.equation("guess", g.target(), "\u2248", g.value());
        }
    }

    private void checks(String title, String kind) {
        List<Check> cs = a.checks().stream().filter(c -> c.kind().equals(kind)).toList();
        if (cs.isEmpty()) return;
        m.heading(2, title);
        if (!kind.equals("units")) equationsOf(kind);
        List<List<Markup.Cell>> rows = new ArrayList<>();
        for (Check c : cs) {
            rows.add(List.of(Markup.Cell.text(c.label()), Markup.Cell.text(String.valueOf(c.span().line())),
                    Markup.Cell.text(c.status().word()), Markup.Cell.text(c.factor() == null ? "" : c.factor()),
                    Markup.Cell.text(c.message())));
        }
        m.table(List.of("label", "line", "verdict", "factor", "why"), rows);
    }

    private void equationsOf(String kind) {
        for (Stmt s : a.model().program().statements()) {
            if (kind.equals("step") && s instanceof Stmt.Step st) {
                m.equation(st.label().present() ? st.label().name() : null, st.equation().lhs(), "=", st.equation().rhs());
            } else if (kind.equals("claim") && s instanceof Stmt.Claim c) {
                m.equation(c.label().present() ? c.label().name() : null, c.equation().lhs(), "=", c.equation().rhs());
            }
        }
    }

    private void derived() {
        if (a.derived().isEmpty()) return;
        m.heading(2, "Closed forms");
        for (Analysis.DerivedForm d : a.derived()) {
            if (d.form() != null) {
                m.equation(null, parse(d.expr()), "=", d.form());
            } else {
                m.paragraph(d.expr() + " = " + d.closedForm() + "  [" + d.unit() + "]");
            }
            if (!d.trail().isEmpty()) {
                m.bullets(d.trail().stream().map(t -> t.action() + ": " + t.result()).toList());
            }
        }
    }

    /** Re-reads a quantity such as {@code P(0)} for typesetting; falls back to a plain name. */
    private static Expr parse(String text) {
        Expr e = dev.plumb.lang.Parser.parseExpression(text);
        return e != null ? e : new Expr.Name(text, dev.plumb.lang.Span.NONE);
    }

    private void scaling() {
        List<Check> cs = a.checks().stream().filter(c -> c.kind().equals("scaling")).toList();
        if (cs.isEmpty() && a.scales().isEmpty()) return;
        m.heading(2, "Scaling");
        for (Stmt.Scaling s : a.model().scalings()) {
            m.equation(s.label().present() ? s.label().name() : null, s.lhs(), "~", s.rhs());
        }
        List<List<Markup.Cell>> rows = new ArrayList<>();
        for (Check c : cs) {
            rows.add(List.of(Markup.Cell.text(c.label()), Markup.Cell.text(c.status().word()),
                    Markup.Cell.text(exponents(c.extra().get("exponents"))), Markup.Cell.text(exponents(c.extra().get("claimed"))),
                    Markup.Cell.text(String.valueOf(c.extra().getOrDefault("dimensional_analysis", "")))));
        }
        if (!rows.isEmpty()) m.table(List.of("label", "verdict", "exponents found", "claimed", "dimensional analysis"), rows);
        if (!a.scales().isEmpty()) m.bullets(a.scales());
    }

    private static String exponents(Object o) {
        if (!(o instanceof Map<?, ?> map)) return "";
        return map.entrySet().stream().map(e -> e.getKey() + " " + e.getValue()).collect(Collectors.joining(", "));
    }

    private void cases() throws IOException {
        if (a.cases().isEmpty()) return;
        m.heading(2, "Cases: closed form beside numeric");
        for (Analysis.CaseTable t : a.cases()) {
            m.heading(3, "Case " + t.label());
            if (t.method() != null) m.paragraph("Numeric method: " + t.method() + ".");
            if (t.failure() != null) {
                m.paragraph("Not solved: " + t.failure());
                continue;
            }
            List<List<Markup.Cell>> rows = new ArrayList<>();
            for (Analysis.Row r : t.rows()) {
                double f = r.shownUnit() != null ? r.shownFactor() : 1.0;
                rows.add(List.of(Markup.Cell.text(r.expr()), Markup.Cell.text(r.closedForm() == null ? "—" : fmt(r.closedForm() / f)),
                        Markup.Cell.text(r.numeric() == null ? "—" : fmt(r.numeric() / f)),
                        Markup.Cell.text(r.relDiff() == null ? "—" : String.format(Locale.ROOT, "%.1e", r.relDiff())),
                        Markup.Cell.text(r.shownUnit() != null ? r.shownUnit() : r.unit()),
                        Markup.Cell.text(sensitivity(r)), Markup.Cell.text(uncertainty(r))));
            }
            m.table(List.of("quantity", "closed form", "numeric", "rel. diff", "unit", "∂ln Q/∂ln p", "uncertainty"), rows);
            int i = 0;
            for (Analysis.ProfileSample p : t.profiles()) {
                Plot plot = FigureData.profile(a.model(), p);
                m.figure("plot-" + t.label() + "-" + p.profile() + "-" + (i++), FigureData.profileCaption(p, t.label(), plot), plot, files);
            }
        }
    }

    /** Each sweep: its table in the file's units, the second shown quantity against the first, and its data file. */
    private void sequences() throws IOException {
        if (a.sweeps().isEmpty()) return;
        m.heading(2, "Sequences of models");
        for (dev.plumb.numeric.Sequences.Result r : a.sweeps()) {
            var spec = r.spec();
            double pf = spec.unit() != null ? spec.factor() : 1.0;
            String unit = r.paramUnit().equals("1") ? "" : " " + r.paramUnit();
            m.heading(3, "Sweep " + spec.label());
            m.paragraph(String.format(Locale.ROOT, "%s from %s%s to %s%s, %d points spaced %s; %d solved. The data are in %s.",
                    spec.param(), fmt(spec.values()[0] / pf), unit, fmt(spec.values()[spec.size() - 1] / pf), unit, spec.size(),
                    spec.log() ? "evenly in the logarithm" : "evenly", r.solved(), SequenceData.fileName(r)));
            List<String> header = new ArrayList<>();
            header.add(spec.param() + " [" + r.paramUnit() + "]");
            for (var c : r.columns()) header.add(c.expr() + " [" + (c.shownUnit() != null ? c.shownUnit() : c.unit()) + "]");
            List<List<Markup.Cell>> rows = new ArrayList<>();
            for (var p : r.points()) {
                List<Markup.Cell> row = new ArrayList<>();
                row.add(Markup.Cell.text(fmt(p.value() / pf)));
                for (int k = 0; k < r.columns().size(); k++) {
                    double v = dev.plumb.numeric.Sequences.shown(r.columns().get(k), p.quantities()[k]);
                    row.add(Markup.Cell.text(p.failure() != null ? (k == 0 ? "not solved: " + p.failure() : "") : Double.isFinite(v) ? fmt(v) : "—"));
                }
                rows.add(row);
            }
            m.table(header, rows);
            for (var x : r.extrema()) {
                var col = r.columns().stream().filter(c -> c.expr().equals(x.expr())).findFirst().orElseThrow();
                String shown = col.shownUnit() != null ? col.shownUnit() : col.unit();
                m.paragraph(String.format(Locale.ROOT, "%s of %s over %s: %s %s at %s = %s%s (%s).", x.max() ? "Maximum" : "Minimum", x.expr(),
                        spec.label(), fmt(dev.plumb.numeric.Sequences.shown(col, x.value())), shown.equals("1") ? "" : shown, spec.param(),
                        fmt(x.at() / pf), unit, x.how()));
            }
            Plot plot = FigureData.sweep(r);
            if (plot != null) {
                String xLabel = r.columns().size() >= 2 ? header.get(1) : header.get(0), yLabel = header.get(r.columns().size() >= 2 ? 2 : 1);
                m.figure("sweep-" + spec.label(), yLabel + " against " + xLabel + " along sweep " + spec.label() + ".", plot, files);
            }
            files.put(SequenceData.fileName(r), SequenceData.csv(r));
        }
    }

    private static String sensitivity(Analysis.Row r) {
        return r.sensitivities().entrySet().stream().map(e -> e.getKey() + " " + String.format(Locale.ROOT, "%.4f", Math.abs(e.getValue()) < 5e-9 ? 0.0 : e.getValue()))
                .collect(Collectors.joining(", "));
    }

    private static String uncertainty(Analysis.Row r) {
        if (r.uncertainty() == null || r.numeric() == null) return "";
        double v = Math.abs(r.numeric());
        return String.format(Locale.ROOT, "±%.3g%% (first order), ±%.3g%% (Monte Carlo, %d samples)",
                100 * r.uncertainty().firstOrder() / v, 100 * r.uncertainty().monteCarlo() / v, r.uncertainty().samples());
    }

    private void sources(Model model) {
        List<String> items = new ArrayList<>();
        for (Symbol.Builtin b : model.symbols(Symbol.Builtin.class)) {
            items.add(b.name() + " = " + fmt(b.constant().value()) + " " + UnitCatalog.siName(b.dimension()) + " — "
                    + b.constant().description() + "; " + b.constant().source());
        }
        if (items.isEmpty()) return;
        m.heading(2, "Constants and their sources");
        m.bullets(items);
    }

    private static String fmt(double v) {
        return String.format(Locale.ROOT, "%.6g", v);
    }
}
