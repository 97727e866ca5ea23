package org.spectralsieve.search;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.condition.EnabledIfEnvironmentVariable;
import org.junit.jupiter.api.io.TempDir;
import org.spectralsieve.ingest.Checksums;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.MaterialClass;
import org.spectralsieve.library.NewMaterial;
import org.spectralsieve.library.NewSample;
import org.spectralsieve.library.Provenance;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.library.SourceFile;
import org.spectralsieve.library.TestPostgres;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.requirement.RankedRow;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.spectra.ImportedSpectrumLookup;
import org.spectralsieve.spectrum.Curve;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.test.context.ActiveProfiles;
import org.springframework.test.context.DynamicPropertyRegistry;
import org.springframework.test.context.DynamicPropertySource;

/**
 * The shared-server case: this JVM is an application node on PostgreSQL (its search store and lookup built
 * and kept), and the command line in a separate JVM writes into the same database. Runs where
 * {@code SIEVE_TEST_POSTGRES_URL} names a database (CI starts one); skipped elsewhere. The database may hold
 * other tests' rows, so every name here carries this run's own suffix.
 */
@EnabledIfEnvironmentVariable(named = TestPostgres.URL_VARIABLE, matches = ".+",
        disabledReason = "no PostgreSQL for tests: set SIEVE_TEST_POSTGRES_URL (and SIEVE_TEST_POSTGRES_USER/_PASSWORD)")
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.NONE)
@ActiveProfiles("postgres")
class PostgresTwoProcessFreshnessTest {

    @DynamicPropertySource
    static void database(DynamicPropertyRegistry registry) {
        TestPostgres.register(registry);
    }

    @Autowired
    SearchService search;
    @Autowired
    ImportedSpectrumLookup lookup;
    @Autowired
    JooqLibraryRepository library;

    @Test
    void aCommandLineImportIntoTheSharedDatabaseIsInTheNodesNextSearch(@TempDir Path dir) throws Exception {
        long run = System.currentTimeMillis();
        String materialClass = "probe sheet " + run;
        String emitter = "probe-lamp-" + run;
        var requirement = RequirementParser.parse("passes over 10% at 350 nm, class " + materialClass);
        assertThat(search.search(requirement, 10).rows()).isEmpty(); // the store is built and kept
        assertThat(lookup.emitter(emitter)).isEmpty();
        long before = library.generation();

        String url = System.getenv(TestPostgres.URL_VARIABLE);
        Map<String, String> postgres = Map.of("SPRING_PROFILES_ACTIVE", "postgres",
                "SIEVE_DB_USER", envOr("SIEVE_TEST_POSTGRES_USER", "sieve"),
                "SIEVE_DB_PASSWORD", envOr("SIEVE_TEST_POSTGRES_PASSWORD", "sieve"));
        SieveProcess.run(dir, postgres, "import", SieveProcess.importFolder(dir, "Illustrative probe sheet " + run,
                materialClass).toString(), "--db-url", url).succeeded();
        SieveProcess.run(dir, postgres, "import-spectrum", "--kind", "emitter", "--name", emitter,
                SieveProcess.emitterFile(dir).toString(), "--db-url", url).succeeded();

        List<String> names = search.search(requirement, 10).rows().stream().map(RankedRow::materialName).toList();
        assertThat(names).containsExactly("Illustrative probe sheet " + run);
        assertThat(lookup.emitter(emitter)).isPresent();
        assertThat(library.generation()).as("at least the sheet's and the emitter's commits").isGreaterThanOrEqualTo(before + 2);
    }

    /** Each writer holds its own pooled connection: PostgreSQL queues the row's UPDATEs, none is lost. */
    @Test
    void concurrentWritersOnPostgresNeverLoseARaise() throws Exception {
        long run = System.currentTimeMillis();
        long materialId = library.insertMaterial(new NewMaterial("busy-probe-" + run, "Illustrative busy probe " + run,
                MaterialClass.of("plastic sheet"), "", List.of(), Scaling.BULK, new ConstantIndex(1.49)));
        long before = library.generation();
        int writers = 4;
        int each = 10;
        ExecutorService pool = Executors.newFixedThreadPool(writers);
        try {
            List<Future<?>> done = new ArrayList<>();
            for (int w = 0; w < writers; w++) {
                int writer = w;
                done.add(pool.submit(() -> {
                    for (int i = 0; i < each; i++) {
                        byte[] bytes = ("wavelength_nm,T\n300,0.3\n400,0.8\n# " + run + " " + writer + " " + i + "\n")
                                .getBytes(StandardCharsets.UTF_8);
                        SourceFile f = new SourceFile("busy.csv", "text/csv", "delimited", bytes, Checksums.sha256(bytes));
                        Curve curve = Curve.of(new double[] {300, 400}, new double[] {0.3, 0.8}, 1e-3);
                        library.insertSample(materialId, new NewSample(1 + writer * each + i, Geometry.REGULAR,
                                Provenance.MEASURED, "", null, "", "", 1e-3, curve, f.fileName(), f.sha256()), f);
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

        // other tests on this database may write meanwhile only in other classes, which run one at a time
        assertThat(library.generation()).isEqualTo(before + (long) writers * each);
    }

    private static String envOr(String name, String fallback) {
        String value = System.getenv(name);
        return value == null ? fallback : value;
    }
}
