package org.spectralsieve.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spectralsieve.ingest.JcampSeries;

/**
 * {@code preview} (a dry run that opens no library) and the block columns of {@code import}, in-process on
 * generated JCAMP-DX series.
 */
class PreviewCommandTest {

    private static final String DB_URL = "jdbc:h2:mem:cli-preview-test;DB_CLOSE_DELAY=-1";

    private static CliRun cli(String... args) {
        return CliRun.of(args);
    }

    private static Path series(Path dir, String text) throws Exception {
        Path file = dir.resolve("series.jdx");
        Files.writeString(file, text, StandardCharsets.UTF_8);
        return file;
    }

    @Test
    void thePreviewPrintsOneLinePerBlockWithTheTakenOneAndTheLeftOutWarning(@TempDir Path dir) throws Exception {
        CliRun run = cli("preview", series(dir, JcampSeries.twoBlocks()).toString());

        assertThat(run.exitCode()).as(run.err()).isEqualTo(SieveCli.OK);
        List<String> lines = run.out().lines().toList();
        assertThat(lines.get(0)).isEqualTo("series.jdx: jcamp-dx, 3 points, 300–400 nm, written as absorbance,"
                + " detection limit 0");
        assertThat(lines.get(1)).contains("block", "title", "points", "range nm", "x units", "y units", "import");
        assertThat(lines.get(2)).contains("1", "amber film, unexposed", "3", "300–400", "NANOMETERS", "ABSORBANCE")
                .endsWith("taken");
        assertThat(lines.get(3)).contains("2", "amber film, 10 min under the 365 nm lamp", "300–500").endsWith("left out");
        assertThat(run.out()).contains("note: the file holds 2 spectra", "Imported block 1 only");
    }

    @Test
    void eachBlockMarksEveryBlockTakenAndNamesABlockThatCannotBeStored(@TempDir Path dir) throws Exception {
        Path file = series(dir, JcampSeries.link(List.of(JcampSeries.unexposed(), JcampSeries.variance())));

        CliRun run = cli("preview", "--each-block", file.toString());

        assertThat(run.exitCode()).as(run.err()).isEqualTo(SieveCli.OK);
        assertThat(run.out().lines().filter(l -> l.endsWith("taken"))).hasSize(2);
        assertThat(run.out()).contains("not a transmittance curve: series.jdx line", "VARIANCE")
                .contains("note: an import with eachBlock would be refused");
    }

    @Test
    void anUnknownBlockExitsOneNamingTheOptionAndTheBlocks(@TempDir Path dir) throws Exception {
        CliRun run = cli("preview", "--block", "5", series(dir, JcampSeries.twoBlocks()).toString());

        assertThat(run.exitCode()).isEqualTo(SieveCli.FAILED);
        assertThat(run.err()).contains("would be refused: --block: block 5 is not a spectrum of series.jdx",
                "block 1 'amber film, unexposed'");
        assertThat(run.out()).isEmpty();
    }

    @Test
    void aBlockNumberThatIsNoNumberIsAUsageError(@TempDir Path dir) throws Exception {
        CliRun run = cli("preview", "--block", "first", series(dir, JcampSeries.twoBlocks()).toString());

        assertThat(run.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(run.err()).contains("--block:", "'first' is not a block number");
    }

    @Test
    void aManifestRowWithEachBlockStoresAndListsEveryBlocksSample(@TempDir Path dir) throws Exception {
        series(dir, JcampSeries.twoBlocks());
        Files.writeString(dir.resolve("manifest.csv"), """
                file,material,thickness,class,scaling,each_block
                series.jdx,Illustrative CLI amber film,0.1,film,fixed,true
                """, StandardCharsets.UTF_8);

        CliRun run = cli("import", dir.toString(), "--db-url", DB_URL);

        assertThat(run.exitCode()).as(run.out() + run.err()).isEqualTo(SieveCli.OK);
        assertThat(run.out()).containsPattern("series\\.jdx\\s+stored\\s+illustrative-cli-amber-film\\s+\\d+,\\d+");
        assertThat(run.out()).contains("1 stored, 0 already stored, 0 refused");
    }

    /** An illustrative capture of a workshop's amber film, %T with a header, 300–400 nm in 10 nm steps. */
    private static Path capture(Path dir) throws Exception {
        StringBuilder text = new StringBuilder("wavelength_nm,transmittance_percent\n");
        for (int nm = 300; nm <= 400; nm += 10) {
            text.append(nm).append(',').append(20 + (nm - 300) / 2).append('\n');
        }
        Path file = dir.resolve("amber-film.csv");
        Files.writeString(file, text, StandardCharsets.UTF_8);
        return file;
    }

    @Test
    void theKeepRangeAndAStatedUncertaintyShowInThePreview(@TempDir Path dir) throws Exception {
        CliRun run = cli("preview", "--from", "320", "--to", "380", "--uncertainty", "0.5%T", capture(dir).toString());

        assertThat(run.exitCode()).as(run.err()).isEqualTo(SieveCli.OK);
        // 300..400 in 10 nm steps is 11 points; keeping 320..380 leaves 7 and leaves out 2 on each side
        assertThat(run.out()).contains("7 points, 320–380 nm", "kept 320–380 nm of the file's 300–400 nm",
                "2 points left out below, 2 above", "measurement uncertainty: stated: ");
    }

    @Test
    void aKeepRangeTheWrongWayRoundIsAUsageErrorNamingTheOption(@TempDir Path dir) throws Exception {
        CliRun run = cli("preview", "--from", "380", "--to", "320", capture(dir).toString());

        assertThat(run.exitCode()).isEqualTo(2);
        assertThat(run.err()).contains("--from");
    }

    @Test
    void aFileWithoutUncertaintySaysSo(@TempDir Path dir) throws Exception {
        CliRun run = cli("preview", capture(dir).toString());

        assertThat(run.out()).contains("measurement uncertainty: none");
    }
}
