package org.spectralsieve.importers;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.io.StringReader;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.spectralsieve.testsupport.ReadsSharedFolder;
import org.spectralsieve.testsupport.SharedFolder;

/**
 * Standard deviations read from a file: a column beside the values, or the spread of replicate columns.
 * Inputs are small illustrative files for an invented "Fernhollow" sheet stock; the numbers are made up,
 * except in the test on a real measured sheet (../shared/reference-data, SOURCES.md section 8).
 */
class StandardDeviationReadTest {

    private final DelimitedTextReader reader = new DelimitedTextReader();

    private ParsedSpectrum read(String text, ReadOptions options) throws ImportException {
        return reader.read("fernhollow-sheet.csv", new StringReader(text), options);
    }

    @ParameterizedTest
    @ValueSource(strings = {"StdDev", "Std.Dev.", "sd", "SD", "std", "stdev", "standard deviation", "sigma",
            "uncertainty", "s.d."})
    void aStandardDeviationColumnIsReadBesideItsValues(String name) throws ImportException {
        String text = "Wavelength (nm),Transmittance(%)," + name + "\n300,40,0.5\n310,50,0.25\n";

        ParsedSpectrum s = read(text, ReadOptions.defaults());

        assertThat(s.hasStandardDeviations()).isTrue();
        assertThat(s.standardDeviations()).containsExactly(0.5, 0.25);
        assertThat(s.standardDeviationOrigin()).contains("column '" + name + "'");
        assertThat(s.warnings()).noneMatch(w -> w.contains("columns ignored"));
    }

    @Test
    void standardDeviationsFollowTheRowsWhenTheyAreReversed() throws ImportException {
        String text = "wavelength,transmittance,sd\n320,0.6,0.03\n310,0.5,0.02\n300,0.4,0.01\n";

        ParsedSpectrum s = read(text, ReadOptions.defaults());

        assertThat(s.wavelengthsNm()).containsExactly(300.0, 310.0, 320.0);
        assertThat(s.standardDeviations()).containsExactly(0.01, 0.02, 0.03);
    }

    @Test
    void aFileWithoutAStandardDeviationColumnHasNone() throws ImportException {
        ParsedSpectrum s = read("wavelength,transmittance\n300,0.4\n310,0.5\n", ReadOptions.defaults());

        assertThat(s.hasStandardDeviations()).isFalse();
        assertThat(s.standardDeviations()).containsOnly(Double.NaN);
        assertThat(s.standardDeviationOrigin()).isEmpty();
    }

    @Test
    void aNegativeStandardDeviationIsRefusedNamingItsLine() {
        String text = "wavelength,transmittance,sd\n300,0.4,0.01\n310,0.5,-0.02\n";

        ImportException e = org.assertj.core.api.Assertions.catchThrowableOfType(ImportException.class,
                () -> read(text, ReadOptions.defaults()));

        assertThat(e.getMessage()).contains("line 3").contains("sd").contains("-0.02");
    }

    @Test
    void averagedReplicatesCarryTheStandardDeviationOfTheirMean() throws ImportException {
        // hand-worked: at 300 nm the replicates 40, 42, 47 %T have mean 43, deviations -3, -1, 4,
        // squares 9 + 1 + 16 = 26, sample variance 26 / (3 - 1) = 13, s = √13 = 3.6056;
        // the mean's standard deviation is s/√3 = √(13/3) = 2.0817 (GUM JCGM 100:2008, 4.2.3).
        // At 310 nm all three read 50: spread 0.
        String text = "wavelength transmittance.1 transmittance.2 transmittance.3\n"
                + "300 40 42 47\n310 50 50 50\n";

        ParsedSpectrum s = read(text, ReadOptions.defaults().replicates(Replicates.MEAN));

        assertThat(s.values()[0]).isCloseTo(43.0, within(1e-12));
        assertThat(s.standardDeviations()[0]).isCloseTo(2.0817, within(1e-4));
        assertThat(s.standardDeviations()[1]).isEqualTo(0.0);
        assertThat(s.standardDeviationOrigin().orElseThrow()).contains("spread of 3 replicates");
    }

    @Test
    void theFirstReplicateAloneHasNoSpread() throws ImportException {
        String text = "wavelength transmittance.1 transmittance.2\n300 40 42\n310 50 52\n";

        ParsedSpectrum s = read(text, ReadOptions.defaults());

        assertThat(s.hasStandardDeviations()).isFalse();
    }

    @Test
    @ReadsSharedFolder
    void theMeasuredClearAcrylicSheetCarriesItsStdDevColumn() throws ImportException {
        Path file = SharedFolder.measuredSheet("acrylic-clear-3mm.csv");

        ParsedSpectrum s = reader.read(file);

        // first data line of the file: 190,0.0100000109795873,0.0039985636075215 (values in percent,
        // SOURCES.md section 8); the StdDev column is in the same unit
        assertThat(s.yKind()).isEqualTo(YKind.TRANSMITTANCE_PERCENT);
        assertThat(s.standardDeviationOrigin()).contains("column 'StdDev'");
        assertThat(s.standardDeviations()[0]).isEqualTo(0.0039985636075215);
        assertThat(java.util.Arrays.stream(s.standardDeviations()).allMatch(v -> v >= 0)).isTrue();
    }

    @Test
    @ReadsSharedFolder
    void theMeasuredGlassCoverReadsItsStdDotDevColumn() throws ImportException {
        Path file = SharedFolder.measuredSheet("glass-dish-cover.csv");

        ParsedSpectrum s = reader.read(file);

        // header "Wavelength (nm),Transmittance(%),Std.Dev.", first row 190,0.0164357601508772,0.00361109561821178
        assertThat(s.standardDeviationOrigin()).contains("column 'Std.Dev.'");
        assertThat(s.standardDeviations()[0]).isEqualTo(0.00361109561821178);
    }

    @Test
    @ReadsSharedFolder
    void theTwoReplicateScansOfTheMeasuredFilmGiveTheStandardDeviationOfTheirMean() throws ImportException {
        Path file = SharedFolder.measuredSheet("ldpe-film-50um.txt");

        ParsedSpectrum s = reader.read(file, ReadOptions.defaults().replicates(Replicates.MEAN));

        // first data line "190\t4.8\t190\t5.3" (SOURCES.md section 8: two replicate x/y pairs): mean 5.05 %T;
        // for n = 2, s = |a − b|/√2 and s/√2 = |a − b|/2 = 0.25 %T
        assertThat(s.values()[0]).isCloseTo(5.05, within(1e-12));
        assertThat(s.standardDeviations()[0]).isCloseTo(0.25, within(1e-12));
        assertThat(s.standardDeviationOrigin().orElseThrow()).contains("spread of 2 replicates");
    }
}
