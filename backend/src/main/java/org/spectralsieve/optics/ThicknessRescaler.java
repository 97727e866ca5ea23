package org.spectralsieve.optics;

import org.spectralsieve.spectrum.Curve;

/**
 * A measured curve converted to another thickness of the same material: strip the two surface
 * reflections to get the internal transmittance, scale that with Beer–Lambert, put the surfaces back.
 * Scaling T itself (T^(d2/d1)) would count the surface loss d2/d1 times over — 7 % absolute wrong for a
 * 2 → 5 mm window at T = 0.8 (REFERENCE §7). Each point follows {@link SlabReading}, the one rule for
 * readings at or near the lossless ceiling.
 */
public final class ThicknessRescaler {

    private ThicknessRescaler() {
    }

    /**
     * Per point: {@link SlabReading} of T and of the detection limit (R from n(λ) by Fresnel), each rescaled
     * by {@link SlabReading#transmittance}. Below-detection flags are kept: the rescaled T is non-decreasing
     * in the reading at every thickness at or above the measured one, so an upper bound maps to an upper
     * bound. A reading whose hidden absorption is extrapolated beyond its far thickness becomes a bound too,
     * with the rescaled value as its limit ({@link SlabReading#boundAt}).
     */
    public static Curve rescale(Curve measured, double fromMm, double toMm, RefractiveIndex index) {
        Prepared prepared = prepare(measured, index);
        return prepared.at(fromMm, toMm);
    }

    /** Every point's reading and detection limit as {@link SlabReading}s: what does not depend on the thickness. */
    static Prepared prepare(Curve measured, RefractiveIndex index) {
        int n = measured.size();
        SlabReading[] value = new SlabReading[n];
        SlabReading[] limit = new SlabReading[n];
        for (int i = 0; i < n; i++) {
            double r = Fresnel.reflectanceInAir(index.at(measured.wavelengthNm(i)));
            value[i] = SlabReading.of(measured.transmittance(i), r);
            limit[i] = SlabReading.of(measured.detectionLimit(i), r);
        }
        return new Prepared(measured, value, limit);
    }

    /** A curve's points prepared for rescaling; {@link #at} is the rescaled curve. */
    record Prepared(Curve measured, SlabReading[] value, SlabReading[] limit) {

        Curve at(double fromMm, double toMm) {
            BeerLambert.requireThickness("fromMm", fromMm);
            BeerLambert.requireThickness("toMm", toMm);
            int n = measured.size();
            double[] t = new double[n];
            double[] limits = new double[n];
            boolean[] below = new boolean[n];
            for (int i = 0; i < n; i++) {
                t[i] = value[i].transmittance(fromMm, toMm);
                limits[i] = limit[i].transmittance(fromMm, toMm);
                below[i] = measured.belowDetection(i);
                if (value[i].boundAt(fromMm, toMm)) {
                    // the rescaled value itself is the bound: the hidden absorption can only lower it
                    below[i] = true;
                    limits[i] = Math.max(limits[i], Math.min(t[i], Math.nextDown(1.0)));
                }
                limits[i] = Math.min(limits[i], Math.nextDown(1.0));
            }
            return Curve.of(measured.wavelengthsNm(), t, below, limits);
        }
    }
}
