package dev.plumb.lsp;

import java.util.List;
import java.util.Optional;
import java.util.concurrent.CompletableFuture;
import org.eclipse.lsp4j.DefinitionParams;
import org.eclipse.lsp4j.DidChangeTextDocumentParams;
import org.eclipse.lsp4j.DidCloseTextDocumentParams;
import org.eclipse.lsp4j.DidOpenTextDocumentParams;
import org.eclipse.lsp4j.DidSaveTextDocumentParams;
import org.eclipse.lsp4j.Hover;
import org.eclipse.lsp4j.HoverParams;
import org.eclipse.lsp4j.Location;
import org.eclipse.lsp4j.LocationLink;
import org.eclipse.lsp4j.MarkupContent;
import org.eclipse.lsp4j.MarkupKind;
import org.eclipse.lsp4j.Position;
import org.eclipse.lsp4j.TextDocumentContentChangeEvent;
import org.eclipse.lsp4j.jsonrpc.messages.Either;
import org.eclipse.lsp4j.services.TextDocumentService;

/**
 * The document side of the server: keeps each open {@code .plumb} document's text (the editor
 * sends it whole on every change), has it checked, and answers hovers and go-to-definition from
 * the latest text's checked model.
 */
final class PlumbTextDocuments implements TextDocumentService {

    private final DocumentChecks checks;

    PlumbTextDocuments(DocumentChecks checks) {
        this.checks = checks;
    }

    @Override
    public void didOpen(DidOpenTextDocumentParams params) {
        checks.changed(params.getTextDocument().getUri(), params.getTextDocument().getVersion(), params.getTextDocument().getText());
    }

    @Override
    public void didChange(DidChangeTextDocumentParams params) {
        List<TextDocumentContentChangeEvent> changes = params.getContentChanges();
        if (changes.isEmpty()) return;
        // Full synchronisation: the last change holds the whole new text.
        TextDocumentContentChangeEvent last = changes.get(changes.size() - 1);
        if (last.getRange() != null) return;
        checks.changed(params.getTextDocument().getUri(), params.getTextDocument().getVersion(), last.getText());
    }

    @Override
    public void didClose(DidCloseTextDocumentParams params) {
        checks.closed(params.getTextDocument().getUri());
    }

    @Override
    public void didSave(DidSaveTextDocumentParams params) {
        // The text was already sent with each change: a save changes nothing to check.
    }

    @Override
    public CompletableFuture<Hover> hover(HoverParams params) {
        return checks.query(params.getTextDocument().getUri(), rev -> target(rev, params.getPosition())
                .map(t -> new Hover(new MarkupContent(MarkupKind.MARKDOWN, t.hover())))
                .orElse(null));
    }

    @Override
    public CompletableFuture<Either<List<? extends Location>, List<? extends LocationLink>>> definition(DefinitionParams params) {
        String uri = params.getTextDocument().getUri();
        return checks.query(uri, rev -> {
            List<Location> found = target(rev, params.getPosition())
                    .filter(t -> t.declaration().line() >= 1)
                    .map(t -> List.of(new Location(uri, new SourcePositions(rev.text).range(t.declaration()))))
                    .orElse(List.of());
            return Either.<List<? extends Location>, List<? extends LocationLink>>forLeft(found);
        });
    }

    private static Optional<Navigation.Target> target(DocumentChecks.Revision rev, Position position) {
        if (rev.fast == null || rev.fast.model() == null) return Optional.empty();
        int[] at = new SourcePositions(rev.text).lineAndColumn(position);
        return new Navigation(rev.fast.model()).at(at[0], at[1]);
    }
}
