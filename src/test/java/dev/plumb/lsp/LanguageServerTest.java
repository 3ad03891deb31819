package dev.plumb.lsp;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import dev.plumb.pipeline.Analyzer;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.LinkedBlockingQueue;
import java.util.concurrent.TimeUnit;
import java.util.function.Predicate;
import org.eclipse.lsp4j.DefinitionParams;
import org.eclipse.lsp4j.Diagnostic;
import org.eclipse.lsp4j.DiagnosticSeverity;
import org.eclipse.lsp4j.DidChangeTextDocumentParams;
import org.eclipse.lsp4j.DidCloseTextDocumentParams;
import org.eclipse.lsp4j.DidOpenTextDocumentParams;
import org.eclipse.lsp4j.Hover;
import org.eclipse.lsp4j.HoverParams;
import org.eclipse.lsp4j.InitializeParams;
import org.eclipse.lsp4j.InitializeResult;
import org.eclipse.lsp4j.InitializedParams;
import org.eclipse.lsp4j.Location;
import org.eclipse.lsp4j.MessageActionItem;
import org.eclipse.lsp4j.MessageParams;
import org.eclipse.lsp4j.Position;
import org.eclipse.lsp4j.PublishDiagnosticsParams;
import org.eclipse.lsp4j.Range;
import org.eclipse.lsp4j.ShowMessageRequestParams;
import org.eclipse.lsp4j.TextDocumentContentChangeEvent;
import org.eclipse.lsp4j.TextDocumentIdentifier;
import org.eclipse.lsp4j.TextDocumentItem;
import org.eclipse.lsp4j.VersionedTextDocumentIdentifier;
import org.eclipse.lsp4j.jsonrpc.Launcher;
import org.eclipse.lsp4j.launch.LSPLauncher;
import org.eclipse.lsp4j.services.LanguageClient;
import org.eclipse.lsp4j.services.LanguageServer;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;

/**
 * Drives {@code plumb lsp} as an editor does, in this process over a pair of pipes: initialize,
 * open a document, type, hover, jump to definitions, shut down. The waits below are bounds on a
 * run that would otherwise hang, not timing assertions: a busy machine only makes them slower.
 */
class LanguageServerTest {

    private static final String URI = "file:///work/sphere.plumb";
    /** The longest a publish is waited for; the slow stages on a busy 2-core machine take a minute. */
    private static final long WAIT_SECONDS = 300;

    private final LinkedBlockingQueue<PublishDiagnosticsParams> published = new LinkedBlockingQueue<>();
    private final List<PublishDiagnosticsParams> seen = new ArrayList<>();
    private LanguageServer server;
    private CompletableFuture<Integer> serverExit;
    private Launcher<LanguageServer> client;

    private String sphere;

    @BeforeEach
    void start() throws IOException {
        sphere = Files.readString(Path.of("derivations/uniform-sphere.plumb"));
        // Channel pipes, not java.io's piped streams: a piped stream fails its reader once the thread that
        // last wrote to it has ended ("write end dead"), and the server writes from pooled threads that
        // its shutdown stops, which made the reply to 'shutdown' go missing now and then.
        java.nio.channels.Pipe up = java.nio.channels.Pipe.open();
        java.nio.channels.Pipe down = java.nio.channels.Pipe.open();
        java.io.InputStream serverIn = java.nio.channels.Channels.newInputStream(up.source());
        java.io.OutputStream toServer = java.nio.channels.Channels.newOutputStream(up.sink());
        java.io.InputStream clientIn = java.nio.channels.Channels.newInputStream(down.source());
        java.io.OutputStream toClient = java.nio.channels.Channels.newOutputStream(down.sink());
        Analyzer analyzer = new Analyzer(Analyzer.Options.defaults());
        // On a thread of its own: the common pool has one worker on two cores, and the server blocks for its lifetime.
        serverExit = new CompletableFuture<>();
        Thread serving = new Thread(() -> {
            try {
                serverExit.complete(PlumbLanguageServer.serve(analyzer, serverIn, toClient, false));
            } catch (Throwable t) {
                serverExit.completeExceptionally(t);
            }
        }, "test-lsp-server");
        serving.setDaemon(true);
        serving.start();
        client = LSPLauncher.createClientLauncher(new Editor(), clientIn, toServer);
        client.startListening();
        server = client.getRemoteProxy();
    }

    @AfterEach
    void stop() {
        serverExit.cancel(true);
    }

    /** A client that records what the server publishes. */
    private final class Editor implements LanguageClient {
        @Override
        public void publishDiagnostics(PublishDiagnosticsParams p) {
            published.add(p);
        }

        @Override
        public void telemetryEvent(Object object) {
        }

        @Override
        public void showMessage(MessageParams p) {
        }

        @Override
        public CompletableFuture<MessageActionItem> showMessageRequest(ShowMessageRequestParams p) {
            return CompletableFuture.completedFuture(null);
        }

        @Override
        public void logMessage(MessageParams p) {
        }
    }

    private InitializeResult initialize() throws Exception {
        InitializeResult result = server.initialize(new InitializeParams()).get(WAIT_SECONDS, TimeUnit.SECONDS);
        server.initialized(new InitializedParams());
        return result;
    }

    private void open(String text) {
        server.getTextDocumentService().didOpen(new DidOpenTextDocumentParams(new TextDocumentItem(URI, "plumb", 1, text)));
    }

    private void change(int version, String text) {
        server.getTextDocumentService().didChange(new DidChangeTextDocumentParams(
                new VersionedTextDocumentIdentifier(URI, version), List.of(new TextDocumentContentChangeEvent(text))));
    }

    /** Waits for the first publish that {@code wanted} accepts, keeping every publish seen on the way. */
    private PublishDiagnosticsParams await(String what, Predicate<PublishDiagnosticsParams> wanted) throws InterruptedException {
        long end = System.nanoTime() + TimeUnit.SECONDS.toNanos(WAIT_SECONDS);
        while (System.nanoTime() < end) {
            PublishDiagnosticsParams p = published.poll(1, TimeUnit.SECONDS);
            if (p == null) continue;
            seen.add(p);
            if (wanted.test(p)) return p;
        }
        fail("no publish " + what + "; seen: " + seen);
        return null;
    }

    private static boolean isVerdicts(PublishDiagnosticsParams p, int version) {
        return version(p) == version && p.getDiagnostics().stream().anyMatch(d -> "claim".equals(code(d)));
    }

    private static int version(PublishDiagnosticsParams p) {
        return p.getVersion() == null ? -1 : p.getVersion();
    }

    private static String code(Diagnostic d) {
        return d.getCode() == null ? null : d.getCode().getLeft();
    }

    private static Range range(int line, int from, int to) {
        return new Range(new Position(line, from), new Position(line, to));
    }

    private Hover hover(int line, int character) throws Exception {
        return server.getTextDocumentService().hover(new HoverParams(new TextDocumentIdentifier(URI), new Position(line, character)))
                .get(WAIT_SECONDS, TimeUnit.SECONDS);
    }

    private List<? extends Location> definition(int line, int character) throws Exception {
        return server.getTextDocumentService().definition(new DefinitionParams(new TextDocumentIdentifier(URI), new Position(line, character)))
                .get(WAIT_SECONDS, TimeUnit.SECONDS).getLeft();
    }

    @Test
    void aUnitErrorIsShownAtItsRangeAndClearsWhenTheLineIsFixed() throws Exception {
        InitializeResult init = initialize();
        assertTrue(init.getCapabilities().getHoverProvider().getLeft());
        assertTrue(init.getCapabilities().getDefinitionProvider().getLeft());

        // The shipped sphere with the r^2 of the balance (line 11) turned into r.
        String wrong = sphere.replace("relation balance: P'(r) = -G*m(r)*rho/r^2", "relation balance: P'(r) = -G*m(r)*rho/r");
        assertFalse(wrong.equals(sphere));
        open(wrong);
        PublishDiagnosticsParams first = await("with the unit error", p -> version(p) == 1
                && p.getDiagnostics().stream().anyMatch(d -> d.getSeverity() == DiagnosticSeverity.Error));
        Diagnostic error = first.getDiagnostics().stream().filter(d -> d.getSeverity() == DiagnosticSeverity.Error).findFirst().get();
        assertTrue(error.getMessage().startsWith("the two sides of relation 'balance' have different units"), error.getMessage());
        assertTrue(error.getMessage().contains("is a 1/r missing on the right"), error.getMessage());
        assertEquals("plumb", error.getSource());
        // "relation balance: P'(r) = -G*m(r)*rho/r": the right side, 0-based line 10, characters 26 to 39.
        assertEquals(range(10, 26, 39), error.getRange());

        change(2, sphere);
        PublishDiagnosticsParams fixed = await("for the fixed text", p -> version(p) == 2);
        assertEquals(List.of(), fixed.getDiagnostics(), "the fast stages find nothing wrong in the fixed text");

        // Then the slow stages' verdicts, each at its statement's label.
        PublishDiagnosticsParams verdicts = await("with the verdicts of version 2", p -> isVerdicts(p, 2));
        Diagnostic central = verdicts.getDiagnostics().stream().filter(d -> d.getMessage().startsWith("claim 'central' holds")).findFirst()
                .orElseThrow(() -> new AssertionError(verdicts.getDiagnostics().toString()));
        assertEquals(DiagnosticSeverity.Information, central.getSeverity());
        assertEquals(range(15, 6, 13), central.getRange(), "the label 'central' on line 16");
        assertTrue(verdicts.getDiagnostics().stream().anyMatch(d -> d.getMessage().startsWith("expect 'sun_value' holds")
                && d.getRange().getStart().getLine() == 20), verdicts.getDiagnostics().toString());
        assertTrue(verdicts.getDiagnostics().stream().anyMatch(d -> d.getMessage().startsWith("scaling 'central_scaling' holds")),
                verdicts.getDiagnostics().toString());
        assertTrue(verdicts.getDiagnostics().stream().noneMatch(d -> d.getSeverity() == DiagnosticSeverity.Error),
                verdicts.getDiagnostics().toString());

        shutDown();
    }

    @Test
    void aWrongClaimIsAnErrorAtItsLabelAndAnOlderTextIsNeverPublishedAfterANewerOne() throws Exception {
        initialize();
        open(sphere);
        await("of version 1", p -> version(p) == 1);
        // Typed quickly: version 2 doubles the claim, version 3 keeps it doubled and changes a comment.
        String doubled = sphere.replace("claim central: P(0) = 3/(8*pi)*G*M^2/R^4", "claim central: P(0) = 3/(4*pi)*G*M^2/R^4");
        assertFalse(doubled.equals(sphere));
        change(2, doubled);
        change(3, doubled + "# typed after the claim\n");
        PublishDiagnosticsParams verdicts = await("with the verdicts of version 3", p -> isVerdicts(p, 3));
        Diagnostic central = verdicts.getDiagnostics().stream().filter(d -> d.getMessage().startsWith("claim 'central' fails")).findFirst()
                .orElseThrow(() -> new AssertionError(verdicts.getDiagnostics().toString()));
        assertEquals(DiagnosticSeverity.Error, central.getSeverity());
        assertTrue(central.getMessage().contains("claimed/true = 2"), central.getMessage());
        int newest = 0;
        for (PublishDiagnosticsParams p : seen) {
            assertTrue(version(p) >= newest, "version " + version(p) + " published after version " + newest + ": " + seen);
            newest = version(p);
        }

        server.getTextDocumentService().didClose(new DidCloseTextDocumentParams(new TextDocumentIdentifier(URI)));
        PublishDiagnosticsParams cleared = await("clearing the closed document", p -> p.getDiagnostics().isEmpty() && p.getVersion() == null);
        assertEquals(URI, cleared.getUri());
        shutDown();
    }

    @Test
    void hoverShowsUnitDimensionAndDeclarationAndDefinitionJumpsToTheName() throws Exception {
        initialize();
        open(sphere);
        await("of version 1", p -> version(p) == 1);

        // Line 11 (0-based 10): "relation balance: P'(r) = -G*m(r)*rho/r^2"; 'rho' at characters 34-37.
        Hover rho = hover(10, 35);
        assertNotNull(rho);
        String text = rho.getContents().getRight().getValue();
        assertTrue(text.contains("**rho** · definition"), text);
        assertTrue(text.contains("unit: `kg/m^3` (from its definition)"), text);
        assertTrue(text.contains("dimension: M L^-3"), text);
        assertTrue(text.contains("declared on line 7: `let rho = M / (4/3*pi*R^3)`"), text);

        String pressure = hover(10, 18).getContents().getRight().getValue();
        assertTrue(pressure.contains("**P** · unknown profile") && pressure.contains("unit: `Pa`")
                && pressure.contains("dimension: M L^-1 T^-2") && pressure.contains("declared on line 10: `unknown P(r) [Pa]`"), pressure);

        String gravity = hover(10, 27).getContents().getRight().getValue();
        assertTrue(gravity.contains("**G** · built-in constant") && gravity.contains("6.6743E-11"), gravity);

        // 'm' in the balance (character 29) is declared on 0-based line 7 by "let m(r) = ...", the name at 4.
        assertEquals(List.of(new Location(URI, range(7, 4, 5))), definition(10, 29));
        // 'r' in the body of m ("let m(r) = 4/3*pi*r^3*rho", the r at 18) is m's own parameter, at 6.
        assertEquals(List.of(new Location(URI, range(7, 6, 7))), definition(7, 18));
        // 'R' in the coordinate's interval ("coord r [m] from 0 to R", 0-based line 4) is the parameter of line 3.
        assertEquals(List.of(new Location(URI, range(3, 6, 7))), definition(4, 22));
        // 'sun' after 'at' in the expectation (0-based line 20) is the label of the case on line 18.
        int at = sphere.lines().toList().get(20).indexOf("at sun") + 3;
        assertEquals(List.of(new Location(URI, range(18, 5, 8))), definition(20, at));
        // A built-in constant has no declaration to jump to; a label is not a name.
        assertEquals(List.of(), definition(10, 27));
        assertEquals(List.of(), definition(10, 12));

        shutDown();
    }

    private void shutDown() throws Exception {
        server.shutdown().get(WAIT_SECONDS, TimeUnit.SECONDS);
        server.exit();
        assertEquals(0, serverExit.get(WAIT_SECONDS, TimeUnit.SECONDS), "exit after shutdown is status 0");
    }
}
