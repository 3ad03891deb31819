package dev.plumb.report;

import dev.plumb.lang.Diagnostic;
import dev.plumb.model.Check;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/** The machine-readable form of an analysis, with the field names of the design brief. */
public final class JsonReport {
    private JsonReport() {
    }

    public static Map<String, Object> toMap(Analysis a, boolean strict) {
        Map<String, Object> root = new LinkedHashMap<>();
        root.put("file", a.source().path());
        if (a.model() != null) root.put("title", a.model().title());
        root.put("ok", a.ok(strict));
        root.put("exit_status", a.exitStatus(strict));
        List<Object> diags = new ArrayList<>();
        for (Diagnostic d : a.diagnostics()) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("severity", d.severity().word());
            m.put("line", d.span().line());
            m.put("column", d.span().column());
            m.put("end_line", d.span().endLine());
            m.put("end_column", d.span().endColumn());
            m.put("message", d.message());
            if (!d.details().isEmpty()) m.put("details", d.details());
            diags.add(m);
        }
        root.put("diagnostics", diags);
        List<Object> checks = new ArrayList<>();
        for (Check c : a.checks()) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("kind", c.kind());
            m.put("label", c.label());
            m.put("line", c.span().line());
            m.put("column", c.span().column());
            m.put("status", c.status().word().replace(' ', '_'));
            m.put("message", c.message());
            if (c.factor() != null) m.put("factor", c.factor());
            m.putAll(c.extra());
            checks.add(m);
        }
        root.put("checks", checks);
        List<Object> derived = new ArrayList<>();
        for (Analysis.DerivedForm d : a.derived()) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("expr", d.expr());
            m.put("closed_form", d.closedForm());
            m.put("unit", d.unit());
            List<Object> trail = new ArrayList<>();
            for (Analysis.TrailEntry t : d.trail()) {
                Map<String, Object> step = new LinkedHashMap<>();
                step.put("action", t.action());
                step.put("result", t.result());
                trail.add(step);
            }
            if (!trail.isEmpty()) m.put("trail", trail);
            derived.add(m);
        }
        root.put("derived", derived);
        List<Object> cases = new ArrayList<>();
        for (Analysis.CaseTable t : a.cases()) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("label", t.label());
            if (t.method() != null) m.put("method", t.method());
            if (t.failure() != null) m.put("failure", t.failure());
            List<Object> rows = new ArrayList<>();
            for (Analysis.Row r : t.rows()) {
                Map<String, Object> q = new LinkedHashMap<>();
                q.put("expr", r.expr());
                q.put("unit", r.unit());
                q.put("closed_form", r.closedForm());
                q.put("numeric", r.numeric());
                q.put("rel_diff", r.relDiff());
                q.put("error_estimate", r.errorEstimate());
                if (!r.sensitivities().isEmpty()) q.put("sensitivities", r.sensitivities());
                if (r.uncertainty() != null) {
                    Map<String, Object> u = new LinkedHashMap<>();
                    u.put("first_order", r.uncertainty().firstOrder());
                    u.put("monte_carlo", r.uncertainty().monteCarlo());
                    u.put("monte_carlo_sampling_error", r.uncertainty().samplingError());
                    u.put("samples", r.uncertainty().samples());
                    u.put("seed", r.uncertainty().seed());
                    q.put("uncertainty", u);
                }
                if (r.shownUnit() != null) {
                    q.put("shown_unit", r.shownUnit());
                    q.put("shown_value", r.numeric() == null ? null : r.numeric() / r.shownFactor());
                }
                rows.add(q);
            }
            m.put("quantities", rows);
            if (!t.profiles().isEmpty()) m.put("profiles", t.profiles().stream().map(JsonReport::profile).toList());
            cases.add(m);
        }
        root.put("cases", cases);
        if (!a.sweeps().isEmpty()) root.put("sweeps", a.sweeps().stream().map(dev.plumb.numeric.Sequences::toMap).toList());
        if (!a.scales().isEmpty()) root.put("scales", a.scales());
        if (!a.notes().isEmpty()) root.put("notes", a.notes());
        return root;
    }

    /**
     * A sampled profile: the coordinate's values and the profile's numeric values (and closed-form
     * values, null when none was derived) at them, all in the SI units named beside.
     */
    private static Map<String, Object> profile(Analysis.ProfileSample p) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("profile", p.profile());
        m.put("unit", p.unit());
        m.put("coordinate", p.coordinate());
        m.put("coordinate_unit", p.coordinateUnit());
        m.put("coordinate_values", p.x());
        m.put("numeric", p.numeric());
        m.put("closed_form", p.closedForm());
        return m;
    }
}
