package dev.plumb.report;

import dev.plumb.lang.Expr;
import dev.plumb.lang.ExprPrinter;
import dev.plumb.lang.Identifier;
import dev.plumb.lang.Parser;
import dev.plumb.units.UnitCatalog;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The words on a plot's axes, typeset: a quantity in plumb's notation ({@code rho_c}, {@code m(R)})
 * with its symbols in italic and Greek letters as letters, and a unit as written in the file
 * ({@code g/cm^3}) with its powers raised. For SVG as runs of styled text; for LaTeX as math.
 */
final class PlotText {
    private PlotText() {
    }

    /** How far a run sits from the baseline. */
    enum Shift { BASE, SUPER, SUB }

    /** A stretch of text in one style. */
    record Run(String text, boolean italic, Shift shift) {
        static Run plain(String t) {
            return new Run(t, false, Shift.BASE);
        }
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

    /** Astronomical units keep their customary symbols: M with the Sun's sign for Msun, and so on. */
    private static final Map<String, String[]> ASTRONOMICAL = Map.of(
            "Msun", new String[] {"M", "☉", "\\odot"}, "Rsun", new String[] {"R", "☉", "\\odot"},
            "Lsun", new String[] {"L", "☉", "\\odot"}, "Mearth", new String[] {"M", "⊕", "\\oplus"},
            "Rearth", new String[] {"R", "⊕", "\\oplus"}, "Mjup", new String[] {"M", "J", "\\mathrm{J}"},
            "Rjup", new String[] {"R", "J", "\\mathrm{J}"});

    private static final Pattern UNIT_TOKEN = Pattern.compile(
            "([^\\s*/()^0-9.]+)|\\^\\s*(\\(\\s*-?\\s*\\d+\\s*(?:/\\s*\\d+\\s*)?\\)|-?\\d+(?:\\.\\d+)?)|([*/()])|(\\s+)|(\\d+(?:\\.\\d+)?)");

    /** An axis title: the quantity, then the common power of ten and the unit in brackets. */
    static List<Run> axisTitle(Plot.Axis axis, int power) {
        List<Run> out = new ArrayList<>(quantity(axis.quantity()));
        if (power == 0 && axis.dimensionless()) return out;
        out.add(Run.plain(" ["));
        if (power != 0) {
            out.add(Run.plain("10"));
            out.add(new Run(minus(Integer.toString(power)), false, Shift.SUPER));
            if (!axis.dimensionless()) out.add(Run.plain("\u2009"));
        }
        if (!axis.dimensionless()) out.addAll(unit(axis.unit()));
        out.add(Run.plain("]"));
        return out;
    }

    /** The same title as LaTeX (text mode, its mathematics in {@code $...$}). */
    static String texAxisTitle(Plot.Axis axis, int power) {
        StringBuilder s = new StringBuilder(texQuantity(axis.quantity()));
        if (power == 0 && axis.dimensionless()) return s.toString();
        s.append(" [$");
        if (power != 0) s.append("10^{").append(power).append("}");
        if (power != 0 && !axis.dimensionless()) s.append("\\,");
        if (!axis.dimensionless()) s.append(texUnit(axis.unit()));
        return s.append("$]").toString();
    }

    static List<Run> quantity(String text) {
        Expr e = Parser.parseExpression(text);
        List<Run> out = new ArrayList<>();
        if (e == null) {
            out.add(Run.plain(text));
        } else {
            expr(e, 0, Shift.BASE, out);
        }
        return out;
    }

    static String texQuantity(String text) {
        Expr e = Parser.parseExpression(text);
        return e == null ? LatexPrinter.escape(text) : "$" + LatexPrinter.print(e) + "$";
    }

    /** A unit as written in the file, as runs: names upright, powers raised, a product spaced thinly. */
    static List<Run> unit(String text) {
        List<Run> out = new ArrayList<>();
        Matcher m = UNIT_TOKEN.matcher(text);
        int at = 0;
        while (at < text.length() && m.find(at) && m.start() == at) {
            if (m.group(1) != null) {
                String[] astro = ASTRONOMICAL.get(m.group(1));
                if (astro != null) {
                    out.add(Run.plain(astro[0]));
                    out.add(new Run(astro[1], false, Shift.SUB));
                } else {
                    out.add(Run.plain(micro(m.group(1))));
                }
            } else if (m.group(2) != null) {
                out.add(new Run(minus(m.group(2).replaceAll("[()\\s]", "")), false, Shift.SUPER));
            } else if (m.group(3) != null) {
                out.add(Run.plain(m.group(3).equals("*") ? "\u2009" : m.group(3)));
            } else if (m.group(4) != null) {
                out.add(Run.plain("\u2009"));
            } else {
                out.add(Run.plain(m.group(5)));
            }
            at = m.end();
        }
        if (at < text.length()) out.add(Run.plain(text.substring(at)));
        return out;
    }

    /** A unit as LaTeX math (without the dollars). */
    static String texUnit(String text) {
        StringBuilder s = new StringBuilder();
        Matcher m = UNIT_TOKEN.matcher(text);
        int at = 0;
        while (at < text.length() && m.find(at) && m.start() == at) {
            if (m.group(1) != null) {
                String[] astro = ASTRONOMICAL.get(m.group(1));
                String name = micro(m.group(1));
                s.append(astro != null ? "\\mathrm{" + astro[0] + "}_{" + astro[2] + "}"
                        : name.startsWith("µ") ? "\\mu\\mathrm{" + LatexPrinter.escape(name.substring(1)) + "}"
                        : "\\mathrm{" + LatexPrinter.escape(name) + "}");
            } else if (m.group(2) != null) {
                s.append("^{").append(m.group(2).replaceAll("[()\\s]", "")).append("}");
            } else if (m.group(3) != null) {
                s.append(m.group(3).equals("*") ? "\\," : m.group(3));
            } else if (m.group(4) != null) {
                s.append("\\,");
            } else {
                s.append(m.group(5));
            }
            at = m.end();
        }
        if (at < text.length()) s.append("\\text{").append(LatexPrinter.escape(text.substring(at))).append("}");
        return s.toString();
    }

    /** Micro is written "u" in plumb files; a prefixed unit such as "um" reads µm. */
    private static String micro(String name) {
        if (name.length() > 1 && name.startsWith("u") && !UnitCatalog.namedSymbols().contains(name)
                && UnitCatalog.namedSymbols().contains(name.substring(1)) && UnitCatalog.takesPrefixes(name.substring(1))) {
            return "µ" + name.substring(1);
        }
        return name;
    }

    /** ASCII hyphen-minus to the minus sign, as typeset text wants. */
    static String minus(String s) {
        return s.replace('-', '−');
    }

    private static void expr(Expr e, int outer, Shift shift, List<Run> out) {
        boolean paren = ExprPrinter.precedence(e) < outer;
        if (paren) out.add(new Run("(", false, shift));
        if (e instanceof Expr.Num n) {
            number(n.text(), shift, out);
        } else if (e instanceof Expr.Quantity q) {
            number(q.text(), shift, out);
            out.add(new Run("\u2009", false, shift));
            for (Run r : unit(q.unit())) out.add(new Run(r.text(), r.italic(), shift == Shift.BASE ? r.shift() : shift));
        } else if (e instanceof Expr.Name n) {
            name(n.id(), shift, out);
        } else if (e instanceof Expr.Neg n) {
            out.add(new Run("−", false, shift));
            expr(n.operand(), 3, shift, out);
        } else if (e instanceof Expr.Call c) {
            String fn = switch (c.callee()) {
                case "log" -> "ln";
                case "exp", "log10", "sin", "cos", "tan", "asin", "acos", "atan", "sinh", "cosh", "tanh", "sqrt", "abs" -> c.callee();
                default -> null;
            };
            if (fn != null) {
                out.add(new Run(fn, false, shift));
            } else {
                name(c.callee(), shift, out);
                if (c.order() > 0) out.add(new Run("′".repeat(c.order()), false, shift));
            }
            out.add(new Run("(", false, shift));
            for (int i = 0; i < c.args().size(); i++) {
                if (i > 0) out.add(new Run(", ", false, shift));
                expr(c.args().get(i), 0, shift, out);
            }
            out.add(new Run(")", false, shift));
        } else if (e instanceof Expr.Binary b) {
            switch (b.op()) {
                case ADD, SUB -> {
                    expr(b.left(), 1, shift, out);
                    out.add(new Run(b.op() == Expr.BinaryOp.ADD ? " + " : " − ", false, shift));
                    expr(b.right(), 2, shift, out);
                }
                case MUL -> {
                    expr(b.left(), 2, shift, out);
                    out.add(new Run(b.right() instanceof Expr.Num || b.right() instanceof Expr.Quantity ? "·" : "\u2009", false, shift));
                    expr(b.right(), 3, shift, out);
                }
                case DIV -> {
                    expr(b.left(), 2, shift, out);
                    out.add(new Run("/", false, shift));
                    expr(b.right(), 3, shift, out);
                }
                case POW -> {
                    expr(b.left(), 5, shift, out);
                    // A power inside a power stays at the first raised level: two levels would be unreadable at axis size.
                    expr(b.right(), 0, Shift.SUPER, out);
                }
            }
        } else {
            out.add(new Run(ExprPrinter.print(e), false, shift));
        }
        if (paren) out.add(new Run(")", false, shift));
    }

    private static void name(String id, Shift shift, List<Run> out) {
        Identifier.Parts parts = Identifier.split(id);
        out.add(new Run(GREEK.getOrDefault(parts.base(), parts.base()), true, shift));
        if (parts.subscript() != null) {
            String sub = parts.subscript();
            out.add(new Run(GREEK.getOrDefault(sub, sub), false, shift == Shift.BASE ? Shift.SUB : shift));
        }
    }

    private static void number(String text, Shift shift, List<Run> out) {
        String t = text.toLowerCase(java.util.Locale.ROOT);
        int e = t.indexOf('e');
        if (e < 0) {
            out.add(new Run(text, false, shift));
            return;
        }
        String mantissa = t.substring(0, e);
        if (!mantissa.equals("1")) out.add(new Run(mantissa + "×", false, shift));
        out.add(new Run("10", false, shift));
        out.add(new Run(minus(t.substring(e + 1).replaceFirst("^\\+", "")), false, Shift.SUPER));
    }
}
