package org.spectralsieve.bench;

import static org.spectralsieve.bench.BenchStats.ms;
import static org.spectralsieve.bench.BenchStats.percentile;

import com.zaxxer.hikari.HikariDataSource;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.flywaydb.core.Flyway;
import org.jooq.DSLContext;
import org.jooq.SQLDialect;
import org.jooq.conf.RenderQuotedNames;
import org.jooq.conf.Settings;
import org.jooq.impl.DSL;
import org.junit.jupiter.api.Test;
import org.spectralsieve.ingest.Checksums;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.MaterialClass;
import org.spectralsieve.library.NewMaterial;
import org.spectralsieve.library.NewSample;
import org.spectralsieve.library.Provenance;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.library.SourceFile;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.search.SearchService;
import org.spectralsieve.seed.DemoLibraryLoader;
import org.spectralsieve.spectrum.Curve;
import org.springframework.core.io.DefaultResourceLoader;

/**
 * What the freshness check costs ({@code docs/freshness.md}): one read of the change counter, timed alone,
 * beside a search on a kept store (which includes one such read) and the first search after a write (which
 * rebuilds the store). The demo library in an H2 file database behind a connection pool, as the embedded
 * default runs; the counter read alone also on PostgreSQL when {@code SIEVE_TEST_POSTGRES_URL} is set. Run by
 * {@code mvn -B -q -Pbench -pl backend -am verify -Dtest=FreshnessCheckBenchmark -Dbench.heap=1g}; prints
 * {@code BENCH freshness ...} lines, asserts nothing about time.
 */
class FreshnessCheckBenchmark {

    static final String REQUIREMENT = "passes over 80% at 365 nm and blocks under 1% at 254 nm";

    @Test
    void counterReadAgainstSearch() throws Exception {
        Path dir = Files.createTempDirectory("freshness-bench");
        try (HikariDataSource pool = pool("jdbc:h2:file:" + dir.resolve("library").toAbsolutePath(), "sa", "")) {
            Flyway.configure().dataSource(pool).load().migrate();
            DSLContext db = DSL.using(pool, SQLDialect.H2);
            JooqLibraryRepository library = new JooqLibraryRepository(db);
            new DemoLibraryLoader(library, db, new DefaultResourceLoader(), "classpath:seed-materials/").load();
            SearchService search = new SearchService(library);
            Requirement requirement = RequirementParser.parse(REQUIREMENT);

            double[] checks = timeChecks(library);
            double[] searches = new double[BenchStats.intProperty("bench.freshnessSearches", 200)];
            for (int i = -20; i < searches.length; i++) {
                long t0 = System.nanoTime();
                search.search(requirement, 20);
                if (i >= 0) {
                    searches[i] = (System.nanoTime() - t0) / 1e6;
                }
            }
            double[] rebuilds = new double[BenchStats.intProperty("bench.freshnessRebuilds", 15)];
            long probe = library.insertMaterial(new NewMaterial("bench-probe", "Illustrative bench probe",
                    MaterialClass.of("plastic sheet"), "", List.of(), Scaling.BULK, new ConstantIndex(1.49)));
            for (int i = 0; i < rebuilds.length; i++) {
                store(library, probe, i);
                long t0 = System.nanoTime();
                search.search(requirement, 20);
                rebuilds[i] = (System.nanoTime() - t0) / 1e6;
            }
            System.out.printf("BENCH freshness db=h2-file samples=%d check_p50_ms=%s check_p95_ms=%s check_p99_ms=%s"
                            + " search_p50_ms=%s search_p95_ms=%s check_share_of_search_p50=%s"
                            + " search_after_write_p50_ms=%s search_after_write_p95_ms=%s%n",
                    library.findAllCurves().size(), ms(percentile(checks, 50)), ms(percentile(checks, 95)),
                    ms(percentile(checks, 99)), ms(percentile(searches, 50)), ms(percentile(searches, 95)),
                    String.format(java.util.Locale.ROOT, "%.4f", percentile(checks, 50) / percentile(searches, 50)),
                    ms(percentile(rebuilds, 50)), ms(percentile(rebuilds, 95)));
        }
        String pg = System.getenv("SIEVE_TEST_POSTGRES_URL");
        if (pg != null && !pg.isBlank()) {
            try (HikariDataSource pool = pool(pg, envOr("SIEVE_TEST_POSTGRES_USER", "sieve"),
                    envOr("SIEVE_TEST_POSTGRES_PASSWORD", "sieve"))) {
                Flyway.configure().dataSource(pool).load().migrate();
                double[] checks = timeChecks(new JooqLibraryRepository(DSL.using(pool, SQLDialect.POSTGRES,
                        // as the application renders them (LibraryConfiguration): PostgreSQL folds the names itself
                        new Settings().withRenderQuotedNames(RenderQuotedNames.NEVER))));
                System.out.printf("BENCH freshness db=postgres-loopback check_p50_ms=%s check_p95_ms=%s check_p99_ms=%s%n",
                        ms(percentile(checks, 50)), ms(percentile(checks, 95)), ms(percentile(checks, 99)));
            }
        }
    }

    private static double[] timeChecks(JooqLibraryRepository library) {
        double[] checks = new double[BenchStats.intProperty("bench.freshnessChecks", 20000)];
        for (int i = -5000; i < checks.length; i++) {
            long t0 = System.nanoTime();
            library.generation();
            if (i >= 0) {
                checks[i] = (System.nanoTime() - t0) / 1e6;
            }
        }
        return checks;
    }

    private static void store(JooqLibraryRepository library, long materialId, int i) {
        byte[] bytes = ("wavelength_nm,T\n250,0.01\n400,0.9\n# " + i + "\n").getBytes(StandardCharsets.UTF_8);
        SourceFile f = new SourceFile("probe.csv", "text/csv", "delimited", bytes, Checksums.sha256(bytes));
        Curve curve = Curve.of(new double[] {250, 400}, new double[] {0.01, 0.9}, 1e-3);
        library.insertSample(materialId, new NewSample(1 + i, Geometry.REGULAR, Provenance.MEASURED, "", null, "", "",
                1e-3, curve, f.fileName(), f.sha256()), f);
    }

    private static HikariDataSource pool(String url, String user, String password) {
        HikariDataSource pool = new HikariDataSource();
        pool.setJdbcUrl(url);
        pool.setUsername(user);
        pool.setPassword(password);
        pool.setMaximumPoolSize(4);
        return pool;
    }

    private static String envOr(String name, String fallback) {
        String value = System.getenv(name);
        return value == null ? fallback : value;
    }
}
