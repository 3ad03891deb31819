package dev.plumb.symbolic;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;

import dev.plumb.model.Model;
import dev.plumb.model.Status;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** Lane–Emden n = 0, 1 and 5 written as one second-order relation, under other names and in other arrangements. */
class LaneEmdenSecondOrderTest {

    @Test
    void nZeroIsAParabolaWithItsFirstZeroAtRootSix() {
        String file = """
                param n = 0
                unknown s1
                coord s from 0 to s1
                unknown w(s)
                relation le: w''(s) + 2*w'(s)/s + w(s)^n = 0
                boundary w(0) = 1
                boundary w'(0) = 0
                boundary w(s1) = 0
                claim zero: s1 = sqrt(6)
                """;
        Model model = Fixtures.model("le0.plumb", file);
        SymbolicResult r = Fixtures.analyze(model);
        // Analytic: theta = 1 - xi^2/6 for n = 0, first zero sqrt(6).
        assertEquals("1 - s^2/6", Fixtures.derived(r, "w(s)").printed());
        assertEquals("sqrt(6)", Fixtures.derived(r, "s1").printed());
        assertEquals(Math.sqrt(6), ConstantEvaluatorSupport.evaluate(model, Fixtures.derived(r, "s1").closedForm(), Map.of()), 1e-15);
        assertEquals(Status.HOLDS, Fixtures.check(r, "zero").status());
    }

    @Test
    void nOneIsSinXiOverXiWithItsFirstZeroAtPi() {
        String file = """
                param n = 1
                coord xi from 0 to xi1
                unknown theta(xi)
                unknown xi1
                relation le: theta''(xi) = -2/xi*theta'(xi) - theta(xi)^n
                boundary centre: theta(0) = 1
                boundary regular: theta'(0) = 0
                boundary surface: theta(xi1) = 0
                claim zero: xi1 = pi
                claim mass: -xi1^2*theta'(xi1) = pi
                claim half: theta(pi/2) = 2/pi
                claim wrong: xi1 = pi/2
                """;
        SymbolicResult r = Fixtures.analyze(Fixtures.model("le1.plumb", file));
        // Analytic: theta = sin(xi)/xi for n = 1 (its slope at 0 is a limit), first zero pi;
        // Chandrasekhar (1939), table of polytropes: -xi1^2 theta'(xi1) = pi.
        assertEquals("sin(xi)/xi", Fixtures.derived(r, "theta(xi)").printed());
        assertEquals("pi", Fixtures.derived(r, "xi1").printed());
        assertEquals(Status.HOLDS, Fixtures.check(r, "zero").status());
        assertEquals(Status.HOLDS, Fixtures.check(r, "mass").status());
        assertEquals(Status.HOLDS, Fixtures.check(r, "half").status());
        assertEquals(Status.FAILS, Fixtures.check(r, "wrong").status());
        assertEquals("1/2", Fixtures.check(r, "wrong").factor());
    }

    @Test
    void nOneIsRecognisedUnderOtherNamesAndArrangements() {
        String wOfS = """
                param n = 1
                unknown s1
                coord s from 0 to s1
                unknown w(s)
                relation le: w''(s) + 2/s*w'(s) + w(s)^n = 0
                boundary w(0) = 1
                boundary w'(0) = 0
                boundary w(s1) = 0
                claim zero: s1 = pi
                """;
        String yOfX = """
                unknown X
                coord x from 0 to X
                unknown y(x)
                relation le: x*y''(x) + 2*y'(x) = -x*y(x)
                boundary y(0) = 1
                boundary y'(0) = 0
                boundary y(X) = 0
                claim zero: X = pi
                """;
        for (String file : new String[] {wOfS, yOfX}) {
            SymbolicResult r = Fixtures.analyze(Fixtures.model("le1-names.plumb", file));
            // Analytic: the first zero of sin(x)/x is pi.
            assertEquals(Status.HOLDS, Fixtures.check(r, "zero").status(), r.notes().toString());
        }
    }

    @Test
    void nFiveIsRecognisedAndHasNoFiniteZero() {
        String file = """
                param n = 5
                unknown xi1
                coord xi from 0 to xi1
                unknown theta(xi)
                relation le: theta''(xi) = -2/xi*theta'(xi) - theta(xi)^n
                boundary theta(0) = 1
                boundary theta'(0) = 0
                boundary theta(xi1) = 0
                claim at3: theta(3) = 1/2
                """;
        Model model = Fixtures.model("le5.plumb", file);
        SymbolicResult r = Fixtures.analyze(model);
        Derived theta = Fixtures.derived(r, "theta(xi)");
        // Analytic: theta = (1 + xi^2/3)^(-1/2) for n = 5, positive for every xi.
        for (double xi : new double[] {0.5, 1, 3, 10}) {
            assertEquals(1 / Math.sqrt(1 + xi * xi / 3), ConstantEvaluatorSupport.evaluate(model, theta.closedForm(), Map.of("xi", xi)),
                    1e-15, theta.printed());
        }
        assertEquals(Status.HOLDS, Fixtures.check(r, "at3").status());
        assertFalse(r.constants().containsKey("xi1"), r.constants().toString());
    }

    @Test
    void nThreeHasNoClosedFormAndSaysSo() {
        String file = """
                param n = 3
                coord xi from 0 to 7
                unknown theta(xi)
                relation le: theta''(xi) + 2/xi*theta'(xi) = -theta(xi)^n
                boundary theta(0) = 1
                boundary theta'(0) = 0
                """;
        SymbolicResult r = Fixtures.analyze(Fixtures.model("le3.plumb", file));
        assertFalse(r.profiles().containsKey("theta"));
        assertEquals(1, r.notes().stream().filter(n -> n.contains("no closed form was found for theta")).count(), r.notes().toString());
    }
}
