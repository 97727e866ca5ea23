package org.spectralsieve.accounts;

import static org.assertj.core.api.Assertions.assertThat;
import static org.spectralsieve.library.db.Tables.API_TOKEN;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.jooq.DSLContext;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.beans.factory.annotation.Qualifier;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.web.bind.annotation.RequestMethod;
import org.springframework.web.servlet.mvc.method.RequestMappingInfo;
import org.springframework.web.servlet.mvc.method.annotation.RequestMappingHandlerMapping;

/**
 * Server mode over real HTTP: who may call what. The state-changing endpoints are read from Spring's own
 * mapping table, so an endpoint added later is checked too: it must appear in this test's lists of
 * read-only POSTs or admin-only endpoints, or be open to editors (and closed to viewers).
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT, properties = {
        "sieve.server-mode=true",
        "sieve.seed.load-on-empty=false",
        "sieve.index.dir=",
        "spring.datasource.url=jdbc:h2:mem:server-mode-access-test;DB_CLOSE_DELAY=-1"})
class ServerModeAccessTest {

    /** POSTs that only compute an answer or touch the caller's own tokens or presets: a viewer may send them. */
    private static final Set<String> VIEWER_CHANGES = Set.of(
            "POST /api/search", "POST /api/requirements/parse", "POST /api/similar", "POST /api/imports/preview",
            "POST /api/tokens", "POST /api/tokens/{id}/revoke",
            // a viewer's own presets (a shared one is refused by the controller unless the caller is an admin)
            "POST /api/presets", "POST /api/presets/import", "PUT /api/presets/{key}", "DELETE /api/presets/{key}");

    /** Admin's alone: accounts, restoring a backup or a retired item. */
    private static final List<Pattern> ADMIN_ONLY = List.of(
            Pattern.compile("\\w+ /api/accounts(/.*)?"),
            Pattern.compile("\\w+ /api/audit(/.*)?"),
            Pattern.compile("POST /api/restore"),
            Pattern.compile("POST /api/[^/]+/[^/]+/restore"));

    private static final Pattern VARIABLE = Pattern.compile("\\{(\\w+)(?::([^}]*))?}");

    @LocalServerPort
    int port;
    @Autowired
    AccountAdministration administration;
    @Autowired
    @Qualifier("requestMappingHandlerMapping")
    RequestMappingHandlerMapping mappings;
    @Autowired
    DSLContext db;

    private ServerHttp viewer;
    private ServerHttp editor;
    private ServerHttp admin;

    @BeforeEach
    void accounts() {
        viewer = ServerHttp.withToken(port, TestAccounts.token(administration,
                TestAccounts.create(administration, "wren", Role.VIEWER)));
        editor = ServerHttp.withToken(port, TestAccounts.token(administration,
                TestAccounts.create(administration, "juniper-editor", Role.EDITOR)));
        admin = ServerHttp.withToken(port, TestAccounts.token(administration,
                TestAccounts.create(administration, "juniper-admin", Role.ADMIN)));
    }

    /** Every non-reading mapping as "METHOD /concrete/path" (pattern alternatives spelled out), with its pattern. */
    private List<String[]> stateChangingEndpoints() {
        List<String[]> endpoints = new ArrayList<>();
        for (RequestMappingInfo info : mappings.getHandlerMethods().keySet()) {
            Set<RequestMethod> methods = info.getMethodsCondition().getMethods();
            for (String pattern : info.getPatternValues()) {
                if (!pattern.startsWith("/api/")) {
                    continue;
                }
                for (RequestMethod method : methods) {
                    if (method == RequestMethod.GET || method == RequestMethod.HEAD || method == RequestMethod.OPTIONS) {
                        continue;
                    }
                    for (String path : concrete(pattern)) {
                        endpoints.add(new String[] {method.name(), path, method.name() + " " + pattern});
                    }
                }
            }
        }
        assertThat(endpoints).as("the mapping table lists the import endpoint at least").isNotEmpty()
                .anyMatch(e -> e[1].equals("/api/imports"));
        return endpoints;
    }

    /** Ids that exist nowhere, so an admitted request changes nothing; each alternative of a pattern variable. */
    private static List<String> concrete(String pattern) {
        Matcher m = VARIABLE.matcher(pattern);
        if (!m.find()) {
            return List.of(pattern);
        }
        List<String> values = m.group(2) != null ? List.of(m.group(2).split("\\|"))
                : List.of(m.group(1).equals("name") ? "no-such-spectrum" : "987654");
        Set<String> paths = new LinkedHashSet<>();
        for (String value : values) {
            paths.addAll(concrete(pattern.substring(0, m.start()) + value + pattern.substring(m.end())));
        }
        return List.copyOf(paths);
    }

    private static boolean adminOnly(String methodAndPath) {
        return ADMIN_ONLY.stream().anyMatch(p -> p.matcher(methodAndPath).matches());
    }

    @Test
    void everyStateChangingEndpointRefusesAnonymousCallersWith401() throws Exception {
        ServerHttp anonymous = ServerHttp.anonymous(port);
        for (String[] e : stateChangingEndpoints()) {
            ServerHttp.Answer answer = anonymous.send(e[0], e[1], "{}");
            assertThat(answer.status()).as(e[0] + " " + e[1]).isEqualTo(401);
            assertThat(answer.header("Content-Type")).as(e[0] + " " + e[1]).hasValueSatisfying(
                    t -> assertThat(t).startsWith("application/problem+json"));
        }
    }

    @Test
    void viewersAreRefusedEveryChangeButTheReadOnlyPostsAndTheirOwnTokens() throws Exception {
        for (String[] e : stateChangingEndpoints()) {
            ServerHttp.Answer answer = viewer.send(e[0], e[1], "{}");
            if (VIEWER_CHANGES.contains(e[2])) {
                assertThat(answer.status()).as(e[2] + " is a viewer's").isNotIn(401, 403);
            } else {
                assertThat(answer.status()).as(e[0] + " " + e[1] + " must refuse a viewer").isEqualTo(403);
                String needed = adminOnly(e[0] + " " + e[1]) ? "admin" : "editor";
                assertThat(answer.json().path("requiredRole").asString()).as(e[0] + " " + e[1]).isEqualTo(needed);
            }
        }
    }

    @Test
    void editorsMayImportCorrectAndRetireButNotWhatIsAdmins() throws Exception {
        for (String[] e : stateChangingEndpoints()) {
            ServerHttp.Answer answer = editor.send(e[0], e[1], "{}");
            if (adminOnly(e[0] + " " + e[1])) {
                assertThat(answer.status()).as(e[0] + " " + e[1] + " is admin's").isEqualTo(403);
            } else {
                assertThat(answer.status()).as(e[0] + " " + e[1] + " admits an editor (or is it new? give it a"
                        + " role in EndpointRoles and in this test)").isNotIn(401, 403);
            }
        }
    }

    @Test
    void adminsMayCallEveryEndpoint() throws Exception {
        for (String[] e : stateChangingEndpoints()) {
            assertThat(admin.send(e[0], e[1], "{}").status()).as(e[0] + " " + e[1]).isNotIn(401, 403);
        }
    }

    @Test
    void onlyAdminsReadTheAccountListTheAuditTrailAndBackups() throws Exception {
        for (String path : List.of("/api/accounts", "/api/audit", "/api/audit/changes", "/api/backup")) {
            assertThat(viewer.get(path).status()).as("viewer " + path).isEqualTo(403);
            assertThat(editor.get(path).status()).as("editor " + path).isEqualTo(403);
        }
        ServerHttp.Answer list = admin.get("/api/accounts");
        assertThat(list.status()).isEqualTo(200);
        assertThat(list.json().findValuesAsString("name")).anyMatch(n -> n.startsWith("wren-"));
        assertThat(list.body()).doesNotContain("password").doesNotContain("$2a$");
    }

    @Test
    void anonymousApiReadsGet401ProblemsAndThePageGoesToSignIn() throws Exception {
        ServerHttp anonymous = ServerHttp.anonymous(port);
        ServerHttp.Answer api = anonymous.get("/api/materials");
        assertThat(api.status()).isEqualTo(401);
        assertThat(api.json().path("status").asInt()).isEqualTo(401);
        assertThat(api.json().path("detail").asString()).contains("sign in");

        ServerHttp.Answer page = anonymous.getPage("/");
        assertThat(page.status()).isEqualTo(302);
        assertThat(page.header("Location")).hasValueSatisfying(l -> assertThat(l).endsWith("/sign-in.html"));
        assertThat(anonymous.getPage("/sign-in.html").status()).isEqualTo(200);
    }

    @Test
    void aViewerReadsTheLibraryAndSeesItsOwnSession() throws Exception {
        assertThat(viewer.get("/api/materials").status()).isEqualTo(200);
        ServerHttp.Answer session = viewer.get("/api/session");
        assertThat(session.json().path("mode").asString()).isEqualTo("server");
        assertThat(session.json().path("role").asString()).isEqualTo("viewer");
        assertThat(session.json().path("name").asString()).startsWith("wren-");
        assertThat(session.json().path("actions").valueStream().map(n -> n.asString()).toList())
                .contains("search").doesNotContain("import", "restore");
    }

    // ------------------------------------------------------------------------------------- tokens

    @Test
    void aViewersTokenCannotImportAndTheStoredHashIsNotTheToken() throws Exception {
        Account wren = TestAccounts.create(administration, "wren", Role.VIEWER);
        AccountAdministration.CreatedToken created = administration.createToken(wren, "plots");
        ServerHttp.Answer refused = ServerHttp.withToken(port, created.secret()).send("POST", "/api/imports", "{}");
        assertThat(refused.status()).isEqualTo(403);
        assertThat(refused.json().path("detail").asString()).contains("editor");

        String stored = db.select(API_TOKEN.TOKEN_HASH).from(API_TOKEN).where(API_TOKEN.ID.eq(created.token().id()))
                .fetchOne().value1();
        assertThat(stored).isNotEqualTo(created.secret()).doesNotContain(created.secret().substring(6))
                .isEqualTo(TokenSecrets.hash(created.secret()));
        assertThat(created.secret()).startsWith("sieve_").hasSizeGreaterThanOrEqualTo(6 + 43);
    }

    @Test
    void aTokenFollowsItsOwnersRoleAndStopsWhenRevokedOrDisabled() throws Exception {
        Account juniper = TestAccounts.create(administration, "juniper-editor", Role.EDITOR);
        String secret = TestAccounts.token(administration, juniper);
        ServerHttp script = ServerHttp.withToken(port, secret);
        assertThat(script.send("POST", "/api/samples/987654/retire", "{}").status()).isEqualTo(404); // admitted

        administration.changeRole(juniper.id(), Role.VIEWER);
        assertThat(script.send("POST", "/api/samples/987654/retire", "{}").status()).isEqualTo(403);
        assertThat(script.get("/api/materials").status()).isEqualTo(200);

        administration.disable(juniper.id());
        assertThat(script.get("/api/materials").status()).isEqualTo(401);

        Account wren = TestAccounts.create(administration, "wren", Role.VIEWER);
        AccountAdministration.CreatedToken other = administration.createToken(wren, "nightly export");
        ServerHttp nightly = ServerHttp.withToken(port, other.secret());
        assertThat(nightly.get("/api/materials").status()).isEqualTo(200);
        ServerHttp.Answer revoked = nightly.send("POST", "/api/tokens/" + other.token().id() + "/revoke", "");
        assertThat(revoked.status()).isEqualTo(200);
        assertThat(revoked.json().path("revokedAt").isNull()).isFalse();
        assertThat(nightly.get("/api/materials").status()).isEqualTo(401);
        assertThat(ServerHttp.withToken(port, "sieve_not-a-token").get("/api/materials").status()).isEqualTo(401);
    }

    @Test
    void tokensAreListedAndRevokedByTheirOwnerOnly() throws Exception {
        Account wren = TestAccounts.create(administration, "wren", Role.VIEWER);
        ServerHttp wrenScript = ServerHttp.withToken(port, TestAccounts.token(administration, wren));
        ServerHttp.Answer created = wrenScript.send("POST", "/api/tokens", "{\"label\":\"spectra sync\"}");
        assertThat(created.status()).isEqualTo(201);
        assertThat(created.json().path("secret").asString()).startsWith("sieve_");
        long id = created.json().path("token").path("id").asLong();

        ServerHttp.Answer listed = wrenScript.get("/api/tokens");
        assertThat(listed.json().findValuesAsString("label")).contains("spectra sync");
        assertThat(listed.body()).doesNotContain(created.json().path("secret").asString());

        assertThat(editor.send("POST", "/api/tokens/" + id + "/revoke", "").status()).isEqualTo(404);
        assertThat(wrenScript.send("POST", "/api/tokens", "{\"label\":\"\"}").json().path("field").asString())
                .isEqualTo("label");
    }

    // ---------------------------------------------------------------------------------- accounts

    @Test
    void anAdminCreatesAccountsChangesRolesAndDisablesThemWithoutDeleting() throws Exception {
        ServerHttp.Answer created = admin.send("POST", "/api/accounts",
                "{\"name\":\"fernhollow-tech\",\"role\":\"editor\",\"password\":\"" + TestAccounts.PASSWORD + "\"}");
        assertThat(created.status()).isEqualTo(201);
        long id = created.json().path("id").asLong();
        assertThat(admin.send("POST", "/api/accounts/" + id + "/role", "{\"role\":\"viewer\"}").json()
                .path("role").asString()).isEqualTo("viewer");
        ServerHttp.Answer disabled = admin.send("POST", "/api/accounts/" + id + "/disable", "");
        assertThat(disabled.json().path("disabledAt").isNull()).isFalse();
        assertThat(admin.get("/api/accounts").json().findValuesAsString("name")).contains("fernhollow-tech");

        ServerHttp.Answer again = admin.send("POST", "/api/accounts",
                "{\"name\":\"fernhollow-tech\",\"role\":\"viewer\",\"password\":\"" + TestAccounts.PASSWORD + "\"}");
        assertThat(again.status()).isEqualTo(409);
        ServerHttp.Answer shortPassword = admin.send("POST", "/api/accounts",
                "{\"name\":\"fernhollow-two\",\"role\":\"viewer\",\"password\":\"short\"}");
        assertThat(shortPassword.status()).isEqualTo(400);
        assertThat(shortPassword.json().path("field").asString()).isEqualTo("password");
        ServerHttp.Answer badRole = admin.send("POST", "/api/accounts",
                "{\"name\":\"fernhollow-two\",\"role\":\"owner\",\"password\":\"" + TestAccounts.PASSWORD + "\"}");
        assertThat(badRole.status()).isEqualTo(400);
        assertThat(badRole.json().path("field").asString()).isEqualTo("role");
    }

    // ------------------------------------------------------------------------------ page session

    @Test
    void thePagesSessionNeedsTheCsrfTokenForEveryChange() throws Exception {
        Account wren = TestAccounts.create(administration, "wren", Role.VIEWER);
        ServerHttp browser = ServerHttp.anonymous(port);
        ServerHttp.Answer signedIn = browser.signIn(wren.name(), TestAccounts.PASSWORD);
        assertThat(signedIn.status()).isEqualTo(200);
        assertThat(signedIn.json().path("role").asString()).isEqualTo("viewer");
        assertThat(browser.get("/api/session").json().path("via").asString()).isEqualTo("session");

        ServerHttp.Answer withoutToken = browser.send("POST", "/api/tokens", "{\"label\":\"from the page\"}");
        assertThat(withoutToken.status()).isEqualTo(403);
        assertThat(withoutToken.json().path("type").asString()).endsWith("csrf-token-missing");

        ServerHttp.Answer withToken = browser.sendWithCsrf("POST", "/api/tokens", "{\"label\":\"from the page\"}");
        assertThat(withToken.status()).isEqualTo(201);

        assertThat(browser.sendWithCsrf("POST", "/sign-out", "").status()).isEqualTo(204);
        assertThat(browser.get("/api/session").status()).isEqualTo(401);
    }

    @Test
    void aSessionLosesWhatItsAccountLosesAtOnce() throws Exception {
        Account juniper = TestAccounts.create(administration, "juniper-editor", Role.EDITOR);
        ServerHttp browser = ServerHttp.anonymous(port);
        assertThat(browser.signIn(juniper.name(), TestAccounts.PASSWORD).status()).isEqualTo(200);
        assertThat(browser.sendWithCsrf("POST", "/api/samples/987654/retire", "").status()).isEqualTo(404);

        administration.changeRole(juniper.id(), Role.VIEWER);
        assertThat(browser.sendWithCsrf("POST", "/api/samples/987654/retire", "").status()).isEqualTo(403);
        administration.disable(juniper.id());
        assertThat(browser.get("/api/materials").status()).isEqualTo(401);
    }

    @Test
    void aWrongPasswordOrADisabledAccountDoesNotSignIn() throws Exception {
        Account wren = TestAccounts.create(administration, "wren", Role.VIEWER);
        ServerHttp browser = ServerHttp.anonymous(port);
        ServerHttp.Answer wrong = browser.signIn(wren.name(), "not-the-password-at-all");
        assertThat(wrong.status()).isEqualTo(401);
        assertThat(wrong.json().path("detail").asString()).doesNotContain("not-the-password");
        administration.disable(wren.id());
        assertThat(browser.signIn(wren.name(), TestAccounts.PASSWORD).status()).isEqualTo(401);
    }
    /**
     * A node behind a reverse proxy on the same machine listens on loopback and gets the public host name: server
     * mode answers it (the sign-in decides), where the embedded tool refuses any name but a loopback one.
     */
    @Test
    void aPublicHostNameFromASameMachineProxyIsAnsweredBySignInNotRefusedByName() throws Exception {
        try (java.net.Socket socket = new java.net.Socket("127.0.0.1", port)) {
            socket.getOutputStream().write(("GET /api/materials HTTP/1.1\r\nHost: sieve.fernhollow.lab\r\n"
                    + "Connection: close\r\n\r\n").getBytes(java.nio.charset.StandardCharsets.US_ASCII));
            String answer = new String(socket.getInputStream().readAllBytes(), java.nio.charset.StandardCharsets.UTF_8);
            assertThat(answer).startsWith("HTTP/1.1 401").contains("sign-in-needed").doesNotContain("foreign-host");
        }
    }
}
