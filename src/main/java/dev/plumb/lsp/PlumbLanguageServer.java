package dev.plumb.lsp;

import dev.plumb.pipeline.Analyzer;
import java.io.InputStream;
import java.io.OutputStream;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.Future;
import org.eclipse.lsp4j.DidChangeConfigurationParams;
import org.eclipse.lsp4j.DidChangeWatchedFilesParams;
import org.eclipse.lsp4j.InitializeParams;
import org.eclipse.lsp4j.InitializeResult;
import org.eclipse.lsp4j.ServerCapabilities;
import org.eclipse.lsp4j.ServerInfo;
import org.eclipse.lsp4j.TextDocumentSyncKind;
import org.eclipse.lsp4j.TextDocumentSyncOptions;
import org.eclipse.lsp4j.jsonrpc.Launcher;
import org.eclipse.lsp4j.launch.LSPLauncher;
import org.eclipse.lsp4j.services.LanguageClient;
import org.eclipse.lsp4j.services.LanguageClientAware;
import org.eclipse.lsp4j.services.LanguageServer;
import org.eclipse.lsp4j.services.TextDocumentService;
import org.eclipse.lsp4j.services.WorkspaceService;

/**
 * The plumb language server: for each open {@code .plumb} document, the syntax and unit messages
 * as the text changes, then the verdicts of the slower stages; hovers with a name's unit,
 * dimension and declaration; go-to-definition. The editor sends whole texts (full
 * synchronisation).
 */
public final class PlumbLanguageServer implements LanguageServer, LanguageClientAware {

    /** How long a text must stay unchanged before the slow stages start on it, in milliseconds. */
    static final long SETTLE_MILLIS = 250;

    private final DocumentChecks checks;
    private final PlumbTextDocuments documents;
    private final CompletableFuture<Integer> exited = new CompletableFuture<>();
    private volatile LanguageClient client;
    private volatile boolean shutdown;

    public PlumbLanguageServer(Analyzer analyzer, boolean debug) {
        this.checks = new DocumentChecks(analyzer, p -> {
            LanguageClient c = client;
            if (c != null) c.publishDiagnostics(p);
        }, SETTLE_MILLIS, debug);
        this.documents = new PlumbTextDocuments(checks);
    }

    /**
     * Serves the protocol on {@code in} and {@code out} until the editor sends {@code exit} or closes
     * the input, and returns the exit status the protocol asks for: 0 after a {@code shutdown}
     * request, 1 without one. With {@code debug}, stack traces of defects go to standard error.
     */
    public static int serve(Analyzer analyzer, InputStream in, OutputStream out, boolean debug) {
        PlumbLanguageServer server = new PlumbLanguageServer(analyzer, debug);
        Launcher<LanguageClient> launcher = LSPLauncher.createServerLauncher(server, in, out);
        server.connect(launcher.getRemoteProxy());
        Future<Void> listening = launcher.startListening();
        Thread endOfInput = new Thread(() -> {
            try {
                listening.get();
            } catch (InterruptedException | ExecutionException | java.util.concurrent.CancellationException e) {
                // the input ended either way
            }
            server.exited.complete(server.shutdown ? 0 : 1);
        }, "plumb-lsp-input");
        endOfInput.setDaemon(true);
        endOfInput.start();
        int status = server.exited.join();
        listening.cancel(true);
        server.checks.close();
        return status;
    }

    @Override
    public void connect(LanguageClient client) {
        this.client = client;
    }

    @Override
    public CompletableFuture<InitializeResult> initialize(InitializeParams params) {
        ServerCapabilities capabilities = new ServerCapabilities();
        TextDocumentSyncOptions sync = new TextDocumentSyncOptions();
        sync.setOpenClose(true);
        sync.setChange(TextDocumentSyncKind.Full);
        capabilities.setTextDocumentSync(sync);
        capabilities.setHoverProvider(true);
        capabilities.setDefinitionProvider(true);
        return CompletableFuture.completedFuture(new InitializeResult(capabilities, new ServerInfo("plumb", version())));
    }

    private static String version() {
        String v = PlumbLanguageServer.class.getPackage().getImplementationVersion();
        return v == null ? "0.1.0" : v;
    }

    @Override
    public CompletableFuture<Object> shutdown() {
        shutdown = true;
        checks.close();
        return CompletableFuture.completedFuture(null);
    }

    @Override
    public void exit() {
        exited.complete(shutdown ? 0 : 1);
    }

    @Override
    public TextDocumentService getTextDocumentService() {
        return documents;
    }

    @Override
    public WorkspaceService getWorkspaceService() {
        return workspace;
    }

    private final WorkspaceService workspace = new WorkspaceService() {
        @Override
        public void didChangeConfiguration(DidChangeConfigurationParams params) {
            // plumb has no settings an editor can change
        }

        @Override
        public void didChangeWatchedFiles(DidChangeWatchedFilesParams params) {
            // open documents are checked from the editor's text, not from the disk
        }
    };
}
