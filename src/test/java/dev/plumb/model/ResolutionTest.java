package dev.plumb.model;

import static dev.plumb.model.Checking.assertAt;
import static dev.plumb.model.Checking.column;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumb.lang.Diagnostic;
import dev.plumb.lang.Severity;
import dev.plumb.lang.Stmt;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Name resolution: what each name means, and what is wrong when it means nothing. */
class ResolutionTest {

    /** Six lines of a uniform sphere; tests append to it, so their own lines start at 7. */
    private static final String SPHERE = """
            param M [kg] > 0
            param R [m] > 0
            coord r [m] from 0 to R
            let rho = M / (4/3*pi*R^3)
            let m(r) = 4/3*pi*r^3*rho
            unknown P(r) [Pa]
            """;

    @Test
    void resolvesEveryKindOfName() {
        Checking c = Checking.of(SPHERE + "relation balance: P'(r) = -G*m(r)*rho/r^2\n");
        c.assertNoErrors();
        Model m = c.model;
        assertInstanceOf(Symbol.FreeParam.class, m.symbol("M").orElseThrow());
        assertInstanceOf(Symbol.Coordinate.class, m.symbol("r").orElseThrow());
        assertInstanceOf(Symbol.Definition.class, m.symbol("rho").orElseThrow());
        assertEquals(List.of("r"), assertInstanceOf(Symbol.Definition.class, m.symbol("m").orElseThrow()).params());
        assertInstanceOf(Symbol.Profile.class, m.symbol("P").orElseThrow());
        assertInstanceOf(Symbol.Builtin.class, m.symbol("G").orElseThrow());
        assertInstanceOf(Symbol.Builtin.class, m.symbol("pi").orElseThrow());
    }

    @Test
    void undefinedNameWithSuggestion() {
        String text = SPHERE + "relation balance: P'(r) = -G*m(r)*rh0/r^2\n";
        Diagnostic d = Checking.of(text).onlyError("'rh0' is not defined; did you mean 'rho'?");
        assertAt(d, 7, column(text, 7, "rh0"));
    }

    @Test
    void undefinedFunctionWithSuggestion() {
        String text = SPHERE + "relation balance: P'(r) = -G*ms(r)*rho/r^2\n";
        Diagnostic d = Checking.of(text).onlyError("'ms' is not defined; did you mean 'm'?");
        assertAt(d, 7, column(text, 7, "ms("));
    }

    @Test
    void undefinedNameFarFromEveryCandidateHasNoSuggestion() {
        Diagnostic d = Checking.of(SPHERE + "show zeta_total\n").onlyError("'zeta_total' is not defined");
        assertTrue(!d.message().contains("did you mean"), d.message());
    }

    @Test
    void duplicateDeclaration() {
        String text = SPHERE + "param M [g] > 0\n";
        Diagnostic d = Checking.of(text).onlyError("'M' is declared twice; the first declaration is at line 1");
        assertAt(d, 7, 7);
    }

    @Test
    void aBoundaryAndAnExpectationMayShareALabel() {
        String text = SPHERE + "boundary centre: P(R) = 0\ncase a: M = 1 [kg], R = 1 [m]\nexpect centre: P(0) at a = 1 [Pa] within 1%\n";
        assertTrue(Checking.of(text).model.diagnostics().stream().noneMatch(d -> d.message().contains("used twice")));
    }

    @Test
    void duplicateLabel() {
        String text = SPHERE + "step s1: P'(r) = -G*m(r)*rho/r^2\nclaim s1: P(0) = 0\n";
        Diagnostic d = Checking.of(text).onlyError("the label 's1' is used twice; the first use is at line 7");
        assertAt(d, 8, 7);
    }

    @Test
    void caseNamesLiveApartFromStatementLabels() {
        Checking.of(SPHERE + "claim sun: P(0) = 0\ncase sun: M = 1 [Msun], R = 1 [Rsun]\n").assertNoErrors();
    }

    @Test
    void wrongArityOfADefinition() {
        String text = SPHERE + "show m(r, R)\n";
        Diagnostic d = Checking.of(text).onlyError("'m' takes 1 argument, found 2");
        assertAt(d, 7, 6);
    }

    @Test
    void wrongArityOfABuiltinFunction() {
        Checking.of(SPHERE + "show sqrt(M, R)\n").onlyError("'sqrt' takes one argument, found 2");
    }

    @Test
    void wrongArityOfAProfile() {
        Checking.of(SPHERE + "show P(r, R)\n").onlyError("'P' is a profile of one coordinate; found 2 arguments");
    }

    @Test
    void definitionCycle() {
        String text = """
                let a = 2*b
                let b = c + 1
                let c = a/3
                show a
                """;
        List<Diagnostic> errors = Checking.of(text).errors();
        assertEquals(1, errors.size(), errors::toString);
        assertTrue(errors.get(0).message().contains("definitions refer to each other in a cycle: a -> b -> c -> a"),
                errors.get(0).message());
        assertAt(errors.get(0), 1, 5);
    }

    @Test
    void definitionReferringToItself() {
        Checking.of("let a = a + 1\n").onlyError("cycle: a -> a");
    }

    @Test
    void derivativeOfADefinitionOfTheCoordinateHasItsUnitOverTheCoordinates() throws Exception {
        String text = SPHERE + "relation mass: m'(r) = 4*pi*r^2*rho\nshow m''(R/2)\n";
        Checking c = Checking.of(text);
        c.assertNoErrors();
        assertEquals(List.of(), c.all(Severity.WARNING));
        Stmt.Show show = c.model.shows().get(0);
        // kg over m twice: the definition's unit over the coordinate's, once per prime.
        assertEquals(dev.plumb.units.UnitParser.parse("kg/m^2").dimension(), c.model.dimensionOf(show.expr()));
    }

    @Test
    void derivativeOfADefinitionWithoutArgumentIsAnError() {
        String text = SPHERE + "show rho'(R)\n";
        Diagnostic d = Checking.of(text).onlyError("'rho' is not a function: it is defined without an argument (line 4), so rho'(R) has no meaning");
        assertAt(d, 7, column(text, 7, "rho'"));
    }

    @Test
    void definitionThatDoesNotDependOnItsArgumentHasDerivativeZeroWithAWarning() {
        String text = SPHERE + "let flat(r) = rho*R\nshow flat'(R)\n";
        Checking c = Checking.of(text);
        c.assertNoErrors();
        List<Diagnostic> warnings = c.all(Severity.WARNING);
        assertEquals(1, warnings.size(), warnings::toString);
        assertTrue(warnings.get(0).message().contains("'flat' does not depend on its argument 'r', so flat'(R) is 0"), warnings.get(0).message());
    }

    @Test
    void derivativeOfADefinitionTakenAtAPointOfAnotherUnit() {
        Checking.of(SPHERE + "show m'(2 [s])\n").onlyError("the point where m' is taken must have the unit of its argument 'r'");
    }

    @Test
    void derivativeOfADefinitionOfTwoArguments() {
        Checking.of(SPHERE + "let f(a, b) = a*b\nshow f'(R)\n").onlyError("'f' takes 2 arguments; only a definition of one argument can be differentiated");
    }

    @Test
    void derivativeOfAParameterAndOfABuiltinFunction() {
        Checking.of(SPHERE + "show M'(r)\n").onlyError("'M' is not a function of the coordinate");
        Checking.of(SPHERE + "show sqrt'(r)\n").onlyError("'sqrt' is a built-in function");
    }

    @Test
    void shadowingABuiltinIsAWarningNotAnError() {
        String text = "param G [m^3 kg^-1 s^-2] > 0\nparam M [kg] > 0\nshow G*M\n";
        Checking c = Checking.of(text);
        c.assertNoErrors();
        List<Diagnostic> warnings = c.all(Severity.WARNING);
        assertEquals(1, warnings.size(), warnings::toString);
        assertTrue(warnings.get(0).message().contains("'G' shadows the built-in constant G"), warnings.get(0).message());
        assertAt(warnings.get(0), 1, 7);
        assertInstanceOf(Symbol.FreeParam.class, c.model.symbol("G").orElseThrow());
    }

    @Test
    void declaringEOrLnShadowsTheBuiltInWithAWarning() {
        String text = "param e = 3\nlet ln(x) = 2*x\nshow e*ln(1)\n";
        Checking c = Checking.of(text);
        c.assertNoErrors();
        List<String> warnings = c.all(Severity.WARNING).stream().map(Diagnostic::message).toList();
        assertEquals(2, warnings.size(), warnings::toString);
        assertTrue(warnings.get(0).contains("'e' shadows the built-in constant e (Euler's number"), warnings.get(0));
        assertTrue(warnings.get(1).contains("'ln' shadows the built-in function ln (natural logarithm)"), warnings.get(1));
        assertInstanceOf(Symbol.FixedParam.class, c.model.symbol("e").orElseThrow());
    }

    @Test
    void eIsEulersNumberWhenNotDeclared() {
        Checking c = Checking.of("param x = ln(e^3)\n");
        c.assertNoErrors();
        assertInstanceOf(Symbol.Builtin.class, c.model.symbol("e").orElseThrow());
        // ln(e^3) = 3 exactly in real arithmetic; in doubles to an ulp or two.
        assertEquals(3.0, ((Symbol.FixedParam) c.model.symbol("x").orElseThrow()).value(), 1e-15);
    }

    @Test
    void greekNamesAndPiWrittenAsTheLetter() {
        String text = "param ρ_c [kg/m^3] > 0\nparam λ = 2\nlet Γ = λ*π\nshow ρ_c*Γ\n";
        Checking c = Checking.of(text);
        c.assertNoErrors();
        assertEquals(List.of(), c.all(Severity.WARNING));
        assertInstanceOf(Symbol.FreeParam.class, c.model.symbol("ρ_c").orElseThrow());
        assertInstanceOf(Symbol.Builtin.class, c.model.symbol("pi").orElseThrow(), "π is the constant pi");
    }

    @Test
    void atFixedNamesTheImplicitCaseOfAFileWithoutFreeParameters() {
        String text = "param g = 9.80665 [m/s^2]\ncoord z [m] from 0 to 10 [m]\nunknown P(z) [Pa]\n"
                + "relation r1: P'(z) = 1000 [kg/m^3]*g\nboundary b: P(0) = 0\n";
        Checking.of(text + "expect x: P(10 [m]) at fixed = 98066.5 [Pa] within 1e-9\n").assertNoErrors();
        Checking.of(text + "expect x: P(10 [m]) at sun = 98066.5 [Pa] within 1e-9\n")
                .onlyError("there is no case named 'sun': the file has no free parameters, so its one case is 'fixed'");
        // With free parameters there is no implicit case, so 'fixed' is no case's name.
        Checking.of(SPHERE + "case sun: M = 1 [kg], R = 1 [m]\nexpect x: rho at fixed = 1 [kg/m^3] within 1%\n")
                .onlyError("there is no case named 'fixed'");
    }

    @Test
    void profileUsedWithoutAPoint() {
        String text = SPHERE + "boundary surface: P = 0\n";
        Diagnostic d = Checking.of(text).onlyError("'P' is a profile: give the point, e.g. P(r)");
        assertAt(d, 7, 19);
    }

    @Test
    void functionUsedWithoutArguments() {
        Checking.of(SPHERE + "show m\n").onlyError("'m' is a function of r: call it, e.g. m(r)");
    }

    @Test
    void caseMissingAParameter() {
        String text = SPHERE + "case sun: M = 1 [Msun]\n";
        Diagnostic d = Checking.of(text).onlyError("case 'sun' gives no value for R");
        assertAt(d, 7, 6);
    }

    @Test
    void caseSettingAFixedParameter() {
        String text = "param n = 3\nparam M [kg] > 0\ncase sun: M = 1 [Msun], n = 1.5\n";
        Diagnostic d = Checking.of(text).onlyError("case 'sun' sets 'n', which is fixed by its declaration");
        assertAt(d, 3, column(text, 3, "n ="));
    }

    @Test
    void caseSettingSomethingThatIsNotAParameter() {
        Checking.of(SPHERE + "case sun: M = 1 [Msun], R = 1 [Rsun], rho = 1 [kg/m^3]\n")
                .onlyError("case 'sun' sets 'rho', which is not a parameter");
    }

    @Test
    void caseValuesAreInSi() {
        Checking c = Checking.of(SPHERE + "case earth: M = 5.972e24 [kg], R = 6371 [km]\n");
        c.assertNoErrors();
        CaseValues earth = c.model.caseNamed("earth").orElseThrow();
        assertEquals(5.972e24, earth.values().get("M"));
        assertEquals(6.371e6, earth.values().get("R"), 1e-6);
    }

    @Test
    void caseUncertaintyIsInSi() {
        Checking c = Checking.of(SPHERE + "case a: M = 1.0 +- 0.02 [kg], R = 2 +- 0.1 [km]\n");
        c.assertNoErrors();
        CaseValues a = c.model.caseNamed("a").orElseThrow();
        assertEquals(0.02, a.uncertainties().get("M"), 1e-15);
        assertEquals(100.0, a.uncertainties().get("R"), 1e-9);
        assertEquals(2000.0, a.values().get("R"), 1e-9);
    }

    @Test
    void expectAtAnUnknownCase() {
        String text = SPHERE + "case sun: M = 1 [Msun], R = 1 [Rsun]\nexpect v: P(0) at sunn = 1 [Pa] within 1%\n";
        Diagnostic d = Checking.of(text).onlyError("there is no case named 'sunn'; did you mean 'sun'?");
        assertAt(d, 8, column(text, 8, "sunn"));
    }

    @Test
    void expectWithoutCaseWhenThereAreFreeParameters() {
        String text = SPHERE + "expect v: P(0) = 1 [Pa] within 1%\n";
        Diagnostic d = Checking.of(text).onlyError("this expectation needs 'at CASE': the file has free parameters");
        assertAt(d, 7, column(text, 7, "P(0)"));
    }

    @Test
    void expectWithoutCaseWhenEveryParameterIsFixed() {
        String text = """
                param g = 9.80665 [m/s^2]
                param rho = 1000 [kg/m^3]
                coord z [m] from 0 to 10 [m]
                unknown P(z) [Pa]
                relation hydrostatic: P'(z) = rho*g
                boundary top: P(0) = 101325 [Pa]
                expect bottom: P(10 [m]) = 199391.5 [Pa] within 0.01%   # 101325 Pa + rho*g*h, worked by hand
                """;
        Checking.of(text).assertNoErrors();
    }

    @Test
    void namesDifferingOnlyInCaseAreDistinct() {
        String text = """
                param m [kg] > 0
                param M [kg] > 0
                param Mm [kg] > 0
                param mm [kg] > 0
                param E [J] > 0
                param I [A] > 0
                param N = 4
                param D [m] > 0
                param C [J/K] > 0
                show m + M + Mm + mm
                show E/(N*I*D*C)
                """;
        Checking c = Checking.of(text);
        c.assertNoErrors();
        assertEquals(9, c.model.freeParams().size() + c.model.symbols(Symbol.FixedParam.class).size());
        assertEquals(4.0, assertInstanceOf(Symbol.FixedParam.class, c.model.symbol("N").orElseThrow()).value());
    }

    @Test
    void aSingleCapitalIsNotAConstant() {
        // E is not Euler's number and I is not the imaginary unit: undeclared, they are errors.
        Checking.of("show 2*E\n").onlyError("'E' is not defined");
        Checking.of("show 2*I\n").onlyError("'I' is not defined");
    }
}
