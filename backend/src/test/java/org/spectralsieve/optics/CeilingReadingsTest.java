package org.spectralsieve.optics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.Random;
import org.junit.jupiter.api.Test;
import org.spectralsieve.spectrum.Curve;

/**
 * Readings at, near or above the lossless-slab ceiling 2n/(n² + 1) (Modern Optical Engineering, eq.
 * 10.6), and the rescaling rule every thickness model uses ({@link SlabReading}): continuous in thickness,
 * equal to the measurement at the measured thickness, never rising, never a value where it extrapolates an
 * absorption the data cannot resolve, and stacks between T1·T2 and T1·T2/(1 − R1·R2). Random cases from fixed
 * seeds (plain loops instead of a property-test library); the checks are written out independently here.
 */
class CeilingReadingsTest {

    private static final double U = SlabReading.READING_UNCERTAINTY;

    @Test
    void losslessCeilingIsTwoNOverNSquaredPlusOne() {
        // Modern Optical Engineering eq. 10.6: T = 2n/(n² + 1); n = 1.65 (polyester film) gives 3.3/3.7225 = 0.88650
        double r = Fresnel.reflectanceInAir(1.65);
        assertThat(Slab.losslessTransmittance(r)).isCloseTo(2 * 1.65 / (1.65 * 1.65 + 1), within(1e-15));
        assertThat(Slab.losslessTransmittance(r)).isCloseTo(0.8865, within(0.00005));
    }

    @Test
    void aReadingAboveTheCeilingIsKeptExactlyThroughAnEffectiveSurface() {
        // measured PET film passes 92.1 % at 550 nm (SOURCES.md §8) although n = 1.65 allows only 88.65 %
        SlabReading reading = SlabReading.of(0.921, Fresnel.reflectanceInAir(1.65));

        assertThat(reading.internal()).isEqualTo(1.0);
        // the effective surface reflectance is the one whose lossless ceiling is the reading: (1 − T)/(1 + T)
        assertThat(reading.reflectance()).isCloseTo((1 - 0.921) / (1 + 0.921), within(1e-15));
        assertThat(reading.transmittance(0.125, 0.125)).isCloseTo(0.921, within(1e-15));
        assertThat(reading.transmittance(0.125, 0.1250001)).isCloseTo(0.921, within(1e-15));
    }

    @Test
    void aResolvedReadingUsesTheFresnelSurfacesOfTheStatedIndex() {
        // REFERENCE §7 trade example: acrylic (n = 1.49) at 3 mm, T = 0.5 → about 0.270 at 6 mm
        SlabReading reading = SlabReading.of(0.5, Fresnel.reflectanceInAir(1.49));

        assertThat(reading.resolved()).isTrue();
        assertThat(reading.reflectance()).isEqualTo(Fresnel.reflectanceInAir(1.49));
        assertThat(reading.transmittance(3, 6)).isCloseTo(0.270, within(0.0005));
        assertThat(reading.boundAt(3, 1e6)).isFalse();
    }

    @Test
    void rescaledReadingsAreContinuousEqualAtTheMeasuredThicknessAndNeverRise() {
        Random random = new Random(20261203L);
        int unresolved = 0;
        for (int trial = 0; trial < 20_000; trial++) {
            double n = 1.3 + 0.6 * random.nextDouble();
            double r = Fresnel.reflectanceInAir(n);
            double ceiling = 2 * n / (n * n + 1);
            // half the readings within 2 % of the ceiling, some of them above it (noise, coatings)
            double t = random.nextBoolean() ? ceiling * (0.98 + 0.05 * random.nextDouble()) : random.nextDouble();
            t = Math.min(t, 1);
            double d0 = 0.01 + 5 * random.nextDouble();
            SlabReading reading = SlabReading.of(t, r);
            unresolved += reading.resolved() ? 0 : 1;
            String context = "T0=" + t + " n=" + n + " d0=" + d0;

            assertThat(reading.transmittance(d0, d0)).as(context).isCloseTo(t, within(1e-12));
            double previous = Double.POSITIVE_INFINITY;
            boolean wasBound = false;
            for (double factor : new double[] {0.01, 0.5, 1 - 1e-9, 1, 1 + 1e-9, 2, 4, 8, 100, 1e4}) {
                double d = d0 * factor;
                double now = reading.transmittance(d0, d);
                assertThat(now).as(context + " at " + d).isLessThanOrEqualTo(previous);
                // continuity: a relative step of 1e-9 in d moves T by no more than about that much
                assertThat(Math.abs(reading.transmittance(d0, d * (1 + 1e-9)) - now)).as(context).isLessThan(1e-7);
                boolean bound = reading.boundAt(d0, d);
                assertThat(!wasBound || bound).as(context + ": once a bound, a bound for every thicker part").isTrue();
                wasBound = bound;
                previous = now;
            }
        }
        assertThat(unresolved).isGreaterThan(5000);
    }

    @Test
    void aClearReadingIsAValueOnlyWhileItsHiddenAbsorbanceStaysWithinAHundredthOfADecade() {
        Random random = new Random(20261206L);
        for (int trial = 0; trial < 5000; trial++) {
            double n = 1.3 + 0.6 * random.nextDouble();
            double ceiling = 2 * n / (n * n + 1);
            double t = Math.min(1, ceiling - U + (U + 0.03) * random.nextDouble());
            double d0 = 0.05 + 3 * random.nextDouble();
            SlabReading reading = SlabReading.of(t, Fresnel.reflectanceInAir(n));
            // independent: K of the darkest reading the uncertainty allows, T0 − u, behind surfaces whose
            // lossless T is T0 (root of R²T·K² + (1 − R)²K − T = 0, REFERENCE §7)
            double rEff = (1 - t) / (1 + t);
            double darkest = t - U;
            double a = rEff * rEff * darkest;
            double b = (1 - rEff) * (1 - rEff);
            double kLow = a == 0 ? darkest / b : (-b + Math.sqrt(b * b + 4 * a * darkest)) / (2 * a);
            double hiddenDecades = -Math.log10(kLow);
            String context = "T0=" + t + " n=" + n;

            assertThat(reading.resolved()).as(context).isFalse();
            assertThat(reading.farMm(d0)).as(context).isCloseTo(d0 * Math.max(1, 0.01 / hiddenDecades),
                    within(1e-6 * d0 * reading.farFactor())); // the plain quadratic loses digits to cancellation
            // inside the far thickness the hidden internal absorbance is at most 0.01 decades, and the darkest
            // plausible T within 0.01·(1 + R²)/(1 − R²) decades of the stated one (d log T / d log K of eq. 10.5)
            double inside = reading.farMm(d0) * (1 - 1e-9);
            double stated = reading.transmittance(d0, inside);
            double darkestThere = Slab.transmittance(Math.pow(kLow, inside / d0), rEff);
            assertThat(-Math.log10(Math.pow(kLow, inside / d0))).as(context).isLessThanOrEqualTo(0.01 + 1e-9);
            assertThat(Math.log10(stated / darkestThere)).as(context)
                    .isLessThanOrEqualTo(0.01 * (1 + rEff * rEff) / (1 - rEff * rEff) + 1e-9);
            assertThat(reading.boundAt(d0, inside)).isFalse();
            assertThat(reading.boundAt(d0, reading.farMm(d0) * (1 + 1e-9))).isTrue();
        }
    }

    @Test
    void aRescaledCurveFlagsFarClearReadingsAsBoundsAtTheirOwnValue() {
        // a clear sheet (n = 1.5, ceiling 0.9231) read at 0.95 (above), 0.92 (within u below) and 0.5
        Curve measured = Curve.of(new double[] {400, 500, 600}, new double[] {0.95, 0.92, 0.5}, 0);
        ConstantIndex n15 = new ConstantIndex(1.5);

        Curve near = ThicknessRescaler.rescale(measured, 2, 4, n15);
        Curve far = ThicknessRescaler.rescale(measured, 2, 200, n15);

        assertThat(near.belowDetectionFlags()).containsExactly(false, false, false);
        assertThat(near.transmittance(0)).isCloseTo(0.95, within(1e-12));
        assertThat(near.transmittance(1)).isCloseTo(0.92, within(1e-12));
        assertThat(far.belowDetectionFlags()).containsExactly(true, true, false);
        assertThat(far.detectionLimit(0)).isCloseTo(0.95, within(1e-12));
        assertThat(far.detectionLimit(1)).isCloseTo(0.92, within(1e-12));
    }

    @Test
    void aStackOfMeasuredPartsLiesBetweenTheProductAndTheProductOverOneMinusR1R2() {
        // Modern Optical Engineering eq. 10.5 for two elements: T = T1·T2/(1 − R1·R2); R_i ≤ 1 − T_i (energy), so
        // T1·T2 ≤ T ≤ T1·T2/(1 − (1 − T1)(1 − T2)), at every wavelength, for any parts and thicknesses
        Random random = new Random(20261207L);
        double[] nm = {380, 420, 460, 500, 540, 580, 620, 660, 700};
        for (int trial = 0; trial < 500; trial++) {
            ConstantIndex n1 = new ConstantIndex(1.3 + 0.6 * random.nextDouble());
            ConstantIndex n2 = new ConstantIndex(1.3 + 0.6 * random.nextDouble());
            Curve bulk = Curve.of(nm, readings(random, nm.length, n1.n()), 0);
            Curve fixed = Curve.of(nm, readings(random, nm.length, n2.n()), 0);
            double d0 = 0.05 + 3 * random.nextDouble();
            double d = d0 * Math.pow(10, -1 + 3 * random.nextDouble());

            Curve alone = ThicknessRescaler.rescale(bulk, d0, d, n1);
            Curve stack = LightPath.of(Layer.bulk(bulk, d0, d, n1), Layer.fixed(fixed, n2)).transmittance();
            Curve swept = new ThicknessSweep(bulk, d0, n1, java.util.List.of(Layer.fixed(fixed, n2))).path(d);

            for (int i = 0; i < nm.length; i++) {
                double t1 = alone.transmittance(i);
                double t2 = Math.min(1, fixed.transmittance(i));
                double t = stack.transmittanceAt(nm[i]).orElseThrow();
                String context = "trial " + trial + " at " + nm[i] + " nm: T1=" + t1 + " T2=" + t2;
                assertThat(t).as(context).isGreaterThanOrEqualTo(t1 * t2 * (1 - 1e-12));
                assertThat(t).as(context).isLessThanOrEqualTo(t1 * t2 / (1 - (1 - t1) * (1 - t2)) * (1 + 1e-12));
                assertThat(swept.transmittanceAt(nm[i]).orElseThrow()).as(context).isEqualTo(t);
            }
        }
    }

    /** Readings spread from dark to slightly above the ceiling of index n. */
    private static double[] readings(Random random, int count, double n) {
        double ceiling = 2 * n / (n * n + 1);
        double[] t = new double[count];
        for (int i = 0; i < count; i++) {
            t[i] = random.nextInt(3) == 0 ? random.nextDouble() * ceiling : ceiling * (0.97 + 0.06 * random.nextDouble());
            t[i] = Math.min(t[i], 1.02);
        }
        return t;
    }
}
