package org.spectralsieve.backup;

import java.io.IOException;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.ingest.ImportFiles;
import org.spectralsieve.ingest.ImportOptions;
import org.spectralsieve.ingest.ImportService;
import org.spectralsieve.ingest.ImportTarget;
import org.spectralsieve.ingest.SampleFields;
import org.spectralsieve.library.MaterialClass;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.spectra.SpectrumImportOptions;
import org.spectralsieve.spectra.SpectrumImportService;
import org.spectralsieve.spectra.SpectrumKind;
import org.spectralsieve.curation.LibraryCuration;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.JooqLibraryRevisions;
import org.spectralsieve.library.MaterialCorrection;
import org.spectralsieve.library.SampleCorrection;
import org.spectralsieve.optics.ConstantIndex;
import org.springframework.context.ConfigurableApplicationContext;

/**
 * The library every restore test starts from, built once per test run: the illustrative demo library, one
 * user import with its original file (corrected once, so revisions exist), one retired demo material, and
 * one imported emitter and response (invented bench readings), backed up to one archive.
 */
public final class SourceLibrary {

    static final String EMITTER = "bench-lamp-365";
    static final String RESPONSE = "bench-detector";

    private static SourceLibrary instance;

    final ConfigurableApplicationContext context;
    final Path archive;

    /** The archive the library was backed up to. */
    public Path archive() {
        return archive;
    }

    public ConfigurableApplicationContext context() {
        return context;
    }

    private SourceLibrary(ConfigurableApplicationContext context, Path archive) {
        this.context = context;
        this.archive = archive;
    }

    public static synchronized SourceLibrary get() {
        if (instance == null) {
            instance = build();
        }
        return instance;
    }

    private static SourceLibrary build() {
        ConfigurableApplicationContext context = LibraryApp.h2("source", true);
        try {
            var imported = context.getBean(ImportService.class).store("workshop-sheet.csv",
                    // with a stated ±0.5 %T, so the archive carries a curve's absorbance uncertainty (V8) too
                    ImportFiles.percentCsv().getBytes(StandardCharsets.UTF_8), ImportOptions.defaults()
                            .withStatedUncertainty(java.util.Optional.of(new org.spectralsieve.ingest.StatedUncertainty(
                                    0.5, org.spectralsieve.ingest.StatedUncertainty.Scale.PERCENT_T))),
                    new ImportTarget.NewMaterial("Illustrative workshop cast sheet", MaterialClass.of("plastic sheet"),
                            Scaling.BULK, null, ""), SampleFields.thickness(3));
            // a corrected sample (two revision rows) and a retired material: the archive keeps both states
            LibraryCuration curation = context.getBean(LibraryCuration.class);
            curation.correct(imported.sample().id(), new SampleCorrection(3.05, null, null, null, null,
                    "remeasured with callipers", null, "thickness remeasured"));
            curation.correct(imported.materialId(), new MaterialCorrection(new ConstantIndex(1.49), null, "index stated"));
            curation.retire(JooqLibraryRevisions.Kind.MATERIAL, imported.materialId());
            curation.restore(JooqLibraryRevisions.Kind.MATERIAL, imported.materialId());
            // a state curve read from a file (its bytes kept) and a demo state curve retired: the archive keeps both (V13)
            var states = context.getBean(org.spectralsieve.ingest.StateCurveService.class);
            states.store(imported.sample().id(), "workshop-sheet-aged.csv",
                    "wavelength_nm,transmittance\n350,0.0004\n365,0.08\n380,0.4\n400,0.85\n450,0.9\n"
                            .getBytes(StandardCharsets.UTF_8), ImportOptions.defaults(),
                    org.spectralsieve.states.MaterialState.aged(org.spectralsieve.states.Exposure.hours(500,
                            "illustrative bench lamp")), null, "invented");
            JooqLibraryRepository repository = context.getBean(JooqLibraryRepository.class);
            long demoCover = repository.findMaterialIdBySlug("uvt-acrylic").orElseThrow();
            long demoCoverSample = repository.findMaterial(demoCover).orElseThrow().samples().stream()
                    .filter(x -> x.thicknessMm() == 6).findFirst().orElseThrow().id();
            states.setRetired(repository.findStateCurves(demoCoverSample).get(0).id(), true);
            long retiredDemoMaterial = context.getBean(JooqLibraryRepository.class).findMaterials(null, null).get(0).id();
            curation.retire(JooqLibraryRevisions.Kind.MATERIAL, retiredDemoMaterial);
            SpectrumImportService spectra = context.getBean(SpectrumImportService.class);
            // invented bench readings: a lamp peaking at 365 nm and a detector's relative response
            spectra.importSpectrum(SpectrumKind.EMITTER, EMITTER, "illustrative bench lamp", "invented", "lamp.csv",
                    "wavelength_nm,power\n350,0\n360,0.6\n365,1\n370,0.6\n380,0\n".getBytes(StandardCharsets.UTF_8),
                    SpectrumImportOptions.defaults());
            spectra.importSpectrum(SpectrumKind.RESPONSE, RESPONSE, "illustrative detector", "invented", "detector.csv",
                    "wavelength_nm,weight\n300,0.1\n350,0.5\n400,1\n450,0.7\n500,0.2\n".getBytes(StandardCharsets.UTF_8),
                    SpectrumImportOptions.defaults());
            Path archive = Files.createTempFile("sieve-backup-test-", ".zip");
            archive.toFile().deleteOnExit();
            try (OutputStream out = Files.newOutputStream(archive)) {
                context.getBean(LibraryBackup.class).write(out);
            }
            return new SourceLibrary(context, archive);
        } catch (ImportException e) {
            throw new IllegalStateException(e);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
