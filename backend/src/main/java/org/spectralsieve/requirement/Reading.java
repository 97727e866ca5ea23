package org.spectralsieve.requirement;

/**
 * T at one wavelength as the judgement sees it. {@code value} is the curve's own number (interpolated in
 * absorbance); when {@code bounded} the true T is only known to be at most {@code upper}, the larger of
 * the stored value and the detection limit. Unbounded readings have {@code upper == value}.
 */
record Reading(double nm, double value, boolean bounded, double upper) {

    /** The number a verdict is based on: the bound for a bounded reading, else the value. */
    double judged() {
        return bounded ? upper : value;
    }
}
