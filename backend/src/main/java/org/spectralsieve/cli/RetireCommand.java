package org.spectralsieve.cli;

import java.util.concurrent.Callable;
import org.spectralsieve.curation.LibraryCuration;
import org.spectralsieve.ingest.ImportRequestException;
import org.spectralsieve.library.JooqLibraryRevisions.Retirement;
import org.spectralsieve.library.NotFoundException;
import org.spectralsieve.spectra.SpectrumImportService;
import org.spectralsieve.spectra.UnknownSpectrumException;
import org.springframework.context.ConfigurableApplicationContext;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code retire}: hides a sample, material, state curve or imported spectrum from every listing and search; kept, restorable. */
@Command(name = "retire", description = "Take back a sample, a material (with all its samples) or an imported emitter"
        + " or response: hidden from listings and searches, kept in the library, brought back with 'restore'.")
final class RetireCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    DatabaseOption database;

    @Parameters(index = "0", paramLabel = "WHAT", description = "sample, material, state-curve, emitter or response")
    String what;

    @Parameters(index = "1", paramLabel = "ID-OR-NAME", description = "the sample's or material's id; the spectrum's name")
    String key;

    @Override
    public Integer call() {
        Curated kind = Curated.parse(what);
        try (ConfigurableApplicationContext context = LibraryContext.start(database.url)) {
            if (kind.spectrum()) {
                context.getBean(SpectrumImportService.class).delete(kind.spectrumKind(), key);
                spec.commandLine().getOut().println("retired " + kind.spectrumKind().label() + " '" + key
                        + "'; its name is free again; bring it back with: restore " + what + " " + key);
                return SieveCli.OK;
            }
            if (kind == Curated.STATE_CURVE) {
                var r = context.getBean(org.spectralsieve.ingest.StateCurveService.class).setRetired(kind.id(key), true);
                spec.commandLine().getOut().println((r.changed() ? "retired " : "already retired: ") + "state curve "
                        + r.id() + " of sample " + r.sampleId() + " at " + r.retiredAt()
                        + "; bring it back with: restore state-curve " + r.id());
                return SieveCli.OK;
            }
            Retirement r = context.getBean(LibraryCuration.class).retire(kind.libraryKind(), kind.id(key));
            spec.commandLine().getOut().println((r.changed() ? "retired " : "already retired: ") + kind.libraryKind().label()
                    + " " + r.id() + " at " + r.retiredAt() + "; bring it back with: restore " + what + " " + r.id());
            return SieveCli.OK;
        } catch (NotFoundException | UnknownSpectrumException e) {
            throw new CliFailure(SieveCli.FAILED, e.getMessage());
        } catch (ImportRequestException e) {
            throw Curated.refused("not retired", e);
        }
    }
}
