package org.spectralsieve.optics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatIllegalArgumentException;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/** The physical ranges of stored index models (docs/validation.md), one rule per test. */
class PhysicalRangesTest {

    @ParameterizedTest(name = "n = {0} is a real window material")
    // fused silica 1.458, sapphire 1.768, diamond 2.417, rutile ~2.9, germanium ~4.0 in the IR (handbook values, from memory)
    @ValueSource(doubles = {1.0, 1.458, 1.768, 2.417, 2.9, 4.0})
    void aConstantIndexOfARealTransparentMaterialIsAccepted(double n) {
        assertThat(new ConstantIndex(n).at(405)).isEqualTo(n);
    }

    @ParameterizedTest(name = "n = {0} is refused")
    @ValueSource(doubles = {0.5, 0.999, 4.01, 1e16, 1e308, Double.NaN, Double.POSITIVE_INFINITY})
    void aConstantIndexOutsideOneToFourIsRefusedQuotingTheValue(double n) {
        assertThatIllegalArgumentException().isThrownBy(() -> new ConstantIndex(n))
                .withMessageContaining("refractive index n").withMessageContaining(String.valueOf(n));
    }

    @Test
    void aSellmeierFitWithAResonanceInsideItsValidRangeIsRefused() {
        // C = 0.09 µm² puts the pole at 300 nm, inside 250–1000 nm
        assertThatIllegalArgumentException().isThrownBy(() -> new SellmeierIndex(List.of(1.0), List.of(0.09), 250, 1000))
                .withMessageContaining("resonance at 300");
    }

    @Test
    void aSellmeierFitGivingAnIndexAboveFourInsideItsValidRangeIsRefused() {
        // B = 20 gives n² ≈ 21, n ≈ 4.6 across 400–800 nm
        assertThatIllegalArgumentException().isThrownBy(() -> new SellmeierIndex(List.of(20.0), List.of(0.01), 400, 800))
                .withMessageContaining("n = 4.");
    }

    @Test
    void aSellmeierFitGivingAnIndexBelowOneInsideItsValidRangeIsRefused() {
        assertThatIllegalArgumentException().isThrownBy(() -> new SellmeierIndex(List.of(-0.5), List.of(0.01), 400, 800))
                .withMessageContaining("Sellmeier coefficients give n =");
    }

    @Test
    void aSellmeierValidRangeOutsideTheToolsWavelengthsIsRefused() {
        assertThatIllegalArgumentException().isThrownBy(() -> new SellmeierIndex(List.of(1.0), List.of(0.01), 400, 1e300))
                .withMessageContaining("validToNm");
    }

    @Test
    void publishedSellmeierFitsPassTheCheckOverTheirStatedRange() {
        // the published fused-silica Sellmeier fit (JOSA 55:1205, 1965) over 210–3710 nm, crown 517642 over 300–2500 nm (REFERENCE §8)
        assertThat(SellmeierIndex.FUSED_SILICA.at(210)).isBetween(1.0, 4.0);
        assertThat(SellmeierIndex.CROWN_517642.at(2500)).isBetween(1.0, 4.0);
    }

    @Test
    void anIndexTableValueOutsideOneToFourIsRefusedNamingItsEntry() {
        assertThatIllegalArgumentException().isThrownBy(() -> new TabulatedIndex(List.of(400.0, 500.0), List.of(1.5, 1e16)))
                .withMessageContaining("index table n at index 1");
    }

    @Test
    void anIndexTableWavelengthOutsideTheToolsRangeIsRefused() {
        assertThatIllegalArgumentException().isThrownBy(() -> new TabulatedIndex(List.of(50.0, 500.0), List.of(1.5, 1.5)))
                .withMessageContaining("index table wavelength at index 0");
    }

    @Test
    void anUnusableStoredIndexRefusesEveryComputationWithItsReason() {
        UnusableIndex stored = new UnusableIndex("constant n = 1.0E16", "refractive index n must be from 1.0 to 4.0");
        assertThatThrownBy(() -> stored.at(405)).isInstanceOf(UnusableIndexException.class)
                .hasMessageContaining("constant n = 1.0E16").hasMessageContaining("from 1.0 to 4.0");
    }

    @ParameterizedTest(name = "{0} mm")
    @ValueSource(doubles = {0.001, 0.025, 3, 1000})
    void thicknessesFromOneMicrometreToOneMetreAreAccepted(double mm) {
        assertThat(PhysicalRanges.requireThicknessMm("thickness", mm)).isEqualTo(mm);
    }

    @ParameterizedTest(name = "{0} mm")
    @ValueSource(doubles = {1e-300, 0.0009, 1000.5, 1e308, Double.NaN, 0, -3})
    void thicknessesOutsideOneMicrometreToOneMetreAreRefused(double mm) {
        assertThatIllegalArgumentException().isThrownBy(() -> PhysicalRanges.requireThicknessMm("thickness", mm))
                .withMessageContaining("thickness must be from 0.001 mm");
    }
}
