package dev.plumb.report;

import dev.plumb.lang.Expr;
import dev.plumb.lang.ExprPrinter;
import dev.plumb.lang.Identifier;
import java.util.Locale;
import java.util.Map;
import java.util.stream.Collectors;

/** Prints an expression as presentation MathML, for self-contained HTML reports. */
public final class MathMLPrinter {
    private static final MathMLPrinter PLAIN = new MathMLPrinter(Map.of());

    /** The user's typeset forms ({@code typeset NAME as "TeX"}), by name, as TeX. */
    private final Map<String, String> typeset;

    private MathMLPrinter(Map<String, String> typeset) {
        this.typeset = typeset;
    }

    /** A printer that writes each name in {@code typeset} from the TeX given for it. */
    public static MathMLPrinter with(Map<String, String> typeset) {
        return typeset.isEmpty() ? PLAIN : new MathMLPrinter(Map.copyOf(typeset));
    }

    private static final Map<String, String> GREEK = Map.ofEntries(
            Map.entry("alpha", "α"), Map.entry("beta", "β"), Map.entry("gamma", "γ"), Map.entry("delta", "δ"),
            Map.entry("epsilon", "ε"), Map.entry("zeta", "ζ"), Map.entry("eta", "η"), Map.entry("theta", "θ"),
            Map.entry("kappa", "κ"), Map.entry("lambda", "λ"), Map.entry("mu", "μ"), Map.entry("nu", "ν"),
            Map.entry("xi", "ξ"), Map.entry("pi", "π"), Map.entry("rho", "ρ"), Map.entry("sigma", "σ"),
            Map.entry("tau", "τ"), Map.entry("phi", "φ"), Map.entry("chi", "χ"), Map.entry("psi", "ψ"),
            Map.entry("omega", "ω"), Map.entry("Gamma", "Γ"), Map.entry("Delta", "Δ"), Map.entry("Theta", "Θ"),
            Map.entry("Lambda", "Λ"), Map.entry("Xi", "Ξ"), Map.entry("Pi", "Π"), Map.entry("Sigma", "Σ"),
            Map.entry("Phi", "Φ"), Map.entry("Psi", "Ψ"), Map.entry("Omega", "Ω"));

    /** A whole {@code <math>} element for an equation {@code lhs = rhs} (rhs may be null). */
    public static String equation(Expr lhs, String relation, Expr rhs) {
        return PLAIN.displayed(lhs, relation, rhs);
    }

    public static String inline(Expr e) {
        return PLAIN.inlined(e, null, null);
    }

    public static String print(Expr e) {
        return PLAIN.render(e);
    }

    /** A whole displayed {@code <math>} element for {@code lhs REL rhs} (rhs may be null). */
    public String displayed(Expr lhs, String relation, Expr rhs) {
        return "<math display=\"block\"><mrow>" + render(lhs) + (rhs == null ? "" : "<mo>" + esc(relation) + "</mo>" + render(rhs))
                + "</mrow></math>";
    }

    /** An inline {@code <math>} element for {@code lhs REL rhs} (relation and rhs may be null). */
    public String inlined(Expr lhs, String relation, Expr rhs) {
        return "<math><mrow>" + render(lhs) + (rhs == null ? "" : "<mo>" + esc(relation) + "</mo>" + render(rhs)) + "</mrow></math>";
    }

    public String render(Expr e) {
        return print(e, 0);
    }

    /** A name as this printer writes it: the user's typeset form if there is one. */
    public String nameOf(String id) {
        String t = typeset.get(id);
        if (t == null) return name(id);
        String m = TexToMathML.convert(t);
        return m != null ? m : name(id);
    }

    static String esc(String s) {
        return s.replace("&", "&amp;").replace("<", "&lt;").replace(">", "&gt;").replace("\"", "&quot;");
    }

    public static String name(String id) {
        Identifier.Parts parts = Identifier.split(id);
        String base = parts.base();
        String sub = parts.subscript();
        String b = "<mi>" + esc(GREEK.getOrDefault(base, base)) + "</mi>";
        if (sub == null) return b;
        String s = sub.chars().allMatch(Character::isDigit) ? "<mn>" + sub + "</mn>"
                : "<mi mathvariant=\"normal\">" + esc(GREEK.getOrDefault(sub, sub)) + "</mi>";
        return "<msub>" + b + s + "</msub>";
    }

    /** A unit as written ({@code kg m^-3}), upright, its powers as superscripts; nothing for the dimensionless {@code 1}. */
    public static String unit(String text) {
        String t = text.strip();
        if (t.equals("1") || t.isEmpty()) return "";
        StringBuilder out = new StringBuilder("<mspace width=\"0.2em\"/>");
        java.util.regex.Matcher m = java.util.regex.Pattern.compile("([^\\s*^/()]+)(?:\\^\\s*(\\(\\s*[-+]?[0-9./ ]+\\)|[-+]?[0-9.]+))?|([/()])").matcher(t);
        boolean first = true;
        while (m.find()) {
            if (m.group(3) != null) {
                out.append("<mo lspace=\"0\" rspace=\"0\">").append(esc(m.group(3))).append("</mo>");
                first = true;
                continue;
            }
            if (!first) out.append("<mo>&#x2062;</mo><mspace width=\"0.15em\"/>");
            first = false;
            String u = "<mi mathvariant=\"normal\">" + esc(m.group(1)) + "</mi>";
            if (m.group(2) == null) {
                out.append(u);
            } else {
                String p = m.group(2).replaceAll("[()\\s]", "");
                String power = p.startsWith("-") ? "<mrow><mo>−</mo><mn>" + esc(p.substring(1)) + "</mn></mrow>" : "<mn>" + esc(p) + "</mn>";
                out.append("<msup>").append(u).append(power).append("</msup>");
            }
        }
        return out.toString();
    }

    static String number(String text) {
        String t = text.toLowerCase(Locale.ROOT);
        int e = t.indexOf('e');
        if (e < 0) return "<mn>" + esc(text) + "</mn>";
        String mantissa = t.substring(0, e);
        String exp = t.substring(e + 1).replaceFirst("^\\+", "");
        if (exp.matches("-?[0-9]+")) exp = String.valueOf(Integer.parseInt(exp));
        String power = exp.startsWith("-") ? "<mrow><mo>−</mo><mn>" + esc(exp.substring(1)) + "</mn></mrow>" : "<mn>" + esc(exp) + "</mn>";
        return "<mrow>" + (mantissa.equals("1") ? "" : "<mn>" + esc(mantissa) + "</mn><mo>×</mo>") + "<msup><mn>10</mn>" + power
                + "</msup></mrow>";
    }

    private String print(Expr e, int outer) {
        String s;
        if (e instanceof Expr.Num n) {
            s = number(n.text());
        } else if (e instanceof Expr.Quantity q) {
            s = "<mrow>" + number(q.text()) + unit(q.unit()) + "</mrow>";
        } else if (e instanceof Expr.Name n) {
            s = nameOf(n.id());
        } else if (e instanceof Expr.Neg n) {
            s = "<mrow><mo>−</mo>" + print(n.operand(), 3) + "</mrow>";
        } else if (e instanceof Expr.Call c) {
            s = call(c);
        } else if (e instanceof Expr.If i) {
            // An else-if chain is one set of cases, not cases nested in cases.
            StringBuilder rows = new StringBuilder("<mrow><mo>{</mo><mtable columnalign=\"left\">");
            Expr rest = i;
            while (rest instanceof Expr.If c) {
                rows.append("<mtr><mtd>").append(print(c.then(), 0)).append("</mtd><mtd><mtext>if</mtext><mspace width=\"0.5em\"/>")
                        .append(print(c.condition().left(), 1)).append("<mo>").append(esc(compare(c.condition().op()))).append("</mo>")
                        .append(print(c.condition().right(), 1)).append("</mtd></mtr>");
                rest = c.otherwise();
            }
            s = rows.append("<mtr><mtd>").append(print(rest, 0)).append("</mtd><mtd><mtext>otherwise</mtext></mtd></mtr></mtable></mrow>")
                    .toString();
        } else {
            Expr.Binary b = (Expr.Binary) e;
            s = switch (b.op()) {
                case ADD -> "<mrow>" + print(b.left(), 1) + "<mo>+</mo>" + print(b.right(), 2) + "</mrow>";
                case SUB -> "<mrow>" + print(b.left(), 1) + "<mo>−</mo>" + print(b.right(), 2) + "</mrow>";
                case MUL -> "<mrow>" + print(b.left(), 2) + "<mo>" + (LatexPrinter.needsDot(b.right()) ? "·" : "&#x2062;") + "</mo>"
                        + print(b.right(), 3) + "</mrow>";
                case DIV -> "<mfrac>" + print(b.left(), 0) + print(b.right(), 0) + "</mfrac>";
                // A fraction or a quantity raised to a power is bracketed: (P/K)^n.
                case POW -> "<msup>" + (LatexPrinter.bracketedBase(b.left()) ? "<mrow><mo>(</mo>" + print(b.left(), 0) + "<mo>)</mo></mrow>"
                        : print(b.left(), 5)) + print(b.right(), 0) + "</msup>";
            };
            if (b.op() == Expr.BinaryOp.DIV) return s;
        }
        return ExprPrinter.precedence(e) < outer ? "<mrow><mo>(</mo>" + s + "<mo>)</mo></mrow>" : s;
    }

    private static String compare(Expr.CompareOp op) {
        return switch (op) {
            case LT -> "<";
            case LE -> "\u2264";
            case GT -> ">";
            case GE -> "\u2265";
        };
    }

    private String call(Expr.Call c) {
        String args = c.args().stream().map(this::render).collect(Collectors.joining("<mo>,</mo>"));
        if (c.callee().equals("sqrt")) return "<msqrt>" + args + "</msqrt>";
        if (c.callee().equals("abs")) return "<mrow><mo>|</mo>" + args + "<mo>|</mo></mrow>";
        String f = switch (c.callee()) {
            case "log", "ln" -> "<mi>ln</mi>";
            // ISO 80000-2 writes the inverse hyperbolic functions arsinh, arcosh, artanh.
            case "asinh", "acosh", "atanh" -> "<mi>ar" + c.callee().substring(1) + "</mi>";
            case "exp", "log10", "sin", "cos", "tan", "asin", "acos", "atan", "sinh", "cosh", "tanh" -> "<mi>" + c.callee() + "</mi>";
            default -> nameOf(c.callee()) + (c.order() > 0 ? "<mo lspace=\"0\" rspace=\"0\">" + "′".repeat(c.order()) + "</mo>" : "");
        };
        // The invisible function application keeps the brackets at the name: m(r), not m (r).
        return "<mrow>" + f + "<mo>&#x2061;</mo><mo form=\"prefix\" stretchy=\"false\">(</mo>" + args
                + "<mo form=\"postfix\" stretchy=\"false\">)</mo></mrow>";
    }
}
