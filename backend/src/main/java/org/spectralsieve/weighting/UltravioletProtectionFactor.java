package org.spectralsieve.weighting;

import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.weighting.Figure.Bound;

/**
 * Ultraviolet protection factor of a fabric or film (reference sheet §2; CIE vocabulary 17-26-075,
 * AATCC TM 183, AS/NZS 4399, EN 13758-1):
 * <pre>UPF = Σ E(λ)·s_er(λ)·Δλ / Σ E(λ)·s_er(λ)·T(λ)·Δλ, λ = 290, 291, …, 400 nm</pre>
 * E is a reference solar spectrum, s_er the erythema action spectrum ({@link Response#erythema()}).
 * The standards' own solar tables are not openly available, so the spectrum is whatever emitter the
 * caller names, and the figure says which. Plain sums on a fixed 1 nm grid (111 points, Δλ = 1 nm
 * cancels): finer than the standards' 5 nm so that a tabulated spectrum's UVB edge, which falls by
 * decades between 290 and 320 nm, is sampled rather than skipped. T is read by {@link Curve#transmittanceAt}.
 * A flat T gives exactly 1/T whatever E is.
 */
public final class UltravioletProtectionFactor {

    public static final String NAME = "upf";
    public static final double FROM_NM = 290;
    public static final double TO_NM = 400;
    public static final double STEP_NM = 1;

    private UltravioletProtectionFactor() {
    }

    /** Not available: no reference solar spectrum was named. */
    public static Figure withoutSolarSpectrum() {
        return Figure.unavailable(NAME, "1", "a reference solar spectrum must be named (a daylight or imported solar spectrum);"
                + " no measured solar table ships, because no solar table with an open licence was found");
    }

    /** UPF under {@code solar}; a lower bound when a weighted point of the curve is below detection. */
    public static Figure of(Curve curve, Emitter solar) {
        String spectrum = "solar spectrum " + solar.name();
        if (!(curve.covers(FROM_NM) && curve.covers(TO_NM))) {
            return Figure.unavailable(NAME, "1", "curve covers " + curve.minWavelengthNm() + "-"
                    + curve.maxWavelengthNm() + " nm; UPF needs " + FROM_NM + "-" + TO_NM
                    + " nm and curves are never extrapolated");
        }
        int n = (int) Math.round((TO_NM - FROM_NM) / STEP_NM);
        double weighted = 0;
        double passed = 0;
        boolean bound = false;
        for (int i = 0; i <= n; i++) {
            double nm = FROM_NM + i * STEP_NM;
            double ew = solar.powerAt(nm) * Response.erythema().weightAt(nm);
            if (!(ew > 0)) {
                continue;
            }
            weighted += ew;
            passed += ew * curve.transmittanceAt(nm).orElseThrow();
            bound |= curve.belowDetectionAt(nm);
        }
        if (!(weighted > 0)) {
            return Figure.unavailable(NAME, "1", spectrum + " has no power between " + FROM_NM + " and " + TO_NM
                    + " nm");
        }
        if (!(passed > 0)) {
            return Figure.of(NAME, StatedLimits.MAX_STATED_FACTOR, "1", Bound.AT_LEAST, "the curve passes no"
                    + " erythemally weighted " + spectrum + "; stated as at least 1e12 (OD 12), since no transmittance"
                    + " measurement states more");
        }
        String note = "Σ E·s_er / Σ E·s_er·T, E = " + spectrum + ", s_er = erythema (ISO/CIE 17166), plain sums "
                + FROM_NM + "-" + TO_NM + " nm on a " + STEP_NM + " nm grid; no rating statistics (mean minus"
                + " t·s/√n, rounding down) applied";
        if (bound) {
            note += "; points below the detection limit enter with their stored T, so UPF is at least this";
        }
        return Figure.of(NAME, weighted / passed, "1", bound ? Bound.AT_LEAST : Bound.VALUE, note);
    }
}
