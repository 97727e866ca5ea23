package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;
import static org.spectralsieve.library.db.Tables.CURVE;

import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import org.jooq.DSLContext;
import org.junit.jupiter.api.Test;
import org.spectralsieve.ingest.NoisyCurves;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;

/** The {@code from}/{@code to} form fields and the preview's keep range, through a real server. */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:keep-range-api-test;DB_CLOSE_DELAY=-1")
class KeepRangeApiTest {

    /** 300–800 nm every 100 nm: six points of an invented sheet (illustrative). */
    private static final String SIX_POINTS = "wavelength_nm,T\n300,0.1\n400,0.5\n500,0.8\n600,0.85\n700,0.86\n800,0.87\n";

    @LocalServerPort
    int port;

    @Autowired
    DSLContext db;

    private JsonNode post(Multipart form, String path, int status) throws Exception {
        return form.postExpecting(port, path, status);
    }

    @Test
    void previewKeepsFromToAndCountsThePointsLeftOutOnEachSide() throws Exception {
        JsonNode p = post(Multipart.file("sheet.csv", SIX_POINTS).field("from", "350").field("to", "650"),
                "/api/imports/preview", 200);

        assertThat(p.path("pointCount").asInt()).isEqualTo(3);
        JsonNode keep = p.path("keep");
        assertThat(keep.path("filePoints").asInt()).isEqualTo(6);
        assertThat(keep.path("keptRangeNm").get(0).asDouble()).isEqualTo(400.0);
        assertThat(keep.path("keptRangeNm").get(1).asDouble()).isEqualTo(600.0);
        assertThat(keep.path("leftOutBelow").asInt()).isEqualTo(1);
        assertThat(keep.path("leftOutAbove").asInt()).isEqualTo(2);
        assertThat(keep.path("from").asDouble()).isEqualTo(350.0);
        assertThat(p.path("warnings").toString()).contains("1 point below it left out", "2 points above it left out");
    }

    @Test
    void fromAtOrAboveToIsAProblemNamingFrom() throws Exception {
        JsonNode problem = post(Multipart.file("sheet.csv", SIX_POINTS).field("from", "600").field("to", "600"),
                "/api/imports/preview", 400);

        assertThat(problem.path("parameter").asString()).isEqualTo("from");
        assertThat(problem.path("detail").asString()).contains("shorter than to");
    }

    @Test
    void aRangeLeavingFewerThanTwoPointsIsAProblemNamingTheParameter() throws Exception {
        JsonNode problem = post(Multipart.file("sheet.csv", SIX_POINTS).field("to", "350"), "/api/imports/preview", 400);

        assertThat(problem.path("parameter").asString()).isEqualTo("to");
        assertThat(problem.path("detail").asString()).contains("leaves 1 of the file's 6 points");
    }

    @Test
    void aToThatIsNotANumberIsAProblemNamingTo() throws Exception {
        JsonNode problem = post(Multipart.file("sheet.csv", SIX_POINTS).field("to", "700nm"), "/api/imports/preview", 400);

        assertThat(problem.path("parameter").asString()).isEqualTo("to");
    }

    @Test
    void previewShowsADeepUvNoiseRegionWithItsRangeReasonAndTheSuggestedFrom() throws Exception {
        double[] t = NoisyCurves.withAbsorbanceNoise(NoisyCurves.cleanTransmittance(), 190, 229, 7);

        JsonNode keep = post(Multipart.file("diode-array.csv", NoisyCurves.absorbanceCsv(t)), "/api/imports/preview", 200)
                .path("keep");

        JsonNode region = keep.path("noiseRegions").get(0);
        assertThat(region.path("end").asString()).isEqualTo("short");
        assertThat(region.path("rangeNm").get(0).asDouble()).isEqualTo(190.0);
        assertThat(region.path("keptPoints").asInt()).isZero();
        assertThat(region.path("reason").asString()).contains("above 100 %T");
        double regionEnd = region.path("rangeNm").get(1).asDouble();
        assertThat(keep.path("suggestedFrom").asDouble()).isEqualTo(regionEnd + 1);
        assertThat(keep.path("keptRangeNm").get(0).asDouble()).isEqualTo(regionEnd + 1);
        assertThat(keep.path("from").isNull()).isTrue();
    }

    @Test
    void importWithFromAndToStoresOnlyThatPartAndKeepsTheWholeOriginalFile() throws Exception {
        Multipart form = Multipart.file("kept-sheet.csv", SIX_POINTS).field("from", "400").field("to", "700")
                .field("materialName", "Illustrative kept sheet").field("materialClass", "plastic sheet")
                .field("scaling", "bulk").field("indexN", 1.5).field("thicknessMm", 3);

        JsonNode stored = post(form, "/api/imports", 201);

        assertThat(stored.path("pointCount").asInt()).isEqualTo(4);
        assertThat(stored.path("warnings").toString()).contains("1 point below it left out", "1 point above it left out");
        long sampleId = stored.path("sampleId").asLong();
        assertThat(db.select(CURVE.POINT_COUNT).from(CURVE).where(CURVE.SAMPLE_ID.eq(sampleId)).fetchOne(CURVE.POINT_COUNT))
                .isEqualTo(4);
        HttpResponse<byte[]> source = java.net.http.HttpClient.newHttpClient().send(java.net.http.HttpRequest.newBuilder(
                java.net.URI.create("http://localhost:" + port + "/api/samples/" + sampleId + "/source-file")).build(),
                HttpResponse.BodyHandlers.ofByteArray());
        assertThat(new String(source.body(), StandardCharsets.UTF_8)).isEqualTo(SIX_POINTS);
    }

    @Test
    void importWithABadFromIsAProblemNamingFromAndStoresNothing() throws Exception {
        int curves = db.fetchCount(CURVE);
        Multipart form = Multipart.file("bad-range.csv", SIX_POINTS).field("from", "-3")
                .field("materialName", "Illustrative refused sheet").field("materialClass", "plastic sheet")
                .field("scaling", "bulk").field("thicknessMm", 3);

        JsonNode problem = post(form, "/api/imports", 400);

        assertThat(problem.path("parameter").asString()).isEqualTo("from");
        assertThat(db.fetchCount(CURVE)).isEqualTo(curves);
    }
}
