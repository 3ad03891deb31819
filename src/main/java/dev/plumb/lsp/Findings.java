package dev.plumb.lsp;

import dev.plumb.lang.Span;
import dev.plumb.lang.Stmt;
import dev.plumb.model.Check;
import dev.plumb.report.Analysis;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.eclipse.lsp4j.Diagnostic;
import org.eclipse.lsp4j.DiagnosticSeverity;

/**
 * An analysis as the editor shows it: each located message of plumb, and each verdict of a
 * step, claim, scaling, expectation (and of any other check but the unit checks, whose failures
 * are messages already) as a diagnostic at its statement's label: Information for holds, Error for
 * fails, Warning for undecided.
 */
final class Findings {

    static final String SOURCE = "plumb";

    private Findings() {
    }

    /** The located messages only: what the fast stages (syntax and units) found. */
    static List<Diagnostic> messages(Analysis a, SourcePositions positions) {
        List<Diagnostic> out = new ArrayList<>();
        for (dev.plumb.lang.Diagnostic d : a.diagnostics()) {
            Diagnostic lsp = new Diagnostic(positions.range(d.span()), d.details().isEmpty() ? d.message()
                    : d.message() + "\n" + String.join("\n", d.details()), severity(d.severity()), SOURCE);
            out.add(lsp);
        }
        return out;
    }

    /** The messages and every verdict but those of the unit checks. */
    static List<Diagnostic> messagesAndVerdicts(Analysis a, SourcePositions positions) {
        List<Diagnostic> out = messages(a, positions);
        Map<Span, Span> labels = labelSpans(a);
        for (Check c : a.checks()) {
            if (c.kind().equals("units")) continue;
            String message = c.kind() + " '" + c.label() + "' " + c.status().word() + ": " + c.message()
                    + (c.factor() != null && !c.message().contains("factor") ? " (factor " + c.factor() + ")" : "");
            Diagnostic lsp = new Diagnostic(positions.range(labels.getOrDefault(c.span(), c.span())), message, switch (c.status()) {
                case HOLDS -> DiagnosticSeverity.Information;
                case FAILS -> DiagnosticSeverity.Error;
                case UNDECIDED -> DiagnosticSeverity.Warning;
                case NOT_EVALUATED -> DiagnosticSeverity.Hint;
            }, SOURCE);
            lsp.setCode(c.kind());
            out.add(lsp);
        }
        return out;
    }

    private static DiagnosticSeverity severity(dev.plumb.lang.Severity s) {
        return switch (s) {
            case ERROR -> DiagnosticSeverity.Error;
            case WARNING -> DiagnosticSeverity.Warning;
            case NOTE -> DiagnosticSeverity.Information;
        };
    }

    /** A check is anchored at its statement; a labelled statement's verdict is shown at the label, clear of its expressions. */
    private static Map<Span, Span> labelSpans(Analysis a) {
        Map<Span, Span> out = new HashMap<>();
        if (a.model() == null) return out;
        for (Stmt s : a.model().program().statements()) {
            Navigation.label(s).ifPresent(l -> out.put(s.span(), l.span()));
        }
        return out;
    }
}
