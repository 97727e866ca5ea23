package org.spectralsieve.library;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.condition.EnabledIfEnvironmentVariable;
import org.spectralsieve.curation.LibraryCuration;
import org.spectralsieve.library.JooqLibraryRevisions.Kind;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.search.SearchService;
import org.spectralsieve.search.Shortlist;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.test.context.ActiveProfiles;
import org.springframework.test.context.DynamicPropertyRegistry;
import org.springframework.test.context.DynamicPropertySource;

/**
 * Undo without loss (docs/undo.md) on PostgreSQL: the V6 migration, retire and restore, and revisions (the
 * spectrum name rule is checked in PostgresReferenceSpectrumTest). Re-runnable on the same database:
 * every check is relative to what the database held before. Runs where {@code SIEVE_TEST_POSTGRES_URL}
 * names a database; skipped elsewhere.
 */
@EnabledIfEnvironmentVariable(named = "SIEVE_TEST_POSTGRES_URL", matches = ".+",
        disabledReason = "no PostgreSQL for tests: set SIEVE_TEST_POSTGRES_URL (and SIEVE_TEST_POSTGRES_USER/_PASSWORD)")
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.NONE)
@ActiveProfiles("postgres")
class PostgresUndoTest {

    private static final String RUN = Long.toString(System.nanoTime(), 36);

    @DynamicPropertySource
    static void database(DynamicPropertyRegistry registry) {
        TestPostgres.register(registry);
    }

    @Autowired
    JooqLibraryRepository library;
    @Autowired
    JooqLibraryRevisions revisions;
    @Autowired
    LibraryCuration curation;
    @Autowired
    SearchService search;

    @Test
    void retiringAndRestoringASampleOnPostgresGivesTheSameShortlist() {
        // common practice, no source: UV-grade fused silica is the window that passes 254 nm
        var requirement = RequirementParser.parse("passes over 80% at 254 nm, at 3 mm");
        Shortlist before = search.search(requirement, 5);
        long sampleId = before.rows().get(0).evaluation().sampleId();

        curation.retire(Kind.SAMPLE, sampleId);
        Shortlist during = search.search(requirement, 5);
        curation.restore(Kind.SAMPLE, sampleId);
        Shortlist after = search.search(requirement, 5);

        assertThat(during.rows()).noneMatch(r -> r.evaluation().sampleId() == sampleId);
        assertThat(after.rows()).isEqualTo(before.rows());
        assertThat(library.findSample(sampleId).orElseThrow().retired()).isFalse();
    }

    @Test
    void correctionsAddRevisionsAndKeepEveryEarlierOneOnPostgres() {
        long materialId = library.findMaterialIdBySlug("petg-sheet").orElseThrow();
        Material m = library.findMaterial(materialId).orElseThrow();
        SampleInfo s = m.samples().get(0);
        int sampleRevisions = revisions.sampleRevisions(s.id()).size();
        int materialRevisions = revisions.materialRevisions(materialId).size();

        SampleRevision r = curation.correct(s.id(), new SampleCorrection(null, null, null, null, "lot-" + RUN, null,
                null, "lot number was swapped"));
        MaterialRevision mr = curation.correct(materialId, new MaterialCorrection(
                otherIndexThan(m), null, "index from a refractometer"));

        assertThat(r.revision()).isEqualTo(s.revision() + 1);
        assertThat(revisions.sampleRevisions(s.id())).hasSize(sampleRevisions + 1);
        assertThat(revisions.sampleRevision(s.id(), s.revision()).orElseThrow().lot()).isEqualTo(s.lot());
        assertThat(library.findSample(s.id()).orElseThrow().lot()).isEqualTo("lot-" + RUN);
        assertThat(mr.revision()).isEqualTo(m.revision() + 1);
        assertThat(revisions.materialRevisions(materialId)).hasSize(materialRevisions + 1);
        assertThat(revisions.materialRevision(materialId, m.revision()).orElseThrow().refractiveIndex())
                .isEqualTo(m.refractiveIndex());
    }

    /** An index the material does not have now, so the correction changes something on every run. */
    private static ConstantIndex otherIndexThan(Material m) {
        if (m.refractiveIndex() instanceof ConstantIndex c) {
            return new ConstantIndex(c.n() >= 1.7 ? 1.45 : c.n() + 0.001);
        }
        return new ConstantIndex(1.55);
    }
}
