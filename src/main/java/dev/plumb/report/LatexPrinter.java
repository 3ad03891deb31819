package dev.plumb.report;

import dev.plumb.lang.Expr;
import dev.plumb.lang.ExprPrinter;
import dev.plumb.lang.Identifier;
import java.util.Locale;
import java.util.Map;
import java.util.stream.Collectors;

/** Prints an expression as LaTeX math: fractions, powers, Greek letters and subscripts. */
public final class LatexPrinter {
    private LatexPrinter() {
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
        return print(e, 0);
    }

    /** An identifier: Greek names become letters, a trailing number or {@code _suffix} a subscript. */
    public static String name(String id) {
        Identifier.Parts parts = Identifier.split(id);
        String base = parts.base();
        String sub = parts.subscript();
        String b = GREEK.getOrDefault(base, base.length() == 1 ? base : "\\mathit{" + escape(base) + "}");
        if (sub == null) return b;
        String s = GREEK.getOrDefault(sub, sub.chars().allMatch(Character::isDigit) ? sub : "\\mathrm{" + escape(sub) + "}");
        return b + "_{" + s + "}";
    }

    static String escape(String s) {
        return s.replace("\\", "\\textbackslash{}").replace("_", "\\_").replace("%", "\\%").replace("&", "\\&")
                .replace("#", "\\#").replace("$", "\\$").replace("{", "\\{").replace("}", "\\}");
    }

    /** A number as written, with an exponent shown as a power of ten. */
    public static String number(String text) {
        String t = text.toLowerCase(Locale.ROOT);
        int e = t.indexOf('e');
        if (e < 0) return text;
        String mantissa = t.substring(0, e);
        String exp = t.substring(e + 1).replaceFirst("^\\+", "");
        return (mantissa.equals("1") ? "" : mantissa + "\\times ") + "10^{" + exp + "}";
    }

    public static String unit(String text) {
        return "\\,\\mathrm{" + escape(text).replace(" ", "\\,").replace("*", "\\,") + "}";
    }

    private static String print(Expr e, int outer) {
        String s;
        if (e instanceof Expr.Num n) {
            s = number(n.text());
        } else if (e instanceof Expr.Quantity q) {
            s = number(q.text()) + unit(q.unit());
        } else if (e instanceof Expr.Name n) {
            s = name(n.id());
        } else if (e instanceof Expr.Neg n) {
            s = "-" + print(n.operand(), 3);
        } else if (e instanceof Expr.Call c) {
            s = call(c);
        } else if (e instanceof Expr.If i) {
            s = "\\begin{cases} " + print(i.then(), 0) + " & \\text{if } " + print(i.condition().left(), 1) + " "
                    + compare(i.condition().op()) + " " + print(i.condition().right(), 1) + " \\\\ "
                    + print(i.otherwise(), 0) + " & \\text{otherwise} \\end{cases}";
        } else {
            Expr.Binary b = (Expr.Binary) e;
            s = switch (b.op()) {
                case ADD -> print(b.left(), 1) + " + " + print(b.right(), 2);
                case SUB -> print(b.left(), 1) + " - " + print(b.right(), 2);
                case MUL -> print(b.left(), 2) + (needsDot(b.right()) ? " \\cdot " : "\\,") + print(b.right(), 3);
                case DIV -> "\\frac{" + print(b.left(), 0) + "}{" + print(b.right(), 0) + "}";
                case POW -> "{" + print(b.left(), 5) + "}^{" + print(b.right(), 0) + "}";
            };
            if (b.op() == Expr.BinaryOp.DIV) return s;
        }
        return ExprPrinter.precedence(e) < outer ? "\\left(" + s + "\\right)" : s;
    }

    private static boolean needsDot(Expr right) {
        return right instanceof Expr.Num || right instanceof Expr.Quantity
                || right instanceof Expr.Binary b && b.op() == Expr.BinaryOp.POW && b.left() instanceof Expr.Num;
    }

    private static String compare(Expr.CompareOp op) {
        return switch (op) {
            case LT -> "<";
            case LE -> "\\le";
            case GT -> ">";
            case GE -> "\\ge";
        };
    }

    private static String call(Expr.Call c) {
        String args = c.args().stream().map(LatexPrinter::print).collect(Collectors.joining(", "));
        switch (c.callee()) {
            case "sqrt":
                return "\\sqrt{" + args + "}";
            case "exp":
                return "\\exp\\left(" + args + "\\right)";
            case "log":
                return "\\ln\\left(" + args + "\\right)";
            case "log10":
                return "\\log_{10}\\left(" + args + "\\right)";
            case "abs":
                return "\\left|" + args + "\\right|";
            case "sin": case "cos": case "tan": case "sinh": case "cosh": case "tanh":
                return "\\" + c.callee() + "\\left(" + args + "\\right)";
            case "asin": case "acos": case "atan":
                return "\\arc" + c.callee().substring(1) + "\\left(" + args + "\\right)";
            default:
                return name(c.callee()) + "'".repeat(c.order()) + "\\left(" + args + "\\right)";
        }
    }
}
