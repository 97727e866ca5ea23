package org.spectralsieve.optics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.CurveException;
import org.spectralsieve.spectrum.WavelengthGrid;

class LightPathTest {

    private static final RefractiveIndex GLASS = new ConstantIndex(1.5);
    private static final double[] NM = {360, 380, 400, 420};

    private static Curve flat(double t) {
        return Curve.of(NM, new double[] {t, t, t, t}, 0.0001);
    }

    @Test
    void oneBulkLayerEqualsTheThicknessRescaler() {
        Curve measured = Curve.of(NM, new double[] {0.00005, 0.02, 0.6, 0.88}, 0.0001);
        WavelengthGrid grid = new WavelengthGrid(360, 420, 5);
        Curve path = LightPath.of(Layer.bulk(measured, 2, 5, SellmeierIndex.CROWN_517642)).transmittance(grid);
        Curve rescaled = ThicknessRescaler.rescale(measured, 2, 5, SellmeierIndex.CROWN_517642).resample(grid);
        assertThat(path.belowDetectionFlags()).containsExactly(rescaled.belowDetectionFlags());
        for (int i = 0; i < grid.size(); i++) {
            assertThat(path.transmittance(i)).isCloseTo(rescaled.transmittance(i), within(1e-12));
            assertThat(path.detectionLimit(i)).isCloseTo(rescaled.detectionLimit(i), within(1e-12));
        }
    }

    @Test
    void twoLosslessPlatesWithAirGapMatchTheIncoherentPileOfPlates() {
        // pile of m non-absorbing plates, incoherent: T = (1−R)/(1+(2m−1)R) (follows from Modern Optical Engineering eq. 10.5
        // applied surface by surface; m = 1 gives eq. 10.6). For m = 2, R = 0.04: 0.96/1.12.
        double lossless = Slab.losslessTransmittance(0.04);
        WavelengthGrid grid = new WavelengthGrid(360, 420, 20);
        Curve path = LightPath.of(Layer.fixed(flat(lossless), GLASS), Layer.fixed(flat(lossless), GLASS))
                .transmittance(grid);
        assertThat(path.transmittance(1)).isCloseTo(0.96 / 1.12, within(1e-12));
    }

    @Test
    void elementCombinationIsTheTwoElementFormOfEquationTenPointFive() {
        // Modern Optical Engineering, eq. 10.5 with the two surfaces replaced by whole elements
        OpticalElement a = new OpticalElement(0.5, 0.1, 0.2);
        OpticalElement b = new OpticalElement(0.6, 0.3, 0.05);
        OpticalElement ab = a.followedBy(b);
        assertThat(ab.transmittance()).isCloseTo(0.5 * 0.6 / (1 - 0.2 * 0.3), within(1e-15));
        assertThat(ab.reflectanceFront()).isCloseTo(0.1 + 0.25 * 0.3 / 0.94, within(1e-15));
        assertThat(ab.reflectanceBack()).isCloseTo(0.05 + 0.36 * 0.2 / 0.94, within(1e-15));
        // a slab built surface by surface equals OpticalElement.slab (Modern Optical Engineering eq. 10.5)
        OpticalElement surface = new OpticalElement(0.96, 0.04, 0.04);
        OpticalElement bulk = new OpticalElement(0.5, 0, 0);
        OpticalElement slab = surface.followedBy(bulk).followedBy(surface);
        assertThat(slab.transmittance()).isCloseTo(OpticalElement.slab(0.5, 0.04).transmittance(), within(1e-15));
        assertThat(slab.reflectanceFront()).isCloseTo(OpticalElement.slab(0.5, 0.04).reflectanceFront(), within(1e-15));
    }

    @Test
    void strongAbsorbersInSeriesMultiplyUpToOneInterReflection() {
        // each measured T already includes its own surfaces; for strong absorbers each part reflects only
        // its front surface R = 0.04, so T = T1·T2/(1 − R²) (two-element form of Modern Optical Engineering eq. 10.5;
        // REFERENCE §7: transmittances of stacked filters multiply, reflection handled separately)
        WavelengthGrid grid = new WavelengthGrid(360, 420, 20);
        Curve path = LightPath.of(Layer.fixed(flat(0.01), GLASS), Layer.fixed(flat(0.02), GLASS)).transmittance(grid);
        assertThat(path.transmittance(0)).isCloseTo(0.01 * 0.02 / (1 - 0.04 * 0.04), within(1e-9));
    }

    @Test
    void pathIsBelowDetectionWhereAnyLayerIs() {
        Curve blocker = Curve.of(NM, new double[] {0.00001, 0.00001, 0.5, 0.8}, 0.0001);
        WavelengthGrid grid = new WavelengthGrid(360, 420, 20);
        Curve path = LightPath.of(Layer.fixed(flat(0.9), GLASS), Layer.bulk(blocker, 1, 2, GLASS)).transmittance(grid);
        assertThat(path.belowDetectionFlags()).containsExactly(true, true, false, false);
        assertThat(path.transmittance(0)).isLessThan(path.detectionLimit(0));
    }

    @Test
    void gridOutsideALayerFailsNamingTheLayer() {
        Curve shortCurve = Curve.of(new double[] {380, 420}, new double[] {0.5, 0.5}, 0);
        LightPath path = LightPath.of(Layer.fixed(flat(0.9), GLASS), Layer.fixed(shortCurve, GLASS));
        assertThatThrownBy(() -> path.transmittance(new WavelengthGrid(360, 420, 20)))
                .isInstanceOf(CurveException.class).hasMessageStartingWith("layer 1: grid start 360.0 nm");
        assertThatThrownBy(() -> LightPath.of()).hasMessageContaining("at least one layer");
    }

    @Test
    void sharedWavelengthsAreTheSortedUnionOfStoredPointsInsideTheCommonRange() {
        Curve a = Curve.of(new double[] {300, 310.5, 320, 330, 400}, new double[] {0.1, 0.2, 0.3, 0.4, 0.5}, 0.001);
        Curve b = Curve.of(new double[] {305, 310.5, 315, 390, 410}, new double[] {0.5, 0.4, 0.3, 0.2, 0.1}, 0.001);
        Curve c = Curve.of(new double[] {290, 320, 395}, new double[] {0.5, 0.5, 0.5}, 0.001);
        LightPath path = LightPath.of(Layer.fixed(a, new ConstantIndex(1.5)), Layer.fixed(b, new ConstantIndex(1.5)),
                Layer.fixed(c, new ConstantIndex(1.5)));
        // common range 305..395 nm: its ends, then every stored point strictly inside, each once
        assertThat(path.sharedWavelengths()).containsExactly(305, 310.5, 315, 320, 330, 390, 395);
    }
}
