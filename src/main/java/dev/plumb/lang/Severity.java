package dev.plumb.lang;

/** How serious a diagnostic is: errors stop the run, warnings and notes do not. */
public enum Severity {
    ERROR, WARNING, NOTE;

    public String word() {
        return name().toLowerCase(java.util.Locale.ROOT);
    }
}
