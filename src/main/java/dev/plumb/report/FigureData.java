package dev.plumb.report;

import dev.plumb.lang.Expr;
import dev.plumb.lang.Stmt;
import dev.plumb.model.Model;
import dev.plumb.numeric.Sequences;
import dev.plumb.units.UnitException;
import dev.plumb.units.UnitParser;
import java.util.ArrayList;
import java.util.List;

/**
 * The figures of a report as data in the file's own units: a profile in the unit its {@code show}
 * asks for (else the unit it was declared in) against the coordinate in the unit the coordinate was
 * declared in; a sweep's second shown quantity against its first, each in its shown unit.
 */
final class FigureData {
    private FigureData() {
    }

    /** A unit as written and the SI value of one of it. */
    private record Written(String text, double factor) { }

    /** A sampled profile (SI) as a plot in the file's units. */
    static Plot profile(Model model, Analysis.ProfileSample p) {
        Written xu = coordinateUnit(model, p);
        Written yu = profileUnit(model, p);
        double[] x = scaled(p.x(), xu.factor());
        List<Plot.Series> series = new ArrayList<>();
        series.add(new Plot.Series(Plot.Kind.NUMERIC, x, scaled(p.numeric(), yu.factor())));
        if (p.closedForm() != null) series.add(new Plot.Series(Plot.Kind.CLOSED_FORM, x, scaled(p.closedForm(), yu.factor())));
        return new Plot(new Plot.Axis(p.coordinate(), xu.text()), new Plot.Axis(p.profile(), yu.text()), series);
    }

    /** The caption of a profile figure: what is drawn, and how to tell the curves apart. */
    static String profileCaption(Analysis.ProfileSample p, String caseLabel, Plot plot) {
        String what = p.profile() + "(" + p.coordinate() + ") for case " + caseLabel;
        if (plot.series(Plot.Kind.CLOSED_FORM) == null) return what + ": numeric solution.";
        return what + ": numeric solution (solid) and closed form (dashed); beneath, their difference divided by the largest "
                + "value of the closed form.";
    }

    /**
     * A sweep's plot: the second shown quantity against the first, or the only one against the swept
     * parameter; null when fewer than two points have both values.
     */
    static Plot sweep(Sequences.Result r) {
        if (r.columns().isEmpty()) return null;
        var spec = r.spec();
        double pf = spec.unit() != null ? spec.factor() : 1.0;
        boolean pair = r.columns().size() >= 2;
        Sequences.Column yc = r.columns().get(pair ? 1 : 0);
        int n = r.points().size(), used = 0;
        double[] x = new double[n], y = new double[n];
        for (Sequences.Point p : r.points()) {
            if (p.failure() != null) continue;
            double xv = pair ? Sequences.shown(r.columns().get(0), p.quantities()[0]) : p.value() / pf;
            double yv = Sequences.shown(yc, p.quantities()[pair ? 1 : 0]);
            if (!Double.isFinite(xv) || !Double.isFinite(yv)) continue;
            x[used] = xv;
            y[used++] = yv;
        }
        if (used < 2) return null;
        Plot.Axis xAxis = pair ? new Plot.Axis(r.columns().get(0).expr(), shownUnit(r.columns().get(0)))
                : new Plot.Axis(spec.param(), r.paramUnit());
        Plot.Axis yAxis = new Plot.Axis(yc.expr(), shownUnit(yc));
        return new Plot(xAxis, yAxis, List.of(new Plot.Series(Plot.Kind.NUMERIC, java.util.Arrays.copyOf(x, used),
                java.util.Arrays.copyOf(y, used))));
    }

    private static String shownUnit(Sequences.Column c) {
        return c.shownUnit() != null ? c.shownUnit() : c.unit();
    }

    /** The unit of the {@code coord} statement, when it names one that reads; else SI. */
    private static Written coordinateUnit(Model model, Analysis.ProfileSample p) {
        for (Stmt s : model.program().statements()) {
            if (s instanceof Stmt.Coord c && c.name().equals(p.coordinate()) && c.unit() != null) {
                Written w = read(c.unit().text());
                if (w != null) return w;
            }
        }
        return new Written(p.coordinateUnit(), 1.0);
    }

    /**
     * The unit the file shows the profile in (its first {@code show} of a value of the profile that
     * names a unit), else the unit of its {@code unknown} declaration, else SI.
     */
    private static Written profileUnit(Model model, Analysis.ProfileSample p) {
        for (Stmt.Show s : model.shows()) {
            if (s.unit() != null && s.expr() instanceof Expr.Call c && c.callee().equals(p.profile()) && c.order() == 0) {
                Written w = read(s.unit().text());
                if (w != null) return w;
            }
        }
        for (Stmt s : model.program().statements()) {
            if (s instanceof Stmt.Unknown u && u.name().equals(p.profile()) && u.unit() != null) {
                Written w = read(u.unit().text());
                if (w != null) return w;
            }
        }
        return new Written(p.unit(), 1.0);
    }

    private static Written read(String text) {
        try {
            return new Written(text.trim(), UnitParser.parse(text).factor());
        } catch (UnitException | RuntimeException e) {
            // A unit that does not read was reported where it was written; the plot falls back to SI.
            return null;
        }
    }

    private static double[] scaled(double[] si, double factor) {
        double[] out = new double[si.length];
        for (int i = 0; i < si.length; i++) out[i] = si[i] / factor;
        return out;
    }
}
