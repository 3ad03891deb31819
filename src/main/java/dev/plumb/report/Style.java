package dev.plumb.report;

/** Terminal styling: ANSI colours when writing to a terminal, plain text otherwise. */
public record Style(boolean color) {

    public static final Style PLAIN = new Style(false);

    /** Colour only on a terminal, and never when NO_COLOR is set (https://no-color.org). */
    public static Style detect() {
        String noColor = System.getenv("NO_COLOR");
        boolean tty = System.console() != null && (noColor == null || noColor.isEmpty());
        String term = System.getenv("TERM");
        return new Style(tty && !"dumb".equals(term));
    }

    private String wrap(String code, String s) {
        return color ? "\u001b[" + code + "m" + s + "\u001b[0m" : s;
    }

    /** The longest run of non-blank characters, and the longest text, shown whole. */
    private static final int LONGEST_WORD = 300, LONGEST_TEXT = 2000;

    /**
     * Text from the input made inert for a terminal: control characters (an escape sequence in a title
     * could recolour or rewrite what the run appears to say) are shown as \\uXXXX, and a name, number
     * or title of megabytes is shown by its ends with the count of what is left out between them.
     */
    public static String inert(String s) {
        if (s == null) return "";
        StringBuilder out = null;
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            boolean control = c < 0x20 && c != '\n' && c != '\t' || c >= 0x7f && c <= 0x9f;
            if (control && out == null) out = new StringBuilder(s.substring(0, i));
            if (out != null) {
                if (control) out.append(String.format("\\u%04x", (int) c));
                else out.append(c);
            }
        }
        return abbreviated(out == null ? s : out.toString());
    }

    private static String abbreviated(String s) {
        if (s.length() <= LONGEST_WORD) return s;
        StringBuilder out = new StringBuilder();
        for (int i = 0; i < s.length(); ) {
            int j = i;
            while (j < s.length() && !Character.isWhitespace(s.charAt(j))) j++;
            out.append(j - i > LONGEST_WORD ? ends(s.substring(i, j), 100, 40) : s.substring(i, j));
            for (i = j; i < s.length() && Character.isWhitespace(s.charAt(i)); i++) out.append(s.charAt(i));
        }
        return out.length() > LONGEST_TEXT ? ends(out.toString(), 1500, 300) : out.toString();
    }

    private static String ends(String s, int head, int tail) {
        return s.substring(0, head) + "...[" + (s.length() - head - tail) + " more characters]..." + s.substring(s.length() - tail);
    }

    /** A quoted source line made inert with its columns kept: each control character becomes '?'. */
    public static String inertLine(String s) {
        StringBuilder out = new StringBuilder(s.length());
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            out.append(c == '\t' ? ' ' : c < 0x20 || c >= 0x7f && c <= 0x9f ? '?' : c);
        }
        return out.toString();
    }

    public String bold(String s) {
        return wrap("1", s);
    }

    public String red(String s) {
        return wrap("1;31", s);
    }

    public String green(String s) {
        return wrap("32", s);
    }

    public String yellow(String s) {
        return wrap("33", s);
    }

    public String cyan(String s) {
        return wrap("36", s);
    }

    public String dim(String s) {
        return wrap("2", s);
    }
}
