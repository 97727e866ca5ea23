package org.spectralsieve.weighting;

import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import org.spectralsieve.spectrum.PointReadings;

/**
 * The integration points of an effective transmittance over a covered range and their weights E·W·(trapezoid
 * end weight), and the figure's normalising integrals, computed once per emitter, response and range instead
 * of once per figure: a figure then costs only the reading of T along the points ({@link SortedReading}).
 * The numbers are those {@link WeightedFigures} computed per figure, by the same arithmetic in the same
 * order. Emitters and responses are immutable, so a cache keyed by the objects themselves (identity: neither
 * defines equals) can never hand out another spectrum's points; it is cleared when it grows past
 * {@link #LIMIT} entries (each range a curve covers is one entry; a library has few). Built-in emitters and
 * responses are constants; a parametric or imported one is a new object per parsed requirement, so its entries
 * serve one search and go at the next clearing (at most about 4 MB held: 256 ranges of at most ~1,000 points).
 */
final class IntegrationNodes {

    private static final int LIMIT = 256;
    private static final Map<Key, IntegrationNodes> COVERED = new ConcurrentHashMap<>();
    private static final Map<Key, double[]> TOTALS = new ConcurrentHashMap<>();

    private record Key(Emitter emitter, Response response, double from, double to) {
    }

    private final double[] nm;
    private final double[] weight;
    private final int count;
    private final double weightSum;
    private final double step;

    private IntegrationNodes(Emitter emitter, Response response, double from, double to) {
        int n = WeightedFigures.intervals(from, to, emitter.stepNm());
        this.step = (to - from) / n;
        double[] at = new double[n + 1];
        double[] w = new double[n + 1];
        int k = 0;
        double sum = 0;
        for (int i = 0; i <= n; i++) {
            double x = i == n ? to : from + i * step;
            double ew = emitter.powerAt(x) * response.weightAt(x) * WeightedFigures.trapezoidWeight(i, n);
            if (!(ew > 0)) {
                continue;
            }
            sum += ew;
            at[k] = x;
            w[k++] = ew;
        }
        this.nm = at;
        this.weight = w;
        this.count = k;
        this.weightSum = sum;
    }

    /** The points over [from, to], a range inside the curves they will read. */
    static IntegrationNodes covered(Emitter emitter, Response response, double from, double to) {
        Key key = new Key(emitter, response, from, to);
        IntegrationNodes nodes = COVERED.get(key);
        if (nodes == null) {
            if (COVERED.size() >= LIMIT) {
                COVERED.clear();
            }
            nodes = new IntegrationNodes(emitter, response, from, to);
            COVERED.put(key, nodes);
        }
        return nodes;
    }

    /** {inside, beyondResponse} of {@link WeightedFigures#totals}, cached; a fresh copy. */
    static double[] totals(Emitter emitter, Response response, double lo, double hi) {
        Key key = new Key(emitter, response, lo, hi);
        double[] totals = TOTALS.get(key);
        if (totals == null) {
            if (TOTALS.size() >= LIMIT) {
                TOTALS.clear();
            }
            totals = WeightedFigures.totals(emitter, response, lo, hi);
            TOTALS.put(key, totals);
        }
        return totals.clone();
    }

    /** ∫E·W dλ and ∫E·W·T dλ over the points, T read on the curve with below-detection points as {@code as}. */
    WeightedFigures.Covered read(PointReadings curve, BelowDetectionAs as) {
        SortedReading.Sum sum = SortedReading.weightedSum(curve, nm, weight, count, as);
        return new WeightedFigures.Covered(weightSum * step, sum.passed() * step, sum.bound(), step);
    }
}
