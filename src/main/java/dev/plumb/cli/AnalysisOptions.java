package dev.plumb.cli;

import dev.plumb.pipeline.Analyzer;
import dev.plumb.symbolic.SymbolicEngine;
import picocli.CommandLine;
import picocli.CommandLine.Option;

/** The options every command that analyses a file shares: the symbolic time limit and strictness. */
final class AnalysisOptions {

    @Option(names = "--symbolic-timeout", paramLabel = "SECONDS", defaultValue = "5",
            description = "CPU-time limit for each symbolic computation, so a busy machine gives the same verdicts "
                    + "(default: ${DEFAULT-VALUE} s; twelve times as long by the clock stops it anyway)")
    double symbolicTimeout;

    @Option(names = "--strict", description = "an undecided check fails the run")
    boolean strict;

    @Option(names = "--timeout", paramLabel = "SECONDS",
            description = "wall-clock limit for the whole run: stages not reached by then are undecided and the run "
                    + "exits 1; a stage still running a little after it is stopped (default: none)")
    Double timeout;

    @Option(names = "--debug", description = "show internal stack traces when a stage stops on a defect")
    boolean debug;

    /** When the run started, for {@link #timeout}. */
    long started = System.nanoTime();

    /** Starts the clock of {@link #timeout} again, for each check of a watch. */
    void restartClock() {
        started = System.nanoTime();
    }

    long deadline() {
        return timeout == null ? Long.MAX_VALUE : started + (long) (timeout * 1e9);
    }

    /** Validates the options and makes the analyzer they describe. */
    Analyzer analyzer(CommandLine commandLine, boolean profiles) {
        return analyzer(commandLine, profiles, Analyzer.Listener.NONE);
    }

    /** As {@link #analyzer(CommandLine, boolean)}, telling {@code listener} what the analysis is doing. */
    Analyzer analyzer(CommandLine commandLine, boolean profiles, Analyzer.Listener listener) {
        if (!(symbolicTimeout > 0) || symbolicTimeout > 3600) {
            throw new CommandLine.ParameterException(commandLine,
                    "--symbolic-timeout must be a number of seconds above 0 and at most 3600, found " + symbolicTimeout);
        }
        if (timeout != null && (!(timeout > 0) || timeout > 86400)) {
            throw new CommandLine.ParameterException(commandLine,
                    "--timeout must be a number of seconds above 0 and at most 86400, found " + timeout);
        }
        return new Analyzer(new Analyzer.Options(symbolicTimeout, profiles, deadline(), timeout == null ? 0 : timeout, debug, listener));
    }

    /**
     * Runs one file's analysis, and with {@code --timeout} stops waiting for it a little after the
     * deadline (a stage that overruns is abandoned on a daemon thread): then a located failure is
     * printed and null returned, and the caller exits 1.
     */
    dev.plumb.report.Analysis withinTimeout(java.util.function.Supplier<dev.plumb.report.Analysis> work, String file,
            java.io.PrintWriter err) {
        if (timeout == null) return work.get();
        java.util.concurrent.CompletableFuture<dev.plumb.report.Analysis> result = new java.util.concurrent.CompletableFuture<>();
        Thread worker = new Thread(null, () -> {
            try {
                result.complete(work.get());
            } catch (Throwable t) {
                result.completeExceptionally(t);
            }
        }, "plumb-analysis", 16L << 20);
        worker.setDaemon(true);
        worker.start();
        long grace = (long) (Math.max(2.0, 0.1 * timeout) * 1e9);
        long wait = deadline() + grace - System.nanoTime();
        try {
            return result.get(Math.max(0, wait), java.util.concurrent.TimeUnit.NANOSECONDS);
        } catch (java.util.concurrent.TimeoutException e) {
            worker.interrupt();
            err.println(file + ":1:1: error: the run did not finish within its --timeout of "
                    + Double.toString(timeout).replaceAll("\\.0$", "") + " s; stopped while checking this file");
            err.flush();
            return null;
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            return null;
        } catch (java.util.concurrent.ExecutionException e) {
            if (e.getCause() instanceof RuntimeException r) throw r;
            if (e.getCause() instanceof Error r) throw r;
            throw new IllegalStateException(e.getCause());
        }
    }
}
