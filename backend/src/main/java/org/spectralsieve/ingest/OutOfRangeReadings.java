package org.spectralsieve.ingest;

import java.util.List;
import java.util.function.IntFunction;
import java.util.Locale;
import org.spectralsieve.spectrum.Curve;

/**
 * Keeps the readings a real capture gives outside [0, 1] instead of refusing the file, and says so in a
 * warning with their count and wavelength range. Nothing is dropped: every point of the file stays a point of
 * the curve.
 *
 * <ul>
 *   <li>T below 0 down to {@link #NEGATIVE_NOISE_LIMIT}: noise around a dark floor (a good blocker always
 *       shows some). Kept as below-detection points: an upper bound at the detection limit, or at the noise
 *       the file itself shows (the largest negative reading's size) when that is larger, since a file that
 *       reads −0.005 %T cannot tell 0.004 %T from nothing.</li>
 *   <li>T above 1 up to {@link #DRIFT_LIMIT}: reference drift (lamp or detector moved between the reference
 *       and the sample scan). Kept as read and flagged; the optics read T above 1 as 1.</li>
 *   <li>T above {@link #DRIFT_LIMIT}: flagged unreliable (the reference or dark scan was wrong there). Kept;
 *       a reading above the curve's ceiling {@link Curve#MAX_TRANSMITTANCE} is stored at the ceiling, which
 *       changes no result because every computation already reads T above 1 as 1.</li>
 * </ul>
 * Readings below −{@link #NEGATIVE_NOISE_LIMIT} are not noise but a wrong baseline; they are refused, naming
 * the count, the lowest value and the range.
 */
final class OutOfRangeReadings {

    /**
     * Most negative T still taken as noise: −1 %T. A photometric noise of a few tenths of a percent at low
     * signal is usual for fibre and diode-array spectrometers (common practice, no source); −1 %T leaves room
     * for that and still refuses a wrong dark or baseline subtraction, which shows as many percent.
     */
    static final double NEGATIVE_NOISE_LIMIT = 0.01;

    /**
     * Highest T taken as reference drift: 105 %T. Lamp and detector drift between the reference and sample
     * scans is typically within a few percent of the reading (common practice, no source); more than 5 % above
     * the reference means the reference itself was wrong there, so those points are flagged unreliable.
     */
    static final double DRIFT_LIMIT = 1.05;

    private OutOfRangeReadings() {
    }

    /**
     * Settles {@code t}, {@code below} and {@code limits} in place (same length as {@code nm}) and adds one
     * warning per kind of out-of-range reading found to {@code warnings}.
     *
     * @throws IngestException naming the file when readings lie below −{@link #NEGATIVE_NOISE_LIMIT}
     */
    static void settle(String sourceName, double[] nm, double[] t, boolean[] below, double[] limits,
                       List<String> warnings) {
        settle(sourceName, nm, t, below, limits, warnings, i -> null);
    }

    /**
     * As {@link #settle(String, double[], double[], boolean[], double[], List)}; {@code where} names point i as
     * the file has it (its line and the value as written), or gives null, and is quoted in a refusal.
     */
    static void settle(String sourceName, double[] nm, double[] t, boolean[] below, double[] limits,
                       List<String> warnings, IntFunction<String> where) {
        Span negative = new Span();
        Span beyondNoise = new Span();
        Span drift = new Span();
        Span unreliable = new Span();
        for (int i = 0; i < t.length; i++) {
            double v = t[i];
            if (!Double.isFinite(v)) {
                continue; // the curve refuses it with its own message
            }
            if (v < -NEGATIVE_NOISE_LIMIT) {
                beyondNoise.add(nm[i], v);
                beyondNoise.lowestAt = v == beyondNoise.lowest ? i : beyondNoise.lowestAt;
            } else if (v < 0) {
                negative.add(nm[i], v);
            } else if (v > DRIFT_LIMIT) {
                unreliable.add(nm[i], v);
            } else if (v > 1) {
                drift.add(nm[i], v);
            }
        }
        if (beyondNoise.count > 0) {
            String lowest = where.apply(beyondNoise.lowestAt);
            throw new IngestException(sourceName, "transmittance", beyondNoise.count + " readings below "
                    + pct(-NEGATIVE_NOISE_LIMIT) + " %T (lowest " + pct(beyondNoise.lowest) + " %T) " + beyondNoise.range()
                    + ": more than noise, the dark or baseline correction is wrong there"
                    + (lowest == null ? "" : "; the lowest is at " + lowest));
        }
        if (negative.count > 0) {
            double noise = -negative.lowest;
            for (int i = 0; i < t.length; i++) {
                if (t[i] < 0) {
                    double bound = Math.max(limits[i], noise);
                    t[i] = bound;
                    limits[i] = bound;
                    below[i] = true;
                }
            }
            warnings.add(negative.count + " readings below 0 %T (lowest " + pct(negative.lowest) + " %T) "
                    + negative.range() + ": noise around the floor, kept as below detection (T at most "
                    + pct(Math.max(noise, 0)) + " %T or the detection limit, whichever is larger)");
        }
        if (drift.count > 0) {
            warnings.add(drift.count + " readings above 100 %T (highest " + pct(drift.highest) + " %T) " + drift.range()
                    + ": reference drift, kept as read; computations read them as 100 %T");
        }
        if (unreliable.count > 0) {
            for (int i = 0; i < t.length; i++) {
                if (t[i] > Curve.MAX_TRANSMITTANCE) {
                    t[i] = Curve.MAX_TRANSMITTANCE;
                }
            }
            warnings.add(unreliable.count + " readings above " + pct(DRIFT_LIMIT) + " %T (highest "
                    + pct(unreliable.highest) + " %T) " + unreliable.range()
                    + ": unreliable (more than reference drift; check the reference and dark scans there), kept"
                    + (unreliable.highest > Curve.MAX_TRANSMITTANCE
                            ? "; values above " + pct(Curve.MAX_TRANSMITTANCE) + " %T stored as " + pct(Curve.MAX_TRANSMITTANCE)
                            + " %T" : "")
                    + "; computations read them as 100 %T");
        }
    }

    private static String pct(double fraction) {
        return String.format(Locale.ROOT, "%.4g", fraction * 100).replaceAll("(\\.\\d*?)0+$", "$1")
                .replaceAll("\\.$", "");
    }

    /** Count, wavelength range and extremes of one kind of reading. */
    private static final class Span {
        int count;
        int lowestAt = -1;
        double fromNm = Double.POSITIVE_INFINITY;
        double toNm = Double.NEGATIVE_INFINITY;
        double lowest = Double.POSITIVE_INFINITY;
        double highest = Double.NEGATIVE_INFINITY;

        void add(double nm, double t) {
            count++;
            fromNm = Math.min(fromNm, nm);
            toNm = Math.max(toNm, nm);
            lowest = Math.min(lowest, t);
            highest = Math.max(highest, t);
        }

        String range() {
            return fromNm == toNm ? "at " + nm(fromNm) + " nm" : "between " + nm(fromNm) + " and " + nm(toNm) + " nm";
        }

        private static String nm(double v) {
            return String.format(Locale.ROOT, "%.6g", v).replaceAll("(\\.\\d*?)0+$", "$1").replaceAll("\\.$", "");
        }
    }
}
