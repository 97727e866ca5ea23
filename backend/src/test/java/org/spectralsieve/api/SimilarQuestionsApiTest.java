package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;
import static org.spectralsieve.api.DemoMaterials.sampleAt;

import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.spectralsieve.importers.DelimitedTextWriter;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.optics.ThicknessRescaler;
import org.spectralsieve.spectrum.Curve;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * {@code POST /api/similar} and the band and warnings of {@code GET /api/samples/{id}/similar}, over the
 * illustrative demo library through a real server: an unsaved file finds the stock it was made from, a band
 * and a requirement change the answer as they should, a query at its detection floor says so, and every bad
 * field is a problem naming it.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = {
        "spring.datasource.url=jdbc:h2:mem:similar-questions-api-test;DB_CLOSE_DELAY=-1",
        "sieve.imports.max-file-bytes=" + SimilarQuestionsApiTest.MAX_BYTES,
        "sieve.imports.max-points=" + SimilarQuestionsApiTest.MAX_POINTS})
class SimilarQuestionsApiTest {

    /** Small import limits, so that the caps can be reached cheaply (a demo curve has 911 points, ~30 kB). */
    static final int MAX_BYTES = 200_000;
    static final int MAX_POINTS = 5_000;

    private static final HttpClient HTTP = HttpClient.newHttpClient();
    private static final JsonMapper JSON = JsonMapper.builder().build();
    /** A bulk demo stock (invented, illustrative) measured at 4 and 6 mm; n = 1.52 in the demo catalogue. */
    private static final String STOCK = "bronze-tint-float-glass";
    private static final double STOCK_INDEX = 1.52;
    /** A demo film (invented, illustrative) opaque through nearly all of 200–700 nm. */
    private static final String BLACK_FILM = "black-stencil-film";
    /**
     * A requirement some of the bronze glass's nearest curves meet and some do not: the violet band a tinted
     * glass absorbs (illustrative, a screen for the test, no trade figure).
     */
    private static final String VIOLET_REQUIREMENT = "passes over 70% from 400 to 450 nm";

    @LocalServerPort
    int port;

    @Autowired
    JooqLibraryRepository library;

    /**
     * The 4 mm sample's stored curve taken to 5 mm by the project's rescaler: Fresnel surfaces off, Beer–Lambert
     * (internal absorbance proportional to the path, any optics handbook) from 4 to 5 mm, surfaces back on —
     * a piece of the same stock at a thickness the library does not hold, written out as a curve file.
     */
    private byte[] stockAtFiveMillimetres() throws Exception {
        Curve stored = library.findCurve(sampleAt(material(STOCK), 4)).orElseThrow();
        Curve rescaled = ThicknessRescaler.rescale(stored, 4, 5, new ConstantIndex(STOCK_INDEX));
        boolean[] bounds = new boolean[rescaled.size()];
        for (int i = 0; i < bounds.length; i++) {
            bounds[i] = rescaled.belowDetection(i);
        }
        Map<String, String> metadata = new LinkedHashMap<>();
        metadata.put("detection_limit", "0.001");
        return DelimitedTextWriter.write(metadata, rescaled.wavelengthsNm(), rescaled.transmittances(), bounds)
                .getBytes(java.nio.charset.StandardCharsets.UTF_8);
    }

    @Test
    void anUnsavedFileFindsTheStockItWasCutFromAndTheThicknessItWasCutAt() throws Exception {
        int samplesBefore = sampleCount();
        JsonNode answer = post(Multipart.file("offcut-5mm.csv", stockAtFiveMillimetres()).field("thicknessMm", 5), 200);

        assertThat(answer.path("query").path("fileName").asString()).isEqualTo("offcut-5mm.csv");
        assertThat(answer.path("query").path("thicknessMm").asDouble()).isEqualTo(5.0);
        assertThat(answer.path("query").path("bulk").asBoolean()).isTrue(); // bulk when a thickness is given
        assertThat(answer.path("metric").asString()).isEqualTo("centred-euclidean");
        assertThat(answer.path("band").isNull()).isTrue();
        assertThat(answer.path("requirement").isNull()).isTrue();
        assertThat(answer.path("warnings")).isEmpty();
        long stock = material(STOCK).path("id").asLong();
        JsonNode first = answer.path("hits").get(0);
        JsonNode second = answer.path("hits").get(1);
        assertThat(first.path("materialId").asLong()).isEqualTo(stock);
        assertThat(second.path("materialId").asLong()).isEqualTo(stock);
        // Beer–Lambert: both stored thicknesses match the piece best at the 5 mm it was rescaled to (2 %, the core's check)
        assertThat(first.path("matchingThicknessMm").asDouble()).isCloseTo(5.0, within(0.1));
        assertThat(second.path("matchingThicknessMm").asDouble()).isCloseTo(5.0, within(0.1));
        assertThat(first.path("distance").asDouble()).isLessThan(answer.path("hits").get(2).path("distance").asDouble());
        assertThat(sampleCount()).as("the uploaded file is never stored").isEqualTo(samplesBefore);
    }

    @Test
    void withoutAThicknessTheFileIsComparedAsMeasuredByCorrelationAndStillFindsItsStock() throws Exception {
        JsonNode answer = post(Multipart.file("offcut.csv", stockAtFiveMillimetres()), 200);
        assertThat(answer.path("query").path("thicknessMm").isNull()).isTrue();
        assertThat(answer.path("query").path("bulk").asBoolean()).isFalse();
        assertThat(answer.path("metric").asString()).isEqualTo("correlation");
        assertThat(answer.path("hits").get(0).path("materialId").asLong()).isEqualTo(material(STOCK).path("id").asLong());
        // the matching thickness comes from the stored sample's own thickness: still 5 mm
        assertThat(answer.path("hits").get(0).path("matchingThicknessMm").asDouble()).isCloseTo(5.0, within(0.1));
    }

    @Test
    void aStoredSampleAsksThePostAsItAsksTheGet() throws Exception {
        long sample = sampleAt(material(STOCK), 4);
        JsonNode posted = post(Multipart.fields().field("sampleId", sample).field("band", "380-700").field("limit", 5), 200);
        JsonNode got = get("/api/samples/" + sample + "/similar?band=380-700&limit=5", 200);
        assertThat(posted.path("hits")).isEqualTo(got.path("hits"));
        assertThat(posted.path("band")).isEqualTo(got.path("band"));
        assertThat(got.path("band").path("fromNm").asDouble()).isEqualTo(380.0);
        assertThat(posted.path("query").path("sampleId").asLong()).isEqualTo(sample);
        assertThat(posted.path("query").path("thicknessMm").asDouble()).isEqualTo(4.0);
    }

    @Test
    void aBandChangesTheRankingAndItsDifferingBandStaysInside() throws Exception {
        long sample = sampleAt(material(STOCK), 4);
        JsonNode whole = get("/api/samples/" + sample + "/similar?limit=50", 200);
        JsonNode uv = get("/api/samples/" + sample + "/similar?limit=50&band=300-400", 200);
        assertThat(whole.path("band").isNull()).isTrue();
        assertThat(ids(uv)).isNotEqualTo(ids(whole));
        for (JsonNode hit : uv.path("hits")) {
            assertThat(hit.path("pointsCompared").asInt()).isLessThanOrEqualTo(21); // 300, 305, …, 400 nm
            assertThat(hit.path("differingMost").path("fromNm").asDouble()).isGreaterThanOrEqualTo(297.5);
            assertThat(hit.path("differingMost").path("toNm").asDouble()).isLessThanOrEqualTo(402.5);
        }
    }

    @Test
    void findASubstituteKeepsOnlyHitsWhoseMaterialTheSearchFindsMeetingTheRequirement() throws Exception {
        long sample = sampleAt(material(STOCK), 4);
        long stock = material(STOCK).path("id").asLong();
        Set<Long> meeting = meetingMaterials(VIOLET_REQUIREMENT);
        JsonNode nearest = get("/api/samples/" + sample + "/similar?limit=50", 200);
        JsonNode substitutes = post(Multipart.fields().field("sampleId", sample).field("requirement", VIOLET_REQUIREMENT)
                .field("limit", 50), 200);

        JsonNode counted = substitutes.path("requirement");
        assertThat(counted.path("text").asString()).isEqualTo(VIOLET_REQUIREMENT);
        // the 50 nearest, less the query's own stock (a substitute is another material)
        int looked = 0;
        int met = 0;
        for (JsonNode hit : nearest.path("hits")) {
            if (hit.path("materialId").asLong() != stock) {
                looked++;
                met += meeting.contains(hit.path("materialId").asLong()) ? 1 : 0;
            }
        }
        assertThat(counted.path("looked").asInt()).isEqualTo(looked);
        assertThat(counted.path("met").asInt()).isEqualTo(met);
        assertThat(met).as("the requirement must leave some hits out and keep some").isPositive().isLessThan(looked);
        assertThat(substitutes.path("hits")).hasSize(met);
        for (JsonNode hit : substitutes.path("hits")) {
            assertThat(meeting).contains(hit.path("materialId").asLong());
            assertThat(hit.path("materialId").asLong()).isNotEqualTo(stock);
        }
        List<Double> distances = substitutes.path("hits").valueStream().map(h -> h.path("distance").asDouble()).toList();
        assertThat(distances).isSorted();
        // a limit takes the nearest of the substitutes
        JsonNode three = post(Multipart.fields().field("sampleId", sample).field("requirement", VIOLET_REQUIREMENT)
                .field("limit", 3), 200);
        assertThat(ids(three)).isEqualTo(ids(substitutes).subList(0, 3));
    }

    @Test
    void wordsBesideTheRequirementKeepExactlyTheSubstitutesWhoseMaterialTheWordsAdmit() throws Exception {
        long sample = sampleAt(material(STOCK), 4);
        JsonNode plain = post(Multipart.fields().field("sampleId", sample).field("requirement", VIOLET_REQUIREMENT)
                .field("limit", 50), 200);
        assertThat(plain.path("requirement").path("admitted").isNull()
                || plain.path("requirement").path("admitted").isMissingNode())
                .as("a requirement without words admits by no words").isTrue();

        // leading words, as the requirement search takes them
        String acrylic = "acrylic " + VIOLET_REQUIREMENT;
        Set<Long> admittedAcrylic = libraryMaterials("q=acrylic");
        JsonNode worded = post(Multipart.fields().field("sampleId", sample).field("requirement", acrylic)
                .field("limit", 50), 200);
        List<Long> expected = idsOfMaterials(plain, admittedAcrylic);
        assertThat(expected).as("the words must leave some substitutes out and keep some").isNotEmpty()
                .hasSizeLessThan(plain.path("hits").size());
        assertThat(ids(worded)).isEqualTo(expected);
        JsonNode counted = worded.path("requirement");
        assertThat(counted.path("text").asString()).isEqualTo(acrylic);
        assertThat(counted.path("looked").asInt()).isEqualTo(plain.path("requirement").path("looked").asInt());
        assertThat(counted.path("met").asInt()).isEqualTo(expected.size());
        assertThat(counted.path("admitted").asInt()).isEqualTo(admittedAcrylic.size());

        // a provenance term narrows as the library's provenance facet does
        String modelled = VIOLET_REQUIREMENT + " and provenance modelled";
        Set<Long> admittedModelled = libraryMaterials("provenance=modelled");
        JsonNode byProvenance = post(Multipart.fields().field("sampleId", sample).field("requirement", modelled)
                .field("limit", 50), 200);
        assertThat(ids(byProvenance)).isEqualTo(idsOfMaterials(plain, admittedModelled));
        assertThat(byProvenance.path("requirement").path("admitted").asInt()).isEqualTo(admittedModelled.size());
    }

    @Test
    void wordsThatAdmitNoMaterialLeaveNoSubstituteAndSaySo() throws Exception {
        long sample = sampleAt(material(STOCK), 4);
        JsonNode plain = post(Multipart.fields().field("sampleId", sample).field("requirement", VIOLET_REQUIREMENT)
                .field("limit", 50), 200);
        assertThat(libraryMaterials("q=unobtainium")).isEmpty();
        JsonNode none = post(Multipart.fields().field("sampleId", sample)
                .field("requirement", "unobtainium " + VIOLET_REQUIREMENT).field("limit", 50), 200);
        assertThat(none.path("hits")).isEmpty();
        assertThat(none.path("requirement").path("admitted").asInt()).isZero();
        assertThat(none.path("requirement").path("admitted").isNumber()).isTrue();
        assertThat(none.path("requirement").path("met").asInt()).isZero();
        assertThat(none.path("requirement").path("looked").asInt()).isEqualTo(plain.path("requirement").path("looked").asInt());
    }

    @Test
    void aCurveAtItsDetectionFloorIsSaidToRestOnFewResolvedPoints() throws Exception {
        long film = material(BLACK_FILM).path("samples").get(0).path("id").asLong();
        JsonNode got = get("/api/samples/" + film + "/similar", 200);
        assertThat(got.path("warnings").get(0).asString()).startsWith("most of this curve is at the detection limit")
                .contains("the ranking rests on");
        JsonNode posted = post(Multipart.fields().field("sampleId", film), 200);
        assertThat(posted.path("warnings")).isEqualTo(got.path("warnings"));
        assertThat(posted.path("query").path("pointsResolved").asInt())
                .isLessThan(posted.path("query").path("pointsCovered").asInt() / 2);
        // a well-resolved curve carries none
        assertThat(get("/api/samples/" + sampleAt(material(STOCK), 4) + "/similar", 200).path("warnings")).isEmpty();
    }

    @Test
    void badFieldsAreProblemsNamingTheField() throws Exception {
        long sample = sampleAt(material(STOCK), 4);
        byte[] file = stockAtFiveMillimetres();
        assertThat(problem("/api/samples/" + sample + "/similar?band=150-300")).isEqualTo("band");
        assertThat(problem("/api/samples/" + sample + "/similar?band=400-300")).isEqualTo("band");
        assertThat(problem("/api/samples/" + sample + "/similar?band=300-320")).isEqualTo("band");
        assertThat(problem("/api/samples/" + sample + "/similar?band=uv")).isEqualTo("band");
        assertThat(problem(Multipart.fields())).isEqualTo("file");
        assertThat(problem(Multipart.file("a.csv", file).field("sampleId", sample))).isEqualTo("sampleId");
        assertThat(problem(Multipart.fields().field("sampleId", "four"))).isEqualTo("sampleId");
        assertThat(problem(Multipart.fields().field("sampleId", sample).field("thicknessMm", 3))).isEqualTo("thicknessMm");
        assertThat(problem(Multipart.file("a.csv", file).field("thicknessMm", -1))).isEqualTo("thicknessMm");
        assertThat(problem(Multipart.file("a.csv", file).field("bulk", "perhaps"))).isEqualTo("bulk");
        assertThat(problem(Multipart.file("a.csv", file).field("bulk", "true"))).isEqualTo("bulk"); // no thickness
        assertThat(problem(Multipart.file("a.csv", file).field("metric", "centred-euclidean"))).isEqualTo("metric");
        assertThat(problem(Multipart.file("a.csv", file).field("metric", "cosine"))).isEqualTo("metric");
        assertThat(problem(Multipart.file("a.csv", file).field("limit", 51))).isEqualTo("limit");
        assertThat(problem(Multipart.file("a.csv", file).field("band", "100-200"))).isEqualTo("band");
        assertThat(problem(Multipart.file("a.csv", file).field("requirement", "passes over"))).isEqualTo("requirement");
        assertThat(problem(Multipart.file("a.csv", file).field("requirement", "acrylic provenance guessed and passes over"
                + " 80% at 400 nm"))).isEqualTo("requirement"); // a provenance the library does not know
        assertThat(problem(Multipart.file("a.csv", file).field("yKind", "colour"))).isEqualTo("yKind");
        // a file that is no curve: the preview's own problem, naming the file
        HttpResponse<String> unreadable = Multipart.file("notes.csv", "wavelength,transmittance\nfoo,bar\n")
                .post(port, "/api/similar");
        assertThat(unreadable.statusCode()).as(unreadable.body()).isEqualTo(400);
        assertThat(JSON.readTree(unreadable.body()).path("file").asString()).isEqualTo("notes.csv");
        assertThat(get("/api/samples/987654321/similar?band=300-400", 404).path("status").asInt()).isEqualTo(404);
        assertThat(post(Multipart.fields().field("sampleId", 987654321), 404).path("status").asInt()).isEqualTo(404);
    }

    @Test
    void theImportLimitsApplyToAnUploadedQuery() throws Exception {
        StringBuilder csv = new StringBuilder("wavelength_nm,T\n");
        for (int i = 0; i <= MAX_POINTS; i++) {
            csv.append(200 + i * 0.1).append(",0.5\n");
        }
        assertThat(csv.length()).isLessThan(MAX_BYTES);
        JsonNode points = post(Multipart.file("dense.csv", csv.toString()), 400);
        assertThat(points.path("detail").asString()).contains("sieve.imports.max-points");

        byte[] big = new byte[MAX_BYTES + 50_000];
        java.util.Arrays.fill(big, (byte) '1');
        JsonNode size = post(Multipart.file("huge.csv", big), 413);
        assertThat(size.path("detail").asString()).contains("sieve.imports.max-file-bytes");
    }

    private Set<Long> meetingMaterials(String requirement) throws Exception {
        HttpResponse<String> response = HTTP.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + "/api/search"))
                .header("Content-Type", "application/json")
                .POST(HttpRequest.BodyPublishers.ofString(JSON.writeValueAsString(Map.of("requirement", requirement,
                        "limit", 500)))).build(), HttpResponse.BodyHandlers.ofString());
        assertThat(response.statusCode()).as(response.body()).isEqualTo(200);
        Set<Long> out = new HashSet<>();
        for (JsonNode row : JSON.readTree(response.body()).path("results")) {
            if (row.path("group").asString().equals("meets")) {
                out.add(row.path("materialId").asLong());
            }
        }
        return out;
    }

    /** The materials {@code GET /api/library} finds for a query, every one of them (the demo library is small). */
    private Set<Long> libraryMaterials(String query) throws Exception {
        JsonNode answer = get("/api/library?limit=200&" + query, 200);
        assertThat(answer.path("total").asLong()).isLessThanOrEqualTo(200);
        Set<Long> out = new HashSet<>();
        answer.path("hits").forEach(h -> out.add(h.path("materialId").asLong()));
        return out;
    }

    /** The sample ids of an answer's hits whose material is one of {@code materials}, in the answer's order. */
    private static List<Long> idsOfMaterials(JsonNode answer, Set<Long> materials) {
        return answer.path("hits").valueStream().filter(h -> materials.contains(h.path("materialId").asLong()))
                .map(h -> h.path("sampleId").asLong()).toList();
    }

    private static List<Long> ids(JsonNode answer) {
        return answer.path("hits").valueStream().map(h -> h.path("sampleId").asLong()).toList();
    }

    private int sampleCount() throws Exception {
        int n = 0;
        for (JsonNode m : get("/api/materials", 200)) {
            n += m.path("samples").size();
        }
        return n;
    }

    private JsonNode material(String slug) throws Exception {
        return DemoMaterials.bySlug(get("/api/materials", 200), slug);
    }

    private String problem(String path) throws Exception {
        return get(path, 400).path("parameter").asString();
    }

    private String problem(Multipart form) throws Exception {
        return post(form, 400).path("parameter").asString();
    }

    private JsonNode post(Multipart form, int expectedStatus) throws Exception {
        HttpResponse<String> response = form.post(port, "/api/similar");
        assertThat(response.statusCode()).as(response.body()).isEqualTo(expectedStatus);
        if (expectedStatus >= 400) {
            assertThat(response.headers().firstValue("Content-Type").orElse("")).startsWith("application/problem+json");
        }
        return JSON.readTree(response.body());
    }

    private JsonNode get(String path, int expectedStatus) throws Exception {
        HttpResponse<String> response = HTTP.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + path))
                .GET().build(), HttpResponse.BodyHandlers.ofString());
        assertThat(response.statusCode()).as(path + " -> " + response.body()).isEqualTo(expectedStatus);
        if (expectedStatus >= 400) {
            assertThat(response.headers().firstValue("Content-Type").orElse("")).startsWith("application/problem+json");
        }
        return JSON.readTree(response.body());
    }
}
