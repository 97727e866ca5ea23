package org.spectralsieve.optics;

/**
 * One measured reading T0 of a plane-parallel part, prepared for a change of thickness: the one rescaling
 * rule every thickness model of the project uses (the rescaler, the sweep, the light path's elements, the
 * requirement's thickness solver and the store's search). See docs/rescaling-model.md.
 *
 * <p>Two kinds of reading:
 * <ul>
 *   <li><b>Resolved</b>, T0 below the lossless ceiling C = 2n/(n² + 1) by more than the reading's
 *       uncertainty u: the surfaces reflect the Fresnel R of the stated index, K0 is the slab inversion of
 *       T0, and K(d) = K0^(d/d0) (Beer–Lambert). The value stays a value at every thickness.</li>
 *   <li><b>Unresolved</b>, T0 ≥ C − u (a clear part; above C through noise, a too-low index guess or a
 *       coating): the data cannot show any absorption, so none is assumed (K0 = 1) and the whole measured
 *       loss is put into the surfaces, with the effective surface reflectance R' = (1 − T0)/(1 + T0) for
 *       which the lossless ceiling is T0 itself. The curve then equals the reading at d0 exactly, is
 *       continuous and flat in d, and never rises. An absorption up to what the reading hides in its
 *       uncertainty — K as low as the inversion of T0 − u — cannot be ruled out; it is δ decades at d0 and
 *       δ·d/d0 at d. While that stays within {@link #RESOLVABLE_DECADES} the reading is a value; beyond the
 *       far thickness d0·{@link #farFactor} it is only an upper bound (an extrapolation of an absorption the
 *       data cannot resolve is not a value).</li>
 * </ul>
 * A reading above 1 (noise) is taken as 1: no slab passes more than all the light.
 *
 * @param reflectance the surface reflectance the rescaling uses: Fresnel R, or R' for an unresolved reading
 * @param internal    K0, the internal transmittance at the measured thickness
 * @param farFactor   the rescaled reading is a value up to d0·farFactor and an upper bound beyond (≥ 1;
 *                    +∞ for a resolved reading)
 */
public record SlabReading(double reflectance, double internal, double farFactor) {

    /**
     * Absolute uncertainty u of a transmittance reading near full transmission: ±0.5 %T, the photometric
     * accuracy UV-VIS spectrophotometers are commonly quoted with (±0.3 to ±0.5 %T; common practice, from
     * memory). Deliberately on the safe side of the repeatability real files show: the instrument blank in
     * ../shared/reference-data/measured-transmittance-… stays within ±0.08 %T of 100 % over 200–1000 nm
     * (±0.64 %T at the array's far ends), its StdDev column about 0.01–0.03 %T in the visible.
     */
    public static final double READING_UNCERTAINTY = 0.005;

    /**
     * How far the hidden absorption may be extrapolated and still give a value: 0.01 decades, i.e. the
     * rescaled T of a clear part could be up to 2.3 % lower than stated (about 2 %T), the precision
     * visible transmittance is usually quoted to (common practice, no source). For a reading near 90 %
     * with u = 0.5 %T this is about four times the measured thickness.
     */
    public static final double RESOLVABLE_DECADES = 0.01;

    public SlabReading {
        Slab.requireReflectance(reflectance);
        Slab.requireFraction("internal", internal);
        if (!(farFactor >= 1)) {
            throw new IllegalArgumentException("far factor must be at least 1, was " + farFactor);
        }
    }

    /** The reading T0 of a part whose surfaces reflect {@code fresnelR} each (Fresnel, stated index). */
    public static SlabReading of(double t, double fresnelR) {
        if (!Double.isFinite(t)) {
            throw new IllegalArgumentException("t must be finite, was " + t);
        }
        Slab.requireReflectance(fresnelR);
        if (t <= 0) {
            return new SlabReading(fresnelR, 0, Double.POSITIVE_INFINITY);
        }
        if (t < Slab.losslessTransmittance(fresnelR) - READING_UNCERTAINTY) {
            return new SlabReading(fresnelR, Slab.internalFromTransmittance(t, fresnelR), Double.POSITIVE_INFINITY);
        }
        double reading = Math.min(t, 1);
        double effective = (1 - reading) / (1 + reading);
        double hiddenInternal = Slab.internalFromTransmittance(Math.max(0, reading - READING_UNCERTAINTY), effective);
        double hiddenDecades = -Math.log10(hiddenInternal);
        double far = hiddenDecades > 0 ? Math.max(1, RESOLVABLE_DECADES / hiddenDecades) : Double.POSITIVE_INFINITY;
        return new SlabReading(effective, 1, far);
    }

    /** Whether the data resolve this reading's absorption (then it is a value at every thickness). */
    public boolean resolved() {
        return farFactor == Double.POSITIVE_INFINITY;
    }

    /** T at {@code toMm} of the part measured at {@code fromMm}: slab T of K0^(to/from) with this reflectance. */
    public double transmittance(double fromMm, double toMm) {
        return Slab.transmittance(BeerLambert.scaleInternal(internal, fromMm, toMm), reflectance);
    }

    /** The thickness beyond which the rescaled reading is only an upper bound (+∞ when resolved). */
    public double farMm(double measuredMm) {
        return measuredMm * farFactor;
    }

    /** True when the reading rescaled from {@code fromMm} to {@code toMm} is an upper bound, not a value. */
    public boolean boundAt(double fromMm, double toMm) {
        return toMm > farMm(fromMm);
    }

    /** The symmetric slab element this reading stands for (its own T, its surfaces), for a light path. */
    public OpticalElement element() {
        return OpticalElement.slab(internal, reflectance);
    }
}
