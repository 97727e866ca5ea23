package org.spectralsieve.spectrum;

/**
 * A curve as the outputs state it (CSV export, the curve JSON): nothing beneath OD 12.
 *
 * <p>A curve rescaled to a thick part can hold transmittances and detection limits of 1e-236, or limits
 * that underflow to 0 — numbers no instrument supports and that read as absurd in a file. Every
 * transmittance under {@link #SMALLEST_STATED_T} (OD 12, the floor the margins use) is stated as the bound
 * "&lt; 1e-12" instead, and every recorded detection limit is raised to at least that floor. Both are
 * weaker, still true statements: T &lt; 1e-36 implies T &lt; 1e-12. A limit of exactly 0 on a point above
 * the floor means "none recorded" and is left alone.
 */
public final class StatedCurve {

    /** OD 12: the smallest transmittance this tool states as a number. */
    public static final double SMALLEST_STATED_T = Curve.ABSORBANCE_FLOOR_T;

    private StatedCurve() {
    }

    public static Curve of(Curve curve) {
        int n = curve.size();
        double[] t = curve.transmittances();
        boolean[] below = curve.belowDetectionFlags();
        double[] limits = curve.detectionLimits();
        boolean changed = false;
        for (int i = 0; i < n; i++) {
            if (t[i] < SMALLEST_STATED_T) {
                t[i] = SMALLEST_STATED_T;
                below[i] = true;
                limits[i] = Math.max(limits[i], SMALLEST_STATED_T);
                changed = true;
            } else if (limits[i] < SMALLEST_STATED_T && (limits[i] > 0 || below[i])) {
                limits[i] = SMALLEST_STATED_T;
                changed = true;
            }
        }
        if (!changed) {
            return curve;
        }
        Curve stated = Curve.of(curve.wavelengthsNm(), t, below, limits);
        return curve.hasUncertainty() ? stated.withAbsorbanceUncertainty(curve.absorbanceUncertainties()) : stated;
    }
}
