package org.spectralsieve.spectrum;

/**
 * The stored points of a transmittance curve as a figure reads them: wavelength, T, below-detection flag and
 * detection limit per point, in increasing wavelength. A {@link Curve} is one; a curve rescaled to another
 * thickness can be another that computes a point only when it is read (optics.RescaledPoints), so a figure
 * that reads a few dozen points of a curve of hundreds does not pay for the rest
 * (docs/exact-judgement-speed.md).
 */
public interface PointReadings {

    int size();

    double wavelengthNm(int i);

    double transmittance(int i);

    boolean belowDetection(int i);

    double detectionLimit(int i);

    /** One standard deviation in absorbance at point i; NaN when not known (the default: none is). */
    default double absorbanceUncertainty(int i) {
        return Double.NaN;
    }

    /** Whether any point may have a known uncertainty (false: {@link #absorbanceUncertainty} is NaN everywhere). */
    default boolean hasUncertainty() {
        return false;
    }

    default double minWavelengthNm() {
        return wavelengthNm(0);
    }

    default double maxWavelengthNm() {
        return wavelengthNm(size() - 1);
    }

    default boolean covers(double nm) {
        return nm >= minWavelengthNm() && nm <= maxWavelengthNm();
    }
}
