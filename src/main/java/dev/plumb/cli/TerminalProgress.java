package dev.plumb.cli;

import dev.plumb.model.Check;
import dev.plumb.model.Model;
import dev.plumb.pipeline.Analyzer;
import dev.plumb.report.Style;
import dev.plumb.report.TextReport;
import java.io.PrintWriter;
import java.util.List;
import java.util.Locale;

/**
 * What {@code check} shows on a terminal while it works: the unit checks as soon as they are final,
 * and, for anything that runs longer than about a second, one line on standard error naming the file,
 * the stage and the case, rewritten in place and erased before anything else is printed. Used only
 * when both streams are a terminal and the output is text; pipes and JSON get nothing of the sort.
 */
final class TerminalProgress implements Analyzer.Listener {

    /** How long a stage runs before the progress line appears. */
    private static final long QUIET_NANOS = 1_000_000_000L;

    private final PrintWriter out;
    private final PrintWriter err;
    private final TextReport text;
    private final Object lock = new Object();
    private String file = "";
    private String what = "";
    private long fileStart;
    private boolean lineShown;
    private boolean unitsShown;
    private Thread ticker;

    TerminalProgress(PrintWriter out, PrintWriter err, TextReport text) {
        this.out = out;
        this.err = err;
        this.text = text;
    }

    /** Whether this run's standard output and error are a terminal (the only place progress belongs). */
    static boolean wanted() {
        return System.console() != null && System.getenv("TERM") != null && !"dumb".equals(System.getenv("TERM"));
    }

    @Override
    public void stage(String file, String what) {
        synchronized (lock) {
            if (!file.equals(this.file)) {
                this.file = file;
                fileStart = System.nanoTime();
                unitsShown = false;
            }
            this.what = what;
            if (ticker == null) {
                ticker = new Thread(this::tick, "plumb-progress");
                ticker.setDaemon(true);
                ticker.start();
            }
        }
    }

    @Override
    public void unitsChecked(Model model, List<Check> unitChecks) {
        synchronized (lock) {
            clear();
            out.print(text.header(model.source().path(), model));
            for (Check c : unitChecks) out.print(text.check(c));
            out.flush();
            unitsShown = true;
            file = model.source().path();
            fileStart = System.nanoTime();
        }
    }

    @Override
    public void finished(String file) {
        synchronized (lock) {
            clear();
            what = "";
        }
    }

    /** Whether the header and unit checks of the file last finished were printed as they came. */
    boolean unitsShown() {
        synchronized (lock) {
            return unitsShown;
        }
    }

    /** Starts a new file: nothing of the last one's is shown any more. */
    void reset() {
        synchronized (lock) {
            unitsShown = false;
            file = "";
        }
    }

    private void tick() {
        while (true) {
            try {
                Thread.sleep(200);
            } catch (InterruptedException e) {
                return;
            }
            synchronized (lock) {
                long elapsed = System.nanoTime() - fileStart;
                if (what.isEmpty() || elapsed < QUIET_NANOS) continue;
                String line = String.format(Locale.ROOT, "plumb: %s: %s (%.1f s)", Style.inert(file), Style.inert(what), elapsed / 1e9);
                if (line.length() > 100) line = line.substring(0, 97) + "...";
                err.print("\r\u001b[K" + line);
                err.flush();
                lineShown = true;
            }
        }
    }

    /** Erases the progress line (called with the lock held). */
    private void clear() {
        if (lineShown) {
            err.print("\r\u001b[K");
            err.flush();
            lineShown = false;
        }
    }
}
