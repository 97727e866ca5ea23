package org.spectralsieve.seedmodel;

import org.spectralsieve.spectrum.Curve;

/**
 * A modelled transmittance curve on a 1 nm grid; points at or below the detection limit carry the limit
 * itself and an upper-bound flag. Arrays are copied in and out.
 */
public final class ModelledCurve {

    private final double[] wavelengthsNm;
    private final double[] transmittances;
    private final boolean[] upperBounds;
    private final double detectionLimit;

    ModelledCurve(double[] wavelengthsNm, double[] transmittances, boolean[] upperBounds, double detectionLimit) {
        if (wavelengthsNm.length != transmittances.length || wavelengthsNm.length != upperBounds.length) {
            throw new IllegalArgumentException("curve arrays differ in length: " + wavelengthsNm.length + ", "
                    + transmittances.length + ", " + upperBounds.length);
        }
        this.wavelengthsNm = wavelengthsNm.clone();
        this.transmittances = transmittances.clone();
        this.upperBounds = upperBounds.clone();
        this.detectionLimit = detectionLimit;
    }

    public double[] wavelengthsNm() {
        return wavelengthsNm.clone();
    }

    public double[] transmittances() {
        return transmittances.clone();
    }

    public boolean[] upperBounds() {
        return upperBounds.clone();
    }

    public double detectionLimit() {
        return detectionLimit;
    }

    /** The same curve as the project's core value type. */
    public Curve toCurve() {
        double[] limits = new double[wavelengthsNm.length];
        java.util.Arrays.fill(limits, detectionLimit);
        return Curve.of(wavelengthsNm, transmittances, upperBounds, limits);
    }
}
