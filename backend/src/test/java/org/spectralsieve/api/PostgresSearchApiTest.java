package org.spectralsieve.api;

import org.junit.jupiter.api.condition.EnabledIfEnvironmentVariable;
import org.spectralsieve.accounts.AdminTokenOnEveryRequest;
import org.spectralsieve.library.TestPostgres;
import org.springframework.context.annotation.Import;
import org.springframework.test.context.ActiveProfiles;
import org.springframework.test.context.DynamicPropertyRegistry;
import org.springframework.test.context.DynamicPropertySource;

/**
 * {@link SearchApiTest} (the search endpoint) once more on PostgreSQL, in a schema of its own
 * (docs/shared-server.md, "Tests that run twice"), in server mode as the postgres profile has it, each request
 * signed with an admin's token ({@link AdminTokenOnEveryRequest}); skipped where {@code SIEVE_TEST_POSTGRES_URL} names none.
 */
@EnabledIfEnvironmentVariable(named = TestPostgres.URL_VARIABLE, matches = ".+",
        disabledReason = "no PostgreSQL for tests: set SIEVE_TEST_POSTGRES_URL (and SIEVE_TEST_POSTGRES_USER/_PASSWORD)")
@ActiveProfiles("postgres")
@Import(AdminTokenOnEveryRequest.class)
class PostgresSearchApiTest extends SearchApiTest {

    @DynamicPropertySource
    static void postgres(DynamicPropertyRegistry registry) {
        TestPostgres.registerFreshSchema(registry, "search_api");
    }
}
