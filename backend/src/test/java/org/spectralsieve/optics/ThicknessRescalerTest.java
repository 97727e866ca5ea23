package org.spectralsieve.optics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.spectralsieve.spectrum.Curve;

class ThicknessRescalerTest {

    private static final RefractiveIndex GLASS = new ConstantIndex(1.5);

    private static double rescaleOne(double t, double fromMm, double toMm, RefractiveIndex index) {
        Curve curve = Curve.of(new double[] {400, 410}, new double[] {t, t}, 0);
        return ThicknessRescaler.rescale(curve, fromMm, toMm, index).transmittance(0);
    }

    @Test
    void twoMillimetreWindowAtEightyPercentPassesSixtyFourPointSixAtFiveMillimetres() {
        // REFERENCE §7 worked example [C] (Modern Optical Engineering, eqs. 10.1, 10.5 + Beer–Lambert)
        assertThat(rescaleOne(0.80, 2, 5, GLASS)).isCloseTo(0.645573, within(5e-7));
        // the naive T^(5/2) = 0.572433 is what this must not give
        assertThat(Math.pow(0.8, 2.5)).isCloseTo(0.572433, within(5e-7));
        assertThat(rescaleOne(0.80, 2, 5, GLASS)).isNotCloseTo(0.572433, within(0.05));
    }

    @Test
    void colouredGlassFilterAtOneMillimetreConvertsToTwoPointTwoMillimetres() {
        // Glass-catalogue worked example (REFERENCE §7 [V], convention τ = P_d·τi): 59.8 % at 1.0 mm,
        // P_d = 0.911 → 36.1 % at 2.2 mm. P_d ≈ (1−R)/(1+R) (Modern Optical Engineering eq. 10.6) gives R = 0.089/1.911 and
        // n = (1+√R)/(1−√R) ≈ 1.550; the exact slab form must land within 0.1 % absolute.
        double r = (1 - 0.911) / (1 + 0.911);
        double n = (1 + Math.sqrt(r)) / (1 - Math.sqrt(r));
        assertThat(rescaleOne(0.598, 1.0, 2.2, new ConstantIndex(n))).isCloseTo(0.361, within(0.001));
    }

    // PRACTICE check value 32 (derived from Beer–Lambert + Fresnel, n = 1.49 for PMMA)
    @ParameterizedTest(name = "{0} at 3 mm gives {2} at {1} mm")
    @CsvSource({
        "0.50, 6,   0.270,    0.0005",
        "0.50, 1.5, 0.680,    0.0005",
        "0.01, 6,   0.00011,  0.000005"})
    void acrylicSheetRescalesLikeTheTradeExample(double t, double toMm, double expected, double tolerance) {
        assertThat(rescaleOne(t, 3, toMm, new ConstantIndex(1.49))).isCloseTo(expected, within(tolerance));
    }

    @Test
    void belowDetectionStaysAnUpperBoundForThickerAndThinnerSlabs() {
        // monotonicity of Modern Optical Engineering eq. 10.5 in K and of K^(d2/d1): a bound maps to a bound
        Curve measured = Curve.of(new double[] {380, 400, 420}, new double[] {0.0005, 0.3, 0.85}, 0.001);
        for (double toMm : new double[] {6, 1.5}) {
            Curve rescaled = ThicknessRescaler.rescale(measured, 3, toMm, new ConstantIndex(1.49));
            assertThat(rescaled.belowDetectionFlags()).containsExactly(true, false, false);
            assertThat(rescaled.transmittance(0)).isLessThanOrEqualTo(rescaled.detectionLimit(0));
            double expectedLimit = SlabReading.of(0.001, Fresnel.reflectanceInAir(1.49)).transmittance(3, toMm);
            assertThat(rescaled.detectionLimit(0)).isCloseTo(expectedLimit, within(1e-15));
        }
        Curve thicker = ThicknessRescaler.rescale(measured, 3, 6, new ConstantIndex(1.49));
        Curve thinner = ThicknessRescaler.rescale(measured, 3, 1.5, new ConstantIndex(1.49));
        assertThat(thicker.detectionLimit(0)).isLessThan(0.001);
        assertThat(thinner.detectionLimit(0)).isGreaterThan(0.001);
    }

    @Test
    void rescalingToTheSameThicknessKeepsTheCurve() {
        // identity of K^(d/d); Slab inversion and eq. 10.5 (Modern Optical Engineering) are mutually inverse
        Curve measured = Curve.of(new double[] {380, 400, 420}, new double[] {0.01, 0.3, 0.85}, 0);
        Curve same = ThicknessRescaler.rescale(measured, 2, 2, SellmeierIndex.FUSED_SILICA);
        for (int i = 0; i < 3; i++) {
            assertThat(same.transmittance(i)).isCloseTo(measured.transmittance(i), within(1e-12));
        }
    }
}
