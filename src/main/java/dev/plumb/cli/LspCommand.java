package dev.plumb.cli;

import dev.plumb.lsp.PlumbLanguageServer;
import dev.plumb.pipeline.Analyzer;
import java.io.FileDescriptor;
import java.io.FileOutputStream;
import java.io.PrintStream;
import java.util.concurrent.Callable;
import java.util.logging.Level;
import java.util.logging.LogManager;
import java.util.logging.Logger;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/** {@code plumb lsp}: the language server, speaking the Language Server Protocol on standard input and output. */
@Command(name = "lsp", mixinStandardHelpOptions = true, versionProvider = Version.class,
        description = {"Run the language server for editors: the Language Server Protocol over standard input and output.",
                "Configure the editor to start 'plumb lsp' for .plumb files."})
public final class LspCommand implements Callable<Integer> {

    @Option(names = "--symbolic-timeout", paramLabel = "SECONDS", defaultValue = "5",
            description = "CPU-time limit for each symbolic computation (default: ${DEFAULT-VALUE} s)")
    double symbolicTimeout;

    @Option(names = "--debug", description = "log the protocol library's messages and internal stack traces to standard error")
    boolean debug;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        if (!(symbolicTimeout > 0) || symbolicTimeout > 3600) {
            throw new CommandLine.ParameterException(spec.commandLine(),
                    "--symbolic-timeout must be a number of seconds above 0 and at most 3600, found " + symbolicTimeout);
        }
        // Standard output carries the protocol and nothing else: whatever else would print there goes to
        // standard error, and the protocol library's java.util.logging records are dropped (or, with
        // --debug, go to standard error).
        PrintStream protocol = new PrintStream(new FileOutputStream(FileDescriptor.out), false);
        System.setOut(System.err);
        LogManager.getLogManager().reset();
        Logger root = Logger.getLogger("");
        if (debug) {
            java.util.logging.ConsoleHandler toStderr = new java.util.logging.ConsoleHandler();
            toStderr.setLevel(Level.ALL);
            root.addHandler(toStderr);
            root.setLevel(Level.INFO);
        } else {
            root.setLevel(Level.OFF);
        }
        Analyzer analyzer = new Analyzer(new Analyzer.Options(symbolicTimeout, false, Long.MAX_VALUE, 0, debug, Analyzer.Listener.NONE));
        return PlumbLanguageServer.serve(analyzer, System.in, protocol, debug);
    }
}
