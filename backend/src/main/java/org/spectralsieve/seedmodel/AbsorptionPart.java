package org.spectralsieve.seedmodel;

/**
 * One named contribution to a material's absorption coefficient α(λ), in 1/mm (natural log).
 * Parts add: the total α is the sum of the parts, as independent absorbers in one matrix do.
 */
public sealed interface AbsorptionPart
        permits UrbachEdge, LogisticEdge, GaussianBand, FlatBackground, IronBand, ScatterLoss {

    /** Largest α any part returns; far beyond it a layer is opaque anyway, and the cap keeps sums finite. */
    double ALPHA_CAP_PER_MM = 1.0e4;

    /** Photon energy in eV of light of the given wavelength: E = hc/λ, hc = 1239.84 eV·nm (CODATA). */
    static double photonEnergyEv(double nm) {
        return 1239.84198 / nm;
    }

    double alphaPerMm(double nm);

    static void requirePositive(String what, double value) {
        if (!(value > 0) || !Double.isFinite(value)) {
            throw new IllegalArgumentException(what + " must be positive and finite, was " + value);
        }
    }

    static void requireNonNegative(String what, double value) {
        if (!(value >= 0) || !Double.isFinite(value)) {
            throw new IllegalArgumentException(what + " must be non-negative and finite, was " + value);
        }
    }
}
