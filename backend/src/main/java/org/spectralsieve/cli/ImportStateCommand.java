package org.spectralsieve.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.ingest.ImportLimitException;
import org.spectralsieve.ingest.ImportOptions;
import org.spectralsieve.ingest.ImportRequestException;
import org.spectralsieve.ingest.IngestException;
import org.spectralsieve.ingest.OptionText;
import org.spectralsieve.ingest.StateCurveService;
import org.spectralsieve.ingest.StateFields;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.NewStateCurve;
import org.spectralsieve.library.NotFoundException;
import org.spectralsieve.library.RetiredException;
import org.spectralsieve.library.StoredStateCurve;
import org.spectralsieve.states.MaterialState;
import org.springframework.context.ConfigurableApplicationContext;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code import-state --sample N --state aged --hours H --source TEXT FILE} (or {@code --dose J --dose-nm NM}, or
 * {@code --state printed --ink-load P --density D}): one file as a sample's curve in another state, as
 * {@code POST /api/samples/{id}/states} stores it (docs/material-states.md). Prints what was stored and then every
 * state curve the sample has.
 */
@Command(name = "import-state", description = "Import a file as sample N's curve in another state: aged (--hours with"
        + " --source, or --dose with --dose-nm) or printed black (--ink-load and/or --density). The sample's own curve"
        + " is its as-supplied state. Read with the same options as 'preview'; never rescaled. Prints what was stored and"
        + " the sample's state curves; exit 1 when the file or a value is refused.")
final class ImportStateCommand implements Callable<Integer> {

    /** The service names HTTP form fields; the command line calls them by its option names. */
    private static final Map<String, String> OPTION_OF_FIELD = Map.ofEntries(Map.entry("state", "--state"),
            Map.entry("hours", "--hours"), Map.entry("source", "--source"), Map.entry("doseJPerCm2", "--dose"),
            Map.entry("doseNm", "--dose-nm"), Map.entry("inkLoadPercent", "--ink-load"),
            Map.entry("statedDensity", "--density"), Map.entry("thicknessMm", "--thickness-mm"),
            Map.entry("notes", "--notes"));

    @Spec
    CommandSpec spec;

    @Mixin
    DatabaseOption database;

    @Mixin
    FileReadingOptions reading;

    @Option(names = "--sample", required = true, paramLabel = "ID", description = "The sample the curve is a state of.")
    long sampleId;

    @Option(names = "--state", required = true, paramLabel = "STATE", description = "aged or printed.")
    String state;

    @Option(names = "--hours", paramLabel = "H", description = "Aged: hours of exposure.")
    String hours;

    @Option(names = "--source", paramLabel = "TEXT", description = "Aged: what it was exposed under, e.g. a lamp bank's name.")
    String source;

    @Option(names = "--dose", paramLabel = "J_PER_CM2", description = "Aged: the radiant exposure in J/cm², instead of hours.")
    String dose;

    @Option(names = "--dose-nm", paramLabel = "NM", description = "Aged: the wavelength the dose was given at.")
    String doseNm;

    @Option(names = "--ink-load", paramLabel = "PERCENT", description = "Printed: the ink load in %% of full coverage.")
    String inkLoad;

    @Option(names = "--density", paramLabel = "OD", description = "Printed: the density the printer or a densitometer states.")
    String density;

    @Option(names = "--thickness-mm", paramLabel = "MM", description = "What it was measured at (default: the sample's own).")
    String thicknessMm;

    @Option(names = "--notes", paramLabel = "TEXT", description = "Kept with the curve.")
    String notes;

    @Parameters(index = "0", paramLabel = "FILE", description = "The curve file.")
    Path file;

    @Override
    public Integer call() {
        if (!Files.isRegularFile(file)) {
            throw new ParameterException(spec.commandLine(), "'" + file + "' is not a file");
        }
        MaterialState materialState;
        Double thickness;
        String note;
        ImportOptions options;
        try {
            materialState = StateFields.parse(state, hours, source, dose, doseNm, inkLoad, density);
            thickness = OptionText.thicknessOrNull("thicknessMm", thicknessMm);
            note = OptionText.paragraph("notes", notes, NewStateCurve.MAX_NOTES);
            options = reading.options(false);
        } catch (ImportRequestException e) {
            throw new ParameterException(spec.commandLine(), option(e));
        }
        byte[] bytes;
        try {
            bytes = Files.readAllBytes(file);
        } catch (IOException e) {
            throw new CliFailure(SieveCli.FAILED, "cannot read " + file + ": " + e.getMessage());
        }
        try (ConfigurableApplicationContext context = LibraryContext.start(database.url)) {
            StateCurveService.Result r = context.getBean(StateCurveService.class).store(sampleId,
                    String.valueOf(file.getFileName()), bytes, options, materialState, thickness, note);
            PrintWriter out = spec.commandLine().getOut();
            StoredStateCurve s = r.stored();
            out.println((r.duplicate() ? "already stored: state curve " : "stored state curve ") + s.id() + " of sample "
                    + sampleId + ": " + s.stateCurve().state().describe() + ", " + s.stateCurve().curve().size()
                    + " points, " + Numbers.mm(s.stateCurve().curve().minWavelengthNm()) + "–"
                    + Numbers.mm(s.stateCurve().curve().maxWavelengthNm()) + " nm, from " + s.sourceFileName());
            r.warnings().forEach(w -> out.println("note: " + w));
            printStates(out, context.getBean(JooqLibraryRepository.class), sampleId);
            out.flush();
            return SieveCli.OK;
        } catch (NotFoundException | RetiredException e) {
            throw new CliFailure(SieveCli.FAILED, "not imported: " + e.getMessage());
        } catch (ImportException | IngestException | ImportLimitException e) {
            throw new CliFailure(SieveCli.FAILED, "not imported: " + e.getMessage());
        } catch (ImportRequestException e) {
            throw new CliFailure(SieveCli.FAILED, "not imported: " + option(e));
        }
    }

    /** The sample's state curves, in use and retired, as a table (also printed by {@code revisions sample N}). */
    static void printStates(PrintWriter out, JooqLibraryRepository library, long sampleId) {
        List<StoredStateCurve> all = library.findStoredStateCurves(sampleId, true);
        if (all.isEmpty()) {
            out.println("sample " + sampleId + " has no curves in other states; its own curve is as supplied");
            return;
        }
        out.println("states of sample " + sampleId + " (its own curve: as supplied):");
        TextTable table = new TextTable(List.of(">state curve", "state", "thickness", "points", "file", "in use"));
        for (StoredStateCurve s : all) {
            double t = s.stateCurve().thicknessMm();
            table.add(List.of(String.valueOf(s.id()), s.stateCurve().state().describe(),
                    Double.isNaN(t) ? Numbers.NONE : Numbers.mm(t) + " mm", String.valueOf(s.stateCurve().curve().size()),
                    s.sourceFileName(), s.retired() ? "retired " + s.retiredAt() : "yes"));
        }
        table.print(out);
    }

    private static String option(ImportRequestException e) {
        String field = OPTION_OF_FIELD.get(e.field());
        if (field == null) {
            return FileReadingOptions.option(e);
        }
        return field + ": " + e.getMessage().substring(e.getMessage().indexOf(':') + 1).strip();
    }
}
