package org.spectralsieve.seedmodel;

/**
 * Wavelength-independent background absorption (impurities, grey tint). Why: even clear stock loses a
 * little in bulk, which keeps every modelled regular sample strictly below its lossless ceiling.
 *
 * @param alphaPerMm α at every wavelength, 1/mm
 */
public record FlatBackground(double alphaPerMm) implements AbsorptionPart {

    public FlatBackground {
        AbsorptionPart.requireNonNegative("alphaPerMm", alphaPerMm);
    }

    @Override
    public double alphaPerMm(double nm) {
        return alphaPerMm;
    }
}
