package dev.plumb.lsp;

import dev.plumb.lang.SourceFile;
import dev.plumb.pipeline.Analyzer;
import dev.plumb.report.Analysis;
import java.util.List;
import java.util.Map;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.ThreadFactory;
import java.util.concurrent.TimeUnit;
import java.util.function.Consumer;
import java.util.function.Function;
import org.eclipse.lsp4j.PublishDiagnosticsParams;

/**
 * Checks the open documents as they change and publishes what it finds. Each new text is parsed
 * and unit-checked at once on one thread (milliseconds), and its messages published; the slower
 * stages (derivation, cases, scaling) then run on a second thread, a moment after the typing
 * stops, and their verdicts are published with the messages. A newer text of a document
 * supersedes the older one: the older one's slow run is cancelled (at its next stage, and its
 * running algebra call interrupted), and nothing computed for a text that is no longer the latest
 * is ever published.
 */
final class DocumentChecks implements AutoCloseable {

    /** One text of one document, as the editor sent it. */
    static final class Revision {
        final String uri;
        final Integer version;
        final String text;
        /** The fast stages' result, set on the fast thread before anything else reads it. */
        volatile Analysis fast;

        Revision(String uri, Integer version, String text) {
            this.uri = uri;
            this.version = version;
            this.text = text;
        }

        SourceFile source() {
            return new SourceFile(displayName(uri), text);
        }
    }

    /** A document's latest text and the slow run scheduled or running for it; guarded by itself. */
    private static final class Document {
        Revision latest;
        Future<?> slow;
    }

    private final Map<String, Document> documents = new ConcurrentHashMap<>();
    private final Analyzer analyzer;
    private final Consumer<PublishDiagnosticsParams> publish;
    private final long settleMillis;
    private final boolean debug;
    private final ExecutorService fast = Executors.newSingleThreadExecutor(named("plumb-lsp-units"));
    private final ScheduledExecutorService slow = Executors.newSingleThreadScheduledExecutor(named("plumb-lsp-checks"));

    /**
     * @param publish       sends diagnostics to the editor (called from the two checking threads)
     * @param settleMillis  how long a text must stay the latest before the slow stages start on it
     * @param debug         print the stack trace of a defect that stops a check to standard error
     */
    DocumentChecks(Analyzer analyzer, Consumer<PublishDiagnosticsParams> publish, long settleMillis, boolean debug) {
        this.analyzer = analyzer;
        this.publish = publish;
        this.settleMillis = settleMillis;
        this.debug = debug;
    }

    private static ThreadFactory named(String name) {
        return r -> {
            // The algebra and the integrators recurse deeply: a stack as large as the command line's.
            Thread t = new Thread(null, r, name, 16L << 20);
            t.setDaemon(true);
            return t;
        };
    }

    /** A document was opened or changed: check its new text. */
    void changed(String uri, Integer version, String text) {
        Revision rev = new Revision(uri, version, text);
        Document d = documents.computeIfAbsent(uri, u -> new Document());
        synchronized (d) {
            d.latest = rev;
            if (d.slow != null) d.slow.cancel(true);
            d.slow = null;
        }
        fast.execute(() -> checkFast(d, rev));
    }

    /** A document was closed: stop checking it and clear what was shown for it. */
    void closed(String uri) {
        Document d = documents.remove(uri);
        if (d == null) return;
        synchronized (d) {
            d.latest = null;
            if (d.slow != null) d.slow.cancel(true);
            d.slow = null;
        }
        publish.accept(new PublishDiagnosticsParams(uri, List.of()));
    }

    /**
     * Runs {@code query} on the fast stages' result for the document's latest text, after every
     * change already received has been checked (so a hover right after typing sees the new text).
     */
    <T> CompletableFuture<T> query(String uri, Function<Revision, T> query) {
        return CompletableFuture.supplyAsync(() -> {
            Document d = documents.get(uri);
            Revision rev;
            if (d == null) return null;
            synchronized (d) {
                rev = d.latest;
            }
            if (rev == null) return null;
            if (rev.fast == null) rev.fast = analyzer.diagnose(rev.source());
            return query.apply(rev);
        }, fast);
    }

    private void checkFast(Document d, Revision rev) {
        if (!isLatest(d, rev)) return;
        try {
            rev.fast = analyzer.diagnose(rev.source());
        } catch (RuntimeException | StackOverflowError e) {
            // A defect in the checker must not take the server down: the document goes unchecked.
            if (debug) e.printStackTrace();
            return;
        }
        SourcePositions positions = new SourcePositions(rev.text);
        synchronized (d) {
            if (d.latest != rev) return;
            publish.accept(new PublishDiagnosticsParams(rev.uri, Findings.messages(rev.fast, positions), rev.version));
            // With syntax or unknown-name errors the slow stages have nothing to work on.
            if (!rev.fast.hasInputErrors()) {
                d.slow = slow.schedule(() -> checkSlow(d, rev), settleMillis, TimeUnit.MILLISECONDS);
            }
        }
    }

    private void checkSlow(Document d, Revision rev) {
        if (!isLatest(d, rev)) return;
        Analysis full;
        try {
            full = analyzer.cancelledWhen(() -> !isLatest(d, rev)).analyze(rev.source());
        } catch (Analyzer.Cancelled superseded) {
            return;
        } catch (RuntimeException | StackOverflowError e) {
            // Each stage guards itself; this is a defect outside them. The fast stages' messages stay shown.
            if (debug) e.printStackTrace();
            return;
        }
        SourcePositions positions = new SourcePositions(rev.text);
        synchronized (d) {
            if (d.latest != rev) return;
            publish.accept(new PublishDiagnosticsParams(rev.uri, Findings.messagesAndVerdicts(full, positions), rev.version));
        }
    }

    private static boolean isLatest(Document d, Revision rev) {
        synchronized (d) {
            return d.latest == rev;
        }
    }

    /** The name messages use for a document: its file path for a file, else its URI. */
    static String displayName(String uri) {
        try {
            java.net.URI u = java.net.URI.create(uri);
            if ("file".equals(u.getScheme())) return java.nio.file.Path.of(u).toString();
        } catch (RuntimeException notAFilePath) {
            // an editor's untitled buffer, say: shown by its URI
        }
        return uri;
    }

    @Override
    public void close() {
        fast.shutdownNow();
        slow.shutdownNow();
    }
}
