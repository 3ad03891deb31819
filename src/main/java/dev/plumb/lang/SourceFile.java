package dev.plumb.lang;

import java.util.List;

/**
 * The text of one input file, kept whole so diagnostics can quote the offending line. A byte-order
 * mark at the start is dropped and every line ending (CR LF, or a lone CR from an old editor) is
 * read as LF, so lines and columns are where an editor shows them.
 */
public record SourceFile(String path, String text) {

    public SourceFile {
        if (text.startsWith("\uFEFF")) text = text.substring(1);
        if (text.indexOf('\r') >= 0) text = text.replace("\r\n", "\n").replace('\r', '\n');
    }

    public List<String> lines() {
        return text.lines().toList();
    }

    /** The text of a 1-based line, or "" past the end. */
    public String line(int number) {
        List<String> all = lines();
        return number >= 1 && number <= all.size() ? all.get(number - 1) : "";
    }

    /** The source text a span covers, joined onto one line when it spans several. */
    public String slice(Span span) {
        if (span.line() < 1) return "";
        StringBuilder out = new StringBuilder();
        for (int l = span.line(); l <= span.endLine(); l++) {
            String text = line(l);
            int from = l == span.line() ? Math.min(text.length(), span.column() - 1) : 0;
            int to = l == span.endLine() ? Math.min(text.length(), span.endColumn() - 1) : text.length();
            if (out.length() > 0) out.append(' ');
            out.append(text.substring(from, Math.max(from, to)).strip());
        }
        return out.toString().strip();
    }
}
