package dev.plumb.bench;

import dev.plumb.lang.Expr;
import dev.plumb.model.Model;
import dev.plumb.numeric.NumericEngine;
import dev.plumb.numeric.NumericOptions;
import dev.plumb.numeric.Sweep;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/**
 * One polytrope case solved from scratch (compile, dimensional guess, shooting on P(0) and K,
 * rtol 1e-12, no error-estimate solve) beside the same star solved by hand with Commons Math, and
 * a sweep of 10,000 such solves over a grid of n and M on two threads. The warm-ups are long
 * because on a busy 2-core machine the JIT took some 20 s to settle on the solve.
 */
@Fork(1)
@State(Scope.Benchmark)
public class PolytropeSolveBench {

    static final double MSUN = 1.3271244e20 / 6.67430e-11, RSUN = 6.957e8;

    Model model;
    Expr centralPressure;
    List<Map<String, Double>> grid;
    NumericOptions options = NumericOptions.defaults().withoutErrorEstimate();

    @Setup
    public void setup() throws Exception {
        model = EvaluatorBench.load("derivations/polytrope.plumb");
        centralPressure = model.shows().get(0).expr();
        grid = new ArrayList<>();
        // 20 indices from 0.5 to 4.5 by 500 masses from 0.1 to 10 solar masses (log-spaced): 10,000 solves.
        for (int i = 0; i < 20; i++) {
            double n = 0.5 + 4.0 * i / 19;
            for (int j = 0; j < 500; j++) {
                grid.add(Map.of("n", n, "M", MSUN * Math.pow(10, -1 + 2.0 * j / 499), "R", RSUN));
            }
        }
    }

    @Benchmark
    @BenchmarkMode(Mode.AverageTime)
    @OutputTimeUnit(TimeUnit.MILLISECONDS)
    @Warmup(iterations = 6, time = 4)
    @Measurement(iterations = 5, time = 2)
    public double singleSolve() throws Exception {
        return NumericEngine.solve(model, Map.of("M", MSUN, "R", RSUN), options).evaluate(centralPressure);
    }

    /**
     * The same n = 3 star solved by hand with Commons Math (Lane-Emden with a series start, an event at
     * theta = 0 and the homology relations) at the same tolerance: the yardstick for {@link #singleSolve}.
     */
    @Benchmark
    @BenchmarkMode(Mode.AverageTime)
    @OutputTimeUnit(TimeUnit.MILLISECONDS)
    @Warmup(iterations = 6, time = 4)
    @Measurement(iterations = 5, time = 2)
    public double handWrittenSolve() {
        return HandLaneEmden.centralPressure(3, MSUN, RSUN, options.relTol());
    }

    @Benchmark
    @BenchmarkMode(Mode.SingleShotTime)
    @OutputTimeUnit(TimeUnit.SECONDS)
    @Warmup(iterations = 2)
    @Measurement(iterations = 3)
    public double sweepOf10000OnTwoThreads() throws Exception {
        double[] p = Sweep.evaluate(model, grid, centralPressure, options, 2);
        int failed = 0;
        for (double v : p) if (Double.isNaN(v)) failed++;
        if (failed > 0) throw new IllegalStateException(failed + " of " + p.length + " solves failed");
        return p[p.length - 1];
    }
}
