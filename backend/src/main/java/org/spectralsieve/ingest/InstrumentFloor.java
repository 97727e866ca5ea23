package org.spectralsieve.ingest;

import java.util.Locale;
import java.util.Optional;

/**
 * An instrument's floor found in a measured curve: the lowest transmittance, repeated at many points
 * because the instrument (or its software) reports that value whenever the signal is below what it can
 * measure. Such points only say "T is at most this", so the floor is a detection limit even when the
 * file states none.
 *
 * <p>The rule: the curve's smallest positive reading is at most {@value #MAX_FLOOR} (1 %T, OD 2), and at least
 * {@value #MIN_POINTS} points sit at it (within a relative {@value #SAME_VALUE} of it, because exports
 * write the floor with varying last digits, e.g. 0.0100000219… and 0.0100000109… %T). Common practice,
 * no source: a noisy measurement of a real blocker does not repeat its lowest value five times to six
 * significant digits, a clamp does; where a coarsely rounded file does, those points are at the file's
 * resolution and are no better than an upper bound either. Above 1 %T a repeated minimum is a flat clear
 * region (e.g. 91.0 %T), not a floor.
 *
 * @param limit  the highest value counted as the floor: every floor point is at or below it
 * @param points how many points sit at the floor
 * @param fromNm first wavelength at the floor
 * @param toNm   last wavelength at the floor
 */
public record InstrumentFloor(double limit, int points, double fromNm, double toNm) {

    /** Points at one value that make a floor (common practice, no source; see the class comment). */
    public static final int MIN_POINTS = 5;
    /** Highest value a floor may have, as a fraction: 1 %T (OD 2). */
    public static final double MAX_FLOOR = 0.01;
    /** Relative difference still counted as the same value. */
    public static final double SAME_VALUE = 1e-5;

    /** The floor of a curve in transmittance fractions, if it has one (wavelengths ascending). */
    public static Optional<InstrumentFloor> find(double[] wavelengthsNm, double[] transmittance) {
        // the smallest positive reading: zero or negative noise beside a clamp must not hide the clamp (it is
        // bounded by OutOfRangeReadings, at the floor once the floor is the limit)
        double min = Double.POSITIVE_INFINITY;
        for (double t : transmittance) {
            min = t > 0 ? Math.min(min, t) : min;
        }
        if (!(min <= MAX_FLOOR)) {
            return Optional.empty(); // no positive reading at all, or a clear minimum: no floor
        }
        double top = min * (1 + SAME_VALUE);
        int count = 0;
        double limit = min;
        double from = Double.NaN;
        double to = Double.NaN;
        for (int i = 0; i < transmittance.length; i++) {
            if (transmittance[i] > 0 && transmittance[i] <= top) {
                count++;
                limit = Math.max(limit, transmittance[i]);
                from = Double.isNaN(from) ? wavelengthsNm[i] : Math.min(from, wavelengthsNm[i]);
                to = Double.isNaN(to) ? wavelengthsNm[i] : Math.max(to, wavelengthsNm[i]);
            }
        }
        return count >= MIN_POINTS ? Optional.of(new InstrumentFloor(limit, count, from, to)) : Optional.empty();
    }

    /** The limit to use: the floor, never lower than the limit the user or the file stated. */
    public double raise(double statedLimit) {
        return Math.max(statedLimit, limit);
    }

    /** The import warning naming the floor and where it lies. */
    public String warning() {
        return String.format(Locale.ROOT,
                "instrument floor: %d points at %s %%T (%s–%s nm) are read as below detection; detection limit set to %s %%T",
                points, percent(limit), number(fromNm), number(toNm), percent(limit));
    }

    private static String percent(double fraction) {
        return String.format(Locale.ROOT, "%.4g", fraction * 100);
    }

    /** Six significant digits: a wavenumber file's wavelengths (10⁷/ν̃) would otherwise print 16. */
    private static String number(double nm) {
        return nm == Math.rint(nm) ? String.valueOf((long) nm)
                : String.format(Locale.ROOT, "%.6g", nm).replaceAll("(\\.\\d*?)0+$", "$1").replaceAll("\\.$", "");
    }
}
