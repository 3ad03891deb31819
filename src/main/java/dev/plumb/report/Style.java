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
