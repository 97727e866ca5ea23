package org.spectralsieve.importers;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.spectralsieve.testsupport.ReadsSharedFolder;
import org.spectralsieve.testsupport.SharedFolder;

/**
 * Every measured-transmittance and DIY-spectrometer file of the shared reference data (never copied into
 * the repository). Expected values: reference-data/SOURCES.md, section 8 (table of T300 / T400 / T550 in
 * percent, ranges, layouts) and section 9 (the DIY spectrometer exports). SOURCES.md rounds T to 0.01 %,
 * hence the 0.005 tolerance.
 */
@ReadsSharedFolder
class ReferenceFilesTest {

    private static final String DIY = "diy-spectrometer/";

    private final DelimitedTextReader reader = new DelimitedTextReader();

    private static double at(ParsedSpectrum s, double nm) {
        int i = Arrays.binarySearch(s.wavelengthsNm(), nm);
        assertThat(i).as("%s has a point at %s nm", s.sourceName(), nm).isGreaterThanOrEqualTo(0);
        return s.values()[i];
    }

    // SOURCES.md §8: file | first nm | last nm | T300 | T400 | T550 (all %T) | header says % ; 1 nm steps
    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', value = {
            "polycarbonate-sheet-3mm.csv          | 190 | 1100 | 0.01  | 53.09 | 87.24 | false",
            "acrylic-clear-3mm.csv                | 190 | 1100 | 7.24  | 91.01 | 92.27 | false",
            "acrylic-uv-absorbing-3mm.csv         | 190 | 810  | 0.01  | 86.69 | 92.84 | false",
            "glass-dish-cover.csv                 | 190 | 1100 | 9.01  | 90.44 | 91.25 | true ",
            "longpass-filter-glass-295nm-2mm.csv  | 190 | 1100 | 62.95 | 91.57 | 91.84 | true ",
            "instrument-blank.csv                 | 190 | 1100 | 100.03| 100.02| 100.02 | true ",
            "instrument-dark.csv                  | 190 | 1100 | 0.01  | 0.01  | 0.01 | true ",
            "ldpe-film-50um.txt                   | 190 | 800  | 85.6  | 89.4  | 90.3 | false",
            "acetate-film-115um.txt               | 190 | 1100 | 61.71 | 88.42 | 90.83 | false",
            "acetate-film-480um.txt               | 190 | 1100 | 19.38 | 76.53 | 84.84 | false",
            "pet-film-125um.txt                   | 190 | 800  | 0.3   | 91.3  | 92.1  | false"})
    void everyMeasuredFileReadsAsPercentWithTheSourcesValues(String name, double first, double last, double t300,
            double t400, double t550, boolean headerSaysPercent) throws ImportException {
        ParsedSpectrum s = reader.read(SharedFolder.measuredSheet(name));

        assertThat(s.yKind()).isEqualTo(YKind.TRANSMITTANCE_PERCENT);
        assertThat(s.xUnit()).isEqualTo(XUnit.NANOMETRE);
        assertThat(s.size()).isEqualTo((int) (last - first) + 1);
        assertThat(s.wavelengthsNm()[0]).isEqualTo(first);
        assertThat(s.wavelengthsNm()[s.size() - 1]).isEqualTo(last);
        assertThat(at(s, 300)).isCloseTo(t300, within(0.005));
        assertThat(at(s, 400)).isCloseTo(t400, within(0.005));
        assertThat(at(s, 550)).isCloseTo(t550, within(0.005));
        // the headers say "transmittance" with no scale, the values are percent (SOURCES.md §8: "T is in percent")
        // headers "Transmittance(%)" say percent; bare "Transmittance" does not, and its percent values are flagged
        assertThat(s.warnings().stream().anyMatch(w -> w.contains("looks like percent"))).isEqualTo(!headerSaysPercent);
    }

    @Test
    void semicolonFilesAreDetectedAndTheirStdDevColumnRead() throws ImportException {
        ParsedSpectrum s = reader.read(SharedFolder.measuredSheet("instrument-blank.csv"));

        // SOURCES.md §8: blank ≈100.03 throughout, up to 100.43
        assertThat(Arrays.stream(s.values()).max().orElseThrow()).isCloseTo(100.43, within(0.005));
        // its third column, "Std.Dev.", is the values' standard deviation: first row 190;99.9398…;0.0126220243469056
        assertThat(s.standardDeviationOrigin()).contains("column 'Std.Dev.'");
        assertThat(s.standardDeviations()[0]).isEqualTo(0.0126220243469056);
    }

    @Test
    void darkFileSitsOnTheInstrumentFloorWithAMaximumOfPointFiveFour() throws ImportException {
        ParsedSpectrum s = reader.read(SharedFolder.measuredSheet("instrument-dark.csv"));

        // SOURCES.md §8: floor 0.0100, max 0.54 (%T)
        assertThat(Arrays.stream(s.values()).min().orElseThrow()).isCloseTo(0.0100, within(1e-6));
        assertThat(Arrays.stream(s.values()).max().orElseThrow()).isCloseTo(0.54, within(0.005));
    }

    @Test
    void ldpeReplicatePairsReadFirstByDefaultWithAWarningNamingTheSecond() throws ImportException {
        ParsedSpectrum s = reader.read(SharedFolder.measuredSheet("ldpe-film-50um.txt"));

        assertThat(s.warnings()).anyMatch(w -> w.contains("w.length.2/transmittance.2"));
        assertThat(s.metadata()).doesNotContainKey("replicate");
        assertThat(s.values()[0]).isEqualTo(4.8);
    }

    @Test
    void ldpeReplicatesReadSeparatelyOrAsTheirMean() throws ImportException {
        Path file = SharedFolder.measuredSheet("ldpe-film-50um.txt");

        List<ParsedSpectrum> both = reader.readAll(file, ReadOptions.defaults().replicates(Replicates.SEPARATE));
        ParsedSpectrum mean = reader.read(file, ReadOptions.defaults().replicates(Replicates.MEAN));

        assertThat(both).hasSize(2);
        assertThat(both.get(1).metadata()).containsEntry("replicate", "2 of 2")
                .containsEntry("columns", "w.length.2, transmittance.2");
        // first data line of the file: "190 4.8 190 5.3" (pair 1, pair 2)
        assertThat(both.get(0).values()[0]).isEqualTo(4.8);
        assertThat(both.get(1).values()[0]).isEqualTo(5.3);
        assertThat(mean.values()[0]).isCloseTo((4.8 + 5.3) / 2, within(1e-12));
        assertThat(mean.size()).isEqualTo(611);
    }

    @Test
    void acetateFileWithMixedTabsAndSpacesKeepsItsCommentsAsPlainRemarks() throws ImportException {
        ParsedSpectrum s = reader.read(SharedFolder.measuredSheet("acetate-film-115um.txt"));

        assertThat(s.size()).isEqualTo(911);
        assertThat(s.metadata()).isEmpty(); // "# cellulose diacetate 0.115 mm thick" has no key: value form
    }

    @Test
    void diyLampExportIsNotATransmittanceFileAndSaysSo() {
        Path lampExport = SharedFolder.referenceFile(DIY + "Spectrum-20260313--130715.csv");

        ImportException e = catchThrowableOfType(ImportException.class, () -> reader.read(lampExport));

        assertThat(e.line()).isEqualTo(10); // 9 '#' lines, then the header
        assertThat(e.problem()).startsWith("no value column in header [Pixel, Wavelength, Measured, Dark]");
    }

    @Test
    void diyLampExportReadsAsRawCapturesWithTheSourcesValues() throws ImportException {
        RawCounts raw = new RawCountsReader().withExposureMs(CaptureRole.SAMPLE, 1)
                .withExposureMs(CaptureRole.DARK, 1)
                .read(SharedFolder.referenceFile(DIY + "Spectrum-20260313--130715.csv"));

        // SOURCES.md §9: 1280 pixels, 268.94–903.38 nm, Measured clipped at 0 (168 zeros), Dark mean 0.0713,
        // maximum at 523.35 nm
        double[] x = raw.wavelengthsNm();
        double[] measured = raw.captures(CaptureRole.SAMPLE).get(0).counts();
        double[] dark = raw.captures(CaptureRole.DARK).get(0).counts();
        int peak = 0;
        for (int i = 1; i < measured.length; i++) {
            peak = measured[i] > measured[peak] ? i : peak;
        }
        assertThat(x).hasSize(1280);
        assertThat(x[0]).isCloseTo(268.94, within(0.005));
        assertThat(x[x.length - 1]).isCloseTo(903.38, within(0.005));
        assertThat(Arrays.stream(measured).filter(v -> v == 0).count()).isEqualTo(168);
        assertThat(Arrays.stream(dark).average().orElseThrow()).isCloseTo(0.0713, within(0.00005));
        assertThat(x[peak]).isCloseTo(523.35, within(0.005));
        assertThat(raw.metadata()).containsEntry("exposure", "10000").containsEntry("gain", "10.0");
    }

    @Test
    void diyExportWithABadCalibrationIsRefusedAtBothTurningPoints() {
        // resolved outside the lambda: a skip thrown inside it would be caught as the wrong exception
        Path badCalibration = SharedFolder.referenceFile(DIY + "Spectrum-20260309--010902.csv");

        ImportException e = catchThrowableOfType(ImportException.class,
                () -> new RawCountsReader().withExposureMs(CaptureRole.SAMPLE, 1).read(badCalibration));

        // SOURCES.md §9: the axis runs 354.9 down, up to 626.2, down to 251.2 nm. The file itself turns at
        // line 27 (351.614689 after 351.612659) and line 418 (626.179283 after 626.186021).
        assertThat(e.line()).isEqualTo(27);
        assertThat(e.problem()).contains("line 27 (351.614689 nm after 351.612659 nm)",
                "line 418 (626.179283 nm after 626.186021 nm)");
    }
}
