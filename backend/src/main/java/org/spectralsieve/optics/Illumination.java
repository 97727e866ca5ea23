package org.spectralsieve.optics;

/**
 * How the light meets the parts: the angles it arrives at, measured from the surface normal. Every figure the
 * project gives assumes one of these; {@link #NORMAL} (square to the surface) unless a requirement or a request
 * says otherwise, and every answer names the one it used ({@link #describe}).
 *
 * <ul>
 *   <li>{@link Kind#NORMAL}: square to the surface (today's figures, unchanged).</li>
 *   <li>{@link Kind#INCIDENCE}: a collimated beam at {@code angleDeg} from the normal.</li>
 *   <li>{@link Kind#CONE}: uniform intensity out to the half-angle {@code angleDeg} ("over a 60° beam" is ±30°).</li>
 *   <li>{@link Kind#LAMBERTIAN}: intensity ∝ cos θ over the whole hemisphere; {@code angleDeg} is 90.</li>
 *   <li>{@link Kind#LED}: intensity ∝ cos^m θ with half intensity at {@code angleDeg} ("a 120° beam angle" is
 *       60°); see {@link BeamSpread#led}.</li>
 * </ul>
 * Plain Java, immutable; the angle is stored in degrees as the user gave it (rounded nowhere), so two equal
 * requests compare equal.
 */
public record Illumination(Kind kind, double angleDeg) {

    public enum Kind { NORMAL, INCIDENCE, CONE, LAMBERTIAN, LED }

    /** Largest angle a user may ask for a collimated beam: 89°; at 90° no light enters a window. */
    public static final double MAX_INCIDENCE_DEG = 89;

    public static final Illumination NORMAL = new Illumination(Kind.NORMAL, 0);

    public Illumination {
        java.util.Objects.requireNonNull(kind, "kind");
        switch (kind) {
            case NORMAL -> require(angleDeg == 0, "normal incidence has angle 0°", angleDeg);
            case INCIDENCE -> require(angleDeg >= 0 && angleDeg <= MAX_INCIDENCE_DEG,
                    "an angle of incidence lies from 0° to " + (int) MAX_INCIDENCE_DEG + "°", angleDeg);
            case CONE -> require(angleDeg > 0 && angleDeg <= 90, "a beam's half-angle lies above 0° and at most 90°",
                    angleDeg);
            case LAMBERTIAN -> require(angleDeg == 90, "a Lambertian source spreads over the hemisphere (90°)", angleDeg);
            case LED -> require(angleDeg > 0 && angleDeg <= MAX_INCIDENCE_DEG,
                    "an LED's half-intensity angle lies above 0° and at most " + (int) MAX_INCIDENCE_DEG + "°"
                            + " (a beam angle up to 178°)", angleDeg);
        }
    }

    public static Illumination atIncidence(double deg) {
        return deg == 0 ? NORMAL : new Illumination(Kind.INCIDENCE, deg);
    }

    /** A uniform cone of full angle {@code fullDeg}: half-angle fullDeg / 2. */
    public static Illumination beam(double fullDeg) {
        return new Illumination(Kind.CONE, fullDeg / 2);
    }

    public static Illumination lambertian() {
        return new Illumination(Kind.LAMBERTIAN, 90);
    }

    /** An LED of beam angle {@code fullDeg} (full width at half intensity): half-intensity angle fullDeg / 2. */
    public static Illumination led(double beamAngleDeg) {
        return new Illumination(Kind.LED, beamAngleDeg / 2);
    }

    public boolean normal() {
        return kind == Kind.NORMAL;
    }

    /** The largest angle of incidence the light arrives at, in radians (at most just under 90°). */
    public double maxAngleRad() {
        return switch (kind) {
            case NORMAL -> 0;
            case INCIDENCE -> Math.toRadians(angleDeg);
            case CONE, LAMBERTIAN, LED -> Math.PI / 2;
        };
    }

    /** The angular distribution to integrate over ({@link BeamSpread}). */
    public BeamSpread spread() {
        return switch (kind) {
            case NORMAL -> BeamSpread.collimated(0);
            case INCIDENCE -> BeamSpread.collimated(Math.toRadians(angleDeg));
            case CONE -> BeamSpread.cone(Math.toRadians(angleDeg));
            case LAMBERTIAN -> BeamSpread.lambertian();
            case LED -> BeamSpread.led(Math.toRadians(angleDeg));
        };
    }

    /** "normal incidence", "collimated at 30° incidence", "LED, 120° beam angle (half intensity at ±60°, cos^1 θ)". */
    public String describe() {
        return switch (kind) {
            case NORMAL -> "normal incidence (light square to the surface)";
            case INCIDENCE -> "collimated light at " + number(angleDeg) + "° incidence";
            case CONE -> "a uniform " + number(2 * angleDeg) + "° beam (±" + number(angleDeg) + "°)";
            case LAMBERTIAN -> "a Lambertian source (intensity ∝ cos θ over ±90°)";
            case LED -> "an LED with " + number(2 * angleDeg) + "° beam angle (half intensity at ±" + number(angleDeg)
                    + "°, intensity ∝ cos^" + number(spread().exponent()) + " θ)";
        };
    }

    /** How the figure was integrated over angle, or empty for one angle. */
    public String integration() {
        return switch (kind) {
            case NORMAL, INCIDENCE -> "";
            default -> "averaged over angle by Gauss–Legendre quadrature in cos θ with " + 2 * BeamSpread.NODES
                    + " angles (error estimated against " + BeamSpread.NODES + ")";
        };
    }

    /** The words a requirement uses for it ("at 30° incidence"), empty for normal incidence. */
    public String words() {
        return switch (kind) {
            case NORMAL -> "";
            case INCIDENCE -> "at " + number(angleDeg) + "° incidence";
            case CONE -> "over a " + number(2 * angleDeg) + "° beam";
            case LAMBERTIAN -> "under a Lambertian source";
            case LED -> "under an LED with " + number(2 * angleDeg) + "° beam angle";
        };
    }

    private static void require(boolean ok, String rule, double angleDeg) {
        if (!ok || !Double.isFinite(angleDeg)) {
            throw new IllegalArgumentException(rule + ", was " + number(angleDeg) + "°");
        }
    }

    static String number(double x) {
        if (!Double.isFinite(x)) {
            return String.valueOf(x);
        }
        return java.math.BigDecimal.valueOf(x).round(new java.math.MathContext(4)).stripTrailingZeros().toPlainString();
    }
}
