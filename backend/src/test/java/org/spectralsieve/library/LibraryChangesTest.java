package org.spectralsieve.library;

import static org.assertj.core.api.Assertions.assertThat;
import static org.spectralsieve.library.LibraryGenerationTest.file;
import static org.spectralsieve.library.LibraryGenerationTest.material;
import static org.spectralsieve.library.LibraryGenerationTest.sample;

import java.util.List;
import java.util.Set;
import org.jooq.DSLContext;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;

/**
 * The change log (V9) names, for every raise of the counter, the material the write concerned, so an index on
 * disk re-indexes only that one; a raise it cannot explain makes the index rebuild (docs/index-on-disk.md).
 */
class LibraryChangesTest {

    private DSLContext db;
    private JooqLibraryRepository library;
    private JooqLibraryRevisions revisions;

    @BeforeEach
    void migrateFreshDatabase() {
        db = MigratedDatabase.freshH2();
        library = new JooqLibraryRepository(db);
        revisions = new JooqLibraryRevisions(db);
    }

    /** The materials the last raise names. */
    private Set<Long> lastChange() {
        long now = library.generation();
        return library.materialsChanged(now - 1, now).orElseThrow();
    }

    /** What the last raise says: the materials changed whole, and the samples named for the others. */
    private LibraryChanges.Changes lastChanges() {
        long now = library.generation();
        return library.changesSince(now - 1, now).orElseThrow();
    }

    @Test
    void aWriteOfOneSampleAloneNamesItAndEveryOtherWriteNamesItsMaterialWhole() {
        long a = library.insertMaterial(material("first"));
        assertThat(lastChanges()).isEqualTo(new LibraryChanges.Changes(Set.of(a), java.util.Map.of()));
        SourceFile f1 = file("wavelength_nm,T\n300,0.3\n400,0.8\n");
        long s1 = library.insertSample(a, sample(2, f1));
        assertThat(lastChanges()).isEqualTo(new LibraryChanges.Changes(Set.of(), java.util.Map.of(a, Set.of(s1))));
        SourceFile f2 = file("wavelength_nm,T\n300,0.2\n400,0.7\n");
        long s2 = library.insertSample(a, sample(3, f2), f2);
        assertThat(lastChanges().samplesOnly()).isEqualTo(java.util.Map.of(a, Set.of(s2)));
        SourceFile f3 = file("wavelength_nm,T\n300,0.1\n400,0.6\n");
        long s3 = library.storeImport(a, null, sample(4, f3), f3).sampleId();
        assertThat(lastChanges().samplesOnly()).as("an import into an existing material").isEqualTo(java.util.Map.of(a, Set.of(s3)));
        SourceFile f4 = file("wavelength_nm,T\n300,0.15\n400,0.65\n");
        long b = library.storeImport(null, material("second"), sample(4, f4), f4).materialId();
        assertThat(lastChanges().wholeMaterials()).as("an import making its material").containsExactly(b);
        SourceFile f5 = file("wavelength_nm,T\n300,0.12\n400,0.62\n");
        library.storeBlocks(a, null, List.of(sample(5, f5), sample(6, f5)), f5);
        assertThat(lastChanges().wholeMaterials()).as("several samples at once").containsExactly(a);

        revisions.setRetired(JooqLibraryRevisions.Kind.SAMPLE, s1, true);
        assertThat(lastChanges().samplesOnly()).isEqualTo(java.util.Map.of(a, Set.of(s1)));
        revisions.setRetired(JooqLibraryRevisions.Kind.SAMPLE, s1, false);
        assertThat(lastChanges().samplesOnly()).isEqualTo(java.util.Map.of(a, Set.of(s1)));
        revisions.correctSample(s2, new SampleCorrection(2.1, null, null, null, null, null, null, "callipers"),
                (now, next, perPoint) -> { });
        assertThat(lastChanges().samplesOnly()).isEqualTo(java.util.Map.of(a, Set.of(s2)));
        revisions.setRetired(JooqLibraryRevisions.Kind.MATERIAL, b, true);
        assertThat(lastChanges().wholeMaterials()).containsExactly(b);
        revisions.correctMaterial(b, new MaterialCorrection(null, null, "checked"), m -> { });
        assertThat(lastChanges().wholeMaterials()).containsExactly(b);

        revisions.setRetired(JooqLibraryRevisions.Kind.MATERIAL, b, false);
        assertThat(lastChanges().wholeMaterials()).containsExactly(b);

        // over several changes: a material changed whole once is read whole, whatever samples were named besides
        long before = library.generation();
        revisions.setRetired(JooqLibraryRevisions.Kind.SAMPLE, s3, true);
        revisions.correctMaterial(a, new MaterialCorrection(null, null, "checked"), m -> { });
        SourceFile f6 = file("wavelength_nm,T\n300,0.11\n400,0.61\n");
        library.storeImport(b, null, sample(7, f6), f6);
        LibraryChanges.Changes run = library.changesSince(before, library.generation()).orElseThrow();
        assertThat(run.wholeMaterials()).containsExactly(a);
        assertThat(run.samplesOnly()).containsOnlyKeys(b);
        assertThat(run.materials()).containsExactlyInAnyOrder(a, b);
    }

    @Test
    void everyWritePathNamesTheMaterialItChanged() {
        long a = library.insertMaterial(material("first"));
        assertThat(lastChange()).containsExactly(a);
        SourceFile f1 = file("wavelength_nm,T\n300,0.3\n400,0.8\n");
        long s1 = library.insertSample(a, sample(2, f1));
        assertThat(lastChange()).containsExactly(a);
        SourceFile f2 = file("wavelength_nm,T\n300,0.2\n400,0.7\n");
        library.insertSample(a, sample(3, f2), f2);
        assertThat(lastChange()).containsExactly(a);
        SourceFile f3 = file("wavelength_nm,T\n300,0.1\n400,0.6\n");
        long b = library.storeImport(null, material("second"), sample(4, f3), f3).materialId();
        assertThat(lastChange()).containsExactly(b);
        SourceFile f4 = file("wavelength_nm,T\n300,0.15\n400,0.65\n");
        library.storeBlocks(b, null, List.of(sample(5, f4)), f4);
        assertThat(lastChange()).containsExactly(b);

        revisions.setRetired(JooqLibraryRevisions.Kind.SAMPLE, s1, true);
        assertThat(lastChange()).as("a sample's change names its material").containsExactly(a);
        revisions.setRetired(JooqLibraryRevisions.Kind.SAMPLE, s1, false);
        assertThat(lastChange()).containsExactly(a);
        revisions.setRetired(JooqLibraryRevisions.Kind.MATERIAL, b, true);
        assertThat(lastChange()).containsExactly(b);
        revisions.setRetired(JooqLibraryRevisions.Kind.MATERIAL, b, false);
        assertThat(lastChange()).containsExactly(b);
        revisions.correctSample(s1, new SampleCorrection(2.1, null, null, null, null, null, null, "callipers"),
                (now, next, perPoint) -> { });
        assertThat(lastChange()).containsExactly(a);
        revisions.correctMaterial(b, new MaterialCorrection(null, null, "checked"), m -> { });
        assertThat(lastChange()).containsExactly(b);

        assertThat(library.materialsChanged(0, library.generation())).contains(Set.of(a, b));
    }

    @Test
    void aChangeConcerningNoMaterialIsExplainedAndNamesNone() {
        long a = library.insertMaterial(material("first"));
        db.transaction(tx -> LibraryGeneration.bumpConcerningNoMaterial(tx.dsl()));

        assertThat(lastChange()).isEmpty();
        assertThat(library.materialsChanged(library.generation() - 2, library.generation())).contains(Set.of(a));
    }

    @Test
    void aBareRaiseCannotBeExplainedSoTheGapCannotEither() {
        library.insertMaterial(material("first"));
        long before = library.generation();
        db.transaction(tx -> LibraryGeneration.bump(tx.dsl()));
        library.insertMaterial(material("second"));

        assertThat(library.materialsChanged(before, library.generation())).isEmpty();
        assertThat(library.materialsChanged(before + 1, library.generation())).isPresent();
    }

    @Test
    void aSlotOverwrittenAChangeLaterIsNoLongerExplainedNorIsAnAskBeyondTheRing() {
        long a = library.insertMaterial(material("first"));
        long g = library.generation();
        // the change RING generations later writes the same slot
        db.transaction(tx -> LibraryChanges.record(tx.dsl(), g + LibraryChanges.RING, a));

        assertThat(library.materialsChanged(g - 1, g)).isEmpty();
        assertThat(library.materialsChanged(g - 1 - LibraryChanges.RING, g)).isEmpty();
        assertThat(library.materialsChanged(g, g)).contains(Set.of());
        assertThat(library.materialsChanged(g, g - 1)).as("an index newer than the database").isEmpty();
    }

    @Test
    void theIdentityIsMadeOnceAndKept() {
        String first = library.libraryId();

        assertThat(first).hasSize(36);
        assertThat(new JooqLibraryRepository(db).libraryId()).isEqualTo(first);
    }
}
