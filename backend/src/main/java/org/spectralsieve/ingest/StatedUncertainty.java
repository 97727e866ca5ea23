package org.spectralsieve.ingest;

/**
 * An instrument's stated measurement uncertainty (one standard deviation), applied to every point of a
 * file; where the file carries standard deviations of its own, the two are combined as independent
 * components (root sum of squares).
 *
 * <p>Stated either in percent transmittance (a photometric accuracy, as spectrometer sheets give it) or in
 * absorbance (as absorbance-mode instruments give it); the import converts it to the absorbance
 * uncertainty the curve stores.
 *
 * @param amount one standard deviation, &gt; 0, in {@code scale}'s unit
 * @param scale  the unit of {@code amount}
 */
public record StatedUncertainty(double amount, Scale scale) {

    /** The unit a stated uncertainty is written in. */
    public enum Scale {
        /** Percentage points of transmittance: 0.5 means ±0.5 %T. */
        PERCENT_T,
        /** Decadic absorbance units: 0.01 means ±0.01 A. */
        ABSORBANCE
    }

    public StatedUncertainty {
        if (scale == null) {
            throw new IllegalArgumentException("uncertainty needs its unit: %T or absorbance");
        }
        double most = scale == Scale.PERCENT_T ? 100 : 12;
        if (!(amount > 0 && amount <= most)) {
            throw new IllegalArgumentException("uncertainty must be a standard deviation greater than 0 and at most "
                    + (scale == Scale.PERCENT_T ? "100 %T" : "12 absorbance units") + ", got " + amount);
        }
    }
}
