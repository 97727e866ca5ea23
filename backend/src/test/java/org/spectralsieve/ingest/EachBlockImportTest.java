package org.spectralsieve.ingest;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.spectralsieve.library.db.Tables.AUDIT_ENTRY;
import static org.spectralsieve.library.db.Tables.CURVE;
import static org.spectralsieve.library.db.Tables.MATERIAL;
import static org.spectralsieve.library.db.Tables.SAMPLE;
import static org.spectralsieve.library.db.Tables.SOURCE_FILE;

import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.OptionalInt;
import java.util.concurrent.atomic.AtomicInteger;
import org.jooq.DSLContext;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.MaterialClass;
import org.spectralsieve.library.MigratedDatabase;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.library.SourceFile;

/** Blocks of a generated JCAMP-DX series stored as samples, on a freshly migrated database without Spring. */
class EachBlockImportTest {

    private DSLContext db;
    private JooqLibraryRepository library;
    private final AtomicInteger invalidations = new AtomicInteger();

    @BeforeEach
    void migrateFreshDatabase() {
        db = MigratedDatabase.freshH2();
        library = new JooqLibraryRepository(db);
    }

    private ImportService service(JooqLibraryRepository repository) {
        return new ImportService(repository, invalidations::incrementAndGet, ImportProperties.defaults());
    }

    private static ImportTarget.NewMaterial amberFilm() {
        return new ImportTarget.NewMaterial("Illustrative amber film", MaterialClass.of("film"), Scaling.FIXED, null, "");
    }

    private static byte[] series() {
        return JcampSeries.twoBlocks().getBytes(StandardCharsets.UTF_8);
    }

    private static ImportOptions each() {
        return ImportOptions.defaults().withBlocks(OptionalInt.empty(), true);
    }

    private static ImportOptions block(int n) {
        return ImportOptions.defaults().withBlocks(OptionalInt.of(n), false);
    }

    private static SampleFields thin(String notes) {
        return new SampleFields(0.1, null, null, null, null, null, notes);
    }

    private List<Integer> rowCounts() {
        return List.of(db.fetchCount(MATERIAL), db.fetchCount(SAMPLE), db.fetchCount(CURVE), db.fetchCount(SOURCE_FILE),
                db.fetchCount(AUDIT_ENTRY)); // one audit entry per stored sample, none for a refused import
    }

    @Test
    void eachBlockBecomesItsOwnSampleOfOneMaterialToldApartByItsNotes() throws ImportException {
        ImportResult r = service(library).store("series.jdx", series(), each(), amberFilm(), thin("bench 2"));

        assertThat(r.blocks()).extracting(ImportResult.BlockSample::block).containsExactly(1, 2);
        assertThat(r.blocks()).extracting(ImportResult.BlockSample::pointCount).containsExactly(3, 4);
        assertThat(r.blocks()).noneMatch(ImportResult.BlockSample::duplicate);
        assertThat(r.sampleIds()).hasSize(2).doesNotHaveDuplicates();
        assertThat(r.blocks()).allMatch(b -> b.sample().materialId() == r.materialId());
        assertThat(r.blocks().get(0).sample().notes())
                .isEqualTo("JCAMP-DX block 1 of the 2 spectra in series.jdx: 'amber film, unexposed'\nbench 2");
        assertThat(r.blocks().get(1).sample().notes()).startsWith("JCAMP-DX block 2 of the 2 spectra in series.jdx:"
                + " 'amber film, 10 min under the 365 nm lamp'");
        // each stored curve is its block's: A = 2 at 300 nm in block 2 is T = 10^-2 (IUPAC Gold Book A00028)
        assertThat(library.findCurve(r.blocks().get(1).sample().id()).orElseThrow().transmittance(0)).isEqualTo(0.01);
        assertThat(r.warnings()).noneMatch(w -> w.contains("left out"));
        assertThat(rowCounts()).containsExactly(1, 2, 2, 2, 2);
        assertThat(invalidations.get()).as("one commit, one invalidation").isEqualTo(1);
    }

    @Test
    void everyBlockSampleKeepsTheOriginalFile() throws ImportException {
        ImportResult r = service(library).store("series.jdx", series(), each(), amberFilm(), thin(null));

        for (long id : r.sampleIds()) {
            assertThat(library.findSourceFile(id).orElseThrow().bytes()).isEqualTo(series());
        }
    }

    @Test
    void anEachBlockImportWithABlockThatIsNoTransmittanceStoresNothing() {
        byte[] file = JcampSeries.link(List.of(JcampSeries.unexposed(), JcampSeries.variance()))
                .getBytes(StandardCharsets.UTF_8);

        assertThatThrownBy(() -> service(library).store("series.jdx", file, each(), amberFilm(), thin(null)))
                .isInstanceOf(ImportException.class).hasMessageContaining("eachBlock stores every block or none");

        assertThat(rowCounts()).containsExactly(0, 0, 0, 0, 0);
        assertThat(invalidations.get()).isZero();
    }

    @Test
    void aFailureAtTheLastBlockLeavesNoBlockAndNoMaterialBehind() {
        AtomicInteger files = new AtomicInteger();
        JooqLibraryRepository failing = new JooqLibraryRepository(db) {
            @Override
            protected void insertSourceFile(DSLContext t, long sampleId, SourceFile file) {
                if (files.incrementAndGet() == 2) {
                    throw new IllegalStateException("forced failure at the second block");
                }
                super.insertSourceFile(t, sampleId, file);
            }
        };

        assertThatThrownBy(() -> service(failing).store("series.jdx", series(), each(), amberFilm(), thin(null)))
                .hasMessageContaining("forced failure");

        assertThat(rowCounts()).containsExactly(0, 0, 0, 0, 0);
    }

    @Test
    void importingEachBlockAgainFindsEveryBlockAndStoresNothing() throws ImportException {
        ImportService imports = service(library);
        ImportResult first = imports.store("series.jdx", series(), each(), amberFilm(), thin(null));

        ImportResult again = imports.store("series.jdx", series(), each(),
                new ImportTarget.ExistingMaterial(first.materialId()), thin(null));

        assertThat(again.duplicate()).isTrue();
        assertThat(again.sampleIds()).isEqualTo(first.sampleIds());
        assertThat(again.warnings()).anySatisfy(w -> assertThat(w).contains("block 2 'amber film, 10 min under the 365 nm"
                + " lamp' of this file", "already stored", "as sample " + first.sampleIds().get(1)));
        assertThat(rowCounts()).containsExactly(1, 2, 2, 2, 2);
        assertThat(invalidations.get()).isEqualTo(1);
    }

    @Test
    void blockTwoAfterBlockOneIsANewSampleNotADuplicateOfTheSameFile() throws ImportException {
        ImportService imports = service(library);
        ImportResult one = imports.store("series.jdx", series(), ImportOptions.defaults(), amberFilm(), thin(null));

        ImportResult two = imports.store("series.jdx", series(), block(2),
                new ImportTarget.ExistingMaterial(one.materialId()), thin(null));

        assertThat(two.duplicate()).isFalse();
        assertThat(two.sampleId()).isNotEqualTo(one.sampleId());
        assertThat(one.warnings()).anySatisfy(w -> assertThat(w).contains("Imported block 1 only", "left out"));
        assertThat(two.sample().notes()).startsWith("JCAMP-DX block 2 of the 2 spectra");
        assertThat(rowCounts()).containsExactly(1, 2, 2, 2, 2);
    }

    @Test
    void eachBlockAfterOneChosenBlockStoresOnlyTheOther() throws ImportException {
        ImportService imports = service(library);
        ImportResult two = imports.store("series.jdx", series(), block(2), amberFilm(), thin(null));

        ImportResult all = imports.store("series.jdx", series(), each(),
                new ImportTarget.ExistingMaterial(two.materialId()), thin(null));

        assertThat(all.duplicate()).isFalse();
        assertThat(all.blocks()).extracting(ImportResult.BlockSample::duplicate).containsExactly(false, true);
        assertThat(all.blocks().get(1).sample().id()).isEqualTo(two.sampleId());
        assertThat(rowCounts()).containsExactly(1, 2, 2, 2, 2);
    }

    @Test
    void theSameBlockAtAnotherThicknessIsANewSample() throws ImportException {
        ImportService imports = service(library);
        ImportResult thin = imports.store("series.jdx", series(), block(1), amberFilm(), thin(null));

        ImportResult thick = imports.store("series.jdx", series(), block(1),
                new ImportTarget.ExistingMaterial(thin.materialId()), SampleFields.thickness(0.2));

        assertThat(thick.duplicate()).isFalse();
        assertThat(rowCounts()).containsExactly(1, 2, 2, 2, 2);
    }
}
