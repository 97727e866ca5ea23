package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;
import static org.spectralsieve.library.db.Tables.CURVE;
import static org.spectralsieve.library.db.Tables.MATERIAL;
import static org.spectralsieve.library.db.Tables.SAMPLE;

import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import org.jooq.DSLContext;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestInstance;
import org.spectralsieve.library.db.tables.records.CurveRecord;
import org.spectralsieve.library.db.tables.records.MaterialRecord;
import org.spectralsieve.library.db.tables.records.SampleRecord;
import org.spectralsieve.search.SearchService;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ObjectNode;

/**
 * A database that already holds rows today's checks refuse (written before the checks existed, or by
 * another tool) still starts, lists and searches: the bad rows are written here straight into the tables,
 * bypassing every check, and each one's sample is unverified with its reason while the others rank.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:bad-stored-rows-test;DB_CLOSE_DELAY=-1")
@TestInstance(TestInstance.Lifecycle.PER_CLASS)
class BadStoredRowIsolationTest {
    // also run on PostgreSQL by PostgresBadStoredRowIsolationTest

    private static final HttpClient HTTP = HttpClient.newHttpClient();
    private static final JsonMapper JSON = JsonMapper.builder().build();

    @LocalServerPort
    int port;

    @Autowired
    DSLContext db;

    @Autowired
    SearchService search;

    /** Names and slugs of this run's bad rows end in it, so that a kept database (PostgreSQL) can run the test again. */
    private final String run = Long.toString(System.nanoTime() % 1_000_000_000L, 36);

    private long hugeIndexSample;
    private long hugeThicknessSample;
    private long tinyThicknessSample;
    private long fixedHugeIndexSample;

    @BeforeAll
    void writeBadRowsPastEveryCheck() {
        // a clear sheet's curve, copied so that only the bad number differs from a good row
        long template = db.select(SAMPLE.ID).from(SAMPLE).join(MATERIAL).on(MATERIAL.ID.eq(SAMPLE.MATERIAL_ID))
                .where(MATERIAL.SLUG.like("%acrylic%")).and(MATERIAL.SCALING.eq("bulk")).orderBy(SAMPLE.ID).limit(1)
                .fetchOne(SAMPLE.ID);
        long hugeIndex = material("Bad row huge index sheet " + run, "bulk", 1e16);
        hugeIndexSample = sample(hugeIndex, 3.0, template);
        long good = material("Bad row odd thickness sheet " + run, "bulk", 1.49);
        hugeThicknessSample = sample(good, 1e308, template);
        tinyThicknessSample = sample(good, 1e-300, template);
        long fixed = material("Bad row huge index coating " + run, "fixed", 1e308);
        fixedHugeIndexSample = sample(fixed, 4.0, template);
        material("Bad row name " + controlCharacters() + " " + run, "bulk", 1.5);
        search.invalidate();
    }

    /** The embedded tool needs no sign-in; the shared-server run (server mode) adds a viewer's token. */
    HttpRequest.Builder signedIn(HttpRequest.Builder request) {
        return request;
    }

    /** NUL, BEL and a right-to-left override; a database that cannot hold NUL (PostgreSQL) gets the other two. */
    String controlCharacters() {
        return "\u0000\u0007\u202e";
    }

    private long material(String name, String scaling, double n) {
        MaterialRecord m = db.newRecord(MATERIAL);
        m.setSlug(name.toLowerCase().replaceAll("[^a-z0-9]+", "-").replaceAll("-$", ""));
        m.setName(name);
        m.setMaterialClass("plastic sheet");
        m.setScaling(scaling);
        m.setIndexKind("constant");
        m.setIndexN(n);
        m.store();
        return m.getId();
    }

    private long sample(long materialId, double thicknessMm, long templateSample) {
        SampleRecord template = db.selectFrom(SAMPLE).where(SAMPLE.ID.eq(templateSample)).fetchOne();
        SampleRecord s = db.newRecord(SAMPLE);
        s.setMaterialId(materialId);
        s.setThicknessMm(thicknessMm);
        s.setGeometry("regular");
        s.setProvenance("measured");
        s.setDetectionLimit(template.getDetectionLimit());
        s.store();
        CurveRecord c = db.selectFrom(CURVE).where(CURVE.SAMPLE_ID.eq(templateSample)).fetchOne().copy();
        c.setSampleId(s.getId());
        db.executeInsert(c);
        return s.getId();
    }

    @Test
    void aSearchWithAThicknessClauseRanksTheOthersAndMarksEachBadSampleUnverified() throws Exception {
        JsonNode rows = search("passes over 80% at 450 nm, at 4 mm, class plastic sheet").path("results");
        assertThat(rows.toString()).contains("\"meets\"");
        assertUnverifiedWithReason(rows, hugeIndexSample);
    }

    @Test
    void aRangeSearchMarksTheSampleOfAnAbsurdThicknessUnverified() throws Exception {
        JsonNode rows = search("passes over 80% at 450 nm, thickness 2 to 6 mm, class plastic sheet").path("results");
        assertThat(rows.toString()).contains("\"meets\"");
        JsonNode row = null;
        for (JsonNode r : rows) {
            if (r.path("materialName").asString().equals("Bad row odd thickness sheet " + run)) {
                row = r;
            }
        }
        assertThat(row).as(rows.toString()).isNotNull();
        assertThat(row.path("sampleId").asLong()).isIn(hugeThicknessSample, tinyThicknessSample);
        assertThat(row.path("verdict").asString()).isEqualTo("unverified");
        assertThat(row.path("clauses").get(0).path("explanation").asString())
                .contains("could not be computed").contains("stored thickness");
    }

    @Test
    void aSearchBehindAFixedPartRanksTheOthersAndMarksEachBadSampleUnverified() throws Exception {
        JsonNode rows = search("passes over 50% at 550 nm, at 4 mm, class plastic sheet, behind 4 mm clear float glass")
                .path("results");
        assertThat(rows.toString()).contains("\"meets\"");
        assertUnverifiedWithReason(rows, hugeIndexSample);
        assertUnverifiedWithReason(rows, fixedHugeIndexSample);
    }

    @Test
    void aSearchAsMeasuredStillJudgesTheBadRowsOnTheirMeasuredCurves() throws Exception {
        JsonNode rows = search("passes over 80% at 450 nm, class plastic sheet").path("results");
        assertThat(rows.toString()).contains("\"meets\"");
    }

    @Test
    void theCurveOfASampleWithAnUnusableIndexIsServedAsMeasuredAndRefusedRescaledWithAProblem() throws Exception {
        assertThat(get("/api/samples/" + hugeIndexSample + "/curve").statusCode()).isEqualTo(200);
        HttpResponse<String> rescaled = get("/api/samples/" + hugeIndexSample + "/curve?thicknessMm=4");
        assertThat(rescaled.statusCode()).as(rescaled.body()).isBetween(400, 499);
        assertThat(rescaled.headers().firstValue("Content-Type").orElse("")).contains("application/problem+json");
        assertThat(rescaled.body()).contains("refractive index");
    }

    @Test
    void theCurveOfASampleOfAnAbsurdThicknessIsRefusedRescaledWithAProblem() throws Exception {
        for (long id : new long[] {hugeThicknessSample, tinyThicknessSample}) {
            HttpResponse<String> rescaled = get("/api/samples/" + id + "/curve?thicknessMm=4");
            assertThat(rescaled.statusCode()).as(rescaled.body()).isBetween(400, 499);
            assertThat(rescaled.body()).contains("thickness");
        }
    }

    @Test
    void theFiguresOfABadSampleAreRefusedWithAProblemNotAFailure() throws Exception {
        HttpResponse<String> figures = get("/api/samples/" + hugeIndexSample + "/figures?thicknessMm=4");
        assertThat(figures.statusCode()).as(figures.body()).isBetween(200, 499);
        HttpResponse<String> behind = get("/api/samples/" + fixedHugeIndexSample
                + "/figures?behind=clear%20float%20glass&behindMm=4");
        assertThat(behind.statusCode()).as(behind.body()).isBetween(200, 499);
    }

    @Test
    void theMaterialListStillAnswersWithTheBadRows() throws Exception {
        HttpResponse<String> list = get("/api/materials?q=bad%20row%20" + run);
        assertThat(list.statusCode()).as(list.body()).isEqualTo(200);
        assertThat(JSON.readTree(list.body()).size()).isEqualTo(4);
    }

    private static void assertUnverifiedWithReason(JsonNode rows, long sampleId) {
        JsonNode row = null;
        for (JsonNode r : rows) {
            if (r.path("sampleId").asLong() == sampleId) {
                row = r;
            }
        }
        assertThat(row).as("row of sample " + sampleId + " in " + rows).isNotNull();
        assertThat(row.path("verdict").asString()).isEqualTo("unverified");
        assertThat(row.path("clauses").get(0).path("explanation").asString()).contains("could not be computed");
    }

    private JsonNode search(String text) throws Exception {
        ObjectNode body = JSON.createObjectNode();
        body.put("requirement", text);
        body.put("limit", 500);
        HttpResponse<String> response = HTTP.send(signedIn(HttpRequest.newBuilder(URI.create("http://localhost:" + port + "/api/search")))
                .header("Content-Type", "application/json").POST(HttpRequest.BodyPublishers.ofString(body.toString())).build(),
                HttpResponse.BodyHandlers.ofString());
        assertThat(response.statusCode()).as(text + " -> " + response.body()).isEqualTo(200);
        return JSON.readTree(response.body());
    }

    private HttpResponse<String> get(String path) throws Exception {
        return HTTP.send(signedIn(HttpRequest.newBuilder(URI.create("http://localhost:" + port + path))).GET().build(),
                HttpResponse.BodyHandlers.ofString());
    }
}
