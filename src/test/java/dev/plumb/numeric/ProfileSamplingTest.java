package dev.plumb.numeric;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import dev.plumb.lang.Expr;
import dev.plumb.lang.Span;
import dev.plumb.model.ConstantEvaluator;
import dev.plumb.model.Model;
import dev.plumb.model.Symbol;
import dev.plumb.symbolic.SymbolicEngine;
import dev.plumb.symbolic.SymbolicOptions;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Every profile of shipped derivations sampled at 121 points across the interval, as plots do
 * (on one solve, each point integrated on from the last, including points on breaks of piecewise
 * relations and at the ends), and compared with the closed form the symbolic engine derives. The
 * closed forms are the analytic solutions of each file's relations.
 */
class ProfileSamplingTest {

    static final int POINTS = 121;

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', value = {
            // file | parameter values (SI) where the file has no case | profiles that must have a closed form
            "uniform-sphere.plumb            |                                        | P",
            "isothermal-atmosphere.plumb     | T=288.15, mu=29, g=9.80665, P0=101325  | P",
            "troposphere.plumb               |                                        | P",
            "standard-atmosphere-1976.plumb  |                                        | P",
            "linear-density.plumb            | rho_c=1.5e5, R=6.957e8                 | m P",
            "layered-planet.plumb            |                                        | m P",
            "free-surface-sphere.plumb       | rho0=3000, P_c=1e10                    | P",
            "polytrope.plumb                 |                                        | ",
            "lane-emden-n1.plumb             |                                        | theta phi",
            "lane-emden-n5.plumb             |                                        | theta"})
    void profilesSampleWithoutFailureAndMeetTheirClosedForms(String file, String given, String required) throws Exception {
        Model m = Models.derivation(file);
        Map<String, Double> params = new HashMap<>();
        if (given != null) {
            for (String kv : given.split(",")) params.put(kv.split("=")[0].trim(), Double.parseDouble(kv.split("=")[1].trim()));
        } else if (!m.cases().isEmpty()) {
            params.putAll(m.cases().get(0).values());
        }
        Solution s = NumericEngine.solve(m, params, new NumericOptions(1e-10, 1e-12, false));
        Map<String, Expr> closed = SymbolicEngine.analyze(m, SymbolicOptions.defaults()).profiles();
        Symbol.Coordinate coord = m.coordinate().orElseThrow();
        Map<String, Double> at = new HashMap<>(params);
        for (Symbol.UnknownConstant u : m.unknownConstants()) at.put(u.name(), s.evaluate(new Expr.Name(u.name(), Span.NONE)));
        double a = s.evaluate(coord.from()), b = s.evaluate(coord.to());
        for (String p : required == null ? List.<String>of() : List.of(required.trim().split(" "))) {
            assertTrue(closed.containsKey(p), file + ": the symbolic engine gives no closed form of " + p + " (" + closed.keySet() + ")");
        }
        for (Symbol.Profile p : m.profiles()) {
            double[] numeric = new double[POINTS], exact = new double[POINTS];
            double biggest = 0;
            for (int i = 0; i < POINTS; i++) {
                double x = a + (b - a) * i / (POINTS - 1);
                try {
                    numeric[i] = s.evaluate(new Expr.Call(p.name(), Span.NONE, 0, List.of(new Expr.Num(x, Double.toString(x), Span.NONE)),
                            Span.NONE));
                } catch (SolveException e) {
                    fail(file + ": " + p.name() + "(" + x + ") could not be evaluated: " + e.getMessage());
                }
                if (closed.containsKey(p.name())) {
                    at.put(coord.name(), x);
                    exact[i] = new ConstantEvaluator(n -> m.symbols().get(n), at).evaluate(closed.get(p.name()));
                    if (Double.isFinite(exact[i])) biggest = Math.max(biggest, Math.abs(exact[i]));
                }
            }
            if (!closed.containsKey(p.name())) continue;
            int compared = 0;
            for (int i = 0; i < POINTS; i++) {
                // A closed form such as sin(xi)/xi is 0/0 at the centre, where only its limit is the profile.
                if (!Double.isFinite(exact[i])) continue;
                // Against the largest value of the profile: at a surface the profile itself is zero.
                assertEquals(exact[i], numeric[i], 1e-8 * biggest, file + ": " + p.name() + " at point " + i + "; " + s.method());
                compared++;
            }
            assertTrue(compared >= POINTS - 1, file + ": " + p.name() + " compared at only " + compared + " points");
        }
    }
}
