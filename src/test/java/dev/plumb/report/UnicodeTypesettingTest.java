package dev.plumb.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumb.lang.Diagnostics;
import dev.plumb.lang.Expr;
import dev.plumb.lang.Lexer;
import dev.plumb.lang.Parser;
import org.junit.jupiter.api.Test;

/**
 * Names written in Greek (or any script) and the new functions, typeset: LaTeX gets commands that
 * pdfLaTeX knows by default (a raw ρ stops it with "Unicode character not set up"), MathML gets the
 * letters themselves.
 */
class UnicodeTypesettingTest {

    private static Expr parse(String text) {
        Diagnostics d = new Diagnostics();
        return new Parser(new Lexer(text, d).tokens(), d).expressionOnly();
    }

    @Test
    void greekLettersBecomeLatexCommands() {
        assertEquals("\\rho{}_{\\mathrm{c}}\\,\\lambda{}", LatexPrinter.print(parse("ρ_c*λ")));
        assertEquals("\\Gamma{}_{1}", LatexPrinter.name("Γ1"));
        assertEquals("\\mathit{\\sigma{}T}", LatexPrinter.name("σT"));
        // A capital that looks Latin is the Latin letter; pi written as the letter is the constant pi.
        assertEquals("B", LatexPrinter.name("Β"));
        assertEquals("\\pi", LatexPrinter.print(parse("π")));
    }

    @Test
    void otherScriptsStillCompile() {
        assertEquals("\\text{é}", LatexPrinter.name("é"));
        assertEquals("\\mathit{\\text{[U+0436]}\\text{[U+0436]}}", LatexPrinter.name("жж"));
    }

    @Test
    void eulersNumberLogarithmsAndInverseHyperbolicFunctions() {
        assertEquals("{e}^{x}", LatexPrinter.print(parse("e^x")));
        // The bracketed argument in braces is an ordinary atom: no thin space between the function and its bracket.
        assertEquals("\\ln{\\left(x\\right)}", LatexPrinter.print(parse("ln(x)")));
        assertEquals("\\operatorname{arsinh}{\\left(x\\right)} + \\operatorname{artanh}{\\left(y\\right)}",
                LatexPrinter.print(parse("asinh(x) + atanh(y)")));
        // MathML applies a function with U+2061 FUNCTION APPLICATION, so the bracket stays at the name.
        String open = "<mo>&#x2061;</mo><mo form=\"prefix\" stretchy=\"false\">(</mo>";
        String close = "<mo form=\"postfix\" stretchy=\"false\">)</mo>";
        assertEquals("<mrow><mi>arcosh</mi>" + open + "<mi>x</mi>" + close + "</mrow>", MathMLPrinter.print(parse("acosh(x)")));
        assertEquals("<mrow><mi>ln</mi>" + open + "<mi>ρ</mi>" + close + "</mrow>", MathMLPrinter.print(parse("ln(ρ)")));
    }

    @Test
    void derivativeOfADefinitionIsPrimed() {
        assertEquals("\\rho{}'{\\left(r\\right)}", LatexPrinter.print(parse("ρ'(r)")));
        assertTrue(MathMLPrinter.print(parse("rho''(r)")).contains("<mi>ρ</mi><mo lspace=\"0\" rspace=\"0\">′′</mo>"),
                MathMLPrinter.print(parse("rho''(r)")));
    }

    @Test
    void textOutsideMathIsEscapedForPdfLatex() {
        assertEquals("\\ensuremath{\\partial}ln Q/\\ensuremath{\\partial}ln p", LatexPrinter.escape("∂ln Q/∂ln p"));
        assertEquals("3*G*M\\^{}2/(8*pi*R\\^{}4)", LatexPrinter.escape("3*G*M^2/(8*pi*R^4)"));
        assertEquals("\\ensuremath{\\rho} \\textless{} 1 \\ensuremath{\\pm} 2\\%", LatexPrinter.escape("ρ < 1 ± 2%"));
        assertEquals("Lane--Emden, Poincar\u00e9 [U+0436]", LatexPrinter.escape("Lane–Emden, Poincar\u00e9 ж"));
    }

    @Test
    void unitPowersAreSuperscripts() {
        assertEquals("\\,\\mathrm{kg\\,m^{-3}}", LatexPrinter.unit("kg m^-3"));
        assertEquals("\\,\\mathrm{kg^{-4/3}}", LatexPrinter.unit("kg^(-4/3)"));
        assertEquals("\\,\\mathrm{\\mu{}m}", LatexPrinter.unit("µm"));
    }
}
