package dev.plumb.pipeline;

import dev.plumb.lang.Diagnostics;
import dev.plumb.lang.Expr;
import dev.plumb.lang.Program;
import dev.plumb.lang.SourceFile;
import dev.plumb.lang.Span;
import dev.plumb.lang.Stmt;
import dev.plumb.model.Check;
import dev.plumb.model.Checker;
import dev.plumb.model.Model;
import dev.plumb.model.Status;
import dev.plumb.numeric.CaseResult;
import dev.plumb.numeric.NumericEngine;
import dev.plumb.numeric.NumericOptions;
import dev.plumb.numeric.NumericResult;
import dev.plumb.report.Analysis;
import dev.plumb.scaling.ScaleLength;
import dev.plumb.scaling.ScalingChecker;
import dev.plumb.symbolic.Derived;
import dev.plumb.symbolic.SymbolicEngine;
import dev.plumb.symbolic.SymbolicOptions;
import dev.plumb.symbolic.SymbolicResult;
import dev.plumb.units.UnitCatalog;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.function.Supplier;

/** Runs the stages in order on one file: text, syntax tree, checked model, verdicts, report data. */
public final class Analyzer {

    /**
     * Options shared by every command that analyses files. {@code deadline} is the {@link System#nanoTime}
     * by which the whole run must end ({@link Long#MAX_VALUE} for none): a stage not started by then is
     * skipped and its checks are undecided, with a located failure saying so. With {@code debug} a stage
     * that stops on a defect prints its stack trace to standard error.
     */
    public record Options(double symbolicTimeoutSeconds, boolean profiles, long deadline, double timeoutSeconds, boolean debug,
                          Listener listener) {
        public Options(double symbolicTimeoutSeconds, boolean profiles) {
            this(symbolicTimeoutSeconds, profiles, Long.MAX_VALUE, 0, false, Listener.NONE);
        }

        public static Options defaults() {
            return new Options(5.0, false);
        }

        boolean expired() {
            return deadline != Long.MAX_VALUE && System.nanoTime() - deadline > 0;
        }

        /** The per-computation symbolic limit, shortened to the time the run has left. */
        double symbolicSeconds() {
            if (deadline == Long.MAX_VALUE) return symbolicTimeoutSeconds;
            double left = (deadline - System.nanoTime()) / 1e9;
            return Math.max(0.05, Math.min(symbolicTimeoutSeconds, left));
        }
    }

    /** Told what the analysis is doing, for a progress line and for results shown as they come. */
    public interface Listener {
        Listener NONE = new Listener() { };

        /** A stage (or a case or sweep within the numeric stage) starts. */
        default void stage(String file, String what) { }

        /** Units are checked and the file has no message at all: its unit checks are final. */
        default void unitsChecked(Model model, List<Check> unitChecks) { }

        /** The file's analysis is complete. */
        default void finished(String file) { }
    }

    private final Options options;
    /** The file being analysed, for the listener. */
    private volatile String current = "";
    private final java.util.function.BooleanSupplier cancelled;

    public Analyzer(Options options) {
        this(options, () -> false);
    }

    private Analyzer(Options options, java.util.function.BooleanSupplier cancelled) {
        this.options = options;
        this.cancelled = cancelled;
    }

    /**
     * Thrown out of {@link #analyze(SourceFile)} between two stages when the run was cancelled (its
     * thread interrupted, or the condition of {@link #cancelledWhen} true): the partial results are
     * dropped whole, so no caller can show a half-finished analysis as if it were the file's.
     */
    public static final class Cancelled extends java.util.concurrent.CancellationException {
        Cancelled() {
            super("the analysis was cancelled");
        }
    }

    /**
     * The same analyzer, whose runs stop at the next stage boundary once {@code cancelled} says so or
     * their thread is interrupted (an interrupt also stops a running computer-algebra call).
     */
    public Analyzer cancelledWhen(java.util.function.BooleanSupplier cancelled) {
        return new Analyzer(options, cancelled);
    }

    /**
     * Only the fast stages, for feedback while typing: parse and check units. The analysis holds the
     * model, the syntax and unit diagnostics and the unit checks; no derivation, case or scaling.
     */
    public Analysis diagnose(SourceFile source) {
        Diagnostics diagnostics = new Diagnostics();
        Program program = Parser.parse(source, diagnostics);
        Model model = Checker.check(program, diagnostics);
        return new Analysis(source, model, model.diagnostics(), model.unitChecks(), List.of(), List.of(), List.of(), List.of());
    }

    private boolean isCancelled() {
        return Thread.currentThread().isInterrupted() || cancelled.getAsBoolean();
    }

    public Analysis analyze(Path path) {
        if (Files.isDirectory(path)) return unreadable(path, Span.NONE, "this is a directory, not a plumb file");
        byte[] bytes;
        try {
            bytes = Files.readAllBytes(path);
        } catch (NoSuchFileException e) {
            return unreadable(path, Span.NONE, "no such file");
        } catch (java.nio.file.AccessDeniedException e) {
            return unreadable(path, Span.NONE, "cannot read the file: permission denied");
        } catch (IOException | OutOfMemoryError e) {
            return unreadable(path, Span.NONE, "cannot read the file: " + (e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage()));
        }
        return analyze(path.toString(), bytes);
    }

    /** Analyses text given as bytes (a file's, or standard input's for {@code check -}), named {@code name} in messages. */
    public Analysis analyze(String name, byte[] bytes) {
        java.nio.ByteBuffer in = java.nio.ByteBuffer.wrap(bytes);
        java.nio.CharBuffer text = java.nio.CharBuffer.allocate(bytes.length + 1);
        java.nio.charset.CharsetDecoder decoder = StandardCharsets.UTF_8.newDecoder();
        java.nio.charset.CoderResult result = decoder.decode(in, text, true);
        if (result.isError()) {
            // Located at the first byte that is not UTF-8, counted in lines and characters decoded so far.
            // Line endings are read as SourceFile reads them (a lone CR ends a line too), so the place is where an editor shows it.
            String before = new SourceFile(name, text.flip().toString()).text();
            int line = 1 + (int) before.chars().filter(c -> c == '\n').count();
            int column = before.length() - (before.lastIndexOf('\n') + 1) + 1;
            return unreadable(new SourceFile(name, before), Span.at(line, column, 1), String.format(java.util.Locale.ROOT,
                    "the %s is not UTF-8 text (byte 0x%02X cannot start or continue a UTF-8 character); save it as UTF-8",
                    name.equals("<stdin>") ? "input" : "file", bytes[in.position()] & 0xFF));
        }
        decoder.flush(text);
        return analyze(new SourceFile(name, text.flip().toString()));
    }

    public Analysis analyze(SourceFile source) {
        Diagnostics diagnostics = new Diagnostics();
        Program program = Parser.parse(source, diagnostics);
        Model model = Checker.check(program, diagnostics);
        List<Check> checks = new ArrayList<>(model.unitChecks());
        List<String> notes = new ArrayList<>();
        List<Analysis.DerivedForm> derived = new ArrayList<>();
        List<String> scales = List.of();
        List<Analysis.CaseTable> tables = new ArrayList<>();
        List<dev.plumb.lang.Diagnostic> found = new ArrayList<>(model.diagnostics());
        List<dev.plumb.numeric.Sequences.Result> sweeps = new ArrayList<>();
        List<String> skipped = new ArrayList<>();
        String file = source.path();
        current = file;
        if (!diagnostics.hasInputErrors() && model.diagnostics().isEmpty()) options.listener().unitsChecked(model, model.unitChecks());
        if (!diagnostics.hasInputErrors()) {
            Map<String, Expr> closedForms = new LinkedHashMap<>();
            SymbolicResult symbolic = guarded(skipped, "symbolic", notes, () -> SymbolicEngine.analyze(model,
                    new SymbolicOptions(options.symbolicSeconds())));
            if (symbolic != null) {
                checks.addAll(symbolic.checks());
                notes.addAll(symbolic.notes());
                for (Derived d : symbolic.derived()) {
                    closedForms.put(d.expr(), d.closedForm());
                    derived.add(new Analysis.DerivedForm(d.expr(), d.printed(), UnitCatalog.siName(d.dimension()), d.closedForm(),
                            d.trail().stream().map(t -> new Analysis.TrailEntry(t.action(), t.result())).toList()));
                }
            } else {
                undecided(model, checks, options.expired() ? "not reached within the run's --timeout" : "the symbolic engine stopped on this file");
            }
            CaseAnalysis cases = new CaseAnalysis(model, closedForms, notes);
            NumericResult numeric = guarded(skipped, "numeric", notes, () -> NumericEngine.run(model, closedForms, NumericOptions.defaults(),
                    what -> options.listener().stage(file, "numeric: " + what)));
            if (numeric != null) {
                checks.addAll(numeric.checks());
                notes.addAll(numeric.notes());
                found.addAll(numeric.diagnostics());
                sweeps.addAll(numeric.sequences());
                for (CaseResult c : numeric.cases()) {
                    Analysis.CaseTable t = guarded(skipped, "case table", notes, () -> cases.table(c, options.profiles()));
                    if (t != null) tables.add(t);
                }
            } else {
                for (Stmt.Expect e : model.expects()) {
                    checks.add(Check.of("expect", label(e.label(), e.span()), e.span(), Status.UNDECIDED,
                            options.expired() ? "not reached within the run's --timeout" : "the numeric engine stopped on this file"));
                }
            }
            guarded(skipped, "numeric identity", notes, () -> {
                decideByNumbers(model, checks, closedForms);
                return null;
            });
            List<Check> scaling = guarded(skipped, "scaling", notes, () -> new ScalingChecker(model, closedForms, cases::numericQuantity).checkAll());
            if (scaling != null) {
                checks.addAll(scaling);
            } else {
                for (Stmt.Scaling sc : model.scalings()) {
                    checks.add(Check.of("scaling", label(sc.label(), sc.span()), sc.span(), Status.UNDECIDED,
                            options.expired() ? "not reached within the run's --timeout" : "the scaling stage stopped on this file"));
                }
            }
            List<String> lengths = guarded(skipped, "scale lengths", notes, () -> ScaleLength.find(model).stream().map(ScaleLength::describe).toList());
            if (lengths != null) scales = lengths;
        }
        if (!skipped.isEmpty()) {
            found.add(dev.plumb.lang.Diagnostic.failure(Span.at(1, 1, 1), "the run reached its --timeout of "
                    + Double.toString(options.timeoutSeconds()).replaceAll("\\.0$", "") + " s before the " + String.join(", ", skipped)
                    + " stage" + (skipped.size() > 1 ? "s" : "") + " on this file; their checks are undecided", "give more time with --timeout SECONDS"));
        }
        found.sort(java.util.Comparator.comparingInt((dev.plumb.lang.Diagnostic d) -> d.span().line())
                .thenComparingInt(d -> d.span().column()));
        options.listener().finished(file);
        return new Analysis(source, model, found, checks, derived, tables, scales, notes, sweeps);
    }

    /**
     * Runs one stage so that a defect inside it costs only that stage's verdicts: the run goes on,
     * and the note says which stage stopped and why (no stack trace reaches the user).
     */
    private <T> T guarded(List<String> skipped, String stage, List<String> notes, Supplier<T> work) {
        if (isCancelled()) throw new Cancelled();
        if (options.expired()) {
            if (!skipped.contains(stage)) skipped.add(stage);
            notes.add("the " + stage + " stage was not reached within the --timeout of "
                    + Double.toString(options.timeoutSeconds()).replaceAll("\\.0$", "") + " s; its checks are undecided");
            return null;
        }
        options.listener().stage(current, stage);
        try {
            return work.get();
        } catch (RuntimeException | StackOverflowError | OutOfMemoryError e) {
            // A stage that stopped because the run was cancelled has no defect to report.
            if (e instanceof Cancelled || isCancelled()) throw new Cancelled();
            if (options.debug()) e.printStackTrace();
            notes.add("the " + stage + " stage stopped on this file (" + e.getClass().getSimpleName()
                    + (e.getMessage() == null ? "" : ": " + e.getMessage()) + "); its checks are undecided. Please report this.");
            return null;
        }
    }

    /**
     * Gives each claim and step the symbolic side left undecided to the numeric identity test over the
     * parameter domain, which decides it when the relations solve there.
     */
    private static void decideByNumbers(Model model, List<Check> checks, Map<String, Expr> closedForms) {
        Map<Span, Stmt.Equation> equations = new java.util.HashMap<>();
        for (Stmt.Claim c : model.claims()) equations.put(c.span(), c.equation());
        for (Stmt.Step s : model.steps()) equations.put(s.span(), s.equation());
        for (int i = 0; i < checks.size(); i++) {
            Check c = checks.get(i);
            if (!c.kind().equals("claim") && !c.kind().equals("step") || c.status() != Status.UNDECIDED) continue;
            Stmt.Equation eq = equations.get(c.span());
            if (eq == null) continue;
            Check decided = dev.plumb.numeric.NumericIdentity.decide(model, c.kind(), c.label(), eq, c.span(), closedForms);
            if (decided != null) {
                checks.set(i, decided.with("symbolic", c.message()));
            }
        }
    }

    private static void undecided(Model model, List<Check> checks, String why) {
        for (Stmt.Step s : model.steps()) checks.add(Check.of("step", label(s.label(), s.span()), s.span(), Status.UNDECIDED, why));
        for (Stmt.Claim c : model.claims()) checks.add(Check.of("claim", label(c.label(), c.span()), c.span(), Status.UNDECIDED, why));
    }

    private static String label(Stmt.Label l, Span span) {
        return l.present() ? l.name() : "line " + span.line();
    }

    private static Analysis unreadable(Path path, Span where, String why) {
        return unreadable(new SourceFile(path.toString(), ""), where, why);
    }

    /** An analysis that stops at the text: {@code source} holds what could be read (quoted under the message). */
    private static Analysis unreadable(SourceFile source, Span where, String why) {
        Diagnostics d = new Diagnostics();
        d.error(where, why);
        return new Analysis(source, null, d.sorted(), List.of(), List.of(), List.of(), List.of(), List.of());
    }

    private static final class Parser {
        static Program parse(SourceFile s, Diagnostics d) {
            return dev.plumb.lang.Parser.parse(s, d);
        }
    }
}
