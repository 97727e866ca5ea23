package org.spectralsieve.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code import --from/--to} and the manifest's {@code from}/{@code to} columns, against an in-memory library. */
class KeepRangeCommandTest {

    private static final String DB_URL = "jdbc:h2:mem:cli-keep-range-test;DB_CLOSE_DELAY=-1";
    /** 300–800 nm every 100 nm: six points of an invented sheet (illustrative). */
    private static final String SIX_POINTS = "wavelength_nm,T\n300,0.1\n400,0.5\n500,0.8\n600,0.85\n700,0.86\n800,0.87\n";

    private static CliRun cli(String... args) {
        return CliRun.against(DB_URL, args);
    }

    @Test
    void manifestCellsKeepTheirRangeAndTheOptionsFillTheSidesARowLeavesBlank(@TempDir Path dir) throws Exception {
        Files.writeString(dir.resolve("manifest.csv"), """
                file,material,thickness,class,scaling,index_n,from,to
                cut-2mm.csv,Illustrative ranged sheet,2,plastic sheet,bulk,1.5,400,600
                cut-4mm.csv,Illustrative ranged sheet,4,,,,,
                bad-6mm.csv,Illustrative ranged sheet,6,,,,700,400
                """);
        Files.writeString(dir.resolve("cut-2mm.csv"), SIX_POINTS);
        Files.writeString(dir.resolve("cut-4mm.csv"), SIX_POINTS);
        Files.writeString(dir.resolve("bad-6mm.csv"), SIX_POINTS);

        CliRun run = cli("import", dir.toString(), "--to", "700");

        assertThat(run.exitCode()).as(run.out() + run.err()).isEqualTo(SieveCli.FAILED);
        assertThat(run.out()).contains("from 400 nm: 1 point below it left out (at 300 nm)")
                .contains("to 600 nm: 2 points above it left out")
                .as("the second row takes --to 700 and keeps its short end")
                .contains("to 700 nm: 1 point above it left out (at 800 nm)")
                .contains("manifest line 4: 'from': from must be shorter than to")
                .contains("2 stored, 0 already stored, 1 refused");
    }

    @Test
    void fromNotShorterThanToIsAUsageErrorBeforeAnythingIsRead(@TempDir Path dir) throws Exception {
        Files.writeString(dir.resolve("manifest.csv"), "file,material\n");

        CliRun run = cli("import", dir.toString(), "--from", "500", "--to", "400");

        assertThat(run.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(run.err()).contains("--from must be shorter than to");
    }
}
