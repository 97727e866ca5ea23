package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;
import static org.spectralsieve.library.db.Tables.CURVE;
import static org.spectralsieve.library.db.Tables.MATERIAL;
import static org.spectralsieve.library.db.Tables.SAMPLE;
import static org.spectralsieve.library.db.Tables.SOURCE_FILE;

import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import org.jooq.DSLContext;
import org.junit.jupiter.api.Test;
import org.spectralsieve.ingest.ImportFiles;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** The import endpoints through a real server, with small limits so that the caps can be reached cheaply. */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = {
        "spring.datasource.url=jdbc:h2:mem:import-api-test;DB_CLOSE_DELAY=-1",
        "sieve.imports.max-file-bytes=" + ImportApiTest.MAX_BYTES,
        "sieve.imports.max-points=" + ImportApiTest.MAX_POINTS,
        "sieve.imports.max-zip-entries=" + ImportApiTest.MAX_ENTRIES})
class ImportApiTest {

    static final int MAX_BYTES = 200_000;
    static final int MAX_POINTS = 5_000;
    static final int MAX_ENTRIES = 20;
    private static final JsonMapper JSON = JsonMapper.builder().build();

    @LocalServerPort
    int port;

    @Autowired
    DSLContext db;

    private JsonNode post(Multipart form, String path, int status) throws Exception {
        HttpResponse<String> response = form.post(port, path);
        assertThat(response.statusCode()).as(response.body()).isEqualTo(status);
        return JSON.readTree(response.body());
    }

    @Test
    void previewOfAPercentCsvGivesFractionsFormatUnitsAndTheFileDetectionLimit() throws Exception {
        JsonNode p = post(Multipart.file("cast-sheet.csv", ImportFiles.percentCsv()), "/api/imports/preview", 200);

        assertThat(p.path("format").asString()).isEqualTo("delimited");
        assertThat(p.path("xUnit").asString()).isEqualTo("nanometre");
        assertThat(p.path("yKind").asString()).isEqualTo("transmittance_percent");
        assertThat(p.path("pointCount").asInt()).isEqualTo(5);
        assertThat(p.path("rangeNm").get(0).asDouble()).isEqualTo(350.0);
        assertThat(p.path("rangeNm").get(1).asDouble()).isEqualTo(450.0);
        // 50 %T is T = 0.5 (definition of percent, common practice, no source)
        assertThat(p.path("curve").path("transmittance").get(2).asDouble()).isEqualTo(0.5);
        // 0.05 %T = 0.0005 lies under the file's detection limit 0.001: an upper bound
        assertThat(p.path("detectionLimit").asDouble()).isEqualTo(0.001);
        assertThat(p.path("curve").path("belowDetection").get(0).asBoolean()).isTrue();
        assertThat(p.path("curve").path("belowDetection").get(1).asBoolean()).isFalse();
        assertThat(p.path("sha256").asString()).hasSize(64);
    }

    @Test
    void previewStoresNothing() throws Exception {
        int before = db.fetchCount(SAMPLE);

        post(Multipart.file("cast-sheet.csv", ImportFiles.percentCsv()), "/api/imports/preview", 200);

        assertThat(db.fetchCount(SAMPLE)).isEqualTo(before);
    }

    @Test
    void previewOfJcampKeepsTheWritersUpperBound() throws Exception {
        JsonNode p = post(Multipart.file("film.jdx", ImportFiles.jcamp()), "/api/imports/preview", 200);

        assertThat(p.path("format").asString()).isEqualTo("jcamp-dx");
        assertThat(p.path("pointCount").asInt()).isEqualTo(5);
        assertThat(p.path("curve").path("transmittance").get(3).asDouble()).isEqualTo(0.7);
        assertThat(p.path("curve").path("belowDetection").get(0).asBoolean()).isTrue();
    }

    @Test
    void jcampIsRecognisedByContentUnderAnyName() throws Exception {
        JsonNode p = post(Multipart.file("film.txt", ImportFiles.jcamp()), "/api/imports/preview", 200);

        assertThat(p.path("format").asString()).isEqualTo("jcamp-dx");
    }

    @Test
    void previewOfDatasheetPointsConvertsOpticalDensityAndSuggestsDatasheetProvenance() throws Exception {
        JsonNode p = post(Multipart.file("filter-graph.csv", ImportFiles.datasheetPoints()), "/api/imports/preview", 200);

        assertThat(p.path("format").asString()).isEqualTo("datasheet-points");
        assertThat(p.path("yKind").asString()).isEqualTo("absorbance");
        assertThat(p.path("provenance").asString()).isEqualTo("datasheet");
        // OD 2 → T = 10^-2 (A = −log10 T, IUPAC Gold Book A00028)
        assertThat(p.path("curve").path("transmittance").get(1).asDouble()).isCloseTo(0.01, within(1e-15));
    }

    @Test
    void previewOfRawCountsAppliesDarkAndReferenceCorrection() throws Exception {
        JsonNode p = post(Multipart.file("bench-capture.csv", ImportFiles.rawCounts()), "/api/imports/preview", 200);

        assertThat(p.path("format").asString()).isEqualTo("raw-counts");
        JsonNode nm = p.path("curve").path("wavelengthsNm");
        JsonNode t = p.path("curve").path("transmittance");
        // T = (S − D)/(R − D), REFERENCE §11: (20100 − 100)/(40100 − 100) = 0.5 at 400 nm; 0.25 at 410 nm
        assertThat(nm.get(2).asDouble()).isEqualTo(400.0);
        assertThat(t.get(2).asDouble()).isCloseTo(0.5, within(1e-12));
        assertThat(t.get(3).asDouble()).isCloseTo(0.25, within(1e-12));
    }

    @Test
    void explicitFormatOverridesDetection() throws Exception {
        // a datasheet file read as plain delimited text keeps the file's own provenance (none → measured)
        JsonNode p = post(Multipart.file("filter-graph.csv", ImportFiles.datasheetPoints()).field("format", "delimited"),
                "/api/imports/preview", 200);

        assertThat(p.path("format").asString()).isEqualTo("delimited");
        assertThat(p.path("provenance").asString()).isEqualTo("measured");
    }

    @Test
    void badFileIsAProblemNamingFileLineAndField() throws Exception {
        String bad = "wavelength_nm,transmittance_percent\n350,12\n365,abc\n380,50\n";

        JsonNode problem = post(Multipart.file("broken.csv", bad), "/api/imports/preview", 400);

        assertThat(problem.path("file").asString()).isEqualTo("broken.csv");
        assertThat(problem.path("line").asInt()).isEqualTo(3);
        assertThat(problem.path("field").asString()).isEqualTo("transmittance_percent");
        assertThat(problem.path("detail").asString()).contains("broken.csv line 3");
    }

    @Test
    void badOptionIsAProblemNamingTheParameter() throws Exception {
        JsonNode problem = post(Multipart.file("cast-sheet.csv", ImportFiles.percentCsv()).field("yKind", "percentage"),
                "/api/imports/preview", 400);

        assertThat(problem.path("parameter").asString()).isEqualTo("yKind");
    }

    @Test
    void uploadOverTheSizeCapIsRefusedWith413NamingTheCap() throws Exception {
        byte[] big = new byte[MAX_BYTES + 50_000];
        java.util.Arrays.fill(big, (byte) '1');

        JsonNode problem = post(Multipart.file("huge.csv", big), "/api/imports/preview", 413);

        assertThat(problem.path("detail").asString()).contains(String.valueOf(MAX_BYTES)).contains("sieve.imports.max-file-bytes");
    }

    @Test
    void curveOverThePointsCapIsRefusedWith400NamingTheCap() throws Exception {
        StringBuilder csv = new StringBuilder("wavelength_nm,T\n");
        for (int i = 0; i <= MAX_POINTS; i++) {
            csv.append(200 + i * 0.1).append(",0.5\n");
        }
        assertThat(csv.length()).isLessThan(MAX_BYTES);

        JsonNode problem = post(Multipart.file("dense.csv", csv.toString()), "/api/imports/preview", 400);

        assertThat(problem.path("detail").asString()).contains(String.valueOf(MAX_POINTS)).contains("sieve.imports.max-points");
    }
}
