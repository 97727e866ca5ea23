package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayInputStream;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.zip.ZipEntry;
import java.util.zip.ZipInputStream;
import org.jooq.DSLContext;
import org.junit.jupiter.api.Test;
import org.spectralsieve.backup.SourceLibrary;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.db.Tables;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Restore and backup through a real server started empty ({@code sieve.seed.load-on-empty=false}, as a user
 * restoring through the server starts it): the archive goes in once, is refused the second time, and the
 * backup the server then gives holds the same rows.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = {"spring.datasource.url=jdbc:h2:mem:backup-api-test;DB_CLOSE_DELAY=-1",
        "sieve.seed.load-on-empty=false"})
class BackupApiTest {

    private static final HttpClient HTTP = HttpClient.newHttpClient();
    private static final JsonMapper JSON = JsonMapper.builder().build();

    @LocalServerPort
    int port;

    @Autowired
    DSLContext db;

    @Test
    void anArchiveRestoresIntoTheEmptyServerOnceAndItsBackupHoldsTheSameRows() throws Exception {
        SourceLibrary source = SourceLibrary.get();
        byte[] archive = Files.readAllBytes(source.archive());

        HttpResponse<String> junk = send("POST", "/api/restore", "application/zip", "not a zip".getBytes());
        assertProblem(junk, 400, "archive-refused");
        // a server in server mode (the PostgreSQL rerun) already holds its own accounts and the audit entries about
        // them; the restore keeps them and puts the archive's entries after theirs (docs/backup.md)
        long ownAuditRows = db.fetchCount(Tables.AUDIT_ENTRY);
        boolean ownAccounts = db.fetchCount(Tables.ACCOUNT) > 0;

        HttpResponse<String> restored = Multipart.file("library.zip", archive).post(port, "/api/restore");

        assertThat(restored.statusCode()).as(restored.body()).isEqualTo(200);
        JsonNode answer = JSON.readTree(restored.body());
        JooqLibraryRepository sourceLibrary = source.context().getBean(JooqLibraryRepository.class);
        long materialRows = sourceLibrary.countMaterials(); // retired ones too: the archive keeps them
        int materials = sourceLibrary.findMaterials(null, null).size(); // in use: what the listing shows
        assertThat(answer.path("rows").path("material").asLong()).isEqualTo(materialRows);
        assertThat(JSON.readTree(send("GET", "/api/materials", null, null).body()).size()).isEqualTo(materials);

        HttpResponse<String> again = send("POST", "/api/restore", "application/zip", archive);
        assertProblem(again, 409, "library-not-empty");
        assertThat(JSON.readTree(again.body()).path("rows").path("material").asLong()).isEqualTo(materialRows);

        HttpResponse<byte[]> backup = HTTP.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + "/api/backup"))
                .GET().build(), HttpResponse.BodyHandlers.ofByteArray());
        assertThat(backup.statusCode()).isEqualTo(200);
        assertThat(backup.headers().firstValue("Content-Type").orElse("")).startsWith("application/zip");
        assertThat(backup.headers().firstValue("Content-Disposition").orElse(""))
                .matches("attachment; filename=\"spectral-sieve-backup-\\d{8}T\\d{6}Z\\.zip\"");
        // the same rows byte for byte, but for the audit trail: the server's own entries, the archive's, then the
        // restore's own; and, where the server had accounts of its own, those instead of the archive's
        Map<String, String> after = tableEntries(backup.body(), "sha256");
        Map<String, String> before = tableEntries(archive, "sha256");
        String audit = before.keySet().stream().filter(k -> k.endsWith("-audit_entry.jsonl")).findFirst().orElseThrow();
        assertThat(Long.parseLong(tableEntries(backup.body(), "rows").get(audit)))
                .isEqualTo(Long.parseLong(tableEntries(archive, "rows").get(audit)) + ownAuditRows + 1);
        after.remove(audit);
        before.remove(audit);
        if (ownAccounts) {
            assertThat(db.fetchCount(Tables.ACCOUNT)).as("the server's own accounts, kept").isPositive();
            after.keySet().removeIf(k -> k.endsWith("-account.jsonl") || k.endsWith("-api_token.jsonl"));
            before.keySet().removeIf(k -> k.endsWith("-account.jsonl") || k.endsWith("-api_token.jsonl"));
        }
        assertThat(after).isEqualTo(before);
    }

    /**
     * Each table entry's {@code field} as the manifest gives it ({@code sha256}: equal means the same rows, byte for
     * byte; {@code rows}: how many).
     */
    private static Map<String, String> tableEntries(byte[] archive, String field) throws Exception {
        try (ZipInputStream zip = new ZipInputStream(new ByteArrayInputStream(archive))) {
            for (ZipEntry e = zip.getNextEntry(); e != null; e = zip.getNextEntry()) {
                if (e.getName().equals("manifest.json")) {
                    Map<String, String> entries = new LinkedHashMap<>();
                    JSON.readTree(zip.readAllBytes()).path("tables")
                            .forEach(t -> entries.put(t.path("entry").asString(), t.path(field).asString()));
                    return entries;
                }
            }
        }
        throw new AssertionError("no manifest.json in the archive");
    }

    private HttpResponse<String> send(String method, String path, String type, byte[] body) throws Exception {
        HttpRequest.Builder request = HttpRequest.newBuilder(URI.create("http://localhost:" + port + path));
        if (type != null) {
            request.header("Content-Type", type);
        }
        request.method(method, body == null ? HttpRequest.BodyPublishers.noBody() : HttpRequest.BodyPublishers.ofByteArray(body));
        return HTTP.send(request.build(), HttpResponse.BodyHandlers.ofString());
    }

    private static void assertProblem(HttpResponse<String> response, int status, String type) {
        assertThat(response.statusCode()).as(response.body()).isEqualTo(status);
        assertThat(response.headers().firstValue("Content-Type").orElse("")).startsWith("application/problem+json");
        assertThat(JSON.readTree(response.body()).path("type").asString()).isEqualTo("/problems/" + type);
    }
}
