package dev.plumb.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumb.lang.Diagnostics;
import dev.plumb.lang.Parser;
import dev.plumb.lang.SourceFile;
import dev.plumb.model.Checker;
import dev.plumb.model.Model;
import dev.plumb.pipeline.Analyzer;
import dev.plumb.report.Style;
import dev.plumb.report.TextReport;
import java.io.PrintWriter;
import java.io.StringWriter;
import org.junit.jupiter.api.Test;

/** On a terminal the unit checks come as soon as they are final, and the final summary does not repeat them. */
class TerminalProgressTest {

    @Test
    void unitChecksComeFirstAndAreNotRepeated() {
        SourceFile source = new SourceFile("t.plumb", "param M [kg] > 0\nparam R [m] > 0\nclaim c: M/R = M/R\n");
        Diagnostics d = new Diagnostics();
        Model model = Checker.check(Parser.parse(source, d), d);
        StringWriter out = new StringWriter(), err = new StringWriter();
        TextReport text = new TextReport(Style.PLAIN);
        TerminalProgress progress = new TerminalProgress(new PrintWriter(out), new PrintWriter(err), text);
        Analyzer analyzer = new Analyzer(new Analyzer.Options(5, false, Long.MAX_VALUE, 0, false, progress));
        var analysis = analyzer.analyze(source);
        String streamed = out.toString();
        assertTrue(streamed.startsWith("t.plumb\n  units     c                      holds"), streamed);
        assertTrue(progress.unitsShown());
        String rest = text.results(analysis, false, true);
        assertTrue(rest.contains("claim     c                      holds"), rest);
        assertEquals(-1, rest.indexOf("units     c"), rest);
        assertEquals(model.unitChecks().size(), analysis.checks().stream().filter(c -> c.kind().equals("units")).count());
    }
}
