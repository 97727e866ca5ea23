package org.spectralsieve.search.text;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.spectralsieve.optics.MeasuredFiles;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.testsupport.ReadsSharedFolder;

/**
 * The spectral summaries the library's facets sort by. Checks against sources outside the project: the
 * definition of τv (ISO 8980-3: a weighted mean, so a flat curve's τv is its T), and the measured sheets
 * of ../shared/reference-data/measured-transmittance-… (skipped with a message when absent), whose 50 %
 * points, τv and UV transmittances SOURCES.md §8 computed independently of this code.
 */
class SpectralSummaryTest {

    private static Curve flat(double from, double to, double t) {
        return Curve.of(new double[] {from, to}, new double[] {t, t}, 1e-3);
    }

    @Test
    void aFlatCurvesLuminousTransmittanceIsItsOwnTransmittance() {
        // ISO 8980-3: τv = Σ T·S·V / Σ S·V, so a constant T is its own τv: 3 %, 30 %, 60 %, 90 %
        assertThat(SpectralSummary.of(flat(300, 800, 0.03)).luminous()).isEqualTo("under 10 %");
        assertThat(SpectralSummary.of(flat(300, 800, 0.30)).luminous()).isEqualTo("10-50 %");
        assertThat(SpectralSummary.of(flat(300, 800, 0.60)).luminous()).isEqualTo("50-80 %");
        assertThat(SpectralSummary.of(flat(300, 800, 0.90)).luminous()).isEqualTo("80 % and over");
    }

    @Test
    void aCurveThatStopsShortOfTheVisibleOrOfAWavelengthSaysNotCoveredNeverBlocks() {
        SpectralSummary uvOnly = SpectralSummary.of(flat(300, 500, 0.90));

        assertThat(uvOnly.luminous()).isEqualTo(SpectralSummary.NOT_COVERED);
        assertThat(uvOnly.at254()).isEqualTo(SpectralSummary.NOT_COVERED);
        assertThat(uvOnly.at365()).isEqualTo(SpectralSummary.PASSES);
    }

    @Test
    void passesPartlyAndBlocksAtTheThresholdsOfFiftyAndOnePercent() {
        assertThat(SpectralSummary.at(flat(250, 450, 0.50), 365)).isEqualTo(SpectralSummary.PASSES);
        assertThat(SpectralSummary.at(flat(250, 450, 0.49), 365)).isEqualTo(SpectralSummary.PARTLY);
        assertThat(SpectralSummary.at(flat(250, 450, 0.01), 365)).isEqualTo(SpectralSummary.PARTLY);
        assertThat(SpectralSummary.at(flat(250, 450, 0.009), 365)).isEqualTo(SpectralSummary.BLOCKS);
    }

    @Test
    void aReadingBelowDetectionBlocksOnlyWhenItsBoundIsUnderOnePercent() {
        // stored 0.1 %, flagged: under a 0.5 % limit it blocks; under a 2 % limit it could be 1.5 %: not determined
        Curve fine = Curve.of(new double[] {250, 450}, new double[] {0.001, 0.001}, 0.005);
        Curve coarse = Curve.of(new double[] {250, 450}, new double[] {0.001, 0.001}, 0.02);

        assertThat(SpectralSummary.at(fine, 365)).isEqualTo(SpectralSummary.BLOCKS);
        assertThat(SpectralSummary.at(coarse, 365)).isEqualTo(SpectralSummary.NOT_DETERMINED);
    }

    @Test
    void theEdgeBandIsThatOfTheFiftyPercentPointAndANeverRisingCurveHasNone() {
        Curve longPass = Curve.of(new double[] {300, 340, 360, 800}, new double[] {0.002, 0.2, 0.6, 0.92}, 1e-3);
        assertThat(SpectralSummary.edge(longPass)).isEqualTo("340-380 nm"); // 50 % between 340 (20 %) and 360 nm (60 %)
        assertThat(SpectralSummary.edge(flat(300, 800, 0.03))).isEqualTo(SpectralSummary.NO_EDGE);
        // over 50 % from its first point: the edge lies below 250 nm, so under 300 nm ...
        assertThat(SpectralSummary.edge(flat(250, 800, 0.9))).isEqualTo("under 300 nm");
        // ... but below 350 nm says nothing about which band
        assertThat(SpectralSummary.edge(flat(350, 800, 0.9))).isEqualTo(SpectralSummary.NO_EDGE);
    }

    @Test
    @ReadsSharedFolder
    void measuredSheetsFallInTheBandsOfTheirSourceTable() {
        // SOURCES.md §8 (1 nm data): 50 % at 373.6 nm, τv 0.9225; T300 7.24 %
        SpectralSummary acrylic = SpectralSummary.of(MeasuredFiles.curve("acrylic-clear-3mm.csv"));
        assertThat(acrylic.edge()).isEqualTo("340-380 nm");
        assertThat(acrylic.luminous()).isEqualTo("80 % and over");
        assertThat(acrylic.at405()).isEqualTo(SpectralSummary.PASSES);

        // 50 % at 399.3 nm, τv 0.8734, T under 1 % over 280-370 nm (max 0.057 %), T400 53.09 %
        SpectralSummary polycarbonate = SpectralSummary.of(MeasuredFiles.curve("polycarbonate-sheet-3mm.csv"));
        assertThat(polycarbonate.edge()).isEqualTo("380-420 nm");
        assertThat(polycarbonate.luminous()).isEqualTo("80 % and over");
        assertThat(polycarbonate.at254()).isEqualTo(SpectralSummary.BLOCKS);
        assertThat(polycarbonate.at365()).isEqualTo(SpectralSummary.BLOCKS);
        assertThat(polycarbonate.at405()).isEqualTo(SpectralSummary.PASSES);

        // 50 % at 388.6 nm; T under 1 % over 280-370 nm (max 0.185 %)
        SpectralSummary uvAcrylic = SpectralSummary.of(MeasuredFiles.curve("acrylic-uv-absorbing-3mm.csv"));
        assertThat(uvAcrylic.edge()).isEqualTo("380-420 nm");
        assertThat(uvAcrylic.at365()).isEqualTo(SpectralSummary.BLOCKS);

        assertThat(SpectralSummary.of(MeasuredFiles.curve("glass-dish-cover.csv")).edge()).isEqualTo("300-340 nm"); // 318.1
        assertThat(SpectralSummary.of(MeasuredFiles.curve("longpass-filter-glass-295nm-2mm.csv")).edge())
                .isEqualTo("under 300 nm"); // 295.0
        // the blocked beam: at the instrument floor everywhere, so no edge, and τv under 10 % (0.0001)
        SpectralSummary dark = SpectralSummary.of(MeasuredFiles.curve("instrument-dark.csv"));
        assertThat(dark.edge()).isEqualTo(SpectralSummary.NO_EDGE);
        assertThat(dark.luminous()).isEqualTo("under 10 %");
    }
}
