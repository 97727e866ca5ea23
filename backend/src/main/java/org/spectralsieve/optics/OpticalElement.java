package org.spectralsieve.optics;

/**
 * One part in a light path at one wavelength, seen from outside: its transmittance and its reflectance
 * from the front (light arriving from the source side) and from the back. Fractions; T may exceed 1
 * slightly when it comes from a noisy measurement, R lies in [0, 1).
 */
public record OpticalElement(double transmittance, double reflectanceFront, double reflectanceBack) {

    public OpticalElement {
        if (!(transmittance >= 0 && transmittance <= 1.5)) {
            throw new IllegalArgumentException("element transmittance must be in [0, 1.5], was " + transmittance);
        }
        requireReflectance("reflectanceFront", reflectanceFront);
        requireReflectance("reflectanceBack", reflectanceBack);
    }

    private static void requireReflectance(String name, double r) {
        if (!(r >= 0 && r < 1)) {
            throw new IllegalArgumentException(name + " must be a fraction in [0, 1), was " + r);
        }
    }

    /** A symmetric slab in air (see {@link Slab}). */
    public static OpticalElement slab(double internal, double r) {
        double rTotal = Slab.reflectance(internal, r);
        return new OpticalElement(Slab.transmittance(internal, r), rTotal, rTotal);
    }

    /**
     * This element and {@code next} behind it, separated by an air gap, with incoherent multiple
     * reflections between them (the two-element case of Smith eq. 10.5):
     * T = T1·T2/(1 − R1b·R2f), Rf = R1f + T1²·R2f/(1 − R1b·R2f), Rb = R2b + T2²·R1b/(1 − R1b·R2f).
     * Reciprocity is assumed: each element transmits equally in both directions.
     */
    public OpticalElement followedBy(OpticalElement next) {
        double denominator = 1 - reflectanceBack * next.reflectanceFront;
        double t = transmittance * next.transmittance / denominator;
        double rf = reflectanceFront + transmittance * transmittance * next.reflectanceFront / denominator;
        double rb = next.reflectanceBack + next.transmittance * next.transmittance * reflectanceBack / denominator;
        return new OpticalElement(t, Math.min(rf, Math.nextDown(1.0)), Math.min(rb, Math.nextDown(1.0)));
    }
}
