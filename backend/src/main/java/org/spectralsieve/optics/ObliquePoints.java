package org.spectralsieve.optics;

import java.util.Arrays;
import org.spectralsieve.spectrum.PointReadings;

/**
 * A light path's points under light at an angle ({@link ObliquePath}), each formed when read: a clause at 365 nm reads
 * two points of a curve of hundreds, and each point costs the angles times the polarisations times the parts. The same
 * numbers as {@link ObliquePath#transmittance} at the points read. Not shared between threads.
 */
final class ObliquePoints implements PointReadings {

    private final ObliquePath path;
    private final PointReadings[] parts;
    private final PointReadings[] boundedAlso;
    private final double[] t;
    private final double[] limits;

    ObliquePoints(ObliquePath path, PointReadings[] parts, PointReadings[] boundedAlso) {
        this.path = path;
        this.parts = parts.clone();
        this.boundedAlso = boundedAlso == null ? null : boundedAlso.clone();
        for (PointReadings part : parts) {
            if (part.size() != path.size()) {
                throw new IllegalArgumentException("a part has " + part.size() + " points, the path " + path.size());
            }
        }
        t = new double[path.size()];
        limits = new double[path.size()];
        Arrays.fill(t, Double.NaN);
        Arrays.fill(limits, Double.NaN);
    }

    @Override
    public int size() {
        return t.length;
    }

    @Override
    public double wavelengthNm(int i) {
        return path.wavelengthNm(i);
    }

    @Override
    public double transmittance(int i) {
        if (Double.isNaN(t[i])) {
            t[i] = path.transmittanceAt(i, parts);
        }
        return t[i];
    }

    @Override
    public boolean belowDetection(int i) {
        return ObliquePath.belowAt(i, parts, boundedAlso);
    }

    @Override
    public double detectionLimit(int i) {
        if (Double.isNaN(limits[i])) {
            limits[i] = path.detectionLimitAt(i, parts);
        }
        return limits[i];
    }

    @Override
    public double absorbanceUncertainty(int i) {
        return path.absorbanceUncertaintyAt(i, parts, belowDetection(i));
    }

    @Override
    public boolean hasUncertainty() {
        for (PointReadings part : parts) {
            if (part.hasUncertainty()) {
                return true;
            }
        }
        return false;
    }
}
