package org.spectralsieve.search.text;

import java.util.List;
import java.util.Objects;
import java.util.OptionalDouble;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.Cutoffs;
import org.spectralsieve.weighting.Figure;
import org.spectralsieve.weighting.LuminousTransmittance;

/**
 * One sample's curve, as stored (at the thickness it was measured at, never rescaled), summed up in the
 * coarse words the library's facets sort by: the band its UV edge lies in, the band of its luminous
 * transmittance τv, and whether it passes, partly passes or blocks the mercury lines and LED wavelengths
 * 254, 365 and 405 nm. A pure function of the curve (docs/library-search.md, "Spectral summaries").
 *
 * <p>Honest about what the curve cannot show: a wavelength the curve does not reach is {@link #NOT_COVERED}
 * (never "blocks"), and a reading below the instrument's detection limit that could lie on either side of
 * a threshold is {@link #NOT_DETERMINED}. A screening sort, not a verdict: the requirement search judges a
 * stated need exactly.
 */
public record SpectralSummary(String edge, String luminous, String at254, String at365, String at405) {

    /** The level of the cutoff wavelength: the 50 % point, the edge as the trade quotes it ({@link Cutoffs}). */
    public static final double EDGE_LEVEL = 0.5;
    /**
     * T at or over this at a wavelength "passes": the same 50 % point as the cutoff wavelength, so a long-pass
     * curve passes exactly the wavelengths above its edge. Our choice, not a trade rule; the trade's window
     * requirements ask more (passes over 80-85 %, ../shared/PRACTICE.md), which the requirement search judges.
     */
    public static final double PASSES_FROM = 0.5;
    /** T under this "blocks": the trade's "blocks under 1 %" (../shared/PRACTICE.md, requirement examples). */
    public static final double BLOCKS_UNDER = 0.01;

    public static final String PASSES = "passes";
    public static final String PARTLY = "partly";
    public static final String BLOCKS = "blocks";
    public static final String NOT_COVERED = "not covered";
    public static final String NOT_DETERMINED = "not determined";
    public static final String NO_EDGE = "no edge in range";

    /** UV edge bands, short to long, then the curves whose edge cannot be placed. */
    public static final List<String> EDGE_BANDS = List.of("under 300 nm", "300-340 nm", "340-380 nm", "380-420 nm",
            "420 nm and over", NO_EDGE);
    /**
     * Band limits in nm between the {@link #EDGE_BANDS}, 40 nm steps from 300 (our choice): they keep apart
     * quartz and UV-transmitting stock, glass and PET, standard acrylic, UV-stabilised sheet, tinted stock.
     */
    private static final double[] EDGE_LIMITS = {300, 340, 380, 420};

    /** τv bands, dark to clear, then what the curve cannot say. */
    public static final List<String> LUMINOUS_BANDS = List.of("under 10 %", "10-50 %", "50-80 %", "80 % and over",
            NOT_COVERED, NOT_DETERMINED);
    /** 80 % is the lower limit of ISO 12312-1 category 0 (clear); 10 % and 50 % split the tints (our choice). */
    private static final double[] LUMINOUS_LIMITS = {0.10, 0.50, 0.80};

    /** What a curve may say at one wavelength. */
    public static final List<String> AT_VALUES = List.of(PASSES, PARTLY, BLOCKS, NOT_COVERED, NOT_DETERMINED);

    /** The wavelengths summarised: the low-pressure mercury line, the i-line / UV LED, the h-line / violet LED. */
    public static final double[] WAVELENGTHS_NM = {254, 365, 405};

    public SpectralSummary {
        Objects.requireNonNull(edge, "edge");
        Objects.requireNonNull(luminous, "luminous");
        Objects.requireNonNull(at254, "at254");
        Objects.requireNonNull(at365, "at365");
        Objects.requireNonNull(at405, "at405");
    }

    /** The summary of a curve as stored. */
    public static SpectralSummary of(Curve curve) {
        return new SpectralSummary(edge(curve), luminous(curve), at(curve, 254), at(curve, 365), at(curve, 405));
    }

    /**
     * The band of the cutoff wavelength (the 50 % point, {@link Cutoffs#cutoffNm}). A curve at or over 50 %
     * everywhere has its edge below its first wavelength: "under 300 nm" when that is at or below 300 nm,
     * else nothing can be said. A curve that never rises through 50 %, or whose walk meets an undetermined
     * below-detection point, has no edge in range.
     */
    static String edge(Curve curve) {
        OptionalDouble nm = Cutoffs.cutoffNm(curve, EDGE_LEVEL);
        if (nm.isPresent()) {
            return band(nm.getAsDouble(), EDGE_LIMITS, EDGE_BANDS);
        }
        if (Cutoffs.whyNoCutoff(curve, EDGE_LEVEL) == Cutoffs.NoEdge.ALWAYS_OVER
                && curve.minWavelengthNm() <= EDGE_LIMITS[0]) {
            return EDGE_BANDS.get(0);
        }
        return NO_EDGE;
    }

    /**
     * The band of τv (D65, V(λ), {@link LuminousTransmittance}). When points below detection make τv only an
     * upper bound, its lower end is τv with those points at 0; the band is given only when both ends fall in it.
     */
    static String luminous(Curve curve) {
        Figure tv = LuminousTransmittance.of(curve);
        if (!tv.available()) {
            return NOT_COVERED;
        }
        String upper = band(tv.value().getAsDouble(), LUMINOUS_LIMITS, LUMINOUS_BANDS);
        if (tv.bound() == Figure.Bound.VALUE) {
            return upper;
        }
        double lower = LuminousTransmittance.of(belowDetectionAtZero(curve)).value().orElse(0);
        return band(lower, LUMINOUS_LIMITS, LUMINOUS_BANDS).equals(upper) ? upper : NOT_DETERMINED;
    }

    /**
     * Passes (T ≥ 50 %), partly (1-50 %) or blocks (T under 1 %) at {@code nm}, read on the stored curve
     * (interpolated in absorbance). A reading below detection is only known to be at most the larger of the
     * stored value and the detection limit: it blocks when that bound is under 1 %, else it is not determined.
     */
    static String at(Curve curve, double nm) {
        OptionalDouble t = curve.transmittanceAt(nm);
        if (t.isEmpty()) {
            return NOT_COVERED;
        }
        if (curve.belowDetectionAt(nm)) {
            return Math.max(t.getAsDouble(), curve.maxDetectionLimit()) < BLOCKS_UNDER ? BLOCKS : NOT_DETERMINED;
        }
        double value = t.getAsDouble();
        return value >= PASSES_FROM ? PASSES : value < BLOCKS_UNDER ? BLOCKS : PARTLY;
    }

    /** The value's band: below limits[0] the first, from limits[i - 1] up to limits[i] the i-th, and so on. */
    private static String band(double value, double[] limits, List<String> bands) {
        int i = 0;
        while (i < limits.length && value >= limits[i]) {
            i++;
        }
        return bands.get(i);
    }

    /** The curve with every point below detection at T = 0 (a τv computed on it is the lower end). */
    private static Curve belowDetectionAtZero(Curve curve) {
        double[] t = curve.transmittances();
        boolean[] below = curve.belowDetectionFlags();
        for (int i = 0; i < t.length; i++) {
            if (below[i]) {
                t[i] = 0;
            }
        }
        return Curve.of(curve.wavelengthsNm(), t, below, curve.detectionLimits());
    }
}
