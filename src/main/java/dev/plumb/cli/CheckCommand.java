package dev.plumb.cli;

import dev.plumb.pipeline.Analyzer;
import dev.plumb.report.Analysis;
import dev.plumb.report.Json;
import dev.plumb.report.JsonReport;
import dev.plumb.report.Style;
import dev.plumb.report.TextReport;
import dev.plumb.watch.SaveWatcher;
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

    @Option(names = "--watch", description = "check, then check again each time a FILE is saved, until Ctrl-C")
    boolean watch;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        if (watch) return watch();
        return checkAll(files);
    }

    /** Checks {@code which} once and prints the results; returns the exit status. */
    private int checkAll(List<Path> which) {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        List<Analysis> results = new ArrayList<>();
        int status = 0;
        TextReport text = new TextReport(noColor ? Style.PLAIN : Style.detect());
        // On a terminal: the unit checks as soon as they are final, and a progress line for long stages.
        TerminalProgress progress = format == Format.text && !watch && TerminalProgress.wanted() ? new TerminalProgress(out, err, text) : null;
        Analyzer analyzer = analysis.analyzer(spec.commandLine(), profiles && format == Format.json,
                progress != null ? progress : Analyzer.Listener.NONE);
        for (Path f : which) {
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

    /**
     * {@code --watch}: checks every file, then each file again whenever it is saved, in this one warm
     * process. Each check is framed by a line with the time it started and one with how long it took,
     * on standard output (not in JSON, which stays a stream of documents). Returns, once the thread is
     * interrupted, the exit status of the last check; Ctrl-C ends the process as usual.
     */
    private int watch() {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        if (files.stream().anyMatch(f -> f.toString().equals("-"))) {
            throw new CommandLine.ParameterException(spec.commandLine(), "--watch needs files to watch; standard input ('-') cannot be watched");
        }
        Style style = noColor ? Style.PLAIN : Style.detect();
        SaveWatcher watcher;
        try {
            watcher = new SaveWatcher(files, 100);
        } catch (java.io.IOException e) {
            String what = e instanceof java.nio.file.NoSuchFileException ? "no such directory" : String.valueOf(e.getMessage());
            err.println("plumb: cannot watch " + (e instanceof java.nio.file.FileSystemException f && f.getFile() != null ? f.getFile() : "the files")
                    + ": " + what);
            return 2;
        }
        Thread goodbye = new Thread(() -> {
            err.println();
            err.println("plumb: stopped watching");
            err.flush();
        }, "plumb-watch-stop");
        Runtime.getRuntime().addShutdownHook(goodbye);
        int status = 0;
        int run = 0;
        try (watcher) {
            List<Path> which = files;
            while (true) {
                run++;
                long start = System.nanoTime();
                if (format == Format.text) {
                    out.println(style.dim("=== " + java.time.LocalTime.now().withNano(0) + "  check " + run + ": "
                            + String.join(", ", which.stream().map(Path::toString).toList()) + " ==="));
                    out.flush();
                }
                analysis.restartClock();
                status = checkAll(which);
                if (format == Format.text) {
                    out.println(style.dim(String.format(java.util.Locale.ROOT, "--- checked in %.3f s; watching %d file%s for saves (Ctrl-C stops) ---",
                            (System.nanoTime() - start) / 1e9, files.size(), files.size() == 1 ? "" : "s")));
                    out.println();
                }
                out.flush();
                which = List.copyOf(watcher.awaitSave());
            }
        } catch (InterruptedException | Analyzer.Cancelled e) {
            // Asked to stop (in the middle of a check, or while waiting for a save).
            Thread.currentThread().interrupt();
        } catch (java.io.IOException e) {
            // Closing the watch service at the end: nothing left to report.
        } finally {
            try {
                Runtime.getRuntime().removeShutdownHook(goodbye);
            } catch (IllegalStateException shuttingDown) {
                // Ctrl-C: the hook is running or has run.
            }
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
