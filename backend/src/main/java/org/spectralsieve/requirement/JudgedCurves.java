package org.spectralsieve.requirement;

import org.spectralsieve.spectrum.Curve;

/**
 * Curves as verdicts read them: a point below the detection limit at its upper bound, max(T, limit), so
 * that a figure integrated over it is an upper bound on the true figure (every weighted figure here is
 * increasing in each T). {@link CurveView} applies the same rule reading by reading.
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
}
