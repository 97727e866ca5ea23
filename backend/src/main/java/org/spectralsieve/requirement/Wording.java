package org.spectralsieve.requirement;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;

/** Numbers as the explanations print them: locale-independent, three significant digits, no trailing zeros. */
final class Wording {

    private Wording() {
    }

    static String percent(double t) {
        return significant(t * 100, 3) + " %";
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
