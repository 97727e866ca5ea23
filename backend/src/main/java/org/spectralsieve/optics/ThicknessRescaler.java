package org.spectralsieve.optics;

import org.spectralsieve.spectrum.Curve;

/**
 * A measured curve converted to another thickness of the same material: strip the two surface
 * reflections to get the internal transmittance, scale that with Beer–Lambert, put the surfaces back.
 * Scaling T itself (T^(d2/d1)) would count the surface loss d2/d1 times over — 7 % absolute wrong for a
 * 2 → 5 mm window at T = 0.8 (REFERENCE §7). Each point follows {@link SlabReading}, the one rule for
 * readings at or near the lossless ceiling.
 *
 * <p>A curve's measurement uncertainty (one standard deviation in absorbance) is carried along, to first
 * order ({@link #rescaledUncertainty}): the surfaces' Fresnel reflectance is taken as exact, so the whole
 * uncertainty belongs to the internal absorbance, which Beer–Lambert scales by d'/d — and so does its
 * standard deviation.
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
            double[] sigma = new double[n];
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
                // a bound has no standard deviation: it says only how high the value can be
                sigma[i] = below[i] ? Double.NaN
                        : rescaledUncertainty(measured.absorbanceUncertainty(i), value[i], fromMm, toMm);
            }
            Curve rescaled = Curve.of(measured.wavelengthsNm(), t, below, limits);
            return measured.hasUncertainty() ? rescaled.withAbsorbanceUncertainty(sigma) : rescaled;
        }
    }

    /**
     * One standard deviation σ_A of a reading's absorbance, carried from {@code fromMm} to {@code toMm}.
     *
     * <p>A resolved reading: the slab's absorbance is A = A_int − 2·log10(1 − R) + log10(1 − R²K²) with
     * A_int = −log10 K, so dA/dA_int = (1 + R²K²)/(1 − R²K²) =: g(K) (the multiple reflections inside the
     * slab; at most 1.003 for R = 0.04). With R exact, σ_int = σ_A/g(K0); Beer–Lambert makes A_int linear in
     * the thickness, so σ_int' = σ_int·d'/d; and σ_A' = g(K')·σ_int'. To first order (GUM JCGM 100:2008,
     * 5.1.2), and only for the measurement's own error: the thicknesses are taken as exact.
     *
     * <p>An unresolved reading (no absorption the data can show, the whole loss put into the surfaces,
     * {@link SlabReading}): nothing tells absorption from surface loss, so the uncertainty is never shrunk and
     * grows as an absorption's would: σ_A·max(1, d'/d), the cautious side of both readings of the loss.
     *
     * @return NaN when {@code sigma} is NaN (unknown stays unknown)
     */
    static double rescaledUncertainty(double sigma, SlabReading reading, double fromMm, double toMm) {
        if (Double.isNaN(sigma)) {
            return Double.NaN;
        }
        double ratio = toMm / fromMm;
        if (!reading.resolved()) {
            return sigma * Math.max(1, ratio);
        }
        double k0 = reading.internal();
        double k1 = BeerLambert.scaleInternal(k0, fromMm, toMm);
        double r = reading.reflectance();
        return sigma * ratio * multipleReflectionSlope(k1, r) / multipleReflectionSlope(k0, r);
    }

    /** g(K) = dA/dA_int = (1 + R²K²)/(1 − R²K²), the slope of a slab's absorbance in its internal absorbance. */
    static double multipleReflectionSlope(double internal, double r) {
        double rk2 = r * r * internal * internal;
        return (1 + rk2) / (1 - rk2);
    }
}
