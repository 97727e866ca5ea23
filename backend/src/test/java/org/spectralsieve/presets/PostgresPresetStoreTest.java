package org.spectralsieve.presets;

import org.jooq.DSLContext;
import org.junit.jupiter.api.condition.EnabledIfEnvironmentVariable;
import org.spectralsieve.library.MigratedDatabase;
import org.spectralsieve.library.TestPostgres;

/**
 * {@link PresetStoreTest} once more on PostgreSQL, each test in a schema of its own; skipped where
 * {@code SIEVE_TEST_POSTGRES_URL} names no database.
 */
@EnabledIfEnvironmentVariable(named = TestPostgres.URL_VARIABLE, matches = ".+",
        disabledReason = "no PostgreSQL for tests: set SIEVE_TEST_POSTGRES_URL (and SIEVE_TEST_POSTGRES_USER/_PASSWORD)")
class PostgresPresetStoreTest extends PresetStoreTest {

    @Override
    DSLContext freshDatabase() {
        return MigratedDatabase.freshPostgres("presets");
    }
}
