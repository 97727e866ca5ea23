package org.spectralsieve.optics;

import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;

/**
 * Gauss–Legendre nodes and weights on [−1, 1]: the nodes are the roots of the Legendre polynomial P_N, found by
 * Newton's method from the Chebyshev-like first guesses cos(π(i − ¼)/(N + ½)), the weights 2 / ((1 − x²) P_N'(x)²)
 * (Abramowitz &amp; Stegun 25.4.29; the usual construction). Each rule is formed once and kept.
 */
final class GaussLegendre {

    private static final Map<Integer, double[][]> RULES = new ConcurrentHashMap<>();

    private GaussLegendre() {
    }

    /** {nodes, weights}, N each. */
    static double[][] rule(int n) {
        if (n < 1 || n > 512) {
            throw new IllegalArgumentException("1 to 512 nodes, asked " + n);
        }
        return RULES.computeIfAbsent(n, GaussLegendre::form);
    }

    private static double[][] form(int n) {
        double[] x = new double[n];
        double[] w = new double[n];
        for (int i = 0; i < (n + 1) / 2; i++) {
            double z = Math.cos(Math.PI * (i + 0.75) / (n + 0.5));
            double derivative = 0;
            for (int iteration = 0; iteration < 100; iteration++) {
                double p0 = 1;
                double p1 = 0;
                for (int j = 0; j < n; j++) {
                    double p2 = p1;
                    p1 = p0;
                    p0 = ((2 * j + 1) * z * p1 - j * p2) / (j + 1);
                }
                derivative = n * (z * p0 - p1) / (z * z - 1);
                double step = p0 / derivative;
                z -= step;
                if (Math.abs(step) < 1e-15) {
                    break;
                }
            }
            x[i] = -z;
            x[n - 1 - i] = z;
            w[i] = 2 / ((1 - z * z) * derivative * derivative);
            w[n - 1 - i] = w[i];
        }
        return new double[][] {x, w};
    }
}
