package org.spectralsieve.library;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import java.util.Random;
import org.jooq.DSLContext;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.condition.EnabledIfEnvironmentVariable;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.search.SearchService;
import org.spectralsieve.search.Shortlist;
import org.spectralsieve.spectrum.Curve;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.test.context.ActiveProfiles;
import org.springframework.test.context.DynamicPropertyRegistry;
import org.springframework.test.context.DynamicPropertySource;

/**
 * The shared-server set-up: the whole application on PostgreSQL with the code generated from H2.
 * Runs where {@code SIEVE_TEST_POSTGRES_URL} names a database (CI starts a fresh one); skipped elsewhere.
 */
@EnabledIfEnvironmentVariable(named = "SIEVE_TEST_POSTGRES_URL", matches = ".+",
        disabledReason = "no PostgreSQL for tests: set SIEVE_TEST_POSTGRES_URL (and SIEVE_TEST_POSTGRES_USER/_PASSWORD)")
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.NONE)
@ActiveProfiles("postgres")
class PostgresLibraryTest {

    @DynamicPropertySource
    static void database(DynamicPropertyRegistry registry) {
        TestPostgres.register(registry);
    }

    @Autowired
    JooqLibraryRepository library;
    @Autowired
    SearchService search;
    @Autowired
    DSLContext db;

    @Test
    void migratesLoadsTheDemoLibraryAndSearchesOnPostgres() {
        assertThat(library.countMaterials()).isGreaterThanOrEqualTo(40);

        // common practice, no source: UV-grade fused silica is the window that passes 254 nm
        Shortlist shortlist = search.search(RequirementParser.parse("passes over 80% at 254 nm, at 3 mm"), 3);

        assertThat(shortlist.rows().get(0).materialName().toLowerCase()).contains("fused silica");
        assertThat(library.findMaterials("plastic sheet", "acrylic")).isNotEmpty(); // case-insensitive filter
    }

    @Test
    void curveRoundTripsBitExactOnPostgres() {
        Random random = new Random(7);
        double[] nm = new double[5000];
        double[] t = new double[5000];
        for (int i = 0; i < nm.length; i++) {
            nm[i] = 190 + i * 0.2 + random.nextDouble() * 0.1;
            t[i] = random.nextDouble();
        }
        Curve curve = Curve.of(nm, t, 1e-3);
        long material = library.insertMaterial(new NewMaterial("pg-round-trip-" + System.nanoTime(), "PG round trip",
                MaterialClass.of("film"), "", List.of(), Scaling.BULK, new ConstantIndex(1.5)));
        long sample = library.insertSample(material, new NewSample(1, Geometry.REGULAR, Provenance.MEASURED, "", null, "",
                "", 1e-3, curve, "pg.csv", "0".repeat(64)));

        assertThat(library.findCurve(sample).orElseThrow()).isEqualTo(curve);
    }
}
