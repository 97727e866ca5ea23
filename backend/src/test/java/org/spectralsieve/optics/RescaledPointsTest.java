package org.spectralsieve.optics;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.PointReadings;

/**
 * The rescaled points computed when read ({@link ThicknessSweep#rescaledPoints}) are the points of the
 * rescaled curve ({@link ThicknessRescaler#rescale}, checked against handbook slab and Beer–Lambert values in
 * {@link ThicknessRescalerTest}) bit for bit, read in any order, on random cases from a fixed seed.
 */
class RescaledPointsTest {

    @Test
    void pointsReadOneByOneAreThePointsOfTheRescaledCurve() {
        Random random = new Random(20261205L);
        for (int trial = 0; trial < 300; trial++) {
            Curve measured = ThicknessSweepTest.randomCurve(random, 300 + 200 * random.nextDouble());
            RefractiveIndex index = ThicknessSweepTest.randomIndex(random);
            double d0 = 0.2 + 8 * random.nextDouble();
            ThicknessSweep sweep = new ThicknessSweep(measured, d0, index, List.of());
            for (double d : ThicknessSweepTest.thicknesses(random, d0)) {
                Curve expected = ThicknessRescaler.rescale(measured, d0, d, index);
                PointReadings points = sweep.rescaledPoints(d);
                assertThat(points.size()).isEqualTo(expected.size());
                // from the far end first, then twice each: the order of reading changes nothing
                for (int i = expected.size() - 1; i >= 0; i--) {
                    assertPoint(points, expected, i, trial, d);
                }
                for (int i = 0; i < expected.size(); i++) {
                    assertPoint(points, expected, i, trial, d);
                }
                assertThat(points.minWavelengthNm()).isEqualTo(expected.minWavelengthNm());
                assertThat(points.maxWavelengthNm()).isEqualTo(expected.maxWavelengthNm());
            }
        }
    }

    @Test
    void pointsFormedWhenReadWithTheirLimitsAndUncertaintiesAreThePointsOfTheRescaledCurve() {
        // the judgement's default (JudgementPath): readings formed when read, limits only when asked
        Random random = new Random(20261206L);
        for (int trial = 0; trial < 300; trial++) {
            Curve measured = ThicknessSweepTest.randomCurve(random, 300 + 200 * random.nextDouble());
            if (random.nextBoolean()) {
                double[] sigma = new double[measured.size()];
                for (int i = 0; i < sigma.length; i++) {
                    sigma[i] = random.nextInt(8) == 0 ? Double.NaN : 0.05 * random.nextDouble();
                }
                measured = measured.withAbsorbanceUncertainty(sigma);
            }
            RefractiveIndex index = ThicknessSweepTest.randomIndex(random);
            double d0 = 0.2 + 8 * random.nextDouble();
            ThicknessSweep sweep = new ThicknessSweep(measured, d0, index, List.of(), true);
            for (double d : ThicknessSweepTest.thicknesses(random, d0)) {
                Curve expected = ThicknessRescaler.rescale(measured, d0, d, index);
                PointReadings points = sweep.rescaledPoints(d);
                // a random order, a limit sometimes read before its T: the order of reading changes nothing
                for (int k = 0; k < 2 * expected.size(); k++) {
                    int i = random.nextInt(expected.size());
                    String at = "trial " + trial + " at " + d + " mm, point " + i;
                    if (random.nextBoolean()) {
                        assertThat(Double.doubleToLongBits(points.detectionLimit(i))).as(at)
                                .isEqualTo(Double.doubleToLongBits(expected.detectionLimit(i)));
                    }
                    assertThat(Double.doubleToLongBits(points.absorbanceUncertainty(i))).as(at)
                            .isEqualTo(Double.doubleToLongBits(expected.absorbanceUncertainty(i)));
                    assertPoint(points, expected, i, trial, d);
                }
            }
        }
    }

    private static void assertPoint(PointReadings points, Curve expected, int i, int trial, double d) {
        String at = "trial " + trial + " at " + d + " mm, point " + i;
        assertThat(points.wavelengthNm(i)).as(at).isEqualTo(expected.wavelengthNm(i));
        assertThat(Double.doubleToLongBits(points.transmittance(i))).as(at)
                .isEqualTo(Double.doubleToLongBits(expected.transmittance(i)));
        assertThat(points.belowDetection(i)).as(at).isEqualTo(expected.belowDetection(i));
        assertThat(Double.doubleToLongBits(points.detectionLimit(i))).as(at)
                .isEqualTo(Double.doubleToLongBits(expected.detectionLimit(i)));
    }
}
