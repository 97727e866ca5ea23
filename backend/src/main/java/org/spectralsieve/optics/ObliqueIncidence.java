package org.spectralsieve.optics;

/**
 * Light meeting a plane surface from air at an angle of incidence θ (radians): Fresnel reflectance for s and p
 * polarisation, Snell's law for the refracted angle, and a slab's transmittance at that angle.
 *
 * <ul>
 *   <li>Snell: sin θt = sin θ / n. Fresnel (Hecht, Optics, §4.6; Born &amp; Wolf §1.5.2):
 *       r_s = (cos θ − n cos θt) / (cos θ + n cos θt), r_p = (n cos θ − cos θt) / (n cos θ + cos θt), R = r².
 *       Unpolarised light: the mean of the two. At θ = 0 both are ((1 − n)/(1 + n))², the number
 *       {@link Fresnel#reflectanceInAir} gives, bit for bit.</li>
 *   <li>A slab: the path inside is d / cos θt, so the internal transmittance is K^(1/cos θt) for the K the slab has at
 *       normal incidence; incoherent multiple reflections per polarisation ({@link Slab#transmittance}, the same R on
 *       both faces since both see the same angle), then the mean. At θ = 0 this is {@link Slab#transmittance}(K, R)
 *       bit for bit ({@code Math.pow(K, 1.0)} is K, and (T + T)/2 is T).</li>
 * </ul>
 * Plain Java; angles from 0 up to (not including) 90°.
 */
public final class ObliqueIncidence {

    private ObliqueIncidence() {
    }

    /** The two reflectances and the cosine of the refracted angle at one surface, air to index n. */
    public record Surface(double rs, double rp, double cosRefracted) {

        /** Unpolarised light: the mean of s and p. */
        public double unpolarised() {
            return (rs + rp) / 2;
        }
    }

    public static Surface surface(double n, double thetaRad) {
        if (!Double.isFinite(n) || n < 1) {
            throw new IllegalArgumentException("index must be a finite number of at least 1 (a solid in air), was " + n);
        }
        requireAngle(thetaRad);
        double cosI = Math.cos(thetaRad);
        double sinT = Math.sin(thetaRad) / n;
        double cosT = Math.sqrt(1 - sinT * sinT);
        double s = (cosI - n * cosT) / (cosI + n * cosT);
        double p = (n * cosI - cosT) / (n * cosI + cosT);
        return new Surface(s * s, p * p, cosT);
    }

    /**
     * T of a slab in air at angle θ, unpolarised light.
     *
     * @param normalInternal the slab's internal transmittance at normal incidence (K, 0 to 1)
     */
    public static double slabTransmittance(double normalInternal, double n, double thetaRad) {
        Slab.requireFraction("internal", normalInternal);
        Surface surface = surface(n, thetaRad);
        double internal = Math.pow(normalInternal, 1 / surface.cosRefracted());
        double ts = Slab.transmittance(internal, surface.rs());
        double tp = Slab.transmittance(internal, surface.rp());
        return (ts + tp) / 2;
    }

    /** Brewster's angle from air, tan θB = n: where r_p vanishes. */
    public static double brewsterRad(double n) {
        return Math.atan(n);
    }

    static void requireAngle(double thetaRad) {
        if (!(thetaRad >= 0 && thetaRad < Math.PI / 2)) {
            throw new IllegalArgumentException("angle of incidence must lie from 0 up to 90°, was "
                    + Math.toDegrees(thetaRad) + "°");
        }
    }
}
