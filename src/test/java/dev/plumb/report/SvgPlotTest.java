package dev.plumb.report;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumb.cli.Main;
import java.io.ByteArrayInputStream;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import javax.xml.parsers.DocumentBuilderFactory;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.w3c.dom.Document;
import org.w3c.dom.Element;
import org.w3c.dom.NodeList;

/** Plots as SVG written by hand: real text, round ticks, the file's units, and the same bytes every run. */
class SvgPlotTest {

    /** Uniform sphere of the Earth's mass and radius, its radius in km; P(0) = 3GM²/(8πR⁴). */
    static final String EARTH_IN_KM = """
            title "Uniform sphere in kilometres (invented check file)"
            param M [kg] > 0
            param R [km] > 0
            coord r [km] from 0 to R
            let rho = M / (4/3*pi*R^3)
            let m(r) = 4/3*pi*r^3*rho
            unknown P(r) [Pa]
            relation balance: P'(r) = -G*m(r)*rho/r^2
            boundary surface: P(R) = 0
            case earth: M = 5.972e24 [kg], R = 6371 [km]
            show P(0) in [GPa]
            """;

    /** P = P0 (1 − (r/R)²) in GPa against r in km, the closed form a part in 10^13 above the numeric curve. */
    static Plot sphere() {
        int n = 41;
        double[] r = new double[n], numeric = new double[n], closed = new double[n];
        for (int i = 0; i < n; i++) {
            r[i] = 6371.0 * i / (n - 1);
            numeric[i] = 172.46 * (1 - Math.pow(r[i] / 6371.0, 2));
            closed[i] = numeric[i] * (1 + 1e-13);
        }
        return new Plot(new Plot.Axis("r", "km"), new Plot.Axis("P", "GPa"),
                List.of(new Plot.Series(Plot.Kind.NUMERIC, r, numeric), new Plot.Series(Plot.Kind.CLOSED_FORM, r, closed)));
    }

    static Document parse(String svg) throws Exception {
        return DocumentBuilderFactory.newInstance().newDocumentBuilder()
                .parse(new ByteArrayInputStream(svg.getBytes(StandardCharsets.UTF_8)));
    }

    static List<String> texts(Document d) {
        NodeList nodes = d.getElementsByTagName("text");
        List<String> out = new ArrayList<>();
        for (int i = 0; i < nodes.getLength(); i++) out.add(nodes.item(i).getTextContent());
        return out;
    }

    @Test
    void labelsAreTextElementsAtRoundValuesInTheAxesUnits() throws Exception {
        String svg = SvgPlot.file(sphere());
        Document d = parse(svg);
        List<String> texts = texts(d);
        // x: 0 .. 6371 km, range → 10000, 10000/5 = 2000 → 2000: 0, 2000, 4000, 6000 (worked by hand).
        // y: 0 .. 172.46 GPa, range → 200, 200/5 = 40 → 50, loose: 0, 50, 100, 150, 200.
        for (String label : List.of("0", "2000", "4000", "6000", "50", "100", "150", "200")) {
            assertTrue(texts.contains(label), label + " in " + texts);
        }
        assertTrue(texts.contains("r [km]"), texts.toString());
        assertTrue(texts.contains("P [GPa]"), texts.toString());
        assertTrue(texts.contains("numeric solution") && texts.contains("closed form"), "a legend names both curves: " + texts);
        assertTrue(texts.contains(Plot.RESIDUAL_TITLE), "the residual panel has its title: " + texts);
        assertFalse(svg.contains("<path"), "no text drawn as outlines");
        assertFalse(svg.contains(" id="), "no ids: nothing that could differ between runs or clash inside one page");
        assertFalse(svg.contains("<title"), "no title inside the image; the caption carries it");
        assertTrue(svg.length() < 20_000, "a plot of 41 points is a few kilobytes, not hundreds: " + svg.length());
    }

    @Test
    void theTwoCurvesDifferInColourAndDashAndTheResidualIsTheirScaledDifference() throws Exception {
        Document d = parse(SvgPlot.element(sphere()));
        NodeList lines = d.getElementsByTagName("polyline");
        assertEquals(3, lines.getLength(), "numeric, closed form, residual");
        Element numeric = (Element) lines.item(0), closed = (Element) lines.item(1);
        assertNotEquals(numeric.getAttribute("stroke"), closed.getAttribute("stroke"));
        assertEquals("", numeric.getAttribute("stroke-dasharray"));
        assertFalse(closed.getAttribute("stroke-dasharray").isEmpty());
        double[] residual = sphere().residual();
        // (numeric − closed)/max|closed| = −1e-13 · numeric/closed(0): about −1e-13 at the centre, 0 at the surface.
        assertEquals(-1e-13, residual[0], 1e-15);
        assertEquals(0, residual[residual.length - 1], 1e-15);
        assertNull(new Plot(sphere().x(), sphere().y(), List.of(sphere().series(Plot.Kind.NUMERIC))).residual());
    }

    @Test
    void theSameDataGiveTheSameBytes() {
        assertEquals(SvgPlot.file(sphere()), SvgPlot.file(sphere()));
    }

    static int report(Path file, Path out, String format) {
        return Main.run(new String[] {"report", file.toString(), "--format", format, "--out", out.toString()},
                new PrintWriter(new StringWriter()), new PrintWriter(new StringWriter()));
    }

    @Test
    void aReportPlotsTheProfileInTheShownUnitAgainstTheCoordinateInItsDeclaredUnitTheSameEveryRun(@TempDir Path dir)
            throws Exception {
        Path file = Files.writeString(dir.resolve("earth-km.plumb"), EARTH_IN_KM);
        assertEquals(0, report(file, dir.resolve("one"), "md,html"));
        assertEquals(0, report(file, dir.resolve("two"), "md"));
        List<Path> svgs;
        try (Stream<Path> s = Files.list(dir.resolve("one"))) {
            svgs = s.filter(p -> p.toString().endsWith(".svg")).sorted().toList();
        }
        assertEquals(1, svgs.size(), svgs.toString());
        for (Path svg : svgs) {
            assertArrayEquals(Files.readAllBytes(svg), Files.readAllBytes(dir.resolve("two").resolve(svg.getFileName())),
                    svg.getFileName() + " differs between two runs");
        }
        String svg = Files.readString(svgs.get(0));
        List<String> texts = texts(parse(svg));
        // P(0) = 3 G M²/(8 π R⁴) = 172.46 GPa with CODATA 2018 G: the axis runs to 200 GPa in steps of 50,
        // the radius to 6371 km with ticks every 2000 km (no power of ten in either title).
        assertTrue(texts.contains("r [km]") && texts.contains("P [GPa]"), texts.toString());
        assertTrue(texts.containsAll(List.of("2000", "6000", "150", "200")), texts.toString());
        String html = Files.readString(dir.resolve("one").resolve("earth-km.html"));
        assertTrue(html.contains(svg.substring(svg.indexOf("<svg"))), "the page inlines the same drawing");
    }
}
