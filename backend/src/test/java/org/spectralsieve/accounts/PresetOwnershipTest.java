package org.spectralsieve.accounts;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;

/**
 * Server mode's presets: each account keeps its own, unseen by others (a link to one answers "not found", telling
 * nothing); shared presets are read by everyone and saved, edited and retired by admins only (docs/presets.md).
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT, properties = {
        "sieve.server-mode=true",
        "sieve.seed.load-on-empty=false",
        "sieve.index.dir=",
        "spring.datasource.url=jdbc:h2:mem:preset-ownership-test;DB_CLOSE_DELAY=-1"})
class PresetOwnershipTest {

    @LocalServerPort
    int port;
    @Autowired
    AccountAdministration administration;

    private ServerHttp wren;
    private ServerHttp juniper;
    private ServerHttp admin;

    @BeforeEach
    void accounts() {
        wren = ServerHttp.withToken(port, TestAccounts.token(administration, TestAccounts.create(administration, "wren", Role.VIEWER)));
        juniper = ServerHttp.withToken(port, TestAccounts.token(administration,
                TestAccounts.create(administration, "juniper", Role.EDITOR)));
        admin = ServerHttp.withToken(port, TestAccounts.token(administration,
                TestAccounts.create(administration, "juniper-admin", Role.ADMIN)));
    }

    private static String body(String name, String text, boolean shared) {
        return "{\"name\": \"" + name + "\", \"text\": \"" + text + "\", \"shared\": " + shared + "}";
    }

    @Test
    void aViewersOwnPresetIsUnseenByAnotherAccountEvenAnAdmin() throws Exception {
        ServerHttp.Answer saved = wren.send("POST", "/api/presets", body("Wren bench window", "passes over 80% at 365 nm", false));
        assertThat(saved.status()).isEqualTo(201);
        long id = saved.json().path("id").asLong();
        assertThat(saved.json().path("origin").asString()).isEqualTo("mine");

        for (ServerHttp other : new ServerHttp[] {juniper, admin}) {
            assertThat(other.get("/api/presets/" + id).status()).isEqualTo(404);
            assertThat(other.get("/api/presets/Wren%20bench%20window").status()).isEqualTo(404);
            assertThat(other.get("/api/presets").body()).doesNotContain("Wren bench window");
            assertThat(other.send("PUT", "/api/presets/" + id, body("Taken", "passes over 1% at 365 nm", false)).status())
                    .isEqualTo(404);
            assertThat(other.send("DELETE", "/api/presets/" + id, "{}").status()).isEqualTo(404);
        }
        assertThat(wren.get("/api/presets/" + id).json().path("text").asString()).isEqualTo("passes over 80% at 365 nm");
    }

    @Test
    void onlyAnAdminSavesEditsAndRetiresASharedPresetWhichEveryoneReads() throws Exception {
        ServerHttp.Answer refused = wren.send("POST", "/api/presets", body("Shop window", "passes over 80% at 365 nm", true));
        assertThat(refused.status()).isEqualTo(403);
        assertThat(refused.json().path("requiredRole").asString()).isEqualTo("admin");

        ServerHttp.Answer shared = admin.send("POST", "/api/presets", body("Shop window", "passes over 80% at 365 nm", true));
        assertThat(shared.status()).isEqualTo(201);
        long id = shared.json().path("id").asLong();
        assertThat(shared.json().path("origin").asString()).isEqualTo("shared");

        ServerHttp.Answer read = wren.get("/api/presets/" + id);
        assertThat(read.status()).isEqualTo(200);
        assertThat(read.json().path("origin").asString()).isEqualTo("shared");
        assertThat(wren.send("PUT", "/api/presets/" + id, body("Shop window", "passes over 90% at 365 nm", true)).status())
                .isEqualTo(403);
        assertThat(juniper.send("DELETE", "/api/presets/" + id, "{}").status()).as("an editor neither").isEqualTo(403);
        assertThat(wren.get("/api/presets/" + id).json().path("text").asString()).isEqualTo("passes over 80% at 365 nm");

        ServerHttp.Answer edited = admin.send("PUT", "/api/presets/" + id,
                "{\"name\": \"Shop window\", \"text\": \"passes over 90% at 365 nm\"}");
        assertThat(edited.status()).isEqualTo(200);
        assertThat(wren.get("/api/presets/" + id).json().path("text").asString()).isEqualTo("passes over 90% at 365 nm");
        assertThat(admin.send("DELETE", "/api/presets/" + id, "{}").status()).isEqualTo(200);
        assertThat(wren.get("/api/presets/" + id).status()).isEqualTo(404);
    }

    @Test
    void twoAccountsMayEachKeepAPresetOfTheSameName() throws Exception {
        assertThat(wren.send("POST", "/api/presets", body("Lid", "blocks under 1% from 300 to 500 nm", false)).status()).isEqualTo(201);
        assertThat(juniper.send("POST", "/api/presets", body("Lid", "blocks under 1% from 300 to 520 nm", false)).status()).isEqualTo(201);
        assertThat(wren.get("/api/presets/Lid").json().path("text").asString()).isEqualTo("blocks under 1% from 300 to 500 nm");
        assertThat(juniper.get("/api/presets/Lid").json().path("text").asString()).isEqualTo("blocks under 1% from 300 to 520 nm");
    }
}
