package dev.plumb.model;

import static dev.plumb.units.Dimension.Base.LENGTH;
import static dev.plumb.units.Dimension.Base.MASS;
import static dev.plumb.units.Dimension.Base.TIME;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumb.lang.Severity;
import dev.plumb.units.Dimension;
import dev.plumb.units.Rational;
import org.junit.jupiter.api.Test;

/** The unit of a polytropic constant left undeclared is found from the relations it appears in. */
class PolytropeUnitsTest {

    private static String polytrope(String n) {
        return """
                param M [kg] > 0
                param n = %s
                unknown R [m]
                coord r [m] from 0 to R
                unknown P(r) [Pa]
                unknown m(r) [kg]
                unknown K
                let rho(r) = (P(r)/K)^(n/(n+1))
                relation mass: m'(r) = 4*pi*r^2*rho(r)
                relation balance: P'(r) = -G*m(r)*rho(r)/r^2
                boundary centre: m(0) = 0
                boundary surface: P(R) = 0
                boundary total: m(R) = M
                """.formatted(n);
    }

    private static Dimension unitOfK(String n) {
        Checking c = Checking.of(polytrope(n));
        c.assertNoErrors();
        assertTrue(c.all(Severity.WARNING).isEmpty(), c.model.diagnostics().toString());
        Symbol.UnknownConstant k = (Symbol.UnknownConstant) c.model.symbol("K").orElseThrow();
        assertTrue(k.unitInferred());
        return k.dimension();
    }

    @Test
    void indexThree() {
        // Worked by hand: K = P / rho^(4/3) = (kg m^-1 s^-2) / (kg m^-3)^(4/3) = m^3 kg^(-1/3) s^-2.
        Dimension expected = Dimension.of(LENGTH, Rational.of(3))
                .mul(Dimension.of(MASS, Rational.of(-1, 3)))
                .mul(Dimension.of(TIME, Rational.of(-2)));
        assertEquals(expected, unitOfK("3"));
    }

    @Test
    void indexOne() {
        // Worked by hand: K = P / rho^2 = (kg m^-1 s^-2) / (kg^2 m^-6) = m^5 kg^-1 s^-2.
        Dimension expected = Dimension.of(LENGTH, Rational.of(5))
                .mul(Dimension.of(MASS, Rational.of(-1)))
                .mul(Dimension.of(TIME, Rational.of(-2)));
        assertEquals(expected, unitOfK("1"));
    }

    @Test
    void indexThreeHalves() {
        // Worked by hand: K = P / rho^(5/3) = m^4 kg^(-2/3) s^-2.
        Dimension expected = Dimension.of(LENGTH, Rational.of(4))
                .mul(Dimension.of(MASS, Rational.of(-2, 3)))
                .mul(Dimension.of(TIME, Rational.of(-2)));
        assertEquals(expected, unitOfK("1.5"));
    }

    @Test
    void theInferredUnitIsReportedAsANote() {
        Checking c = Checking.of(polytrope("3"));
        assertTrue(c.all(Severity.NOTE).stream().anyMatch(d -> d.message().contains("the unit of 'K' is inferred: ")
                && d.span().line() == 7), c.model.diagnostics().toString());
    }
}
