package org.spectralsieve.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import java.util.concurrent.Callable;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.ingest.ImportLimitException;
import org.spectralsieve.ingest.ImportRequestException;
import org.spectralsieve.ingest.IngestException;
import org.spectralsieve.spectra.ImportedSpectrum;
import org.spectralsieve.spectra.ReferenceSpectrum;
import org.spectralsieve.spectra.SpectrumImportOptions;
import org.spectralsieve.spectra.SpectrumImportService;
import org.spectralsieve.spectra.SpectrumKind;
import org.springframework.context.ConfigurableApplicationContext;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code import-spectrum --kind emitter --name NAME FILE}: one source or response spectrum into the library,
 * usable by name in the figures afterwards, as {@code POST /api/emitters} and {@code /api/responses} do.
 */
@Command(name = "import-spectrum", description = "Import a light source (--kind emitter: relative power) or a"
        + " response (--kind response: relative weights) from a delimited text or JCAMP-DX file of wavelength and"
        + " value. Values are kept as written; negative values are refused. Prints what was stored; exit 1 when"
        + " the file or name is refused.")
final class ImportSpectrumCommand implements Callable<Integer> {

    /** In lower case because the help lists the constants as the words to type. */
    enum Kind { emitter, response }

    /** The service names HTTP form fields; the command line calls them by its option names. */
    private static final Map<String, String> OPTION_OF_FIELD = Map.of("name", "--name", "description", "--description",
            "provenance", "--provenance", "format", "--format", "xUnit", "--x-unit", "decimalMark", "--decimal-mark",
            "block", "--block", "mergeDuplicates", "--merge-duplicates");

    @Spec
    CommandSpec spec;

    @Mixin
    DatabaseOption database;

    @Option(names = "--kind", required = true, paramLabel = "KIND", description = "${COMPLETION-CANDIDATES}")
    Kind kind;

    @Option(names = "--name", required = true, paramLabel = "NAME",
            description = "Lower-case name to use it by, e.g. bench-lamp-365 (built-in names are taken).")
    String name;

    @Option(names = "--description", paramLabel = "TEXT", description = "Shown in the listings.")
    String description;

    @Option(names = "--provenance", paramLabel = "TEXT", description = "Where the numbers came from (instrument, standard, date).")
    String provenance;

    @Option(names = "--value-column", paramLabel = "COLUMN",
            description = "The value column by header name or 1-based number, when the file has several.")
    String valueColumn;

    @Option(names = "--x-unit", paramLabel = "UNIT", description = "nm, um, angstrom or cm-1 instead of the header's unit.")
    String xUnit;

    @Option(names = "--decimal-mark", paramLabel = "MARK", description = "point or comma instead of detecting it.")
    String decimalMark;

    @Option(names = "--format", paramLabel = "FORMAT", description = "delimited or jcamp-dx instead of detecting it.")
    String format;

    @Option(names = "--merge-duplicates", description = "Average rows that repeat a wavelength instead of refusing the file.")
    boolean mergeDuplicates;

    @Option(names = "--block", paramLabel = "INDEX", description = "JCAMP-DX: the block to read (default the first with data).")
    String block;

    @Parameters(index = "0", paramLabel = "FILE", description = "The spectrum file.")
    Path file;

    @Override
    public Integer call() {
        if (!Files.isRegularFile(file)) {
            throw new ParameterException(spec.commandLine(), "'" + file + "' is not a file");
        }
        byte[] bytes;
        try {
            bytes = Files.readAllBytes(file);
        } catch (IOException e) {
            throw new CliFailure(SieveCli.FAILED, "cannot read " + file + ": " + e.getMessage());
        }
        SpectrumImportOptions options;
        try {
            options = SpectrumImportOptions.parse(format, decimalMark, xUnit, valueColumn, String.valueOf(mergeDuplicates),
                    block);
        } catch (ImportRequestException e) {
            throw new ParameterException(spec.commandLine(), option(e));
        }
        ImportedSpectrum result;
        try (ConfigurableApplicationContext context = LibraryContext.start(database.url)) {
            result = context.getBean(SpectrumImportService.class).importSpectrum(SpectrumKind.parse(kind.name()), name,
                    description, provenance, String.valueOf(file.getFileName()), bytes, options);
        } catch (ImportException | IngestException | ImportLimitException e) {
            throw new CliFailure(SieveCli.FAILED, "not imported: " + e.getMessage());
        } catch (ImportRequestException e) {
            throw new CliFailure(SieveCli.FAILED, "not imported: " + option(e));
        }
        print(spec.commandLine().getOut(), result);
        return SieveCli.OK;
    }

    private static String option(ImportRequestException e) {
        String option = OPTION_OF_FIELD.getOrDefault(e.field(), e.field());
        return option + ": " + e.getMessage().substring(e.getMessage().indexOf(':') + 1).strip();
    }

    private static void print(PrintWriter out, ImportedSpectrum result) {
        ReferenceSpectrum s = result.spectrum();
        out.println("stored " + s.kind().label() + " '" + s.name() + "' from " + s.sourceFileName()
                + (s.valueColumn().isEmpty() ? "" : " (column '" + s.valueColumn() + "')") + ": " + s.pointCount()
                + " points, " + Numbers.mm(s.minNm()) + "–" + Numbers.mm(s.maxNm()) + " nm stored, "
                + Numbers.mm(result.usedFromNm()) + "–" + Numbers.mm(result.usedToNm()) + " nm used");
        result.warnings().forEach(w -> out.println("note: " + w));
        out.flush();
    }
}
