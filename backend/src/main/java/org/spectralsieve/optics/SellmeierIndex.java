package org.spectralsieve.optics;

import java.util.List;

/**
 * Sellmeier dispersion n² − 1 = Σ Bi·λ²/(λ² − Ci), λ in µm, Ci in µm². The formula is evaluated outside
 * {@code validFromNm..validToNm} as well (the UV end of a fit is often what users need), but
 * {@link #isExtrapolated} lets callers flag such values.
 */
public record SellmeierIndex(List<Double> b, List<Double> cMicronsSquared, double validFromNm, double validToNm)
        implements RefractiveIndex {

    /**
     * Fused silica, I. H. Malitson, JOSA 55:1205 (1965). Measured range 0.21–3.71 µm (from memory, see
     * REFERENCE §8).
     */
    public static final SellmeierIndex FUSED_SILICA = new SellmeierIndex(
            List.of(0.6961663, 0.4079426, 0.8974794),
            List.of(0.00467914826, 0.0135120631, 97.9340025),
            210, 3710);

    /** Borosilicate crown of international glass code 517642 (nd 1.5168, Vd 64.2), glass-catalogue coefficients; range 0.3–2.5 µm (from memory). */
    public static final SellmeierIndex CROWN_517642 = new SellmeierIndex(
            List.of(1.03961212, 0.231792344, 1.01046945),
            List.of(0.00600069867, 0.0200179144, 103.560653),
            300, 2500);

    /**
     * PMMA, one-term fit of Sultanova, Kasarova, Nikolov, Acta Phys. Pol. A 116:585 (2009), validated
     * 437–1052 nm only: 365 and 405 nm are extrapolations.
     */
    public static final SellmeierIndex PMMA = new SellmeierIndex(
            List.of(1.1819), List.of(0.011313), 437, 1052);

    public SellmeierIndex {
        b = List.copyOf(b);
        cMicronsSquared = List.copyOf(cMicronsSquared);
        if (b.isEmpty() || b.size() != cMicronsSquared.size()) {
            throw new IllegalArgumentException("Sellmeier needs as many B as C terms, at least one; got "
                    + b.size() + " B and " + cMicronsSquared.size() + " C");
        }
        for (int i = 0; i < b.size(); i++) {
            requireFinite("B at index " + i, b.get(i));
            requireFinite("C at index " + i, cMicronsSquared.get(i));
        }
        PhysicalRanges.requireWavelengthNm("Sellmeier validFromNm", validFromNm);
        PhysicalRanges.requireWavelengthNm("Sellmeier validToNm", validToNm);
        if (!(validFromNm < validToNm)) {
            throw new IllegalArgumentException("validity range " + validFromNm + ".." + validToNm
                    + " nm must be increasing");
        }
        requirePhysicalOverValidRange(b, cMicronsSquared, validFromNm, validToNm);
    }

    /** Points at which a fit is evaluated over its stated range; with no resonance inside, n varies smoothly between them. */
    private static final int CHECK_POINTS = 256;

    /**
     * The coefficients must describe a transparent material over the range they are stated for: no
     * resonance (λ² = Ci) inside it, and n finite and within {@link PhysicalRanges#MIN_INDEX}..
     * {@link PhysicalRanges#MAX_INDEX} at every checked point. A fit that fails this would turn every
     * surface reflection computed from it into nonsense.
     */
    private static void requirePhysicalOverValidRange(List<Double> b, List<Double> c, double fromNm, double toNm) {
        double lo2 = Math.pow(fromNm / 1000.0, 2);
        double hi2 = Math.pow(toNm / 1000.0, 2);
        for (int i = 0; i < c.size(); i++) {
            if (c.get(i) >= lo2 && c.get(i) <= hi2) {
                throw new IllegalArgumentException("Sellmeier C at index " + i + " (" + c.get(i) + " µm²) puts a resonance at "
                        + Math.sqrt(c.get(i)) * 1000 + " nm, inside its stated valid range " + fromNm + ".." + toNm + " nm");
            }
        }
        for (int k = 0; k <= CHECK_POINTS; k++) {
            double nm = fromNm + (toNm - fromNm) * k / CHECK_POINTS;
            double l2 = Math.pow(nm / 1000.0, 2);
            double nSquared = 1;
            for (int i = 0; i < b.size(); i++) {
                nSquared += b.get(i) * l2 / (l2 - c.get(i));
            }
            double n = Math.sqrt(nSquared);
            if (!PhysicalRanges.isIndex(n)) {
                throw new IllegalArgumentException("Sellmeier coefficients give n = " + n + " at " + nm
                        + " nm, inside their stated valid range " + fromNm + ".." + toNm + " nm; n must be from "
                        + PhysicalRanges.MIN_INDEX + " to " + PhysicalRanges.MAX_INDEX + " there");
            }
        }
    }

    private static void requireFinite(String name, double value) {
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException("Sellmeier " + name + " must be finite, was " + value);
        }
    }

    @Override
    public double at(double wavelengthNm) {
        if (!Double.isFinite(wavelengthNm) || wavelengthNm <= 0) {
            throw new IllegalArgumentException("wavelength must be finite and > 0 nm, was " + wavelengthNm);
        }
        double l2 = Math.pow(wavelengthNm / 1000.0, 2);
        double nSquared = 1;
        for (int i = 0; i < b.size(); i++) {
            nSquared += b.get(i) * l2 / (l2 - cMicronsSquared.get(i));
        }
        if (!(nSquared >= 1) || !Double.isFinite(nSquared)) {
            // near or past a resonance the real-index formula has no physical meaning
            throw new IllegalArgumentException("Sellmeier formula gives n² = " + nSquared + " at "
                    + wavelengthNm + " nm, outside its physical range (valid " + validFromNm + ".."
                    + validToNm + " nm)");
        }
        return Math.sqrt(nSquared);
    }

    public boolean isExtrapolated(double nm) {
        return nm < validFromNm || nm > validToNm;
    }
}
