package dev.plumb.report;

import dev.plumb.numeric.Sequences;
import java.io.IOException;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;

/**
 * A sequence as data: one row per point, the swept parameter and every quantity, each in the unit the
 * file wrote or showed it in (named in the header, twelve significant digits), with the SI value beside
 * (every digit of the double); a point that did not solve has empty cells and its reason in the last column.
 */
public final class SequenceData {

    private SequenceData() {
    }

    /** The CSV file's name for a sequence. */
    public static String fileName(Sequences.Result r) {
        return "sweep-" + r.spec().label().replaceAll("[^A-Za-z0-9_.-]", "_") + ".csv";
    }

    public static byte[] csv(Sequences.Result r) throws IOException {
        double pf = r.spec().unit() != null ? r.spec().factor() : 1.0;
        List<String> header = new ArrayList<>();
        header.add(r.spec().param() + " [" + r.paramUnit() + "]");
        for (Sequences.Column c : r.columns()) {
            String shown = c.shownUnit() != null ? c.shownUnit() : c.unit();
            header.add(c.expr() + " [" + shown + "]");
            if (c.shownUnit() != null) header.add(c.expr() + " [" + c.unit() + "] (SI)");
        }
        header.add("failure");
        StringWriter out = new StringWriter();
        try (CSVPrinter csv = new CSVPrinter(out, CSVFormat.RFC4180.builder().setHeader(header.toArray(String[]::new)).build())) {
            for (Sequences.Point p : r.points()) {
                List<String> row = new ArrayList<>();
                row.add(num(p.value() / pf));
                for (int k = 0; k < r.columns().size(); k++) {
                    Sequences.Column c = r.columns().get(k);
                    double v = p.failure() == null ? p.quantities()[k] : Double.NaN;
                    row.add(num(Sequences.shown(c, v)));
                    if (c.shownUnit() != null) row.add(CaseData.exact(v));
                }
                row.add(p.failure() == null ? "" : p.failure());
                csv.printRecord(row);
            }
        }
        return out.toString().getBytes(StandardCharsets.UTF_8);
    }

    private static String num(double v) {
        return CaseData.twelve(v);
    }
}
