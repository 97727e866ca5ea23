package org.spectralsieve.spectrum;

/**
 * Conversions between the three ways the trade writes transmittance: percent, fraction and optical
 * density (OD = absorbance = −log10 T, decadic).
 */
public final class Transmittance {

    private Transmittance() {
    }

    public static double fromPercent(double percent) {
        requireNotNaN("percent", percent);
        return percent / 100.0;
    }

    public static double toPercent(double t) {
        requireNotNaN("t", t);
        return t * 100.0;
    }

    /** −log10 t; +Infinity for t <= 0 (a perfect blocker has unbounded density). */
    public static double toOpticalDensity(double t) {
        requireNotNaN("t", t);
        return t <= 0 ? Double.POSITIVE_INFINITY : -Math.log10(t);
    }

    public static double fromOpticalDensity(double od) {
        requireNotNaN("od", od);
        return Math.pow(10.0, -od);
    }

    private static void requireNotNaN(String name, double value) {
        if (Double.isNaN(value)) {
            throw new IllegalArgumentException(name + " must be a number, was NaN");
        }
    }
}
