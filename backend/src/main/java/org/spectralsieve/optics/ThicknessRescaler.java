package org.spectralsieve.optics;

import org.spectralsieve.spectrum.Curve;

/**
 * A measured curve converted to another thickness of the same material: strip the two surface
 * reflections to get the internal transmittance, scale that with Beer–Lambert, put the surfaces back.
 * Scaling T itself (T^(d2/d1)) would count the surface loss d2/d1 times over — 7 % absolute wrong for a
 * 2 → 5 mm window at T = 0.8 (REFERENCE §7).
 */
public final class ThicknessRescaler {

    private ThicknessRescaler() {
    }

    /**
     * Per point: R = reflectance in air of n(λ), K = {@link Slab#internalFromTransmittance}, K' =
     * {@link BeerLambert#scaleInternal}, T' = {@link Slab#transmittance}(K', R). The detection limit goes
     * through the same map and below-detection flags are kept: T' is increasing in T, so an upper bound on
     * T maps to an upper bound on T'. Readings above the lossless ceiling come out at the ceiling.
     */
    public static Curve rescale(Curve measured, double fromMm, double toMm, RefractiveIndex index) {
        BeerLambert.requireThickness("fromMm", fromMm);
        BeerLambert.requireThickness("toMm", toMm);
        int n = measured.size();
        double[] t = new double[n];
        double[] limits = new double[n];
        for (int i = 0; i < n; i++) {
            double r = Fresnel.reflectanceInAir(index.at(measured.wavelengthNm(i)));
            t[i] = rescalePoint(measured.transmittance(i), r, fromMm, toMm);
            limits[i] = rescalePoint(measured.detectionLimit(i), r, fromMm, toMm);
        }
        return Curve.of(measured.wavelengthsNm(), t, measured.belowDetectionFlags(), limits);
    }

    static double rescalePoint(double t, double r, double fromMm, double toMm) {
        double k = Slab.internalFromTransmittance(t, r);
        return Slab.transmittance(BeerLambert.scaleInternal(k, fromMm, toMm), r);
    }
}
