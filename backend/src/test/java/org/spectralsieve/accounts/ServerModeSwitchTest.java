package org.spectralsieve.accounts;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.api.Test;
import org.spectralsieve.SpectralSieveApplication;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.WebApplicationType;
import org.springframework.boot.builder.SpringApplicationBuilder;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.context.ApplicationContext;

/**
 * The switch: the embedded default has no sign-in, no CSRF cookie and no accounts API; the shared-server
 * profile refuses to start without server mode.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT, properties = {
        "sieve.seed.load-on-empty=false",
        "sieve.index.dir=",
        "spring.datasource.url=jdbc:h2:mem:server-mode-switch-test;DB_CLOSE_DELAY=-1"})
class ServerModeSwitchTest {

    @LocalServerPort
    int port;
    @Autowired
    ApplicationContext context;

    @Test
    void theEmbeddedDefaultNeedsNoSignInAndInstallsNoSecurityChain() throws Exception {
        ServerHttp anyone = ServerHttp.anonymous(port);
        ServerHttp.Answer session = anyone.get("/api/session");
        assertThat(session.status()).isEqualTo(200);
        assertThat(session.json().path("mode").asString()).isEqualTo("embedded");
        assertThat(anyone.getPage("/").status()).isEqualTo(200);
        assertThat(anyone.get("/api/materials").status()).isEqualTo(200);
        ServerHttp.Answer change = anyone.send("POST", "/api/samples/987654/retire", "");
        assertThat(change.status()).as("reaches the controller: no CSRF refusal, no sign-in").isEqualTo(404);
        assertThat(change.header("Set-Cookie")).isEmpty();
        assertThat(anyone.get("/api/accounts").status()).isEqualTo(404);
        assertThat(context.containsBean("springSecurityFilterChain")).isFalse();
    }

    @Test
    void thePostgresProfileWithoutServerModeRefusesToStartBeforeOpeningTheDatabase() {
        SpringApplicationBuilder app = new SpringApplicationBuilder(SpectralSieveApplication.class)
                .web(WebApplicationType.NONE).profiles("postgres");
        // a database that does not exist: the refusal comes first, so it is never tried
        assertThatThrownBy(() -> app.run("--sieve.server-mode=false",
                "--spring.datasource.url=jdbc:postgresql://127.0.0.1:9/nowhere", "--logging.level.root=OFF"))
                .isInstanceOf(ServerModeRequiredException.class)
                .hasMessageContaining("SIEVE_SERVER_MODE=true");
    }
}
