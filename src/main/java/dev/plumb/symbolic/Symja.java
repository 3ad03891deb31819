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


    static {
        configure();
    }

    private final ExprEvaluator evaluator;
    private final double timeoutSeconds;

    Symja(double timeoutSeconds) {
        this.timeoutSeconds = timeoutSeconds;
        PrintStream sink = new PrintStream(OutputStream.nullOutputStream());
        EvalEngine engine = new EvalEngine("plumb", RECURSION_LIMIT, ITERATION_LIMIT, sink, sink, false);
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
        // Bounds that do not depend on the machine's load: a number past 20,000 bits (6,000 digits), a
        // polynomial past degree 10,000 or an expression past a million nodes is given up at once, the same
        // way on a quiet machine and a busy one ((1+x)^1000000 or x^1e6 at a rational point).
        Config.MAX_BIT_LENGTH = 20_000;
        Config.MAX_POLYNOMIAL_DEGREE = 10_000;
        // Time limits inside Symja (its own TimeConstrained) would run on the clock: the session's CPU budget bounds them.
        Config.TIMECONSTRAINED_NO_THREAD = true;
        Config.MAX_AST_SIZE = 1_000_000;
        // Symja keeps its own start-up thread for its integration rules (Config.JAS_NO_THREADS stays false): loaded
        // on a caller's thread instead, they could be interrupted half-way by a cancelled check (the language server
        // cancels on every edit), leaving the rules marked as read but never finished, and the next integral waiting.
    }

    private static boolean integrationRulesLoaded;

    /**
     * Loads Symja's integration rules (once per process) outside any check's time limit: Symja reads them
     * on the first antiderivative, and a limit that included the reading could run out on it alone. Files
     * that never integrate, or whose integrands are sums of powers of the variable (integrated term by
     * term without the rules), never pay for them.
     */
    static void loadIntegrationRules() {
        synchronized (Symja.class) {
            if (integrationRulesLoaded) return;
        }
        synchronized (INTEGRATION_LOCK) {
            if (integrationRulesLoaded) return;
            Symja s = new Symja(120);
            try {
                ISymbol x = F.Dummy("plumbwarm");
                s.eval(F.Integrate(F.Times(x, F.Sin(x)), x));
            } catch (Failure ignored) {
                // The rules are loaded as far as they could be; the integration itself will say what failed.
            } finally {
                s.close();
            }
            synchronized (Symja.class) {
                integrationRulesLoaded = true;
            }
        }
    }

    private static final Object INTEGRATION_LOCK = new Object();

    double timeoutSeconds() {
        return timeoutSeconds;
    }

    /**
     * The private symbol named {@code name}, the same object on every call. Symja's symbols are
     * equal only to themselves ({@code F.Dummy} makes a new one each time), so the trees of two
     * analyses of the same text are equal, and {@link #eval} can answer the second from memory,
     * only when both are built from the same symbols.
     */
    static ISymbol symbol(String name) {
        return SYMBOLS.computeIfAbsent(name, F::Dummy);
    }

    private static final java.util.Map<String, ISymbol> SYMBOLS = new java.util.concurrent.ConcurrentHashMap<>();

    /**
     * Results of earlier evaluations in this process, by the tree evaluated: an evaluation is a
     * function of its tree alone (the engine's limits are fixed, assumptions are part of the tree,
     * no symbol is ever assigned), so a warm process (a watch, the language server) re-checks an
     * edited file at the cost of what changed. Only results are kept, never a failure or a timeout,
     * which may depend on the machine; the oldest entries go past {@link #REMEMBERED_LIMIT}.
     */
    private static final java.util.Map<IExpr, IExpr> REMEMBERED = java.util.Collections.synchronizedMap(
            new java.util.LinkedHashMap<>(256, 0.75f, true) {
                @Override
                protected boolean removeEldestEntry(java.util.Map.Entry<IExpr, IExpr> eldest) {
                    return size() > REMEMBERED_LIMIT;
                }
            });
    private static final int REMEMBERED_LIMIT = 20_000;

    /**
     * Symja's own bounds on one evaluation, the same on every machine: deep enough for the simplification
     * of a layered atmosphere's closed form (the defaults, 512 and 1000, are not), and far below what the
     * worker's stack holds.
     */
    private static final int RECURSION_LIMIT = 4096, ITERATION_LIMIT = 100_000;

    /** Evaluates {@code e} within the time limit. */
    IExpr eval(IExpr e) {
        return eval(e, timeoutSeconds);
    }

    /**
     * Evaluates {@code e} on this session's own worker thread, within {@code seconds} of that thread's
     * CPU time. CPU time, not wall-clock time, so that a busy machine (both cores taken by another
     * build) slows an evaluation down without making it run out: the same file gets the same verdicts.
     * A wall-clock limit of {@link #HARD_STOP_FACTOR} times as long stays as a safety stop. Either
     * limit asks the engine to stop and interrupts the worker; a worker that does not stop (deep in
     * arithmetic that never checks) is abandoned and the session starts a fresh one.
     */
    IExpr eval(IExpr e, double seconds) {
        IExpr known = REMEMBERED.get(e);
        if (known != null) return known;
        IExpr result = evaluate(e, seconds);
        REMEMBERED.put(e, result);
        return result;
    }

    private IExpr evaluate(IExpr e, double seconds) {
        EvalEngine engine = evaluator.getEvalEngine();
        engine.setStopRequested(false);
        Worker w = worker();
        java.util.concurrent.Future<IExpr> job = w.pool.submit(() -> evaluator.eval(e));
        long budget = Math.round(seconds * 1e9), cpuStart = w.cpu(), wallStart = System.nanoTime();
        boolean stopped = false;
        long stoppedAt = 0;
        while (true) {
            try {
                IExpr result = job.get(10, java.util.concurrent.TimeUnit.MILLISECONDS);
                if (stopped || result == S.$Aborted) throw new Failure(stopped ? timedOutMessage(seconds)
                        : "the computer algebra system aborted the computation", stopped);
                if (result.isAST(S.Hold) && !e.isAST(S.Hold)) {
                    throw new Failure("the computer algebra system gave up (its recursion or iteration limit)", false);
                }
                return result;
            } catch (java.util.concurrent.TimeoutException running) {
                long cpu = w.cpu() - cpuStart, wall = System.nanoTime() - wallStart;
                if (!stopped && (cpu > budget || wall > HARD_STOP_FACTOR * budget)) {
                    stopped = true;
                    engine.stopRequest();
                    w.thread.interrupt();
                    stoppedAt = System.nanoTime();
                } else if (stopped && System.nanoTime() - stoppedAt > GRACE_NANOS) {
                    w.abandon();
                    worker = null;
                    throw new Failure(timedOutMessage(seconds), true);
                }
            } catch (java.util.concurrent.ExecutionException ex) {
                if (stopped) throw new Failure(timedOutMessage(seconds), true);
                // Not only StackOverflowError: Symja's own assertions (under -ea) throw Errors from inside an
                // evaluation, and the numeric side can still answer.
                throw new Failure("the computer algebra system gave up (" + reason(ex.getCause() == null ? ex : ex.getCause()) + ")", false);
            } catch (InterruptedException ex) {
                Thread.currentThread().interrupt();
                engine.stopRequest();
                w.thread.interrupt();
                throw new Failure("the symbolic computation was cancelled", true);
            }
        }
    }

    /** Why an evaluation threw, in words: the name of a Java class tells the user nothing. */
    static String reason(Throwable cause) {
        if (cause.getClass().getSimpleName().equals("BigIntegerLimitExceeded")) return "a number past " + Config.MAX_BIT_LENGTH + " bits";
        if (cause.getClass().getSimpleName().equals("OverflowException")) return "a number beyond the range of its arithmetic";
        if (cause instanceof ArithmeticException) return "an arithmetic error";
        if (cause instanceof StackOverflowError) return "its nesting limit";
        if (cause instanceof OutOfMemoryError) return "its memory limit";
        return "a failure inside it";
    }

    private static String timedOutMessage(double seconds) {
        return "symbolic computation ran out of its " + seconds(seconds) + " s of CPU time";
    }

    /** How much longer than the CPU budget an evaluation may take by the wall clock before it is stopped anyway. */
    static final long HARD_STOP_FACTOR = 12;
    /** How long a stopped evaluation may take to notice before its worker is abandoned. */
    private static final long GRACE_NANOS = 2_000_000_000L;
    private static final java.lang.management.ThreadMXBean THREADS = java.lang.management.ManagementFactory.getThreadMXBean();

    private Worker worker;

    /** The thread this session's evaluations run on. */
    private static final class Worker {
        final java.util.concurrent.ExecutorService pool;
        volatile Thread thread;

        /** The executor makes its one thread on the first submit, in the submitting thread: {@code thread} is set then. */
        Worker() {
            pool = java.util.concurrent.Executors.newSingleThreadExecutor(r -> {
                // Symja recurses deeply; a stack of its own keeps that off whatever the JVM's default is.
                Thread t = new Thread(null, r, "plumb-symja", 256L << 20);
                t.setDaemon(true);
                thread = t;
                return t;
            });
        }

        /** The worker's CPU time in nanoseconds (its wall time where the JVM cannot measure CPU time). */
        long cpu() {
            long t = THREADS.isThreadCpuTimeSupported() ? THREADS.getThreadCpuTime(thread.getId()) : -1;
            return t >= 0 ? t : System.nanoTime();
        }

        @SuppressWarnings({"deprecation", "removal"})
        void abandon() {
            pool.shutdownNow();
            // Arithmetic deep in a library (a huge BigInteger product) never looks at the stop request; on
            // Java 17 such a thread can still be stopped, so it does not burn a core for the rest of the run.
            try {
                thread.stop();
            } catch (UnsupportedOperationException | SecurityException notOnThisJava) {
                // Newer Java cannot stop a thread: it stays a daemon and ends with the run.
            }
        }
    }

    private Worker worker() {
        if (worker == null) worker = new Worker();
        return worker;
    }

    /** Ends this session's worker thread. */
    void close() {
        if (worker != null) worker.pool.shutdownNow();
        worker = null;
    }

    static String seconds(double s) {
        return s == Math.rint(s) ? String.valueOf((long) s) : String.valueOf(s);
    }
}
