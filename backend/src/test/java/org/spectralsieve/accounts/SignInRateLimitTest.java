package org.spectralsieve.accounts;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;

/**
 * Wrong passwords pause sign-in: per name after 5 in the window, per client address after 8 here (20 by
 * default). One test, in order, since every attempt of this class comes from the same address.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT, properties = {
        "sieve.server-mode=true",
        "sieve.seed.load-on-empty=false",
        "sieve.index.dir=",
        "sieve.accounts.sign-in.failures-per-address=8",
        "spring.datasource.url=jdbc:h2:mem:sign-in-rate-limit-test;DB_CLOSE_DELAY=-1"})
class SignInRateLimitTest {

    @LocalServerPort
    int port;
    @Autowired
    AccountAdministration administration;

    @Test
    void wrongPasswordsPauseSignInPerNameThenPerAddressAndTheRightPasswordWaitsToo() throws Exception {
        Account wren = TestAccounts.create(administration, "wren", Role.VIEWER);
        ServerHttp browser = ServerHttp.anonymous(port);
        for (int i = 0; i < 5; i++) {
            assertThat(browser.signIn(wren.name(), "wrong-guess-number-" + i).status()).isEqualTo(401);
        }
        ServerHttp.Answer paused = browser.signIn(wren.name(), TestAccounts.PASSWORD);
        assertThat(paused.status()).as("the right password during the pause").isEqualTo(429);
        assertThat(paused.header("Retry-After")).hasValueSatisfying(s -> assertThat(Long.parseLong(s)).isPositive());
        assertThat(paused.json().path("retryAfterSeconds").asLong()).isPositive();
        assertThat(browser.get("/api/session").status()).as("not signed in").isEqualTo(401);

        Account juniper = TestAccounts.create(administration, "juniper-admin", Role.ADMIN);
        assertThat(ServerHttp.anonymous(port).signIn(juniper.name(), TestAccounts.PASSWORD).status())
                .as("another name from the same address is not paused yet").isEqualTo(200);
        for (int i = 0; i < 3; i++) { // 5 + 3 = 8 wrong passwords from this address
            assertThat(browser.signIn("fernhollow-guess-" + i, "wrong-guess").status()).isEqualTo(401);
        }
        ServerHttp.Answer addressPaused = ServerHttp.anonymous(port).signIn(juniper.name(), TestAccounts.PASSWORD);
        assertThat(addressPaused.status()).as("the address has used up its wrong passwords").isEqualTo(429);
        assertThat(addressPaused.header("Retry-After")).isPresent();
    }
}
