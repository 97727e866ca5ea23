package org.spectralsieve.accounts;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.condition.EnabledIfEnvironmentVariable;
import org.spectralsieve.library.TestPostgres;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.ActiveProfiles;
import org.springframework.test.context.DynamicPropertyRegistry;
import org.springframework.test.context.DynamicPropertySource;

/**
 * Server mode on the shared-server profile (PostgreSQL, where server mode is on by default): accounts, sessions,
 * roles and tokens work on its tables too. Runs where {@code SIEVE_TEST_POSTGRES_URL} names a database.
 */
@EnabledIfEnvironmentVariable(named = TestPostgres.URL_VARIABLE, matches = ".+",
        disabledReason = "no PostgreSQL for tests: set SIEVE_TEST_POSTGRES_URL (and SIEVE_TEST_POSTGRES_USER/_PASSWORD)")
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT, properties = "sieve.index.dir=")
@ActiveProfiles("postgres")
class PostgresAccountsTest {

    @DynamicPropertySource
    static void database(DynamicPropertyRegistry registry) {
        TestPostgres.register(registry);
    }

    @LocalServerPort
    int port;
    @Autowired
    AccountAdministration administration;

    @Test
    void theSharedServerSignsInChecksRolesAndRevokesTokensOnPostgres() throws Exception {
        Account wren = TestAccounts.create(administration, "wren-" + System.nanoTime(), Role.VIEWER);
        ServerHttp browser = ServerHttp.anonymous(port);
        assertThat(browser.get("/api/materials").status()).isEqualTo(401);
        assertThat(browser.signIn(wren.name(), TestAccounts.PASSWORD).status()).isEqualTo(200);
        assertThat(browser.get("/api/materials").status()).isEqualTo(200);
        assertThat(browser.sendWithCsrf("POST", "/api/imports", "{}").status()).isEqualTo(403);

        AccountAdministration.CreatedToken token = administration.createToken(wren, "postgres script");
        ServerHttp script = ServerHttp.withToken(port, token.secret());
        assertThat(script.get("/api/session").json().path("name").asString()).isEqualTo(wren.name());
        administration.revokeToken(wren, token.token().id());
        assertThat(script.get("/api/session").status()).isEqualTo(401);

        Account again = administration.changeRole(wren.id(), Role.EDITOR);
        assertThat(again.role()).isEqualTo(Role.EDITOR);
        assertThat(browser.sendWithCsrf("POST", "/api/samples/987654321/retire", "").status()).isEqualTo(404);
    }
}
