package dev.plumb.lang;

import java.util.stream.Collectors;

/** Prints an expression back in plumb syntax with the fewest parentheses that keep its meaning. */
public final class ExprPrinter {
    private ExprPrinter() {
    }

    public static String print(Expr e) {
        return print(e, 0);
    }

    /** Binding strength of an expression's top operator: 1 for + -, 2 for * /, 3 for negation, 4 for ^, 5 for atoms. */
    public static int precedence(Expr e) {
        if (e instanceof Expr.Binary b) {
            return switch (b.op()) {
                case ADD, SUB -> 1;
                case MUL, DIV -> 2;
                case POW -> 4;
            };
        }
        if (e instanceof Expr.Neg) return 3;
        if (e instanceof Expr.If) return 0;
        return 5;
    }

    private static String print(Expr e, int outer) {
        String s;
        if (e instanceof Expr.Num n) {
            s = n.text();
        } else if (e instanceof Expr.Quantity q) {
            s = q.text() + " [" + q.unit() + "]";
        } else if (e instanceof Expr.Name n) {
            s = n.id();
        } else if (e instanceof Expr.Neg n) {
            s = "-" + print(n.operand(), 3);
        } else if (e instanceof Expr.Call c) {
            s = c.callee() + "'".repeat(c.order()) + "("
                    + c.args().stream().map(ExprPrinter::print).collect(Collectors.joining(", ")) + ")";
        } else if (e instanceof Expr.If i) {
            s = "if " + print(i.condition().left(), 1) + " " + i.condition().op().symbol + " "
                    + print(i.condition().right(), 1) + " then " + print(i.then(), 0) + " else " + print(i.otherwise(), 0);
        } else {
            Expr.Binary b = (Expr.Binary) e;
            int p = precedence(b);
            // Left-associative operators need parentheses on a right operand of equal rank; '^' the reverse.
            int leftMin = b.op() == Expr.BinaryOp.POW ? p + 1 : p;
            int rightMin = b.op() == Expr.BinaryOp.POW ? p : p + 1;
            String sep = b.op() == Expr.BinaryOp.ADD || b.op() == Expr.BinaryOp.SUB ? " " + b.op().symbol + " " : b.op().symbol;
            s = print(b.left(), leftMin) + sep + print(b.right(), rightMin);
        }
        boolean quantityInPower = e instanceof Expr.Quantity && outer >= 4;
        return precedence(e) < outer || quantityInPower ? "(" + s + ")" : s;
    }
}
