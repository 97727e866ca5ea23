package org.spectralsieve.cli;

import java.util.concurrent.Callable;
import org.spectralsieve.curation.LibraryCuration;
import org.spectralsieve.ingest.ImportRequestException;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.JooqLibraryRevisions.Retirement;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.NotFoundException;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.spectra.ReferenceSpectrum;
import org.spectralsieve.spectra.SpectrumImportService;
import org.spectralsieve.spectra.UnknownSpectrumException;
import org.springframework.context.ConfigurableApplicationContext;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code restore}: brings a retired sample, material or imported spectrum back into listings and searches. */
@Command(name = "restore", description = "Bring back what 'retire' took back: a sample, a material (with the samples"
        + " it had in use) or an imported emitter or response.")
final class RestoreCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    DatabaseOption database;

    @Parameters(index = "0", paramLabel = "WHAT", description = "sample, material, state-curve, emitter or response")
    String what;

    @Parameters(index = "1", paramLabel = "ID-OR-NAME", description = "the sample's or material's id; the spectrum's name")
    String key;

    @Option(names = "--id", paramLabel = "ID", description = "For a spectrum name retired more than once: which one"
            + " (default: the most recently retired).")
    Long spectrumId;

    @Override
    public Integer call() {
        Curated kind = Curated.parse(what);
        try (ConfigurableApplicationContext context = LibraryContext.start(database.url)) {
            if (kind.spectrum()) {
                ReferenceSpectrum s = context.getBean(SpectrumImportService.class).restore(kind.spectrumKind(), key, spectrumId);
                spec.commandLine().getOut().println("restored " + s.kind().label() + " '" + s.name() + "' (id " + s.id() + ")");
                return SieveCli.OK;
            }
            if (kind == Curated.STATE_CURVE) {
                var r = context.getBean(org.spectralsieve.ingest.StateCurveService.class).setRetired(kind.id(key), false);
                spec.commandLine().getOut().println((r.changed() ? "restored " : "already in use: ") + "state curve "
                        + r.id() + " of sample " + r.sampleId());
                return SieveCli.OK;
            }
            Retirement r = context.getBean(LibraryCuration.class).restore(kind.libraryKind(), kind.id(key));
            String line = (r.changed() ? "restored " : "already in use: ") + kind.libraryKind().label() + " " + r.id();
            if (kind == Curated.SAMPLE) {
                JooqLibraryRepository library = context.getBean(JooqLibraryRepository.class);
                SampleInfo s = library.findSample(r.id()).orElseThrow();
                Material m = library.findMaterial(s.materialId()).orElseThrow();
                if (m.retired()) {
                    line += "; still hidden: its material " + m.id() + " (" + m.name() + ") is retired (restore material "
                            + m.id() + ")";
                }
            }
            spec.commandLine().getOut().println(line);
            return SieveCli.OK;
        } catch (NotFoundException | UnknownSpectrumException e) {
            throw new CliFailure(SieveCli.FAILED, e.getMessage());
        } catch (ImportRequestException e) {
            throw Curated.refused("not restored", e);
        }
    }
}
