package org.spectralsieve.seedmodel;

/**
 * Loss by scattering out of the measured beam, α_s = s·(500 nm/λ)^p. Why a power law: small scatterers
 * give Rayleigh's p = 4, coarse ones (matte coatings, PTFE grains, opal fillers) p near 0–1. A sample with
 * this part is stored with geometry "total" when the loss is what an integrating sphere still misses
 * (back-scatter), and thickness rescaling is not valid for it (multiple scattering, PRACTICE.md [S47]).
 *
 * @param alphaAt500PerMm s, the scatter coefficient at 500 nm, 1/mm
 * @param exponent        p, the wavelength exponent
 */
public record ScatterLoss(double alphaAt500PerMm, double exponent) implements AbsorptionPart {

    public ScatterLoss {
        AbsorptionPart.requireNonNegative("alphaAt500PerMm", alphaAt500PerMm);
        AbsorptionPart.requireNonNegative("exponent", exponent);
    }

    @Override
    public double alphaPerMm(double nm) {
        return Math.min(ALPHA_CAP_PER_MM, alphaAt500PerMm * Math.pow(500.0 / nm, exponent));
    }
}
