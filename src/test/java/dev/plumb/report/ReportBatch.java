package dev.plumb.report;

import dev.plumb.cli.Main;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Path;

/**
 * Writes the report of each file given, in every format, into a folder of its own under the first
 * argument: {@code ReportBatch OUT FILE...}. Run in a JVM of its own by {@link ReportRuns}, so that
 * two runs share nothing but the files (not even the JVM's hash seeds or identity hash codes).
 * Prints one line per file: its exit status and name.
 */
public final class ReportBatch {

    static final String FORMATS = "md,tex,html,json,csv";

    private ReportBatch() {
    }

    public static void main(String[] args) {
        Path out = Path.of(args[0]);
        for (int i = 1; i < args.length; i++) {
            Path file = Path.of(args[i]);
            StringWriter err = new StringWriter();
            int status = Main.run(new String[] {"report", file.toString(), "--format", FORMATS, "--out",
                    out.resolve(folder(file)).toString()}, new PrintWriter(new StringWriter()), new PrintWriter(err));
            System.out.println(status + " " + file);
            System.out.flush();
        }
        // Symja's worker threads would otherwise keep the JVM alive.
        System.exit(0);
    }

    /** The folder a file's report goes to: its name without the extension. */
    static String folder(Path file) {
        String name = file.getFileName().toString();
        return name.endsWith(".plumb") ? name.substring(0, name.length() - ".plumb".length()) : name;
    }
}
