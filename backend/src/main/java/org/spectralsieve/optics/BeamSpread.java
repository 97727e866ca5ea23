package org.spectralsieve.optics;

import java.util.function.DoubleUnaryOperator;

/**
 * How a source's light reaches a flat window: its radiant intensity I(θ) over the angle from the window's normal, and
 * the effective transmittance it sees, T_eff = ∫ T(θ) I(θ) sin θ dθ / ∫ I(θ) sin θ dθ (the power a point source sends
 * into the ring between θ and θ + dθ is I(θ)·2π sin θ dθ; every ray of the hemisphere facing the window meets it).
 *
 * <ul>
 *   <li>{@link #collimated}: one angle.</li>
 *   <li>{@link #cone}: uniform intensity out to a half-angle α.</li>
 *   <li>{@link #lambertian}: I ∝ cos θ over the hemisphere.</li>
 *   <li>{@link #led}: I ∝ cos^m θ, m = ln ½ / ln cos θ½ from the half-intensity angle θ½ (the angle where I falls to
 *       half; a "120° beam" has θ½ = 60°, which gives m = 1, the Lambertian).</li>
 * </ul>
 *
 * <p>Integration: with u = cos θ the integral is ∫ T(u) I(u) du over [cos θmax, 1], and I(u) = u^m or 1 is smooth
 * there; so Gauss–Legendre on u with {@value #NODES} nodes. The error is estimated by doing it again with twice the
 * nodes ({@link Result#errorBound}): Gauss–Legendre with N nodes is exact for polynomials of degree 2N − 1, and the
 * difference of the two rules bounds the error of the finer one for integrands as smooth as these (T(θ) varies only
 * through the Fresnel terms and K^(1/cos θt), both analytic for θ below 90°).
 */
public final class BeamSpread {

    /** Gauss–Legendre nodes of the reported integral; the estimate uses twice as many. */
    public static final int NODES = 24;

    /** The share of an LED's power the integral may leave out at wide angles (see {@link #led}). */
    static final double NEGLIGIBLE = 1e-12;

    private final double fromCos;
    private final double exponent;
    private final double onlyAngleRad;
    private final String description;

    private BeamSpread(double fromCos, double exponent, double onlyAngleRad, String description) {
        this.fromCos = fromCos;
        this.exponent = exponent;
        this.onlyAngleRad = onlyAngleRad;
        this.description = description;
    }

    public static BeamSpread collimated(double thetaRad) {
        ObliqueIncidence.requireAngle(thetaRad);
        return new BeamSpread(Double.NaN, Double.NaN, thetaRad, "collimated at " + degrees(thetaRad) + "°");
    }

    public static BeamSpread cone(double halfAngleRad) {
        if (!(halfAngleRad > 0 && halfAngleRad <= Math.PI / 2)) {
            throw new IllegalArgumentException("a cone's half-angle lies above 0 and at most 90°, was "
                    + degrees(halfAngleRad) + "°");
        }
        return new BeamSpread(Math.cos(halfAngleRad), 0, Double.NaN, "uniform cone of ±" + degrees(halfAngleRad) + "°");
    }

    public static BeamSpread lambertian() {
        return new BeamSpread(0, 1, Double.NaN, "Lambertian (cos θ)");
    }

    /** @param halfIntensityRad where the intensity falls to half, above 0 and below 90° */
    public static BeamSpread led(double halfIntensityRad) {
        if (!(halfIntensityRad > 0 && halfIntensityRad < Math.PI / 2)) {
            throw new IllegalArgumentException("a half-intensity angle lies above 0 and below 90°, was "
                    + degrees(halfIntensityRad) + "°");
        }
        double m = Math.log(0.5) / Math.log(Math.cos(halfIntensityRad));
        // a narrow LED's cos^m θ is all but zero away from the axis: integrate only where u^m exceeds
        // NEGLIGIBLE, so the nodes sit where the light is; the power left out is below NEGLIGIBLE of the total
        // (∫₀^u₀ u^m du / ∫₀¹ u^m du = u₀^(m+1) < u₀^m = NEGLIGIBLE)
        double from = Math.pow(NEGLIGIBLE, 1 / m);
        return new BeamSpread(from, m, Double.NaN, "LED with half intensity at ±" + degrees(halfIntensityRad)
                + "° (cos^" + round(m) + " θ)");
    }

    /** The exponent m of cos^m θ (0 for a uniform cone; NaN for a collimated beam). */
    public double exponent() {
        return exponent;
    }

    public String describe() {
        return description;
    }

    /** The effective transmittance, and the estimate of its integration error. */
    public record Result(double transmittance, double errorBound, int angles) {
    }

    /** @param transmittanceAt T at an angle of incidence in radians, from 0 up to 90° */
    public Result effective(DoubleUnaryOperator transmittanceAt) {
        if (!Double.isNaN(onlyAngleRad)) {
            return new Result(transmittanceAt.applyAsDouble(onlyAngleRad), 0, 1);
        }
        double coarse = integrate(transmittanceAt, NODES);
        double fine = integrate(transmittanceAt, 2 * NODES);
        return new Result(fine, Math.abs(fine - coarse), 2 * NODES);
    }

    private double integrate(DoubleUnaryOperator transmittanceAt, int nodes) {
        double[][] rule = nodes(nodes);
        double weighted = 0;
        for (int i = 0; i < rule[0].length; i++) {
            weighted += rule[1][i] * transmittanceAt.applyAsDouble(rule[0][i]);
        }
        return weighted;
    }

    /**
     * The angles (radians) and weights, summing to 1, with which T_eff = Σ w T(θ): Gauss–Legendre with
     * {@code count} nodes in u = cos θ, each node's weight times the intensity there, normalised; a collimated
     * beam's one angle with weight 1.
     */
    public double[][] nodes(int count) {
        if (!Double.isNaN(onlyAngleRad)) {
            return new double[][] {{onlyAngleRad}, {1}};
        }
        double[][] rule = GaussLegendre.rule(count);
        double half = (1 - fromCos) / 2;
        double mid = (1 + fromCos) / 2;
        double[] angles = new double[count];
        double[] weights = new double[count];
        double total = 0;
        for (int i = 0; i < count; i++) {
            double u = mid + half * rule[0][i];
            double w = rule[1][i] * (exponent == 0 ? 1 : Math.pow(u, exponent));
            angles[i] = Math.acos(u);
            weights[i] = w;
            total += w;
        }
        for (int i = 0; i < count; i++) {
            weights[i] /= total;
        }
        return new double[][] {angles, weights};
    }

    private static String degrees(double rad) {
        return round(Math.toDegrees(rad));
    }

    private static String round(double x) {
        return java.math.BigDecimal.valueOf(x).round(new java.math.MathContext(4)).stripTrailingZeros().toPlainString();
    }
}
