package org.spectralsieve.cli;

import java.util.LinkedHashMap;
import java.util.Map;
import java.util.concurrent.Callable;
import org.spectralsieve.curation.LibraryCuration;
import org.spectralsieve.ingest.ImportRequestException;
import org.spectralsieve.ingest.SampleCorrectionForm;
import org.spectralsieve.library.MaterialRevision;
import org.spectralsieve.library.NotFoundException;
import org.spectralsieve.library.SampleRevision;
import org.springframework.context.ConfigurableApplicationContext;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code correct}: a sample's or material's metadata as a new revision; every earlier one stays readable
 * ({@code revisions}). Values are read and checked as the import reads them.
 */
@Command(name = "correct", description = "Correct a sample's metadata or a material's index and made thicknesses as a"
        + " new revision; the curve never changes, earlier revisions stay readable with 'revisions'.")
final class CorrectCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    DatabaseOption database;

    @Parameters(index = "0", paramLabel = "WHAT", description = "sample or material")
    String what;

    @Parameters(index = "1", paramLabel = "ID", description = "the sample's or material's id")
    String key;

    @Option(names = "--reason", required = true, paramLabel = "TEXT", description = "Why the values change (kept with the revision).")
    String reason;

    @Option(names = "--thickness-mm", paramLabel = "MM", description = "Sample: its thickness.")
    String thicknessMm;

    @Option(names = "--geometry", paramLabel = "regular|total", description = "Sample: how it was measured.")
    String geometry;

    @Option(names = "--instrument", paramLabel = "TEXT", description = "Sample: the instrument.")
    String instrument;

    @Option(names = "--measured-on", paramLabel = "YYYY-MM-DD", description = "Sample: the day it was measured.")
    String measuredOn;

    @Option(names = "--lot", paramLabel = "TEXT", description = "Sample: the lot or batch.")
    String lot;

    @Option(names = "--notes", paramLabel = "TEXT", description = "Sample: notes.")
    String notes;

    @Option(names = "--detection-limit", paramLabel = "FRACTION", description = "Sample: transmittance at or under which"
            + " a value is only an upper bound, e.g. 0.001.")
    String detectionLimit;

    @Option(names = "--index-n", paramLabel = "N", description = "Material: a constant refractive index.")
    String indexN;

    @Option(names = "--stock", paramLabel = "LIST", description = "Material: stock thicknesses, e.g. \"2 3 6\" or \"25 50 um\".")
    String stock;

    @Option(names = "--made-range", paramLabel = "RANGE", description = "Material: the range it is made in, e.g. \"1 to 12\".")
    String madeRange;

    @Override
    public Integer call() {
        Curated kind = Curated.parse(what);
        if (kind.spectrum()) {
            throw new CliFailure(SieveCli.USAGE, "an imported " + what + " is not corrected: retire it and import the"
                    + " right file under its name");
        }
        if (kind == Curated.STATE_CURVE) {
            throw new CliFailure(SieveCli.USAGE, "a state curve is not corrected: retire it (retire state-curve ID) and"
                    + " store the right file with import-state");
        }
        long id = kind.id(key);
        Map<String, String> fields = new LinkedHashMap<>();
        fields.put("reason", reason);
        if (kind == Curated.SAMPLE) {
            put(fields, "thicknessMm", thicknessMm);
            put(fields, "geometry", geometry);
            put(fields, "instrument", instrument);
            put(fields, "measuredOn", measuredOn);
            put(fields, "lot", lot);
            put(fields, "notes", notes);
            put(fields, "detectionLimit", detectionLimit);
            refuseOthers(kind, indexN, stock, madeRange);
        } else {
            put(fields, "indexN", indexN);
            put(fields, "stockThicknesses", stock);
            put(fields, "madeRange", madeRange);
            refuseOthers(kind, thicknessMm, geometry, instrument, measuredOn, lot, notes, detectionLimit);
        }
        try (ConfigurableApplicationContext context = LibraryContext.start(database.url)) {
            LibraryCuration curation = context.getBean(LibraryCuration.class);
            if (kind == Curated.SAMPLE) {
                SampleRevision r = curation.correct(id, SampleCorrectionForm.sample(fields));
                spec.commandLine().getOut().println("sample " + id + " is now at revision " + r.revision() + ": "
                        + Numbers.mm(r.thicknessMm()) + ", " + r.geometry().label() + ", detection limit "
                        + r.detectionLimit() + " (earlier revisions: revisions sample " + id + ")");
            } else {
                MaterialRevision r = curation.correct(id, SampleCorrectionForm.material(fields));
                spec.commandLine().getOut().println("material " + id + " is now at revision " + r.revision()
                        + " (earlier revisions: revisions material " + id + ")");
            }
            return SieveCli.OK;
        } catch (NotFoundException e) {
            throw new CliFailure(SieveCli.FAILED, e.getMessage());
        } catch (ImportRequestException e) {
            throw Curated.refused("not corrected", e);
        }
    }

    private static void put(Map<String, String> fields, String name, String value) {
        if (value != null) {
            fields.put(name, value);
        }
    }

    private static void refuseOthers(Curated kind, String... values) {
        for (String v : values) {
            if (v != null) {
                throw new CliFailure(SieveCli.USAGE, "an option given does not apply to a " + kind.name().toLowerCase(
                        java.util.Locale.ROOT) + " (sample: --thickness-mm --geometry --instrument --measured-on --lot"
                        + " --notes --detection-limit; material: --index-n --stock --made-range)");
            }
        }
    }
}
