package dev.plumb.lang;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;

/** Every statement form of the language reference, one at a time. */
class StatementParserTest {

    @Test
    void title() {
        Stmt.Title t = Parsing.only("title \"Uniform-density sphere\"", Stmt.Title.class);
        assertEquals("Uniform-density sphere", t.text());
        assertEquals(new Span(1, 1, 1, 31), t.span());
    }

    @Test
    void typesetGivesANameItsTexAsWritten() {
        Stmt.Typeset t = Parsing.only("typeset Rstar as \"R_\\star\"", Stmt.Typeset.class);
        assertEquals("Rstar", t.name());
        assertEquals("R_\\star", t.tex());
        assertEquals(new Span(1, 9, 1, 14), t.nameSpan());
        // Columns counted by hand: the quoted TeX runs from column 18 to 26.
        assertEquals(new Span(1, 18, 1, 27), t.texSpan());
        assertNull(TexForm.check(t.tex()));
        assertEquals(2, TexForm.check("R_{\\star").offset(), "the unclosed brace");
        assertEquals(0, TexForm.check("\\write18{x}").offset(), "a command outside the checked set");
        assertEquals(1, TexForm.check("R_").offset(), "a subscript of nothing");
        assertEquals(1, TexForm.check("R$").offset(), "a character that would leave math");
    }

    @Test
    void paramWithUnitAndPositiveAssumption() {
        Stmt.Param p = Parsing.only("param M [kg] > 0", Stmt.Param.class);
        assertEquals("M", p.name());
        assertEquals("kg", p.unit().text());
        assertEquals(Stmt.Assumption.POSITIVE, p.assumption());
        assertNull(p.value());
        assertEquals(new Span(1, 7, 1, 8), p.nameSpan());
    }

    @Test
    void paramWithNonNegativeAssumption() {
        Stmt.Param p = Parsing.only("param h [m] >= 0", Stmt.Param.class);
        assertEquals(Stmt.Assumption.NON_NEGATIVE, p.assumption());
        assertEquals("m", p.unit().text());
    }

    @Test
    void paramWithoutUnitOrAssumptionIsFree() {
        Stmt.Param p = Parsing.only("param a", Stmt.Param.class);
        assertNull(p.unit());
        assertNull(p.assumption());
        assertNull(p.value());
    }

    @Test
    void fixedParamWithoutUnit() {
        Stmt.Param p = Parsing.only("param n = 3", Stmt.Param.class);
        Expr.Num value = assertInstanceOf(Expr.Num.class, p.value());
        assertEquals(3.0, value.value());
        assertNull(p.unit());
        assertNull(p.assumption());
    }

    @Test
    void fixedParamWithQuantityValue() {
        Stmt.Param p = Parsing.only("param g = 9.80665 [m/s^2]", Stmt.Param.class);
        Expr.Quantity q = assertInstanceOf(Expr.Quantity.class, p.value());
        assertEquals(9.80665, q.value());
        assertEquals("m/s^2", q.unit());
        assertNull(p.unit());
    }

    @Test
    void fixedParamWithDeclaredUnitCarriesItToTheNumber() {
        Stmt.Param p = Parsing.only("param g [m/s^2] = 9.80665", Stmt.Param.class);
        assertEquals("m/s^2", p.unit().text());
        Expr.Quantity q = assertInstanceOf(Expr.Quantity.class, p.value());
        assertEquals("m/s^2", q.unit());
        assertEquals(9.80665, q.value());
    }

    @Test
    void coord() {
        Stmt.Coord c = Parsing.only("coord r [m] from 0 to R", Stmt.Coord.class);
        assertEquals("r", c.name());
        assertEquals("m", c.unit().text());
        assertEquals(0.0, assertInstanceOf(Expr.Num.class, c.from()).value());
        assertEquals("R", assertInstanceOf(Expr.Name.class, c.to()).id());
    }

    @Test
    void letWithoutParameters() {
        Stmt.Let l = Parsing.only("let rho = M / (4/3*pi*R^3)", Stmt.Let.class);
        assertEquals("rho", l.name());
        assertEquals(List.of(), l.params());
        Expr.Binary body = assertInstanceOf(Expr.Binary.class, l.body());
        assertEquals(Expr.BinaryOp.DIV, body.op());
        assertEquals("M", assertInstanceOf(Expr.Name.class, body.left()).id());
    }

    @Test
    void letWithParameters() {
        assertEquals(List.of("r"), Parsing.only("let m(r) = 4/3*pi*r^3*rho", Stmt.Let.class).params());
        assertEquals(List.of("x", "y"), Parsing.only("let f(x, y) = x*y", Stmt.Let.class).params());
    }

    @Test
    void unknownProfileWithUnit() {
        Stmt.Unknown u = Parsing.only("unknown P(r) [Pa]", Stmt.Unknown.class);
        assertEquals("P", u.name());
        assertEquals(List.of("r"), u.args());
        assertEquals("Pa", u.unit().text());
        assertTrue(u.isProfile());
    }

    @Test
    void unknownProfileWithoutUnit() {
        Stmt.Unknown u = Parsing.only("unknown T(z)", Stmt.Unknown.class);
        assertTrue(u.isProfile());
        assertNull(u.unit());
    }

    @Test
    void unknownConstantWithAndWithoutUnit() {
        Stmt.Unknown k = Parsing.only("unknown K", Stmt.Unknown.class);
        assertFalse(k.isProfile());
        assertNull(k.unit());
        Stmt.Unknown r = Parsing.only("unknown R [m]", Stmt.Unknown.class);
        assertFalse(r.isProfile());
        assertEquals("m", r.unit().text());
    }

    @Test
    void equationStatementsWithLabel() {
        List<Stmt> all = Parsing.clean("""
                relation balance: P'(r) = -G*m(r)*rho/r^2
                boundary surface: P(R) = 0
                step s1: P'(r) = -4/3*pi*G*rho^2*r
                claim central: P(0) = 3/(8*pi)*G*M^2/R^4
                """);
        Stmt.Relation rel = assertInstanceOf(Stmt.Relation.class, all.get(0));
        assertEquals("balance", rel.label().name());
        Expr.Call lhs = assertInstanceOf(Expr.Call.class, rel.equation().lhs());
        assertEquals("P", lhs.callee());
        assertEquals(1, lhs.order());
        assertEquals("-G*m(r)*rho/r^2", ExprPrinter.print(rel.equation().rhs()));
        assertEquals("surface", assertInstanceOf(Stmt.Boundary.class, all.get(1)).label().name());
        assertEquals("s1", assertInstanceOf(Stmt.Step.class, all.get(2)).label().name());
        Stmt.Claim claim = assertInstanceOf(Stmt.Claim.class, all.get(3));
        assertEquals("central", claim.label().name());
        assertEquals(4, claim.span().line());
    }

    @Test
    void equationStatementsWithoutLabel() {
        List<Stmt> all = Parsing.clean("""
                relation P'(r) = -rho*g
                boundary P(0) = 1 [atm]
                step P(r) = 1 [atm] - rho*g*r
                claim P(1 [m]) = 0
                """);
        assertEquals(4, all.size());
        for (Stmt s : all) {
            assertFalse(dev.plumb.model.Checker.labelOf(s).present(), s.toString());
        }
        Stmt.Boundary b = assertInstanceOf(Stmt.Boundary.class, all.get(1));
        assertEquals("atm", assertInstanceOf(Expr.Quantity.class, b.equation().rhs()).unit());
    }

    @Test
    void scalingWithAndWithoutLabel() {
        Stmt.Scaling s = Parsing.only("scaling central_scaling: P(0) ~ G*M^2/R^4", Stmt.Scaling.class);
        assertEquals("central_scaling", s.label().name());
        assertEquals("P", assertInstanceOf(Expr.Call.class, s.lhs()).callee());
        assertEquals(Expr.BinaryOp.DIV, assertInstanceOf(Expr.Binary.class, s.rhs()).op());
        assertFalse(Parsing.only("scaling P(0) ~ M^2", Stmt.Scaling.class).label().present());
    }

    @Test
    void caseWithSeveralAssignments() {
        Stmt.Case c = Parsing.only("case earth: M = 5.972e24 [kg], R = 6371 [km]", Stmt.Case.class);
        assertEquals("earth", c.label().name());
        assertEquals(2, c.assignments().size());
        Stmt.Assignment m = c.assignments().get(0);
        assertEquals("M", m.name());
        Expr.Quantity mass = assertInstanceOf(Expr.Quantity.class, m.value());
        assertEquals(5.972e24, mass.value());
        assertEquals("kg", mass.unit());
        assertNull(m.uncertainty());
        assertEquals("km", assertInstanceOf(Expr.Quantity.class, c.assignments().get(1).value()).unit());
    }

    @Test
    void caseWithUncertaintySharesTheTrailingUnit() {
        for (String pm : List.of("+-", "±")) {
            Stmt.Case c = Parsing.only("case a: M = 1.0 " + pm + " 0.02 [Msun], R = 1 [Rsun]", Stmt.Case.class);
            Stmt.Assignment m = c.assignments().get(0);
            Expr.Quantity value = assertInstanceOf(Expr.Quantity.class, m.value());
            Expr.Quantity sigma = assertInstanceOf(Expr.Quantity.class, m.uncertainty());
            assertEquals(1.0, value.value());
            assertEquals("Msun", value.unit());
            assertEquals(0.02, sigma.value());
            assertEquals("Msun", sigma.unit());
            assertEquals(2, c.assignments().size());
        }
    }

    @Test
    void expectWithCaseAndPercentTolerance() {
        Stmt.Expect e = Parsing.only("expect sun_value: P(0) at sun = 1.3447e14 [Pa] within 0.1%", Stmt.Expect.class);
        assertEquals("sun_value", e.label().name());
        assertEquals("sun", e.caseName());
        assertEquals(new Span(1, 27, 1, 30), e.caseSpan());
        assertEquals(1.3447e14, assertInstanceOf(Expr.Quantity.class, e.expected()).value());
        assertTrue(e.tolerance().isRelative());
        assertEquals(0.001, e.tolerance().relative(), 1e-15);
    }

    @Test
    void expectWithoutCaseAndPlainNumberTolerance() {
        Stmt.Expect e = Parsing.only("expect top: P(11 [km]) = 22632.06 [Pa] within 1e-6", Stmt.Expect.class);
        assertNull(e.caseName());
        assertTrue(e.tolerance().isRelative());
        assertEquals(1e-6, e.tolerance().relative());
        Expr.Call lhs = assertInstanceOf(Expr.Call.class, e.lhs());
        assertEquals("km", assertInstanceOf(Expr.Quantity.class, lhs.args().get(0)).unit());
    }

    @Test
    void expectWithQuantityTolerance() {
        Stmt.Expect e = Parsing.only("expect top: P(0) = 101325 [Pa] within 5 [Pa]", Stmt.Expect.class);
        assertFalse(e.tolerance().isRelative());
        Expr.Quantity tol = assertInstanceOf(Expr.Quantity.class, e.tolerance().absolute());
        assertEquals(5.0, tol.value());
        assertEquals("Pa", tol.unit());
    }

    @Test
    void showWithAndWithoutUnit() {
        Stmt.Show in = Parsing.only("show P(0) in [GPa]", Stmt.Show.class);
        assertEquals("GPa", in.unit().text());
        assertEquals("P", assertInstanceOf(Expr.Call.class, in.expr()).callee());
        assertNull(Parsing.only("show P(0)", Stmt.Show.class).unit());
    }

    @Test
    void piecewiseDefinition() {
        Stmt.Let l = Parsing.only("let T(z) = if z < 11 [km] then T0 - L*z else T0 - L*(11 [km])", Stmt.Let.class);
        Expr.If body = assertInstanceOf(Expr.If.class, l.body());
        assertEquals(Expr.CompareOp.LT, body.condition().op());
        assertEquals("z", assertInstanceOf(Expr.Name.class, body.condition().left()).id());
        assertEquals("km", assertInstanceOf(Expr.Quantity.class, body.condition().right()).unit());
        assertEquals(Expr.BinaryOp.SUB, assertInstanceOf(Expr.Binary.class, body.then()).op());
        Expr.Binary otherwise = assertInstanceOf(Expr.Binary.class, body.otherwise());
        Expr.Binary product = assertInstanceOf(Expr.Binary.class, otherwise.right());
        assertInstanceOf(Expr.Quantity.class, product.right());
    }

    @Test
    void everyComparisonOperatorInAnIf() {
        String[] ops = {"<", "<=", ">", ">="};
        Expr.CompareOp[] want = {Expr.CompareOp.LT, Expr.CompareOp.LE, Expr.CompareOp.GT, Expr.CompareOp.GE};
        for (int i = 0; i < ops.length; i++) {
            Expr.If e = assertInstanceOf(Expr.If.class, Parsing.expr("if x " + ops[i] + " 1 then 2 else 3"));
            assertEquals(want[i], e.condition().op(), ops[i]);
        }
    }

    @Test
    void statementContinuesInsideOpenParentheses() {
        List<Stmt> all = Parsing.clean("""
                relation balance: P'(r) = -G*m(r)*rho/(
                        r^2)
                step s1: P'(r) = (-4/3*pi*G
                    *rho^2*r)   # a comment inside the continuation
                """);
        assertEquals(2, all.size());
        Stmt.Relation rel = assertInstanceOf(Stmt.Relation.class, all.get(0));
        assertEquals(1, rel.span().line());
        assertEquals(2, rel.span().endLine());
        Stmt.Step step = assertInstanceOf(Stmt.Step.class, all.get(1));
        assertEquals(3, step.span().line());
        assertEquals("-4/3*pi*G*rho^2*r", ExprPrinter.print(step.equation().rhs()));
    }

    @Test
    void commentsAndBlankLinesAreIgnored() {
        List<Stmt> all = Parsing.clean("""
                # a file-level comment
                param M [kg] > 0   # a trailing comment with = and [brackets

                   # an indented comment
                param R [m] > 0
                """);
        assertEquals(2, all.size());
        assertEquals(5, all.get(1).span().line());
        assertEquals("kg", ((Stmt.Param) all.get(0)).unit().text());
    }

    @Test
    void theShippedExampleParsesIntoThirteenKindsOfStatement() throws Exception {
        String text = java.nio.file.Files.readString(java.nio.file.Path.of("derivations/uniform-sphere.plumb"));
        List<Stmt> all = Parsing.clean(text);
        assertEquals(17, all.size());
        assertEquals(13, all.stream().map(Object::getClass).distinct().count());
    }
}
