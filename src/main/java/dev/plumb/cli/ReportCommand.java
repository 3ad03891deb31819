package dev.plumb.cli;

import dev.plumb.pipeline.Analyzer;
import dev.plumb.report.Analysis;
import dev.plumb.report.CaseData;
import dev.plumb.report.DerivationDocument;
import dev.plumb.report.DiagnosticPrinter;
import dev.plumb.report.HtmlMarkup;
import dev.plumb.report.Json;
import dev.plumb.report.JsonReport;
import dev.plumb.report.LatexMarkup;
import dev.plumb.report.MarkdownMarkup;
import dev.plumb.report.Markup;
import dev.plumb.report.SequenceData;
import dev.plumb.report.Style;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/**
 * {@code plumb report FILE --format md|tex|html|json|csv --out DIR}: the derivation document; {@code csv}
 * writes the data (each case's table, each profile's samples, each sweep) as CSV files.
 */
@Command(name = "report", mixinStandardHelpOptions = true, versionProvider = Version.class,
        description = {"Write the derivation document: declarations, relations, every check with its verdict,",
                "closed forms with their trail, cases closed-form beside numeric, plots, and sources.",
                "'csv' writes the data: each case's table (case-LABEL.csv), each profile's samples (profile-CASE-NAME.csv)",
                "and each sweep (sweep-LABEL.csv), in the file's units with SI beside.",
                "Nothing is written when the input cannot be understood; existing files are replaced only when complete."})
public final class ReportCommand implements Callable<Integer> {

    enum Format { md, tex, html, json, csv }

    @Parameters(index = "0", paramLabel = "FILE", description = "the plumb file")
    Path file;

    @Option(names = "--format", split = ",", defaultValue = "md",
            description = "one or more of ${COMPLETION-CANDIDATES}, comma-separated (default: ${DEFAULT-VALUE})")
    List<Format> formats;

    @Option(names = "--out", paramLabel = "DIR", defaultValue = "report", description = "output directory (default: ${DEFAULT-VALUE})")
    Path out;

    @CommandLine.Mixin
    AnalysisOptions analysis;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        PrintWriter err = spec.commandLine().getErr();
        PrintWriter stdout = spec.commandLine().getOut();
        Analyzer analyzer = analysis.analyzer(spec.commandLine(), true);
        Analysis a = analysis.withinTimeout(() -> analyzer.analyze(file), file.toString(), err);
        if (a == null) {
            err.println("plumb: no report written");
            return 1;
        }
        DiagnosticPrinter printer = new DiagnosticPrinter(Style.detect());
        a.diagnostics().forEach(d -> err.print(printer.print(a.source(), d)));
        err.flush();
        if (a.hasInputErrors() || a.model() == null) {
            finishInterruptedReplacement(err);
            err.println("plumb: no report written: " + file + " could not be understood");
            return 2;
        }
        String base = baseName(file);
        Map<String, byte[]> files = new LinkedHashMap<>();
        try {
            for (Format f : formats) {
                if (f == Format.json) {
                    files.put(base + ".json", Json.write(JsonReport.toMap(a, analysis.strict)).getBytes(StandardCharsets.UTF_8));
                    continue;
                }
                if (f == Format.csv) {
                    files.putAll(data(a));
                    continue;
                }
                Markup markup = switch (f) {
                    case md -> new MarkdownMarkup();
                    case tex -> new LatexMarkup();
                    default -> new HtmlMarkup();
                };
                DerivationDocument doc = new DerivationDocument(a, markup);
                String text = doc.render();
                files.putAll(doc.files());
                files.put(base + "." + markup.extension(), text.getBytes(StandardCharsets.UTF_8));
                markup.companions(base).forEach((name, body) -> files.put(name, body.getBytes(StandardCharsets.UTF_8)));
            }
            String clash = inputAmong(out, files);
            if (clash != null) {
                err.println("plumb: no report written: " + out.resolve(clash) + " is the input file, and an input is never overwritten; "
                        + "choose another --out folder");
                return 2;
            }
            DocumentSet.replace(out, files);
        } catch (IOException e) {
            err.println("plumb: cannot write the report to " + out + ": " + reason(e));
            return 2;
        }
        files.keySet().forEach(name -> stdout.println("wrote " + out.resolve(name)));
        return a.exitStatus(analysis.strict);
    }

    /** A run that writes nothing still leaves the folder whole: a replacement a killed run began is finished. */
    private void finishInterruptedReplacement(PrintWriter err) {
        try {
            DocumentSet.recover(out);
        } catch (IOException e) {
            err.println("plumb: cannot finish the replacement a stopped run began in " + out + ": " + reason(e));
        }
    }

    /** The data files of {@code --format csv}: each case's table and profiles, then each sweep. */
    private static Map<String, byte[]> data(Analysis a) throws IOException {
        Map<String, byte[]> out = new LinkedHashMap<>();
        for (Analysis.CaseTable t : a.cases()) {
            out.put(CaseData.tableFileName(t), CaseData.table(t));
            for (Analysis.ProfileSample p : t.profiles()) out.put(CaseData.profileFileName(t, p), CaseData.profile(a.model(), p));
        }
        for (var r : a.sweeps()) out.put(SequenceData.fileName(r), SequenceData.csv(r));
        return out;
    }

    /** The name of an output that would replace the input file itself (same file, however it is reached), or null. */
    private String inputAmong(Path dir, Map<String, byte[]> files) {
        for (String name : files.keySet()) {
            Path target = dir.resolve(name);
            try {
                if (Files.exists(target) && Files.isSameFile(target, file)) return name;
            } catch (IOException cannotTell) {
                if (target.toAbsolutePath().normalize().equals(file.toAbsolutePath().normalize())) return name;
            }
        }
        return null;
    }

    private static String baseName(Path p) {
        String name = p.getFileName().toString();
        int dot = name.lastIndexOf('.');
        return dot > 0 ? name.substring(0, dot) : name;
    }

    /** Why an I/O operation failed, in words: the exception's own message is often only the path. */
    private static String reason(IOException e) {
        if (e instanceof java.nio.file.AccessDeniedException a) return "permission denied: " + a.getFile();
        if (e instanceof java.nio.file.NoSuchFileException n) return "no such file or folder: " + n.getFile();
        if (e instanceof java.nio.file.FileAlreadyExistsException f) return "already exists: " + f.getFile();
        if (e instanceof java.nio.file.FileSystemException f && f.getReason() != null) {
            return f.getReason() + (f.getFile() == null ? "" : ": " + f.getFile());
        }
        return e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage();
    }
}
