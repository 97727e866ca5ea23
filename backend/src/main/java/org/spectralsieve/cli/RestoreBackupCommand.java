package org.spectralsieve.cli;

import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import org.spectralsieve.backup.ArchiveRefusedException;
import org.spectralsieve.backup.LibraryNotEmptyException;
import org.spectralsieve.backup.LibraryRestore;
import org.spectralsieve.backup.RestoreFailedException;
import org.springframework.context.ConfigurableApplicationContext;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Spec;

/**
 * {@code restore-backup --from FILE}: an archive into an empty library. The demo library is not loaded into the
 * target first (as a server start would), so a new database stays empty for the restore.
 */
@Command(name = "restore-backup", description = "Load a backup archive into an empty library: every checksum is checked"
        + " before anything is written, and the rows go in in one transaction (all or nothing). Exit 1 when the"
        + " library is not empty or the archive is refused.")
final class RestoreBackupCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    DatabaseOption database;

    @Option(names = "--from", required = true, paramLabel = "FILE", description = "The archive written by backup.")
    Path source;

    @Override
    public Integer call() {
        if (!Files.isRegularFile(source)) {
            throw new ParameterException(spec.commandLine(), "'" + source + "' is not a file");
        }
        LibraryRestore.Summary summary;
        try (ConfigurableApplicationContext context = LibraryContext.start(database.url,
                List.of("--sieve.seed.load-on-empty=false"))) {
            summary = context.getBean(LibraryRestore.class).restore(source);
        } catch (LibraryNotEmptyException e) {
            throw new CliFailure(SieveCli.FAILED, List.of("not restored: " + e.getMessage(),
                    "Restore into a new database (--db-url), or into one the server has not filled: start it once"
                            + " with --sieve.seed.load-on-empty=false, or use this command before the first start."));
        } catch (ArchiveRefusedException | RestoreFailedException e) {
            throw new CliFailure(SieveCli.FAILED, "not restored: " + e.getMessage());
        }
        PrintWriter out = spec.commandLine().getOut();
        out.println("restored " + source + " (schema version " + summary.schemaVersion() + ", " + summary.curves()
                + " curves checked)");
        summary.rowsByTable().forEach((table, rows) -> out.println("  " + table + ": " + rows + " rows"));
        out.flush();
        return SieveCli.OK;
    }
}
