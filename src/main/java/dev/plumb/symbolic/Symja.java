package dev.plumb.symbolic;

import java.io.OutputStream;
import java.io.PrintStream;
import org.matheclipse.core.basic.Config;
import org.matheclipse.core.eval.EvalEngine;
import org.matheclipse.core.eval.ExprEvaluator;
import org.matheclipse.core.expression.F;
import org.matheclipse.core.expression.S;
import org.matheclipse.core.interfaces.IExpr;
import org.matheclipse.core.interfaces.ISymbol;

/**
 * One time-limited session of the Symja computer algebra system. Expressions are only ever built
 * as trees (never parsed from text), the engine writes to its own discarded streams, and its
 * file-system and Java-interop features stay off.
 */
final class Symja {

    /** Raised when a call runs past its time limit or Symja gives up with an error. */
    static final class Failure extends RuntimeException {
        final boolean timedOut;

        Failure(String message, boolean timedOut) {
            super(message, null, false, false);
            this.timedOut = timedOut;
        }
    }

    private static volatile Thread warmer;

    static {
        configure();
    }

    private final ExprEvaluator evaluator;
    private final double timeoutSeconds;
    private final ISymbol timedOut = F.Dummy("plumbtimedout");

    Symja(double timeoutSeconds) {
        this.timeoutSeconds = timeoutSeconds;
        PrintStream sink = new PrintStream(OutputStream.nullOutputStream());
        EvalEngine engine = new EvalEngine("plumb", Config.DEFAULT_RECURSION_LIMIT, Config.DEFAULT_ITERATION_LIMIT,
                sink, sink, false);
        engine.setFileSystemEnabled(false);
        evaluator = new ExprEvaluator(engine, true, (short) 0);
    }

    private static void configure() {
        // Symja is a library here, not a notebook: no files, no Java reflection, no plot windows.
        Config.FILESYSTEM_ENABLED = false;
        Config.JAVA_UNSAFE = false;
        Config.UNPROTECT_ALLOWED = false;
        Config.JAVA_AWT_DESKTOP_AVAILABLE = false;
        Config.SWING_PLOT_FRAME = false;
        Config.USE_MANIPULATE_JS = false;
        Config.FUZZY_PARSER = false;
    }

    /** Loads Symja's rule tables on a background thread; later sessions start warm. */
    static synchronized void warmUp() {
        if (warmer != null) return;
        warmer = new Thread(() -> {
            try {
                Symja s = new Symja(30);
                ISymbol x = F.Dummy("plumbwarm");
                s.eval(F.Simplify(F.Integrate(F.Times(x, F.Sin(x)), x)));
            } catch (RuntimeException | LinkageError ignored) {
                // A failed warm-up only costs time later. When the run ends before the warm-up does
                // (a file with a syntax error), Symja's static set-up fails with an Error as the JVM
                // shuts down; the default handler would print its stack trace on the user's screen.
            }
        }, "plumb-symja-warm-up");
        warmer.setDaemon(true);
        warmer.start();
    }

    /**
     * Waits (at most {@code seconds}) for the warm-up to finish, starting it if need be: Symja loads
     * its integration rules on first use, and a time limit that starts before they are loaded can run
     * out on the loading alone.
     */
    static void awaitWarm(double seconds) {
        warmUp();
        try {
            warmer.join(Math.round(seconds * 1000));
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
    }

    double timeoutSeconds() {
        return timeoutSeconds;
    }

    /** Evaluates {@code e} within the time limit. */
    IExpr eval(IExpr e) {
        return eval(e, timeoutSeconds);
    }

    IExpr eval(IExpr e, double seconds) {
        IExpr result;
        try {
            long whole = Math.max(1, Math.round(seconds));
            result = evaluator.eval(F.TimeConstrained(e, F.ZZ(whole), timedOut));
        } catch (RuntimeException | Error ex) {
            // Not only StackOverflowError: Symja's own assertions (under -ea) and Guava's time limiter
            // (ExecutionError) throw Errors from inside an evaluation, and the numeric side can still answer.
            throw new Failure("the computer algebra system gave up (" + ex.getClass().getSimpleName() + ")", false);
        }
        if (result == timedOut || result.has(timedOut)) {
            throw new Failure("symbolic computation timed out after " + seconds(seconds) + " s", true);
        }
        if (result == S.$Aborted) {
            throw new Failure("the computer algebra system aborted the computation", false);
        }
        return result;
    }

    static String seconds(double s) {
        return s == Math.rint(s) ? String.valueOf((long) s) : String.valueOf(s);
    }
}
