package org.spectralsieve.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code import-spectrum} run in-process against an in-memory library; the spectra are made up. */
class ImportSpectrumCommandTest {

    private static final String DB_URL = "jdbc:h2:mem:cli-import-spectrum-test;DB_CLOSE_DELAY=-1";

    private static CliRun cli(String... args) {
        return CliRun.against(DB_URL, args);
    }

    @Test
    void anEmitterIsStoredOnceAndItsNameIsThenTaken(@TempDir Path dir) throws Exception {
        Path file = dir.resolve("workshop-lamp.csv");
        Files.writeString(file, "wavelength,extraterrestrial,global\n380,1,0.5\n390,2,1\n400,1,0.25\n");

        CliRun first = cli("import-spectrum", "--kind", "emitter", "--name", "workshop-lamp", "--value-column", "global",
                "--provenance", "illustrative bench capture", file.toString());

        assertThat(first.exitCode()).as(first.err()).isEqualTo(SieveCli.OK);
        assertThat(first.out()).startsWith("stored emitter 'workshop-lamp' from workshop-lamp.csv (column 'global'):"
                + " 3 points, 380–400 nm stored, 380–400 nm used");
        assertThat(first.out()).contains("note: values read from column 'global'; columns not read: [extraterrestrial]");

        CliRun again = cli("import-spectrum", "--kind", "emitter", "--name", "workshop-lamp", "--value-column", "2",
                file.toString());

        assertThat(again.exitCode()).isEqualTo(SieveCli.FAILED);
        assertThat(again.err()).contains("not imported: --name:").contains("already exists");
        assertThat(again.out()).isEmpty();
    }

    @Test
    void aBadFileExitsOneNamingLineAndField(@TempDir Path dir) throws Exception {
        Path file = dir.resolve("resist.csv");
        Files.writeString(file, "nm,sensitivity\n350,0.5\n360,-0.1\n");

        CliRun run = cli("import-spectrum", "--kind", "response", "--name", "resist-c", file.toString());

        assertThat(run.exitCode()).isEqualTo(SieveCli.FAILED);
        assertThat(run.err()).contains("not imported: resist.csv line 3, field 'sensitivity': negative value -0.1");
    }

    @Test
    void aBuiltInNameExitsOne(@TempDir Path dir) throws Exception {
        Path file = dir.resolve("flat.csv");
        Files.writeString(file, "nm,weight\n350,1\n360,1\n");

        CliRun run = cli("import-spectrum", "--kind", "response", "--name", "erythema", file.toString());

        assertThat(run.exitCode()).isEqualTo(SieveCli.FAILED);
        assertThat(run.err()).contains("--name:").contains("built-in response");
    }

    @Test
    void badOptionsAreUsageErrors(@TempDir Path dir) throws Exception {
        Path file = dir.resolve("lamp.csv");
        Files.writeString(file, "nm,power\n350,1\n360,1\n");

        CliRun unit = cli("import-spectrum", "--kind", "emitter", "--name", "x-lamp", "--x-unit", "furlong", file.toString());
        CliRun kind = cli("import-spectrum", "--kind", "lamp", "--name", "x-lamp", file.toString());
        CliRun missing = cli("import-spectrum", "--kind", "emitter", "--name", "x-lamp", dir.resolve("none.csv").toString());

        assertThat(unit.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(unit.err()).contains("--x-unit: 'furlong' is not one of nm, um, angstrom, cm-1");
        assertThat(kind.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(kind.err()).contains("emitter, response");
        assertThat(missing.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(missing.err()).contains("is not a file");
    }
}
