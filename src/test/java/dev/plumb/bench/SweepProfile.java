package dev.plumb.bench;

import dev.plumb.lang.Expr;
import dev.plumb.model.Model;
import dev.plumb.numeric.NumericEngine;
import dev.plumb.numeric.NumericOptions;
import dev.plumb.numeric.Sweep;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * A slice of the benchmark sweep run on one thread, for a profiler to watch (run it under JFR:
 * java -XX:StartFlightRecording=filename=sweep.jfr,settings=profile ...). Not a benchmark: the
 * figures it prints are wall times of one run.
 */
public final class SweepProfile {

    private SweepProfile() {
    }

    public static void main(String[] args) throws Exception {
        int masses = args.length > 0 ? Integer.parseInt(args[0]) : 100;
        Model model = EvaluatorBench.load("derivations/polytrope.plumb");
        Expr pc = model.shows().get(0).expr();
        NumericOptions options = NumericOptions.defaults().withoutErrorEstimate();
        List<Map<String, Double>> grid = new ArrayList<>();
        for (int i = 0; i < 20; i++) {
            double n = 0.5 + 4.0 * i / 19;
            for (int j = 0; j < masses; j++) {
                grid.add(Map.of("n", n, "M", PolytropeSolveBench.MSUN * Math.pow(10, -1 + 2.0 * j / (masses - 1)),
                        "R", PolytropeSolveBench.RSUN));
            }
        }
        int rounds = args.length > 1 ? Integer.parseInt(args[1]) : 3;
        for (int round = 0; round < rounds; round++) {
            long t0 = System.nanoTime();
            double[] p = Sweep.evaluate(model, grid, pc, options, 1);
            long t1 = System.nanoTime();
            int failed = 0;
            for (double v : p) if (Double.isNaN(v)) failed++;
            System.out.printf("sweep of %d on one thread: %.3f s, %.0f solves/s, %d failed%n", grid.size(), (t1 - t0) * 1e-9,
                    grid.size() / ((t1 - t0) * 1e-9), failed);
        }
        long t0 = System.nanoTime();
        int reps = 200;
        for (int k = 0; k < reps; k++) {
            NumericEngine.solve(model, Map.of("M", PolytropeSolveBench.MSUN, "R", PolytropeSolveBench.RSUN), options).evaluate(pc);
        }
        System.out.printf("single n = 3 solve: %.3f ms%n", (System.nanoTime() - t0) * 1e-6 / reps);
        try {
            // Counters exist only in an instrumented build.
            System.out.println(Class.forName("dev.plumb.numeric.Probe").getMethod("report").invoke(null));
        } catch (ClassNotFoundException notInstrumented) {
            // Nothing to print.
        }
    }
}
