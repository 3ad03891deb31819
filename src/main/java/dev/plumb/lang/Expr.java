package dev.plumb.lang;

import java.util.List;

/** An expression of the plumb language, as written. */
public sealed interface Expr {

    Span span();

    /** A plain number such as {@code 12}, {@code 1.5} or {@code 6.674e-11}; {@code text} is as written. */
    record Num(double value, String text, Span span) implements Expr { }

    /** A number with a unit, {@code 6371 [km]}: {@code unit} is the text inside the brackets. */
    record Quantity(double value, String text, String unit, Span unitSpan, Span span) implements Expr { }

    /** A reference to a parameter, the coordinate, a definition, an unknown constant or a built-in constant. */
    record Name(String id, Span span) implements Expr { }

    /**
     * A call {@code f(a, b)} of a built-in function, a {@code let} function or an unknown profile;
     * {@code order} counts primes, {@code P''(r)} having order 2 (0 for a plain call).
     */
    record Call(String callee, Span calleeSpan, int order, List<Expr> args, Span span) implements Expr {
        public Call {
            args = List.copyOf(args);
        }
    }

    /** Negation, {@code -x}. */
    record Neg(Expr operand, Span span) implements Expr { }

    /** A binary arithmetic operation. */
    record Binary(BinaryOp op, Expr left, Expr right, Span span) implements Expr { }

    /** {@code if COND then A else B}. */
    record If(Condition condition, Expr then, Expr otherwise, Span span) implements Expr { }

    /** A comparison used as the condition of an {@code if}. */
    record Condition(CompareOp op, Expr left, Expr right, Span span) { }

    enum BinaryOp {
        ADD("+"), SUB("-"), MUL("*"), DIV("/"), POW("^");
        public final String symbol;

        BinaryOp(String symbol) {
            this.symbol = symbol;
        }
    }

    enum CompareOp {
        LT("<"), LE("<="), GT(">"), GE(">=");
        public final String symbol;

        CompareOp(String symbol) {
            this.symbol = symbol;
        }

        public boolean test(double a, double b) {
            return switch (this) {
                case LT -> a < b;
                case LE -> a <= b;
                case GT -> a > b;
                case GE -> a >= b;
            };
        }
    }
}
