package org.spectralsieve.weighting;

import org.spectralsieve.spectrum.Curve;

/**
 * The two ends of what a curve with points below the detection limit can be: each such point at its upper
 * bound max(T, limit), or at 0. The true curve lies between them, so a figure that rises with every T (any
 * weighted transmittance, τv, a band mean) lies between the figures of the two. The requirement's judgement
 * and the figures report both use these, so they state the same two ends.
 */
public final class BoundedCurves {

    private BoundedCurves() {
    }

    /** The curve with each below-detection point raised to its upper bound; flags and limits kept. */
    public static Curve upperBounds(Curve curve) {
        boolean any = false;
        for (int i = 0; i < curve.size() && !any; i++) {
            any = curve.belowDetection(i) && curve.detectionLimit(i) > curve.transmittance(i);
        }
        if (!any) {
            return curve;
        }
        double[] t = curve.transmittances();
        for (int i = 0; i < t.length; i++) {
            if (curve.belowDetection(i)) {
                t[i] = Math.max(t[i], curve.detectionLimit(i));
            }
        }
        return keepingUncertainty(curve, Curve.of(curve.wavelengthsNm(), t, curve.belowDetectionFlags(), curve.detectionLimits()));
    }

    /** The curve with each below-detection point at 0: the least the true curve can be. */
    public static Curve lowerBounds(Curve curve) {
        boolean any = false;
        for (int i = 0; i < curve.size() && !any; i++) {
            any = curve.belowDetection(i);
        }
        if (!any) {
            return curve;
        }
        double[] t = curve.transmittances();
        for (int i = 0; i < t.length; i++) {
            if (curve.belowDetection(i)) {
                t[i] = 0;
            }
        }
        return keepingUncertainty(curve, Curve.of(curve.wavelengthsNm(), t, curve.belowDetectionFlags(), curve.detectionLimits()));
    }

    /** The bounded copy keeps the measurement's uncertainty: only below-detection values moved, the σ stays. */
    private static Curve keepingUncertainty(Curve from, Curve bounded) {
        return from.hasUncertainty() ? bounded.withAbsorbanceUncertainty(from.absorbanceUncertainties()) : bounded;
    }
}
