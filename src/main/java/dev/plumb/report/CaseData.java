package dev.plumb.report;

import dev.plumb.lang.Expr;
import dev.plumb.lang.Stmt;
import dev.plumb.model.Model;
import dev.plumb.units.UnitCatalog;
import dev.plumb.units.UnitException;
import dev.plumb.units.UnitParser;
import java.io.IOException;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;

/**
 * A case as data: its comparison table, one row per quantity, and each sampled profile, one row per
 * point of the coordinate. Values are in the unit the file shows or declares them in (named in the
 * header or in a unit column) with the SI value beside; shown values carry twelve significant digits,
 * SI values every digit of the double (they read back to the numbers of the JSON). Cells with no value
 * are empty.
 */
public final class CaseData {

    private CaseData() {
    }

    /** A unit to show values in: its name as the file wrote it and the SI value of one of it. */
    public record ShownUnit(String name, double factor, String si) {
        /** Whether a column in SI is needed beside this one. */
        public boolean differsFromSi() {
            return factor != 1.0 || !name.equals(si);
        }

        double shown(double siValue) {
            return siValue / factor;
        }
    }

    /** The CSV file's name for a case's table. */
    public static String tableFileName(Analysis.CaseTable t) {
        return "case-" + safe(t.label()) + ".csv";
    }

    /** The CSV file's name for a profile of a case. */
    public static String profileFileName(Analysis.CaseTable t, Analysis.ProfileSample p) {
        return "profile-" + safe(t.label()) + "-" + safe(p.profile()) + ".csv";
    }

    /**
     * The comparison table: the quantity, the unit it is shown in and its closed-form value, numeric value,
     * relative difference and error estimate in that unit; then the same in SI; then ∂ln Q/∂ln p for each
     * free parameter; then the propagated uncertainties in the shown unit, when a case value carries one.
     */
    public static byte[] table(Analysis.CaseTable t) throws IOException {
        Set<String> params = new LinkedHashSet<>();
        t.rows().forEach(r -> params.addAll(r.sensitivities().keySet()));
        boolean uncertain = t.rows().stream().anyMatch(r -> r.uncertainty() != null);
        List<String> header = new ArrayList<>(List.of("quantity", "unit", "closed form", "numeric", "relative difference",
                "error estimate", "SI unit", "closed form (SI)", "numeric (SI)", "error estimate (SI)"));
        params.forEach(p -> header.add("d ln Q/d ln " + p));
        if (uncertain) {
            header.addAll(List.of("uncertainty, first order", "uncertainty, Monte Carlo", "Monte Carlo sampling error",
                    "Monte Carlo samples"));
        }
        StringWriter out = new StringWriter();
        try (CSVPrinter csv = new CSVPrinter(out, format(header))) {
            for (Analysis.Row r : t.rows()) {
                double f = r.shownUnit() != null ? r.shownFactor() : 1.0;
                List<String> row = new ArrayList<>();
                row.add(r.expr());
                row.add(r.shownUnit() != null ? r.shownUnit() : r.unit());
                row.add(shown(r.closedForm(), f));
                row.add(shown(r.numeric(), f));
                row.add(r.relDiff() == null ? "" : exact(r.relDiff()));
                row.add(shown(r.errorEstimate(), f));
                row.add(r.unit());
                row.add(r.closedForm() == null ? "" : exact(r.closedForm()));
                row.add(r.numeric() == null ? "" : exact(r.numeric()));
                row.add(r.errorEstimate() == null ? "" : exact(r.errorEstimate()));
                for (String p : params) {
                    Double s = r.sensitivities().get(p);
                    row.add(s == null ? "" : exact(s));
                }
                if (uncertain) {
                    Analysis.Uncertainty u = r.uncertainty();
                    row.add(u == null ? "" : shown(u.firstOrder(), f));
                    row.add(u == null ? "" : shown(u.monteCarlo(), f));
                    row.add(u == null ? "" : shown(u.samplingError(), f));
                    row.add(u == null ? "" : Integer.toString(u.samples()));
                }
                csv.printRecord(row);
            }
        }
        return out.toString().getBytes(StandardCharsets.UTF_8);
    }

    /**
     * A profile's samples: the coordinate, the numeric profile and (when one was derived) its closed
     * form, each in the unit of {@link #coordinateUnit} and {@link #profileUnit}, with SI beside when
     * that unit is not SI.
     */
    public static byte[] profile(Model model, Analysis.ProfileSample p) throws IOException {
        ShownUnit xu = coordinateUnit(model, p);
        ShownUnit yu = profileUnit(model, p);
        List<String> header = new ArrayList<>();
        header.add(p.coordinate() + " [" + xu.name() + "]");
        if (xu.differsFromSi()) header.add(p.coordinate() + " [" + xu.si() + "] (SI)");
        String name = p.profile() + "(" + p.coordinate() + ")";
        header.add(name + " numeric [" + yu.name() + "]");
        if (yu.differsFromSi()) header.add(name + " numeric [" + yu.si() + "] (SI)");
        if (p.closedForm() != null) {
            header.add(name + " closed form [" + yu.name() + "]");
            if (yu.differsFromSi()) header.add(name + " closed form [" + yu.si() + "] (SI)");
        }
        StringWriter out = new StringWriter();
        try (CSVPrinter csv = new CSVPrinter(out, format(header))) {
            for (int i = 0; i < p.x().length; i++) {
                List<String> row = new ArrayList<>();
                addBoth(row, p.x()[i], xu);
                addBoth(row, p.numeric()[i], yu);
                if (p.closedForm() != null) addBoth(row, p.closedForm()[i], yu);
                csv.printRecord(row);
            }
        }
        return out.toString().getBytes(StandardCharsets.UTF_8);
    }

    /** The coordinate's unit as declared ({@code coord r [km] ...}), else SI. */
    public static ShownUnit coordinateUnit(Model model, Analysis.ProfileSample p) {
        for (Stmt s : model.program().statements()) {
            if (s instanceof Stmt.Coord c && c.name().equals(p.coordinate()) && c.unit() != null) {
                return unit(c.unit().text(), p.coordinateUnit());
            }
        }
        return unit(null, p.coordinateUnit());
    }

    /**
     * The unit a profile is shown in: that of the first {@code show} of a value of it
     * ({@code show P(0) in [GPa]}), else the unit it was declared in ({@code unknown P(r) [Pa]}), else SI.
     */
    public static ShownUnit profileUnit(Model model, Analysis.ProfileSample p) {
        for (Stmt.Show s : model.shows()) {
            if (s.unit() != null && s.expr() instanceof Expr.Call c && c.callee().equals(p.profile()) && c.order() == 0) {
                ShownUnit u = unit(s.unit().text(), p.unit());
                if (u != null) return u;
            }
        }
        for (Stmt s : model.program().statements()) {
            if (s instanceof Stmt.Unknown u && u.name().equals(p.profile()) && u.unit() != null) {
                return unit(u.unit().text(), p.unit());
            }
        }
        return unit(null, p.unit());
    }

    /** The named unit when it reads as a unit of the SI one's dimension, else the SI unit itself. */
    private static ShownUnit unit(String text, String si) {
        if (text != null) {
            try {
                var u = UnitParser.parse(text);
                if (u.dimension().equals(UnitParser.parse(si).dimension())) return new ShownUnit(text.strip(), u.factor(), si);
            } catch (UnitException unreadable) {
                // The checker has already reported it at its place; the data fall back to SI.
            }
        }
        return new ShownUnit(si, 1.0, si);
    }

    private static void addBoth(List<String> row, double si, ShownUnit u) {
        row.add(Double.isFinite(si) ? twelve(u.shown(si)) : "");
        if (u.differsFromSi()) row.add(Double.isFinite(si) ? exact(si) : "");
    }

    private static CSVFormat format(List<String> header) {
        return CSVFormat.RFC4180.builder().setHeader(header.toArray(String[]::new)).build();
    }

    private static String shown(Double si, double factor) {
        return si == null || !Double.isFinite(si) ? "" : twelve(si / factor);
    }

    /** Twelve significant digits, without trailing zeros after the point ({@code 5797500}, not {@code 5797500.00000}). */
    static String twelve(double v) {
        if (!Double.isFinite(v)) return "";
        String s = String.format(Locale.ROOT, "%.12g", v);
        int e = s.indexOf('e');
        String mantissa = e < 0 ? s : s.substring(0, e);
        if (mantissa.contains(".")) mantissa = mantissa.replaceAll("0+$", "").replaceAll("\\.$", "");
        return e < 0 ? mantissa : mantissa + s.substring(e);
    }

    /** Every digit of the double: {@code Double.parseDouble} gives back the same value. */
    static String exact(double v) {
        return Double.isFinite(v) ? Double.toString(v) : "";
    }

    /** A label or name as part of a file name: letters (any script), digits, '_', '.' and '-' are kept. */
    static String safe(String name) {
        return name.isEmpty() ? "_" : name.replaceAll("[^\\p{L}\\p{N}_.-]", "_");
    }
}
