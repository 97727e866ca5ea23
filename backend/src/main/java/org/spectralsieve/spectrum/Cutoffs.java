package org.spectralsieve.spectrum;

import java.util.OptionalDouble;

/**
 * The edges of a curve at a transmittance level: where the first pass band that rises out of an absorbing
 * region, counted from the short-wavelength side, begins and ends.
 *
 * <ul>
 *   <li><b>UV absorption edge</b> ({@link #cutoffNm}, "cutoff wavelength"): the rising edge of that pass band,
 *       where T climbs through the level coming from the absorbing short-wavelength side. For a long-pass
 *       material (clear and UV-stabilised plastics, glass) it is the cutoff as the trade quotes it; for a
 *       band-pass material (UV-pass black glass, green tinted sheet) it is the band's short edge, not the
 *       red or infrared edge where the material opens again.</li>
 *   <li><b>Pass-band end</b> ({@link #passBandEndNm}): where T falls back through the level at the long side
 *       of the same band. Empty for a long-pass curve, which stays at or over the level to its long end.</li>
 * </ul>
 *
 * <p>Which band: T must first be under the level somewhere. A band already open at the curve's short end
 * has no rising edge in the data and is passed over (the deep-UV window of a sunscreen film on quartz; a
 * stray-light floor that reads 1.1 % in the far UV). After that, the band is the one holding the first
 * reading at or over the <em>anchor</em> level max(level, min(50 %, Tmax/2)), Tmax being the highest reading
 * from there on. From the anchor the walk goes down the wavelengths to the absorption edge and up to the
 * band's end. The anchor keeps weak features from being taken for the band: clear PMMA's small windows
 * near 270 and 315 nm at the 10 % level lie under it. For a long-pass curve the answer is the classic one,
 * the first fall under the level walking from the clear long side, unless the curve rises back over the
 * level further down (a deep-UV window), which walking down from the anchor never reaches.
 *
 * <p>Below-detection points: the true T of such a point is only known to be at most
 * max(stored value, detection limit). The point counts as under the level when that bound is under the
 * level. When the bound is at or above the level the point is <em>undetermined</em> — the curve fell
 * under what the instrument resolves before it reached the level — and the walk gives up with an empty
 * answer rather than guess; such a point is never an anchor. When the crossing ends on a below-detection
 * point its bound is used for the interpolation; the true T there is lower, so the reported edge is then at
 * most a few interval fractions inside the band, never placed where the data do not support it.
 * Crossings are interpolated in absorbance between the two points around them.
 */
public final class Cutoffs {

    /** The anchor level of a curve that reaches it: the usual 50 % point of an edge. */
    static final double ANCHOR = 0.5;

    private Cutoffs() {
    }

    /** The edges of the first pass band at one level; either may be empty (see the class comment). */
    public record Edges(double level, OptionalDouble absorptionEdgeNm, OptionalDouble passBandEndNm) {

        /** Whether the curve has a pass band closed on both sides at this level (a band-pass curve). */
        public boolean bandPass() {
            return absorptionEdgeNm.isPresent() && passBandEndNm.isPresent();
        }
    }

    /** Why {@link #cutoffNm} found no edge. */
    public enum NoEdge {
        /** T is at or over the level at every point: nothing to rise from. */
        ALWAYS_OVER,
        /** Once under the level, T never reaches it again within the measured range. */
        NEVER_RISES,
        /** An undetermined below-detection point (bound at or over the level) stopped the walk. */
        UNDETERMINED
    }

    /** Both edges at the level (a transmittance fraction in (0, 1]). */
    public static Edges edges(Curve curve, double level) {
        return new Edges(level, cutoffNm(curve, level), passBandEndNm(curve, level));
    }

    /**
     * The UV absorption edge (cutoff wavelength): walking down from the anchor of the first pass band, the
     * first place where T drops from >= level to < level. Empty when there is no such band (see
     * {@link NoEdge}) or an undetermined below-detection point comes first.
     */
    public static OptionalDouble cutoffNm(Curve curve, double level) {
        int anchor = anchor(curve, checked(level));
        return anchor < 0 ? OptionalDouble.empty() : walk(curve, level, anchor, -1);
    }

    /**
     * The long end of the first pass band: walking up from its anchor, the first place where T drops from
     * >= level to < level. Empty when there is no band, when T stays at or over the level to the curve's
     * long end (a long-pass curve), or when an undetermined below-detection point comes first.
     */
    public static OptionalDouble passBandEndNm(Curve curve, double level) {
        int anchor = anchor(curve, checked(level));
        return anchor < 0 ? OptionalDouble.empty() : walk(curve, level, anchor, +1);
    }

    /** Why {@link #cutoffNm} is empty for this curve and level; null when it is not. */
    public static NoEdge whyNoCutoff(Curve curve, double level) {
        int start = firstNotOver(curve, checked(level));
        if (start < 0) {
            return NoEdge.ALWAYS_OVER;
        }
        if (anchor(curve, level) < 0) {
            // a reading the instrument could not resolve at this level might be the band: say so, do not call it a miss
            for (int i = start; i < curve.size(); i++) {
                if (side(curve, i, level) == Side.UNDETERMINED) {
                    return NoEdge.UNDETERMINED;
                }
            }
            return NoEdge.NEVER_RISES;
        }
        return cutoffNm(curve, level).isPresent() ? null : NoEdge.UNDETERMINED;
    }

    private static double checked(double level) {
        if (!(level > 0 && level <= Curve.MAX_TRANSMITTANCE)) {
            throw new IllegalArgumentException("level must be a fraction in (0, " + Curve.MAX_TRANSMITTANCE
                    + "], was " + level);
        }
        return level;
    }

    /** Index of the first point, from the short end, that is not at or over the level; −1 when none. */
    private static int firstNotOver(Curve curve, double level) {
        for (int i = 0; i < curve.size(); i++) {
            if (side(curve, i, level) != Side.AT_OR_ABOVE) {
                return i;
            }
        }
        return -1;
    }

    /** Index of the first pass band's anchor reading (see the class comment); −1 when there is none. */
    private static int anchor(Curve curve, double level) {
        int start = firstNotOver(curve, level);
        if (start < 0) {
            return -1;
        }
        double highest = 0;
        for (int i = start; i < curve.size(); i++) {
            if (!curve.belowDetection(i)) {
                highest = Math.max(highest, curve.transmittance(i));
            }
        }
        double anchorLevel = Math.max(level, Math.min(ANCHOR, highest / 2));
        for (int i = start; i < curve.size(); i++) {
            if (!curve.belowDetection(i) && curve.transmittance(i) >= anchorLevel) {
                return i;
            }
        }
        return -1;
    }

    /** From the anchor (at or over the level) in direction step (−1 down, +1 up), the first fall under the level. */
    private static OptionalDouble walk(Curve curve, double level, int anchor, int step) {
        for (int i = anchor; i + step >= 0 && i + step < curve.size(); i += step) {
            Side next = side(curve, i + step, level);
            if (next == Side.UNDETERMINED) {
                return OptionalDouble.empty();
            }
            if (next == Side.BELOW) {
                return OptionalDouble.of(crossing(curve, i + step, i, level));
            }
        }
        return OptionalDouble.empty();
    }

    private enum Side { AT_OR_ABOVE, BELOW, UNDETERMINED }

    private static Side side(Curve curve, int i, double level) {
        if (curve.belowDetection(i)) {
            return upperBound(curve, i) < level ? Side.BELOW : Side.UNDETERMINED;
        }
        return curve.transmittance(i) >= level ? Side.AT_OR_ABOVE : Side.BELOW;
    }

    private static double upperBound(Curve curve, int i) {
        return Math.max(curve.transmittance(i), curve.detectionLimit(i));
    }

    private static double crossing(Curve curve, int below, int above, double level) {
        double tBelow = curve.belowDetection(below) ? upperBound(curve, below) : curve.transmittance(below);
        double aBelow = Curve.absorbance(tBelow);
        double aAbove = Curve.absorbance(curve.transmittance(above));
        double aLevel = Curve.absorbance(level);
        double f = (aLevel - aAbove) / (aBelow - aAbove);
        double nmAbove = curve.wavelengthNm(above);
        return nmAbove + f * (curve.wavelengthNm(below) - nmAbove);
    }
}
