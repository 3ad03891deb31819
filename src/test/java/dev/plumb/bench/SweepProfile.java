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
        var process = (com.sun.management.OperatingSystemMXBean) java.lang.management.ManagementFactory.getOperatingSystemMXBean();
        for (int round = 0; round < rounds; round++) {
            long t0 = System.nanoTime(), c0 = process.getProcessCpuTime();
            double[] p = Sweep.evaluate(model, grid, pc, options, 1);
            long t1 = System.nanoTime(), c1 = process.getProcessCpuTime();
            int failed = 0;
            for (double v : p) if (Double.isNaN(v)) failed++;
            System.out.printf("sweep of %d on one thread: %.3f s wall, %.3f s process CPU, %.0f solves per CPU second, %d failed%n",
                    grid.size(), (t1 - t0) * 1e-9, (c1 - c0) * 1e-9, grid.size() / ((c1 - c0) * 1e-9), failed);
        }
        // Thread CPU time as well as wall time: on a loaded machine only the former says what a solve costs.
        var cpu = java.lang.management.ManagementFactory.getThreadMXBean();
        int reps = 400;
        for (int round = 0; round < 3; round++) {
            long t0 = System.nanoTime(), c0 = cpu.getCurrentThreadCpuTime();
            for (int k = 0; k < reps; k++) {
                NumericEngine.solve(model, Map.of("M", PolytropeSolveBench.MSUN, "R", PolytropeSolveBench.RSUN), options).evaluate(pc);
            }
            long t1 = System.nanoTime(), c1 = cpu.getCurrentThreadCpuTime();
            for (int k = 0; k < reps; k++) {
                HandLaneEmden.centralPressure(3, PolytropeSolveBench.MSUN, PolytropeSolveBench.RSUN, options.relTol());
            }
            long t2 = System.nanoTime(), c2 = cpu.getCurrentThreadCpuTime();
            System.out.printf("single n = 3 solve: %.3f ms wall, %.3f ms CPU; by hand: %.3f ms wall, %.3f ms CPU; ratio (CPU) %.1f%n",
                    (t1 - t0) * 1e-6 / reps, (c1 - c0) * 1e-6 / reps, (t2 - t1) * 1e-6 / reps, (c2 - c1) * 1e-6 / reps,
                    (c1 - c0) / (double) (c2 - c1));
        }
        try {
            // Counters exist only in an instrumented build.
            System.out.println(Class.forName("dev.plumb.numeric.Probe").getMethod("report").invoke(null));
        } catch (ClassNotFoundException notInstrumented) {
            // Nothing to print.
        }
    }
}
