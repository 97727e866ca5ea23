package org.spectralsieve.spectrum;

import java.util.Arrays;
import java.util.OptionalDouble;

/**
 * An immutable measured or modelled transmittance curve T(λ).
 *
 * <p>Each point carries its own detection limit and a below-detection flag: a flagged point is an upper
 * bound, not a value (the instrument could not tell it from its floor). Interpolation works in absorbance
 * because transmittance of an absorbing sample varies exponentially with concentration and thickness, so
 * straight lines in −log10 T stay closer to the truth than straight lines in T across an absorption edge.
 * Nothing is ever extrapolated beyond the measured range.
 *
 * <p>A curve may also carry a measurement uncertainty per point: one standard deviation in decadic
 * absorbance ({@link #absorbanceUncertainty(int)}). Absorbance is the scale on which a measurement's error
 * is closest to symmetric and on which Beer–Lambert rescaling is linear, so the uncertainty scales with the
 * thickness just as the internal absorbance does. NaN at a point means "not known there"; a curve built
 * without uncertainties answers NaN everywhere.
 */
public final class Curve implements PointReadings {

    /** Upper end of accepted transmittance: noise on a clear sample reads slightly above 1, not 1.5. */
    public static final double MAX_TRANSMITTANCE = 1.5;

    /** Floor for T before taking the logarithm, so a reading of exactly 0 still interpolates (A = 12). */
    public static final double ABSORBANCE_FLOOR_T = 1e-12;

    private final double[] wavelengthsNm;
    private final double[] transmittance;
    private final boolean[] belowDetection;
    private final double[] detectionLimits;
    /** One standard deviation in absorbance per point, NaN where unknown; null when none is known at all. */
    private final double[] absorbanceSigma;

    private Curve(double[] wavelengthsNm, double[] transmittance, boolean[] belowDetection,
            double[] detectionLimits, double[] absorbanceSigma) {
        this.wavelengthsNm = wavelengthsNm;
        this.transmittance = transmittance;
        this.belowDetection = belowDetection;
        this.detectionLimits = detectionLimits;
        this.absorbanceSigma = absorbanceSigma;
    }

    /** Copies the arrays; all four must have the same length, at least 2. */
    public static Curve of(double[] wavelengthsNm, double[] transmittance, boolean[] belowDetection,
            double[] detectionLimits) {
        requireNonNull("wavelengthsNm", wavelengthsNm);
        requireNonNull("transmittance", transmittance);
        requireNonNull("belowDetection", belowDetection);
        requireNonNull("detectionLimits", detectionLimits);
        int n = wavelengthsNm.length;
        requireSameLength("transmittance", transmittance.length, n);
        requireSameLength("belowDetection", belowDetection.length, n);
        requireSameLength("detectionLimits", detectionLimits.length, n);
        if (n < 2) {
            throw new CurveException("a curve needs at least 2 points, got " + n);
        }
        for (int i = 0; i < n; i++) {
            validatePoint(i, wavelengthsNm, transmittance[i], detectionLimits[i]);
        }
        return new Curve(wavelengthsNm.clone(), transmittance.clone(), belowDetection.clone(),
                detectionLimits.clone(), null);
    }

    /**
     * This curve with a measurement uncertainty per point: one standard deviation in decadic absorbance,
     * finite and &ge; 0, or NaN where it is not known. An array of only NaN is the same as none.
     */
    public Curve withAbsorbanceUncertainty(double[] sigma) {
        requireNonNull("absorbance uncertainty", sigma);
        requireSameLength("absorbance uncertainty", sigma.length, size());
        boolean any = false;
        for (int i = 0; i < sigma.length; i++) {
            double s = sigma[i];
            if (Double.isNaN(s)) {
                continue;
            }
            if (!Double.isFinite(s) || s < 0) {
                throw new CurveException("absorbance uncertainty at index " + i + " (" + wavelengthsNm[i] + " nm) is "
                        + s + ", must be a finite standard deviation >= 0 or NaN (unknown)");
            }
            any = true;
        }
        return new Curve(wavelengthsNm, transmittance, belowDetection, detectionLimits, any ? sigma.clone() : null);
    }

    /** This curve without any uncertainty. */
    public Curve withoutUncertainty() {
        return absorbanceSigma == null ? this
                : new Curve(wavelengthsNm, transmittance, belowDetection, detectionLimits, null);
    }

    /** One detection limit for all points; a point is below detection when T <= detectionLimit. */
    public static Curve of(double[] wavelengthsNm, double[] transmittance, double detectionLimit) {
        requireNonNull("wavelengthsNm", wavelengthsNm);
        requireNonNull("transmittance", transmittance);
        requireSameLength("transmittance", transmittance.length, wavelengthsNm.length);
        validateDetectionLimit("detectionLimit", detectionLimit);
        boolean[] below = new boolean[transmittance.length];
        double[] limits = new double[transmittance.length];
        for (int i = 0; i < transmittance.length; i++) {
            below[i] = transmittance[i] <= detectionLimit;
            limits[i] = detectionLimit;
        }
        return of(wavelengthsNm, transmittance, below, limits);
    }

    private static void validatePoint(int i, double[] wl, double t, double limit) {
        double nm = wl[i];
        if (!Double.isFinite(nm) || nm <= 0) {
            throw new CurveException("wavelength at index " + i + " (" + nm + " nm) must be finite and > 0");
        }
        if (i > 0 && !(nm > wl[i - 1])) {
            throw new CurveException("wavelength at index " + i + " (" + nm
                    + " nm) is not greater than the previous one (" + wl[i - 1] + " nm)");
        }
        if (!Double.isFinite(t) || t < 0 || t > MAX_TRANSMITTANCE) {
            throw new CurveException("transmittance at index " + i + " (" + t + " at " + nm
                    + " nm) must be a finite fraction in [0, " + MAX_TRANSMITTANCE + "]");
        }
        if (!validDetectionLimit(limit)) {
            // the message is built only on failure: curves are built in the thickness solver's inner loop
            validateDetectionLimit("detection limit at index " + i + " (" + nm + " nm)", limit);
        }
    }

    private static void validateDetectionLimit(String what, double limit) {
        if (!validDetectionLimit(limit)) {
            throw new CurveException(what + " is " + limit + ", must be a fraction in [0, 1)");
        }
    }

    private static boolean validDetectionLimit(double limit) {
        return Double.isFinite(limit) && limit >= 0 && limit < 1;
    }

    private static void requireNonNull(String name, Object array) {
        if (array == null) {
            throw new CurveException(name + " must not be null");
        }
    }

    private static void requireSameLength(String name, int length, int expected) {
        if (length != expected) {
            throw new CurveException(name + " has " + length + " entries but wavelengthsNm has " + expected);
        }
    }

    public int size() {
        return wavelengthsNm.length;
    }

    public double wavelengthNm(int i) {
        return wavelengthsNm[i];
    }

    public double transmittance(int i) {
        return transmittance[i];
    }

    public boolean belowDetection(int i) {
        return belowDetection[i];
    }

    public double detectionLimit(int i) {
        return detectionLimits[i];
    }

    /** True when at least one point has a known uncertainty. */
    public boolean hasUncertainty() {
        return absorbanceSigma != null;
    }

    /** One standard deviation in absorbance at point i; NaN when not known. */
    public double absorbanceUncertainty(int i) {
        return absorbanceSigma == null ? Double.NaN : absorbanceSigma[i];
    }

    /** All points' absorbance uncertainties (NaN where unknown); a fresh array. */
    public double[] absorbanceUncertainties() {
        if (absorbanceSigma == null) {
            double[] unknown = new double[size()];
            Arrays.fill(unknown, Double.NaN);
            return unknown;
        }
        return absorbanceSigma.clone();
    }

    /**
     * The absorbance uncertainty at {@code nm}, interpolated linearly between neighbours (a straight-line
     * blend of two points' errors, the same weights the absorbance itself gets); empty outside the range or
     * where either neighbour's uncertainty is unknown.
     */
    public OptionalDouble absorbanceUncertaintyAt(double nm) {
        if (absorbanceSigma == null || !covers(nm)) {
            return OptionalDouble.empty();
        }
        int hit = Arrays.binarySearch(wavelengthsNm, nm);
        double s;
        if (hit >= 0) {
            s = absorbanceSigma[hit];
        } else {
            int upper = -hit - 1;
            double f = fraction(nm, upper - 1, upper);
            s = absorbanceSigma[upper - 1] * (1 - f) + absorbanceSigma[upper] * f;
        }
        return Double.isNaN(s) ? OptionalDouble.empty() : OptionalDouble.of(s);
    }

    public double[] wavelengthsNm() {
        return wavelengthsNm.clone();
    }

    public double[] transmittances() {
        return transmittance.clone();
    }

    public boolean[] belowDetectionFlags() {
        return belowDetection.clone();
    }

    public double[] detectionLimits() {
        return detectionLimits.clone();
    }

    public double minWavelengthNm() {
        return wavelengthsNm[0];
    }

    public double maxWavelengthNm() {
        return wavelengthsNm[wavelengthsNm.length - 1];
    }

    public boolean covers(double nm) {
        return nm >= minWavelengthNm() && nm <= maxWavelengthNm();
    }

    public boolean hasUniformDetectionLimit() {
        for (double limit : detectionLimits) {
            if (limit != detectionLimits[0]) {
                return false;
            }
        }
        return true;
    }

    public double maxDetectionLimit() {
        return Arrays.stream(detectionLimits).max().orElseThrow();
    }

    /** Interpolated in absorbance between the neighbouring points; empty outside the measured range. */
    public OptionalDouble transmittanceAt(double nm) {
        if (!covers(nm)) {
            return OptionalDouble.empty();
        }
        int hit = Arrays.binarySearch(wavelengthsNm, nm);
        if (hit >= 0) {
            return OptionalDouble.of(transmittance[hit]);
        }
        int upper = -hit - 1;
        return OptionalDouble.of(interpolated(upper - 1, upper, fraction(nm, upper - 1, upper)));
    }

    /** T a fraction f of the way from point lower to point upper, linear in absorbance. */
    private double interpolated(int lower, int upper, double f) {
        double a = absorbance(transmittance[lower]) * (1 - f) + absorbance(transmittance[upper]) * f;
        return Math.pow(10.0, -a);
    }

    /**
     * The number a verdict judges at {@code nm}: where the reading is below detection ({@link #belowDetectionAt}),
     * the bound on the true T, else the value. A point's bound is the larger of its value and its limit; between
     * points the neighbours' bounds (a neighbour above detection giving its value) are interpolated in absorbance
     * as {@link #transmittanceAt} interpolates values, which bounds the interpolated true T because the
     * interpolation rises with each end. The same reading as the exact judgement's ({@code requirement.CurveView}).
     * Empty outside the measured range.
     */
    public OptionalDouble judgedTransmittanceAt(double nm) {
        if (!covers(nm)) {
            return OptionalDouble.empty();
        }
        int hit = Arrays.binarySearch(wavelengthsNm, nm);
        if (hit >= 0) {
            return OptionalDouble.of(judged(hit));
        }
        int upper = -hit - 1;
        int lower = upper - 1;
        if (!belowDetection[lower] && !belowDetection[upper]) {
            return OptionalDouble.of(interpolated(lower, upper, fraction(nm, lower, upper)));
        }
        double f = fraction(nm, lower, upper);
        double a = absorbance(judged(lower)) * (1 - f) + absorbance(judged(upper)) * f;
        return OptionalDouble.of(Math.pow(10.0, -a));
    }

    /** Point i's judged number: its bound (the larger of value and limit) when below detection, else its value. */
    private double judged(int i) {
        return belowDetection[i] ? Math.max(transmittance[i], detectionLimits[i]) : transmittance[i];
    }

    /**
     * True if the point at {@code nm}, or either neighbour of an interpolated value, is below detection:
     * a value interpolated towards an upper bound is itself only a bound. False outside the range.
     */
    public boolean belowDetectionAt(double nm) {
        if (!covers(nm)) {
            return false;
        }
        int hit = Arrays.binarySearch(wavelengthsNm, nm);
        if (hit >= 0) {
            return belowDetection[hit];
        }
        int upper = -hit - 1;
        return belowDetection[upper - 1] || belowDetection[upper];
    }

    /**
     * The curve on {@code grid}: T interpolated in absorbance, flags as {@link #belowDetectionAt}, limits
     * interpolated linearly. Fails, naming the grid end, if the grid reaches outside the measured range.
     */
    public Curve resample(WavelengthGrid grid) {
        double first = grid.at(0);
        double last = grid.at(grid.size() - 1);
        if (first < minWavelengthNm()) {
            throw new CurveException("grid start " + first + " nm lies below the measured range "
                    + rangeText() + "; curves are never extrapolated");
        }
        if (last > maxWavelengthNm()) {
            throw new CurveException("grid end " + last + " nm lies above the measured range "
                    + rangeText() + "; curves are never extrapolated");
        }
        int n = grid.size();
        if (n < 2) {
            throw new CurveException("grid " + grid + " has only " + n + " point; a curve needs 2");
        }
        return readAt(grid.points());
    }

    /**
     * The curve read at the given increasing wavelengths, as {@link #resample(WavelengthGrid)} does on a
     * grid; for points that are not evenly spaced, e.g. the union of two curves' own wavelengths. Fails,
     * naming the wavelength, when one lies outside the measured range.
     */
    public Curve resampleAt(double[] wavelengthsNm) {
        requireNonNull("wavelengthsNm", wavelengthsNm);
        if (wavelengthsNm.length < 2) {
            throw new CurveException("a curve needs at least 2 points, got " + wavelengthsNm.length);
        }
        for (int i = 0; i < wavelengthsNm.length; i++) {
            if (!covers(wavelengthsNm[i])) {
                throw new CurveException("wavelength " + wavelengthsNm[i] + " nm lies outside the measured range "
                        + rangeText() + "; curves are never extrapolated");
            }
            if (i > 0 && !(wavelengthsNm[i] > wavelengthsNm[i - 1])) {
                throw new CurveException("wavelength at index " + i + " (" + wavelengthsNm[i]
                        + " nm) is not greater than the previous one (" + wavelengthsNm[i - 1] + " nm)");
            }
        }
        return PerPointArithmetic.earlier() ? readAt(wavelengthsNm.clone()) : readAlong(wavelengthsNm.clone());
    }

    /**
     * {@link #readAt} for increasing wavelengths inside the range, by one walk along the stored points instead of a
     * binary search per wavelength, each stored absorbance taken once however many wavelengths interpolate from
     * it: the same hit or bracketing pair (the first stored wavelength not below nm), the same expressions, so the
     * same numbers. Why: a stack resamples every candidate onto the union of its grid and the layer's.
     */
    private Curve readAlong(double[] nm) {
        int n = nm.length;
        double[] t = new double[n];
        boolean[] below = new boolean[n];
        double[] limits = new double[n];
        double[] sigma = absorbanceSigma == null ? null : new double[n];
        int upper = 0;
        int lowerTaken = -1;
        double aLower = 0;
        int upperTaken = -1;
        double aUpper = 0;
        for (int i = 0; i < n; i++) {
            while (wavelengthsNm[upper] < nm[i]) {
                upper++;
            }
            if (wavelengthsNm[upper] == nm[i]) {
                t[i] = transmittance[upper];
                below[i] = belowDetection[upper];
                limits[i] = detectionLimits[upper];
                if (sigma != null) {
                    sigma[i] = absorbanceSigma[upper];
                }
                continue;
            }
            int lower = upper - 1;
            if (lowerTaken != lower) {
                aLower = lower == upperTaken ? aUpper : absorbance(transmittance[lower]);
                lowerTaken = lower;
            }
            if (upperTaken != upper) {
                aUpper = absorbance(transmittance[upper]);
                upperTaken = upper;
            }
            double f = fraction(nm[i], lower, upper);
            // interpolated(lower, upper, f) with the two absorbances already taken
            t[i] = Math.pow(10.0, -(aLower * (1 - f) + aUpper * f));
            below[i] = belowDetection[lower] || belowDetection[upper];
            limits[i] = detectionLimits[lower] * (1 - f) + detectionLimits[upper] * f;
            if (sigma != null) {
                sigma[i] = absorbanceSigma[lower] * (1 - f) + absorbanceSigma[upper] * f;
            }
        }
        return new Curve(nm, t, below, limits, sigma);
    }

    private Curve readAt(double[] nm) {
        int n = nm.length;
        double[] t = new double[n];
        boolean[] below = new boolean[n];
        double[] limits = new double[n];
        double[] sigma = absorbanceSigma == null ? null : new double[n];
        for (int i = 0; i < n; i++) {
            // what transmittanceAt, belowDetectionAt and detectionLimitAt give, from one search
            int hit = Arrays.binarySearch(wavelengthsNm, nm[i]);
            if (hit >= 0) {
                t[i] = transmittance[hit];
                below[i] = belowDetection[hit];
                limits[i] = detectionLimits[hit];
                if (sigma != null) {
                    sigma[i] = absorbanceSigma[hit];
                }
            } else {
                int upper = -hit - 1;
                int lower = upper - 1;
                double f = fraction(nm[i], lower, upper);
                t[i] = interpolated(lower, upper, f);
                below[i] = belowDetection[lower] || belowDetection[upper];
                limits[i] = detectionLimits[lower] * (1 - f) + detectionLimits[upper] * f;
                if (sigma != null) {
                    sigma[i] = absorbanceSigma[lower] * (1 - f) + absorbanceSigma[upper] * f;
                }
            }
        }
        return new Curve(nm, t, below, limits, sigma);
    }

    private double fraction(double nm, int lower, int upper) {
        return (nm - wavelengthsNm[lower]) / (wavelengthsNm[upper] - wavelengthsNm[lower]);
    }

    /** −log10 T with T floored at {@link #ABSORBANCE_FLOOR_T}. */
    static double absorbance(double t) {
        return -Math.log10(Math.max(t, ABSORBANCE_FLOOR_T));
    }

    private String rangeText() {
        return minWavelengthNm() + ".." + maxWavelengthNm() + " nm";
    }

    /**
     * The same curve holding its wavelengths and detection limits in the pool's arrays where an equal one is
     * pooled (or pooling its own), so curves measured alike keep one copy of them: for caches of decoded
     * curves ({@link SharedCurveArrays}). Equal to this curve in every value.
     */
    public Curve sharingArraysWith(SharedCurveArrays pool) {
        double[] nm = pool.canonical(wavelengthsNm);
        double[] limits = pool.canonical(detectionLimits);
        return nm == wavelengthsNm && limits == detectionLimits ? this
                : new Curve(nm, transmittance, belowDetection, limits, absorbanceSigma);
    }

    /**
     * The heap this curve holds apart from arrays held in the pool (an estimate for a 64-bit JVM with
     * compressed references: object and array headers, 8 bytes a double, 1 a flag).
     */
    public long heapBytesBeside(SharedCurveArrays pool) {
        int n = wavelengthsNm.length;
        long own = 32 + SharedCurveArrays.arrayBytes(n) + 16L + n; // object, transmittances, flags
        own += pool.holds(wavelengthsNm) ? 0 : SharedCurveArrays.arrayBytes(n);
        own += pool.holds(detectionLimits) ? 0 : SharedCurveArrays.arrayBytes(n);
        return own + (absorbanceSigma == null ? 0 : SharedCurveArrays.arrayBytes(n));
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof Curve other
                && Arrays.equals(wavelengthsNm, other.wavelengthsNm)
                && Arrays.equals(transmittance, other.transmittance)
                && Arrays.equals(belowDetection, other.belowDetection)
                && Arrays.equals(detectionLimits, other.detectionLimits)
                && Arrays.equals(absorbanceSigma, other.absorbanceSigma);
    }

    @Override
    public int hashCode() {
        int h = Arrays.hashCode(wavelengthsNm);
        h = 31 * h + Arrays.hashCode(transmittance);
        h = 31 * h + Arrays.hashCode(belowDetection);
        h = 31 * h + Arrays.hashCode(detectionLimits);
        return 31 * h + Arrays.hashCode(absorbanceSigma);
    }

    @Override
    public String toString() {
        return "Curve[" + size() + " points, " + rangeText() + "]";
    }
}
