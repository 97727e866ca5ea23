package org.spectralsieve.spectrum;

import java.util.OptionalDouble;

/**
 * Cutoff wavelength of a long-pass edge: where T, coming from the long-wavelength (clear) side, first
 * falls under a level.
 *
 * <p>Below-detection points: the true T of such a point is only known to be at most
 * max(stored value, detection limit). The point counts as under the level when that bound is under the
 * level. When the bound is at or above the level the point is <em>undetermined</em> — the curve fell
 * under what the instrument resolves before it reached the level — and the walk gives up with an empty
 * answer rather than guess. When the crossing ends on a below-detection point its bound is used for the
 * interpolation; the true T there is lower, so the reported cutoff is then at most a few interval
 * fractions too short, never placed where the data do not support it.
 */
public final class Cutoffs {

    private Cutoffs() {
    }

    /**
     * Walking from the longest wavelength toward shorter ones, the first place where T drops from
     * >= level to < level, interpolated in absorbance between the two points. Empty if T never crosses,
     * if the curve is already under the level at its long end, or if an undetermined below-detection
     * point (see class comment) comes first.
     */
    public static OptionalDouble cutoffNm(Curve curve, double level) {
        if (!(level > 0 && level <= Curve.MAX_TRANSMITTANCE)) {
            throw new IllegalArgumentException("level must be a fraction in (0, " + Curve.MAX_TRANSMITTANCE
                    + "], was " + level);
        }
        int last = curve.size() - 1;
        if (side(curve, last, level) != Side.AT_OR_ABOVE) {
            return OptionalDouble.empty();
        }
        for (int i = last; i > 0; i--) {
            Side next = side(curve, i - 1, level);
            if (next == Side.UNDETERMINED) {
                return OptionalDouble.empty();
            }
            if (next == Side.BELOW) {
                return OptionalDouble.of(crossing(curve, i - 1, i, level));
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
