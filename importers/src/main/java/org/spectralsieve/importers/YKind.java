package org.spectralsieve.importers;

/** What the value column of a file means. Absorbance is decadic: A = −log10 T (= optical density). */
public enum YKind {
    TRANSMITTANCE_FRACTION,
    TRANSMITTANCE_PERCENT,
    ABSORBANCE;

    /** Converts one value of this kind to transmittance as a fraction (1 = all light passes). */
    public double toTransmittanceFraction(double value) {
        return switch (this) {
            case TRANSMITTANCE_FRACTION -> value;
            case TRANSMITTANCE_PERCENT -> value / 100.0;
            case ABSORBANCE -> Math.pow(10.0, -value);
        };
    }
}
