package org.spectralsieve.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spectralsieve.api.Zips;

/** {@code import} run in-process on temporary folders and zips, against an in-memory library. */
class ImportCommandTest {

    private static final String DB_URL = "jdbc:h2:mem:cli-import-test;DB_CLOSE_DELAY=-1";
    private static final String CURVE = "wavelength_nm,T\n300,0.3\n400,0.7\n";

    private static CliRun cli(String... args) {
        return CliRun.against(DB_URL, args);
    }

    private static void write(Path dir, String name, String text) throws Exception {
        Files.writeString(dir.resolve(name), text, StandardCharsets.UTF_8);
    }

    @Test
    void folderWithOneBadFileExitsOneReportingEveryRowAndAgainReportsDuplicates(@TempDir Path dir) throws Exception {
        write(dir, "manifest.csv", """
                file,material,thickness,geometry,provenance,instrument,date,notes,class,scaling
                sheet-2mm.csv,Illustrative folder sheet,2,regular,measured,bench,2026-03-02,,plastic sheet,bulk
                sheet-4mm.csv,Illustrative folder sheet,4,,,,,,,
                broken.csv,Illustrative folder sheet,5,,,,,,,
                """);
        write(dir, "sheet-2mm.csv", CURVE);
        write(dir, "sheet-4mm.csv", "wavelength_nm,T\n300,0.1\n400,0.5\n");
        write(dir, "broken.csv", "wavelength_nm,T\n300,0.1\n400,half\n");

        CliRun first = cli("import", dir.toString());

        assertThat(first.exitCode()).as(first.err()).isEqualTo(SieveCli.FAILED);
        List<String> lines = first.out().lines().toList();
        assertThat(lines.get(0)).startsWith("line").contains("file", "outcome", "material", "sample");
        assertThat(lines).anySatisfy(l -> assertThat(l).contains("sheet-2mm.csv", "stored"));
        assertThat(lines).anySatisfy(l -> assertThat(l).contains("broken.csv", "refused"));
        assertThat(first.out()).contains("broken.csv line 3, field 'T'").contains("2 stored, 0 already stored, 1 refused");
        assertThat(first.err()).contains("[##########] 3/3");

        Files.delete(dir.resolve("broken.csv"));
        Files.writeString(dir.resolve("manifest.csv"), Files.readString(dir.resolve("manifest.csv")).replace(
                "broken.csv,Illustrative folder sheet,5,,,,,,,\n", ""));
        CliRun again = cli("import", dir.toString());

        assertThat(again.exitCode()).as(again.out() + again.err()).isEqualTo(SieveCli.OK);
        assertThat(again.out()).contains("0 stored, 2 already stored, 0 refused");
    }

    @Test
    void aManifestRowStatesTheThicknessesANewFilmIsMadeIn(@TempDir Path dir) throws Exception {
        write(dir, "manifest.csv", """
                file,material,thickness,geometry,provenance,class,scaling,stock,made_range
                film-50um.csv,Illustrative manifest film,0.05,regular,measured,film,bulk,25 50 125 um,25-125 um
                """);
        write(dir, "film-50um.csv", CURVE);

        CliRun imported = cli("import", dir.toString());
        assertThat(imported.exitCode()).as(imported.out() + imported.err()).isEqualTo(SieveCli.OK);

        CliRun listed = cli("materials", "--q", "Illustrative manifest film");
        assertThat(listed.out()).contains("25–125 µm, stock 25, 50, 125 µm");
    }

    @Test
    void zipWithAPathOutsideItExitsOneAndImportsNothing(@TempDir Path dir) throws Exception {
        Path zip = dir.resolve("slip.zip");
        Files.write(zip, Zips.of("manifest.csv", "file,material,thickness\n../evil.csv,x,1\n", "../evil.csv", CURVE));

        CliRun run = cli("import", zip.toString());

        assertThat(run.exitCode()).isEqualTo(SieveCli.FAILED);
        assertThat(run.err()).contains("nothing imported").contains("../evil.csv");
        assertThat(run.out()).isEmpty();
    }

    @Test
    void pathThatIsNeitherFolderNorZipIsAUsageError(@TempDir Path dir) {
        CliRun run = cli("import", dir.resolve("absent").toString());

        assertThat(run.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(run.err()).contains("neither a folder nor a .zip");
    }

    @Test
    void importIsACommandLineEntryWord() {
        assertThat(SieveCli.handles(new String[] {"import", "batch.zip"})).isTrue();
    }

    @Test
    void progressBarFillsInTenths() {
        assertThat(ImportCommand.bar(0, 40)).isEqualTo("[..........] 0/40");
        assertThat(ImportCommand.bar(12, 40)).isEqualTo("[###.......] 12/40");
        assertThat(ImportCommand.bar(40, 40)).isEqualTo("[##########] 40/40");
    }
}
