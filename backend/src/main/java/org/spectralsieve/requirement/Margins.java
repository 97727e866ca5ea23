package org.spectralsieve.requirement;

import org.spectralsieve.spectrum.Curve;

/**
 * Margins in decades (optical-density units). PASS: log10(T / threshold); BLOCK: log10(threshold / T);
 * positive when the clause holds. T is floored at {@link Curve#ABSORBANCE_FLOOR_T} (or at the threshold,
 * if that is even smaller) so that a reading of exactly 0 gives a large finite margin rather than
 * infinity, which would break the root finder's interpolation and sorting; flooring at no more than the threshold keeps the
 * sign of the margin equal to whether the clause holds.
 */
final class Margins {

    private Margins() {
    }

    static double of(Direction direction, double t, double threshold) {
        double floored = Math.max(t, Math.min(Curve.ABSORBANCE_FLOOR_T, threshold));
        return direction == Direction.PASS
                ? Math.log10(floored / threshold)
                : Math.log10(threshold / floored);
    }

    /** Whether a number that is the true T (not a bound) satisfies the clause: PASS T >= t, BLOCK T <= t. */
    static boolean holds(Direction direction, double t, double threshold) {
        return direction == Direction.PASS ? t >= threshold : t <= threshold;
    }

    /**
     * Verdict of one reading. A bounded reading (true T <= u) proves a block when u <= threshold and
     * disproves a pass when u < threshold; otherwise it cannot decide.
     */
    static Verdict verdict(Direction direction, Reading reading, double threshold) {
        double t = reading.judged();
        if (!reading.bounded()) {
            return holds(direction, t, threshold) ? Verdict.MEETS : Verdict.MISSES;
        }
        if (direction == Direction.PASS) {
            return t < threshold ? Verdict.MISSES : Verdict.UNVERIFIED;
        }
        return t <= threshold ? Verdict.MEETS : Verdict.UNVERIFIED;
    }

    /** MISSES if any misses, else UNVERIFIED if any is unverified, else MEETS. */
    static Verdict combine(Verdict a, Verdict b) {
        return a.ordinal() >= b.ordinal() ? a : b;
    }
}
