package org.spectralsieve.cli;

import java.util.List;
import java.util.concurrent.Callable;
import org.spectralsieve.library.JooqLibraryRevisions;
import org.spectralsieve.library.MaterialRevision;
import org.spectralsieve.library.NotFoundException;
import org.spectralsieve.library.RefractiveIndexJson;
import org.spectralsieve.library.SampleRevision;
import org.springframework.context.ConfigurableApplicationContext;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code revisions}: every revision of a sample's or material's metadata, oldest first, the one in use marked. */
@Command(name = "revisions", description = "Every revision of a sample's metadata or a material's index and made"
        + " thicknesses, oldest first; * marks the one searches, exports and figures use.")
final class RevisionsCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    DatabaseOption database;

    @Parameters(index = "0", paramLabel = "WHAT", description = "sample or material")
    String what;

    @Parameters(index = "1", paramLabel = "ID", description = "the sample's or material's id")
    String key;

    @Override
    public Integer call() {
        Curated kind = Curated.parse(what);
        if (kind.spectrum()) {
            throw new CliFailure(SieveCli.USAGE, "an imported " + what + " has no revisions; see its retired ones with"
                    + " GET /api/" + kind.spectrumKind().plural() + "/retired");
        }
        if (kind == Curated.STATE_CURVE) {
            throw new CliFailure(SieveCli.USAGE, "a state curve has no revisions; 'revisions sample ID' lists its sample's"
                    + " revisions and state curves");
        }
        long id = kind.id(key);
        TextTable table;
        java.io.StringWriter states = new java.io.StringWriter();
        try (ConfigurableApplicationContext context = LibraryContext.start(database.url)) {
            JooqLibraryRevisions revisions = context.getBean(JooqLibraryRevisions.class);
            if (kind == Curated.SAMPLE) {
                table = new TextTable(List.of(">rev", "revised at", "thickness", "geometry", "detection limit",
                        "instrument", "lot", "measured on", "reason"));
                for (SampleRevision r : revisions.sampleRevisions(id)) {
                    table.add(List.of(r.revision() + (r.current() ? "*" : ""), String.valueOf(r.revisedAt()),
                            Numbers.mm(r.thicknessMm()), r.geometry().label(), String.valueOf(r.detectionLimit()),
                            r.instrument(), r.lot(), r.measuredOn() == null ? "" : r.measuredOn().toString(), r.reason()));
                }
                // its curves in other states are not revisions (each is a curve of its own), but belong with its details
                java.io.PrintWriter w = new java.io.PrintWriter(states);
                ImportStateCommand.printStates(w, context.getBean(org.spectralsieve.library.JooqLibraryRepository.class), id);
                w.flush();
            } else {
                table = new TextTable(List.of(">rev", "revised at", "refractive index", "made in", "reason"));
                for (MaterialRevision r : revisions.materialRevisions(id)) {
                    table.add(List.of(r.revision() + (r.current() ? "*" : ""), String.valueOf(r.revisedAt()),
                            RefractiveIndexJson.toJson(r.refractiveIndex()).toString(), stated(r), r.reason()));
                }
            }
        } catch (NotFoundException e) {
            throw new CliFailure(SieveCli.FAILED, e.getMessage());
        }
        table.print(spec.commandLine().getOut());
        spec.commandLine().getOut().print(states);
        spec.commandLine().getOut().flush();
        return SieveCli.OK;
    }

    private static String stated(MaterialRevision r) {
        var t = r.thicknesses();
        String stock = t.stockMm().isEmpty() ? "" : "stock " + t.stockMm().stream().map(Numbers::mm).toList();
        String range = t.rangeStated() ? "range " + Numbers.mm(t.minMm()) + " to " + Numbers.mm(t.maxMm()) : "";
        String both = (stock + " " + range).strip();
        return both.isEmpty() ? "none stated" : both;
    }

}
