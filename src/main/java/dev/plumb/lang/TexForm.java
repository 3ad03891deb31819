package dev.plumb.lang;

import java.util.Set;

/**
 * The TeX a {@code typeset NAME as "TeX"} statement gives a name, checked: a small part of TeX's
 * math that every output can show (LaTeX writes it as it is, MathML and Markdown render it), so that
 * what the user writes can never break a document or reach beyond it. Allowed: letters, digits,
 * {@code _} and {@code ^} with an argument, balanced braces, a few punctuation marks, and the
 * commands in {@link #COMMANDS}.
 */
public final class TexForm {
    private TexForm() {
    }

    /** Greek letters, as TeX names them. */
    public static final Set<String> GREEK = Set.of("alpha", "beta", "gamma", "delta", "epsilon", "varepsilon", "zeta", "eta", "theta",
            "vartheta", "iota", "kappa", "lambda", "mu", "nu", "xi", "pi", "varpi", "rho", "varrho", "sigma", "varsigma", "tau",
            "upsilon", "phi", "varphi", "chi", "psi", "omega", "Gamma", "Delta", "Theta", "Lambda", "Xi", "Pi", "Sigma", "Upsilon",
            "Phi", "Psi", "Omega");
    /** Symbols that stand as an ordinary character. */
    public static final Set<String> SYMBOLS = Set.of("star", "ast", "odot", "oplus", "otimes", "circ", "bullet", "dagger", "ddagger",
            "prime", "infty", "ell", "hbar", "partial", "nabla", "oslash", "emptyset");
    /** Commands that take one braced argument: fonts, text and accents. */
    public static final Set<String> ARGUMENT = Set.of("mathrm", "mathit", "mathbf", "mathsf", "mathcal", "text", "bar", "hat",
            "tilde", "dot", "ddot", "vec", "check", "breve", "overline");
    private static final String PUNCTUATION = "',.+-*/()[]|:;! ";

    /** What is wrong with a typeset form, and at which offset in it. */
    public record Problem(String message, int offset) { }

    /** The first thing wrong with {@code tex}, or null when it is a form every output can show. */
    public static Problem check(String tex) {
        if (tex.isBlank()) return new Problem("the typeset form is empty", 0);
        int depth = 0;
        int i = 0;
        while (i < tex.length()) {
            char c = tex.charAt(i);
            if (c == '{') {
                depth++;
            } else if (c == '}') {
                if (--depth < 0) return new Problem("'}' closes no '{' (the braces are unbalanced)", i);
            } else if (c == '\\') {
                int j = i + 1;
                while (j < tex.length() && Character.isLetter(tex.charAt(j)) && tex.charAt(j) < 0x80) j++;
                String command = tex.substring(i + 1, j);
                if (command.isEmpty()) {
                    if (j < tex.length() && ",;!".indexOf(tex.charAt(j)) >= 0) {
                        i = j + 1;
                        continue;
                    }
                    return new Problem("a backslash must begin a command such as \\star or \\rho", i);
                }
                if (!GREEK.contains(command) && !SYMBOLS.contains(command) && !ARGUMENT.contains(command)) {
                    return new Problem("\\" + command + " is not a command a typeset form may use (Greek letters, \\star and similar "
                            + "symbols, \\mathrm and other fonts, \\bar and other accents)", i);
                }
                if (ARGUMENT.contains(command) && (j >= tex.length() || tex.charAt(j) != '{')) {
                    return new Problem("\\" + command + " takes its argument in braces, as in \\" + command + "{x}", i);
                }
                i = j;
                continue;
            } else if (c == '_' || c == '^') {
                char next = i + 1 < tex.length() ? tex.charAt(i + 1) : 0;
                if (next == 0 || next == '}' || next == '_' || next == '^' || next == ' ') {
                    return new Problem("'" + c + "' needs something after it to raise or lower", i);
                }
            } else if (!(c < 0x80 && (Character.isLetterOrDigit(c) || PUNCTUATION.indexOf(c) >= 0))) {
                return new Problem("'" + c + "' cannot stand in a typeset form (letters, digits, _ ^ { } and TeX commands can)", i);
            }
            i++;
        }
        if (depth > 0) return new Problem("a '{' is not closed (the braces are unbalanced)", tex.lastIndexOf('{'));
        return null;
    }
}
