package org.spectralsieve.cli;

import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.OptionalDouble;
import java.util.concurrent.Callable;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.ingest.BatchImport;
import org.spectralsieve.ingest.BatchReport;
import org.spectralsieve.ingest.ImportLimitException;
import org.spectralsieve.ingest.ImportOptions;
import org.springframework.context.ConfigurableApplicationContext;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code import FOLDER-OR-ZIP}: every file its manifest.csv lists, each in its own transaction, with a report. */
@Command(name = "import", description = "Import a folder or a .zip holding manifest.csv (columns file,material,"
        + "thickness,geometry,provenance,instrument,date,notes,from,to; for a new material also class,scaling,index_n,stock,"
        + "made_range; to correct a file x_unit,x_column,y_column,y_kind,decimal_mark; for a JCAMP-DX file with several spectra block or each_block)."
        + " Prints a progress bar on stderr and one report line per file on stdout; exit 1 when any file is refused.")
final class ImportCommand implements Callable<Integer> {

    static final int BAR_WIDTH = 10;

    @Spec
    CommandSpec spec;

    @Mixin
    DatabaseOption database;

    @Parameters(index = "0", paramLabel = "FOLDER-OR-ZIP", description = "A folder or a .zip with manifest.csv at its top.")
    Path source;

    @Option(names = "--from", paramLabel = "NM", description = "Keep only wavelengths from NM up, in every file whose"
            + " manifest row has no 'from' cell (default: the whole axis, without a noise region at its ends).")
    Double fromNm;

    @Option(names = "--to", paramLabel = "NM", description = "Keep only wavelengths up to NM, in every file whose"
            + " manifest row has no 'to' cell.")
    Double toNm;

    @Override
    public Integer call() {
        boolean zip = Files.isRegularFile(source) && source.getFileName().toString().toLowerCase(Locale.ROOT).endsWith(".zip");
        if (!Files.isDirectory(source) && !zip) {
            throw new ParameterException(spec.commandLine(), "'" + source + "' is neither a folder nor a .zip file");
        }
        BatchImport.KeepDefault keep = keepDefault();
        PrintWriter err = spec.commandLine().getErr();
        BatchReport report;
        try (ConfigurableApplicationContext context = LibraryContext.start(database.url)) {
            report = context.getBean(BatchImport.class).run(source, keep,
                    (done, total, file) -> progress(err, done, total, file));
        } catch (ImportException | ImportLimitException e) {
            throw new CliFailure(SieveCli.FAILED, List.of("nothing imported: " + e.getMessage()));
        }
        err.println();
        err.flush();
        table(report).print(spec.commandLine().getOut());
        PrintWriter out = spec.commandLine().getOut();
        out.println(report.count(BatchReport.Outcome.STORED) + " stored, " + report.count(BatchReport.Outcome.DUPLICATE)
                + " already stored, " + report.count(BatchReport.Outcome.REFUSED) + " refused");
        if (!report.notInManifest().isEmpty()) {
            out.println("not in manifest.csv, not imported: " + String.join(", ", report.notInManifest()));
        }
        out.flush();
        return report.allStored() ? SieveCli.OK : SieveCli.FAILED;
    }

    /** {@code --from}/{@code --to}, refused before anything is opened when they cannot be a range. */
    private BatchImport.KeepDefault keepDefault() {
        try {
            ImportOptions.defaults().withKeepRange(optional(fromNm), optional(toNm));
        } catch (IllegalArgumentException e) {
            throw new ParameterException(spec.commandLine(), "--" + e.getMessage());
        }
        return new BatchImport.KeepDefault(optional(fromNm), optional(toNm));
    }

    private static OptionalDouble optional(Double v) {
        return v == null ? OptionalDouble.empty() : OptionalDouble.of(v);
    }

    /** Redrawn in place with a carriage return; the bar is as long on a log file as on a terminal. */
    static String bar(int done, int total) {
        int filled = total == 0 ? BAR_WIDTH : done * BAR_WIDTH / total;
        return "[" + "#".repeat(filled) + ".".repeat(BAR_WIDTH - filled) + "] " + done + "/" + total;
    }

    private static void progress(PrintWriter err, int done, int total, String file) {
        err.print("\r" + bar(done, total) + (file.isEmpty() ? "" : " " + file));
        err.flush();
    }

    static TextTable table(BatchReport report) {
        TextTable table = new TextTable(List.of(">line", "file", "outcome", "material", ">sample"));
        for (BatchReport.FileReport f : report.files()) {
            List<String> details = new ArrayList<>();
            if (f.message() != null) {
                details.add(f.message());
            }
            f.warnings().forEach(w -> details.add("note: " + w));
            table.add(List.of(String.valueOf(f.line()), f.file(), f.outcome().name().toLowerCase(Locale.ROOT),
                    f.material() == null ? Numbers.NONE : f.material(),
                    f.sampleIds().isEmpty() ? Numbers.NONE
                            : String.join(",", f.sampleIds().stream().map(String::valueOf).toList())), details);
        }
        return table;
    }
}
