package org.spectralsieve.weighting;

import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.PerPointArithmetic;
import org.spectralsieve.spectrum.PointReadings;

/**
 * A weighted sum Σ wₖ·T(λₖ) over increasing wavelengths inside a curve's range, T read as
 * {@link Curve#transmittanceAt} and the flags as {@link Curve#belowDetectionAt} read them — the same
 * arithmetic, term for term and in the same order, so the sum is the same number — but by one walk along
 * the curve's points (one binary search for the first wavelength) instead of two binary searches per
 * wavelength, and with below-detection points read at either end ({@link BelowDetectionAs}) instead of
 * building a bounded curve. Why it pays: a thickness solve reads a weighted figure dozens of times per
 * sample, on a curve of hundreds of points (docs/exact-judgement-speed.md).
 */
final class SortedReading {

    private static final double FLOOR_T = Curve.ABSORBANCE_FLOOR_T;

    private SortedReading() {
    }

    /** Σ w[k]·T(nm[k]) for k below count, and whether any read point is below detection. */
    record Sum(double passed, boolean bound) {
    }

    /**
     * @param nm    non-decreasing wavelengths, all inside the curve's range
     * @param w     the weight of each
     * @param count how many of nm and w to read
     */
    static Sum weightedSum(PointReadings curve, double[] nm, double[] w, int count, BelowDetectionAs as) {
        if (count == 0) {
            return new Sum(0, false);
        }
        int size = curve.size();
        boolean zeroFirst = !PerPointArithmetic.earlier();
        int j = binarySearch(curve, nm[0]);
        j = j >= 0 ? j : -j - 1;
        double passed = 0;
        boolean bound = false;
        // absorbances of the interval last read, kept because neighbouring wavelengths share its points
        int lowerIndex = -1;
        double aLower = 0;
        int upperIndex = -1;
        double aUpper = 0;
        for (int k = 0; k < count; k++) {
            double x = nm[k];
            while (j < size && curve.wavelengthNm(j) < x) {
                j++;
            }
            double t;
            if (curve.wavelengthNm(j) == x) {
                t = zeroFirst ? pointTZeroFirst(curve, j, as) : pointT(curve, j, as);
                bound |= curve.belowDetection(j);
            } else {
                int lower = j - 1;
                if (lower != lowerIndex) {
                    aLower = lower == upperIndex ? aUpper
                            : absorbance(zeroFirst ? pointTZeroFirst(curve, lower, as) : pointT(curve, lower, as));
                    lowerIndex = lower;
                }
                if (j != upperIndex) {
                    aUpper = absorbance(zeroFirst ? pointTZeroFirst(curve, j, as) : pointT(curve, j, as));
                    upperIndex = j;
                }
                double lowerNm = curve.wavelengthNm(lower);
                double f = (x - lowerNm) / (curve.wavelengthNm(j) - lowerNm);
                t = Math.pow(10.0, -(aLower * (1 - f) + aUpper * f));
                bound |= curve.belowDetection(lower) || curve.belowDetection(j);
            }
            passed += w[k] * t;
        }
        return new Sum(passed, bound);
    }

    /**
     * {@link #pointT} with a point below detection read as 0 before its T is asked for: the same number, and a
     * curve that forms its points when read ({@code optics.RescaledPoints}) never forms a T nobody uses.
     */
    static double pointTZeroFirst(PointReadings curve, int i, BelowDetectionAs as) {
        if (as == BelowDetectionAs.ZERO && curve.belowDetection(i)) {
            return 0;
        }
        return pointT(curve, i, as);
    }

    /** The stored T of point i, or its bound when it is below detection. */
    static double pointT(PointReadings curve, int i, BelowDetectionAs as) {
        double t = curve.transmittance(i);
        if (as == BelowDetectionAs.STORED || !curve.belowDetection(i)) {
            return t;
        }
        return as == BelowDetectionAs.ZERO ? 0 : Math.max(t, curve.detectionLimit(i));
    }

    /** −log10 T with T floored, as the curve's interpolation takes it. */
    private static double absorbance(double t) {
        return -Math.log10(Math.max(t, FLOOR_T));
    }

    /** {@link Arrays#binarySearch(double[], double)} over the curve's wavelengths, without copying them. */
    private static int binarySearch(PointReadings curve, double key) {
        int low = 0;
        int high = curve.size() - 1;
        while (low <= high) {
            int mid = (low + high) >>> 1;
            double v = curve.wavelengthNm(mid);
            if (v < key) {
                low = mid + 1;
            } else if (v > key) {
                high = mid - 1;
            } else {
                return mid;
            }
        }
        return -(low + 1);
    }
}
