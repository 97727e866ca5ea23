package org.spectralsieve.seedmodel;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.Collections;
import java.util.List;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.api.Test;

/** The generator's physics against textbook formulas and REFERENCE.md's worked numbers. */
class SampleModellerTest {

    private static SampleSpec oneMillimetre(AbsorptionPart part) {
        return SampleSpec.bulk(1, Absorption.of(part), "test");
    }

    @ParameterizedTest(name = "K = {0} gives T = {1}")
    @CsvSource({"1.0, 0.923077", "0.9, 0.830516", "0.5, 0.460984", "0.1, 0.092161"})
    void slabWithFourPercentSurfacesMatchesTheHandbookSlabEquation(double k, double expected) {
        // REFERENCE.md §7 table (Modern Optical Engineering eq. 10.5): n = 1.5 → R = 0.04
        SampleSpec sample = oneMillimetre(new FlatBackground(-Math.log(k)));
        double t = SampleModeller.externalTransmittance(new IndexSpec.Constant(1.5), sample, 500);
        assertThat(t).isCloseTo(expected, within(1e-6));
    }

    @Test
    void urbachEdgeFallsByFactorEOneUrbachEnergyBelowTheEdgeEnergy() {
        // Urbach's rule α ∝ exp(E/E_U): one E_U less photon energy divides α by e
        UrbachEdge edge = new UrbachEdge(300, 2.0, 0.1);
        double longerNm = 1239.84198 / (1239.84198 / 300 - 0.1);
        assertThat(edge.alphaPerMm(300)).isCloseTo(2.0, within(1e-12));
        assertThat(edge.alphaPerMm(longerNm)).isCloseTo(2.0 / Math.E, within(1e-12));
    }

    @Test
    void gaussianBandIsAtHalfPeakHalfAWidthFromItsCentre() {
        // definition of full width at half maximum
        GaussianBand band = new GaussianBand(400, 3.0, 50);
        assertThat(band.alphaPerMm(425)).isCloseTo(1.5, within(1e-12));
        assertThat(band.alphaPerMm(375)).isCloseTo(1.5, within(1e-12));
    }

    @Test
    void logisticEdgeIsTheGeometricMeanOfItsTwoLevelsAtTheEdge() {
        // log-α midpoint: ln α = (ln α_below + ln α_above)/2
        LogisticEdge edge = new LogisticEdge(380, 100, 0.01, 5);
        assertThat(edge.alphaPerMm(380)).isCloseTo(1.0, within(1e-12));
        assertThat(edge.alphaPerMm(200)).isCloseTo(100, within(1e-6));
        assertThat(edge.alphaPerMm(900)).isCloseTo(0.01, within(1e-9));
    }

    @Test
    void doublingThicknessDoublesTheInternalAbsorbance() {
        // Beer–Lambert, Modern Optical Engineering eqs. 10.2–10.3: K(2d) = K(d)²
        Absorption a = Absorption.of(new GaussianBand(450, 1.2, 80));
        assertThat(a.internalTransmittance(450, 6)).isCloseTo(Math.pow(a.internalTransmittance(450, 3), 2), within(1e-15));
    }

    @Test
    void valuesBelowTheFloorAreWrittenAsUpperBoundsAtTheFloor() {
        SampleSpec opaque = oneMillimetre(new FlatBackground(20)); // K = 2e-9
        ModelledCurve c = SampleModeller.model(new IndexSpec.Constant(1.5), opaque);
        assertThat(c.upperBounds()).containsOnly(true);
        assertThat(c.transmittances()).containsOnly(0.001);
    }

    @Test
    void modelledValuesAreRoundedDownToSixSignificantDigits() {
        ModelledCurve c = SampleModeller.model(new IndexSpec.Constant(1.5), oneMillimetre(new FlatBackground(0)));
        // 2n/(n²+1) = 0.923076923… → 0.923076, never rounded up over the ceiling
        assertThat(c.transmittances()[0]).isEqualTo(0.923076);
    }

    @Test
    void gridRunsFrom190Or250To1100nmInOneNanometreSteps() {
        SampleSpec s = oneMillimetre(new FlatBackground(0.01));
        assertThat(SampleModeller.model(new IndexSpec.Constant(1.5), s).wavelengthsNm()).hasSize(911).startsWith(190.0).endsWith(1100.0);
        assertThat(SampleModeller.model(new IndexSpec.Constant(1.5), s.startingAt(250)).wavelengthsNm()).hasSize(851).startsWith(250.0);
    }

    @Test
    void materialWithFourSamplesIsRejectedNamingItsSlug() {
        SampleSpec s = oneMillimetre(new FlatBackground(0.01));
        assertThatThrownBy(() -> new MaterialSpec("too-many", "x", MaterialClass.OTHER, "x", List.of(),
                Scaling.BULK, new IndexSpec.Constant(1.5), Collections.nCopies(4, s)))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("too-many").hasMessageContaining("4");
    }

    @Test
    void negativeAbsorptionIsRejectedQuotingTheValue() {
        assertThatThrownBy(() -> new FlatBackground(-0.5)).hasMessageContaining("-0.5");
    }

    @Test
    void stackThicknessIsTheSumOfItsLayersPrintedPlainly() {
        Absorption a = Absorption.of(new FlatBackground(0.01));
        SampleSpec laminate = Stock.stack(new Layer("glass", 3, a), new Layer("PVB", 0.38, a), new Layer("glass", 3, a));
        assertThat(laminate.thicknessLabel()).isEqualTo("6.38");
    }
}
