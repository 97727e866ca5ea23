package org.spectralsieve.importers;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.spectralsieve.testsupport.ReadsSharedFolder;
import org.spectralsieve.testsupport.SharedFolder;

/**
 * Reads a real measured file from the shared reference data (never copied into the repository).
 * Expected values: reference-data/SOURCES.md, section 8, row {@code acrylic-clear-3mm.csv}: comma,
 * header {@code Wavelength,Transmittance,StdDev}, T in percent, 190–1100 nm at 1 nm steps (so 911
 * points), T300 / T400 / T550 = 7.24 / 91.01 / 92.27 %, instrument floor written as 0.0100000…
 */
@ReadsSharedFolder
class ReferenceDataReadTest {

    private static final String SHEET = "acrylic-clear-3mm.csv";

    @Test
    void clearAcrylicSheetReadsWithSourcesMdValues() throws ImportException {
        Path file = SharedFolder.measuredSheet(SHEET);

        // the header says "Transmittance" but SOURCES.md says the values are percent, so force the kind
        ParsedSpectrum s = new DelimitedTextReader().read(file,
                ReadOptions.defaults().withYKind(YKind.TRANSMITTANCE_PERCENT));
        double[] x = s.wavelengthsNm();
        double[] t = s.values();

        assertThat(s.sourceName()).isEqualTo("acrylic-clear-3mm.csv");
        assertThat(s.size()).isEqualTo(911);
        assertThat(x[0]).isEqualTo(190.0);
        assertThat(x[x.length - 1]).isEqualTo(1100.0);
        assertThat(t[0]).isCloseTo(0.0100, within(1e-6)); // the instrument floor at 190 nm
        assertThat(t[300 - 190]).isCloseTo(7.24, within(0.005));
        assertThat(t[400 - 190]).isCloseTo(91.01, within(0.005));
        assertThat(t[550 - 190]).isCloseTo(92.27, within(0.005));
        assertThat(s.yKind()).isEqualTo(YKind.TRANSMITTANCE_PERCENT);
        // the StdDev column is read as the values' standard deviation, no longer ignored
        assertThat(s.standardDeviationOrigin()).contains("column 'StdDev'");
        assertThat(s.warnings()).noneMatch(w -> w.contains("StdDev"));
    }

    @Test
    void clearAcrylicSheetWithoutOverrideIsReadAsPercentWithAWarningThatItsHeaderNamesNoScale() throws ImportException {
        Path file = SharedFolder.measuredSheet(SHEET);

        ParsedSpectrum s = new DelimitedTextReader().read(file);

        assertThat(s.yKind()).isEqualTo(YKind.TRANSMITTANCE_PERCENT);
        assertThat(s.warnings()).anyMatch(w -> w.contains("looks like percent"));
    }
}
