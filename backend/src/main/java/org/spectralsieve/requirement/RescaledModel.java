package org.spectralsieve.requirement;

import java.util.Arrays;
import org.spectralsieve.optics.Fresnel;
import org.spectralsieve.optics.RefractiveIndex;
import org.spectralsieve.optics.SlabReading;
import org.spectralsieve.optics.ThicknessSweep;
import org.spectralsieve.spectrum.Curve;

/**
 * A bulk sample's readings as functions of thickness d, with the same rule as
 * {@link org.spectralsieve.optics.ThicknessRescaler}: every stored point is a {@link SlabReading} (Fresnel
 * surfaces and Beer–Lambert for a resolved reading; an effective surface and no absorption for a reading
 * at the lossless ceiling), T(d) its slab T. Interpolated wavelengths are absorbance-interpolated between
 * rescaled neighbours, exactly as a rescaled {@link Curve} would be read. Every T(d) is non-increasing in
 * d, and so is every bound. A reading is a bound where the measured point is below detection, or where d
 * is beyond the point's far thickness (the rescaled curve flags it there too); an interpolated reading is
 * a bound where either neighbour is.
 */
final class RescaledModel {

    private final Curve curve;
    private final double[] wavelengths;
    private final double d0;
    private final SlabReading[] value;
    private final SlabReading[] judged;
    /** Where readings not yet formed come from; null when every reading was formed at construction. */
    private final ThicknessSweep sweep;

    /** Every reading formed now, from the index (the earlier way, kept as the reference). */
    RescaledModel(Curve curve, double d0, RefractiveIndex index) {
        this.curve = curve;
        this.wavelengths = curve.wavelengthsNm();
        this.d0 = d0;
        this.sweep = null;
        int n = curve.size();
        value = new SlabReading[n];
        judged = new SlabReading[n];
        for (int i = 0; i < n; i++) {
            double r = Fresnel.reflectanceInAir(index.at(wavelengths[i]));
            double t = curve.transmittance(i);
            value[i] = SlabReading.of(t, r);
            judged[i] = curve.belowDetection(i) ? SlabReading.of(Math.max(t, curve.detectionLimit(i)), r) : value[i];
        }
    }

    /**
     * The same model on a sweep's readings of the same curve, each formed when first read: the solver reads a
     * few points of a band, and the readings it shares with the rescaled curves are formed once.
     */
    RescaledModel(ThicknessSweep sweep, double d0) {
        this.curve = sweep.measured();
        this.wavelengths = curve.wavelengthsNm();
        this.d0 = d0;
        this.sweep = sweep;
        value = new SlabReading[curve.size()];
        judged = new SlabReading[curve.size()];
    }

    private SlabReading value(int i) {
        SlabReading v = value[i];
        if (v == null) {
            v = sweep.reading(i);
            value[i] = v;
        }
        return v;
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

    /** The reading a verdict is based on at stored point i (of the bound when the point is below detection). */
    SlabReading judged(int i) {
        SlabReading j = judged[i];
        if (j == null) {
            // as the eager constructor forms it: the bound's reading below detection, else the value's
            j = curve.belowDetection(i)
                    ? SlabReading.of(Math.max(curve.transmittance(i), curve.detectionLimit(i)), sweep.fresnelReflectance(i))
                    : value(i);
            judged[i] = j;
        }
        return j;
    }

    /** Whether the measured reading at a covered wavelength is a bound (same rule as {@link Curve#belowDetectionAt}). */
    boolean measuredBoundAt(double nm) {
        return curve.belowDetectionAt(nm);
    }

    /**
     * The thickness beyond which the reading at a covered wavelength is only an upper bound because it
     * extrapolates an absorption the data cannot resolve (+∞ when it never is); for an interpolated reading
     * the nearer of its neighbours' far thicknesses.
     */
    double farMmAt(double nm) {
        int hit = Arrays.binarySearch(wavelengths, nm);
        if (hit >= 0) {
            return value(hit).farMm(d0);
        }
        int hi = -hit - 1;
        return Math.min(value(hi - 1).farMm(d0), value(hi).farMm(d0));
    }

    /**
     * The least far thickness of the stored points from {@code fromNm} to {@code toNm}: a cutoff is read
     * walking up from the short-wavelength side ({@link org.spectralsieve.spectrum.Cutoffs}), so a clear point
     * inside its window that turns into a bound leaves the crossing undetermined; points beyond the window
     * keep their values (a far bound is flagged at its own value), so they do not move the edge.
     */
    double farMmBetween(double fromNm, double toNm) {
        double far = Double.POSITIVE_INFINITY;
        for (int i = 0; i < wavelengths.length; i++) {
            if (wavelengths[i] >= fromNm && wavelengths[i] <= toNm) {
                far = Math.min(far, value(i).farMm(d0));
            }
        }
        return Math.min(far, Math.min(farMmAt(fromNm), farMmAt(toNm)));
    }

    /** Whether the reading at a covered wavelength, rescaled to d, is a bound. */
    boolean boundedAt(double nm, double d) {
        return curve.belowDetectionAt(nm) || d > farMmAt(nm);
    }

    /**
     * The judged number (bound where bounded) at a covered wavelength, at thickness d. A reading that is a
     * bound only for being far has its rescaled value as its bound, so the number does not depend on it.
     */
    double judgedAt(double nm, double d) {
        int hit = Arrays.binarySearch(wavelengths, nm);
        if (hit >= 0) {
            return judgedAtIndex(hit, d);
        }
        int hi = -hit - 1;
        int lo = hi - 1;
        double f = (nm - wavelengths[lo]) / (wavelengths[hi] - wavelengths[lo]);
        if (!curve.belowDetectionAt(nm)) {
            return CurveView.interpolate(value(lo).transmittance(d0, d), value(hi).transmittance(d0, d), f);
        }
        return CurveView.interpolate(judgedAtIndex(lo, d), judgedAtIndex(hi, d), f);
    }

    double judgedAtIndex(int i, double d) {
        return judged(i).transmittance(d0, d);
    }
}
