package org.spectralsieve.library;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.jooq.DSLContext;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.spectralsieve.ingest.Checksums;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.spectrum.Curve;

/** The change counter moves with every committed write and only then, on a freshly migrated H2 database. */
class LibraryGenerationTest {

    private DSLContext db;
    private JooqLibraryRepository library;

    @BeforeEach
    void migrateFreshDatabase() {
        db = MigratedDatabase.freshH2();
        library = new JooqLibraryRepository(db);
    }

    static NewMaterial material(String slug) {
        return new NewMaterial(slug, "Illustrative " + slug, MaterialClass.of("plastic sheet"), "", List.of(),
                Scaling.BULK, new ConstantIndex(1.49));
    }

    static SourceFile file(String text) {
        byte[] bytes = text.getBytes(StandardCharsets.UTF_8);
        return new SourceFile("sheet.csv", "text/csv", "delimited", bytes, Checksums.sha256(bytes));
    }

    static NewSample sample(double mm, SourceFile file) {
        Curve curve = Curve.of(new double[] {300, 400}, new double[] {0.3, 0.8}, 1e-3);
        return new NewSample(mm, Geometry.REGULAR, Provenance.MEASURED, "", null, "", "", 1e-3, curve,
                file.fileName(), file.sha256());
    }

    @Test
    void aFreshLibraryStartsAtZero() {
        assertThat(library.generation()).isZero();
    }

    @Test
    void everyWritePathRaisesTheCounter() {
        long start = library.generation();
        long materialId = library.insertMaterial(material("counted"));
        assertThat(library.generation()).isEqualTo(start + 1);

        SourceFile a = file("wavelength_nm,T\n300,0.3\n400,0.8\n");
        library.insertSample(materialId, sample(2, a));
        assertThat(library.generation()).isEqualTo(start + 2);

        SourceFile b = file("wavelength_nm,T\n300,0.2\n400,0.7\n");
        library.insertSample(materialId, sample(3, b), b);
        assertThat(library.generation()).isEqualTo(start + 3);

        SourceFile c = file("wavelength_nm,T\n300,0.1\n400,0.6\n");
        library.storeImport(null, material("imported"), sample(4, c), c);
        assertThat(library.generation()).isEqualTo(start + 4);
    }

    @Test
    void retiringRestoringAndCorrectingRaiseTheCounter() {
        long materialId = library.insertMaterial(material("curated"));
        SourceFile a = file("wavelength_nm,T\n300,0.3\n400,0.8\n");
        long sampleId = library.insertSample(materialId, sample(2, a), a);
        JooqLibraryRevisions revisions = new JooqLibraryRevisions(db);
        long start = library.generation();

        revisions.setRetired(JooqLibraryRevisions.Kind.SAMPLE, sampleId, true);
        assertThat(library.generation()).isEqualTo(start + 1);
        revisions.setRetired(JooqLibraryRevisions.Kind.SAMPLE, sampleId, false);
        assertThat(library.generation()).isEqualTo(start + 2);
        revisions.setRetired(JooqLibraryRevisions.Kind.MATERIAL, materialId, true);
        assertThat(library.generation()).isEqualTo(start + 3);

        revisions.correctSample(sampleId, new SampleCorrection(2.1, null, null, null, null, null, null, "callipers"),
                (now, next, perPoint) -> { });
        assertThat(library.generation()).isEqualTo(start + 4);
        revisions.correctMaterial(materialId, new MaterialCorrection(new ConstantIndex(1.5), null, "index checked"),
                m -> { });
        assertThat(library.generation()).isEqualTo(start + 5);
    }

    @Test
    void retiringWhatIsRetiredAlreadyWritesNothingAndLeavesTheCounter() {
        long materialId = library.insertMaterial(material("twice"));
        JooqLibraryRevisions revisions = new JooqLibraryRevisions(db);
        revisions.setRetired(JooqLibraryRevisions.Kind.MATERIAL, materialId, true);
        long after = library.generation();

        revisions.setRetired(JooqLibraryRevisions.Kind.MATERIAL, materialId, true);

        assertThat(library.generation()).isEqualTo(after);
    }

    @Test
    void aRecognisedDuplicateWritesNothingAndLeavesTheCounter() {
        SourceFile f = file("wavelength_nm,T\n300,0.3\n400,0.8\n");
        StoredImport first = library.storeImport(null, material("twice"), sample(2, f), f);
        long after = library.generation();

        StoredImport again = library.storeImport(first.materialId(), null, sample(2, f), f);

        assertThat(again.duplicate()).isTrue();
        assertThat(library.generation()).isEqualTo(after);
    }

    @Test
    void aRolledBackImportLeavesTheCounterWhereItWas() {
        JooqLibraryRepository failing = new JooqLibraryRepository(db) {
            @Override
            protected void insertSourceFile(DSLContext t, long sampleId, SourceFile file) {
                throw new IllegalStateException("disk full (simulated)");
            }
        };
        long before = failing.generation();
        SourceFile f = file("wavelength_nm,T\n300,0.3\n400,0.8\n");

        assertThatThrownBy(() -> failing.storeImport(null, material("lost"), sample(2, f), f))
                .hasMessageContaining("disk full");

        assertThat(failing.generation()).isEqualTo(before);
        assertThat(failing.countMaterials()).isZero();
    }

    @Test
    void concurrentWritersNeverLoseARaise() throws Exception {
        long materialId = library.insertMaterial(material("busy"));
        long before = library.generation();
        int writers = 4;
        int each = 15;
        ExecutorService pool = Executors.newFixedThreadPool(writers);
        try {
            List<Future<?>> done = new ArrayList<>();
            for (int w = 0; w < writers; w++) {
                int writer = w;
                done.add(pool.submit(() -> {
                    for (int i = 0; i < each; i++) {
                        SourceFile f = file("wavelength_nm,T\n300,0." + writer + "\n400,0.8" + i + "\n");
                        library.insertSample(materialId, sample(1 + writer * each + i, f), f);
                    }
                    return null;
                }));
            }
            for (Future<?> f : done) {
                f.get();
            }
        } finally {
            pool.shutdown();
        }

        assertThat(library.generation()).isEqualTo(before + (long) writers * each);
    }
}
