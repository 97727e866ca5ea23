package org.spectralsieve.ingest;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.OptionalInt;
import org.junit.jupiter.api.Test;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.testsupport.ReadsSharedFolder;
import org.spectralsieve.testsupport.SharedFolder;

/**
 * The multi-block JCAMP-DX files of ../shared/reference-data (never copied in; skipped with a message where
 * the folder is absent). Expected values: reference-data/SOURCES.md §1 (blckpac1.jdx), §2 (uv-link.jdx) and
 * §3 (example_compound_file.jdx); absorbance becomes T = 10^−A (IUPAC Gold Book A00028) and a wavenumber
 * becomes λ = 10⁷/ν̃ nm (definition of the wavenumber in cm⁻¹).
 */
@ReadsSharedFolder
class ReferenceBlocksTest {

    private final FileImport reader = new FileImport(ImportProperties.defaults().maxPoints());

    private static final ImportOptions EACH = ImportOptions.defaults().withBlocks(OptionalInt.empty(), true);

    private FilePreview preview(Path f, ImportOptions options) throws Exception {
        return reader.read(f.getFileName().toString(), Files.readAllBytes(f), options);
    }

    @Test
    void theTimeSeriesPreviewListsItsFiveBlocksAndTakesTheFirst() throws Exception {
        FilePreview p = preview(SharedFolder.referenceFile("jcamp-lancashire/blckpac1.jdx"), ImportOptions.defaults());

        // SOURCES.md §1 blckpac1: LINK with five blocks t1..t5, 176 points each, 700→350 nm, YUNITS A
        assertThat(p.blocks()).extracting(FileBlock::number).containsExactly(1, 2, 3, 4, 5);
        for (int i = 0; i < 5; i++) {
            FileBlock b = p.blocks().get(i);
            assertThat(b.title()).endsWith("(t" + (i + 1) + ")");
            assertThat(b.points()).isEqualTo(176);
            assertThat(b.fromNm()).isEqualTo(350.0);
            assertThat(b.toNm()).isEqualTo(700.0);
            assertThat(b.xUnits()).isEqualTo("nm");
            assertThat(b.yUnits()).isEqualTo("A");
            assertThat(b.readable()).isTrue();
        }
        assertThat(p.blocks()).extracting(FileBlock::taken).containsExactly(true, false, false, false, false);
    }

    @Test
    void eachBlockOfTheTimeSeriesIsReadAsItsOwnCurveWithTheSourcesValues() throws Exception {
        Path f = SharedFolder.referenceFile("jcamp-lancashire/blckpac1.jdx");

        List<FilePreview> blocks = reader.readEachBlock(f.getFileName().toString(), Files.readAllBytes(f), EACH);

        assertThat(blocks).hasSize(5);
        // SOURCES.md §1: block 1 y(350) = 0.193442, y(700) = −0.006136; block 5 y(350) = 0.176864, y(700) = −0.009105
        assertT(blocks.get(0).curve(), 350, 0.193442);
        assertT(blocks.get(0).curve(), 700, -0.006136);
        assertT(blocks.get(4).curve(), 350, 0.176864);
        assertT(blocks.get(4).curve(), 700, -0.009105);
        assertThat(blocks).allSatisfy(b -> assertThat(b.warnings()).noneMatch(w -> w.contains("left out")));
    }

    @Test
    void theCompoundFileListsTwoUntitledBlocksWithTheirRangeInNanometres() throws Exception {
        FilePreview p = preview(SharedFolder.referenceFileNamed("example_compound_file.jdx"), ImportOptions.defaults());

        // SOURCES.md §3: LINK with 2 NIR absorbance blocks, 11995.21→3999.69 cm⁻¹ (≈833.7–2500.2 nm), 2074 points, titles empty
        assertThat(p.blocks()).hasSize(2).allSatisfy(b -> {
            assertThat(b.title()).isEmpty();
            assertThat(b.points()).isEqualTo(2074);
            assertThat(b.fromNm()).isCloseTo(1e7 / 11995.21, within(1e-9));
            assertThat(b.toNm()).isCloseTo(1e7 / 3999.691, within(1e-9));
            assertThat(b.xUnits()).isEqualTo("1/CM");
            assertThat(b.yUnits()).isEqualTo("ABSORBANCE");
        });
        assertThat(p.warnings()).anySatisfy(w -> assertThat(w).contains("2 spectra", "Imported block 1 only"));
    }

    @Test
    void theCompoundFilesSecondBlockIsReadWhenChosen() throws Exception {
        FilePreview p = preview(SharedFolder.referenceFileNamed("example_compound_file.jdx"),
                ImportOptions.defaults().withBlocks(OptionalInt.of(2), false));

        // SOURCES.md §3 block 2: y0 = 0.193928 (at 11995.21 cm⁻¹, the shortest wavelength), y(last) = 1.17382
        Curve c = p.curve();
        assertThat(c.transmittance(0)).isCloseTo(Math.pow(10, -0.193928), within(2e-6));
        assertThat(c.transmittance(c.size() - 1)).isCloseTo(Math.pow(10, -1.17382), within(2e-6));
        assertThat(p.blocks()).extracting(FileBlock::taken).containsExactly(false, true);
    }

    @Test
    void theDiodeArrayFilesVarianceBlockIsListedAsNoTransmittanceAndEachBlockIsRefused() throws Exception {
        Path f = SharedFolder.referenceFile("jcamp-cheminfo/uv-link.jdx");

        FilePreview p = preview(f, ImportOptions.defaults());

        // SOURCES.md §2 uv-link: block 1 absorbance, block 2 the variance on the same x
        assertThat(p.blocks()).extracting(FileBlock::yUnits).containsExactly("ABSORBANCE", "VARIANCE");
        assertThat(p.blocks().get(0).readable()).isTrue();
        assertThat(p.blocks().get(1).problem()).contains("VARIANCE");
        byte[] bytes = Files.readAllBytes(f);
        assertThatThrownBy(() -> reader.readEachBlock("uv-link.jdx", bytes, EACH)).isInstanceOf(ImportException.class)
                .hasMessageContaining("block 2").hasMessageContaining("readable block [1]");
    }

    private static void assertT(Curve c, double nm, double absorbance) {
        // the file's y to 6 decimals: ±5e-7 in A is about ±1.2e-6 relative in T
        assertThat(c.transmittanceAt(nm).getAsDouble()).as("T at %s nm", nm)
                .isCloseTo(Math.pow(10, -absorbance), within(2e-6));
    }
}
