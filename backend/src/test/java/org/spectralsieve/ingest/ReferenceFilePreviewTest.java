package org.spectralsieve.ingest;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.spectralsieve.importers.YKind;
import org.spectralsieve.testsupport.ReadsSharedFolder;
import org.spectralsieve.testsupport.SharedFolder;

/**
 * Real files by other people, read from ../shared/reference-data beside the repository (never copied
 * in); skipped with a message where that folder is absent. Expected values: reference-data/SOURCES.md.
 */
@ReadsSharedFolder
class ReferenceFilePreviewTest {

    private final FileImport reader = new FileImport(ImportProperties.defaults().maxPoints());

    @Test
    void measuredAcrylicCsvPreviewsAsDelimitedPercentWithSourcesValues() throws Exception {
        Path f = SharedFolder.measuredSheet("acrylic-clear-3mm.csv");

        FilePreview p = reader.read(f.getFileName().toString(), Files.readAllBytes(f), ImportOptions.defaults());

        // SOURCES.md section 8, acrylic-clear-3mm.csv: 190–1100 nm at 1 nm (911 points), T400 = 91.01 %
        assertThat(p.format()).isEqualTo(ImportFormat.DELIMITED);
        assertThat(p.yKind()).isEqualTo(YKind.TRANSMITTANCE_PERCENT);
        assertThat(p.pointCount()).isEqualTo(911);
        assertThat(p.curve().transmittance(400 - 190)).isCloseTo(0.9101, within(0.00005));
    }

    @Test
    void jcampUvFilePreviewsByContentWithItsPointCount() throws Exception {
        Path f = SharedFolder.referenceFile("jcamp-cheminfo/uv.jdx");
        ImportOptions percent = new ImportOptions(null, Optional.of(YKind.TRANSMITTANCE_PERCENT), null, null, false,
                null, null, null);

        FilePreview p = reader.read("uv-upload.txt", Files.readAllBytes(f), percent);

        // SOURCES.md §2 uv.jdx: 501 points from 300 to 800 nm
        assertThat(p.format()).isEqualTo(ImportFormat.JCAMP_DX);
        assertThat(p.pointCount()).isEqualTo(501);
        assertThat(p.curve().minWavelengthNm()).isEqualTo(300.0);
        assertThat(p.curve().maxWavelengthNm()).isEqualTo(800.0);
    }

    @Test
    void jcampTimeSeriesPreviewWarnsThatFourOfItsFiveSpectraAreLeftOut() throws Exception {
        Path f = SharedFolder.referenceFile("jcamp-lancashire/blckpac1.jdx");

        FilePreview p = reader.read(f.getFileName().toString(), Files.readAllBytes(f), ImportOptions.defaults());

        // SOURCES.md §1 blckpac1: five blocks of a time series, 176 points each; the first is read
        assertThat(p.pointCount()).isEqualTo(176);
        assertThat(p.warnings()).anySatisfy(w -> assertThat(w).contains("5 spectra", "Imported block 1 only",
                "the other 4 were left out"));
    }

    @Test
    void jcampTransmittanceWithNegativeNoiseImportsWholeWithItsNegativePointsAsBelowDetection() throws Exception {
        Path f = SharedFolder.referenceFile("jcamp-lancashire/xyinc1.jdx");

        FilePreview p = reader.read(f.getFileName().toString(), Files.readAllBytes(f), ImportOptions.defaults());

        // SOURCES.md, xyinc1.jdx: 3601 points, T from -0.0023 (negative) to 0.7945; no point is dropped
        assertThat(p.pointCount()).isEqualTo(3601);
        assertThat(p.warnings()).anySatisfy(w -> assertThat(w).contains("readings below 0 %T")
                .contains("noise around the floor"));
        double lowestKept = Arrays.stream(p.curve().transmittances()).min().orElseThrow();
        assertThat(lowestKept).as("every negative reading became a bound, none a negative T").isGreaterThanOrEqualTo(0);
    }
}
