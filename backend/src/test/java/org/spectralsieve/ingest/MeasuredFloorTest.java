package org.spectralsieve.ingest;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.spectralsieve.testsupport.ReadsSharedFolder;
import org.spectralsieve.testsupport.SharedFolder;

/**
 * The floor of a real measured file, read from ../shared/reference-data (never copied in; skipped with
 * a message where absent). SOURCES.md §8: "the instrument floor appears as the constant 0.0100000…",
 * and the UV-absorbing acrylic sheet reads 0.01 %T at 300 nm.
 */
@ReadsSharedFolder
class MeasuredFloorTest {

    private final FileImport reader = new FileImport(ImportProperties.defaults().maxPoints());

    @Test
    void theUvAbsorbingAcrylicSheetImportsWithItsFloorAsTheDetectionLimit() throws Exception {
        Path f = SharedFolder.measuredSheet("acrylic-uv-absorbing-3mm.csv");

        FilePreview p = reader.read(f.getFileName().toString(), Files.readAllBytes(f), ImportOptions.defaults());

        assertThat(p.detectionLimit()).isCloseTo(0.0001, within(1e-9));
        assertThat(p.curve().belowDetection(300 - 190)).isTrue(); // T300 = 0.01 % in SOURCES.md §8
        assertThat(p.curve().belowDetection(400 - 190)).isFalse(); // T400 = 86.69 %
        assertThat(p.warnings()).anySatisfy(w -> assertThat(w).contains("instrument floor").contains("190–"));
    }
}
