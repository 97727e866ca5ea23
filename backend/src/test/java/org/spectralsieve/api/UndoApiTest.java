package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;
import static org.spectralsieve.library.db.Tables.MATERIAL;
import static org.spectralsieve.library.db.Tables.REFERENCE_SPECTRUM;
import static org.spectralsieve.library.db.Tables.SAMPLE;
import static org.spectralsieve.library.db.Tables.SAMPLE_REVISION;

import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.util.ArrayList;
import java.util.List;
import org.jooq.DSLContext;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.spectralsieve.ingest.ImportFiles;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ObjectNode;

/**
 * Undo without loss (docs/undo.md) through a real server over the illustrative demo library: retire and
 * restore, corrections as revisions, the revision every answer names, and the refusals. Each test works on
 * its own demo materials, so the order the tests run in does not matter.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:undo-api-test;DB_CLOSE_DELAY=-1")
class UndoApiTest {

    private static final HttpClient HTTP = HttpClient.newHttpClient();
    private static final JsonMapper JSON = JsonMapper.builder().build();

    @LocalServerPort
    int port;

    @Autowired
    DSLContext db;

    @Test
    void aRetiredSampleIsHiddenFromSearchAndListingButReadableByIdAndRestoringGivesTheIdenticalShortlist()
            throws Exception {
        // common practice, no source: UV-grade fused silica is the window that passes 254 nm
        String requirement = "passes over 80% at 254 nm, at 3 mm";
        JsonNode before = search(requirement, 10);
        long sampleId = before.path("results").get(0).path("sampleId").asLong();
        long materialId = before.path("results").get(0).path("materialId").asLong();

        JsonNode retired = post("/api/samples/" + sampleId + "/retire", "", 200);
        JsonNode during = search(requirement, 10);
        JsonNode listing = get("/api/materials?q=" + slugOf(materialId), 200);
        JsonNode byId = get("/api/samples/" + sampleId, 200);
        JsonNode curve = get("/api/samples/" + sampleId + "/curve", 200);
        JsonNode materialWhileRetired = get("/api/materials/" + materialId, 200);
        JsonNode restored = post("/api/samples/" + sampleId + "/restore", "", 200);
        JsonNode after = search(requirement, 10);

        assertThat(retired.path("retiredAt").isNull()).isFalse();
        assertThat(retired.path("inUse").asBoolean()).isFalse();
        assertThat(sampleIds(during)).doesNotContain(sampleId);
        for (JsonNode m : listing) {
            for (JsonNode s : m.path("samples")) {
                assertThat(s.path("id").asLong()).isNotEqualTo(sampleId);
            }
        }
        assertThat(byId.path("sample").path("retiredAt").asString()).isEqualTo(retired.path("retiredAt").asString());
        assertThat(byId.path("inUse").asBoolean()).isFalse();
        assertThat(curve.path("retiredAt").asString()).isEqualTo(retired.path("retiredAt").asString());
        assertThat(materialWhileRetired.path("retiredSamples").get(0).path("id").asLong()).isEqualTo(sampleId);
        assertThat(restored.path("inUse").asBoolean()).isTrue();
        assertThat(withoutTiming(after)).isEqualTo(withoutTiming(before));
        assertThat(db.fetchCount(SAMPLE, SAMPLE.ID.eq(sampleId))).as("kept in the database").isEqualTo(1);
    }

    @Test
    void retiringAMaterialHidesAllItsSamplesFromSearchListingAndTheLayerMatcherAndRestoresOnlyThoseInUse()
            throws Exception {
        long glass = materialId("clear-float-glass");
        JsonNode material = get("/api/materials/" + glass, 200);
        long thinnest = material.path("samples").get(0).path("id").asLong();
        String behind = "blocks under 1% at 405 nm, behind 4 mm clear float glass";
        assertThat(search(behind, 5).path("layer").path("materialSlug").asString()).isEqualTo("clear-float-glass");

        post("/api/samples/" + thinnest + "/retire", "", 200);
        post("/api/materials/" + glass + "/retire", "", 200);
        JsonNode windowGlass = search("passes over 50% at 550 nm, class window glass", 50);
        JsonNode listed = get("/api/materials?class=window%20glass", 200);
        HttpResponse<String> layer = send(HttpRequest.newBuilder(uri("/api/search")).header("Content-Type", "application/json")
                .POST(HttpRequest.BodyPublishers.ofString(body(behind, 5))));
        JsonNode retiredList = get("/api/materials/retired", 200);
        JsonNode byId = get("/api/materials/" + glass, 200);
        post("/api/materials/" + glass + "/restore", "", 200);
        JsonNode back = get("/api/materials/" + glass, 200);

        assertThat(materialIds(windowGlass)).doesNotContain(glass);
        assertThat(listed.findValues("id").stream().map(JsonNode::asLong).toList()).doesNotContain(glass);
        if (layer.statusCode() == 200) {
            assertThat(JSON.readTree(layer.body()).path("layer").path("materialSlug").asString())
                    .isNotEqualTo("clear-float-glass");
        } else {
            assertThat(layer.statusCode()).as(layer.body()).isEqualTo(400);
        }
        assertThat(retiredList.findValues("slug").stream().map(JsonNode::asString).toList()).contains("clear-float-glass");
        assertThat(byId.path("retiredAt").isNull()).isFalse();
        assertThat(back.path("retiredAt").isNull()).isTrue();
        assertThat(back.path("samples").size()).isEqualTo(material.path("samples").size() - 1);
        assertThat(back.path("retiredSamples").get(0).path("id").asLong()).isEqualTo(thinnest);
        assertThat(search(behind, 5).path("layer").path("materialSlug").asString()).isEqualTo("clear-float-glass");
        post("/api/samples/" + thinnest + "/restore", "", 200);
    }

    @Test
    void aCorrectedThicknessIsANewRevisionTheOldOneStaysReadableAndTheCurveNeverChanges() throws Exception {
        long sampleId = onlySampleOf("resin-lid-amber");
        JsonNode measured = get("/api/samples/" + sampleId + "/curve", 200);

        HttpResponse<String> created = send(HttpRequest.newBuilder(uri("/api/samples/" + sampleId + "/revisions"))
                .header("Content-Type", "application/json")
                .POST(HttpRequest.BodyPublishers.ofString("{\"thicknessMm\": 3.2, \"notes\": \"caliper says 3.2 mm\","
                        + " \"reason\": \"thickness read off the order, not measured\"}")));
        JsonNode revisions = get("/api/samples/" + sampleId + "/revisions", 200);
        JsonNode first = get("/api/samples/" + sampleId + "/revisions/1", 200);
        JsonNode after = get("/api/samples/" + sampleId + "/curve", 200);

        assertThat(created.statusCode()).as(created.body()).isEqualTo(201);
        assertThat(created.headers().firstValue("Location")).hasValue("/api/samples/" + sampleId + "/revisions/2");
        assertThat(revisions.size()).isEqualTo(2);
        assertThat(first.path("thicknessMm").asDouble()).isEqualTo(3.0);
        assertThat(first.path("current").asBoolean()).isFalse();
        assertThat(revisions.get(1).path("thicknessMm").asDouble()).isEqualTo(3.2);
        assertThat(revisions.get(1).path("reason").asString()).contains("order");
        assertThat(revisions.get(1).path("current").asBoolean()).isTrue();
        assertThat(after.path("thicknessMm").asDouble()).isEqualTo(3.2);
        assertThat(after.path("sampleRevision").asInt()).isEqualTo(2);
        assertThat(after.path("transmittance")).isEqualTo(measured.path("transmittance"));
        assertThat(after.path("wavelengthsNm")).isEqualTo(measured.path("wavelengthsNm"));
    }

    @Test
    void correctingTheThicknessMovesWhereRescalingStartsFromAsLambertsLawSays() throws Exception {
        // Lambert's law: internal transmittance τ(d) = τ(d0)^(d/d0) (optics handbooks, e.g. Born & Wolf;
        // from memory); surface reflection depends on the index only. So a sample first said to be 3 mm,
        // rescaled to 6 mm, reads as the same sample corrected to 2 mm rescaled to 4 mm (the same ratio).
        long sampleId = onlySampleOf("resin-lid-red");
        JsonNode doubledBefore = get("/api/samples/" + sampleId + "/curve?thicknessMm=6", 200);

        post("/api/samples/" + sampleId + "/revisions", "{\"thicknessMm\": \"2\", \"reason\": \"the 3 mm was a typo\"}", 201);
        JsonNode doubledAfter = get("/api/samples/" + sampleId + "/curve?thicknessMm=4", 200);
        JsonNode asMeasured = get("/api/samples/" + sampleId + "/curve?thicknessMm=2", 200);

        assertThat(asMeasured.path("rescaled").asBoolean()).isFalse();
        for (int i = 0; i < doubledBefore.path("transmittance").size(); i++) {
            double a = doubledBefore.path("transmittance").get(i).asDouble();
            assertThat(doubledAfter.path("transmittance").get(i).asDouble()).isCloseTo(a, within(1e-12 + a * 1e-9));
        }
    }

    @Test
    void searchesExportsAndFiguresNameTheRevisionTheyUsed() throws Exception {
        long materialId = materialId("resin-lid-yellow");
        long sampleId = onlySampleOf("resin-lid-yellow");
        post("/api/samples/" + sampleId + "/revisions", "{\"instrument\": \"bench spectrometer B\","
                + " \"reason\": \"instrument was recorded wrongly\"}", 201);
        post("/api/materials/" + materialId + "/revisions", "{\"indexN\": 1.55, \"reason\": \"index from the maker's sheet\"}", 201);

        JsonNode answer = search("blocks under 1% at 405 nm, class resin-tank sheet", 50);
        JsonNode row = rowOf(answer, sampleId);
        String csv = send(HttpRequest.newBuilder(uri("/api/samples/" + sampleId + "/curve.csv")).GET()).body();
        JsonNode figures = get("/api/samples/" + sampleId + "/figures", 200);
        JsonNode material = get("/api/materials/" + materialId, 200);
        JsonNode materialRevisions = get("/api/materials/" + materialId + "/revisions", 200);

        assertThat(row.path("sampleRevision").asInt()).isEqualTo(2);
        assertThat(row.path("materialRevision").asInt()).isEqualTo(2);
        assertThat(csv).contains("sample_revision").contains("material_revision");
        assertThat(csv.lines().filter(l -> l.contains("sample_revision")).findFirst().orElseThrow()).contains("2");
        assertThat(figures.path("sampleRevision").asInt()).isEqualTo(2);
        assertThat(figures.path("materialRevision").asInt()).isEqualTo(2);
        assertThat(material.path("revision").asInt()).isEqualTo(2);
        assertThat(material.path("refractiveIndex").path("n").asDouble()).isEqualTo(1.55);
        assertThat(materialRevisions.get(0).path("refractiveIndex").path("n").asDouble()).isNotEqualTo(1.55);
        assertThat(materialRevisions.get(1).path("current").asBoolean()).isTrue();
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', value = {
            "thicknessMm | {\"thicknessMm\": -1, \"reason\": \"r\"}",
            "thicknessMm | {\"thicknessMm\": 1e308, \"reason\": \"r\"}",
            "thicknessMm | {\"thicknessMm\": \"thick\", \"reason\": \"r\"}",
            "geometry | {\"geometry\": \"sideways\", \"reason\": \"r\"}",
            "detectionLimit | {\"detectionLimit\": 1.5, \"reason\": \"r\"}",
            "measuredOn | {\"measuredOn\": \"yesterday\", \"reason\": \"r\"}",
            "notes | {\"notes\": \"a\\u0000b\", \"reason\": \"r\"}",
            "lot | {\"lot\": \"x\\u202Ey\", \"reason\": \"r\"}",
            "reason | {\"thicknessMm\": 2}",
            "transmittance | {\"transmittance\": [0.5], \"reason\": \"r\"}",
            "provenance | {\"provenance\": \"measured\", \"reason\": \"r\"}",
            "thicknessMm | {\"reason\": \"nothing given\"}",
            "thicknessMm | {\"thicknessMm\": 1, \"reason\": \"the value it already has\"}"})
    void aBadCorrectionIsRefusedNamingTheFieldAndNothingIsStored(String field, String body) throws Exception {
        long sampleId = firstSampleOf("petg-sheet");
        JsonNode before = get("/api/samples/" + sampleId, 200);
        int revisionRows = db.fetchCount(SAMPLE_REVISION);

        JsonNode problem = post("/api/samples/" + sampleId + "/revisions", body, 400);

        assertThat(problem.path("parameter").asString()).isEqualTo(field);
        assertThat(problem.path("type").asString()).isEqualTo("/problems/bad-parameter");
        assertThat(get("/api/samples/" + sampleId, 200)).isEqualTo(before);
        assertThat(db.fetchCount(SAMPLE_REVISION)).isEqualTo(revisionRows);
    }

    @Test
    void aBadMaterialCorrectionIsRefusedNamingTheField() throws Exception {
        long materialId = materialId("polystyrene-sheet");
        JsonNode before = get("/api/materials/" + materialId, 200);

        JsonNode index = post("/api/materials/" + materialId + "/revisions", "{\"indexN\": \"n/a\", \"reason\": \"r\"}", 400);
        JsonNode range = post("/api/materials/" + materialId + "/revisions",
                "{\"madeRange\": \"12 to 1\", \"reason\": \"r\"}", 400);

        assertThat(index.path("parameter").asString()).isEqualTo("indexN");
        assertThat(range.path("parameter").asString()).isEqualTo("madeRange");
        assertThat(get("/api/materials/" + materialId, 200)).isEqualTo(before);
    }

    @Test
    void noOrdinaryPathHardDeletesASampleOrMaterial() throws Exception {
        long materialId = materialId("ptfe-sheet");
        long sampleId = firstSampleOf("ptfe-sheet");
        int samples = db.fetchCount(SAMPLE);
        int materials = db.fetchCount(MATERIAL);

        int deleteSample = send(HttpRequest.newBuilder(uri("/api/samples/" + sampleId)).DELETE()).statusCode();
        int deleteMaterial = send(HttpRequest.newBuilder(uri("/api/materials/" + materialId)).DELETE()).statusCode();

        assertThat(deleteSample).isBetween(400, 499);
        assertThat(deleteMaterial).isBetween(400, 499);
        assertThat(db.fetchCount(SAMPLE)).isEqualTo(samples);
        assertThat(db.fetchCount(MATERIAL)).isEqualTo(materials);
        assertThat(get("/api/samples/" + sampleId, 200).path("inUse").asBoolean()).isTrue();
    }

    @Test
    void deletingAnImportedEmitterRetiresItFreesItsNameAndItCanBeRestoredBitForBit() throws Exception {
        String first = "nm,power\n380,0.5\n385,1\n390,0.5\n";
        assertThat(Multipart.file("bench-lamp.csv", first).field("name", "bench-lamp").post(port, "/api/emitters")
                .statusCode()).isEqualTo(201);
        JsonNode points = get("/api/emitters/bench-lamp/points", 200);
        int rows = db.fetchCount(REFERENCE_SPECTRUM);

        assertThat(send(HttpRequest.newBuilder(uri("/api/emitters/bench-lamp")).DELETE()).statusCode()).isEqualTo(204);
        get("/api/emitters/bench-lamp", 404);
        JsonNode retired = get("/api/emitters/retired", 200);
        assertThat(Multipart.file("bench-lamp-2.csv", "nm,power\n380,1\n390,1\n").field("name", "bench-lamp")
                .post(port, "/api/emitters").statusCode()).as("the name is free again").isEqualTo(201);
        JsonNode taken = post("/api/emitters/bench-lamp/restore", "", 400);
        send(HttpRequest.newBuilder(uri("/api/emitters/bench-lamp")).DELETE());
        JsonNode restored = post("/api/emitters/bench-lamp/restore?id=" + retired.get(0).path("id").asLong(), "", 200);

        assertThat(db.fetchCount(REFERENCE_SPECTRUM)).as("nothing deleted").isEqualTo(rows + 1);
        assertThat(retired.get(0).path("name").asString()).isEqualTo("bench-lamp");
        assertThat(taken.path("parameter").asString()).isEqualTo("name");
        assertThat(restored.path("id").asLong()).isEqualTo(retired.get(0).path("id").asLong());
        assertThat(get("/api/emitters/bench-lamp/points", 200)).isEqualTo(points);
    }

    @Test
    void importingIntoARetiredMaterialIsAConflictThatSaysToRestoreIt() throws Exception {
        long materialId = materialId("fep-film-fogged");
        post("/api/materials/" + materialId + "/retire", "", 200);
        int samples = db.fetchCount(SAMPLE);

        HttpResponse<String> refused = Multipart.file("more.csv", ImportFiles.csvWithThickness(0.127))
                .field("materialId", materialId).post(port, "/api/imports");
        post("/api/materials/" + materialId + "/restore", "", 200);

        assertThat(refused.statusCode()).as(refused.body()).isEqualTo(409);
        assertThat(JSON.readTree(refused.body()).path("detail").asString()).contains("restore");
        assertThat(db.fetchCount(SAMPLE)).isEqualTo(samples);
    }

    @Test
    void restoringASampleOfARetiredMaterialSaysItIsStillHidden() throws Exception {
        long materialId = materialId("resin-lid-green");
        long sampleId = onlySampleOf("resin-lid-green");
        post("/api/samples/" + sampleId + "/retire", "", 200);
        post("/api/materials/" + materialId + "/retire", "", 200);

        JsonNode restored = post("/api/samples/" + sampleId + "/restore", "", 200);
        post("/api/materials/" + materialId + "/restore", "", 200);

        assertThat(restored.path("inUse").asBoolean()).isFalse();
        assertThat(restored.path("note").asString()).contains("material " + materialId);
        assertThat(get("/api/samples/" + sampleId, 200).path("inUse").asBoolean()).isTrue();
    }

    private long materialId(String slug) {
        return db.select(MATERIAL.ID).from(MATERIAL).where(MATERIAL.SLUG.eq(slug)).fetchSingle(MATERIAL.ID);
    }

    private String slugOf(long materialId) {
        return db.select(MATERIAL.SLUG).from(MATERIAL).where(MATERIAL.ID.eq(materialId)).fetchSingle(MATERIAL.SLUG);
    }

    private long firstSampleOf(String slug) {
        return db.select(SAMPLE.ID).from(SAMPLE).where(SAMPLE.MATERIAL_ID.eq(materialId(slug)))
                .orderBy(SAMPLE.THICKNESS_MM, SAMPLE.ID).limit(1).fetchSingle(SAMPLE.ID);
    }

    private long onlySampleOf(String slug) {
        assertThat(db.fetchCount(SAMPLE, SAMPLE.MATERIAL_ID.eq(materialId(slug)))).as(slug).isEqualTo(1);
        return firstSampleOf(slug);
    }

    private static List<Long> sampleIds(JsonNode answer) {
        List<Long> ids = new ArrayList<>();
        answer.path("results").forEach(r -> ids.add(r.path("sampleId").asLong()));
        return ids;
    }

    private static List<Long> materialIds(JsonNode answer) {
        List<Long> ids = new ArrayList<>();
        answer.path("results").forEach(r -> ids.add(r.path("materialId").asLong()));
        return ids;
    }

    private static JsonNode rowOf(JsonNode answer, long sampleId) {
        for (JsonNode row : answer.path("results")) {
            if (row.path("sampleId").asLong() == sampleId) {
                return row;
            }
        }
        throw new AssertionError("no row for sample " + sampleId + " in " + answer);
    }

    /** The answer without its timing, which differs from run to run. */
    private static JsonNode withoutTiming(JsonNode answer) {
        ObjectNode copy = (ObjectNode) answer.deepCopy();
        copy.remove("tookMs");
        copy.remove("libraryGeneration"); // a counter every write raises, not part of the answer
        return copy;
    }

    private JsonNode search(String requirement, int limit) throws Exception {
        return post("/api/search", body(requirement, limit), 200);
    }

    private static String body(String requirement, int limit) {
        ObjectNode body = JSON.createObjectNode();
        body.put("requirement", requirement);
        body.put("limit", limit);
        return body.toString();
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
