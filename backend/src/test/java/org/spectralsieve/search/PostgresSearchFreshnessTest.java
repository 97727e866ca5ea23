package org.spectralsieve.search;

import org.jooq.DSLContext;
import org.junit.jupiter.api.condition.EnabledIfEnvironmentVariable;
import org.spectralsieve.library.MigratedDatabase;
import org.spectralsieve.library.TestPostgres;

/**
 * {@link SearchFreshnessTest} (a search answers from the library as committed when it starts, whoever wrote it) once more on PostgreSQL, each test in a schema of
 * its own (docs/shared-server.md, "Tests that run twice"); skipped where {@code SIEVE_TEST_POSTGRES_URL} names none.
 */
@EnabledIfEnvironmentVariable(named = TestPostgres.URL_VARIABLE, matches = ".+",
        disabledReason = "no PostgreSQL for tests: set SIEVE_TEST_POSTGRES_URL (and SIEVE_TEST_POSTGRES_USER/_PASSWORD)")
class PostgresSearchFreshnessTest extends SearchFreshnessTest {

    @Override
    DSLContext freshDatabase() {
        return MigratedDatabase.freshPostgres("search_freshness");
    }
}
