package dev.plumb.report;

import dev.plumb.lang.Expr;
import dev.plumb.lang.ExprPrinter;
import dev.plumb.lang.Identifier;
import java.util.Locale;
import java.util.Map;
import java.util.stream.Collectors;

/** Prints an expression as LaTeX math: fractions, powers, Greek letters and subscripts. */
public final class LatexPrinter {
    private static final LatexPrinter PLAIN = new LatexPrinter(Map.of(), false);

    /** The user's typeset forms ({@code typeset NAME as "TeX"}), by name; checked TeX, written as it is. */
    private final Map<String, String> typeset;
    /** Whether units are written for siunitx (its unit command), as in a LaTeX document, or upright by hand (Markdown's math). */
    private final boolean siunitx;

    private LatexPrinter(Map<String, String> typeset, boolean siunitx) {
        this.typeset = typeset;
        this.siunitx = siunitx;
    }

    /** A printer that writes each name in {@code typeset} as the TeX given for it, and units for siunitx if asked. */
    public static LatexPrinter with(Map<String, String> typeset, boolean siunitx) {
        return typeset.isEmpty() && !siunitx ? PLAIN : new LatexPrinter(Map.copyOf(typeset), siunitx);
    }

    /** A unit in math as this printer writes units. */
    public String unitOf(String text) {
        if (!siunitx) return unit(text);
        String u = siUnit(text);
        return u.isEmpty() ? "" : "\\," + u;
    }

    static final Map<String, String> GREEK = Map.ofEntries(
            Map.entry("alpha", "\\alpha"), Map.entry("beta", "\\beta"), Map.entry("gamma", "\\gamma"),
            Map.entry("delta", "\\delta"), Map.entry("epsilon", "\\epsilon"), Map.entry("zeta", "\\zeta"),
            Map.entry("eta", "\\eta"), Map.entry("theta", "\\theta"), Map.entry("kappa", "\\kappa"),
            Map.entry("lambda", "\\lambda"), Map.entry("mu", "\\mu"), Map.entry("nu", "\\nu"), Map.entry("xi", "\\xi"),
            Map.entry("pi", "\\pi"), Map.entry("rho", "\\rho"), Map.entry("sigma", "\\sigma"), Map.entry("tau", "\\tau"),
            Map.entry("phi", "\\phi"), Map.entry("chi", "\\chi"), Map.entry("psi", "\\psi"), Map.entry("omega", "\\omega"),
            Map.entry("Gamma", "\\Gamma"), Map.entry("Delta", "\\Delta"), Map.entry("Theta", "\\Theta"),
            Map.entry("Lambda", "\\Lambda"), Map.entry("Xi", "\\Xi"), Map.entry("Pi", "\\Pi"), Map.entry("Sigma", "\\Sigma"),
            Map.entry("Phi", "\\Phi"), Map.entry("Psi", "\\Psi"), Map.entry("Omega", "\\Omega"));

    public static String print(Expr e) {
        return PLAIN.render(e);
    }

    public String render(Expr e) {
        return print(e, 0);
    }

    /** A name as this printer writes it: the user's typeset form if there is one. */
    public String nameOf(String id) {
        String t = typeset.get(id);
        return t != null ? "{" + t + "}" : name(id);
    }

    /** An identifier: Greek names (rho, or ρ itself) become letters, a trailing number or {@code _suffix} a subscript. */
    public static String name(String id) {
        Identifier.Parts parts = Identifier.split(id);
        String base = parts.base();
        String sub = parts.subscript();
        String b = GREEK.getOrDefault(base, base.codePointCount(0, base.length()) == 1 ? mathText(base) : "\\mathit{" + mathText(base) + "}");
        if (sub == null) return b;
        String s = GREEK.getOrDefault(sub, sub.chars().allMatch(c -> c >= '0' && c <= '9') ? sub : "\\mathrm{" + mathText(sub) + "}");
        return b + "_{" + s + "}";
    }

    /** LaTeX for the Greek letters, by code point: the capitals that look Latin are Latin letters. */
    private static final Map<Integer, String> GREEK_LETTERS = greekLetters();

    private static Map<Integer, String> greekLetters() {
        Map<Integer, String> m = new java.util.HashMap<>();
        String[] lower = {"alpha", "beta", "gamma", "delta", "epsilon", "zeta", "eta", "theta", "iota", "kappa", "lambda", "mu", "nu",
            "xi", "o", "pi", "rho", "varsigma", "sigma", "tau", "upsilon", "phi", "chi", "psi", "omega"};
        for (int i = 0; i < lower.length; i++) m.put(0x03B1 + i, lower[i].equals("o") ? "o" : "\\" + lower[i]);
        String[] upper = {"A", "B", "\\Gamma", "\\Delta", "E", "Z", "H", "\\Theta", "I", "K", "\\Lambda", "M", "N", "\\Xi", "O", "\\Pi",
            "P", null, "\\Sigma", "T", "\\Upsilon", "\\Phi", "X", "\\Psi", "\\Omega"};
        for (int i = 0; i < upper.length; i++) if (upper[i] != null) m.put(0x0391 + i, upper[i]);
        m.put(0x03D1, "\\vartheta");
        m.put(0x03D5, "\\phi");
        m.put(0x03F5, "\\epsilon");
        m.put(0x03C6, "\\varphi");
        m.put(0x00B5, "\\mu");
        return Map.copyOf(m);
    }

    /**
     * Letters of a name (or a unit) inside math: ASCII as it is (LaTeX specials escaped), Greek as
     * its command, accented Latin letters as text, and any other character as its code, so that the
     * document compiles with pdfLaTeX whatever script a name is written in.
     */
    static String mathText(String s) {
        StringBuilder out = new StringBuilder();
        s.codePoints().forEach(c -> {
            if (c < 0x80) out.append(escapeAscii(Character.toString(c)));
            else if (GREEK_LETTERS.containsKey(c)) out.append(GREEK_LETTERS.get(c)).append(GREEK_LETTERS.get(c).startsWith("\\") ? "{}" : "");
            else if (isLatin(c)) out.append("\\text{").appendCodePoint(c).append('}');
            else out.append("\\text{").append(codeOf(c)).append('}');
        });
        return out.toString();
    }

    /** Text outside math, escaped: LaTeX specials, and the characters beyond ASCII that pdfLaTeX does not know by default. */
    static String escape(String s) {
        StringBuilder out = new StringBuilder();
        s.codePoints().forEach(c -> {
            if (c < 0x80) {
                out.append(switch (c) {
                    case '^' -> "\\^{}";
                    case '~' -> "\\textasciitilde{}";
                    case '<' -> "\\textless{}";
                    case '>' -> "\\textgreater{}";
                    case '|' -> "\\textbar{}";
                    default -> escapeAscii(Character.toString(c));
                });
            } else if (GREEK_LETTERS.containsKey(c)) {
                out.append("\\ensuremath{").append(GREEK_LETTERS.get(c)).append('}');
            } else if (TEXT_SYMBOLS.containsKey(c)) {
                out.append(TEXT_SYMBOLS.get(c));
            } else if (isLatin(c)) {
                out.appendCodePoint(c);
            } else {
                out.append(codeOf(c));
            }
        });
        return out.toString();
    }

    private static final Map<Integer, String> TEXT_SYMBOLS = Map.ofEntries(
            Map.entry(0x00B1, "\\ensuremath{\\pm}"), Map.entry(0x00D7, "\\ensuremath{\\times}"),
            Map.entry(0x00B7, "\\ensuremath{\\cdot}"), Map.entry(0x00B0, "\\ensuremath{^\\circ}"),
            Map.entry(0x2212, "\\ensuremath{-}"), Map.entry(0x2013, "--"), Map.entry(0x2014, "---"),
            Map.entry(0x2018, "`"), Map.entry(0x2019, "'"), Map.entry(0x201C, "``"), Map.entry(0x201D, "''"),
            Map.entry(0x2032, "\\ensuremath{'}"), Map.entry(0x2033, "\\ensuremath{''}"),
            Map.entry(0x2202, "\\ensuremath{\\partial}"), Map.entry(0x221D, "\\ensuremath{\\propto}"),
            Map.entry(0x2248, "\\ensuremath{\\approx}"), Map.entry(0x2264, "\\ensuremath{\\le}"),
            Map.entry(0x2265, "\\ensuremath{\\ge}"), Map.entry(0x2260, "\\ensuremath{\\ne}"),
            Map.entry(0x221A, "\\ensuremath{\\surd}"), Map.entry(0x2192, "\\ensuremath{\\to}"),
            Map.entry(0x221E, "\\ensuremath{\\infty}"), Map.entry(0x2026, "\\ldots{}"),
            Map.entry(0x2070, "\\textsuperscript{0}"), Map.entry(0x00B9, "\\textsuperscript{1}"),
            Map.entry(0x00B2, "\\textsuperscript{2}"), Map.entry(0x00B3, "\\textsuperscript{3}"),
            Map.entry(0x2074, "\\textsuperscript{4}"), Map.entry(0x2075, "\\textsuperscript{5}"),
            Map.entry(0x2076, "\\textsuperscript{6}"), Map.entry(0x2077, "\\textsuperscript{7}"),
            Map.entry(0x2078, "\\textsuperscript{8}"), Map.entry(0x2079, "\\textsuperscript{9}"),
            Map.entry(0x207B, "\\textsuperscript{\\ensuremath{-}}"),
            Map.entry(0x2080, "\\ensuremath{_0}"), Map.entry(0x2081, "\\ensuremath{_1}"), Map.entry(0x2082, "\\ensuremath{_2}"),
            Map.entry(0x2083, "\\ensuremath{_3}"), Map.entry(0x2084, "\\ensuremath{_4}"), Map.entry(0x2085, "\\ensuremath{_5}"),
            Map.entry(0x2086, "\\ensuremath{_6}"), Map.entry(0x2087, "\\ensuremath{_7}"), Map.entry(0x2088, "\\ensuremath{_8}"),
            Map.entry(0x2089, "\\ensuremath{_9}"));

    private static String escapeAscii(String s) {
        return s.replace("\\", "\\textbackslash{}").replace("_", "\\_").replace("%", "\\%").replace("&", "\\&")
                .replace("#", "\\#").replace("$", "\\$").replace("{", "\\{").replace("}", "\\}");
    }

    /** Latin letters with accents (Latin-1 and Latin Extended-A), which pdfLaTeX's default input encoding knows. */
    private static boolean isLatin(int c) {
        return c >= 0xC0 && c <= 0x17F && c != 0xD7 && c != 0xF7;
    }

    private static String codeOf(int c) {
        return String.format("[U+%04X]", c);
    }

    /** A number as written, with an exponent shown as a power of ten. */
    public static String number(String text) {
        String t = text.toLowerCase(Locale.ROOT);
        int e = t.indexOf('e');
        if (e < 0) return text;
        String mantissa = t.substring(0, e);
        String exp = t.substring(e + 1).replaceFirst("^\\+", "");
        if (exp.matches("-?[0-9]+")) exp = String.valueOf(Integer.parseInt(exp));
        return (mantissa.equals("1") ? "" : mantissa + "\\times ") + "10^{" + exp + "}";
    }

    /**
     * A unit for siunitx as a literal unit ({@code kg m^-3} becomes the literal unit kg.m^{-3}); a unit
     * with characters siunitx's literal input does not take (Greek, accents) is written upright by hand.
     * No space before it; the dimensionless unit {@code 1} is nothing.
     */
    public static String siUnit(String text) {
        String t = text.strip();
        if (t.equals("1") || t.isEmpty()) return "";
        String powers = t.replaceAll("\\^\\s*\\(\\s*([-+]?[0-9./ ]+?)\\s*\\)", "^{$1}").replaceAll("\\^\\s*([-+]?[0-9.]+)", "^{$1}");
        String literal = powers.replaceAll("\\s*\\*\\s*|\\s+", ".").replaceAll("\\.?/\\.?", "/");
        if (!literal.matches("[A-Za-z0-9./^{}()+-]+")) return unit(text).substring("\\,".length());
        return "\\unit{" + literal + "}";
    }

    /** A unit as written ({@code kg m^-3}, {@code kg^(-4/3)}), upright, with its powers as superscripts. */
    public static String unit(String text) {
        String powers = text.replaceAll("\\^\\s*\\(\\s*([-+]?[0-9./ ]+?)\\s*\\)", "^{$1}").replaceAll("\\^\\s*([-+]?[0-9.]+)", "^{$1}");
        StringBuilder out = new StringBuilder();
        int i = 0;
        while (i < powers.length()) {
            int open = powers.indexOf("^{", i);
            int end = open < 0 ? powers.length() : open;
            out.append(mathText(powers.substring(i, end)).replace(" ", "\\,").replace("*", "\\,"));
            if (open < 0) break;
            int close = powers.indexOf('}', open);
            out.append("^{").append(powers, open + 2, close).append('}');
            i = close + 1;
        }
        return "\\,\\mathrm{" + out + "}";
    }

    private String print(Expr e, int outer) {
        String s;
        if (e instanceof Expr.Num n) {
            s = number(n.text());
        } else if (e instanceof Expr.Quantity q) {
            s = number(q.text()) + unitOf(q.unit());
        } else if (e instanceof Expr.Name n) {
            s = nameOf(n.id());
        } else if (e instanceof Expr.Neg n) {
            s = "-" + print(n.operand(), 3);
        } else if (e instanceof Expr.Call c) {
            s = call(c);
        } else if (e instanceof Expr.If i) {
            // An else-if chain is one set of cases, not cases nested in cases.
            StringBuilder rows = new StringBuilder("\\begin{cases} ");
            Expr rest = i;
            while (rest instanceof Expr.If c) {
                rows.append(print(c.then(), 0)).append(" & \\text{if } ").append(print(c.condition().left(), 1)).append(' ')
                        .append(compare(c.condition().op())).append(' ').append(print(c.condition().right(), 1)).append(" \\\\ ");
                rest = c.otherwise();
            }
            s = rows.append(print(rest, 0)).append(" & \\text{otherwise} \\end{cases}").toString();
        } else {
            Expr.Binary b = (Expr.Binary) e;
            s = switch (b.op()) {
                case ADD -> print(b.left(), 1) + " + " + print(b.right(), 2);
                case SUB -> print(b.left(), 1) + " - " + print(b.right(), 2);
                case MUL -> print(b.left(), 2) + (needsDot(b.right()) ? " \\cdot " : "\\,") + print(b.right(), 3);
                case DIV -> "\\frac{" + print(b.left(), 0) + "}{" + print(b.right(), 0) + "}";
                // A fraction or a quantity raised to a power is bracketed: (P/K)^n, not P over K^n.
                case POW -> (bracketedBase(b.left()) ? "\\left(" + print(b.left(), 0) + "\\right)" : "{" + print(b.left(), 5) + "}")
                        + "^{" + print(b.right(), 0) + "}";
            };
            if (b.op() == Expr.BinaryOp.DIV) return s;
        }
        return ExprPrinter.precedence(e) < outer ? "\\left(" + s + "\\right)" : s;
    }

    /** Whether a product needs a visible sign before {@code right}: a number (or a quantity) would run into what stands before it. */
    static boolean needsDot(Expr right) {
        return right instanceof Expr.Num || right instanceof Expr.Quantity
                || right instanceof Expr.Binary b && (b.op() == Expr.BinaryOp.POW || b.op() == Expr.BinaryOp.MUL) && needsDot(b.left());
    }

    /** A base of a power that must stand in brackets: a fraction, a quantity, or a negative number. */
    static boolean bracketedBase(Expr base) {
        return base instanceof Expr.Binary b && b.op() == Expr.BinaryOp.DIV || base instanceof Expr.Quantity
                || base instanceof Expr.Num n && n.text().startsWith("-");
    }

    private static String compare(Expr.CompareOp op) {
        return switch (op) {
            case LT -> "<";
            case LE -> "\\le";
            case GT -> ">";
            case GE -> "\\ge";
        };
    }

    private String call(Expr.Call c) {
        String args = c.args().stream().map(this::render).collect(Collectors.joining(", "));
        switch (c.callee()) {
            case "sqrt":
                return "\\sqrt{" + args + "}";
            case "exp":
                return "\\exp{\\left(" + args + "\\right)}";
            case "log": case "ln":
                return "\\ln{\\left(" + args + "\\right)}";
            case "log10":
                return "\\log_{10}{\\left(" + args + "\\right)}";
            case "abs":
                return "\\left|" + args + "\\right|";
            case "sin": case "cos": case "tan": case "sinh": case "cosh": case "tanh":
                return "\\" + c.callee() + "{\\left(" + args + "\\right)}";
            case "asin": case "acos": case "atan":
                return "\\arc" + c.callee().substring(1) + "{\\left(" + args + "\\right)}";
            case "asinh": case "acosh": case "atanh":
                // ISO 80000-2 writes the inverse hyperbolic functions arsinh, arcosh, artanh.
                return "\\operatorname{ar" + c.callee().substring(1) + "}{\\left(" + args + "\\right)}";
            default:
                // In braces the bracketed group is an ordinary atom: no thin space between m and (r).
                return nameOf(c.callee()) + "'".repeat(c.order()) + "{\\left(" + args + "\\right)}";
        }
    }
}
