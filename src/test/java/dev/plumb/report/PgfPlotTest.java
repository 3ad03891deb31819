package dev.plumb.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Plots for LaTeX: pgfplots over CSV data beside the document, compiled by pdflatex to check them. */
class PgfPlotTest {

    /** Central density against mass along an invented sequence of dwarfs, spaced evenly in the logarithm. */
    static Plot sequence() {
        int n = 30;
        double[] rho = new double[n], mass = new double[n];
        for (int i = 0; i < n; i++) {
            rho[i] = Math.pow(10, 9 + 6.0 * i / (n - 1));
            mass[i] = 1.4 * (1 - Math.exp(-rho[i] / 1e11));
        }
        return new Plot(new Plot.Axis("rho_c", "kg/m^3"), new Plot.Axis("m(R)", "Msun"),
                List.of(new Plot.Series(Plot.Kind.NUMERIC, rho, mass)));
    }

    @Test
    void theDataFileHoldsTheCurvesAndTheResidualInTheAxesUnits() throws Exception {
        Plot plot = SvgPlotTest.sphere();
        PgfPlot.Picture p = PgfPlot.of("sphere", plot);
        assertEquals("sphere-plotdata.csv", p.dataFile());
        CSVFormat format = CSVFormat.RFC4180.builder().setCommentMarker('#').setHeader().setSkipHeaderRecord(true).build();
        try (CSVParser csv = CSVParser.parse(new StringReader(new String(p.data(), StandardCharsets.UTF_8)), format)) {
            assertEquals(List.of("x", "numeric", "closed_form", "residual"), csv.getHeaderNames());
            List<CSVRecord> rows = csv.getRecords();
            double[] x = plot.series(Plot.Kind.NUMERIC).x(), y = plot.series(Plot.Kind.NUMERIC).y(), r = plot.residual();
            assertEquals(x.length, rows.size());
            for (int i = 0; i < x.length; i++) {
                assertEquals(x[i], Double.parseDouble(rows.get(i).get("x")), 1e-9 * 6371);
                assertEquals(y[i], Double.parseDouble(rows.get(i).get("numeric")), 1e-9 * 172.46);
                assertEquals(r[i], Double.parseDouble(rows.get(i).get("residual")), 1e-9 * 1e-13);
            }
        }
        // The hand-computed ticks of SvgPlotTest, as pgfplots keys: the document sets them, pgfplots does not choose.
        assertTrue(p.tikz().contains("xtick={0,2000,4000,6000}"), p.tikz());
        assertTrue(p.tikz().contains("ytick={0,50,100,150,200}"), p.tikz());
        assertTrue(p.tikz().contains("\\addlegendentry{numeric solution}") && p.tikz().contains("\\addlegendentry{closed form}"));
        assertTrue(p.tikz().contains("dash pattern"), "the closed form is dashed");
        assertTrue(p.tikz().contains("groupplot"), "a residual panel beneath");
    }

    @Test
    void numbersAreWrittenSoThatTheyReadBackAsTheSameDouble() {
        assertEquals("0", PgfPlot.tex(0));
        assertEquals("2000", PgfPlot.tex(2000));
        assertEquals("0.25", PgfPlot.tex(0.25));
        assertEquals("8e23", PgfPlot.tex(8e23));
        assertEquals("-1.5e-13", PgfPlot.tex(-1.5e-13));
        assertEquals("0.474697889721467", PgfPlot.tex(0.474697889721467));
        assertEquals("4.74697889721467e8", PgfPlot.tex(4.74697889721467e8));
        for (double v : new double[] {6.957e8, 1.3446551700e5, -4e-13, 1e17, 0.0012345}) {
            assertEquals(v, Double.parseDouble(PgfPlot.tex(v)), 0, () -> PgfPlot.tex(v));
        }
    }

    @Test
    void figuresCompileWithPdflatexAndKeepTheirTextAsTextInEmbeddedFonts(@TempDir Path dir) throws Exception {
        var pdflatex = ExternalTool.find("pdflatex");
        Assumptions.assumeTrue(pdflatex.isPresent(), "pdflatex is not installed (CI installs TeX Live from Debian's packages); skipped");
        LatexMarkup tex = new LatexMarkup();
        Map<String, byte[]> files = new LinkedHashMap<>();
        tex.heading(1, "Plots (test document)");
        tex.figure("sphere", "Pressure against radius, invented test data.", SvgPlotTest.sphere(), files);
        tex.figure("sequence", "Mass against central density along an invented sequence.", sequence(), files);
        Files.writeString(dir.resolve("plots.tex"), tex.finish());
        for (var f : files.entrySet()) Files.write(dir.resolve(f.getKey()), f.getValue());
        String log = "";
        for (int pass = 0; pass < 2; pass++) {
            var r = pdflatex.get().run(dir, List.of("-halt-on-error", "-interaction=nonstopmode", "plots.tex"));
            log = Files.readString(dir.resolve("plots.log"), StandardCharsets.ISO_8859_1);
            assertEquals(0, r.status(), () -> r.out());
        }
        assertFalse(log.contains("! "), log);
        Matcher overfull = Pattern.compile("Overfull \\\\[hv]box \\(([0-9.]+)pt too (wide|high)").matcher(log);
        while (overfull.find()) assertTrue(Double.parseDouble(overfull.group(1)) <= 5, overfull.group());
        var pdftotext = ExternalTool.find("pdftotext");
        var pdffonts = ExternalTool.find("pdffonts");
        Assumptions.assumeTrue(pdftotext.isPresent() && pdffonts.isPresent(), "poppler-utils are not installed; text checks skipped");
        String text = pdftotext.get().run(dir, List.of("-layout", "plots.pdf", "-")).out();
        for (String word : List.of("numeric solution", "closed form", "rel. diff.", "2000", "6000", "150", "GPa", "km")) {
            assertTrue(text.contains(word), word + " is text in the PDF:\n" + text);
        }
        String fonts = pdffonts.get().run(dir, List.of("plots.pdf")).out();
        List<String> rows = fonts.lines().skip(2).toList();
        assertFalse(rows.isEmpty(), fonts);
        // pdffonts columns: name, type, encoding, emb, sub, uni, object ID; every font embedded.
        for (String row : rows) assertTrue(row.matches(".*\\s+yes\\s+(yes|no)\\s+(yes|no)\\s+\\d+\\s+\\d+\\s*"), "not embedded: " + row);
    }
}
