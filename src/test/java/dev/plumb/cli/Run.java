package dev.plumb.cli;

import java.io.PrintWriter;
import java.io.StringWriter;

/** One run of the command line through {@link Main#run}, with what it wrote and the exit status. */
record Run(int status, String out, String err) {

    static Run of(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int status = Main.run(args, new PrintWriter(out, true), new PrintWriter(err, true));
        return new Run(status, out.toString(), err.toString());
    }

    /** Both streams, for checks that nothing of the kind reached the user. */
    String all() {
        return out + err;
    }
}
