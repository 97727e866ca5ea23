package org.spectralsieve.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code backup} and {@code restore} run in-process against two H2 file libraries: the demo library backed
 * up, restored into a new database, refused the second time.
 */
class BackupCommandTest {

    private static CliRun cli(String... args) {
        return CliRun.of(args);
    }

    @Test
    void theDemoLibraryIsBackedUpRestoredIntoANewDatabaseAndRefusedWhenThatIsNoLongerEmpty(@TempDir Path dir)
            throws Exception {
        String source = "jdbc:h2:file:" + dir.resolve("source/sieve");
        String target = "jdbc:h2:file:" + dir.resolve("target/sieve");
        Path archive = dir.resolve("library.zip");

        CliRun backup = cli("backup", "--db-url", source, "--to", archive.toString());

        assertThat(backup.exitCode()).as(backup.err()).isEqualTo(SieveCli.OK);
        assertThat(backup.out()).startsWith("wrote " + archive).contains("material: ").contains("curve: ");
        assertThat(Files.size(archive)).isPositive();
        try (var files = Files.list(dir)) {
            assertThat(files.map(p -> p.getFileName().toString())).noneMatch(n -> n.endsWith(".partial"));
        }

        CliRun restore = cli("restore-backup", "--db-url", target, "--from", archive.toString());

        assertThat(restore.exitCode()).as(restore.err()).isEqualTo(SieveCli.OK);
        assertThat(restore.out()).startsWith("restored " + archive);
        String materials = backup.out().lines().filter(l -> l.strip().startsWith("material:")).findFirst().orElseThrow();
        assertThat(restore.out()).contains(materials);

        CliRun again = cli("restore-backup", "--db-url", target, "--from", archive.toString());

        assertThat(again.exitCode()).isEqualTo(SieveCli.FAILED);
        assertThat(again.err()).contains("not restored: the library is not empty");
        assertThat(again.out()).isEmpty();

        CliRun overwrite = cli("backup", "--db-url", target, "--to", archive.toString());

        assertThat(overwrite.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(overwrite.err()).contains("exists");
    }

    @Test
    void aFileThatIsNoArchiveIsRefusedWithExitOne(@TempDir Path dir) throws Exception {
        Path junk = Files.writeString(dir.resolve("library.zip"), "just text");
        String target = "jdbc:h2:file:" + dir.resolve("target/sieve");

        CliRun restore = cli("restore-backup", "--db-url", target, "--from", junk.toString());

        assertThat(restore.exitCode()).isEqualTo(SieveCli.FAILED);
        assertThat(restore.err()).contains("not restored: not a readable zip archive");
        assertThat(restore.out()).isEmpty();
    }
}
