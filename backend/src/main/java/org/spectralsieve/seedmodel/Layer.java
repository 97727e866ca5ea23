package org.spectralsieve.seedmodel;

/**
 * One layer of a sample: a bulk sheet is one layer; a fixed construction (coating on glass, laminate)
 * is several, whose internal transmittances multiply.
 *
 * @param part        what the layer is, for the reader of the catalogue code ("float glass", "PVB interlayer")
 * @param thicknessMm layer thickness, mm
 * @param absorption  the layer's absorption model
 */
public record Layer(String part, double thicknessMm, Absorption absorption) {

    public Layer {
        if (part == null || part.isBlank()) {
            throw new IllegalArgumentException("layer part name is blank");
        }
        AbsorptionPart.requirePositive("layer '" + part + "' thicknessMm", thicknessMm);
        if (absorption == null) {
            throw new IllegalArgumentException("layer '" + part + "' has no absorption model");
        }
    }

    public double internalTransmittance(double nm) {
        return absorption.internalTransmittance(nm, thicknessMm);
    }
}
