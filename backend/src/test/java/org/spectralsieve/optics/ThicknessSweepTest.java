package org.spectralsieve.optics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.CurveException;

/**
 * The precomputed sweep must give the very numbers of the straightforward route — rescale the measured
 * curve ({@link ThicknessRescaler}), then build the light path ({@link LightPath}) — for any curve,
 * thickness and fixed parts. Those routes are checked against the handbook's slab and Beer–Lambert values in
 * {@link ThicknessRescalerTest} and {@link LightPathTest}; here equality is exact (Curve.equals compares
 * every double bit for bit), on random cases from a fixed seed.
 */
class ThicknessSweepTest {

    @Test
    void rescaledCurveIsExactlyTheRescalersCurve() {
        Random random = new Random(20261202L);
        for (int trial = 0; trial < 300; trial++) {
            Curve measured = randomCurve(random, 300 + 200 * random.nextDouble());
            RefractiveIndex index = randomIndex(random);
            double d0 = 0.2 + 8 * random.nextDouble();
            ThicknessSweep sweep = new ThicknessSweep(measured, d0, index, List.of());
            for (double d : thicknesses(random, d0)) {
                Curve expected = ThicknessRescaler.rescale(measured, d0, d, index);
                assertThat(sweep.rescaled(d)).as("trial %d at %s mm", trial, d).isEqualTo(expected);
                assertThat(sweep.path(d)).isEqualTo(expected);
            }
        }
    }

    @Test
    void stackedPathIsExactlyTheLightPathOfTheRescaledCurve() {
        Random random = new Random(20261203L);
        int stacksWithThreeParts = 0;
        int stacked = 0;
        for (int trial = 0; trial < 300; trial++) {
            Curve measured = randomCurve(random, 300 + 200 * random.nextDouble());
            RefractiveIndex index = randomIndex(random);
            double d0 = 0.2 + 8 * random.nextDouble();
            // a layer starting inside the candidate's range, with its own (different) wavelengths
            Layer glass = Layer.fixed(randomCurve(random, measured.minWavelengthNm() + 20 * random.nextDouble()),
                    randomIndex(random));
            List<Layer> fixed = random.nextBoolean() ? List.of(glass)
                    : List.of(glass, Layer.bulk(randomCurve(random, measured.minWavelengthNm() + 10 * random.nextDouble()),
                            1 + random.nextDouble(), 0.5 + 3 * random.nextDouble(), randomIndex(random)));
            stacksWithThreeParts += fixed.size() == 2 ? 1 : 0;
            ThicknessSweep sweep = new ThicknessSweep(measured, d0, index, fixed);
            for (double d : thicknesses(random, d0)) {
                Curve rescaled = ThicknessRescaler.rescale(measured, d0, d, index);
                Layer candidate = Layer.fixed(rescaled, index);
                Curve expected;
                try {
                    expected = LightPath.of(prepend(candidate, fixed)).transmittance();
                } catch (CurveException noOverlap) {
                    // short random parts may miss each other: the sweep must refuse the same way
                    assertThatThrownBy(() -> sweep.path(d)).isInstanceOf(CurveException.class)
                            .hasMessage(noOverlap.getMessage());
                    continue;
                }
                assertThat(sweep.path(d)).as("trial %d at %s mm", trial, d).isEqualTo(expected);
                stacked++;
            }
        }
        assertThat(stacksWithThreeParts).isGreaterThan(100);
        assertThat(stacked).isGreaterThan(800);
    }

    @Test
    void partsThatDoNotOverlapFailAsTheLightPathDoes() {
        Random random = new Random(7);
        Curve measured = randomCurve(random, 300);
        Layer far = Layer.fixed(randomCurve(random, measured.maxWavelengthNm() + 50), new ConstantIndex(1.5));
        ThicknessSweep sweep = new ThicknessSweep(measured, 2, new ConstantIndex(1.5), List.of(far));
        assertThatThrownBy(() -> LightPath.of(Layer.fixed(measured, new ConstantIndex(1.5)), far).transmittance())
                .isInstanceOf(CurveException.class);
        assertThatThrownBy(() -> sweep.path(3)).isInstanceOf(CurveException.class)
                .hasMessageContaining("do not overlap");
    }

    private static List<Layer> prepend(Layer first, List<Layer> rest) {
        return java.util.stream.Stream.concat(java.util.stream.Stream.of(first), rest.stream()).toList();
    }

    static double[] thicknesses(Random random, double d0) {
        return new double[] {d0, 0.1 + 12 * random.nextDouble(), 0.1 + 12 * random.nextDouble(), d0 * (1 + 1e-9)};
    }

    static RefractiveIndex randomIndex(Random random) {
        return random.nextInt(3) == 0 ? SellmeierIndex.FUSED_SILICA : new ConstantIndex(1.4 + 0.3 * random.nextDouble());
    }

    /**
     * Uneven wavelengths; T from fully dark (0) through tiny values to readings above the lossless ceiling
     * (noise); points below a varying detection limit flagged.
     */
    static Curve randomCurve(Random random, double fromNm) {
        int n = 2 + random.nextInt(80);
        double[] nm = new double[n];
        double[] t = new double[n];
        boolean[] below = new boolean[n];
        double[] limits = new double[n];
        double at = fromNm;
        for (int i = 0; i < n; i++) {
            nm[i] = at;
            at += 0.5 + 10 * random.nextDouble();
            int kind = random.nextInt(6);
            t[i] = kind == 0 ? 0 : kind == 1 ? 1e-6 * random.nextDouble() : kind == 2 ? 0.9 + 0.15 * random.nextDouble()
                    : random.nextDouble();
            limits[i] = random.nextBoolean() ? 1e-3 : 1e-4 * random.nextInt(50);
            below[i] = t[i] <= limits[i];
        }
        return Curve.of(nm, t, below, limits);
    }
}
