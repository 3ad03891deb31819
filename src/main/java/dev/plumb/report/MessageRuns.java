package dev.plumb.report;

import dev.plumb.lang.Expr;
import dev.plumb.lang.Parser;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.function.Predicate;

/**
 * A message as running text with its formulas typeset. The stages write their messages as sentences
 * with formulas in plumb's notation ("the derived value is P(0) = 3*G*M^2/(8*pi*R^4)"); this finds
 * each formula by reading it back with plumb's own parser: around each {@code =} standing alone, the
 * word before it and the longest run of words after it that parse as expressions whose every name is
 * one the file knows (so that English words never pass for symbols), and a lone call of a known name
 * such as {@code P'(r)}. What is not read back that way stays text.
 */
final class MessageRuns {
    private static final Set<String> FUNCTIONS = Set.of("sqrt", "exp", "log", "ln", "log10", "sin", "cos", "tan", "asin", "acos",
            "atan", "sinh", "cosh", "tanh", "asinh", "acosh", "atanh", "abs", "pi", "e", "π");
    /** How many words after an {@code =} a formula may take (plumb prints a blank only around {@code +} and {@code -}). */
    private static final int LONGEST = 80;

    private final Predicate<String> known;

    /** Reads formulas whose names all pass {@code known} (the file's symbols); the built-in functions always do. */
    MessageRuns(Predicate<String> known) {
        this.known = name -> known.test(name) || FUNCTIONS.contains(name);
    }

    List<Markup.Inline> of(String message) {
        List<Markup.Inline> out = new ArrayList<>();
        if (message == null || message.isEmpty()) return out;
        String[] words = message.split(" ", -1);
        StringBuilder text = new StringBuilder();
        int i = 0;
        while (i < words.length) {
            // An equation: WORD = WORDS..., with the longest right side that reads back.
            if (i + 2 < words.length && words[i + 1].equals("=")) {
                String lhsWord = words[i];
                String lead = lhsWord.startsWith("(") && !balanced(lhsWord) ? "(" : "";
                Expr lhs = formula(lhsWord.substring(lead.length()));
                int best = -1;
                Expr rhs = null;
                String rest = "";
                StringBuilder candidate = new StringBuilder();
                for (int j = i + 2; j < words.length && j < i + 2 + LONGEST; j++) {
                    if (j > i + 2) candidate.append(' ');
                    candidate.append(words[j]);
                    String c = candidate.toString();
                    String trimmed = c.replaceAll("[,;:.]+$", "");
                    Expr e = formula(trimmed);
                    if (e == null && trimmed.endsWith(")") && !balanced(trimmed)) {
                        trimmed = trimmed.substring(0, trimmed.length() - 1);
                        e = formula(trimmed);
                    }
                    if (e != null) {
                        best = j;
                        rhs = e;
                        rest = c.substring(trimmed.length());
                    }
                }
                if (rhs != null) {
                    if (lhs != null) {
                        text.append(lead);
                        flush(text, out);
                        out.add(new Markup.Inline.Math(lhs, "=", rhs));
                    } else {
                        // A left side in words ("claimed/true = 2"): only the value is mathematics.
                        text.append(lhsWord).append(" = ");
                        flush(text, out);
                        out.add(Markup.Inline.Math.of(rhs));
                    }
                    text.append(rest);
                    if (best + 1 < words.length) text.append(' ');
                    i = best + 1;
                    continue;
                }
            }
            Expr call = lone(words[i]);
            if (call != null) {
                String w = words[i];
                String core = w.replaceAll("[,;:.]+$", "");
                flush(text, out);
                out.add(Markup.Inline.Math.of(call));
                text.append(w.substring(core.length()));
            } else {
                text.append(words[i]);
            }
            if (i + 1 < words.length) text.append(' ');
            i++;
        }
        flush(text, out);
        return out;
    }

    /**
     * A word that is a formula of known names on its own, with punctuation after it: a call such as
     * {@code P(0)} or {@code P'(r)}, or a product, quotient or power such as {@code m_u^(-1)*M}.
     */
    private Expr lone(String word) {
        String core = word.replaceAll("[,;:.]+$", "");
        boolean call = core.matches("[\\p{L}_][\\p{L}\\p{N}_]*'*\\(.+\\)");
        boolean operation = core.matches(".*\\p{L}.*") && core.matches(".*[*/^].*");
        if (!call && !operation) return null;
        return formula(core);
    }

    /** The expression {@code text} reads as, when it does and every name in it is known; else null. */
    private Expr formula(String text) {
        if (text.isBlank() || text.startsWith(" ") || text.endsWith(" ")) return null;
        Expr e;
        try {
            e = Parser.parseExpression(text);
        } catch (RuntimeException ex) {
            return null;
        }
        return e != null && allKnown(e) ? e : null;
    }

    private boolean allKnown(Expr e) {
        if (e instanceof Expr.Name n) return known.test(n.id());
        if (e instanceof Expr.Call c) return known.test(c.callee()) && c.args().stream().allMatch(this::allKnown);
        if (e instanceof Expr.Neg n) return allKnown(n.operand());
        if (e instanceof Expr.Binary b) return allKnown(b.left()) && allKnown(b.right());
        if (e instanceof Expr.If f) {
            return allKnown(f.condition().left()) && allKnown(f.condition().right()) && allKnown(f.then()) && allKnown(f.otherwise());
        }
        return true;
    }

    private static boolean balanced(String s) {
        int depth = 0;
        for (char c : s.toCharArray()) {
            if (c == '(') depth++;
            if (c == ')' && --depth < 0) return false;
        }
        return depth == 0;
    }

    private static void flush(StringBuilder text, List<Markup.Inline> out) {
        if (text.length() > 0) out.add(new Markup.Inline.Text(text.toString()));
        text.setLength(0);
    }
}
