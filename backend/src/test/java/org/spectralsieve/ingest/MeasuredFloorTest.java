package org.spectralsieve.ingest;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.requirement.Candidate;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.requirement.SampleEvaluator;
import org.spectralsieve.requirement.Verdict;
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

    @Test
    void aBlockDeeperThanTheFloorIsUnverifiedAndOneAboveItIsMetAsABound() throws Exception {
        Path f = SharedFolder.measuredSheet("acrylic-uv-absorbing-3mm.csv");
        FilePreview p = reader.read(f.getFileName().toString(), Files.readAllBytes(f), ImportOptions.defaults());
        // PMMA n(0.59 µm) = 1.485 (SOURCES.md, the refractiveindex-info PMMA table); 3 mm as measured
        Candidate sheet = new Candidate(1, 1, "UV-absorbing acrylic", p.curve(), 3.0, true, new ConstantIndex(1.485));

        // at 300 nm the sheet reads the floor, 0.01 %T (about OD 4): T is at most that, not equal to it
        var deeper = SampleEvaluator.evaluate(sheet, RequirementParser.parse("blocks to OD 5 or more at 300 nm"));
        var shallower = SampleEvaluator.evaluate(sheet, RequirementParser.parse("blocks to OD 3 or more at 300 nm"));

        assertThat(deeper.verdict()).isEqualTo(Verdict.UNVERIFIED); // before the floor was read: MISSES
        assertThat(shallower.verdict()).isEqualTo(Verdict.MEETS); // T <= 0.01 % proves OD 3
    }
}
