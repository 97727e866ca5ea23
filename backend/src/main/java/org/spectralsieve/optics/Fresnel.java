package org.spectralsieve.optics;

/** Fresnel reflectance at normal incidence, R = ((n2 − n1)/(n2 + n1))² (Smith, Modern Optical Engineering, eq. 10.1). */
public final class Fresnel {

    private Fresnel() {
    }

    public static double normalReflectance(double n1, double n2) {
        requireIndex("n1", n1);
        requireIndex("n2", n2);
        double r = (n2 - n1) / (n2 + n1);
        return r * r;
    }

    public static double reflectanceInAir(double n) {
        return normalReflectance(1.0, n);
    }

    private static void requireIndex(String name, double n) {
        if (!Double.isFinite(n) || n <= 0) {
            throw new IllegalArgumentException(name + " must be a finite index > 0, was " + n);
        }
    }
}
