package dev.plumb.model;

import static dev.plumb.model.Checking.assertAt;
import static dev.plumb.model.Checking.column;
import static dev.plumb.units.Dimension.Base.LENGTH;
import static dev.plumb.units.Dimension.Base.MASS;
import static dev.plumb.units.Dimension.Base.TIME;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumb.lang.Diagnostic;
import dev.plumb.lang.Expr;
import dev.plumb.lang.Stmt;
import dev.plumb.units.Dimension;
import dev.plumb.units.Rational;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Unit inference and the unit check of every line. */
class UnitCheckTest {

    private static final String SPHERE = """
            param M [kg] > 0
            param R [m] > 0
            coord r [m] from 0 to R
            let rho = M / (4/3*pi*R^3)
            let m(r) = 4/3*pi*r^3*rho
            unknown P(r) [Pa]
            """;

    private static Dimension dim(int kg, int m, int s) {
        return Dimension.of(MASS, Rational.of(kg)).mul(Dimension.of(LENGTH, Rational.of(m))).mul(Dimension.of(TIME, Rational.of(s)));
    }

    private static final Dimension PASCAL = dim(1, -1, -2);
    private static final Dimension DENSITY = dim(1, -3, 0);

    /** The dimension inferred for the expression of the last {@code show} statement. */
    private static Dimension lastShown(Checking c) {
        List<Stmt.Show> shows = c.model.shows();
        Expr e = shows.get(shows.size() - 1).expr();
        return c.model.dimensionOf(e);
    }

    private static String details(Diagnostic d) {
        return String.join("\n", d.details());
    }

    @Test
    void relationSidesWithDifferentUnitsArePointedAtWithTheMissingFactor() {
        String text = SPHERE + "relation balance: P'(r) = -G*m(r)*rho/r\n";
        Checking c = Checking.of(text);
        Diagnostic d = c.onlyError("the two sides of relation 'balance' have different units");
        assertAt(d, 7, column(text, 7, "-G"));
        assertEquals(7, d.span().endLine());
        assertEquals(text.lines().toList().get(6).length() + 1, d.span().endColumn());
        assertFalse(d.isInputError(), "a unit mismatch is a failing check, not unreadable input");
        assertTrue(details(d).contains("is a 1/r missing on the right"), details(d));
        Check check = c.model.unitChecks().stream().filter(k -> "balance".equals(k.label())).findFirst().orElseThrow();
        assertEquals(Status.FAILS, check.status());
        assertEquals("units", check.kind());
    }

    @Test
    void anExtraPowerOfTheCoordinateOnTheRightIsNamedAsSuch() {
        Diagnostic d = Checking.of(SPHERE + "relation balance: P'(r) = -G*m(r)*rho/r^3\n")
                .onlyError("have different units");
        assertTrue(details(d).contains("an extra 1/r on the right"), details(d));
    }

    @Test
    void otherMismatchesNameTheFactor() {
        // Left P'(r) in Pa/m = kg m^-2 s^-2; right G m / r^2 in m s^-2: they differ by a density.
        Diagnostic d = Checking.of(SPHERE + "relation balance: P'(r) = -G*m(r)/r^2\n").onlyError("have different units");
        assertTrue(details(d).contains("they differ by a factor of kg/m^3 (kg m^-3)"), details(d));
        assertTrue(details(d).contains("kg m^-2 s^-2"), details(d));
    }

    @Test
    void whenTheRightSideIsAPlainUnknownTheLeftIsBlamed() {
        String text = SPHERE + "boundary 1 [m] = P(0)\n";
        Diagnostic d = Checking.of(text).onlyError("the two sides of the boundary on line 7 have different units");
        assertAt(d, 7, column(text, 7, "1 [m]"));
    }

    @Test
    void matchingSidesHold() {
        Checking c = Checking.of(SPHERE + "relation balance: P'(r) = -G*m(r)*rho/r^2\nboundary surface: P(R) = 0\n");
        c.assertNoErrors();
        assertEquals(List.of(Status.HOLDS, Status.HOLDS), c.model.unitChecks().stream().map(Check::status).toList());
    }

    @Test
    void operandsOfPlusMustAgree() {
        String text = SPHERE + "show M + R\n";
        Diagnostic d = Checking.of(text).onlyError("the operands of '+' have different units");
        assertAt(d, 7, column(text, 7, "M + R"));
        assertTrue(details(d).contains("kg") && details(d).contains("m"), details(d));
        Checking.of(SPHERE + "show R - 3 [km]\n").assertNoErrors();
        Checking.of(SPHERE + "show M - 1\n").onlyError("the operands of '-' have different units");
    }

    @Test
    void zeroIsCompatibleWithAnyUnit() {
        Checking c = Checking.of(SPHERE + "show 0 + M\n");
        c.assertNoErrors();
        assertEquals(Dimension.of(MASS), lastShown(c));
    }

    @Test
    void functionArgumentsMustBeDimensionless() {
        String text = SPHERE + "show exp(R)\n";
        Diagnostic d = Checking.of(text).onlyError("the argument of 'exp' must be dimensionless, found m");
        assertAt(d, 7, column(text, 7, "R)"));
        Checking.of(SPHERE + "show sin(M)\n").onlyError("the argument of 'sin' must be dimensionless, found kg");
        Checking ok = Checking.of(SPHERE + "show log(r/R)\n");
        ok.assertNoErrors();
        assertEquals(Dimension.NONE, lastShown(ok));
    }

    @Test
    void sqrtAndAbsKeepUnits() {
        Checking c = Checking.of(SPHERE + "show sqrt(G*M/R)\n");
        c.assertNoErrors();
        assertEquals(dim(0, 1, -1), lastShown(c));
        Checking a = Checking.of(SPHERE + "show abs(P(0))\n");
        a.assertNoErrors();
        assertEquals(PASCAL, lastShown(a));
    }

    @Test
    void exponentOfAQuantityWithAUnitMustBeFixed() {
        String text = "param a > 0\nparam R [m] > 0\nshow R^a\n";
        Diagnostic d = Checking.of(text).onlyError("the exponent of a quantity with a unit must be a fixed number");
        assertAt(d, 3, column(text, 3, "a"));
        Checking.of("param a > 0\nshow 2^a\n").assertNoErrors();
    }

    @Test
    void exponentMustBeDimensionless() {
        Checking.of(SPHERE + "show R^M\n").onlyError("an exponent must be dimensionless, found kg");
    }

    @Test
    void fixedRationalExponentGivesRationalDimension() {
        Checking c = Checking.of("param n = 3\nparam R [m] > 0\nshow R^(n/2)\n");
        c.assertNoErrors();
        assertEquals(Dimension.of(LENGTH, Rational.of(3, 2)), lastShown(c));
    }

    @Test
    void derivativeHasTheUnitOfTheProfileOverTheCoordinate() {
        Checking c = Checking.of(SPHERE + "show P'(r)\n");
        c.assertNoErrors();
        assertEquals(PASCAL.div(Dimension.of(LENGTH)), lastShown(c));
        Checking second = Checking.of(SPHERE + "show P''(r)\n");
        second.assertNoErrors();
        assertEquals(dim(1, -3, -2), lastShown(second));
        Checking time = Checking.of("coord t [s] from 0 to 1 [s]\nunknown x(t) [m]\nshow x''(t)\n");
        time.assertNoErrors();
        assertEquals(dim(0, 1, -2), lastShown(time));
    }

    @Test
    void ifBranchesMustAgree() {
        String text = SPHERE + "let f(r) = if r < R/2 then 1 [Pa] else 2 [m]\n";
        Diagnostic d = Checking.of(text).onlyError("the 'then' and 'else' branches have different units");
        assertAt(d, 7, column(text, 7, "if"));
    }

    @Test
    void ifConditionSidesMustAgree() {
        Checking.of(SPHERE + "let f(r) = if r < 1 [kg] then rho else 2*rho\n")
                .onlyError("the two sides of the comparison have different units");
    }

    @Test
    void ifTakesTheUnitOfItsBranches() {
        Checking c = Checking.of(SPHERE + "let f(r) = if r < R/2 then 0 else 2*rho\nshow f(r)\n");
        c.assertNoErrors();
        assertEquals(DENSITY, lastShown(c));
    }

    @Test
    void fixedParamValueMustHaveItsDeclaredUnit() {
        Checking.of("param g [m/s^2] = 9.80665 [m/s]\n").onlyError("the value of 'g' does not have its declared unit [m/s^2]");
        Checking ok = Checking.of("param g [m/s^2] = 980.665 [cm/s^2]\n");
        ok.assertNoErrors();
        // 980.665 cm/s^2 is the standard acceleration of gravity, 9.80665 m/s^2 by definition (SI Brochure, 9th ed.).
        Symbol.FixedParam g = (Symbol.FixedParam) ok.model.symbol("g").orElseThrow();
        assertEquals(9.80665, g.value(), 1e-12);
        assertEquals(dim(0, 1, -2), g.dimension());
    }

    @Test
    void showInAnotherUnitMustMatch() {
        Checking.of(SPHERE + "show P(0) in [m]\n").onlyError("cannot show P(0) in [m]: the units differ");
        Checking.of(SPHERE + "show P(0) in [GPa]\n").assertNoErrors();
    }

    @Test
    void caseValueMustHaveTheUnitOfItsParameter() {
        Checking.of(SPHERE + "case x: M = 1 [m], R = 1 [m]\n").onlyError("the value of 'M' does not have its unit");
    }

    @Test
    void unknownUnitNameIsAnInputErrorInsideTheBrackets() {
        String text = "param M [kgg] > 0\n";
        Diagnostic d = Checking.of(text).onlyError("kgg");
        assertTrue(d.isInputError());
        assertAt(d, 1, column(text, 1, "kgg"));
    }

    @Test
    void unitOfAnUnknownConstantIsInferredFromABoundary() {
        Checking c = Checking.of(SPHERE + "unknown Pc\nboundary centre: P(0) = Pc\n");
        c.assertNoErrors();
        assertEquals(PASCAL, c.model.symbol("Pc").orElseThrow().dimension());
        assertTrue(c.all(dev.plumb.lang.Severity.NOTE).stream()
                .anyMatch(n -> n.message().contains("the unit of 'Pc' is inferred: Pa")), c.model.diagnostics().toString());
    }

    @Test
    void unknownWhoseUnitCannotBeInferredGivesAWarning() {
        String text = SPHERE + "unknown Q\nshow Q\n";
        Checking c = Checking.of(text);
        c.assertNoErrors();
        List<Diagnostic> warnings = c.all(dev.plumb.lang.Severity.WARNING);
        assertEquals(1, warnings.size(), warnings::toString);
        assertTrue(warnings.get(0).message().contains("the unit of 'Q' cannot be inferred"), warnings.get(0).message());
        assertAt(warnings.get(0), 7, 9);
    }

    @Test
    void theShippedUniformSphereHoldsEveryUnitCheck() throws Exception {
        String text = java.nio.file.Files.readString(java.nio.file.Path.of("derivations/uniform-sphere.plumb"));
        Checking c = Checking.of(text);
        c.assertNoErrors();
        List<Check> checks = c.model.unitChecks();
        // relation, boundary, two steps, claim, expect
        assertEquals(6, checks.size(), checks::toString);
        assertTrue(checks.stream().allMatch(k -> k.status() == Status.HOLDS), checks::toString);
        assertEquals(DENSITY, c.model.symbol("rho").orElseThrow().dimension());
        assertEquals(2, c.model.cases().size());
    }
}
