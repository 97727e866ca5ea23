package org.spectralsieve.library;

import org.spectralsieve.spectrum.Curve;

/** A sample's curve as the user asked for it: as measured, or rescaled to another thickness. */
public record SampleCurve(Material material, SampleInfo sample, Curve curve, double thicknessMm, boolean rescaled) {
}
