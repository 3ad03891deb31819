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
        m.begin(stem(a.source().path()), typesetForms(model));
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
            m.bulletList(a.notes().stream().map(this::runs).toList());
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

    /** The file's name without folders and its extension, which labels in a LaTeX report start with. */
    private static String stem(Object path) {
        String name = String.valueOf(path).replace('\\', '/');
        name = name.substring(name.lastIndexOf('/') + 1);
        return name.endsWith(".plumb") ? name.substring(0, name.length() - ".plumb".length()) : name;
    }

    /** The typeset forms the file gives its names ({@code typeset NAME as "TeX"}), in the order written. */
    private static Map<String, String> typesetForms(Model model) {
        Map<String, String> forms = new LinkedHashMap<>();
        for (Stmt s : model.program().statements()) {
            if (s instanceof Stmt.Typeset t) forms.put(t.name(), t.tex());
        }
        return forms;
    }

    /** Reads the formulas in a message back for typesetting, with the names this file knows. */
    private List<Markup.Inline> runs(String message) {
        return new MessageRuns(n -> a.model().symbols().containsKey(n)).of(message);
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
            Markup.Cell detail = Markup.Cell.text("");
            if (s instanceof Symbol.FreeParam p) {
                kind = "free parameter";
                if (p.assumption() != null) detail = Markup.Cell.of(Markup.Inline.Math.of(name(s.name())),
                        Markup.text(" " + p.assumption().text.replace(">=", "\u2265").replace(" 0", " ")), new Markup.Inline.Number("0"));
            } else if (s instanceof Symbol.FixedParam p) {
                kind = "fixed parameter";
                detail = Markup.Cell.of(Markup.text("= "), new Markup.Inline.Number(fmt(p.value())), new Markup.Inline.Unit(
                        UnitCatalog.siName(s.dimension())), Markup.text(" (SI)"));
            } else if (s instanceof Symbol.Coordinate c) {
                kind = "coordinate";
                detail = Markup.Cell.of(Markup.text("from "), Markup.Inline.Math.of(c.from()), Markup.text(" to "), Markup.Inline.Math.of(c.to()));
            } else if (s instanceof Symbol.Profile p) {
                kind = "unknown profile";
                detail = Markup.Cell.text(p.unitInferred() ? "unit inferred" : "");
            } else if (s instanceof Symbol.UnknownConstant c) {
                kind = c.endOfInterval() ? "unknown constant (free surface)" : "unknown constant";
                detail = Markup.Cell.text(c.unitInferred() ? "unit inferred" : "");
            } else {
                continue;
            }
            rows.add(List.of(Markup.Cell.math(name(s.name())), Markup.Cell.text(kind),
                    Markup.Cell.of(new Markup.Inline.Unit(UnitCatalog.siName(s.dimension()))), detail));
        }
        m.table(List.of("symbol", "kind", "unit (SI)", "details"), rows);
        for (Stmt s : model.program().statements()) {
            if (s instanceof Stmt.Let l) {
                Expr lhs = l.params().isEmpty() ? new Expr.Name(l.name(), l.nameSpan())
                        : new Expr.Call(l.name(), l.nameSpan(), 0,
                        l.params().stream().<Expr>map(p -> new Expr.Name(p, dev.plumb.lang.Span.NONE)).toList(), l.span());
                m.equation(new Markup.Equation(null, "definition", lhs, "=", l.body(), null));
            }
        }
    }

    private void relations(Model model) {
        m.heading(2, "Relations and boundary conditions");
        for (Stmt.Relation r : model.relations()) {
            equation(r.label(), null, r.equation(), r.span(), false);
        }
        for (Stmt.Boundary b : model.boundaries()) {
            equation(b.label(), "boundary", b.equation(), b.span(), false);
        }
        if (!model.guesses().isEmpty()) {
            m.paragraph("First guesses given for the numeric solve (they change where the search starts, not the answer):");
            for (Stmt.Guess g : model.guesses()) m.equation(new Markup.Equation(null, "guess", g.target(), "\u2248", g.value(), null));
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
                    Markup.Cell.of(new Markup.Inline.Verdict(c.status())), factor(c.factor()),
                    new Markup.Cell(kind.equals("units") ? unitsMessage(c.message()) : runs(c.message()))));
        }
        m.table(List.of("label", "line", "verdict", "factor", "why"), rows);
    }

    /** A factor such as {@code 2}, {@code -1} or {@code pi}, typeset when it reads as a formula. */
    private Markup.Cell factor(String f) {
        if (f == null || f.isEmpty()) return Markup.Cell.text("");
        Expr e = dev.plumb.lang.Parser.parseExpression(f);
        return e != null ? Markup.Cell.math(e) : Markup.Cell.text(f);
    }

    /** "both sides in Pa/m (kg m^-2 s^-2)" with its units typeset; any other message as {@link #runs}. */
    private List<Markup.Inline> unitsMessage(String message) {
        java.util.regex.Matcher u = java.util.regex.Pattern.compile("both sides in ([^()\\[\\]]+?)(?: \\(([^()\\[\\]]+)\\))?").matcher(message);
        if (!u.matches() || !isUnit(u.group(1)) || u.group(2) != null && !isUnit(u.group(2))) return runs(message);
        List<Markup.Inline> out = new ArrayList<>(List.of(Markup.text("both sides in "), new Markup.Inline.Unit(u.group(1))));
        if (u.group(2) != null) out.addAll(List.of(Markup.text(" ("), new Markup.Inline.Unit(u.group(2)), Markup.text(")")));
        return out;
    }

    private static boolean isUnit(String text) {
        try {
            return text.equals("1") || dev.plumb.units.UnitParser.parse(text) != null;
        } catch (Exception e) {
            return false;
        }
    }

    private void equationsOf(String kind) {
        for (Stmt s : a.model().program().statements()) {
            if (kind.equals("step") && s instanceof Stmt.Step st) {
                equation(st.label(), null, st.equation(), st.span(), true);
            } else if (kind.equals("claim") && s instanceof Stmt.Claim c) {
                equation(c.label(), null, c.equation(), c.span(), true);
            }
        }
    }

    /**
     * A checked statement's equation with its verdict at it: the worst verdict of the checks on its
     * line (always for steps and claims, otherwise only when something does not hold), and, for one
     * that fails, the correct form plumb derived when a message of its names one for the same side.
     */
    private void equation(Stmt.Label label, String note, Stmt.Equation eq, dev.plumb.lang.Span span, boolean always) {
        List<Check> own = a.checks().stream().filter(c -> c.span().line() == span.line() && c.span().line() > 0).toList();
        Status worst = null;
        for (Check c : own) {
            if (worst == null || rank(c.status()) > rank(worst)) worst = c.status();
        }
        Markup.Mark mark = null;
        if (worst != null && (always || worst != Status.HOLDS)) {
            Expr correctRhs = null;
            Expr correctLhs = null;
            if (worst == Status.FAILS) {
                String side = dev.plumb.lang.ExprPrinter.print(eq.lhs());
                for (Check c : own) {
                    for (Markup.Inline i : runs(c.message())) {
                        if (correctRhs == null && i instanceof Markup.Inline.Math f && f.rhs() != null
                                && dev.plumb.lang.ExprPrinter.print(f.lhs()).equals(side)) {
                            correctLhs = f.lhs();
                            correctRhs = f.rhs();
                        }
                    }
                }
            }
            mark = new Markup.Mark(worst, correctLhs, correctRhs);
        }
        m.equation(new Markup.Equation(label.present() ? label.name() : null, label.present() ? null : note, eq.lhs(), "=", eq.rhs(), mark));
    }

    private static int rank(Status s) {
        return switch (s) {
            case HOLDS -> 0;
            case NOT_EVALUATED -> 1;
            case UNDECIDED -> 2;
            case FAILS -> 3;
        };
    }

    private static Expr name(String id) {
        return new Expr.Name(id, dev.plumb.lang.Span.NONE);
    }

    private void derived() {
        if (a.derived().isEmpty()) return;
        m.heading(2, "Closed forms");
        for (Analysis.DerivedForm d : a.derived()) {
            if (d.form() != null) {
                m.equation(null, parse(d.expr()), "=", d.form());
            } else {
                List<Markup.Inline> p = new ArrayList<>(runs(d.expr() + " = " + d.closedForm()));
                p.addAll(List.of(Markup.text(" in "), new Markup.Inline.Unit(d.unit())));
                m.paragraph(p);
            }
            if (!d.trail().isEmpty()) {
                m.bulletList(d.trail().stream().map(t -> trailEntry(t)).toList());
            }
        }
    }

    /**
     * One step of a trail, {@code action: LHS = RHS}, with the equation typeset: the result is an
     * equation printed by plumb, so it reads back whole (an integration constant included).
     */
    private List<Markup.Inline> trailEntry(Analysis.TrailEntry t) {
        int eq = t.result().indexOf(" = ");
        Expr lhs = eq < 0 ? null : dev.plumb.lang.Parser.parseExpression(t.result().substring(0, eq));
        Expr rhs = eq < 0 ? null : dev.plumb.lang.Parser.parseExpression(t.result().substring(eq + 3));
        List<Markup.Inline> out = new ArrayList<>(runs(t.action() + ": "));
        Expr whole = eq < 0 ? dev.plumb.lang.Parser.parseExpression(t.result()) : null;
        if (lhs != null && rhs != null) out.add(new Markup.Inline.Math(lhs, "=", rhs));
        else if (whole != null) out.add(Markup.Inline.Math.of(whole));
        else out.addAll(runs(t.result()));
        return out;
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
            rows.add(List.of(Markup.Cell.text(c.label()), Markup.Cell.of(new Markup.Inline.Verdict(c.status())),
                    exponents(c.extra().get("exponents")), exponents(c.extra().get("claimed")),
                    new Markup.Cell(runs(String.valueOf(c.extra().getOrDefault("dimensional_analysis", ""))))));
        }
        if (!rows.isEmpty()) m.table(List.of("label", "verdict", "exponents found", "claimed", "dimensional analysis"), rows);
        if (!a.scales().isEmpty()) m.bulletList(a.scales().stream().map(this::runs).toList());
    }

    /** Exponents by parameter, each as the parameter and its exponent ({@code G 1, M 2, R -4}). */
    private static Markup.Cell exponents(Object o) {
        if (!(o instanceof Map<?, ?> map)) return Markup.Cell.text("");
        List<Markup.Inline> out = new ArrayList<>();
        for (Map.Entry<?, ?> e : map.entrySet()) {
            if (!out.isEmpty()) out.add(Markup.text(", "));
            out.add(Markup.Inline.Math.of(name(String.valueOf(e.getKey()))));
            out.add(Markup.text(" "));
            // Exponents found by fitting are floating point (0.9999999999999938): three decimals say what they are.
            Object v = e.getValue();
            out.add(new Markup.Inline.Number(v instanceof Double d ? String.format(Locale.ROOT, "%.3f", d) : String.valueOf(v)));
        }
        return new Markup.Cell(out);
    }

    private void cases() throws IOException {
        if (a.cases().isEmpty()) return;
        m.heading(2, "Cases: closed form beside numeric");
        for (Analysis.CaseTable t : a.cases()) {
            m.heading(3, "Case " + t.label());
            if (t.method() != null) {
                List<Markup.Inline> p = new ArrayList<>(List.of(Markup.text("Numeric method: ")));
                p.addAll(runs(t.method() + "."));
                m.paragraph(p);
            }
            if (t.failure() != null) {
                List<Markup.Inline> p = new ArrayList<>(List.of(Markup.text("Not solved: ")));
                p.addAll(runs(t.failure()));
                m.paragraph(p);
                continue;
            }
            List<List<Markup.Cell>> rows = new ArrayList<>();
            for (Analysis.Row r : t.rows()) {
                double f = r.shownUnit() != null ? r.shownFactor() : 1.0;
                rows.add(List.of(Markup.Cell.math(parse(r.expr())), number(r.closedForm() == null ? null : fmt(r.closedForm() / f)),
                        number(r.numeric() == null ? null : fmt(r.numeric() / f)),
                        number(r.relDiff() == null ? null : String.format(Locale.ROOT, "%.1e", r.relDiff())),
                        Markup.Cell.of(new Markup.Inline.Unit(r.shownUnit() != null ? r.shownUnit() : r.unit())),
                        sensitivity(r), Markup.Cell.text(uncertainty(r))));
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
            m.heading(3, "Sweep " + spec.label());
            m.paragraph(List.of(Markup.Inline.Math.of(name(spec.param())), Markup.text(" from "), new Markup.Inline.Number(fmt(spec.values()[0] / pf)),
                    new Markup.Inline.Unit(r.paramUnit()), Markup.text(" to "), new Markup.Inline.Number(fmt(spec.values()[spec.size() - 1] / pf)),
                    new Markup.Inline.Unit(r.paramUnit()), Markup.text(String.format(Locale.ROOT, ", %d points spaced %s; %d solved. The data are in %s.",
                            spec.size(), spec.log() ? "evenly in the logarithm" : "evenly", r.solved(), SequenceData.fileName(r)))));
            List<String> header = new ArrayList<>();
            List<Markup.Cell> headerCells = new ArrayList<>();
            header.add(spec.param() + " [" + r.paramUnit() + "]");
            headerCells.add(headerCell(spec.param(), r.paramUnit()));
            for (var c : r.columns()) {
                String u = c.shownUnit() != null ? c.shownUnit() : c.unit();
                header.add(c.expr() + " [" + u + "]");
                headerCells.add(headerCell(c.expr(), u));
            }
            List<List<Markup.Cell>> rows = new ArrayList<>();
            for (var p : r.points()) {
                List<Markup.Cell> row = new ArrayList<>();
                row.add(number(fmt(p.value() / pf)));
                for (int k = 0; k < r.columns().size(); k++) {
                    double v = dev.plumb.numeric.Sequences.shown(r.columns().get(k), p.quantities()[k]);
                    row.add(p.failure() != null ? (k == 0 ? new Markup.Cell(runs("not solved: " + p.failure())) : Markup.Cell.text(""))
                            : number(Double.isFinite(v) ? fmt(v) : null));
                }
                rows.add(row);
            }
            m.tabulate(headerCells, rows);
            for (var x : r.extrema()) {
                var col = r.columns().stream().filter(c -> c.expr().equals(x.expr())).findFirst().orElseThrow();
                String shown = col.shownUnit() != null ? col.shownUnit() : col.unit();
                List<Markup.Inline> p = new ArrayList<>(List.of(Markup.text((x.max() ? "Maximum" : "Minimum") + " of "),
                        Markup.Inline.Math.of(parse(x.expr())), Markup.text(" over " + spec.label() + ": "),
                        new Markup.Inline.Number(fmt(dev.plumb.numeric.Sequences.shown(col, x.value()))), new Markup.Inline.Unit(shown),
                        Markup.text(" at "), Markup.Inline.Math.of(name(spec.param())), Markup.text(" = "), new Markup.Inline.Number(fmt(x.at() / pf)),
                        new Markup.Inline.Unit(r.paramUnit()), Markup.text(" (")));
                p.addAll(runs(x.how()));
                p.add(Markup.text(")."));
                m.paragraph(p);
            }
            Plot plot = FigureData.sweep(r);
            if (plot != null) {
                String xLabel = r.columns().size() >= 2 ? header.get(1) : header.get(0), yLabel = header.get(r.columns().size() >= 2 ? 2 : 1);
                m.figure("sweep-" + spec.label(), yLabel + " against " + xLabel + " along sweep " + spec.label() + ".", plot, files);
            }
            files.put(SequenceData.fileName(r), SequenceData.csv(r));
        }
    }

    /** A number as a cell, or a dash when there is none. */
    private static Markup.Cell number(String text) {
        return text == null ? Markup.Cell.text("\u2014") : Markup.Cell.of(new Markup.Inline.Number(text));
    }

    /** A column heading: the quantity typeset, and its unit in brackets. */
    private static Markup.Cell headerCell(String quantity, String unit) {
        if (unit.equals("1")) return Markup.Cell.math(parse(quantity));
        return Markup.Cell.of(Markup.Inline.Math.of(parse(quantity)), Markup.text(" ["), new Markup.Inline.Unit(unit), Markup.text("]"));
    }

    private static Markup.Cell sensitivity(Analysis.Row r) {
        Map<Object, Object> rounded = new LinkedHashMap<>();
        r.sensitivities().forEach((k, v) -> rounded.put(k, String.format(Locale.ROOT, "%.4f", Math.abs(v) < 5e-9 ? 0.0 : v)));
        return exponents(rounded);
    }

    private static String uncertainty(Analysis.Row r) {
        if (r.uncertainty() == null || r.numeric() == null) return "";
        double v = Math.abs(r.numeric());
        return String.format(Locale.ROOT, "±%.3g%% (first order), ±%.3g%% (Monte Carlo, %d samples)",
                100 * r.uncertainty().firstOrder() / v, 100 * r.uncertainty().monteCarlo() / v, r.uncertainty().samples());
    }

    private void sources(Model model) {
        List<List<Markup.Inline>> items = new ArrayList<>();
        for (Symbol.Builtin b : model.symbols(Symbol.Builtin.class)) {
            items.add(List.of(Markup.Inline.Math.of(name(b.name())), Markup.text(" = "), new Markup.Inline.Number(fmt(b.constant().value())),
                    new Markup.Inline.Unit(UnitCatalog.siName(b.dimension())), Markup.text(" \u2014 " + b.constant().description() + "; "
                            + b.constant().source())));
        }
        if (items.isEmpty()) return;
        m.heading(2, "Constants and their sources");
        m.bulletList(items);
    }

    private static String fmt(double v) {
        return String.format(Locale.ROOT, "%.6g", v);
    }
}
