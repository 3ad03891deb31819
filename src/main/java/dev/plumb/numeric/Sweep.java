package dev.plumb.numeric;

import dev.plumb.lang.Expr;
import dev.plumb.model.Model;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;

/**
 * Solves one model at many parameter points on several threads (each solve compiles its own
 * evaluators, so solves share nothing mutable) and evaluates one quantity at each. Each thread
 * takes a contiguous run of points and starts every shooting from its neighbours' solutions
 * (see {@link Continuation}), which the dimensional first guesses only approximate.
 */
public final class Sweep {

    private Sweep() {
    }

    /**
     * @param points  SI parameter values per solve (free parameters, and fixed ones to override)
     * @param threads worker threads, normally the number of cores
     * @return the quantity at each point in SI, NaN where the solve failed
     */
    public static double[] evaluate(Model model, List<Map<String, Double>> points, Expr quantity, NumericOptions options,
                                    int threads) throws InterruptedException {
        double[] out = new double[points.size()];
        ExecutorService pool = Executors.newFixedThreadPool(threads, r -> {
            Thread t = new Thread(r, "plumb-sweep");
            t.setDaemon(true);
            return t;
        });
        try {
            int chunks = threads * 4;
            List<Future<?>> work = new ArrayList<>();
            for (int c = 0; c < chunks; c++) {
                int from = (int) ((long) points.size() * c / chunks), to = (int) ((long) points.size() * (c + 1) / chunks);
                work.add(pool.submit(() -> {
                    Continuation near = new Continuation();
                    for (int i = from; i < to; i++) out[i] = solveOne(model, points.get(i), quantity, options, near);
                }));
            }
            for (Future<?> f : work) {
                try {
                    f.get();
                } catch (ExecutionException e) {
                    throw new IllegalStateException("a sweep worker failed", e.getCause());
                }
            }
        } finally {
            pool.shutdownNow();
        }
        return out;
    }

    /**
     * One point of the sweep, started from the continuation's prediction; when that start fails, solved
     * again from the guesses, so a point's verdict never depends on its neighbours (only its last digits do).
     */
    private static double solveOne(Model model, Map<String, Double> point, Expr quantity, NumericOptions options,
                                   Continuation near) {
        double[] predicted = near.predict(point);
        for (double[] start : predicted == null ? new double[][]{null} : new double[][]{predicted, null}) {
            try {
                Solution s = NumericEngine.solve(model, point, options, Map.of(), start);
                double v = s.evaluate(quantity);
                near.record(point, s);
                return v;
            } catch (SolveException failed) {
                // From the prediction: try again from the guesses; from the guesses: the point is not solved.
            }
        }
        return Double.NaN;
    }
}
