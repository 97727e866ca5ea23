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
