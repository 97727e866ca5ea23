package org.spectralsieve.ingest;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.nio.charset.StandardCharsets;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Where an imported curve's absorbance uncertainty comes from and how it is converted, checked against
 * first-order propagation worked by hand: A = −log10 T, so σ_A = σ_T/(T·ln 10) (GUM JCGM 100:2008, 5.1.2;
 * ln 10 = 2.302585). Files are small illustrative "Fernhollow" sheets; the numbers are made up.
 */
class MeasurementUncertaintyTest {

    private final FileImport reader = new FileImport(ImportProperties.defaults().maxPoints());

    private FilePreview preview(String text, ImportOptions options) throws Exception {
        return reader.read("fernhollow-sheet.csv", text.getBytes(StandardCharsets.UTF_8), options);
    }

    private static ImportOptions stated(String text) {
        return ImportOptions.defaults().withStatedUncertainty(OptionText.statedUncertainty("uncertainty", text));
    }

    @Test
    void aPercentStandardDeviationColumnBecomesAnAbsorbanceUncertainty() throws Exception {
        // 400 nm: T = 40 %T ± 0.5 %T → σ_A = 0.005/(0.40 · 2.302585) = 0.005/0.921034 = 0.0054287
        // 500 nm: T = 80 %T ± 0.5 %T → σ_A = 0.005/(0.80 · 2.302585) = 0.0027143
        FilePreview p = preview("Wavelength (nm),Transmittance(%),Std.Dev.\n400,40,0.5\n500,80,0.5\n",
                ImportOptions.defaults());

        assertThat(p.curve().absorbanceUncertainty(0)).isCloseTo(0.0054287, within(1e-7));
        assertThat(p.curve().absorbanceUncertainty(1)).isCloseTo(0.0027143, within(1e-7));
        assertThat(p.uncertaintySource()).contains("Std.Dev.").contains("%T");
    }

    @Test
    void anAbsorbanceFileKeepsItsStandardDeviationAsIs() throws Exception {
        FilePreview p = preview("wavelength,absorbance,sd\n400,0.4,0.012\n500,0.1,0.003\n", ImportOptions.defaults());

        assertThat(p.curve().absorbanceUncertainties()).containsExactly(0.012, 0.003);
    }

    @Test
    void aStatedPercentUncertaintyIsConvertedAtEveryPoint() throws Exception {
        FilePreview p = preview("wavelength,transmittance\n400,0.4\n500,0.8\n", stated("0.5%T"));

        assertThat(p.curve().absorbanceUncertainty(0)).isCloseTo(0.0054287, within(1e-7));
        assertThat(p.curve().absorbanceUncertainty(1)).isCloseTo(0.0027143, within(1e-7));
        assertThat(p.uncertaintySource()).isEqualTo("stated: ±0.5 %T at every point");
    }

    @Test
    void aStatedAbsorbanceUncertaintyIsTheSameAtEveryReadingButUnknownAtABound() throws Exception {
        FilePreview p = preview("wavelength,transmittance\n300,<0.001\n400,0.4\n500,0.8\n", stated("0.01A"));

        assertThat(p.curve().absorbanceUncertainty(0)).isNaN(); // an upper bound has no standard deviation
        assertThat(p.curve().absorbanceUncertainty(1)).isEqualTo(0.01);
        assertThat(p.curve().absorbanceUncertainty(2)).isEqualTo(0.01);
    }

    @Test
    void theFilesOwnColumnAndAStatedUncertaintyCombineAsIndependentComponents() throws Exception {
        FilePreview p = preview("wavelength,transmittance,sd\n400,0.4,0.002\n500,0.8,0.002\n", stated("0.5%T"));

        // GUM JCGM 100:2008, 5.1.2, uncorrelated inputs. At T = 0.4: file σ_A = 0.002/(0.4 · 2.302585) = 0.0021715,
        // stated σ_A = 0.005/(0.4 · 2.302585) = 0.0054287; √(0.0021715² + 0.0054287²) = 0.0058469
        assertThat(p.curve().absorbanceUncertainty(0)).isCloseTo(0.0058469, within(1e-7));
        assertThat(p.uncertaintySource()).contains("combined with the stated ±0.5 %T");
    }

    @Test
    void theFilesOwnColumnAloneIsTakenAsItIs() throws Exception {
        FilePreview p = preview("wavelength,transmittance,sd\n400,0.4,0.002\n500,0.8,0.002\n", ImportOptions.defaults());

        // σ_A = 0.002/(0.4 · 2.302585) = 0.0021715 (GUM 5.1.2, first order)
        assertThat(p.curve().absorbanceUncertainty(0)).isCloseTo(0.0021715, within(1e-7));
    }

    @Test
    void aStandardDeviationAboveHalfTheTransmittanceLeavesThePointUnknownWithAWarning() throws Exception {
        // 300 nm: σ_T/T = 0.006/0.01 = 0.6 > 0.5; 400 nm: 0.004/0.01 = 0.4 → σ_A = 0.4/2.302585 = 0.173718
        FilePreview p = preview("wavelength,transmittance,sd\n300,0.01,0.006\n400,0.01,0.004\n500,0.8,0.002\n",
                ImportOptions.defaults());

        assertThat(p.curve().absorbanceUncertainty(0)).isNaN();
        assertThat(p.curve().absorbanceUncertainty(1)).isCloseTo(0.173718, within(1e-6));
        assertThat(p.warnings()).anySatisfy(w -> assertThat(w).contains("1 point between 300.0 and 300.0 nm"));
    }

    @Test
    void averagedReplicatesGiveTheUncertaintyOfTheirMean() throws Exception {
        // 400 nm: 40, 42, 47 %T, mean 43, s = √13, s/√3 = 2.0817 %T → σ_A = 0.020817/(0.43 · 2.302585) = 0.021025
        FilePreview p = preview("wavelength transmittance.1 transmittance.2 transmittance.3\n"
                + "400 40 42 47\n500 80 80 80\n", new ImportOptions(Optional.empty(), Optional.empty(),
                Optional.empty(), org.spectralsieve.importers.Replicates.MEAN, false, java.util.OptionalDouble.empty(),
                java.util.OptionalDouble.empty(), java.util.OptionalDouble.empty()));

        assertThat(p.curve().absorbanceUncertainty(0)).isCloseTo(0.021025, within(1e-6));
        assertThat(p.curve().absorbanceUncertainty(1)).isEqualTo(0.0);
        assertThat(p.uncertaintySource()).contains("spread of 3 replicates");
    }

    @Test
    void aFileWithoutAnyUncertaintyHasNoneAndNoSource() throws Exception {
        FilePreview p = preview("wavelength,transmittance\n400,0.4\n500,0.8\n", ImportOptions.defaults());

        assertThat(p.curve().hasUncertainty()).isFalse();
        assertThat(p.uncertaintySource()).isNull();
    }

    @ParameterizedTest
    @CsvSource({"0.5%T, 0.5, PERCENT_T", "0.5 %, 0.5, PERCENT_T", "'0,5 %T', 0.5, PERCENT_T", "±0.3%t, 0.3, PERCENT_T",
            "0.01A, 0.01, ABSORBANCE", "0.01 abs, 0.01, ABSORBANCE", "0.02 OD, 0.02, ABSORBANCE",
            "+/- 0.05 absorbance, 0.05, ABSORBANCE"})
    void aStatedUncertaintyIsWrittenWithItsUnit(String text, double amount, StatedUncertainty.Scale scale) {
        assertThat(OptionText.statedUncertainty("uncertainty", text)).contains(new StatedUncertainty(amount, scale));
    }

    @ParameterizedTest
    @ValueSource(strings = {"0.5", "half a percent", "0%T", "150%T", "-0.5%T"})
    void aStatedUncertaintyWithoutItsUnitOrOutOfRangeIsRefusedNamingTheField(String text) {
        assertThatThrownBy(() -> OptionText.statedUncertainty("uncertainty", text))
                .isInstanceOf(ImportRequestException.class).hasMessageContaining("uncertainty");
    }
}
