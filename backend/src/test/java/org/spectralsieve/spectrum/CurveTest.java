package org.spectralsieve.spectrum;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.Random;
import org.junit.jupiter.api.Test;

class CurveTest {

    private static final double[] NM = {300, 350, 400, 450};

    @Test
    void wavelengthOutOfOrderIsRejectedQuotingIndexAndValues() {
        double[] nm = {400, 405, 404};
        // message format fixed by the project's interface agreement
        assertThatThrownBy(() -> Curve.of(nm, new double[] {0.1, 0.2, 0.3}, 0.001))
                .isInstanceOf(CurveException.class)
                .hasMessageContaining("wavelength at index 2 (404.0 nm) is not greater than the previous one (405.0 nm)");
    }

    @Test
    void transmittanceOutsideAcceptedRangeIsRejectedQuotingIndexAndValue() {
        assertThatThrownBy(() -> Curve.of(NM, new double[] {0.1, 1.7, 0.3, 0.4}, 0.001))
                .isInstanceOf(CurveException.class)
                .hasMessageContaining("index 1").hasMessageContaining("1.7");
        assertThatThrownBy(() -> Curve.of(NM, new double[] {0.1, 0.2, Double.NaN, 0.4}, 0.001))
                .hasMessageContaining("index 2").hasMessageContaining("NaN");
        assertThatThrownBy(() -> Curve.of(new double[] {0, 1}, new double[] {0.1, 0.2}, 0.001))
                .hasMessageContaining("index 0 (0.0 nm)");
    }

    @Test
    void detectionLimitOfOneOrMoreIsRejectedQuotingIndex() {
        assertThatThrownBy(() -> Curve.of(NM, new double[] {0.1, 0.2, 0.3, 0.4},
                new boolean[4], new double[] {0, 0, 1.0, 0}))
                .hasMessageContaining("detection limit at index 2 (400.0 nm) is 1.0");
    }

    @Test
    void singlePointAndMismatchedArraysAreRejected() {
        assertThatThrownBy(() -> Curve.of(new double[] {300}, new double[] {0.5}, 0))
                .hasMessageContaining("at least 2 points");
        assertThatThrownBy(() -> Curve.of(NM, new double[] {0.1, 0.2}, 0))
                .hasMessageContaining("transmittance has 2 entries but wavelengthsNm has 4");
    }

    @Test
    void midpointBetweenTenPercentAndOneTenthPercentIsOnePercentInAbsorbance() {
        // Beer–Lambert: absorbance linear in path/concentration (Modern Optical Engineering,
        // eqs. 10.2–10.3), so A = 1 and A = 3 average to A = 2, T = 0.01 (a linear average would give 0.0505)
        Curve curve = Curve.of(new double[] {400, 410}, new double[] {0.1, 0.001}, 0);
        assertThat(curve.transmittanceAt(405).orElseThrow()).isCloseTo(0.01, within(1e-12));
    }

    @Test
    void transmittanceIsNeverExtrapolated() {
        Curve curve = Curve.of(NM, new double[] {0.1, 0.2, 0.3, 0.4}, 0);
        assertThat(curve.transmittanceAt(299.9)).isEmpty();
        assertThat(curve.transmittanceAt(450.1)).isEmpty();
        assertThat(curve.transmittanceAt(450).orElseThrow()).isEqualTo(0.4);
        assertThat(curve.covers(300)).isTrue();
    }

    @Test
    void resampleOutsideMeasuredRangeFailsNamingTheGridEnd() {
        Curve curve = Curve.of(NM, new double[] {0.1, 0.2, 0.3, 0.4}, 0);
        assertThatThrownBy(() -> curve.resample(new WavelengthGrid(290, 400, 10)))
                .isInstanceOf(CurveException.class).hasMessageContaining("grid start 290.0 nm");
        assertThatThrownBy(() -> curve.resample(new WavelengthGrid(300, 460, 10)))
                .isInstanceOf(CurveException.class).hasMessageContaining("grid end 460.0 nm");
    }

    @Test
    void resampleCarriesFlagsAndInterpolatesLimitsLinearly() {
        Curve curve = Curve.of(NM, new double[] {0.0001, 0.2, 0.3, 0.4},
                new boolean[] {true, false, false, false}, new double[] {0.001, 0.003, 0.003, 0.003});
        Curve grid = curve.resample(new WavelengthGrid(300, 400, 25));
        assertThat(grid.wavelengthsNm()).containsExactly(300, 325, 350, 375, 400);
        // a value next to an upper bound is only a bound
        assertThat(grid.belowDetectionFlags()).containsExactly(true, true, false, false, false);
        assertThat(grid.detectionLimit(1)).isCloseTo(0.002, within(1e-15));
        assertThat(grid.transmittance(2)).isEqualTo(0.2);
        assertThat(grid.hasUniformDetectionLimit()).isFalse();
        assertThat(grid.maxDetectionLimit()).isEqualTo(0.003);
    }

    @Test
    void uniformLimitMarksPointsAtOrBelowItAsBelowDetection() {
        Curve curve = Curve.of(NM, new double[] {0.0005, 0.001, 0.0011, 0.5}, 0.001);
        assertThat(curve.belowDetectionFlags()).containsExactly(true, true, false, false);
        assertThat(curve.belowDetectionAt(425)).isFalse();
        assertThat(curve.belowDetectionAt(375)).isTrue();
        assertThat(curve.hasUniformDetectionLimit()).isTrue();
    }

    @Test
    void curveIsImmutableAndComparedByContent() {
        double[] t = {0.1, 0.2, 0.3, 0.4};
        Curve curve = Curve.of(NM, t, 0);
        t[0] = 0.9;
        curve.transmittances()[1] = 0.9;
        assertThat(curve.transmittance(0)).isEqualTo(0.1);
        assertThat(curve.transmittance(1)).isEqualTo(0.2);
        Curve same = Curve.of(NM, new double[] {0.1, 0.2, 0.3, 0.4}, 0);
        assertThat(curve).isEqualTo(same).hasSameHashCodeAs(same);
        assertThat(curve).hasToString("Curve[4 points, 300.0..450.0 nm]");
    }

    @Test
    void resamplingReadsWhatThePointReadersGiveAtEveryWavelength() {
        // resampleAt searches once per point; it must equal transmittanceAt (absorbance interpolation),
        // belowDetectionAt and the linear limit, read one at a time (exact equality, random curves)
        Random random = new Random(11);
        for (int trial = 0; trial < 200; trial++) {
            int n = 2 + random.nextInt(40);
            double[] nm = new double[n];
            double[] t = new double[n];
            boolean[] below = new boolean[n];
            double[] limits = new double[n];
            for (int i = 0; i < n; i++) {
                nm[i] = (i == 0 ? 250 : nm[i - 1]) + 0.5 + 9 * random.nextDouble();
                t[i] = random.nextInt(5) == 0 ? 0 : random.nextDouble();
                limits[i] = 1e-4 * random.nextInt(30);
                below[i] = t[i] <= limits[i];
            }
            Curve curve = Curve.of(nm, t, below, limits);
            // stored points and points between them, in order
            java.util.TreeSet<Double> points = new java.util.TreeSet<>(java.util.List.of(nm[0], nm[n - 1]));
            for (int k = 0; k < 20; k++) {
                points.add(random.nextBoolean() ? nm[random.nextInt(n)]
                        : nm[0] + (nm[n - 1] - nm[0]) * random.nextDouble());
            }
            double[] at = points.stream().mapToDouble(Double::doubleValue).toArray();
            Curve read = curve.resampleAt(at);
            for (int k = 0; k < at.length; k++) {
                assertThat(read.transmittance(k)).isEqualTo(curve.transmittanceAt(at[k]).getAsDouble());
                assertThat(read.belowDetection(k)).isEqualTo(curve.belowDetectionAt(at[k]));
                int hit = java.util.Arrays.binarySearch(nm, at[k]);
                double limit = hit >= 0 ? limits[hit] : linear(nm, limits, -hit - 1, at[k]);
                assertThat(read.detectionLimit(k)).isEqualTo(limit);
            }
        }
    }

    private static double linear(double[] nm, double[] values, int upper, double x) {
        int lower = upper - 1;
        double f = (x - nm[lower]) / (nm[upper] - nm[lower]);
        return values[lower] * (1 - f) + values[upper] * f;
    }
}
