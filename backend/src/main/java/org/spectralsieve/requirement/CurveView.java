package org.spectralsieve.requirement;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.PointReadings;

/**
 * Readings of a curve for judging clauses. Values come from {@link Curve#transmittanceAt} (absorbance
 * interpolation), each with the curve's absorbance uncertainty there ({@link Curve#absorbanceUncertaintyAt},
 * NaN where unknown) for {@link ClauseConfidence}; the upper bound of an interpolated reading next to a below-detection point is the same
 * absorbance interpolation applied to the neighbours' upper bounds, which bounds the interpolated true T
 * because the interpolation is increasing in each end value.
 */
final class CurveView {

    /** The built curve, or null for a view on points formed when read ({@link #CurveView(PointReadings)}). */
    private final Curve curve;
    private final PointReadings points;
    private final double[] wavelengths;

    CurveView(Curve curve) {
        this.curve = curve;
        this.points = curve;
        this.wavelengths = curve.wavelengthsNm();
    }

    /**
     * A view on points that may be formed only when read (a rescaled curve's {@code optics.RescaledPoints}): the
     * same readings as on the built curve, by the same arithmetic as {@link Curve#transmittanceAt},
     * {@link Curve#belowDetectionAt} and {@link Curve#absorbanceUncertaintyAt}, reading only the points a band
     * needs. For transmittance clauses; {@link #curve()} is then not available.
     */
    CurveView(PointReadings points) {
        this.curve = points instanceof Curve built ? built : null;
        this.points = points;
        this.wavelengths = new double[points.size()];
        for (int i = 0; i < wavelengths.length; i++) {
            wavelengths[i] = points.wavelengthNm(i);
        }
    }

    Curve curve() {
        if (curve == null) {
            throw new IllegalStateException("a view on points formed when read has no built curve");
        }
        return curve;
    }

    boolean covers(double nm) {
        return points.covers(nm);
    }

    boolean covers(Band band) {
        return points.covers(band.fromNm()) && points.covers(band.toNm());
    }

    /** Whether some of the band lies inside the measured range. */
    boolean overlaps(Band band) {
        return band.fromNm() <= points.maxWavelengthNm() && band.toNm() >= points.minWavelengthNm();
    }

    String rangeText() {
        return Wording.span(points.minWavelengthNm(), points.maxWavelengthNm());
    }

    /** Stored index at exactly {@code nm}, or −1. */
    int indexOf(double nm) {
        int hit = Arrays.binarySearch(wavelengths, nm);
        return hit >= 0 ? hit : -1;
    }

    Reading atIndex(int i) {
        double t = points.transmittance(i);
        boolean bounded = points.belowDetection(i);
        return new Reading(wavelengths[i], t, bounded, bounded ? upper(i) : t, points.absorbanceUncertainty(i));
    }

    /** Reading at a covered wavelength. */
    Reading at(double nm) {
        if (!points.covers(nm)) {
            // what Curve.transmittanceAt(nm).orElseThrow() threw here before
            throw new java.util.NoSuchElementException("No value present");
        }
        int hit = Arrays.binarySearch(wavelengths, nm);
        if (hit >= 0) {
            return atIndex(hit);
        }
        int hi = -hit - 1;
        int lo = hi - 1;
        double f = (nm - wavelengths[lo]) / (wavelengths[hi] - wavelengths[lo]);
        double value = interpolate(points.transmittance(lo), points.transmittance(hi), f);
        boolean bounded = points.belowDetection(lo) || points.belowDetection(hi);
        double sigma = uncertaintyBetween(lo, hi, f);
        if (!bounded) {
            return new Reading(nm, value, false, value, sigma);
        }
        return new Reading(nm, value, true, interpolate(upperOrValue(lo), upperOrValue(hi), f), sigma);
    }

    /** As {@link Curve#absorbanceUncertaintyAt} between two stored points: linear, NaN where either is unknown. */
    private double uncertaintyBetween(int lo, int hi, double f) {
        if (!points.hasUncertainty()) {
            return Double.NaN;
        }
        return points.absorbanceUncertainty(lo) * (1 - f) + points.absorbanceUncertainty(hi) * f;
    }

    /**
     * Readings judged for a band: every stored point strictly inside plus the two ends, in order of
     * wavelength; for a point band the single reading. Only the covered part of the band is read.
     */
    List<Reading> readings(Band band) {
        List<Reading> out = new ArrayList<>();
        double from = Math.max(band.fromNm(), points.minWavelengthNm());
        double to = Math.min(band.toNm(), points.maxWavelengthNm());
        if (from > to) {
            return out;
        }
        out.add(at(from));
        if (from == to) {
            return out;
        }
        // the stored points strictly inside, found by a search (the same points, in order, as a full walk)
        int first = Arrays.binarySearch(wavelengths, from);
        first = first >= 0 ? first + 1 : -first - 1;
        for (int i = first; i < wavelengths.length && wavelengths[i] < to; i++) {
            out.add(atIndex(i));
        }
        out.add(at(to));
        return out;
    }

    private double upper(int i) {
        return Math.max(points.transmittance(i), points.detectionLimit(i));
    }

    private double upperOrValue(int i) {
        return points.belowDetection(i) ? upper(i) : points.transmittance(i);
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
