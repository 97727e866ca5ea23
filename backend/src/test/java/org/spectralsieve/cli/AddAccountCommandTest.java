package org.spectralsieve.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.spectralsieve.library.db.Tables.ACCOUNT;

import java.io.ByteArrayInputStream;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import org.jooq.DSLContext;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;
import org.spectralsieve.SpectralSieveApplication;
import org.spectralsieve.accounts.ServerHttp;
import org.springframework.boot.builder.SpringApplicationBuilder;
import org.springframework.boot.test.system.CapturedOutput;
import org.springframework.boot.test.system.OutputCaptureExtension;
import org.springframework.boot.web.server.context.WebServerApplicationContext;
import org.springframework.context.ConfigurableApplicationContext;

/**
 * {@code add-account}: the first admin comes from the command line, with a password of at least 12
 * characters read from standard input (never from the command line); a new server has no account at all.
 */
@ExtendWith(OutputCaptureExtension.class)
class AddAccountCommandTest {

    private static final String DB_URL = "jdbc:h2:mem:cli-add-account-test;DB_CLOSE_DELAY=-1";
    private static final String PASSWORD = "fernhollow-larkspur-9";

    private static CliRun withStdin(String stdin, String... args) {
        return withStdinAgainst(DB_URL, stdin, args);
    }

    private static CliRun withStdinAgainst(String dbUrl, String stdin, String... args) {
        InputStream processIn = System.in;
        try {
            System.setIn(new ByteArrayInputStream(stdin.getBytes(StandardCharsets.UTF_8)));
            return CliRun.against(dbUrl, args);
        } finally {
            System.setIn(processIn);
        }
    }

    @Test
    void createsAnAdminWhoCanSignInToTheServerWhichHadNoAccountBefore(CapturedOutput log) throws Exception {
        String fresh = "jdbc:h2:mem:cli-add-first-admin-test;DB_CLOSE_DELAY=-1";
        try (ConfigurableApplicationContext server = new SpringApplicationBuilder(SpectralSieveApplication.class).run(
                "--server.port=0", "--sieve.server-mode=true", "--sieve.seed.load-on-empty=false", "--sieve.index.dir=",
                "--spring.datasource.url=" + fresh)) {
            int port = ((WebServerApplicationContext) server).getWebServer().getPort();
            assertThat(server.getBean(DSLContext.class).fetchCount(ACCOUNT)).as("no default account").isZero();
            assertThat(log.getOut()).as("the server says how to create the first admin")
                    .contains("add-account --name NAME --role admin");
            assertThat(ServerHttp.anonymous(port).signIn("admin", "admin").status()).isEqualTo(401);

            CliRun run = withStdinAgainst(fresh, PASSWORD + "\n", "add-account", "--name", "juniper-admin", "--role", "admin",
                    "--password-stdin");
            assertThat(run.exitCode()).as(run.err()).isEqualTo(SieveCli.OK);
            assertThat(run.out()).contains("juniper-admin").doesNotContain(PASSWORD);

            ServerHttp browser = ServerHttp.anonymous(port);
            ServerHttp.Answer signedIn = browser.signIn("juniper-admin", PASSWORD);
            assertThat(signedIn.status()).isEqualTo(200);
            assertThat(signedIn.json().path("role").asString()).isEqualTo("admin");
            assertThat(browser.get("/api/accounts").status()).isEqualTo(200);
        }
    }

    @Test
    void refusesAPasswordUnderTwelveCharactersAndCreatesNothing() {
        CliRun run = withStdin("short-pass\n", "add-account", "--name", "wren-short", "--role", "viewer",
                "--password-stdin");
        assertThat(run.exitCode()).isEqualTo(SieveCli.FAILED);
        assertThat(run.err()).contains("at least 12 characters");
        CliRun again = withStdin(PASSWORD + "\n", "add-account", "--name", "wren-short", "--role", "viewer",
                "--password-stdin");
        assertThat(again.exitCode()).as("the name was not taken by the refused attempt: " + again.err())
                .isEqualTo(SieveCli.OK);
    }

    @Test
    void refusesAnUnknownRoleAndAConsoleLessRunWithoutPasswordStdin() {
        CliRun badRole = withStdin(PASSWORD + "\n", "add-account", "--name", "wren-x", "--role", "owner",
                "--password-stdin");
        assertThat(badRole.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(badRole.err()).contains("--role");
        if (System.console() == null) {
            CliRun noConsole = CliRun.against(DB_URL, "add-account", "--name", "wren-y", "--role", "viewer");
            assertThat(noConsole.exitCode()).isEqualTo(SieveCli.USAGE);
            assertThat(noConsole.err()).contains("--password-stdin");
        }
    }
}
