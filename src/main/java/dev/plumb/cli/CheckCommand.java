package dev.plumb.cli;

import dev.plumb.report.Analysis;
import dev.plumb.report.Json;
import dev.plumb.report.JsonReport;
import dev.plumb.report.Style;
import dev.plumb.report.TextReport;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code plumb check FILE...}: every check on every file, with an exit status for scripts. */
@Command(name = "check", mixinStandardHelpOptions = true, versionProvider = Version.class,
        description = {"Parse, check units, derive, check steps, claims and scaling, solve every case and compare.",
                "Exit status: 0 every check holds, 1 some check fails, 2 the input could not be understood."})
public final class CheckCommand implements Callable<Integer> {

    enum Format { text, json }

    @Parameters(arity = "1..*", paramLabel = "FILE", description = "plumb files to check ('-' reads standard input)")
    List<Path> files;

    @Option(names = "--format", description = "output format: ${COMPLETION-CANDIDATES} (default: ${DEFAULT-VALUE})",
            defaultValue = "text")
    Format format;

    @Option(names = "--profiles", description = "with --format json: each case's profiles sampled across the interval "
            + "(coordinate, numeric and closed-form values, SI), as in the report's JSON; costs a solve per case")
    boolean profiles;

    @CommandLine.Mixin
    AnalysisOptions analysis;

    @Option(names = "--no-color", description = "plain output even on a terminal")
    boolean noColor;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        List<Analysis> results = new ArrayList<>();
        int status = 0;
        TextReport text = new TextReport(noColor ? Style.PLAIN : Style.detect());
        // On a terminal: the unit checks as soon as they are final, and a progress line for long stages.
        TerminalProgress progress = format == Format.text && TerminalProgress.wanted() ? new TerminalProgress(out, err, text) : null;
        Analyzer analyzer = analysis.analyzer(spec.commandLine(), profiles && format == Format.json,
                progress != null ? progress : Analyzer.Listener.NONE);
        for (Path f : files) {
            if (progress != null) progress.reset();
            Analysis a = analysis.withinTimeout(() -> analyze(analyzer, f), f.toString(), err);
            if (a == null) return 1;
            results.add(a);
            status = Math.max(status, a.exitStatus(analysis.strict));
            if (format == Format.text) {
                // Located messages go to standard error, verdicts and tables to standard output.
                err.print(text.diagnostics(a));
                err.flush();
                out.print(text.results(a, analysis.strict, progress != null && progress.unitsShown()));
                out.flush();
            }
        }
        if (format == Format.json) {
            Object doc = results.size() == 1 ? JsonReport.toMap(results.get(0), analysis.strict)
                    : results.stream().map(a -> JsonReport.toMap(a, analysis.strict)).toList();
            out.print(Json.write(doc));
            out.flush();
        }
        return status;
    }

    private static Analysis analyze(Analyzer analyzer, Path f) {
        if (!f.toString().equals("-")) return analyzer.analyze(f);
        // 'check -' reads the derivation from standard input, named <stdin> in messages.
        byte[] bytes;
        try {
            bytes = System.in.readAllBytes();
        } catch (java.io.IOException e) {
            bytes = new byte[0];
        }
        return analyzer.analyze("<stdin>", bytes);
    }
}
