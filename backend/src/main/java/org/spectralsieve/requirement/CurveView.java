package org.spectralsieve.requirement;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.spectralsieve.spectrum.Curve;

/**
 * Readings of a curve for judging clauses. Values come from {@link Curve#transmittanceAt} (absorbance
 * interpolation), each with the curve's absorbance uncertainty there ({@link Curve#absorbanceUncertaintyAt},
 * NaN where unknown) for {@link ClauseConfidence}; the upper bound of an interpolated reading next to a below-detection point is the same
 * absorbance interpolation applied to the neighbours' upper bounds, which bounds the interpolated true T
 * because the interpolation is increasing in each end value.
 */
final class CurveView {

    private final Curve curve;
    private final double[] wavelengths;

    CurveView(Curve curve) {
        this.curve = curve;
        this.wavelengths = curve.wavelengthsNm();
    }

    Curve curve() {
        return curve;
    }

    boolean covers(double nm) {
        return curve.covers(nm);
    }

    boolean covers(Band band) {
        return curve.covers(band.fromNm()) && curve.covers(band.toNm());
    }

    /** Whether some of the band lies inside the measured range. */
    boolean overlaps(Band band) {
        return band.fromNm() <= curve.maxWavelengthNm() && band.toNm() >= curve.minWavelengthNm();
    }

    String rangeText() {
        return Wording.span(curve.minWavelengthNm(), curve.maxWavelengthNm());
    }

    /** Stored index at exactly {@code nm}, or −1. */
    int indexOf(double nm) {
        int hit = Arrays.binarySearch(wavelengths, nm);
        return hit >= 0 ? hit : -1;
    }

    Reading atIndex(int i) {
        double t = curve.transmittance(i);
        boolean bounded = curve.belowDetection(i);
        return new Reading(wavelengths[i], t, bounded, bounded ? upper(i) : t, curve.absorbanceUncertainty(i));
    }

    /** Reading at a covered wavelength. */
    Reading at(double nm) {
        int hit = Arrays.binarySearch(wavelengths, nm);
        if (hit >= 0) {
            return atIndex(hit);
        }
        int hi = -hit - 1;
        int lo = hi - 1;
        double value = curve.transmittanceAt(nm).orElseThrow();
        boolean bounded = curve.belowDetectionAt(nm);
        double sigma = curve.absorbanceUncertaintyAt(nm).orElse(Double.NaN);
        if (!bounded) {
            return new Reading(nm, value, false, value, sigma);
        }
        double f = (nm - wavelengths[lo]) / (wavelengths[hi] - wavelengths[lo]);
        return new Reading(nm, value, true, interpolate(upperOrValue(lo), upperOrValue(hi), f), sigma);
    }

    /**
     * Readings judged for a band: every stored point strictly inside plus the two ends, in order of
     * wavelength; for a point band the single reading. Only the covered part of the band is read.
     */
    List<Reading> readings(Band band) {
        List<Reading> out = new ArrayList<>();
        double from = Math.max(band.fromNm(), curve.minWavelengthNm());
        double to = Math.min(band.toNm(), curve.maxWavelengthNm());
        if (from > to) {
            return out;
        }
        out.add(at(from));
        if (from == to) {
            return out;
        }
        for (int i = 0; i < wavelengths.length; i++) {
            if (wavelengths[i] > from && wavelengths[i] < to) {
                out.add(atIndex(i));
            }
        }
        out.add(at(to));
        return out;
    }

    private double upper(int i) {
        return Math.max(curve.transmittance(i), curve.detectionLimit(i));
    }

    private double upperOrValue(int i) {
        return curve.belowDetection(i) ? upper(i) : curve.transmittance(i);
    }

    /** The same arithmetic as {@link Curve#transmittanceAt}, so bounds and values agree where both apply. */
    static double interpolate(double tLo, double tHi, double f) {
        double a = absorbance(tLo) * (1 - f) + absorbance(tHi) * f;
        return Math.pow(10.0, -a);
    }

    static double absorbance(double t) {
        return -Math.log10(Math.max(t, Curve.ABSORBANCE_FLOOR_T));
    }

    /** Trapezoid mean over readings ordered by wavelength, of the judged numbers (bounds where bounded). */
    static double trapezoidMean(List<Reading> readings) {
        double area = 0;
        for (int i = 1; i < readings.size(); i++) {
            Reading a = readings.get(i - 1);
            Reading b = readings.get(i);
            area += 0.5 * (a.judged() + b.judged()) * (b.nm() - a.nm());
        }
        double width = readings.get(readings.size() - 1).nm() - readings.get(0).nm();
        return area / width;
    }
}
