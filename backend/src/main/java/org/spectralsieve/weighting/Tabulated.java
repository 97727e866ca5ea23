package org.spectralsieve.weighting;

import java.util.Arrays;

/**
 * A spectrum given as points (wavelength, value), read by straight-line interpolation between points and
 * 0 outside them. Straight lines in the value, not in its logarithm, because imported spectra (a lamp
 * capture, a photoinitiator's absorbance) may contain zeros.
 */
final class Tabulated {

    private final double[] nm;
    private final double[] values;

    Tabulated(String what, double[] nm, double[] values) {
        if (nm.length != values.length) {
            throw new IllegalArgumentException(what + ": " + nm.length + " wavelengths but " + values.length + " values");
        }
        if (nm.length < 2) {
            throw new IllegalArgumentException(what + ": needs at least 2 points, got " + nm.length);
        }
        for (int i = 0; i < nm.length; i++) {
            if (!(nm[i] > 0 && Double.isFinite(nm[i]))) {
                throw new IllegalArgumentException(what + ": point " + (i + 1) + " wavelength " + nm[i]
                        + " nm must be finite and > 0");
            }
            if (i > 0 && !(nm[i] > nm[i - 1])) {
                throw new IllegalArgumentException(what + ": point " + (i + 1) + " wavelength " + nm[i]
                        + " nm is not greater than the previous " + nm[i - 1] + " nm");
            }
            if (!(values[i] >= 0 && Double.isFinite(values[i]))) {
                throw new IllegalArgumentException(what + ": point " + (i + 1) + " at " + nm[i] + " nm has value "
                        + values[i] + ", must be finite and >= 0");
            }
        }
        if (Arrays.stream(values).allMatch(v -> v == 0)) {
            throw new IllegalArgumentException(what + ": every value is 0");
        }
        this.nm = nm.clone();
        this.values = values.clone();
    }

    double minNm() {
        return nm[0];
    }

    double maxNm() {
        return nm[nm.length - 1];
    }

    /** The integration step the data call for: the finest point spacing, between 0.1 and 1 nm. */
    double stepNm() {
        double finest = Double.POSITIVE_INFINITY;
        for (int i = 1; i < nm.length; i++) {
            finest = Math.min(finest, nm[i] - nm[i - 1]);
        }
        return Math.max(0.1, Math.min(1.0, finest));
    }

    double valueAt(double x) {
        if (!(x >= nm[0] && x <= nm[nm.length - 1])) {
            return 0;
        }
        int hit = Arrays.binarySearch(nm, x);
        if (hit >= 0) {
            return values[hit];
        }
        int hi = -hit - 1;
        int lo = hi - 1;
        double f = (x - nm[lo]) / (nm[hi] - nm[lo]);
        return values[lo] * (1 - f) + values[hi] * f;
    }
}
