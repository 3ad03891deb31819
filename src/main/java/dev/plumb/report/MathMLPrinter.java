package dev.plumb.report;

import dev.plumb.lang.Expr;
import dev.plumb.lang.ExprPrinter;
import dev.plumb.lang.Identifier;
import java.util.Locale;
import java.util.Map;
import java.util.stream.Collectors;

/** Prints an expression as presentation MathML, for self-contained HTML reports. */
public final class MathMLPrinter {
    private MathMLPrinter() {
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
        return "<math display=\"block\"><mrow>" + print(lhs) + (rhs == null ? "" : "<mo>" + esc(relation) + "</mo>" + print(rhs))
                + "</mrow></math>";
    }

    public static String inline(Expr e) {
        return "<math><mrow>" + print(e) + "</mrow></math>";
    }

    public static String print(Expr e) {
        return print(e, 0);
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

    static String number(String text) {
        String t = text.toLowerCase(Locale.ROOT);
        int e = t.indexOf('e');
        if (e < 0) return "<mn>" + esc(text) + "</mn>";
        String mantissa = t.substring(0, e);
        String exp = t.substring(e + 1).replaceFirst("^\\+", "");
        return "<mrow><mn>" + esc(mantissa) + "</mn><mo>×</mo><msup><mn>10</mn><mn>" + esc(exp) + "</mn></msup></mrow>";
    }

    private static String print(Expr e, int outer) {
        String s;
        if (e instanceof Expr.Num n) {
            s = number(n.text());
        } else if (e instanceof Expr.Quantity q) {
            s = "<mrow>" + number(q.text()) + "<mspace width=\"0.2em\"/><mi mathvariant=\"normal\">" + esc(q.unit()) + "</mi></mrow>";
        } else if (e instanceof Expr.Name n) {
            s = name(n.id());
        } else if (e instanceof Expr.Neg n) {
            s = "<mrow><mo>−</mo>" + print(n.operand(), 3) + "</mrow>";
        } else if (e instanceof Expr.Call c) {
            s = call(c);
        } else if (e instanceof Expr.If i) {
            s = "<mrow><mo>{</mo><mtable><mtr><mtd>" + print(i.then(), 0) + "</mtd><mtd><mtext>if </mtext>"
                    + print(i.condition().left(), 1) + "<mo>" + esc(i.condition().op().symbol) + "</mo>"
                    + print(i.condition().right(), 1) + "</mtd></mtr><mtr><mtd>" + print(i.otherwise(), 0)
                    + "</mtd><mtd><mtext>otherwise</mtext></mtd></mtr></mtable></mrow>";
        } else {
            Expr.Binary b = (Expr.Binary) e;
            s = switch (b.op()) {
                case ADD -> "<mrow>" + print(b.left(), 1) + "<mo>+</mo>" + print(b.right(), 2) + "</mrow>";
                case SUB -> "<mrow>" + print(b.left(), 1) + "<mo>−</mo>" + print(b.right(), 2) + "</mrow>";
                case MUL -> "<mrow>" + print(b.left(), 2) + "<mo>" + (b.right() instanceof Expr.Num ? "·" : "&#x2062;") + "</mo>"
                        + print(b.right(), 3) + "</mrow>";
                case DIV -> "<mfrac>" + print(b.left(), 0) + print(b.right(), 0) + "</mfrac>";
                case POW -> "<msup>" + print(b.left(), 5) + print(b.right(), 0) + "</msup>";
            };
            if (b.op() == Expr.BinaryOp.DIV) return s;
        }
        return ExprPrinter.precedence(e) < outer ? "<mrow><mo>(</mo>" + s + "<mo>)</mo></mrow>" : s;
    }

    private static String call(Expr.Call c) {
        String args = c.args().stream().map(MathMLPrinter::print).collect(Collectors.joining("<mo>,</mo>"));
        if (c.callee().equals("sqrt")) return "<msqrt>" + args + "</msqrt>";
        if (c.callee().equals("abs")) return "<mrow><mo>|</mo>" + args + "<mo>|</mo></mrow>";
        String f = switch (c.callee()) {
            case "log", "ln" -> "<mi>ln</mi>";
            // ISO 80000-2 writes the inverse hyperbolic functions arsinh, arcosh, artanh.
            case "asinh", "acosh", "atanh" -> "<mi>ar" + c.callee().substring(1) + "</mi>";
            case "exp", "log10", "sin", "cos", "tan", "asin", "acos", "atan", "sinh", "cosh", "tanh" -> "<mi>" + c.callee() + "</mi>";
            default -> name(c.callee()) + (c.order() > 0 ? "<mo>" + "′".repeat(c.order()) + "</mo>" : "");
        };
        return "<mrow>" + f + "<mo>(</mo>" + args + "<mo>)</mo></mrow>";
    }
}
