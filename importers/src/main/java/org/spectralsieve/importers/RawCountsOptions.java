package org.spectralsieve.importers;

/**
 * How raw counts become transmittance. Immutable; start from {@link #defaults()}.
 *
 * @param fullScale          the detector's maximum count (e.g. 65535 for 16 bits, 1.0 for normalised
 *                           data); NaN when unknown, then only flat tops mark saturation
 * @param saturationFraction a point at or above this fraction of full scale is saturated (0.98 default:
 *                           common practice, no source; the response turns non-linear before the ADC clips)
 * @param flatTopRun         this many or more equal neighbouring counts at a capture's maximum are a flat,
 *                           clipped top (3 by default); with a known full scale only tops above half of it
 * @param noiseHalfWindow    with a single dark capture, σ at pixel i is the standard deviation of the dark
 *                           over pixels i − w … i + w (5 by default: 11 pixels)
 * @param strayLightFloor    the instrument's stray-light or detection floor as a transmittance fraction
 *                           (REFERENCE §11, ASTM E387); 0 when not known
 */
public record RawCountsOptions(double fullScale, double saturationFraction, int flatTopRun, int noiseHalfWindow,
        double strayLightFloor) {

    /** IUPAC Gold Book L03540: detection limit x̄_bl + k·s_bl with k = 3. */
    public static final double K = 3.0;

    public RawCountsOptions {
        if (!Double.isNaN(fullScale) && !(fullScale > 0)) {
            throw new IllegalArgumentException("fullScale must be positive or NaN (unknown), was " + fullScale);
        }
        if (!(saturationFraction > 0 && saturationFraction <= 1)) {
            throw new IllegalArgumentException("saturationFraction must be in (0, 1], was " + saturationFraction);
        }
        if (flatTopRun < 2) {
            throw new IllegalArgumentException("flatTopRun must be at least 2, was " + flatTopRun);
        }
        if (noiseHalfWindow < 1) {
            throw new IllegalArgumentException("noiseHalfWindow must be at least 1, was " + noiseHalfWindow);
        }
        if (!(strayLightFloor >= 0 && strayLightFloor < 1)) {
            throw new IllegalArgumentException("strayLightFloor must be a fraction in [0, 1), was " + strayLightFloor);
        }
    }

    public static RawCountsOptions defaults() {
        return new RawCountsOptions(Double.NaN, 0.98, 3, 5, 0.0);
    }

    public RawCountsOptions fullScale(double counts) {
        return new RawCountsOptions(counts, saturationFraction, flatTopRun, noiseHalfWindow, strayLightFloor);
    }

    public RawCountsOptions saturationFraction(double fraction) {
        return new RawCountsOptions(fullScale, fraction, flatTopRun, noiseHalfWindow, strayLightFloor);
    }

    public RawCountsOptions flatTopRun(int run) {
        return new RawCountsOptions(fullScale, saturationFraction, run, noiseHalfWindow, strayLightFloor);
    }

    public RawCountsOptions noiseHalfWindow(int pixels) {
        return new RawCountsOptions(fullScale, saturationFraction, flatTopRun, pixels, strayLightFloor);
    }

    public RawCountsOptions strayLightFloor(double fraction) {
        return new RawCountsOptions(fullScale, saturationFraction, flatTopRun, noiseHalfWindow, fraction);
    }
}
