package org.spectralsieve.requirement;

import java.util.function.DoubleUnaryOperator;

/**
 * One condition's margins at its last few thicknesses, so a solve that asks the same condition at the same
 * thickness again reads the number it computed (docs/exact-judgement-speed.md, "Margins read once per
 * thickness"). Why: a weighted solve asks each condition at the range's ends in its own crossing search, then
 * again at the same ends and at the recommendation's last bracket ends, where every condition is read; each ask
 * is a figure (a weighted sum over the path's points). The margin is a function of the thickness alone (the
 * path's points at d are the same numbers whether kept or recomputed), so the kept value is the one a new
 * computation gives, bit for bit. Keyed by the thickness's bits, as {@link RecentThicknesses}; a miss computes.
 * Not shared between threads (one solve, one candidate).
 */
final class RecentMargins {

    /** The ends of the range, a crossing search's last trials and the recommendation's: a dozen is ample. */
    static final int CAPACITY = 16;

    private final DoubleUnaryOperator margin;
    private final long[] keys = new long[CAPACITY];
    private final double[] values = new double[CAPACITY];
    private int count;
    private int next;

    RecentMargins(DoubleUnaryOperator margin) {
        this.margin = margin;
    }

    /** The margin at d: the kept one when d was asked lately, else computed (and kept over the oldest). */
    double at(double d) {
        long key = Double.doubleToRawLongBits(d);
        for (int k = 1; k <= count; k++) {
            int slot = next - k < 0 ? next - k + CAPACITY : next - k;
            if (keys[slot] == key) {
                return values[slot];
            }
        }
        double m = margin.applyAsDouble(d);
        keys[next] = key;
        values[next] = m;
        next = next + 1 == CAPACITY ? 0 : next + 1;
        count = Math.min(count + 1, CAPACITY);
        return m;
    }
}
