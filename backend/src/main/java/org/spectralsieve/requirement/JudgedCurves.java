package org.spectralsieve.requirement;

import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.weighting.BoundedCurves;

/**
 * The two ends of what a curve with points below the detection limit can be: each such point at its upper
 * bound max(T, limit), or at 0 ({@link BoundedCurves}, shared with the figures report so both state the
 * same ends). {@link CurveView} applies the upper end reading by reading.
 */
final class JudgedCurves {

    private JudgedCurves() {
    }

    /** The curve with each below-detection point raised to its upper bound; flags and limits kept. */
    static Curve upperBounds(Curve curve) {
        return BoundedCurves.upperBounds(curve);
    }

    /** The curve with each below-detection point at 0: the least the true curve can be. */
    static Curve lowerBounds(Curve curve) {
        return BoundedCurves.lowerBounds(curve);
    }
}
