package org.spectralsieve.ingest;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * A stretch at one end of a file's wavelength axis where the readings are noise, not the sample: typically
 * the deep UV of a diode-array capture, where the lamp and the detector give almost no light and the
 * absorbance jumps between −0.7 and +1 from one nanometre to the next.
 *
 * <p>The rule, all of it read off the transmittance the file gives (before any flag or limit is applied):
 * <ol>
 *   <li><b>Scatter at a point</b>: how far a reading lies from the straight line through its two neighbours,
 *       |T<sub>i</sub> − (T<sub>i−1</sub> + T<sub>i+1</sub>)/2|, and its median over the {@value #WINDOW}
 *       points around it. A straight or gently curved stretch of a real curve scores near 0 whatever its
 *       slope; random noise of one standard deviation σ scores about 0.8 σ. The median ignores a lone spike
 *       and the one or two points of a sharp bend.</li>
 *   <li><b>Noisy point</b>: scatter at least {@link #MIN_SCATTER} (5 %T) and at least {@link #TIMES_TYPICAL}
 *       times the curve's typical scatter (its median over all points). A reading that is uncertain by 5 %T
 *       or more cannot support a 1 %T blocking verdict or a 10 %T cutoff, and photometric noise of a working
 *       UV–visible spectrometer is a few tenths of a percent (common practice, no source); ten times what
 *       the same file shows elsewhere says the instrument, not the sample, changed there.</li>
 *   <li><b>Region</b>: the unbroken run of noisy points that starts at the first (or last) point of the axis,
 *       at least {@value #MIN_POINTS} points long and at most half the curve (a file that is noise all
 *       through has no "rest" to compare with), in a curve of at least {@value #MIN_CURVE_POINTS} points.</li>
 *   <li><b>Impossible readings</b>: the run holds at least one reading above 100 %T or below 0 %T (negative
 *       or impossible absorbance). A steep but real edge read at coarse steps can scatter as much, but
 *       stays within 0–100 %T; noise around a weak signal does not.</li>
 * </ol>
 * Only the ends are looked at: noise in the middle of a curve (a lamp change-over) is rarer and would cut the
 * curve in two. A blocker's stop band (T scattering around 0 by a few hundredths of a percent) scores far
 * below 5 %T and is never a noise region: it is evidence of blocking, kept as below-detection points.
 *
 * @param end         which end of the axis the region lies at
 * @param firstIndex  index of its first point in the file's axis
 * @param lastIndex   index of its last point (inclusive)
 * @param fromNm      its shortest wavelength
 * @param toNm        its longest wavelength
 * @param scatter     the median scatter over the region, as a transmittance fraction
 * @param typical     the curve's typical scatter, as a transmittance fraction
 * @param aboveOne    readings above 100 %T in the region
 * @param belowZero   readings below 0 %T in the region
 * @param highest     the highest reading in the region (fraction)
 */
public record NoiseRegion(End end, int firstIndex, int lastIndex, double fromNm, double toNm, double scatter,
                          double typical, int aboveOne, int belowZero, double highest) {

    /** Points whose scatter is taken together (median): odd, so a point sits in its middle. */
    public static final int WINDOW = 7;
    /** Least scatter of a noisy point, as a transmittance fraction: 5 %T. */
    public static final double MIN_SCATTER = 0.05;
    /** A noisy point scatters at least this many times the curve's typical scatter. */
    public static final double TIMES_TYPICAL = 10;
    /** Fewest points of a region: fewer are a spike or two, left to the out-of-range flags. */
    public static final int MIN_POINTS = 5;
    /** Fewest points of a curve that is looked at: a window needs room on both sides and a rest to compare. */
    public static final int MIN_CURVE_POINTS = 20;

    /** The short-wavelength or the long-wavelength end of the axis. */
    public enum End {
        SHORT, LONG;

        public String label() {
            return name().toLowerCase(Locale.ROOT);
        }
    }

    public NoiseRegion {
        if (end == null || firstIndex < 0 || lastIndex < firstIndex || !(fromNm <= toNm)) {
            throw new IllegalArgumentException("a noise region needs an end and ascending indices and wavelengths");
        }
    }

    /** Points in the region. */
    public int points() {
        return lastIndex - firstIndex + 1;
    }

    /**
     * The noise regions of a curve, at most one per end, short end first.
     *
     * @param wavelengthsNm ascending, as in the file
     * @param transmittance fractions as read (may lie below 0 or above 1)
     */
    public static List<NoiseRegion> find(double[] wavelengthsNm, double[] transmittance) {
        int n = transmittance.length;
        if (n < MIN_CURVE_POINTS || wavelengthsNm.length != n) {
            return List.of();
        }
        double[] scatter = localScatter(transmittance);
        double typical = median(scatter.clone());
        double threshold = Math.max(MIN_SCATTER, TIMES_TYPICAL * typical);
        List<NoiseRegion> found = new ArrayList<>();
        int run = 0;
        while (run < n && scatter[run] >= threshold) {
            run++;
        }
        region(End.SHORT, 0, run - 1, wavelengthsNm, transmittance, scatter, typical).ifPresent(found::add);
        int start = n;
        while (start > 0 && scatter[start - 1] >= threshold) {
            start--;
        }
        if (start > run) { // a curve noisy all through is refused as a region by the half-curve rule anyway
            region(End.LONG, start, n - 1, wavelengthsNm, transmittance, scatter, typical).ifPresent(found::add);
        }
        return List.copyOf(found);
    }

    private static Optional<NoiseRegion> region(End end, int first, int last, double[] nm, double[] t,
                                                          double[] scatter, double typical) {
        int points = last - first + 1;
        if (points < MIN_POINTS || points > t.length / 2) {
            return Optional.empty();
        }
        int above = 0;
        int below = 0;
        double highest = Double.NEGATIVE_INFINITY;
        for (int i = first; i <= last; i++) {
            above += t[i] > 1 ? 1 : 0;
            below += t[i] < 0 ? 1 : 0;
            highest = Math.max(highest, t[i]);
        }
        if (above + below == 0) {
            return Optional.empty();
        }
        double regionScatter = median(Arrays.copyOfRange(scatter, first, last + 1));
        return Optional.of(new NoiseRegion(end, first, last, nm[first], nm[last], regionScatter, typical,
                above, below, highest));
    }

    /** Per point: the median over the window around it of each reading's distance from its neighbours' mean. */
    static double[] localScatter(double[] t) {
        int n = t.length;
        double[] off = new double[n];
        for (int i = 1; i < n - 1; i++) {
            off[i] = Math.abs(t[i] - (t[i - 1] + t[i + 1]) / 2);
        }
        off[0] = off[1]; // an end point has one neighbour: take its neighbour's value
        off[n - 1] = off[n - 2];
        double[] scatter = new double[n];
        int half = WINDOW / 2;
        for (int i = 0; i < n; i++) {
            scatter[i] = median(Arrays.copyOfRange(off, Math.max(0, i - half), Math.min(n, i + half + 1)));
        }
        return scatter;
    }

    private static double median(double[] values) {
        Arrays.sort(values);
        int m = values.length / 2;
        return values.length % 2 == 1 ? values[m] : (values[m - 1] + values[m]) / 2;
    }

    /** Why the region is taken for noise, in the words of the warning and the preview. */
    public String reason() {
        StringBuilder s = new StringBuilder(String.format(Locale.ROOT,
                "readings scatter by about %s %%T from one point to the next (%s times the rest of the curve)",
                percent(scatter), typical > 0 ? String.format(Locale.ROOT, "%.0f", scatter / typical) : "many"));
        if (aboveOne > 0) {
            s.append(String.format(Locale.ROOT, "; %d read above 100 %%T (highest %s %%T, absorbance %s)", aboveOne,
                    percent(highest), String.format(Locale.ROOT, "%.2f", -Math.log10(highest))));
        }
        if (belowZero > 0) {
            s.append("; ").append(belowZero).append(" read below 0 %T");
        }
        return s.append(": the signal there is noise, not the sample").toString();
    }

    /** "190–255 nm" as the warnings and the preview write it. */
    public String range() {
        return KeptRange.nm(fromNm) + "–" + KeptRange.nm(toNm) + " nm";
    }

    private static String percent(double fraction) {
        return String.format(Locale.ROOT, "%.3g", fraction * 100).replaceAll("(\\.\\d*?)0+$", "$1")
                .replaceAll("\\.$", "");
    }
}
