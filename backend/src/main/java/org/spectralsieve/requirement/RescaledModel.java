package org.spectralsieve.requirement;

import java.util.Arrays;
import org.spectralsieve.optics.BeerLambert;
import org.spectralsieve.optics.Fresnel;
import org.spectralsieve.optics.RefractiveIndex;
import org.spectralsieve.optics.Slab;
import org.spectralsieve.spectrum.Curve;

/**
 * A bulk sample's readings as functions of thickness d, with the same arithmetic as
 * {@link org.spectralsieve.optics.ThicknessRescaler}: per stored point K0 = slab inversion of T (Smith eq.
 * 10.5 inverted), K(d) = K0^(d/d0) (Beer–Lambert), T(d) = slab T of K(d). Interpolated wavelengths are
 * absorbance-interpolated between rescaled neighbours, exactly as a rescaled {@link Curve} would be read.
 * Every T(d) is non-increasing in d, and so is every bound.
 */
final class RescaledModel {

    private final Curve curve;
    private final double[] wavelengths;
    private final double d0;
    private final double[] reflectance;
    private final double[] kValue;
    private final double[] kUpper;

    RescaledModel(Curve curve, double d0, RefractiveIndex index) {
        this.curve = curve;
        this.wavelengths = curve.wavelengthsNm();
        this.d0 = d0;
        int n = curve.size();
        reflectance = new double[n];
        kValue = new double[n];
        kUpper = new double[n];
        for (int i = 0; i < n; i++) {
            double r = Fresnel.reflectanceInAir(index.at(wavelengths[i]));
            double t = curve.transmittance(i);
            double upper = curve.belowDetection(i) ? Math.max(t, curve.detectionLimit(i)) : t;
            reflectance[i] = r;
            kValue[i] = Slab.internalFromTransmittance(t, r);
            kUpper[i] = Slab.internalFromTransmittance(upper, r);
        }
    }

    Curve curve() {
        return curve;
    }

    double measuredMm() {
        return d0;
    }

    int indexOf(double nm) {
        int hit = Arrays.binarySearch(wavelengths, nm);
        return hit >= 0 ? hit : -1;
    }

    double reflectance(int i) {
        return reflectance[i];
    }

    boolean bounded(int i) {
        return curve.belowDetection(i);
    }

    /** K0 of the number a verdict is based on at stored point i (of the bound when bounded). */
    double judgedInternal(int i) {
        return curve.belowDetection(i) ? kUpper[i] : kValue[i];
    }

    /** Whether the reading at a covered wavelength is a bound (same rule as {@link Curve#belowDetectionAt}). */
    boolean boundedAt(double nm) {
        return curve.belowDetectionAt(nm);
    }

    /** The judged number (bound where bounded) at a covered wavelength, at thickness d. */
    double judgedAt(double nm, double d) {
        int hit = Arrays.binarySearch(wavelengths, nm);
        if (hit >= 0) {
            return judgedAtIndex(hit, d);
        }
        int hi = -hit - 1;
        int lo = hi - 1;
        double f = (nm - wavelengths[lo]) / (wavelengths[hi] - wavelengths[lo]);
        if (!curve.belowDetectionAt(nm)) {
            return CurveView.interpolate(t(kValue[lo], lo, d), t(kValue[hi], hi, d), f);
        }
        return CurveView.interpolate(judgedAtIndex(lo, d), judgedAtIndex(hi, d), f);
    }

    double judgedAtIndex(int i, double d) {
        return t(judgedInternal(i), i, d);
    }

    private double t(double k0, int i, double d) {
        return Slab.transmittance(BeerLambert.scaleInternal(k0, d0, d), reflectance[i]);
    }
}
