package org.spectralsieve.optics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.spectralsieve.spectrum.Curve;

/**
 * A curve's absorbance uncertainty carried through thickness rescaling and through stacks of parts, checked
 * against hand-worked first-order propagation (GUM JCGM 100:2008, 5.1.2). The slab formula is Modern Optical
 * Engineering eq. 10.5, T = (1 − R)²K/(1 − R²K²), with the normal-incidence Fresnel R = ((n − 1)/(n + 1))²
 * (eq. 10.1): n = 1.5 gives R = (0.5/2.5)² = 0.04. Values are illustrative.
 */
class UncertaintyRescalingTest {

    private static final RefractiveIndex GLASS = new ConstantIndex(1.5);
    /** K0 = 0.5 at 1 mm: T0 = 0.96² · 0.5 / (1 − 0.04² · 0.5²) = 0.4608 / 0.9996 = 0.460984. */
    private static final double T_HALF_INTERNAL = 0.9216 * 0.5 / (1 - 0.0016 * 0.25);

    private static Curve oneReading(double t, double sigma) {
        return Curve.of(new double[] {400, 410}, new double[] {t, t}, 0)
                .withAbsorbanceUncertainty(new double[] {sigma, sigma});
    }

    @Test
    void doublingTheThicknessDoublesTheAbsorbanceUncertaintyOfAnAbsorbingReading() {
        // σ_A = 0.01 at 1 mm, K0 = 0.5; at 2 mm K' = 0.25.
        // g(K) = (1 + R²K²)/(1 − R²K²): g(0.5) = 1.0004/0.9996 = 1.00080032, g(0.25) = 1.0001/0.9999 = 1.00020002
        // σ' = 0.01 · (2/1) · g(0.25)/g(0.5) = 0.02 · 0.99940018 = 0.0199880036
        Curve rescaled = ThicknessRescaler.rescale(oneReading(T_HALF_INTERNAL, 0.01), 1, 2, GLASS);

        assertThat(rescaled.absorbanceUncertainty(0)).isCloseTo(0.0199880036, within(1e-9));
        // within 0.1 % of the plain Beer–Lambert scaling σ·d'/d: the surfaces add almost nothing
        assertThat(rescaled.absorbanceUncertainty(0)).isCloseTo(0.02, within(0.02 * 0.001));
    }

    @Test
    void halvingTheThicknessHalvesTheAbsorbanceUncertainty() {
        // at 0.5 mm K' = √0.5, R²K'² = 0.0016 · 0.5 = 0.0008, g = 1.0008/0.9992 = 1.00160128
        // σ' = 0.01 · 0.5 · 1.00160128/1.00080032 = 0.0050040016
        Curve rescaled = ThicknessRescaler.rescale(oneReading(T_HALF_INTERNAL, 0.01), 1, 0.5, GLASS);

        assertThat(rescaled.absorbanceUncertainty(0)).isCloseTo(0.0050040016, within(1e-9));
    }

    @Test
    void aClearReadingNeverHasItsUncertaintyShrunkButItGrowsWithThickness() {
        // lossless ceiling 2n/(n² + 1) = 3/3.25 = 0.9231; T0 = 0.92 lies within 0.5 %T of it: unresolved
        Curve clear = oneReading(0.92, 0.002);

        assertThat(ThicknessRescaler.rescale(clear, 3, 1, GLASS).absorbanceUncertainty(0)).isEqualTo(0.002);
        assertThat(ThicknessRescaler.rescale(clear, 3, 6, GLASS).absorbanceUncertainty(0)).isCloseTo(0.004, within(1e-15));
    }

    @Test
    void aPointBelowDetectionHasNoUncertaintyAfterRescaling() {
        Curve measured = Curve.of(new double[] {380, 400}, new double[] {0.0005, 0.3}, 0.001)
                .withAbsorbanceUncertainty(new double[] {0.05, 0.01});

        Curve rescaled = ThicknessRescaler.rescale(measured, 3, 6, GLASS);

        assertThat(rescaled.absorbanceUncertainty(0)).isNaN();
        assertThat(rescaled.absorbanceUncertainty(1)).isGreaterThan(0.01);
    }

    @Test
    void aCurveWithoutUncertaintyRescalesWithoutOne() {
        Curve measured = Curve.of(new double[] {380, 400}, new double[] {0.2, 0.3}, 0);

        assertThat(ThicknessRescaler.rescale(measured, 3, 6, GLASS).hasUncertainty()).isFalse();
    }

    @Test
    void independentPartsInAStackAddTheirVariances() {
        // σ² = 0.03² + 0.04² = 0.0009 + 0.0016 = 0.0025, σ = 0.05 (the 3-4-5 triangle)
        Curve front = oneReading(0.5, 0.03);
        Curve back = oneReading(0.6, 0.04);

        Curve path = LightPath.of(Layer.fixed(front, GLASS), Layer.fixed(back, GLASS)).transmittance();

        assertThat(path.absorbanceUncertainty(0)).isCloseTo(0.05, within(1e-15));
    }

    @Test
    void aStackWithAPartOfUnknownUncertaintyHasNone() {
        Curve known = oneReading(0.5, 0.03);
        Curve unknown = Curve.of(new double[] {400, 410}, new double[] {0.6, 0.6}, 0);

        Curve path = LightPath.of(Layer.fixed(known, GLASS), Layer.fixed(unknown, GLASS)).transmittance();

        assertThat(path.hasUncertainty()).isFalse();
    }
}
