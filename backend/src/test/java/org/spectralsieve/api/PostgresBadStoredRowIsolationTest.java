package org.spectralsieve.api;

import java.net.http.HttpRequest;
import org.junit.jupiter.api.condition.EnabledIfEnvironmentVariable;
import org.spectralsieve.accounts.AccountAdministration;
import org.spectralsieve.accounts.Role;
import org.spectralsieve.library.TestPostgres;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.test.context.ActiveProfiles;
import org.springframework.test.context.DynamicPropertyRegistry;
import org.springframework.test.context.DynamicPropertySource;

/**
 * {@link BadStoredRowIsolationTest} on PostgreSQL, where {@code SIEVE_TEST_POSTGRES_URL} names a database
 * (CI starts a fresh one); skipped elsewhere. The postgres profile runs in server mode, so the requests carry
 * a viewer's API token.
 */
@EnabledIfEnvironmentVariable(named = TestPostgres.URL_VARIABLE, matches = ".+",
        disabledReason = "no PostgreSQL database named by SIEVE_TEST_POSTGRES_URL")
@ActiveProfiles("postgres")
class PostgresBadStoredRowIsolationTest extends BadStoredRowIsolationTest {

    @Autowired
    AccountAdministration accounts;

    private String token;

    @Override
    HttpRequest.Builder signedIn(HttpRequest.Builder request) {
        if (token == null) {
            var viewer = accounts.createAccount("wren-" + System.nanoTime(), Role.VIEWER, "larkspur-lane-bench-7");
            token = accounts.createToken(viewer, "bad stored rows test").secret();
        }
        return request.header("Authorization", "Bearer " + token);
    }

    @Override
    String controlCharacters() {
        return "\u0007\u202e"; // PostgreSQL text refuses NUL itself
    }

    @DynamicPropertySource
    static void postgres(DynamicPropertyRegistry registry) {
        TestPostgres.register(registry);
    }
}
