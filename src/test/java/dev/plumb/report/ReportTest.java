package dev.plumb.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumb.cli.Main;
import java.io.ByteArrayInputStream;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import javax.xml.parsers.DocumentBuilderFactory;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.w3c.dom.Document;

class ReportTest {

    static int run(String... args) {
        return Main.run(args, new PrintWriter(new StringWriter()), new PrintWriter(new StringWriter()));
    }

    @Test
    void everyFormatIsWrittenAndTheHtmlIsWellFormedWithMathML(@TempDir Path out) throws Exception {
        int status = run("report", "derivations/uniform-sphere.plumb", "--format", "md,tex,html,json", "--out", out.toString());
        assertEquals(0, status);
        for (String ext : new String[] {"md", "tex", "html", "json"}) {
            assertTrue(Files.exists(out.resolve("uniform-sphere." + ext)), ext);
        }
        String html = Files.readString(out.resolve("uniform-sphere.html"));
        // Self-contained: no external scripts, stylesheets or images.
        assertFalse(html.contains("<script"), "no scripts");
        assertFalse(html.contains("src=\"http"), "no remote resources");
        // Well-formed XML, so browsers parse the MathML the way it was written.
        DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
        f.setFeature("http://apache.org/xml/features/disallow-doctype-decl", false);
        Document doc = f.newDocumentBuilder().parse(new ByteArrayInputStream(
                html.replace("<!DOCTYPE html>", "").getBytes(StandardCharsets.UTF_8)));
        assertTrue(doc.getElementsByTagName("math").getLength() >= 5, "equations are MathML");
        assertTrue(doc.getElementsByTagName("mfrac").getLength() >= 1, "fractions are typeset");
        String tex = Files.readString(out.resolve("uniform-sphere.tex"));
        assertTrue(tex.contains("\\frac{M}{\\frac{4}{3}\\,\\pi\\,{R}^{3}}"), "the definition of rho in LaTeX");
        assertTrue(tex.contains("\\begin{document}") && tex.contains("\\end{document}"));
        String md = Files.readString(out.resolve("uniform-sphere.md"));
        // The caution closes every format as one line set apart, not as a section of its own.
        assertFalse(md.contains("## Caution"), "the caution is not a section");
        assertTrue(md.strip().endsWith("licensed engineering practice, not this report."), "the caution closes the report");
        assertTrue(html.contains("<footer class=\"caution\">Caution: "), "the page ends with the caution as its footer");
        assertTrue(tex.contains("{\\footnotesize Caution: "), "the document ends with the caution in small type");
        assertTrue(md.contains("CODATA 2018"), "constants name their source");
    }

    @Test
    void badInputWritesNothingAndKeepsEarlierReports(@TempDir Path dir) throws Exception {
        Path bad = dir.resolve("bad.plumb");
        Files.writeString(bad, "param M [kg] > 0\nrelation P'(r) = \n");
        Path out = dir.resolve("out");
        Files.createDirectories(out);
        Files.writeString(out.resolve("bad.md"), "earlier report");
        assertEquals(2, run("report", bad.toString(), "--out", out.toString()));
        assertEquals("earlier report", Files.readString(out.resolve("bad.md")));
    }

    @Test
    void temporaryFilesOfAKilledRunAreRemovedAndNoneAreLeft(@TempDir Path out) throws Exception {
        Files.writeString(out.resolve(".plumb-killed.tmp"), "half a report");
        run("report", "derivations/uniform-sphere.plumb", "--format", "md,json", "--out", out.toString());
        try (var left = Files.newDirectoryStream(out, "*.tmp")) {
            assertFalse(left.iterator().hasNext(), "temporary files left in " + out);
        }
        assertTrue(Files.exists(out.resolve("uniform-sphere.md")));
    }

    @Test
    void theInputFileIsNeverOverwritten(@TempDir Path dir) throws Exception {
        // A derivation saved as x.md, reported as Markdown into its own folder, would be replaced by x.md.
        Path input = dir.resolve("x.md");
        String text = Files.readString(Path.of("derivations/uniform-sphere.plumb"));
        Files.writeString(input, text);
        assertEquals(2, run("report", input.toString(), "--format", "md", "--out", dir.toString()));
        assertEquals(text, Files.readString(input));
        assertEquals(2, run("report", input.toString(), "--format", "md", "--out", dir.resolve(".").toString()));
        assertEquals(text, Files.readString(input));
    }

    @Test
    void latexPrinterTypesetsGreekSubscriptsAndPowers() {
        dev.plumb.lang.Diagnostics d = new dev.plumb.lang.Diagnostics();
        dev.plumb.lang.Expr e = new dev.plumb.lang.Parser(new dev.plumb.lang.Lexer("rho_c*T0^(n+1)/k_B", d).tokens(), d)
                .expressionOnly();
        assertEquals("\\frac{\\rho_{\\mathrm{c}}\\,{T_{0}}^{n + 1}}{k_{\\mathrm{B}}}", LatexPrinter.print(e));
    }
}
