package dev.plumb.report;

import dev.plumb.lang.Diagnostic;
import dev.plumb.lang.Severity;
import dev.plumb.lang.SourceFile;
import dev.plumb.lang.Span;

/**
 * Prints a diagnostic the way compilers do: {@code FILE:LINE:COLUMN: severity: message}, the line
 * quoted, carets under the span, then any detail lines.
 */
public final class DiagnosticPrinter {
    private final Style style;

    public DiagnosticPrinter(Style style) {
        this.style = style;
    }

    /** How many characters either side of the column a long line is quoted with. */
    private static final int WINDOW = 80;

    /** How many columns the characters from index {@code from} to {@code to} of the line take on a terminal. */
    private static int width(String line, int from, int to) {
        int a = Math.min(from, line.length()), b = Math.min(to, line.length());
        int w = Math.max(0, to - Math.max(from, line.length()));
        for (int i = a; i < b; ) {
            int c = line.codePointAt(i);
            int type = Character.getType(c);
            if (type != Character.NON_SPACING_MARK && type != Character.ENCLOSING_MARK) w++;
            i += Character.charCount(c);
        }
        return w;
    }

    public String print(SourceFile source, Diagnostic d) {
        StringBuilder out = new StringBuilder();
        Span s = d.span();
        String where = s.line() > 0 ? source.path() + ":" + s.line() + ":" + s.column() : source.path();
        String severity = switch (d.severity()) {
            case ERROR -> style.red("error");
            case WARNING -> style.yellow("warning");
            case NOTE -> style.cyan("note");
        };
        out.append(style.bold(where)).append(": ").append(severity).append(": ").append(Style.inert(d.message())).append('\n');
        if (s.line() > 0) {
            String line = Style.inertLine(source.line(s.line()));
            int start = Math.max(1, s.column());
            // A very long line is quoted in a window around the column, not whole.
            int shift = 0;
            if (line.length() > WINDOW * 2) {
                int from = Math.max(0, start - 1 - WINDOW), to = Math.min(line.length(), start - 1 + WINDOW);
                String head = from > 0 ? "..." : "";
                line = head + line.substring(from, to) + (to < line.length() ? "..." : "");
                shift = from - head.length();
                start -= shift;
            }
            out.append("    ").append(line).append('\n');
            int end = s.endLine() == s.line() ? Math.max(start + 1, s.endColumn() - shift) : line.length() + 1;
            end = Math.min(end, Math.max(start + 1, line.length() + 1));
            // Columns count UTF-16 units; on screen a letter beyond 16 bits (two units) or a combining mark takes one column or none.
            String carets = "^".repeat(Math.max(1, width(line, start - 1, end - 1)));
            out.append("    ").append(" ".repeat(width(line, 0, start - 1)))
                    .append(d.severity() == Severity.ERROR ? style.red(carets) : style.cyan(carets)).append('\n');
        }
        for (String detail : d.details()) {
            out.append("  ").append(Style.inert(detail)).append('\n');
        }
        return out.toString();
    }
}
