package org.spectralsieve.library;

import org.spectralsieve.spectrum.Curve;

/**
 * A sample's curve as the user asked for it: as measured, or rescaled to another thickness.
 *
 * @param material the sample's material, its own row only: {@link Material#samples()} is empty
 *                 ({@link JooqLibraryRepository#findMaterialWithoutSamples})
 */
public record SampleCurve(Material material, SampleInfo sample, Curve curve, double thicknessMm, boolean rescaled) {
}
