package org.spectralsieve.ingest;

import java.util.Optional;
import org.spectralsieve.requirement.RequirementLimits;
import org.spectralsieve.spectrum.Curve;

/**
 * A curve lying wholly beyond the near infrared imports, but with a warning: this library's verdicts are about
 * ultraviolet and visible light (and a requirement can name wavelengths up to the end of the near infrared at
 * most), so such a curve answers none of them. Axes wholly outside 100–25,000 nm are refused before reading,
 * by {@link CurveShapeCheck}; this check only warns.
 *
 * <p>The boundary is {@value #NEAR_INFRARED_END_NM} nm, with nothing at or below it: the near infrared ends at
 * 3 µm in ISO 20473 and CIE's IR-C band starts there (both from memory), and it is the longest wavelength a
 * requirement may name ({@link RequirementLimits#MAX_WAVELENGTH_NM}). An infrared scan over the usual
 * 4000–400 cm⁻¹ starts at 2500 nm, inside the near infrared, and gets no warning: a requirement can still ask
 * about its 2500–3000 nm.
 */
final class InfraredOnly {

    /** A curve whose shortest wavelength lies above this (nm) is infrared only. */
    static final double NEAR_INFRARED_END_NM = RequirementLimits.MAX_WAVELENGTH_NM;

    private InfraredOnly() {
    }

    /** The warning for a curve with no point at or below {@link #NEAR_INFRARED_END_NM}; else empty. */
    static Optional<String> warning(Curve curve) {
        if (curve.minWavelengthNm() <= NEAR_INFRARED_END_NM) {
            return Optional.empty();
        }
        return Optional.of("infrared only: every wavelength lies beyond " + KeptRange.nm(NEAR_INFRARED_END_NM)
                + " nm, the end of the near infrared (" + KeptRange.nm(curve.minWavelengthNm()) + "–"
                + KeptRange.nm(curve.maxWavelengthNm()) + " nm); this tool's verdicts are about ultraviolet and"
                + " visible light and no requirement can name these wavelengths, so the curve answers none of them;"
                + " it is read as given");
    }
}
