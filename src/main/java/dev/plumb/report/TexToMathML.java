package dev.plumb.report;

import dev.plumb.lang.TexForm;
import java.util.Map;

/**
 * A typeset form ({@code typeset Rstar as "R_\star"}, checked by {@link TexForm}) as presentation
 * MathML: letters, digits, Greek letters and symbols, {@code _} and {@code ^} as scripts, fonts and
 * accents. A form it cannot follow gives null, and the printer falls back to the plain name.
 */
final class TexToMathML {
    private static final Map<String, String> LETTERS = Map.ofEntries(
            Map.entry("alpha", "α"), Map.entry("beta", "β"), Map.entry("gamma", "γ"), Map.entry("delta", "δ"),
            Map.entry("epsilon", "ϵ"), Map.entry("varepsilon", "ε"), Map.entry("zeta", "ζ"), Map.entry("eta", "η"),
            Map.entry("theta", "θ"), Map.entry("vartheta", "ϑ"), Map.entry("iota", "ι"), Map.entry("kappa", "κ"),
            Map.entry("lambda", "λ"), Map.entry("mu", "μ"), Map.entry("nu", "ν"), Map.entry("xi", "ξ"), Map.entry("pi", "π"),
            Map.entry("varpi", "ϖ"), Map.entry("rho", "ρ"), Map.entry("varrho", "ϱ"), Map.entry("sigma", "σ"),
            Map.entry("varsigma", "ς"), Map.entry("tau", "τ"), Map.entry("upsilon", "υ"), Map.entry("phi", "ϕ"),
            Map.entry("varphi", "φ"), Map.entry("chi", "χ"), Map.entry("psi", "ψ"), Map.entry("omega", "ω"),
            Map.entry("Gamma", "Γ"), Map.entry("Delta", "Δ"), Map.entry("Theta", "Θ"), Map.entry("Lambda", "Λ"),
            Map.entry("Xi", "Ξ"), Map.entry("Pi", "Π"), Map.entry("Sigma", "Σ"), Map.entry("Upsilon", "Υ"), Map.entry("Phi", "Φ"),
            Map.entry("Psi", "Ψ"), Map.entry("Omega", "Ω"), Map.entry("ell", "ℓ"), Map.entry("hbar", "ℏ"),
            Map.entry("partial", "∂"), Map.entry("nabla", "∇"), Map.entry("infty", "∞"), Map.entry("emptyset", "∅"));
    private static final Map<String, String> SYMBOLS = Map.ofEntries(
            Map.entry("star", "⋆"), Map.entry("ast", "∗"), Map.entry("odot", "⊙"), Map.entry("oplus", "⊕"),
            Map.entry("otimes", "⊗"), Map.entry("circ", "∘"), Map.entry("bullet", "∙"), Map.entry("dagger", "†"),
            Map.entry("ddagger", "‡"), Map.entry("prime", "′"), Map.entry("oslash", "⊘"));
    private static final Map<String, String> ACCENTS = Map.of("bar", "¯", "overline", "¯", "hat", "^", "tilde", "~", "dot", "˙",
            "ddot", "¨", "vec", "→", "check", "ˇ", "breve", "˘");

    private final String tex;
    private int pos;

    private TexToMathML(String tex) {
        this.tex = tex;
    }

    /** The MathML for {@code tex} (one {@code <mrow>}), or null when it is not a form this can follow. */
    static String convert(String tex) {
        if (TexForm.check(tex) != null) return null;
        try {
            TexToMathML t = new TexToMathML(tex);
            String row = t.sequence();
            return t.pos == tex.length() ? "<mrow>" + row + "</mrow>" : null;
        } catch (IllegalStateException e) {
            return null;
        }
    }

    /** Items up to a closing brace or the end. */
    private String sequence() {
        StringBuilder out = new StringBuilder();
        while (pos < tex.length() && tex.charAt(pos) != '}') out.append(scripted());
        return out.toString();
    }

    /** An atom with its subscript and superscript, if any. */
    private String scripted() {
        String base = atom();
        String sub = null;
        String sup = null;
        while (pos < tex.length() && (tex.charAt(pos) == '_' || tex.charAt(pos) == '^')) {
            char c = tex.charAt(pos++);
            String arg = argument();
            if (c == '_') sub = arg;
            else sup = arg;
        }
        if (sub != null && sup != null) return "<msubsup>" + base + sub + sup + "</msubsup>";
        if (sub != null) return "<msub>" + base + sub + "</msub>";
        if (sup != null) return "<msup>" + base + sup + "</msup>";
        return base;
    }

    /** A script's argument: a braced group, or one character or command. */
    private String argument() {
        if (pos < tex.length() && tex.charAt(pos) == '{') return group();
        return atom();
    }

    private String group() {
        pos++;
        String inner = sequence();
        if (pos >= tex.length()) throw new IllegalStateException("unclosed group");
        pos++;
        return "<mrow>" + inner + "</mrow>";
    }

    private String atom() {
        if (pos >= tex.length()) throw new IllegalStateException("nothing to typeset");
        char c = tex.charAt(pos);
        if (c == '{') return group();
        if (c == '\\') return command();
        if (Character.isDigit(c)) {
            int start = pos;
            while (pos < tex.length() && (Character.isDigit(tex.charAt(pos)) || tex.charAt(pos) == '.')) pos++;
            return "<mn>" + tex.substring(start, pos) + "</mn>";
        }
        pos++;
        if (Character.isLetter(c)) return "<mi>" + c + "</mi>";
        if (c == ' ') return "";
        if (c == '\'') return "<mo lspace=\"0\" rspace=\"0\">′</mo>";
        return "<mo>" + MathMLPrinter.esc(String.valueOf(c)) + "</mo>";
    }

    private String command() {
        int start = ++pos;
        while (pos < tex.length() && Character.isLetter(tex.charAt(pos))) pos++;
        String name = tex.substring(start, pos);
        if (name.isEmpty()) {
            pos++;
            return "<mspace width=\"0.17em\"/>";
        }
        if (LETTERS.containsKey(name)) return "<mi>" + LETTERS.get(name) + "</mi>";
        if (SYMBOLS.containsKey(name)) return "<mo lspace=\"0\" rspace=\"0\">" + SYMBOLS.get(name) + "</mo>";
        if (pos >= tex.length() || tex.charAt(pos) != '{') throw new IllegalStateException("argument expected");
        if (name.equals("text") || name.startsWith("math")) {
            int close = tex.indexOf('}', pos);
            String inner = tex.substring(pos + 1, close);
            if (inner.contains("{") || inner.contains("\\")) {
                String row = group();
                return name.equals("mathit") ? row : row.replace("<mi>", "<mi mathvariant=\"" + variant(name) + "\">");
            }
            pos = close + 1;
            if (name.equals("text")) return "<mtext>" + MathMLPrinter.esc(inner) + "</mtext>";
            return "<mi mathvariant=\"" + variant(name) + "\">" + MathMLPrinter.esc(inner) + "</mi>";
        }
        String accent = ACCENTS.get(name);
        if (accent == null) throw new IllegalStateException("unknown command");
        return "<mover accent=\"true\">" + group() + "<mo>" + accent + "</mo></mover>";
    }

    private static String variant(String font) {
        return switch (font) {
            case "mathbf" -> "bold";
            case "mathsf" -> "sans-serif";
            case "mathcal" -> "script";
            case "mathit" -> "italic";
            default -> "normal";
        };
    }
}
