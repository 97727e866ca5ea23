package org.spectralsieve.ingest;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.OptionalInt;
import org.junit.jupiter.api.Test;
import org.spectralsieve.importers.ImportException;

/** The preview lists a JCAMP-DX file's blocks, and the block options choose among them; generated files. */
class JcampBlockChoiceTest {

    private final FileImport reader = new FileImport(ImportProperties.defaults().maxPoints());

    private static byte[] bytes(String text) {
        return text.getBytes(StandardCharsets.UTF_8);
    }

    private static ImportOptions block(int n) {
        return ImportOptions.defaults().withBlocks(OptionalInt.of(n), false);
    }

    private static ImportOptions each() {
        return ImportOptions.defaults().withBlocks(OptionalInt.empty(), true);
    }

    @Test
    void thePreviewListsEveryBlockWithNumberTitlePointsRangeAndUnitsAndTakesTheFirst() throws ImportException {
        FilePreview p = reader.read("series.jdx", bytes(JcampSeries.twoBlocks()), ImportOptions.defaults());

        assertThat(p.blocks()).containsExactly(
                new FileBlock(1, "amber film, unexposed", 3, 300.0, 400.0, "NANOMETERS", "ABSORBANCE", true, null),
                new FileBlock(2, "amber film, 10 min under the 365 nm lamp", 4, 300.0, 500.0, "NANOMETERS", "ABSORBANCE",
                        false, null));
        assertThat(p.pointCount()).isEqualTo(3);
        assertThat(p.warnings()).anySatisfy(w -> assertThat(w).contains("Imported block 1 only", "block 2 '"));
    }

    @Test
    void choosingBlockTwoReadsItsCurveAndMarksItTaken() throws ImportException {
        FilePreview p = reader.read("series.jdx", bytes(JcampSeries.twoBlocks()), block(2));

        assertThat(p.blocks()).extracting(FileBlock::taken).containsExactly(false, true);
        assertThat(p.pointCount()).isEqualTo(4);
        // A = 1 at 400 nm is T = 10^-1 (A = -log10 T, IUPAC Gold Book A00028)
        assertThat(p.curve().transmittanceAt(400).getAsDouble()).isCloseTo(0.1, within(1e-12));
        assertThat(p.warnings()).anySatisfy(w -> assertThat(w).contains("Imported block 2 only", "left out"));
    }

    @Test
    void anUnknownBlockNumberIsRefusedNamingTheParameterAndTheBlocksThatExist() {
        assertThatThrownBy(() -> reader.read("series.jdx", bytes(JcampSeries.twoBlocks()), block(7)))
                .isInstanceOfSatisfying(ImportRequestException.class, e -> assertThat(e.field()).isEqualTo("block"))
                .hasMessageContaining("block 7 is not a spectrum of series.jdx")
                .hasMessageContaining("block 1 'amber film, unexposed', block 2 'amber film, 10 min under the 365 nm lamp'");
    }

    @Test
    void theLinkBlockZeroHoldsNoSpectrumAndIsRefusedAsABlockChoice() {
        assertThatThrownBy(() -> reader.read("series.jdx", bytes(JcampSeries.twoBlocks()), block(0)))
                .isInstanceOfSatisfying(ImportRequestException.class, e -> assertThat(e.field()).isEqualTo("block"))
                .hasMessageContaining("2 blocks with data are block 1");
    }

    @Test
    void aBlockOptionOnADelimitedFileIsRefusedNotIgnored() {
        assertThatThrownBy(() -> reader.read("sheet.csv", bytes(ImportFiles.percentCsv()), block(1)))
                .isInstanceOfSatisfying(ImportRequestException.class, e -> assertThat(e.field()).isEqualTo("block"))
                .hasMessageContaining("only a JCAMP-DX file holds blocks");
        assertThatThrownBy(() -> reader.read("sheet.csv", bytes(ImportFiles.percentCsv()), each()))
                .isInstanceOfSatisfying(ImportRequestException.class, e -> assertThat(e.field()).isEqualTo("eachBlock"));
    }

    @Test
    void aSingleSpectrumFileListsItsOneBlockWithoutAWarning() throws ImportException {
        FilePreview p = reader.read("film.jdx", bytes(ImportFiles.jcamp()), ImportOptions.defaults());

        assertThat(p.blocks()).singleElement().satisfies(b -> {
            assertThat(b.number()).isZero();
            assertThat(b.taken()).isTrue();
            assertThat(b.points()).isEqualTo(5);
        });
        assertThat(p.warnings()).noneMatch(w -> w.contains("left out"));
    }

    @Test
    void aBlockThatCannotBeATransmittanceIsListedWithWhy() throws ImportException {
        String file = JcampSeries.link(List.of(JcampSeries.unexposed(), JcampSeries.variance()));

        FilePreview p = reader.read("series.jdx", bytes(file), ImportOptions.defaults());

        assertThat(p.blocks().get(0).readable()).isTrue();
        assertThat(p.blocks().get(1).problem()).contains("##YUNITS", "VARIANCE");
    }

    @Test
    void theEachBlockPreviewTakesEveryBlockAndLeavesNoneOut() throws ImportException {
        FilePreview p = reader.read("series.jdx", bytes(JcampSeries.twoBlocks()), each());

        assertThat(p.blocks()).allMatch(FileBlock::taken);
        assertThat(p.warnings()).noneMatch(w -> w.contains("left out"));
        assertThat(p.warnings()).anySatisfy(w -> assertThat(w).contains("each of the file's 2 blocks would be stored"));
    }

    @Test
    void theEachBlockPreviewSaysAnImportWouldBeRefusedAndWhy() throws ImportException {
        String file = JcampSeries.link(List.of(JcampSeries.unexposed(), JcampSeries.variance(), JcampSeries.exposed()));

        FilePreview p = reader.read("series.jdx", bytes(file), each());

        assertThat(p.warnings()).anySatisfy(w -> assertThat(w).contains("an import with eachBlock would be refused",
                "block 2 'amber film, variance of the scans' cannot be read as a transmittance curve",
                "readable blocks [1, 3]"));
    }

    @Test
    void readingEachBlockGivesOneCurvePerBlockWithoutALeftOutWarning() throws ImportException {
        List<FilePreview> all = reader.readEachBlock("series.jdx", bytes(JcampSeries.twoBlocks()), each());

        assertThat(all).extracting(FilePreview::pointCount).containsExactly(3, 4);
        assertThat(all).extracting(p -> p.block().orElseThrow().number()).containsExactly(1, 2);
        // A = 0.5 at 350 nm in block 1 is T = 10^-0.5 (IUPAC Gold Book A00028)
        assertThat(all.get(0).curve().transmittanceAt(350).getAsDouble()).isCloseTo(Math.pow(10, -0.5), within(1e-12));
        assertThat(all).allSatisfy(p -> assertThat(p.warnings()).noneMatch(w -> w.contains("left out")));
    }

    @Test
    void readingEachBlockIsRefusedWholeWhenOneBlockIsNoTransmittance() {
        String file = JcampSeries.link(List.of(JcampSeries.unexposed(), JcampSeries.variance()));

        assertThatThrownBy(() -> reader.readEachBlock("series.jdx", bytes(file), each()))
                .isInstanceOf(ImportException.class)
                .hasMessageContaining("eachBlock stores every block or none")
                .hasMessageContaining("block 2 'amber film, variance of the scans' cannot be read")
                .hasMessageContaining("Import the readable block [1] one at a time with the block option");
    }
}
