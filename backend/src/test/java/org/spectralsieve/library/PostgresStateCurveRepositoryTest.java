package org.spectralsieve.library;

import org.jooq.DSLContext;
import org.junit.jupiter.api.condition.EnabledIfEnvironmentVariable;

/**
 * {@link StateCurveRepositoryTest} once more on PostgreSQL, each test in a schema of its own; skipped where
 * {@code SIEVE_TEST_POSTGRES_URL} names none.
 */
@EnabledIfEnvironmentVariable(named = TestPostgres.URL_VARIABLE, matches = ".+",
        disabledReason = "no PostgreSQL for tests: set SIEVE_TEST_POSTGRES_URL (and SIEVE_TEST_POSTGRES_USER/_PASSWORD)")
class PostgresStateCurveRepositoryTest extends StateCurveRepositoryTest {

    @Override
    DSLContext freshDatabase() {
        return MigratedDatabase.freshPostgres("state_curves");
    }
}
