package org.spectralsieve.store;

import static org.spectralsieve.store.WeightedScreen.SLACK;

import org.spectralsieve.optics.Fresnel;
import org.spectralsieve.optics.RefractiveIndex;
import org.spectralsieve.optics.SlabReading;

/**
 * What the weighted screen can say about a curve's surfaces from its refractive index alone: the largest and smallest
 * Fresnel reflectance over a range (R_max, R_min), a slab element's largest reflectance, the least far factor of an
 * unresolved reading, and one index model's {@link Surfaces} as {@link WeightedScreen.Query} reads them
 * (docs/weighted-screening.md).
 */
final class SurfaceBounds {

    private SurfaceBounds() {
    }

    /**
     * The largest total reflectance ρ of a slab element ({@code OpticalElement.slab} of a {@code SlabReading})
     * whose surfaces reflect at most {@code rMax} (Fresnel): a resolved reading's R + (1 − R)²RK²/(1 − R²K²)
     * rises with K to the lossless 2R/(1 + R); an unresolved one's element is lossless with the effective
     * surface, ρ = 1 − min(T0, 1), and T0 ≥ (1 − R)/(1 + R) − u, so ρ ≤ 2R/(1 + R) + u. 1 (no bound) for
     * rMax ≥ 1.
     */
    static double elementReflectance(double rMax) {
        if (!(rMax < 1)) {
            return 1;
        }
        return Math.min(1, 2 * rMax / (1 + rMax) + SlabReading.READING_UNCERTAINTY);
    }

    /**
     * One index model's surfaces over one curve range, as {@code Query.thinned} and {@code Query.thickened}
     * use them: R_max, R_min and the logarithms formed from them, the same expressions the per-bin arithmetic
     * used to form on every call.
     */
    static final class Surfaces {
        final double largest;
        final double smallest;
        /** ln((1 − R_max)² / (1 + SLACK)): the thinned bound's loss through both surfaces. */
        final double logLoss;
        /** (1 − R_min) / (1 + R_min): the largest T a resolved reading can have. */
        final double ceiling;
        final double leastFarFactor;
        /** ln(1 − R_max²): the thickened bound's factor c, formed once ({@code Query.thickenedFromCode} reads it per split). */
        final double lnContrast;
        private final double lnOneMinusLargest;
        private final double lnOnePlusLargest;
        private final double lnOneMinusSmallest;
        private final double lnOnePlusSmallest;

        Surfaces(double largest, double smallest) {
            this.largest = largest;
            this.smallest = smallest;
            this.logLoss = Math.log(((1 - largest) * (1 - largest)) / (1 + SLACK));
            this.ceiling = (1 - smallest) / (1 + smallest);
            this.leastFarFactor = largest < 1 ? SurfaceBounds.leastFarFactor(largest) : Double.NaN;
            this.lnContrast = Math.log(1 - largest * largest);
            this.lnOneMinusLargest = Math.log(1 - largest);
            this.lnOnePlusLargest = Math.log(1 + largest);
            this.lnOneMinusSmallest = Math.log(1 - smallest);
            this.lnOnePlusSmallest = Math.log(1 + smallest);
        }

        /** ln h(R_max) at k, as {@code lnSurfaceFactor}. */
        double lnLargestFactor(double k) {
            return (1 - 2 * k) * lnOneMinusLargest - lnOnePlusLargest;
        }

        /** ln h(R_min) at k; −∞ without a smallest reflectance. */
        double lnSmallestFactor(double k) {
            return Double.isNaN(smallest) ? Double.NEGATIVE_INFINITY : (1 - 2 * k) * lnOneMinusSmallest - lnOnePlusSmallest;
        }
    }

    /**
     * A lower bound on the far factor ({@link org.spectralsieve.optics.SlabReading#farFactor}) of every
     * reading the data cannot resolve on surfaces of Fresnel reflectance at most {@code rMax}. Such a reading r
     * is at least the lossless ceiling C = (1 − R)/(1 + R) ≥ (1 − R_max)/(1 + R_max) minus the reading's
     * uncertainty u; its hidden internal transmittance is the slab inversion of r − u with the effective
     * surface R' = (1 − r)/(1 + r), which is at least (r − u)(1 + R')/(1 − R') = 1 − u/r (the inversion's
     * K ≥ T(1 + R)/(1 − R)); so its hidden absorption is at most −log10(1 − u/r) decades and its far factor at
     * least {@link org.spectralsieve.optics.SlabReading#RESOLVABLE_DECADES} over that (and at least 1).
     */
    static double leastFarFactor(double rMax) {
        double u = SlabReading.READING_UNCERTAINTY;
        double least = (1 - rMax) / (1 + rMax) - u;
        if (!(least > u)) {
            return 1;
        }
        double hidden = -Math.log10(1 - u / least);
        return Math.max(1, SlabReading.RESOLVABLE_DECADES / hidden);
    }

    /**
     * The largest normal-incidence surface reflectance of the index over the curve's range (every 0.25 nm
     * and both ends, n raised by 0.02 for what lies between the samples); 1 (no bound) when the index cannot
     * give n there, where the exact rescaling fails too and says so (an unverified row, never a miss).
     */
    static double largestReflectance(RefractiveIndex index, double[] curveRange) {
        double largest = 0;
        try {
            for (double nm = curveRange[0]; ; nm = Math.min(curveRange[1], nm + 0.25)) {
                double n = index.at(nm);
                if (!(n >= 1) || !Double.isFinite(n)) {
                    return 1;
                }
                largest = Math.max(largest, Fresnel.reflectanceInAir(n + 0.02));
                if (nm >= curveRange[1]) {
                    return largest;
                }
            }
        } catch (RuntimeException e) {
            return 1;
        }
    }

    /**
     * The smallest normal-incidence surface reflectance of the index over the curve's range (every 0.25 nm
     * and both ends, n lowered by 0.02 for what lies between the samples, not below 1); NaN (no bound) when the
     * index cannot give n there.
     */
    static double smallestReflectance(RefractiveIndex index, double[] curveRange) {
        double smallest = Double.POSITIVE_INFINITY;
        try {
            for (double nm = curveRange[0]; ; nm = Math.min(curveRange[1], nm + 0.25)) {
                double n = index.at(nm);
                if (!(n >= 1) || !Double.isFinite(n)) {
                    return Double.NaN;
                }
                smallest = Math.min(smallest, Fresnel.reflectanceInAir(Math.max(1, n - 0.02)));
                if (nm >= curveRange[1]) {
                    return smallest;
                }
            }
        } catch (RuntimeException e) {
            return Double.NaN;
        }
    }
}
