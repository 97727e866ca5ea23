package org.spectralsieve.library;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.charset.StandardCharsets;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.condition.EnabledIfEnvironmentVariable;
import org.spectralsieve.audit.AuditTrail;
import org.spectralsieve.audit.AuditTrail.Query;
import org.spectralsieve.audit.AuditTrail.Stored;
import org.spectralsieve.ingest.Checksums;
import org.spectralsieve.library.JooqLibraryRevisions.Kind;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.spectrum.Curve;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.test.context.ActiveProfiles;
import org.springframework.test.context.DynamicPropertyRegistry;
import org.springframework.test.context.DynamicPropertySource;
import tools.jackson.databind.json.JsonMapper;

/**
 * The audit trail on PostgreSQL (docs/audit.md): the V12 table, one entry per change in the change's transaction, none
 * for a refused one, ids that only grow, and the values before and after read back as written. Re-runnable on the same
 * database: every check is relative to what the trail held before. Runs where {@code SIEVE_TEST_POSTGRES_URL} names a
 * database; skipped elsewhere.
 */
@EnabledIfEnvironmentVariable(named = "SIEVE_TEST_POSTGRES_URL", matches = ".+",
        disabledReason = "no PostgreSQL for tests: set SIEVE_TEST_POSTGRES_URL (and SIEVE_TEST_POSTGRES_USER/_PASSWORD)")
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.NONE)
@ActiveProfiles("postgres")
class PostgresAuditTest {

    private static final String RUN = Long.toString(System.nanoTime(), 36);
    private static final JsonMapper JSON = JsonMapper.builder().build();

    @DynamicPropertySource
    static void database(DynamicPropertyRegistry registry) {
        TestPostgres.register(registry);
    }

    @Autowired
    JooqLibraryRepository library;
    @Autowired
    JooqLibraryRevisions revisions;
    @Autowired
    AuditTrail trail;

    private List<Stored> newest(int n) {
        return trail.page(new Query(null, n, null, null));
    }

    private long newestId() {
        List<Stored> one = newest(1);
        return one.isEmpty() ? 0 : one.get(0).id();
    }

    @Test
    void importCorrectRetireAndRestoreEachWriteOneEntryAndARefusalNoneOnPostgres() {
        long start = newestId();
        byte[] bytes = ("wavelength_nm,T\n300,0.3\n400,0.8\n# " + RUN + "\n").getBytes(StandardCharsets.UTF_8);
        SourceFile file = new SourceFile("audit-" + RUN + ".csv", "text/csv", "delimited", bytes, Checksums.sha256(bytes));
        Curve curve = Curve.of(new double[] {300, 400}, new double[] {0.3, 0.8}, 1e-3);
        NewSample sample = new NewSample(3, Geometry.REGULAR, Provenance.MEASURED, "", null, "", "", 1e-3, curve,
                file.fileName(), file.sha256());
        StoredImport stored = library.storeImport(null, new NewMaterial("audit-" + RUN, "Illustrative audit sheet " + RUN,
                MaterialClass.of("plastic sheet"), "", List.of(), Scaling.BULK, new ConstantIndex(1.49)), sample, file);
        long sampleId = stored.sampleId();

        revisions.correctSample(sampleId, new SampleCorrection(3.2, null, null, null, null, null, null, "caliper"),
                (now, next, perPoint) -> { });
        assertThatThrownBy(() -> revisions.correctSample(sampleId, new SampleCorrection(3.4, null, null, null, null, null,
                null, "refused"), (now, next, perPoint) -> {
                    throw new IllegalArgumentException("refused by the check");
                }));
        revisions.setRetired(Kind.SAMPLE, sampleId, true);
        revisions.setRetired(Kind.SAMPLE, sampleId, false);

        List<Stored> mine = trail.page(new Query(null, 10, sampleId, null));
        assertThat(mine).extracting(Stored::action).containsExactly("restore", "retire", "correct", "import");
        assertThat(mine).allMatch(e -> e.id() > start && e.materialId() == stored.materialId());
        assertThat(mine).extracting(Stored::id).isSortedAccordingTo((a, b) -> Long.compare(b, a));
        assertThat(newestId()).isEqualTo(mine.get(0).id());
        Stored correction = mine.get(2);
        assertThat(JSON.readTree(correction.beforeJson()).path("thicknessMm").asDouble()).isEqualTo(3.0);
        assertThat(JSON.readTree(correction.afterJson()).path("thicknessMm").asDouble()).isEqualTo(3.2);
        assertThat(correction.actor()).startsWith("command line (");
        assertThat(JSON.readTree(mine.get(3).afterJson()).path("sourceSha256").asString()).isEqualTo(file.sha256());
    }
}
