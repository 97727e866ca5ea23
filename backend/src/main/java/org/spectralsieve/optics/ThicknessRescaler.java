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
        Prepared prepared = prepareWhenRead(measured, index);
        for (int i = 0; i < measured.size(); i++) {
            prepared.value(i);
            prepared.limit(i);
        }
        return prepared;
    }

    /**
     * The same readings, each formed the first time it is read: a solve that reads a few dozen of a curve's
     * hundreds of points forms only those. The surface reflectances are computed and checked for every point
     * now, in order, so a refractive index that fails fails here with the same exception as {@link #prepare}
     * (given a finite T, {@link SlabReading#of} fails only on the reflectance).
     */
    static Prepared prepareWhenRead(Curve measured, RefractiveIndex index) {
        int n = measured.size();
        double[] fresnel = new double[n];
        for (int i = 0; i < n; i++) {
            double r = Fresnel.reflectanceInAir(index.at(measured.wavelengthNm(i)));
            Slab.requireReflectance(r);
            fresnel[i] = r;
        }
        return new Prepared(measured, fresnel, new SlabReading[n], new SlabReading[n]);
    }

    /**
     * A curve's points prepared for rescaling; {@link #at} is the rescaled curve. Each point's readings are
     * formed when first read and kept (the same numbers whenever formed); not shared between threads.
     */
    static final class Prepared {

        private final Curve measured;
        private final double[] fresnel;
        private final SlabReading[] value;
        private final SlabReading[] limit;
        private SlabMemo valueMemo;
        private SlabMemo limitMemo;

        private Prepared(Curve measured, double[] fresnel, SlabReading[] value, SlabReading[] limit) {
            this.measured = measured;
            this.fresnel = fresnel;
            this.value = value;
            this.limit = limit;
        }

        Curve measured() {
            return measured;
        }

        /** The Fresnel reflectance of point i's surfaces (from the index at its wavelength). */
        double fresnel(int i) {
            return fresnel[i];
        }

        /** Point i's reading T as a {@link SlabReading}. */
        SlabReading value(int i) {
            SlabReading v = value[i];
            if (v == null) {
                v = SlabReading.of(measured.transmittance(i), fresnel[i]);
                value[i] = v;
            }
            return v;
        }

        /** Point i's detection limit as a {@link SlabReading}. */
        SlabReading limit(int i) {
            SlabReading v = limit[i];
            if (v == null) {
                v = SlabReading.of(measured.detectionLimit(i), fresnel[i]);
                limit[i] = v;
            }
            return v;
        }

        /**
         * {@code value(i).transmittance(fromMm, toMm)} given K = K0^(toMm/fromMm) already taken
         * ({@link RescaledPoints}): the slab formula of the reading's reflectance, reused while K repeats for the
         * point (a clear reading has K0 = 1, so the same K at every thickness) — the same function of the same
         * two numbers.
         */
        double valueTransmittanceAt(int i, double internal) {
            if (valueMemo == null) {
                valueMemo = new SlabMemo(measured.size());
            }
            return valueMemo.transmittance(i, internal, value(i).reflectance());
        }

        /**
         * Whether point i's detection limit is stored as the very number of its T (a point below detection kept
         * at the floor): then its {@link #limit} reading is {@code SlabReading.of} of the same two numbers as its
         * {@link #value}, and every thickness gives the limit the T's number.
         */
        boolean limitIsValue(int i) {
            return Double.doubleToRawLongBits(measured.detectionLimit(i))
                    == Double.doubleToRawLongBits(measured.transmittance(i));
        }

        /** The same for point i's detection limit ({@code limit(i).transmittance(fromMm, toMm)}). */
        double limitTransmittanceAt(int i, double internal) {
            if (limitMemo == null) {
                limitMemo = new SlabMemo(measured.size());
            }
            return limitMemo.transmittance(i, internal, limit(i).reflectance());
        }

        Curve at(double fromMm, double toMm) {
            BeerLambert.requireThickness("fromMm", fromMm);
            BeerLambert.requireThickness("toMm", toMm);
            int n = measured.size();
            double[] t = new double[n];
            double[] limits = new double[n];
            boolean[] below = new boolean[n];
            double[] sigma = new double[n];
            for (int i = 0; i < n; i++) {
                SlabReading reading = value(i);
                t[i] = reading.transmittance(fromMm, toMm);
                limits[i] = limit(i).transmittance(fromMm, toMm);
                below[i] = measured.belowDetection(i);
                if (reading.boundAt(fromMm, toMm)) {
                    // the rescaled value itself is the bound: the hidden absorption can only lower it
                    below[i] = true;
                    limits[i] = Math.max(limits[i], Math.min(t[i], Math.nextDown(1.0)));
                }
                limits[i] = Math.min(limits[i], Math.nextDown(1.0));
                // a bound has no standard deviation: it says only how high the value can be
                sigma[i] = below[i] ? Double.NaN
                        : rescaledUncertainty(measured.absorbanceUncertainty(i), reading, fromMm, toMm);
            }
            Curve rescaled = Curve.of(measured.wavelengthsNm(), t, below, limits);
            return measured.hasUncertainty() ? rescaled.withAbsorbanceUncertainty(sigma) : rescaled;
        }
    }

    /** Per point, the last K a slab formula was applied to and its T, for a part read at many thicknesses. */
    private static final class SlabMemo {

        private final long[] internalBits;
        private final double[] transmittance;

        SlabMemo(int n) {
            internalBits = new long[n];
            transmittance = new double[n];
        }

        double transmittance(int i, double internal, double reflectance) {
            // K's bits plus one, so the array's initial 0 matches no K (the one K whose key is 0 is never kept)
            long key = Double.doubleToRawLongBits(internal) + 1;
            if (key == 0 || internalBits[i] != key) {
                transmittance[i] = Slab.transmittance(internal, reflectance);
                internalBits[i] = key;
            }
            return transmittance[i];
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
