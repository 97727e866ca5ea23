package org.spectralsieve.requirement;

/**
 * T at one wavelength as the judgement sees it. {@code value} is the curve's own number (interpolated in
 * absorbance); when {@code bounded} the true T is only known to be at most {@code upper}, the larger of
 * the stored value and the detection limit. Unbounded readings have {@code upper == value}.
 * {@code sigmaA}: the curve's measurement uncertainty there, one standard deviation in decadic absorbance
 * ({@link org.spectralsieve.spectrum.Curve#absorbanceUncertaintyAt}); NaN when not known.
 */
record Reading(double nm, double value, boolean bounded, double upper, double sigmaA) {

    /** A reading without a known uncertainty. */
    Reading(double nm, double value, boolean bounded, double upper) {
        this(nm, value, bounded, upper, Double.NaN);
    }

    /** The number a verdict is based on: the bound for a bounded reading, else the value. */
    double judged() {
        return bounded ? upper : value;
    }

    /** Whether a Gaussian error model applies: a reading (not a bound) with a known uncertainty. */
    boolean hasUncertainty() {
        return !bounded && !Double.isNaN(sigmaA);
    }
}
