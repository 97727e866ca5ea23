package org.spectralsieve.api;

import org.junit.jupiter.api.condition.EnabledIfEnvironmentVariable;
import org.spectralsieve.library.TestPostgres;
import org.springframework.test.context.ActiveProfiles;
import org.springframework.test.context.DynamicPropertyRegistry;
import org.springframework.test.context.DynamicPropertySource;

/**
 * {@link BadStoredRowIsolationTest} on PostgreSQL, where {@code SIEVE_TEST_POSTGRES_URL} names a database
 * (CI starts a fresh one); skipped elsewhere.
 */
@EnabledIfEnvironmentVariable(named = TestPostgres.URL_VARIABLE, matches = ".+",
        disabledReason = "no PostgreSQL database named by SIEVE_TEST_POSTGRES_URL")
@ActiveProfiles("postgres")
class PostgresBadStoredRowIsolationTest extends BadStoredRowIsolationTest {

    @Override
    String controlCharacters() {
        return "\u0007\u202e"; // PostgreSQL text refuses NUL itself
    }

    @DynamicPropertySource
    static void postgres(DynamicPropertyRegistry registry) {
        TestPostgres.register(registry);
    }
}
