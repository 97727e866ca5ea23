package org.spectralsieve.library;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.spectralsieve.library.LibraryGenerationTest.file;
import static org.spectralsieve.library.LibraryGenerationTest.material;
import static org.spectralsieve.library.LibraryGenerationTest.sample;

import java.util.List;
import org.jooq.DSLContext;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.spectralsieve.audit.ActingUser;
import org.spectralsieve.audit.AuditTrail;
import org.spectralsieve.audit.AuditTrail.Query;
import org.spectralsieve.audit.AuditTrail.Stored;
import org.spectralsieve.library.JooqLibraryRevisions.Kind;
import org.spectralsieve.optics.ConstantIndex;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Every write of samples and materials records exactly one audit entry in its own transaction, naming the actor, the
 * action, the subject and the values before and after; a refused or empty write records none (docs/audit.md).
 */
class LibraryAuditTest {

    private static final JsonMapper JSON = JsonMapper.builder().build();

    private DSLContext db;
    private JooqLibraryRepository library;
    private JooqLibraryRevisions revisions;
    private AuditTrail trail;

    @BeforeEach
    void freshLibraryActedOnByWren() {
        db = MigratedDatabase.freshH2();
        library = new JooqLibraryRepository(db, ActingUser.named("wren"));
        revisions = new JooqLibraryRevisions(db, ActingUser.named("juniper-admin"));
        trail = new AuditTrail(db);
    }

    private List<Stored> all() {
        return trail.page(new Query(null, AuditTrail.MAX_PAGE, null, null));
    }

    private static JsonNode json(String text) {
        return text == null ? null : JSON.readTree(text);
    }

    @Test
    void anImportIntoANewMaterialWritesOneEntryNamingActorSampleMaterialAndFile() {
        SourceFile f = file("wavelength_nm,T\n300,0.3\n400,0.8\n");
        StoredImport stored = library.storeImport(null, material("larkspur-acrylic"), sample(3, f), f);

        List<Stored> entries = all();
        assertThat(entries).hasSize(1);
        Stored e = entries.get(0);
        assertThat(e.actor()).isEqualTo("wren");
        assertThat(e.action()).isEqualTo("import");
        assertThat(e.subjectKind()).isEqualTo("sample");
        assertThat(e.subjectId()).isEqualTo(stored.sampleId());
        assertThat(e.materialId()).isEqualTo(stored.materialId());
        assertThat(e.beforeJson()).isNull();
        JsonNode after = json(e.afterJson());
        assertThat(after.path("sample").path("thicknessMm").asDouble()).isEqualTo(3.0);
        assertThat(after.path("sample").path("revision").asInt()).isEqualTo(1);
        assertThat(after.path("sourceSha256").asString()).isEqualTo(f.sha256());
        assertThat(after.path("newMaterial").path("slug").asString()).isEqualTo("larkspur-acrylic");
        assertThat(e.summary()).contains("sample " + stored.sampleId()).contains("larkspur-acrylic");
    }

    @Test
    void aDuplicateImportChangesNothingAndWritesNoEntry() {
        SourceFile f = file("wavelength_nm,T\n300,0.3\n400,0.8\n");
        StoredImport first = library.storeImport(null, material("fernhollow-glass"), sample(3, f), f);
        StoredImport again = library.storeImport(first.materialId(), null, sample(3, f), f);

        assertThat(again.duplicate()).isTrue();
        assertThat(all()).hasSize(1);
    }

    @Test
    void anImportThatFailsBeforeCommitLeavesNeitherRowsNorEntry() {
        JooqLibraryRepository failing = new JooqLibraryRepository(db, ActingUser.named("wren")) {
            @Override
            protected void insertSourceFile(DSLContext t, long sampleId, SourceFile file) {
                throw new IllegalStateException("the disk filled up");
            }
        };
        SourceFile f = file("wavelength_nm,T\n300,0.3\n400,0.8\n");

        assertThatThrownBy(() -> failing.storeImport(null, material("never-stored"), sample(3, f), f))
                .hasMessageContaining("disk filled");
        assertThat(all()).isEmpty();
    }

    @Test
    void anImportRefusedForARetiredMaterialWritesNoEntry() {
        long materialId = library.insertMaterial(material("shelved"));
        revisions.setRetired(Kind.MATERIAL, materialId, true);
        int before = all().size();
        SourceFile f = file("wavelength_nm,T\n300,0.3\n400,0.8\n");

        assertThatThrownBy(() -> library.storeImport(materialId, null, sample(3, f), f)).isInstanceOf(RetiredException.class);
        assertThat(all()).hasSize(before);
    }

    @Test
    void eachBlockOfAFileStoredWritesItsOwnEntryAndOnlyTheFirstNamesTheNewMaterial() {
        SourceFile f = file("two blocks");
        StoredBlocks stored = library.storeBlocks(null, material("two-blocks"), List.of(sample(2, f), sample(4, f)), f);

        List<Stored> entries = all();
        assertThat(entries).hasSize(2);
        assertThat(entries).extracting(Stored::subjectId).containsExactlyInAnyOrder(
                stored.samples().get(0).sampleId(), stored.samples().get(1).sampleId());
        assertThat(entries).allMatch(e -> e.action().equals("import") && e.materialId() == stored.materialId());
        // newest first: the second block's entry, then the first's, which made the material
        assertThat(json(entries.get(1).afterJson()).path("newMaterial").path("id").asLong()).isEqualTo(stored.materialId());
        assertThat(json(entries.get(0).afterJson()).path("newMaterial").isNull()).isTrue();
    }

    @Test
    void aSampleCorrectionRecordsTheOldAndTheNewValues() {
        SourceFile f = file("wavelength_nm,T\n300,0.3\n400,0.8\n");
        long sampleId = library.storeImport(null, material("corrected"), sample(3, f), f).sampleId();

        revisions.correctSample(sampleId, new SampleCorrection(3.1, null, null, null, "lot-7", null, null,
                "caliper read again"), (now, next, perPoint) -> { });

        Stored e = all().get(0);
        assertThat(e.actor()).isEqualTo("juniper-admin");
        assertThat(e.action()).isEqualTo("correct");
        assertThat(e.subjectId()).isEqualTo(sampleId);
        assertThat(e.summary()).contains("revision 1 to 2").contains("caliper read again");
        assertThat(json(e.beforeJson()).path("thicknessMm").asDouble()).isEqualTo(3.0);
        assertThat(json(e.afterJson()).path("thicknessMm").asDouble()).isEqualTo(3.1);
        assertThat(json(e.beforeJson()).path("lot").asString()).isEqualTo("");
        assertThat(json(e.afterJson()).path("lot").asString()).isEqualTo("lot-7");
        assertThat(json(e.afterJson()).path("revision").asInt()).isEqualTo(2);
    }

    @Test
    void aRefusedCorrectionWritesNoEntry() {
        SourceFile f = file("wavelength_nm,T\n300,0.3\n400,0.8\n");
        long sampleId = library.storeImport(null, material("refused"), sample(3, f), f).sampleId();
        int before = all().size();

        assertThatThrownBy(() -> revisions.correctSample(sampleId, new SampleCorrection(3.1, null, null, null, null,
                null, null, "no"), (now, next, perPoint) -> {
                    throw new IllegalArgumentException("refused by the check");
                })).hasMessageContaining("refused");
        assertThat(all()).hasSize(before);
    }

    @Test
    void aMaterialCorrectionRecordsTheOldAndTheNewIndex() {
        long materialId = library.insertMaterial(material("reindexed"));

        revisions.correctMaterial(materialId, new MaterialCorrection(new ConstantIndex(1.52), null, "refractometer"),
                m -> { });

        Stored e = all().get(0);
        assertThat(e.action()).isEqualTo("correct");
        assertThat(e.subjectKind()).isEqualTo("material");
        assertThat(e.subjectId()).isEqualTo(materialId);
        assertThat(json(e.beforeJson()).path("refractiveIndex").path("n").asDouble()).isEqualTo(1.49);
        assertThat(json(e.afterJson()).path("refractiveIndex").path("n").asDouble()).isEqualTo(1.52);
        assertThat(json(e.afterJson()).path("revision").asInt()).isEqualTo(2);
    }

    @Test
    void retiringAndRestoringRecordOneEntryEachAndANoOpRecordsNone() {
        long materialId = library.insertMaterial(material("retired-and-back"));
        SourceFile f = file("wavelength_nm,T\n300,0.3\n400,0.8\n");
        long sampleId = library.insertSample(materialId, sample(2, f), f);
        int start = all().size();

        revisions.setRetired(Kind.SAMPLE, sampleId, true);
        revisions.setRetired(Kind.SAMPLE, sampleId, true); // already retired: nothing changes
        revisions.setRetired(Kind.SAMPLE, sampleId, false);
        revisions.setRetired(Kind.MATERIAL, materialId, true);
        revisions.setRetired(Kind.MATERIAL, materialId, false);

        List<Stored> entries = all().subList(0, all().size() - start);
        assertThat(entries).extracting(e -> e.action() + " " + e.subjectKind() + " " + e.subjectId()).containsExactly(
                "restore material " + materialId, "retire material " + materialId,
                "restore sample " + sampleId, "retire sample " + sampleId);
        Stored retired = entries.get(3);
        assertThat(json(retired.beforeJson()).path("retiredAt").isNull()).isTrue();
        assertThat(json(retired.afterJson()).path("retiredAt").isNull()).isFalse();
        assertThat(entries).allMatch(e -> e.actor().equals("juniper-admin") && e.materialId() == materialId);
    }

    @Test
    void pagesGoNewestFirstByIdAndFilterBySampleAndMaterial() {
        long a = library.insertMaterial(material("alpha"));
        long b = library.insertMaterial(material("beta"));
        SourceFile f1 = file("wavelength_nm,T\n300,0.3\n400,0.8\n");
        SourceFile f2 = file("wavelength_nm,T\n300,0.2\n400,0.7\n");
        long s1 = library.insertSample(a, sample(2, f1), f1);
        long s2 = library.insertSample(b, sample(3, f2), f2);
        revisions.setRetired(Kind.SAMPLE, s1, true);

        List<Stored> entries = all();
        assertThat(entries).hasSize(5);
        assertThat(entries).extracting(Stored::id).isSortedAccordingTo((x, y) -> Long.compare(y, x));
        List<Stored> firstTwo = trail.page(new Query(null, 2, null, null));
        List<Stored> nextTwo = trail.page(new Query(firstTwo.get(1).id(), 2, null, null));
        assertThat(firstTwo).containsExactlyElementsOf(entries.subList(0, 2));
        assertThat(nextTwo).containsExactlyElementsOf(entries.subList(2, 4));

        assertThat(trail.page(new Query(null, 100, s1, null))).extracting(Stored::action).containsExactly("retire", "import");
        assertThat(trail.page(new Query(null, 100, null, b))).extracting(Stored::subjectId).containsExactly(s2, b);
        assertThat(trail.page(new Query(null, 100, s2, a))).isEmpty();
    }

    @Test
    void idsOfRolledBackWritesAreNotHandedOutAgain() {
        library.insertMaterial(material("first"));
        long firstId = all().get(0).id();
        JooqLibraryRepository failing = new JooqLibraryRepository(db, ActingUser.named("wren")) {
            @Override
            protected void insertSourceFile(DSLContext t, long sampleId, SourceFile file) {
                throw new IllegalStateException("refused late");
            }
        };
        SourceFile f = file("wavelength_nm,T\n300,0.3\n400,0.8\n");
        assertThatThrownBy(() -> failing.storeImport(null, material("rolled-back"), sample(3, f), f));
        library.insertMaterial(material("second"));

        assertThat(all()).hasSize(2);
        assertThat(all().get(0).id()).isGreaterThan(firstId);
    }
}
