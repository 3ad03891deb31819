package dev.plumb.numeric;

import org.apache.commons.math3.analysis.integration.gauss.GaussIntegrator;
import org.apache.commons.math3.analysis.integration.gauss.GaussIntegratorFactory;

/**
 * The Gauss-Legendre nodes and weights of one degree on [0, 1] with the matrix that integrates
 * the Lagrange interpolant on those nodes from 0 to each node. They depend on the degree alone,
 * so each is computed once per process (computing them cost more than the collocation itself).
 */
final class CollocationRule {

    private static final CollocationRule[] CACHE = new CollocationRule[32];

    /** Nodes c_j in (0, 1), weights w_j, and A[i][j] = integral from 0 to c_i of the j-th Lagrange basis polynomial. */
    final double[] nodes, weights;
    final double[][] integration;

    private CollocationRule(int s) {
        GaussIntegrator rule = new GaussIntegratorFactory().legendre(s, 0.0, 1.0);
        nodes = new double[s];
        weights = new double[s];
        for (int j = 0; j < s; j++) {
            nodes[j] = rule.getPoint(j);
            weights[j] = rule.getWeight(j);
        }
        integration = new double[s][s];
        for (int i = 0; i < s; i++) {
            for (int j = 0; j < s; j++) {
                double sum = 0;
                for (int q = 0; q < s; q++) sum += weights[q] * nodes[i] * lagrange(nodes, j, nodes[i] * nodes[q]);
                integration[i][j] = sum;
            }
        }
    }

    /** The rule of degree {@code s}; the arrays are shared and must not be written. */
    static CollocationRule of(int s) {
        if (s >= CACHE.length) return new CollocationRule(s);
        synchronized (CACHE) {
            if (CACHE[s] == null) CACHE[s] = new CollocationRule(s);
            return CACHE[s];
        }
    }

    private static double lagrange(double[] c, int j, double t) {
        double p = 1;
        for (int k = 0; k < c.length; k++) if (k != j) p *= (t - c[k]) / (c[j] - c[k]);
        return p;
    }
}
