package org.spectralsieve.optics;

/**
 * Thickness scaling of internal transmittance, K(d2) = K(d1)^(d2/d1): absorbance is proportional to path
 * length (Smith, Modern Optical Engineering, eqs. 10.2–10.3). Applies to internal transmittance only —
 * surface reflection does not scale with thickness, which is why {@link ThicknessRescaler} strips it first.
 */
public final class BeerLambert {

    private BeerLambert() {
    }

    public static double scaleInternal(double internal, double fromMm, double toMm) {
        Slab.requireFraction("internal", internal);
        requireThickness("fromMm", fromMm);
        requireThickness("toMm", toMm);
        return Math.pow(internal, toMm / fromMm);
    }

    static void requireThickness(String name, double mm) {
        if (!Double.isFinite(mm) || mm <= 0) {
            throw new IllegalArgumentException(name + " must be a finite thickness > 0 mm, was " + mm);
        }
    }
}
