package org.spectralsieve.optics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class RefractiveIndexTest {

    // REFERENCE §8 check values [C], computed from the published fused-silica Sellmeier coefficients (JOSA 55:1205, 1965)
    @ParameterizedTest(name = "fused silica n({0} nm) = {1}")
    @CsvSource({"365, 1.474541", "405, 1.469581", "587.6, 1.458464"})
    void fusedSilicaIndexMatchesThePublishedSellmeierFit(double nm, double n) {
        assertThat(SellmeierIndex.FUSED_SILICA.at(nm)).isCloseTo(n, within(1e-5));
    }

    // REFERENCE §8 check values [C] from glass-catalogue coefficients of the 517642 borosilicate crown; they agree with the
    // catalogue's nd = 1.51680 and ni = 1.53627, which REFERENCE gives from memory [M]
    @ParameterizedTest(name = "crown 517642 n({0} nm) = {1}")
    @CsvSource({"365, 1.536270", "405, 1.530196", "587.6, 1.516800"})
    void borosilicateCrownIndexMatchesCatalogueFormula(double nm, double n) {
        assertThat(SellmeierIndex.CROWN_517642.at(nm)).isCloseTo(n, within(1e-5));
    }

    @Test
    void pmmaIndexMatchesMeasuredValueAtSodiumDLine() {
        // Sultanova, Kasarova, Nikolov 2009, Acta Phys. Pol. A 116:585: measured 1.491 at 587.6 nm
        // (REFERENCE §8 [V]); fit value 1.490618 [C]
        assertThat(SellmeierIndex.PMMA.at(587.6)).isCloseTo(1.491, within(5e-4));
        assertThat(SellmeierIndex.PMMA.isExtrapolated(405)).isTrue();
        assertThat(SellmeierIndex.PMMA.isExtrapolated(587.6)).isFalse();
    }

    @Test
    void sellmeierKnowsItsValidityRange() {
        // ranges as recorded in REFERENCE §8 (from memory [M])
        assertThat(SellmeierIndex.CROWN_517642.isExtrapolated(254)).isTrue();
        assertThat(SellmeierIndex.FUSED_SILICA.isExtrapolated(254)).isFalse();
    }

    @Test
    void tabulatedIndexInterpolatesLinearlyAndClampsAtTheEnds() {
        // interpolation rule is our definition; table values are Sultanova 2009 PMMA (REFERENCE §8 [V])
        TabulatedIndex pmma = new TabulatedIndex(List.of(436.8, 486.1, 587.6), List.of(1.502, 1.497, 1.491));
        assertThat(pmma.at(486.1)).isEqualTo(1.497);
        assertThat(pmma.at((486.1 + 587.6) / 2)).isCloseTo(1.494, within(1e-12));
        assertThat(pmma.at(365)).isEqualTo(1.502);
        assertThat(pmma.at(1000)).isEqualTo(1.491);
    }

    @Test
    void invalidIndexModelsAreRejectedQuotingIndexAndValue() {
        assertThatThrownBy(() -> new ConstantIndex(0.9)).hasMessageContaining("0.9");
        assertThatThrownBy(() -> new TabulatedIndex(List.of(400.0, 390.0), List.of(1.5, 1.5)))
                .hasMessageContaining("index 1 (390.0 nm)");
        assertThatThrownBy(() -> new SellmeierIndex(List.of(1.0), List.of(), 300, 400))
                .hasMessageContaining("1 B and 0 C");
        assertThat(new ConstantIndex(1.5).at(250)).isEqualTo(1.5);
    }
}
