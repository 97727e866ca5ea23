package org.spectralsieve.requirement;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import org.spectralsieve.spectrum.Curve;

/**
 * Numbers as the explanations print them: locale-independent, three significant digits, no trailing zeros.
 *
 * <p>Transmittances found on a curve are stated down to OD 12 (T = 1e-12, {@link Curve#ABSORBANCE_FLOOR_T},
 * the floor the margins already use) and no further: a rescaled reading or detection limit can reach
 * 1e-236 or underflow to 0, numbers no instrument can support. Below that the text says so instead.
 */
final class Wording {

    /** The smallest transmittance an explanation states as a number: OD 12. */
    static final double SMALLEST_STATED_T = Curve.ABSORBANCE_FLOOR_T;
    /** What an explanation says for a transmittance under {@link #SMALLEST_STATED_T}. */
    static final String BEYOND_OD_12 = "below OD 12 (T < 1e-12), the most this tool states";

    private Wording() {
    }

    static String percent(double t) {
        return significant(t * 100, 3) + " %";
    }

    /**
     * A transmittance read from a curve (a value, or a bound on one): as a percentage, or, under OD 12,
     * {@link #BEYOND_OD_12} — never 1e-236 % or 0 %.
     */
    static String transmittance(double t) {
        return statable(t) ? percent(t) : BEYOND_OD_12;
    }

    /** "at most 3 %", or {@link #BEYOND_OD_12} for an upper bound too small to state. */
    static String atMost(double t) {
        return statable(t) ? "at most " + percent(t) : BEYOND_OD_12;
    }

    /** Whether a transmittance is large enough to state as a number (at or above OD 12; NaN is left as is). */
    static boolean statable(double t) {
        return !(t < SMALLEST_STATED_T);
    }

    /**
     * A confidence as a percentage, rounded DOWN to 0.1 % so it never reads surer than it is (94.96 % is
     * "94.9 %", which does not look like a met 95 % demand); "over 99.9 %" and "under 0.1 %" at the ends.
     */
    static String confidence(double p) {
        if (p > 0.999) {
            return "over 99.9 %";
        }
        if (p < 0.001) {
            return "under 0.1 %";
        }
        double tenths = Math.floor(p * 1000 + 1e-9) / 10;
        return BigDecimal.valueOf(tenths).setScale(1, RoundingMode.HALF_EVEN).stripTrailingZeros().toPlainString() + " %";
    }

    static String nm(double nm) {
        return BigDecimal.valueOf(nm).setScale(1, RoundingMode.HALF_EVEN).stripTrailingZeros().toPlainString() + " nm";
    }

    static String mm(double mm) {
        return significant(mm, 4) + " mm";
    }

    /** A thickness or factor as written, up to four significant digits, without unit. */
    static String plain(double x) {
        return significant(x, 4);
    }

    static String mmSpan(double fromMm, double toMm) {
        return significant(fromMm, 4) + "–" + mm(toMm);
    }

    static String span(double fromNm, double toNm) {
        return trimmed(fromNm) + "–" + nm(toNm);
    }

    static String band(Band band) {
        return band.isPoint() ? nm(band.fromNm()) : span(band.fromNm(), band.toNm());
    }

    static String need(Direction direction, double threshold) {
        return (direction == Direction.PASS ? "over " : "under ") + percent(threshold);
    }

    private static String trimmed(double nm) {
        return BigDecimal.valueOf(nm).setScale(1, RoundingMode.HALF_EVEN).stripTrailingZeros().toPlainString();
    }

    private static String significant(double x, int digits) {
        if (!Double.isFinite(x)) {
            return String.valueOf(x);
        }
        if (x == 0) {
            return "0";
        }
        return new BigDecimal(x).round(new MathContext(digits, RoundingMode.HALF_EVEN)).stripTrailingZeros().toPlainString();
    }
}
