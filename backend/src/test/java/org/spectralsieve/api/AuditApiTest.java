package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;
import static org.spectralsieve.library.db.Tables.AUDIT_ENTRY;
import static org.spectralsieve.library.db.Tables.MATERIAL;
import static org.spectralsieve.library.db.Tables.SAMPLE;

import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import org.jooq.DSLContext;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ObjectNode;

/**
 * The audit trail over HTTP, on the illustrative demo library (docs/audit.md): a change through the API is recorded
 * with the embedded user's name, its values before and after; {@code GET /api/audit} pages newest first and filters by
 * subject; bad parameters are problems naming them; and a shortlist and an export name the revisions they used, which
 * move with a correction. Each test works on its own demo material, so the order they run in does not matter.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:audit-api-test;DB_CLOSE_DELAY=-1")
class AuditApiTest {

    private static final HttpClient HTTP = HttpClient.newHttpClient();
    private static final JsonMapper JSON = JsonMapper.builder().build();

    @LocalServerPort
    int port;

    @Autowired
    DSLContext db;

    @Test
    void aCorrectionThroughTheApiIsRecordedAsTheLocalUserWithOldAndNewValues() throws Exception {
        long sampleId = onlySampleOf("resin-lid-amber");

        post("/api/samples/" + sampleId + "/revisions", "{\"thicknessMm\": 3.2, \"reason\": \"caliper read again\"}", 201);
        JsonNode page = get("/api/audit?sampleId=" + sampleId, 200);

        JsonNode newest = page.path("entries").get(0);
        assertThat(newest.path("actor").asString()).isEqualTo("local");
        assertThat(newest.path("action").asString()).isEqualTo("correct");
        assertThat(newest.path("subjectKind").asString()).isEqualTo("sample");
        assertThat(newest.path("subjectId").asLong()).isEqualTo(sampleId);
        assertThat(newest.path("before").path("thicknessMm").asDouble()).isEqualTo(3.0);
        assertThat(newest.path("after").path("thicknessMm").asDouble()).isEqualTo(3.2);
        assertThat(newest.path("summary").asString()).contains("caliper read again");
        // the demo library's load recorded the sample's import before it
        assertThat(page.path("entries").get(1).path("action").asString()).isEqualTo("import");
        assertThat(page.path("entries").get(1).path("before").isNull()).isTrue();
    }

    @Test
    void aRefusedCorrectionWritesNoEntry() throws Exception {
        long sampleId = onlySampleOf("resin-lid-red");
        int before = db.fetchCount(AUDIT_ENTRY);

        post("/api/samples/" + sampleId + "/revisions", "{\"thicknessMm\": -1, \"reason\": \"r\"}", 400);

        assertThat(db.fetchCount(AUDIT_ENTRY)).isEqualTo(before);
    }

    @Test
    void pagesGoNewestFirstAndTheCursorReachesEveryEntryOnce() throws Exception {
        long materialId = materialId("resin-lid-yellow");
        post("/api/materials/" + materialId + "/retire", "", 200);
        post("/api/materials/" + materialId + "/restore", "", 200);
        int total = db.fetchCount(AUDIT_ENTRY);

        List<Long> ids = new ArrayList<>();
        String path = "/api/audit?limit=7";
        for (int pages = 0; path != null; pages++) {
            assertThat(pages).as("pages").isLessThanOrEqualTo(total / 7 + 1);
            JsonNode page = get(path, 200);
            assertThat(page.path("entries").size()).isLessThanOrEqualTo(7);
            page.path("entries").forEach(e -> ids.add(e.path("id").asLong()));
            path = page.path("nextBefore").isNull() ? null : "/api/audit?limit=7&before=" + page.path("nextBefore").asLong();
        }

        assertThat(ids).hasSize(total).isSortedAccordingTo((a, b) -> Long.compare(b, a));
        assertThat(new HashSet<>(ids)).hasSize(total);
        JsonNode mine = get("/api/audit?materialId=" + materialId + "&limit=2", 200).path("entries");
        assertThat(mine.get(0).path("action").asString()).isEqualTo("restore");
        assertThat(mine.get(1).path("action").asString()).isEqualTo("retire");
        assertThat(mine.get(1).path("after").path("retiredAt").isNull()).isFalse();
        assertThat(get("/api/audit", 200).path("entries").size()).isEqualTo(Math.min(total, AuditController.DEFAULT_LIMIT));
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource({
            "limit, limit=0",
            "limit, limit=501",
            "limit, limit=many",
            "before, before=0",
            "before, before=x",
            "sampleId, sampleId=-3",
            "materialId, materialId=1.5",
            "sample, sample=3"})
    void aBadParameterIsAProblemNamingIt(String parameter, String query) throws Exception {
        HttpResponse<String> response = send(HttpRequest.newBuilder(uri("/api/audit?" + query)).GET());

        assertThat(response.statusCode()).as(response.body()).isEqualTo(400);
        assertThat(response.headers().firstValue("Content-Type")).hasValueSatisfying(
                t -> assertThat(t).startsWith("application/problem+json"));
        assertThat(JSON.readTree(response.body()).path("parameter").asString()).isEqualTo(parameter);
    }

    @Test
    void theShortlistAndTheExportNameTheRevisionsUsedAndMoveWithACorrection() throws Exception {
        long materialId = materialId("resin-lid-green");
        long sampleId = onlySampleOf("resin-lid-green");
        String requirement = "blocks under 1% at 405 nm, class resin-tank sheet";
        JsonNode before = post("/api/search", body(requirement), 200);
        String csvBefore = text("/api/samples/" + sampleId + "/curve.csv");

        post("/api/samples/" + sampleId + "/revisions", "{\"lot\": \"FH-LOT-9\", \"reason\": \"lot was swapped\"}", 201);
        post("/api/materials/" + materialId + "/revisions", "{\"indexN\": 1.56, \"reason\": \"refractometer\"}", 201);
        JsonNode after = post("/api/search", body(requirement), 200);
        String csvAfter = text("/api/samples/" + sampleId + "/curve.csv");

        JsonNode rowBefore = rowOf(before, sampleId);
        JsonNode rowAfter = rowOf(after, sampleId);
        assertThat(rowAfter.path("sampleRevision").asInt()).isEqualTo(rowBefore.path("sampleRevision").asInt() + 1);
        assertThat(rowAfter.path("materialRevision").asInt()).isEqualTo(rowBefore.path("materialRevision").asInt() + 1);
        assertThat(before.path("libraryGeneration").isIntegralNumber()).isTrue();
        assertThat(after.path("libraryGeneration").asLong()).isGreaterThanOrEqualTo(before.path("libraryGeneration").asLong() + 2);
        assertThat(headerValue(csvBefore, "sample_revision")).isEqualTo(rowBefore.path("sampleRevision").asString());
        assertThat(headerValue(csvAfter, "sample_revision")).isEqualTo(rowAfter.path("sampleRevision").asString());
        assertThat(headerValue(csvAfter, "material_revision")).isEqualTo(rowAfter.path("materialRevision").asString());
        // the revision the shortlist named is readable as it was
        JsonNode named = get("/api/samples/" + sampleId + "/revisions/" + rowBefore.path("sampleRevision").asInt(), 200);
        assertThat(named.path("lot").asString()).isNotEqualTo("FH-LOT-9");
    }

    /** The value on the CSV header line that names {@code key}: the line's last comma- or colon-separated field. */
    private static String headerValue(String csv, String key) {
        String line = csv.lines().filter(l -> l.contains(key)).findFirst().orElseThrow(() -> new AssertionError(key));
        String[] parts = line.split("[,:=]");
        return parts[parts.length - 1].replace("\"", "").trim();
    }

    private long materialId(String slug) {
        return db.select(MATERIAL.ID).from(MATERIAL).where(MATERIAL.SLUG.eq(slug)).fetchSingle(MATERIAL.ID);
    }

    private long onlySampleOf(String slug) {
        assertThat(db.fetchCount(SAMPLE, SAMPLE.MATERIAL_ID.eq(materialId(slug)))).as(slug).isEqualTo(1);
        return db.select(SAMPLE.ID).from(SAMPLE).where(SAMPLE.MATERIAL_ID.eq(materialId(slug))).fetchSingle(SAMPLE.ID);
    }

    private static JsonNode rowOf(JsonNode answer, long sampleId) {
        for (JsonNode row : answer.path("results")) {
            if (row.path("sampleId").asLong() == sampleId) {
                return row;
            }
        }
        throw new AssertionError("no row for sample " + sampleId + " in " + answer);
    }

    private static String body(String requirement) {
        ObjectNode body = JSON.createObjectNode();
        body.put("requirement", requirement);
        body.put("limit", 50);
        return body.toString();
    }

    private String text(String path) throws Exception {
        HttpResponse<String> response = send(HttpRequest.newBuilder(uri(path)).GET());
        assertThat(response.statusCode()).as(path).isEqualTo(200);
        return response.body();
    }

    private JsonNode get(String path, int status) throws Exception {
        HttpResponse<String> response = send(HttpRequest.newBuilder(uri(path)).GET());
        assertThat(response.statusCode()).as(path + " -> " + response.body()).isEqualTo(status);
        return JSON.readTree(response.body());
    }

    private JsonNode post(String path, String body, int status) throws Exception {
        HttpResponse<String> response = send(HttpRequest.newBuilder(uri(path)).header("Content-Type", "application/json")
                .POST(HttpRequest.BodyPublishers.ofString(body)));
        assertThat(response.statusCode()).as(path + " " + body + " -> " + response.body()).isEqualTo(status);
        return JSON.readTree(response.body());
    }

    private HttpResponse<String> send(HttpRequest.Builder request) throws Exception {
        return HTTP.send(request.build(), HttpResponse.BodyHandlers.ofString());
    }

    private URI uri(String path) {
        return URI.create("http://localhost:" + port + path);
    }
}
