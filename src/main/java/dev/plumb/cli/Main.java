package dev.plumb.cli;

import java.io.PrintWriter;
import picocli.CommandLine;
import picocli.CommandLine.Command;

/** The {@code plumb} command: check derivations, write reports, convert units. */
@Command(name = "plumb", mixinStandardHelpOptions = true, versionProvider = Version.class,
        description = "Unit-checked symbolic-to-numeric derivation assistant for hydrostatic equilibrium.",
        subcommands = {CheckCommand.class, ReportCommand.class, UnitsCommand.class, LspCommand.class, CommandLine.HelpCommand.class})
public final class Main implements Runnable {

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    public static void main(String[] args) {
        System.exit(run(args, new PrintWriter(System.out, true), new PrintWriter(System.err, true)));
    }

    /** Runs the command line and returns the exit status; never throws. */
    public static int run(String[] args, PrintWriter out, PrintWriter err) {
        CommandLine cli = new CommandLine(new Main());
        cli.setOut(out);
        cli.setErr(err);
        boolean debug = java.util.Arrays.asList(args).contains("--debug");
        cli.setExecutionExceptionHandler((ex, commandLine, parseResult) -> {
            if (debug) ex.printStackTrace(err);
            err.println("plumb: internal error: " + ex + " (please report this with the input file)");
            return 3;
        });
        cli.setParameterExceptionHandler((ex, args1) -> {
            err.println("plumb: " + ex.getMessage());
            err.println("try 'plumb " + (ex.getCommandLine() == cli ? "" : ex.getCommandLine().getCommandName() + " ") + "--help'");
            return 2;
        });
        try {
            return cli.execute(args);
        } catch (RuntimeException | Error ex) {
            // picocli hands only Exceptions to the handler above; an Error would reach the user as a stack trace.
            if (debug) ex.printStackTrace(err);
            err.println("plumb: internal error: " + ex + " (please report this with the input file)");
            return 3;
        }
    }

    @Override
    public void run() {
        spec.commandLine().usage(spec.commandLine().getOut());
    }
}
