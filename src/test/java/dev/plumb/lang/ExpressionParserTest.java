package dev.plumb.lang;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;

import dev.plumb.lang.Expr.BinaryOp;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Precedence, associativity, literals and case-sensitive names. */
class ExpressionParserTest {

    private static Expr.Binary binary(Expr e, BinaryOp op) {
        Expr.Binary b = assertInstanceOf(Expr.Binary.class, e);
        assertEquals(op, b.op(), () -> "in " + ExprPrinter.print(e));
        return b;
    }

    private static String name(Expr e) {
        return assertInstanceOf(Expr.Name.class, e).id();
    }

    @Test
    void powerBindsRight() {
        Expr.Binary top = binary(Parsing.expr("a^b^c"), BinaryOp.POW);
        assertEquals("a", name(top.left()));
        Expr.Binary inner = binary(top.right(), BinaryOp.POW);
        assertEquals("b", name(inner.left()));
        assertEquals("c", name(inner.right()));
    }

    @Test
    void unaryMinusAppliesToThePower() {
        Expr.Neg neg = assertInstanceOf(Expr.Neg.class, Parsing.expr("-x^2"));
        Expr.Binary pow = binary(neg.operand(), BinaryOp.POW);
        assertEquals("x", name(pow.left()));
        assertEquals(2.0, assertInstanceOf(Expr.Num.class, pow.right()).value());
    }

    @Test
    void negativeExponent() {
        Expr.Binary pow = binary(Parsing.expr("R^-4"), BinaryOp.POW);
        Expr.Neg exponent = assertInstanceOf(Expr.Neg.class, pow.right());
        assertEquals(4.0, assertInstanceOf(Expr.Num.class, exponent.operand()).value());
    }

    @Test
    void productsBindTighterThanSumsAndBothAreLeftAssociative() {
        Expr.Binary sum = binary(Parsing.expr("a + b*c - d"), BinaryOp.SUB);
        Expr.Binary left = binary(sum.left(), BinaryOp.ADD);
        assertEquals("a", name(left.left()));
        binary(left.right(), BinaryOp.MUL);
        assertEquals("d", name(sum.right()));

        Expr.Binary quotient = binary(Parsing.expr("a/b*c"), BinaryOp.MUL);
        binary(quotient.left(), BinaryOp.DIV);
        assertEquals("c", name(quotient.right()));

        Expr.Binary diff = binary(Parsing.expr("a - b - c"), BinaryOp.SUB);
        binary(diff.left(), BinaryOp.SUB);
    }

    @Test
    void powerBindsTighterThanProduct() {
        Expr.Binary product = binary(Parsing.expr("4/3*pi*R^3"), BinaryOp.MUL);
        Expr.Binary pow = binary(product.right(), BinaryOp.POW);
        assertEquals("R", name(pow.left()));
        binary(binary(product.left(), BinaryOp.MUL).left(), BinaryOp.DIV);
    }

    @Test
    void parenthesesOverridePrecedence() {
        Expr.Binary product = binary(Parsing.expr("2*(a + b)"), BinaryOp.MUL);
        binary(product.right(), BinaryOp.ADD);
        Expr.Binary pow = binary(Parsing.expr("(-x)^2"), BinaryOp.POW);
        assertInstanceOf(Expr.Neg.class, pow.left());
    }

    @Test
    void numberLiterals() {
        assertEquals(12.0, assertInstanceOf(Expr.Num.class, Parsing.expr("12")).value());
        assertEquals(1.5, assertInstanceOf(Expr.Num.class, Parsing.expr("1.5")).value());
        Expr.Num g = assertInstanceOf(Expr.Num.class, Parsing.expr("6.674e-11"));
        assertEquals(6.674e-11, g.value());
        assertEquals("6.674e-11", g.text());
        assertEquals(2e30, assertInstanceOf(Expr.Num.class, Parsing.expr("2E+30")).value());
    }

    @Test
    void quantityLiteralKeepsTheUnitText() {
        Expr.Quantity q = assertInstanceOf(Expr.Quantity.class, Parsing.expr("6371 [km]"));
        assertEquals(6371.0, q.value());
        assertEquals("km", q.unit());
        assertEquals(new Span(1, 11, 1, 15), q.unitSpan());
        assertEquals("kg^(-4/3) m", assertInstanceOf(Expr.Quantity.class, Parsing.expr("1 [kg^(-4/3) m]")).unit());
    }

    @Test
    void derivativesCountPrimes() {
        Expr.Call first = assertInstanceOf(Expr.Call.class, Parsing.expr("P'(r)"));
        assertEquals(1, first.order());
        Expr.Call second = assertInstanceOf(Expr.Call.class, Parsing.expr("P''(r)"));
        assertEquals(2, second.order());
        assertEquals("P", second.callee());
        assertEquals(0, assertInstanceOf(Expr.Call.class, Parsing.expr("P(0)")).order());
    }

    @Test
    void callsTakeSeveralArguments() {
        Expr.Call c = assertInstanceOf(Expr.Call.class, Parsing.expr("f(1, x^2, 3 [m])"));
        assertEquals(3, c.args().size());
        assertInstanceOf(Expr.Quantity.class, c.args().get(2));
    }

    @Test
    void identifiersAreCaseSensitive() {
        Expr.Binary b = binary(Parsing.expr("m*M"), BinaryOp.MUL);
        assertEquals("m", name(b.left()));
        assertEquals("M", name(b.right()));
    }

    @Test
    void capitalLettersThatMeanSomethingElsewhereAreOrdinaryNames() {
        for (String id : List.of("E", "I", "N", "D", "C", "Mm", "mm", "T0")) {
            assertEquals(id, name(Parsing.expr(id)), id);
        }
        Stmt.Param p = Parsing.only("param E [J] > 0", Stmt.Param.class);
        assertEquals("E", p.name());
    }

    @Test
    void spansCoverTheWholeExpression() {
        Expr e = Parsing.expr("-G*m(r)*rho/r^2");
        assertEquals(new Span(1, 6, 1, 21), e.span());
    }

    @Test
    void printerRoundTripsPrecedence() {
        for (String s : List.of("-x^2", "a^b^c", "(a^b)^c", "a - (b - c)", "a/(b*c)", "(-x)^2", "P'(r)")) {
            assertEquals(s, ExprPrinter.print(Parsing.expr(s)), s);
        }
    }
}
