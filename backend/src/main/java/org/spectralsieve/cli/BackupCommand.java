package org.spectralsieve.cli;

import java.io.IOException;
import java.io.OutputStream;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.concurrent.Callable;
import org.spectralsieve.backup.LibraryBackup;
import org.springframework.context.ConfigurableApplicationContext;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Spec;

/** {@code backup --to FILE}: the whole library into one archive (see docs/backup.md). */
@Command(name = "backup", description = "Write the whole library (materials, samples, curves, original files, imported"
        + " emitters and responses) to one zip archive with a manifest of checksums. The file appears only when"
        + " it is complete; an existing file is not overwritten.")
final class BackupCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    DatabaseOption database;

    @Option(names = "--to", required = true, paramLabel = "FILE", description = "The archive to write, e.g. library.zip.")
    Path target;

    @Override
    public Integer call() {
        if (Files.exists(target)) {
            throw new ParameterException(spec.commandLine(), "'" + target + "' exists; give a new file name");
        }
        Path folder = target.toAbsolutePath().getParent();
        if (folder == null || !Files.isDirectory(folder)) {
            throw new ParameterException(spec.commandLine(), "the folder of '" + target + "' does not exist");
        }
        LibraryBackup.Summary summary;
        Path partial = null;
        try (ConfigurableApplicationContext context = LibraryContext.start(database.url)) {
            // written beside the target and renamed at the end, so a failed backup leaves no file that looks whole
            partial = Files.createTempFile(folder, ".backup-", ".partial");
            try (OutputStream out = Files.newOutputStream(partial)) {
                summary = context.getBean(LibraryBackup.class).write(out);
            }
            Files.move(partial, target, StandardCopyOption.ATOMIC_MOVE);
        } catch (IOException e) {
            throw new CliFailure(SieveCli.FAILED, "cannot write " + target + ": " + e.getMessage());
        } finally {
            deleteQuietly(partial);
        }
        PrintWriter out = spec.commandLine().getOut();
        out.println("wrote " + target + " (schema version " + summary.schemaVersion() + ", " + summary.curves() + " curves)");
        summary.tables().forEach(t -> out.println("  " + t.table() + ": " + t.rows() + " rows"));
        out.flush();
        return SieveCli.OK;
    }

    private static void deleteQuietly(Path partial) {
        if (partial != null) {
            try {
                Files.deleteIfExists(partial);
            } catch (IOException ignored) {
                // a stray .partial file is named as such; nothing depends on it
            }
        }
    }
}
