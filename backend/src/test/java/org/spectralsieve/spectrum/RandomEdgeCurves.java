package org.spectralsieve.spectrum;

import java.util.Random;

/**
 * The random long-pass edge curves the screening and bound tests judge: a logistic edge with a slight ripple, an
 * occasional point at 0, and points under a detection limit kept below detection at a random reading under it (as a
 * spectrometer reports them). Each test draws its own ranges (start, step, edge, width, top, limit) and calls this for
 * the points, so the sequence of random draws, and with it every seeded case, is the one each test had before.
 */
public final class RandomEdgeCurves {

    private RandomEdgeCurves() {
    }

    /**
     * A curve of {@code n} points from {@code start} every {@code step} nm.
     *
     * @param top          the plateau transmittance beyond the edge
     * @param limit        the detection limit, 0 for none
     * @param cap          the largest reading kept ({@code Double.POSITIVE_INFINITY} for none)
     * @param zeroOneIn    a point is set to 0 with odds one in this many (one random draw per point)
     */
    public static Curve edge(Random random, double start, double step, int n, double edge, double width, double top,
                             double limit, double cap, int zeroOneIn) {
        double[] nm = new double[n];
        double[] t = new double[n];
        boolean[] below = new boolean[n];
        double[] limits = new double[n];
        for (int i = 0; i < n; i++) {
            nm[i] = start + i * step;
            double value = Math.min(cap, top / (1 + Math.exp(-(nm[i] - edge) / width)) * (1 + 0.03 * Math.sin(nm[i] / 3)));
            if (random.nextInt(zeroOneIn) == 0) {
                value = 0;
            }
            below[i] = limit > 0 && value < limit;
            t[i] = below[i] ? limit * random.nextDouble() : value;
            limits[i] = below[i] ? limit : 0;
        }
        return Curve.of(nm, t, below, limits);
    }
}
