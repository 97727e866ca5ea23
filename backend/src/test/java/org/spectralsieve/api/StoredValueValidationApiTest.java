package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;
import static org.spectralsieve.library.db.Tables.MATERIAL;
import static org.spectralsieve.library.db.Tables.REFERENCE_SPECTRUM;
import static org.spectralsieve.library.db.Tables.SAMPLE;

import java.net.http.HttpResponse;
import java.util.stream.Stream;
import org.jooq.DSLContext;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Hostile values for every stored number and text, through the import endpoints: each is refused with a
 * 4xx problem detail naming the field (and the file where the value came from one), and stores nothing.
 * The ranges are the project's own (docs/validation.md); the valid import beside each case shows that only
 * the one hostile value is refused.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:stored-value-validation-test;DB_CLOSE_DELAY=-1")
class StoredValueValidationApiTest {

    private static final JsonMapper JSON = JsonMapper.builder().build();
    private static final String CURVE = "wavelength_nm,T\n300,0.2\n400,0.6\n500,0.9\n";

    @LocalServerPort
    int port;

    @Autowired
    DSLContext db;

    /** A new material's import with every field valid; each case overrides one. */
    private static Multipart validImport(String fileText) {
        return Multipart.file("illustrative-sheet.csv", fileText).field("materialName", "Illustrative validation sheet")
                .field("materialClass", "plastic sheet").field("scaling", "bulk").field("indexN", "1.49")
                .field("thicknessMm", "3").field("description", "illustrative").field("instrument", "bench")
                .field("lot", "A1").field("notes", "first\nsecond line").field("measuredOn", "2026-01-05");
    }

    static Stream<Arguments> hostileFormFields() {
        return Stream.of(
                Arguments.of("indexN", "1e16"),
                Arguments.of("indexN", "1e308"),
                Arguments.of("indexN", "0.5"),
                Arguments.of("indexN", "4.5"),
                Arguments.of("indexN", "NaN"),
                Arguments.of("thicknessMm", "1e308"),
                Arguments.of("thicknessMm", "1e-300"),
                Arguments.of("thicknessMm", "0.0001"),
                Arguments.of("thicknessMm", "1001"),
                Arguments.of("thicknessMm", "Infinity"),
                Arguments.of("materialName", "Sheet\u0000with NUL"),
                Arguments.of("materialName", "Sheet\u0007with BEL"),
                Arguments.of("materialName", "Sheet \u202Eevil\u202C name"),
                Arguments.of("materialName", "Sheet \u2066isolate\u2069"),
                Arguments.of("materialName", "Sheet \u200Fmark"),
                Arguments.of("materialName", "Sheet \u061Cmark"),
                Arguments.of("materialName", "Sheet on\ntwo lines"),
                Arguments.of("materialName", "x".repeat(201)),
                Arguments.of("description", "escape \u001B[31m red"),
                Arguments.of("description", "d".repeat(4001)),
                Arguments.of("instrument", "bench\u0000"),
                Arguments.of("instrument", "i".repeat(201)),
                Arguments.of("lot", "A\u202E1"),
                Arguments.of("lot", "l".repeat(101)),
                Arguments.of("notes", "ring \u0007 the bell"),
                Arguments.of("notes", "n".repeat(4001)),
                Arguments.of("stockThicknesses", "2 3 1e308"),
                Arguments.of("stockThicknesses", "0.0000001"),
                Arguments.of("madeRange", "1e-300 to 5"),
                Arguments.of("madeRange", "1 to 1e308"),
                Arguments.of("detectionLimit", "1"),
                Arguments.of("detectionLimit", "-0.1"),
                Arguments.of("detectionLimit", "NaN"),
                Arguments.of("measuredOn", "2999-01-01"),
                Arguments.of("measuredOn", "1850-01-01"));
    }

    @ParameterizedTest(name = "{0} = {1}")
    @MethodSource("hostileFormFields")
    void aHostileFormFieldIsRefusedNamingItAndStoresNothing(String field, String value) throws Exception {
        refusedNaming(validImport(CURVE).field(field, value), "/api/imports", "parameter", field);
    }

    @Test
    void theValidImportBesideTheHostileCasesIsStored() throws Exception {
        int samples = db.fetchCount(SAMPLE);
        HttpResponse<String> response = validImport(CURVE).field("materialName", "Illustrative validation control")
                .post(port, "/api/imports");
        assertThat(response.statusCode()).as(response.body()).isEqualTo(201);
        assertThat(db.fetchCount(SAMPLE)).isEqualTo(samples + 1);
    }

    @Test
    void aHostileThicknessForAnExistingMaterialIsRefusedNamingIt() throws Exception {
        long materialId = db.select(MATERIAL.ID).from(MATERIAL).orderBy(MATERIAL.ID).limit(1).fetchOne(MATERIAL.ID);
        refusedNaming(Multipart.file("sheet.csv", CURVE).field("materialId", materialId).field("thicknessMm", "1e308"),
                "/api/imports", "parameter", "thicknessMm");
    }

    @Test
    void aThicknessTheFileStatesOutsideTheRangeIsRefusedNamingTheFileAndField() throws Exception {
        JsonNode problem = refusedNaming(validImport("# thickness_mm: 1e308\n" + CURVE).field("thicknessMm", ""),
                "/api/imports", "field", "thickness_mm");
        assertThat(problem.path("file").asString()).isEqualTo("illustrative-sheet.csv");
    }

    @Test
    void wavelengthsOutsideTheToolsRangeAreRefusedNamingTheFile() throws Exception {
        JsonNode problem = refusedNaming(validImport("wavelength_nm,T\n1e300,0.2\n2e300,0.6\n"), "/api/imports",
                "field", "wavelength");
        assertThat(problem.path("file").asString()).isEqualTo("illustrative-sheet.csv");
    }

    @Test
    void anInstrumentTheFileStatesWithAControlCharacterIsRefusedNamingTheFile() throws Exception {
        JsonNode problem = refusedNaming(validImport("# instrument: bench\u0007\n" + CURVE).field("instrument", ""),
                "/api/imports", "field", "instrument");
        assertThat(problem.path("file").asString()).isEqualTo("illustrative-sheet.csv");
    }

    @Test
    void aBatchRowWithAHostileValueIsRefusedNamingTheColumnAndStoresNothing() throws Exception {
        int materials = db.fetchCount(MATERIAL);
        int samples = db.fetchCount(SAMPLE);
        byte[] zip = Zips.of("manifest.csv", """
                        file,material,thickness,class,scaling,index_n,lot
                        a.csv,Illustrative batch thickness,1e308,plastic sheet,bulk,1.49,
                        a.csv,Illustrative batch index,3,plastic sheet,bulk,1e16,
                        a.csv,Illustrative batch\u0007bell,3,plastic sheet,bulk,1.49,
                        a.csv,Illustrative batch lot,3,plastic sheet,bulk,1.49,L\u202E1
                        """, "a.csv", CURVE);

        HttpResponse<String> response = Multipart.file("batch.zip", zip).post(port, "/api/imports/batch");

        assertThat(response.statusCode()).as(response.body()).isEqualTo(200);
        JsonNode files = JSON.readTree(response.body()).path("files");
        String[] columns = {"'thickness'", "'index_n'", "'material'", "'lot'"};
        for (int i = 0; i < columns.length; i++) {
            assertThat(files.get(i).path("outcome").asString()).isEqualTo("REFUSED");
            assertThat(files.get(i).path("message").asString()).contains("manifest line " + (i + 2), columns[i]);
        }
        assertThat(db.fetchCount(MATERIAL)).isEqualTo(materials);
        assertThat(db.fetchCount(SAMPLE)).isEqualTo(samples);
    }

    static Stream<Arguments> hostileSpectrumFields() {
        return Stream.of(
                Arguments.of("description", "lamp \u202Egnirts"),
                Arguments.of("description", "lamp \u0000"),
                Arguments.of("provenance", "bench \u0007"),
                Arguments.of("provenance", "p".repeat(4001)));
    }

    @ParameterizedTest(name = "{0} = {1}")
    @MethodSource("hostileSpectrumFields")
    void aHostileTextOfAnImportedEmitterIsRefusedNamingItAndStoresNothing(String field, String value) throws Exception {
        int spectra = db.fetchCount(REFERENCE_SPECTRUM);
        refusedNaming(Multipart.file("lamp.csv", "wavelength_nm,power\n350,0.2\n365,1\n405,0.4\n")
                .field("name", "illustrative-lamp").field(field, value), "/api/emitters", "parameter", field);
        assertThat(db.fetchCount(REFERENCE_SPECTRUM)).isEqualTo(spectra);
    }

    @Test
    void anEmitterWhoseWavelengthsLieOutsideTheToolsRangeIsRefusedNamingTheFile() throws Exception {
        int spectra = db.fetchCount(REFERENCE_SPECTRUM);
        JsonNode problem = refusedNaming(Multipart.file("far-lamp.csv", "wavelength_nm,power\n350,0.2\n365,1\n1e300,0.4\n")
                .field("name", "illustrative-far-lamp"), "/api/emitters", "field", "wavelength");
        assertThat(problem.path("file").asString()).isEqualTo("far-lamp.csv");
        assertThat(db.fetchCount(REFERENCE_SPECTRUM)).isEqualTo(spectra);
    }

    /** Posts the form, expects a 4xx problem detail whose {@code property} names {@code name}; nothing stored. */
    private JsonNode refusedNaming(Multipart form, String path, String property, String name) throws Exception {
        int materials = db.fetchCount(MATERIAL);
        int samples = db.fetchCount(SAMPLE);

        HttpResponse<String> response = form.post(port, path);

        assertThat(response.statusCode()).as(response.body()).isBetween(400, 499);
        assertThat(response.headers().firstValue("Content-Type").orElse("")).contains("application/problem+json");
        JsonNode problem = JSON.readTree(response.body());
        assertThat(problem.path(property).asString()).as(response.body()).isEqualTo(name);
        assertThat(db.fetchCount(MATERIAL)).isEqualTo(materials);
        assertThat(db.fetchCount(SAMPLE)).isEqualTo(samples);
        return problem;
    }
}
