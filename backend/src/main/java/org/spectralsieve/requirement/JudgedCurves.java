package org.spectralsieve.requirement;

import org.spectralsieve.spectrum.Curve;

/**
 * The two ends of what a curve with points below the detection limit can be: each such point at its upper
 * bound max(T, limit), or at 0. The true curve lies between them, so a figure that increases with every
 * T (any weighted transmittance) lies between the figures of the two. {@link CurveView} applies the upper
 * end reading by reading.
 */
final class JudgedCurves {

    private JudgedCurves() {
    }

    /** The curve with each below-detection point raised to its upper bound; flags and limits kept. */
    static Curve upperBounds(Curve curve) {
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
        return Curve.of(curve.wavelengthsNm(), t, curve.belowDetectionFlags(), curve.detectionLimits());
    }

    /** The curve with each below-detection point at 0: the least the true curve can be. */
    static Curve lowerBounds(Curve curve) {
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
        return Curve.of(curve.wavelengthsNm(), t, curve.belowDetectionFlags(), curve.detectionLimits());
    }
}
