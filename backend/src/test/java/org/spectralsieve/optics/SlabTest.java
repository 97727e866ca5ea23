package org.spectralsieve.optics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class SlabTest {

    private static final double SIX_DECIMALS = 5e-7;

    @Test
    void glassOfIndexOnePointFiveReflectsFourPercentPerSurface() {
        // Modern Optical Engineering, 4th ed., eq. 10.1
        assertThat(Fresnel.reflectanceInAir(1.5)).isCloseTo(0.04, within(1e-15));
        assertThat(Fresnel.normalReflectance(1.5, 1.0)).isCloseTo(0.04, within(1e-15));
    }

    @Test
    void slabWithFourPercentSurfacesPassesNinetyTwoPointThreePercent() {
        // Modern Optical Engineering, 4th ed., eq. 10.6: T = 2n/(n²+1) = 0.923077 for n = 1.5;
        // eq. 10.7: R_total = (n−1)²/(n²+1) = 0.076923
        assertThat(Slab.transmittance(1, 0.04)).isCloseTo(0.923077, within(SIX_DECIMALS));
        assertThat(Slab.reflectance(1, 0.04)).isCloseTo(0.076923, within(SIX_DECIMALS));
        assertThat(Slab.losslessTransmittance(0.04)).isCloseTo(2 * 1.5 / (1.5 * 1.5 + 1), within(1e-15));
    }

    // REFERENCE §7 table [C], computed from Modern Optical Engineering, eq. 10.5, R = 0.04
    @ParameterizedTest(name = "K = {0} gives T = {1}, R = {2}")
    @CsvSource({
        "0.9,  0.830516, 0.069899",
        "0.5,  0.460984, 0.049220",
        "0.1,  0.092161, 0.040369",
        "0.01, 0.009216, 0.040004"})
    void absorbingSlabTransmittanceAndReflectanceMatchTable(double k, double t, double r) {
        assertThat(Slab.transmittance(k, 0.04)).isCloseTo(t, within(SIX_DECIMALS));
        assertThat(Slab.reflectance(k, 0.04)).isCloseTo(r, within(SIX_DECIMALS));
    }

    // REFERENCE §7 inversion check values [C], positive root of R²T·K² + (1−R)²K − T = 0 (from Modern Optical Engineering eq. 10.5)
    @ParameterizedTest(name = "T = {0} gives K = {1}")
    @CsvSource({"0.8, 0.867012", "0.5, 0.542279", "0.1, 0.108505"})
    void measuredTransmittanceInvertsToInternalTransmittance(double t, double k) {
        assertThat(Slab.internalFromTransmittance(t, 0.04)).isCloseTo(k, within(SIX_DECIMALS));
    }

    @Test
    void transmittanceAboveLosslessCeilingIsTreatedAsNoAbsorption() {
        // the ceiling (1−R)/(1+R) is Modern Optical Engineering eq. 10.6; readings above it can only be noise
        assertThat(Slab.internalFromTransmittance(0.95, 0.04)).isEqualTo(1.0);
        assertThat(Slab.internalFromTransmittance(1.02, 0.04)).isEqualTo(1.0);
        assertThat(Slab.internalFromTransmittance(0, 0.04)).isEqualTo(0.0);
        assertThat(Slab.internalFromTransmittance(-0.001, 0.04)).isEqualTo(0.0);
    }

    @Test
    void withoutSurfaceReflectionInternalEqualsMeasuredTransmittance() {
        // R = 0 reduces eq. 10.5 (Modern Optical Engineering) to T = K
        assertThat(Slab.internalFromTransmittance(0.37, 0)).isCloseTo(0.37, within(1e-15));
    }

    @Test
    void inversionUndoesSlabTransmittanceForRandomInternalAndReflectance() {
        // property: internalFromTransmittance is the inverse of eq. 10.5 (Modern Optical Engineering) on K ∈ [0,1], R ∈ [0,0.3]
        SplittableRandom random = new SplittableRandom(20240405L);
        for (int i = 0; i < 20_000; i++) {
            double k = random.nextDouble();
            double r = random.nextDouble(0, 0.3);
            double t = Slab.transmittance(k, r);
            assertThat(Slab.internalFromTransmittance(t, r))
                    .as("K = %s, R = %s", k, r)
                    .isCloseTo(k, within(1e-12));
        }
    }
}
