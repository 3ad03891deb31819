package dev.plumb.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;

/**
 * Every LaTeX report of the shipped derivations and the examples (the batch of {@link ReportRuns}),
 * compiled by pdfLaTeX twice with {@code -halt-on-error}: no error, and no line more than 5 pt wider
 * than its box. The preamble-free bodies written beside them are compiled too, all in one document
 * that loads exactly the packages their top comments list, as a thesis would, and whose text refers
 * to a labelled equation of one of them.
 */
class LatexReportsTest {

    private static final Pattern OVERFULL = Pattern.compile("Overfull \\\\hbox \\(([0-9.]+)pt too wide\\)[^\\n]*");
    /** The widest a line may run over its box, in points (the limit). */
    private static final double OVERFULL_LIMIT = 5;

    private static ExternalTool pdflatex() {
        var pdflatex = ExternalTool.find("pdflatex");
        Assumptions.assumeTrue(pdflatex.isPresent(), "pdflatex is not installed (CI installs TeX Live from Debian's packages); skipped");
        return pdflatex.get();
    }

    /** Runs pdfLaTeX twice (the first pass only for the labels and makes no PDF); the problems found in the second pass's log. */
    private static List<String> compile(ExternalTool pdflatex, Path dir, String name) throws Exception {
        List<String> problems = new ArrayList<>();
        for (int pass = 0; pass < 2; pass++) {
            List<String> args = new ArrayList<>(List.of("-halt-on-error", "-interaction=nonstopmode"));
            if (pass == 0) args.add("-draftmode");
            args.add(name + ".tex");
            var r = pdflatex.run(dir, args);
            if (r.status() != 0) {
                String log = Files.exists(dir.resolve(name + ".log")) ? Files.readString(dir.resolve(name + ".log"), StandardCharsets.ISO_8859_1) : r.out();
                int bang = log.indexOf("\n! ");
                problems.add(dir.resolve(name + ".tex") + ": pdflatex stopped (exit " + r.status() + ")"
                        + (bang >= 0 ? ": " + log.substring(bang + 1, Math.min(log.length(), bang + 400)) : ""));
                return problems;
            }
        }
        String log = Files.readString(dir.resolve(name + ".log"), StandardCharsets.ISO_8859_1);
        Matcher m = OVERFULL.matcher(log);
        while (m.find()) {
            if (Double.parseDouble(m.group(1)) > OVERFULL_LIMIT) problems.add(dir.resolve(name + ".tex") + ": " + m.group());
        }
        for (String warning : List.of("There were undefined references", "multiply defined")) {
            if (log.contains(warning)) problems.add(dir.resolve(name + ".tex") + ": " + warning);
        }
        return problems;
    }

    @Test
    void everyReportCompilesTwiceWithoutErrorsOrLinesMoreThanFivePointsTooWide() throws Exception {
        ExternalTool pdflatex = pdflatex();
        ReportRuns.Run run = ReportRuns.first();
        List<String> problems = new ArrayList<>();
        int compiled = 0;
        for (Map.Entry<Path, Integer> e : run.statuses().entrySet()) {
            if (e.getValue() == 2) continue;
            String name = ReportBatch.folder(e.getKey());
            Path dir = run.reportOf(e.getKey());
            assertTrue(Files.exists(dir.resolve(name + ".tex")), () -> e.getKey() + " wrote no LaTeX report");
            problems.addAll(compile(pdflatex, dir, name));
            compiled++;
        }
        assertTrue(compiled >= 35, "reports compiled: " + compiled);
        assertEquals(List.of(), problems);
        // A failing claim is marked at its equation with a word, and plumb's correct form stands beside it.
        var pdftotext = ExternalTool.find("pdftotext");
        Assumptions.assumeTrue(pdftotext.isPresent(), "poppler-utils are not installed; the text checks are skipped");
        Path moonlet = run.reportOf(Path.of("examples/wrong-moonlet.plumb"));
        String text = pdftotext.get().run(moonlet, List.of("wrong-moonlet.pdf", "-")).out();
        for (String words : List.of("doubled: fails", "lost_pi: fails", "right_centre: holds", "derived by plumb:")) {
            assertTrue(text.contains(words), () -> words + " is in the PDF:\n" + text);
        }
    }

    @Test
    void theBodiesCompileInADocumentThatLoadsOnlyThePackagesTheirCommentsList() throws Exception {
        ExternalTool pdflatex = pdflatex();
        ReportRuns.Run run = ReportRuns.first();
        List<String> packages = null;
        StringBuilder inputs = new StringBuilder();
        String reference = null;
        for (Map.Entry<Path, Integer> e : run.statuses().entrySet()) {
            if (e.getValue() == 2) continue;
            String name = ReportBatch.folder(e.getKey());
            Path body = run.reportOf(e.getKey()).resolve(name + "-body.tex");
            assertTrue(Files.exists(body), () -> e.getKey() + " wrote no body beside its LaTeX report");
            String text = Files.readString(body);
            assertFalse(text.contains("\\documentclass") || text.contains("\\begin{document}") || text.contains("\\usepackage{")
                    && !text.lines().filter(l -> l.contains("\\usepackage")).allMatch(l -> l.startsWith("%")), body + " has a preamble");
            // The lines of the top comment that a preamble takes: each stands after '%' and blanks.
            List<String> listed = text.lines().takeWhile(l -> l.startsWith("%")).map(l -> l.substring(1).strip())
                    .filter(l -> l.startsWith("\\usepackage") || l.startsWith("\\usepgfplotslibrary") || l.startsWith("\\pgfplotsset")).toList();
            assertFalse(listed.isEmpty(), body + " lists no packages in its top comment");
            if (packages == null) packages = listed;
            assertEquals(packages, listed, body + " needs other packages than the first body");
            String folder = run.folder().relativize(run.reportOf(e.getKey())).toString().replace('\\', '/');
            inputs.append("\\renewcommand{\\plumbplotdir}{").append(folder).append("/}\n\\input{").append(folder).append('/').append(name)
                    .append("-body}\n\\clearpage\n");
            if (name.equals("uniform-sphere")) reference = "uniform-sphere:balance";
        }
        assertTrue(reference != null, "the uniform sphere was reported");
        String wrapper = "\\documentclass{report}\n" + String.join("\n", packages) + "\n\\newcommand{\\plumbplotdir}{}\n"
                + "\\begin{document}\nThe balance of the uniform sphere is equation~\\eqref{" + reference + "}.\n\n" + inputs
                + "\\end{document}\n";
        Files.writeString(run.folder().resolve("thesis.tex"), wrapper);
        assertEquals(List.of(), compile(pdflatex, run.folder(), "thesis"));
    }
}
