package dev.plumb.cli;

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

    /** Validates the options and starts Symja's warm-up, which is worth starting before the file is even read. */
    Analyzer analyzer(CommandLine commandLine, boolean profiles) {
        if (!(symbolicTimeout > 0) || symbolicTimeout > 3600) {
            throw new CommandLine.ParameterException(commandLine,
                    "--symbolic-timeout must be a number of seconds above 0 and at most 3600, found " + symbolicTimeout);
        }
        SymbolicEngine.warmUp();
        return new Analyzer(new Analyzer.Options(symbolicTimeout, profiles));
    }
}
