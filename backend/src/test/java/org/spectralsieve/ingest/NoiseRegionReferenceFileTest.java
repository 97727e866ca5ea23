package org.spectralsieve.ingest;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.spectralsieve.testsupport.ReadsSharedFolder;
import org.spectralsieve.testsupport.SharedFolder;

/**
 * The real diode-array file with deep-UV noise, read from ../shared/reference-data (skipped with a message where
 * that folder is absent). Expected values: reference-data/SOURCES.md §2, uv-link.jdx.
 */
@ReadsSharedFolder
class NoiseRegionReferenceFileTest {

    private final FileImport reader = new FileImport(ImportProperties.defaults().maxPoints());

    @Test
    void theDeepUvNoiseOfTheDiodeArrayFileIsFoundLeftOutAndCounted() throws Exception {
        Path f = SharedFolder.referenceFile("jcamp-cheminfo/uv-link.jdx");

        FilePreview p = reader.read(f.getFileName().toString(), Files.readAllBytes(f), ImportOptions.defaults());

        // SOURCES.md §2: 911 points 190–1100 nm, "noisy negative absorbance below 220 nm", y(190) = −0.72973
        KeptRange k = p.keptRange();
        assertThat(k.filePoints()).isEqualTo(911);
        assertThat(k.noiseRegions()).singleElement().satisfies(r -> {
            assertThat(r.end()).isEqualTo(NoiseRegion.End.SHORT);
            assertThat(r.fromNm()).isEqualTo(190.0);
            assertThat(r.toNm()).as("covers the noisy stretch SOURCES.md names").isGreaterThanOrEqualTo(220.0);
            assertThat(r.highest()).as("A = −0.72973 is T = 10^0.72973").isCloseTo(Math.pow(10, 0.72973), within(1e-4));
        });
        NoiseRegion r = k.noiseRegions().get(0);
        assertThat(p.curve().minWavelengthNm()).isEqualTo(r.toNm() + 1);
        assertThat(p.pointCount()).isEqualTo(911 - r.points());
        assertThat(k.suggestedFromNm()).hasValue(r.toNm() + 1);
        assertThat(p.warnings()).anySatisfy(w -> assertThat(w).contains("noise region", "190–", "left out",
                "absorbance -0.73"));
    }

    @Test
    void theMeasuredSheetsHaveNoNoiseRegion() throws Exception {
        for (String name : new String[] {"acrylic-clear-3mm.csv", "polycarbonate-sheet-3mm.csv",
                "longpass-filter-glass-295nm-2mm.csv", "instrument-dark.csv"}) {
            Path f = SharedFolder.measuredSheet(name);

            FilePreview p = reader.read(name, Files.readAllBytes(f), ImportOptions.defaults());

            // SOURCES.md section 8: each 190–1100 nm at 1 nm, 911 points, kept whole
            assertThat(p.keptRange().noiseRegions()).as(name).isEmpty();
            assertThat(p.pointCount()).as(name).isEqualTo(911);
        }
    }
}
