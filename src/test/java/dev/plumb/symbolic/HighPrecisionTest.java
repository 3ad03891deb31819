package dev.plumb.symbolic;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.matheclipse.core.expression.F;
import org.matheclipse.core.interfaces.IExpr;
import org.matheclipse.core.interfaces.ISymbol;

/** The fast evaluation at a point agrees with Symja's own, and leaves to Symja what rests on cancellation. */
class HighPrecisionTest {

    private static Symja symja;
    private static final ISymbol A = F.Dummy("pb900");
    private static final ISymbol B = F.Dummy("pb901");
    private static final ISymbol X = F.Dummy("pb902");

    @BeforeAll
    static void start() {
        Symja.loadIntegrationRules();
        symja = new Symja(10);
    }

    private static Map<ISymbol, IExpr> point(IExpr a, IExpr b, IExpr x) {
        Map<ISymbol, IExpr> p = new LinkedHashMap<>();
        p.put(A, a);
        p.put(B, b);
        p.put(X, x);
        return p;
    }

    @Test
    void agreesWithSymjaToItsSixtyDigits() {
        List<IExpr> trees = List.of(
                F.Times(F.QQ(2, 3), F.Pi, A, F.Sqr(B), F.Subtract(F.Power(F.Times(F.QQ(3, 4), A, F.Power(F.Pi, F.CN1)), F.QQ(2, 3)), F.Sqr(X))),
                F.Times(A, F.Exp(F.Negate(F.Divide(X, B)))),
                F.Times(A, F.Power(F.Subtract(F.C1, F.Times(B, X, F.QQ(1, 1000))), F.Divide(A, B))),
                F.Plus(F.Log(A), F.Divide(F.Sin(X), X), F.Cos(F.Times(B, X)), F.Tan(F.QQ(1, 3))),
                F.Plus(F.Sqrt(A), F.Power(B, F.QQ(-5, 7)), F.Sinh(X), F.Tanh(B), F.ArcTan(A), F.ArcSin(F.QQ(1, 3))),
                F.Piecewise(F.list(F.list(F.Times(A, X), F.Less(X, F.C2))), F.Times(B, F.Sqr(X))));
        List<Map<ISymbol, IExpr>> points = List.of(
                point(F.QQ(597217, 1000), F.QQ(1001, 7), F.QQ(37, 10)),
                point(F.QQ(3, 2), F.QQ(5, 3), F.QQ(1, 9)),
                point(F.QQ(12345678901L, 1000), F.ZZ(123456), F.QQ(1, 1000)));
        for (IExpr tree : trees) {
            for (Map<ISymbol, IExpr> p : points) {
                check(tree, p);
            }
        }
    }

    private static void check(IExpr tree, Map<ISymbol, IExpr> p) {
        Sampler sampler = new Sampler(symja, null, 1);
        BigDecimal fast = sampler.value(tree, p);
        assertTrue(fast != null, () -> "no value for " + tree + " at " + p);
        BigDecimal exact = sampler.symjaValue(tree, p);
        if (exact != null) {
            assertTrue(Comparison.same(fast, exact, new BigDecimal("1e-55")), tree + " at " + p + ": " + fast + " vs " + exact);
            return;
        }
        // Exact rational powers such as (4709/10000)^(597217/143000) run out of time in Symja; in machine numbers they do not.
        List<IExpr> rules = new java.util.ArrayList<>();
        p.forEach((k, v) -> rules.add(F.Rule(k, F.num(v.evalDouble()))));
        double machine = symja.eval(F.N(F.ReplaceAll(tree, F.ListAlloc(rules)))).evalDouble();
        assertEquals(machine, fast.doubleValue(), 1e-12 * Math.abs(machine), tree + " at " + p);
    }

    @Test
    void whatIsNotRealIsNotReal() {
        Map<ISymbol, IExpr> p = point(F.CN1, F.C2, F.C3);
        Sampler sampler = new Sampler(symja, null, 1);
        for (IExpr tree : List.of(F.Sqrt(A), F.Log(A), F.Power(A, F.QQ(1, 3)), F.ArcSin(B), F.Power(F.Subtract(B, F.C2), F.CN1))) {
            assertNull(sampler.value(tree, p), tree.toString());
            assertNull(sampler.symjaValue(tree, p), tree.toString());
        }
    }

    @Test
    void anExactZeroIsLeftToSymja() {
        // sin(pi) is 0 exactly; 90 digits of pi leave about 1e-90, which must not pass for a value.
        IExpr tree = F.Divide(F.Sin(F.Times(F.Pi, X)), X);
        assertThrows(HighPrecision.Declined.class, () -> HighPrecision.value(tree, point(F.C1, F.C1, F.C3)));
        assertEquals(0, new Sampler(symja, null, 1).value(tree, point(F.C1, F.C1, F.C3)).signum());
        IExpr cancelling = F.Subtract(F.Power(F.Times(F.C2, A), F.QQ(1, 3)), F.Times(F.Power(F.C2, F.QQ(1, 3)), F.Power(A, F.QQ(1, 3))));
        assertEquals(0, new Sampler(symja, null, 1).value(cancelling, point(F.QQ(7, 3), F.C1, F.C1)).signum());
    }
}
