package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;
import static org.spectralsieve.library.db.Tables.SAMPLE_STATE_CURVE;

import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.util.Map;
import org.jooq.DSLContext;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** A sample's curves in other states over real HTTP: import with every field checked, reading, retire and restore. */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:state-curve-api-test;DB_CLOSE_DELAY=-1")
class StateCurveApiTest {

    private static final HttpClient HTTP = HttpClient.newHttpClient();
    private static final JsonMapper JSON = JsonMapper.builder().build();

    /** Illustrative new lamp cover, 3 mm. */
    private static final String NEW_COVER = "wavelength_nm,transmittance\n280,0.05\n300,0.60\n320,0.85\n360,0.90\n400,0.91\n450,0.92\n";
    /** The same cover after ageing: lower near the cut-off, little change in the visible. */
    private static final String AGED_COVER = "wavelength_nm,transmittance\n280,0.01\n300,0.30\n320,0.70\n360,0.86\n400,0.90\n450,0.915\n";

    @LocalServerPort
    int port;
    @Autowired
    DSLContext db;

    private long sampleId;

    @BeforeEach
    void importACover() throws Exception {
        JsonNode stored = Multipart.file("cover-new.csv", NEW_COVER)
                .field("materialName", "Illustrative lamp cover " + System.nanoTime()).field("materialClass", "plastic sheet")
                .field("scaling", "bulk").field("thicknessMm", "3").postExpecting(port, "/api/imports", 201);
        sampleId = stored.path("sampleId").asLong();
    }

    @Test
    void agedCurveIsStoredAtTheSamplesThicknessAndListedWithItsDescription() throws Exception {
        JsonNode stored = aged(AGED_COVER).field("hours", "2000").field("source", "lamp bank B")
                .postExpecting(port, statesOf(sampleId), 201);

        assertThat(stored.path("duplicate").asBoolean()).isFalse();
        JsonNode state = stored.path("state");
        assertThat(state.path("kind").asString()).isEqualTo("aged");
        assertThat(state.path("description").asString()).isEqualTo("aged 2000 h under lamp bank B");
        assertThat(state.path("exposure").path("hours").asDouble()).isEqualTo(2000.0);
        assertThat(state.path("exposure").path("source").asString()).isEqualTo("lamp bank B");
        assertThat(state.path("printing").isNull()).isTrue();
        assertThat(state.path("thicknessMm").asDouble()).isEqualTo(3.0);

        JsonNode sample = get("/api/samples/" + sampleId, 200);
        assertThat(sample.path("states")).hasSize(1);
        assertThat(sample.path("states").get(0).path("id").asLong()).isEqualTo(state.path("id").asLong());
        assertThat(sample.path("sample").path("states").get(0).path("description").asString())
                .isEqualTo("aged 2000 h under lamp bank B");
        assertThat(sample.path("retiredStates")).isEmpty();
        JsonNode material = get("/api/materials/" + stored.path("materialId").asLong(), 200);
        assertThat(material.path("samples").get(0).path("states").get(0).path("kind").asString()).isEqualTo("aged");

        JsonNode curve = get(state.path("curve").asString(), 200);
        assertThat(curve.path("wavelengthsNm")).hasSize(6);
        assertThat(curve.path("transmittance").get(1).asDouble()).isEqualTo(0.30);
        // the state curve as stored, beside the sample's own: lower at 300 nm, as the file says
        JsonNode own = get("/api/samples/" + sampleId + "/curve", 200);
        assertThat(curve.path("transmittance").get(1).asDouble()).isLessThan(own.path("transmittance").get(1).asDouble());
        assertThat(get(state.path("sourceFile").asString() , 200)).isNotNull();
    }

    @Test
    void printedCurveStatesInkLoadAndDensityAndAnotherThickness() throws Exception {
        JsonNode stored = Multipart.file("printed.csv", AGED_COVER).field("state", "printed")
                .field("inkLoadPercent", "100").field("statedDensity", "4").field("thicknessMm", "0.2")
                .postExpecting(port, statesOf(sampleId), 201);

        JsonNode state = stored.path("state");
        assertThat(state.path("description").asString()).isEqualTo("printed black, 100 % ink, density 4.0");
        assertThat(state.path("printing").path("inkLoadPercent").asDouble()).isEqualTo(100.0);
        assertThat(state.path("exposure").isNull()).isTrue();
        assertThat(state.path("thicknessMm").asDouble()).isEqualTo(0.2);
        assertThat(stored.path("warnings").toString()).contains("never rescaled");
    }

    @Test
    void everyBadFieldIsAProblemNamingItAndStoresNothing() throws Exception {
        int before = db.fetchCount(SAMPLE_STATE_CURVE);
        Map<String, Multipart> bad = new java.util.LinkedHashMap<>();
        bad.put("state", Multipart.file("a.csv", AGED_COVER));
        bad.put("state ", Multipart.file("a.csv", AGED_COVER).field("state", "faded"));
        bad.put("state  ", Multipart.file("a.csv", AGED_COVER).field("state", "new"));
        bad.put("hours", aged(AGED_COVER));
        bad.put("hours ", aged(AGED_COVER).field("hours", "-5"));
        bad.put("hours  ", aged(AGED_COVER).field("hours", "many"));
        bad.put("doseJPerCm2", aged(AGED_COVER).field("hours", "10").field("doseJPerCm2", "5").field("doseNm", "365"));
        bad.put("doseNm", aged(AGED_COVER).field("doseJPerCm2", "5"));
        bad.put("doseNm ", aged(AGED_COVER).field("doseJPerCm2", "5").field("doseNm", "50"));
        bad.put("source", aged(AGED_COVER).field("doseJPerCm2", "5").field("doseNm", "365").field("source", "lamp"));
        bad.put("inkLoadPercent", aged(AGED_COVER).field("hours", "10").field("inkLoadPercent", "100"));
        bad.put("inkLoadPercent ", Multipart.file("a.csv", AGED_COVER).field("state", "printed"));
        bad.put("inkLoadPercent  ", Multipart.file("a.csv", AGED_COVER).field("state", "printed").field("inkLoadPercent", "900"));
        bad.put("statedDensity", Multipart.file("a.csv", AGED_COVER).field("state", "printed").field("statedDensity", "0"));
        bad.put("hours   ", Multipart.file("a.csv", AGED_COVER).field("state", "printed").field("statedDensity", "3")
                .field("hours", "4"));
        bad.put("thicknessMm", aged(AGED_COVER).field("hours", "10").field("thicknessMm", "0"));
        for (var e : bad.entrySet()) {
            JsonNode problem = e.getValue().postExpecting(port, statesOf(sampleId), 400);
            assertThat(problem.path("parameter").asString()).as(e.getKey() + " " + problem).isEqualTo(e.getKey().strip());
        }
        assertThat(db.fetchCount(SAMPLE_STATE_CURVE)).isEqualTo(before);
    }

    @Test
    void unknownSampleIsNotFoundAndARetiredOneRefusesWithItsProblem() throws Exception {
        JsonNode missing = aged(AGED_COVER).field("hours", "10").postExpecting(port, statesOf(987654), 404);
        assertThat(missing.path("resource").asString()).isEqualTo("sample");

        post("/api/samples/" + sampleId + "/retire", 200);
        JsonNode retired = aged(AGED_COVER).field("hours", "10").postExpecting(port, statesOf(sampleId), 409);
        assertThat(retired.path("resource").asString()).isEqualTo("sample");
        assertThat(db.fetchCount(SAMPLE_STATE_CURVE, SAMPLE_STATE_CURVE.SAMPLE_ID.eq(sampleId))).isZero();
    }

    @Test
    void captureWithNegativeReadingsIsKeptAndFlaggedNotRefused() throws Exception {
        String noisy = "wavelength_nm,transmittance\n280,-0.004\n290,-0.001\n300,0.2\n350,0.8\n400,0.9\n";
        JsonNode stored = aged(noisy).field("doseJPerCm2", "50").field("doseNm", "365")
                .postExpecting(port, statesOf(sampleId), 201);

        assertThat(stored.path("warnings").toString()).contains("2 readings below 0 %T");
        JsonNode curve = get(stored.path("state").path("curve").asString(), 200);
        assertThat(curve.path("wavelengthsNm")).hasSize(5);
        assertThat(curve.path("belowDetection").get(0).asBoolean()).isTrue();
        assertThat(curve.path("belowDetection").get(1).asBoolean()).isTrue();
        assertThat(curve.path("belowDetection").get(2).asBoolean()).isFalse();
        assertThat(stored.path("state").path("description").asString()).isEqualTo("aged 50 J/cm² at 365 nm");
    }

    @Test
    void sameFileInTheSameStateIsRecognisedAndNotStoredTwice() throws Exception {
        JsonNode first = aged(AGED_COVER).field("hours", "2000").field("source", "lamp bank B")
                .postExpecting(port, statesOf(sampleId), 201);
        JsonNode again = aged(AGED_COVER).field("hours", "2000").field("source", "lamp bank B")
                .postExpecting(port, statesOf(sampleId), 200);

        assertThat(again.path("duplicate").asBoolean()).isTrue();
        assertThat(again.path("state").path("id").asLong()).isEqualTo(first.path("state").path("id").asLong());
    }

    @Test
    void retiredStateCurveLeavesTheListingAndComesBackWhenRestored() throws Exception {
        long id = aged(AGED_COVER).field("hours", "500").postExpecting(port, statesOf(sampleId), 201)
                .path("state").path("id").asLong();

        JsonNode retired = post("/api/state-curves/" + id + "/retire", 200);
        assertThat(retired.path("changed").asBoolean()).isTrue();
        assertThat(retired.path("inUse").asBoolean()).isFalse();
        JsonNode sample = get("/api/samples/" + sampleId, 200);
        assertThat(sample.path("states")).isEmpty();
        assertThat(sample.path("retiredStates").get(0).path("id").asLong()).isEqualTo(id);
        assertThat(get("/api/samples/" + sampleId + "/states/" + id, 200).path("retiredAt").isNull()).isFalse();

        assertThat(post("/api/state-curves/" + id + "/restore", 200).path("inUse").asBoolean()).isTrue();
        assertThat(get("/api/samples/" + sampleId + "/states", 200).path("states").get(0).path("id").asLong()).isEqualTo(id);
        post("/api/state-curves/987654/retire", 404);
        // a state curve is read under its own sample only
        get("/api/samples/" + (sampleId + 1000) + "/states/" + id, 404);
    }

    private static Multipart aged(String csv) {
        return Multipart.file("aged.csv", csv).field("state", "aged");
    }

    private static String statesOf(long sample) {
        return "/api/samples/" + sample + "/states";
    }

    private JsonNode get(String path, int status) throws Exception {
        HttpResponse<String> r = HTTP.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + path)).GET().build(),
                HttpResponse.BodyHandlers.ofString());
        assertThat(r.statusCode()).as(path + " -> " + r.body()).isEqualTo(status);
        return r.body().isEmpty() || !r.body().startsWith("{") && !r.body().startsWith("[") ? JSON.nullNode()
                : JSON.readTree(r.body());
    }

    private JsonNode post(String path, int status) throws Exception {
        HttpResponse<String> r = HTTP.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + path))
                .POST(HttpRequest.BodyPublishers.noBody()).build(), HttpResponse.BodyHandlers.ofString());
        assertThat(r.statusCode()).as(path + " -> " + r.body()).isEqualTo(status);
        return JSON.readTree(r.body());
    }
}
