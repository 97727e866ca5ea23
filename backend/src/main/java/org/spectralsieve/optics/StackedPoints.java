package org.spectralsieve.optics;

import java.util.function.Supplier;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.PointReadings;

/**
 * A front part followed by fixed parts, each shared point formed only when it is read: the numbers of
 * {@link FixedParts#behind} point for point — the front read at the shared wavelength as {@code Curve.resampleAt}
 * reads it (the same hit or bracketing pair and fraction, kept per front grid; the same expressions), the same
 * slab elements and chains ({@link StackArithmetic}), the same detection rule. Why: the weighted figures of a
 * requirement behind a layer read the UV and the visible of the stack, not its near infrared, and the stack was
 * most of such a judgement (docs/exact-judgement-speed.md, "One judgement cheaper").
 *
 * <p>A point the built curve would refuse (T not finite or outside [0, {@link Curve#MAX_TRANSMITTANCE}], a limit
 * outside [0, 1)) or a number an element record would refuse builds the curve instead ({@code built}), which
 * refuses it the same way or gives the numbers every later read then takes. No part may carry an uncertainty
 * ({@link FixedParts#pointsBehind} builds the curve then). Not shared between threads.
 */
final class StackedPoints implements PointReadings {

    private final Curve front;
    private final double[] frontReflectances;
    private final FixedParts.OnGrid on;
    private final StackArithmetic arithmetic;
    private final Supplier<Curve> built;
    private final double[] t;
    private final double[] limits;
    private final boolean[] below;
    private final boolean[] done;
    /** −log10 of the front's stored T (floored), each taken once: NaN until taken. */
    private final double[] frontAbsorbance;
    private Curve fallback;

    StackedPoints(Curve front, double[] frontReflectances, FixedParts.OnGrid on, Supplier<Curve> built) {
        this.front = front;
        this.frontReflectances = frontReflectances;
        this.on = on;
        this.arithmetic = StackArithmetic.forParts(on.onShared().length);
        this.built = built;
        int n = on.nm().length;
        t = new double[n];
        limits = new double[n];
        below = new boolean[n];
        done = new boolean[n];
        frontAbsorbance = new double[front.size()];
        java.util.Arrays.fill(frontAbsorbance, Double.NaN);
    }

    @Override
    public int size() {
        return on.nm().length;
    }

    @Override
    public double wavelengthNm(int i) {
        return on.nm()[i];
    }

    @Override
    public double transmittance(int i) {
        return form(i) ? t[i] : fallback.transmittance(i);
    }

    @Override
    public boolean belowDetection(int i) {
        return form(i) ? below[i] : fallback.belowDetection(i);
    }

    @Override
    public double detectionLimit(int i) {
        return form(i) ? limits[i] : fallback.detectionLimit(i);
    }

    /** Forms point i unless formed; false when the built curve answers instead. */
    private boolean form(int i) {
        if (fallback != null) {
            return false;
        }
        if (done[i]) {
            return true;
        }
        int upper = on.frontUpper()[i];
        double frontT;
        double frontLimit;
        boolean frontBelow;
        if (on.frontHit()[i]) {
            frontT = front.transmittance(upper);
            frontLimit = front.detectionLimit(upper);
            frontBelow = front.belowDetection(upper);
        } else {
            int lower = upper - 1;
            double f = on.frontFraction()[i];
            frontT = Math.pow(10.0, -(frontAbsorbance(lower) * (1 - f) + frontAbsorbance(upper) * f));
            frontLimit = front.detectionLimit(lower) * (1 - f) + front.detectionLimit(upper) * f;
            frontBelow = front.belowDetection(lower) || front.belowDetection(upper);
        }
        boolean ok = arithmetic.formPart(0, frontT, frontLimit, frontReflectances[i]);
        boolean pathBelow = frontBelow;
        Curve[] onShared = on.onShared();
        for (int j = 1; ok && j < onShared.length; j++) {
            ok = arithmetic.formPart(j, i, onShared[j], on.reflectances()[j], on.elements()[j]);
            pathBelow |= onShared[j].belowDetection(i);
        }
        ok = ok && arithmetic.chainPoint();
        double pathT = arithmetic.pointT();
        double pathLimit = arithmetic.pointLimit();
        // Curve.of's checks of a point
        if (!ok || !(Double.isFinite(pathT) && pathT >= 0 && pathT <= Curve.MAX_TRANSMITTANCE)
                || !(Double.isFinite(pathLimit) && pathLimit >= 0 && pathLimit < 1)) {
            fallback = built.get();
            return false;
        }
        t[i] = pathT;
        limits[i] = pathLimit;
        below[i] = pathBelow;
        done[i] = true;
        return true;
    }

    /** {@code Curve.absorbance} of the front's stored point k, taken once. */
    private double frontAbsorbance(int k) {
        double a = frontAbsorbance[k];
        if (Double.isNaN(a)) {
            a = -Math.log10(Math.max(front.transmittance(k), Curve.ABSORBANCE_FLOOR_T));
            frontAbsorbance[k] = a;
        }
        return a;
    }
}
