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
        return form.postExpecting(port, path, status);
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

    private static Multipart newMaterialForm(String file, String text, String name) {
        return Multipart.file(file, text).field("materialName", name).field("materialClass", "plastic sheet")
                .field("scaling", "bulk").field("thicknessMm", 3).field("instrument", "bench spectrometer")
                .field("measuredOn", "2026-03-02");
    }

    @Test
    void storeUnderANewMaterialReturnsTheSampleAndKeepsTheOriginalBytes() throws Exception {
        String csv = ImportFiles.percentCsv();
        JsonNode stored = post(newMaterialForm("new-sheet.csv", csv, "Illustrative new sheet"), "/api/imports", 201);

        assertThat(stored.path("duplicate").asBoolean()).isFalse();
        assertThat(stored.path("newMaterial").asBoolean()).isTrue();
        assertThat(stored.path("materialSlug").asString()).isEqualTo("illustrative-new-sheet");
        assertThat(stored.path("sample").path("thicknessMm").asDouble()).isEqualTo(3.0);
        assertThat(stored.path("sample").path("measuredOn").asString()).isEqualTo("2026-03-02");
        assertThat(stored.path("warnings").toString()).contains("n = 1.5");
        long sampleId = stored.path("sampleId").asLong();
        assertThat(db.select(CURVE.POINT_COUNT).from(CURVE).where(CURVE.SAMPLE_ID.eq(sampleId)).fetchOne(CURVE.POINT_COUNT))
                .isEqualTo(5);
        HttpResponse<byte[]> source = java.net.http.HttpClient.newHttpClient().send(java.net.http.HttpRequest.newBuilder(
                java.net.URI.create("http://localhost:" + port + "/api/samples/" + sampleId + "/source-file")).build(),
                HttpResponse.BodyHandlers.ofByteArray());
        assertThat(source.statusCode()).isEqualTo(200);
        assertThat(new String(source.body(), StandardCharsets.UTF_8)).isEqualTo(csv);
        // the stored curve is found by the next search (the search store was invalidated)
        JsonNode material = getJson("/api/materials/" + stored.path("materialId").asLong());
        assertThat(material.path("samples").size()).isEqualTo(1);
    }

    @Test
    void storeUnderAnExistingMaterialThenTheSameFileAgainIsRecognisedAsDuplicate() throws Exception {
        long materialId = post(newMaterialForm("base.csv", ImportFiles.csvWithThickness(2), "Illustrative base stock"),
                "/api/imports", 201).path("materialId").asLong();
        String second = ImportFiles.csvWithThickness(4);
        Multipart form = Multipart.file("thicker.csv", second).field("materialId", materialId);

        JsonNode first = post(form, "/api/imports", 201);
        int samples = db.fetchCount(SAMPLE);
        JsonNode again = post(Multipart.file("thicker-copy.csv", second).field("materialId", materialId), "/api/imports", 200);

        assertThat(first.path("sample").path("thicknessMm").asDouble()).isEqualTo(4.0); // from the file's thickness_mm
        assertThat(first.path("newMaterial").asBoolean()).isFalse();
        assertThat(again.path("duplicate").asBoolean()).isTrue();
        assertThat(again.path("sampleId").asLong()).isEqualTo(first.path("sampleId").asLong());
        assertThat(db.fetchCount(SAMPLE)).isEqualTo(samples);
    }

    @Test
    void sameFileAtAnotherThicknessIsANewSample() throws Exception {
        String csv = "wavelength_nm,T\n300,0.3\n400,0.7\n";
        long materialId = post(newMaterialForm("a.csv", csv, "Illustrative twin stock"), "/api/imports", 201)
                .path("materialId").asLong();

        JsonNode other = post(Multipart.file("a.csv", csv).field("materialId", materialId).field("thicknessMm", 6),
                "/api/imports", 201);

        assertThat(other.path("duplicate").asBoolean()).isFalse();
    }

    @Test
    void refusedFileStoresNothingAtAll() throws Exception {
        int materials = db.fetchCount(MATERIAL);
        int samples = db.fetchCount(SAMPLE);
        int curves = db.fetchCount(CURVE);
        int files = db.fetchCount(SOURCE_FILE);

        JsonNode problem = post(newMaterialForm("broken.csv", "wavelength_nm,T\n300,0.3\n310,x\n", "Illustrative never"),
                "/api/imports", 400);

        assertThat(problem.path("line").asInt()).isEqualTo(3);
        assertThat(db.fetchCount(MATERIAL)).isEqualTo(materials);
        assertThat(db.fetchCount(SAMPLE)).isEqualTo(samples);
        assertThat(db.fetchCount(CURVE)).isEqualTo(curves);
        assertThat(db.fetchCount(SOURCE_FILE)).isEqualTo(files);
    }

    @Test
    void bulkMaterialWithoutThicknessIsRefusedNamingThicknessMm() throws Exception {
        Multipart form = Multipart.file("no-thickness.csv", "wavelength_nm,T\n300,0.3\n400,0.7\n")
                .field("materialName", "Illustrative thin").field("materialClass", "film").field("scaling", "bulk");

        JsonNode problem = post(form, "/api/imports", 400);

        assertThat(problem.path("parameter").asString()).isEqualTo("thicknessMm");
    }

    @Test
    void unknownMaterialIdIsNotFound() throws Exception {
        post(Multipart.file("a.csv", ImportFiles.percentCsv()).field("materialId", 987654).field("thicknessMm", 3),
                "/api/imports", 404);
    }

    @Test
    void batchZipReportsTheBadRowAndStoresTheRest() throws Exception {
        byte[] zip = Zips.of(
                "manifest.csv", """
                        file,material,thickness,geometry,provenance,instrument,date,notes,class,scaling,index_n
                        a-3mm.csv,Illustrative batch stock,3,regular,measured,bench,2026-03-02,first,plastic sheet,bulk,1.49
                        broken.csv,Illustrative batch stock,4,,,,,,,,
                        missing.csv,Illustrative batch stock,5,,,,,,,,
                        a-6mm.csv,illustrative-batch-stock,6,,,,,,,,
                        """,
                "a-3mm.csv", "wavelength_nm,T\n300,0.3\n400,0.7\n",
                "a-6mm.csv", "wavelength_nm,T\n300,0.09\n400,0.49\n",
                "broken.csv", "wavelength_nm,T\n300,0.3\n310,oops\n",
                "stray.csv", "wavelength_nm,T\n300,0.3\n400,0.7\n");

        JsonNode report = post(Multipart.file("batch.zip", zip), "/api/imports/batch", 200);

        JsonNode files = report.path("files");
        assertThat(files.size()).isEqualTo(4);
        assertThat(files.get(0).path("outcome").asString()).isEqualTo("STORED");
        assertThat(files.get(1).path("outcome").asString()).isEqualTo("REFUSED");
        assertThat(files.get(1).path("line").asInt()).isEqualTo(3);
        assertThat(files.get(1).path("message").asString()).contains("broken.csv line 3", "field 'T'");
        assertThat(files.get(2).path("outcome").asString()).isEqualTo("REFUSED");
        assertThat(files.get(2).path("message").asString()).contains("missing.csv", "not in the zip");
        assertThat(files.get(3).path("outcome").asString()).isEqualTo("STORED");
        assertThat(files.get(3).path("materialId").asLong()).isEqualTo(files.get(0).path("materialId").asLong());
        assertThat(report.path("notInManifest").toString()).contains("stray.csv");
    }

    @Test
    void zipWithAnEntryLeavingTheUploadIsRefusedWholeAndStoresNothing() throws Exception {
        int samples = db.fetchCount(SAMPLE);
        byte[] zip = Zips.of("manifest.csv", "file,material,thickness\nok.csv,Illustrative slip,3\n",
                "ok.csv", "wavelength_nm,T\n300,0.3\n400,0.7\n",
                "../evil.csv", "wavelength_nm,T\n300,0.3\n400,0.7\n");

        JsonNode problem = post(Multipart.file("slip.zip", zip), "/api/imports/batch", 400);

        assertThat(problem.path("detail").asString()).contains("../evil.csv").contains("'..'");
        assertThat(db.fetchCount(SAMPLE)).isEqualTo(samples);
    }

    @Test
    void zipWithMoreEntriesThanAllowedIsRefusedNamingTheSetting() throws Exception {
        String[] entries = new String[2 * (MAX_ENTRIES + 1)];
        for (int i = 0; i <= MAX_ENTRIES; i++) {
            entries[2 * i] = "f" + i + ".csv";
            entries[2 * i + 1] = "wavelength_nm,T\n300,0.3\n400,0.7\n";
        }

        JsonNode problem = post(Multipart.file("many.zip", Zips.of(entries)), "/api/imports/batch", 400);

        assertThat(problem.path("detail").asString()).contains("more than " + MAX_ENTRIES + " entries");
        assertThat(problem.path("setting").asString()).isEqualTo("sieve.imports.max-zip-entries");
    }

    @Test
    void demoLibrarySamplesKeepTheirCurveFileUnderTheCurvesChecksum() throws Exception {
        long sampleId = db.select(SAMPLE.ID).from(SAMPLE).orderBy(SAMPLE.ID).limit(1).fetchOne(SAMPLE.ID);
        String sha = db.select(CURVE.SOURCE_SHA256).from(CURVE).where(CURVE.SAMPLE_ID.eq(sampleId)).fetchOne(CURVE.SOURCE_SHA256);

        HttpResponse<byte[]> source = java.net.http.HttpClient.newHttpClient().send(java.net.http.HttpRequest.newBuilder(
                java.net.URI.create("http://localhost:" + port + "/api/samples/" + sampleId + "/source-file")).build(),
                HttpResponse.BodyHandlers.ofByteArray());

        assertThat(source.statusCode()).isEqualTo(200);
        assertThat(org.spectralsieve.ingest.Checksums.sha256(source.body())).isEqualTo(sha);
        assertThat(source.headers().firstValue("X-Checksum-SHA256")).contains(sha);
    }

    private JsonNode getJson(String path) throws Exception {
        HttpResponse<String> r = java.net.http.HttpClient.newHttpClient().send(java.net.http.HttpRequest.newBuilder(
                java.net.URI.create("http://localhost:" + port + path)).build(), HttpResponse.BodyHandlers.ofString());
        assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
        return JSON.readTree(r.body());
    }
}
