package dev.plumb.numeric;

import dev.plumb.lang.Expr;
import dev.plumb.model.Model;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.ArrayList;

/**
 * Solves one model at many parameter points on several threads (each solve compiles its own
 * evaluators, so solves share nothing mutable) and evaluates one quantity at each.
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
                    for (int i = from; i < to; i++) {
                        try {
                            out[i] = NumericEngine.solve(model, points.get(i), options).evaluate(quantity);
                        } catch (SolveException failed) {
                            out[i] = Double.NaN;
                        }
                    }
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
}
