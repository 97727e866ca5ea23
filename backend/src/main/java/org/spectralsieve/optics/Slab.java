package org.spectralsieve.optics;

/**
 * One plane-parallel slab in air, both surfaces reflecting R, with incoherent multiple reflections
 * (Smith, Modern Optical Engineering, eq. 10.5 with T1 = T2 = 1 − R, R1 = R2 = R):
 * T = (1 − R)²K / (1 − R²K²), K the internal transmittance.
 *
 * <p>Incoherent because the slabs handled here (sheets, windows, films of tens of µm and more) are far
 * thicker than the coherence length of lamps and LEDs, so interference fringes average out.
 */
public final class Slab {

    private Slab() {
    }

    public static double transmittance(double internal, double r) {
        requireFraction("internal", internal);
        requireReflectance(r);
        double oneMinusR = 1 - r;
        return oneMinusR * oneMinusR * internal / (1 - r * r * internal * internal);
    }

    /** R_total = R + (1 − R)²R·K² / (1 − R²K²); for K = 1 this is (n − 1)²/(n² + 1) (Smith eq. 10.7). */
    public static double reflectance(double internal, double r) {
        requireFraction("internal", internal);
        requireReflectance(r);
        double oneMinusR = 1 - r;
        double k2 = internal * internal;
        return r + oneMinusR * oneMinusR * r * k2 / (1 - r * r * k2);
    }

    /**
     * K from a measured T: the positive root of R²T·K² + (1 − R)²K − T = 0 (REFERENCE §7),
     * K = [−(1−R)² + √((1−R)⁴ + 4R²T²)] / (2R²T), computed in the rationalised form
     * 2T / [(1−R)² + √((1−R)⁴ + 4R²T²)], which is the same number without cancellation for small R and
     * stays defined at R = 0.
     *
     * <p>The pure inversion: T at or above the lossless ceiling (1 − R)/(1 + R) gives K = 1, T <= 0 gives
     * K = 0. Measured readings go through {@link SlabReading}, which keeps a reading at the ceiling exact
     * with an effective surface reflectance instead of clipping it.
     */
    public static double internalFromTransmittance(double t, double r) {
        if (Double.isNaN(t) || Double.isInfinite(t)) {
            throw new IllegalArgumentException("t must be finite, was " + t);
        }
        requireReflectance(r);
        if (t <= 0) {
            return 0;
        }
        if (t >= losslessTransmittance(r)) {
            return 1;
        }
        double oneMinusR2 = (1 - r) * (1 - r);
        double k = 2 * t / (oneMinusR2 + Math.sqrt(oneMinusR2 * oneMinusR2 + 4 * r * r * t * t));
        return Math.min(1, k);
    }

    /** T of a non-absorbing slab, (1 − R)/(1 + R) = 2n/(n² + 1) (Smith eq. 10.6). */
    public static double losslessTransmittance(double r) {
        requireReflectance(r);
        return (1 - r) / (1 + r);
    }

    static void requireFraction(String name, double value) {
        if (!(value >= 0 && value <= 1)) {
            throw new IllegalArgumentException(name + " transmittance must be a fraction in [0, 1], was " + value);
        }
    }

    static void requireReflectance(double r) {
        if (!(r >= 0 && r < 1)) {
            throw new IllegalArgumentException("surface reflectance r must be a fraction in [0, 1), was " + r);
        }
    }
}
