package org.spectralsieve.weighting;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;

/**
 * How a bounded transmittance-type figure is stated, the same in the search's explanations, the figures
 * answer's {@code stated} text, the command line and the page: by its two ends, never by one sign alone.
 * With the points below the detection limit at their limit the figure is an upper bound U, with them at 0
 * a lower bound L, and the true value lies between; "at least L" in one answer and "≤ U" in another read
 * as a contradiction when L and U print alike, so both say the same:
 * <ul>
 * <li>L and U print alike (three significant digits): that one number, "79.6 %";</li>
 * <li>L is 0 (or unknown): "at most U";</li>
 * <li>otherwise "between L and U".</li>
 * </ul>
 */
public final class FigureText {

    private FigureText() {
    }

    /**
     * A transmittance fraction with three significant digits: "79.6 %", "0.0181 %"; below 0.001 % in
     * powers of ten, "9.06e-7 %", so that a long row of zeros does not pass for precision.
     */
    public static String percent(double fraction) {
        double p = 100 * fraction;
        if (p != 0 && Math.abs(p) < 1e-3) {
            return String.format(java.util.Locale.ROOT, "%.2e", p).replaceAll("\\.?0+e", "e")
                    .replaceAll("e-0*", "e-") + " %";
        }
        return significant(p, 3) + " %";
    }

    /** The two ends of a bounded transmittance, as described above; lower may be NaN when unknown. */
    public static String ends(double lower, double upper) {
        if (!(lower > 0)) {
            return "at most " + percent(upper);
        }
        String l = percent(lower);
        String u = percent(upper);
        return l.equals(u) ? u : "between " + l + " and " + u;
    }

    /**
     * The text a figure is stated by in answers: its ends for a bounded transmittance with a known other end,
     * else null (the caller formats value and sign as before).
     */
    public static String stated(Figure figure) {
        if (!figure.available() || !"fraction".equals(figure.unit()) || figure.bound() != Figure.Bound.AT_MOST) {
            return null;
        }
        return ends(figure.otherEnd().orElse(Double.NaN), figure.value().getAsDouble());
    }

    static String significant(double x, int digits) {
        if (!Double.isFinite(x)) {
            return String.valueOf(x);
        }
        if (x == 0) {
            return "0";
        }
        return new BigDecimal(x).round(new MathContext(digits, RoundingMode.HALF_EVEN)).stripTrailingZeros()
                .toPlainString();
    }
}
