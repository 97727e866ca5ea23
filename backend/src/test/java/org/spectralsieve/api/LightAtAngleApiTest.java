package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.net.URI;
import java.net.URLEncoder;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;
import org.spectralsieve.optics.Illumination;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Light at an angle on the figures endpoint ({@code light}) and T against the angle of incidence
 * ({@code GET /api/samples/{id}/angles}) over the (illustrative) demo library.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:light-at-angle-api-test;DB_CLOSE_DELAY=-1")
class LightAtAngleApiTest {

    private static final HttpClient HTTP = HttpClient.newHttpClient();
    private static final JsonMapper JSON = JsonMapper.builder().build();

    /** Clear and bulk: absorbs almost nothing, so what changes with angle is the surfaces and the slant path. */
    private static final String CLEAR = "UV-grade synthetic fused silica";
    /** Absorbs part of the UV-A at 365 nm: a value (not a bound) there, and a slant path that matters. */
    private static final String ABSORBING = "Clear cast acrylic sheet";
    private static final String COATED = "Clear float glass with UV-blocking lacquer";
    private static final String DIFFUSE = "Opal white acrylic diffuser";

    @LocalServerPort
    int port;

    @Test
    void withoutALightParameterTheFiguresNameNormalIncidenceAndEqualAnExplicitNormal() throws Exception {
        long id = sampleId(CLEAR);
        JsonNode plain = figures(id, "&emitter=led-365&response=flat", 200);
        JsonNode normal = figures(id, "&emitter=led-365&response=flat&light=normal", 200);
        assertThat(plain.path("light").path("kind").asString()).isEqualTo("normal");
        assertThat(plain.path("light").path("description").asString())
                .isEqualTo(Illumination.NORMAL.describe()).contains("normal incidence");
        assertThat(plain.path("light").path("integration").isNull()).isTrue();
        assertThat(normal.path("effectiveTransmittance").path("value").asDouble())
                .isEqualTo(plain.path("effectiveTransmittance").path("value").asDouble());
    }

    /**
     * At 45° a clear window reflects more at each face (unpolarised R of n = 1.46 rises from about 3.5 % to about
     * 5 %: Hecht, Optics, §4.6, Fresnel's equations), so it passes less of a 365 nm LED than square on.
     */
    @Test
    void at45DegreesAClearBulkWindowPassesLessThanAtNormalIncidence() throws Exception {
        long id = sampleId(CLEAR);
        JsonNode normal = figures(id, "&emitter=led-365&response=flat", 200);
        JsonNode oblique = figures(id, "&emitter=led-365&response=flat&light=" + encode("at 45° incidence"), 200);
        double square = normal.path("effectiveTransmittance").path("value").asDouble();
        double slanted = oblique.path("effectiveTransmittance").path("value").asDouble();
        assertThat(slanted).isLessThan(square).isGreaterThan(square - 0.1);
        assertThat(oblique.path("light").path("kind").asString()).isEqualTo("incidence");
        assertThat(oblique.path("light").path("angleDeg").asDouble()).isEqualTo(45);
        assertThat(oblique.path("light").path("description").asString()).contains("45° incidence");
        assertThat(oblique.path("caution").asString()).contains("not a certification");

        // a spread source is named with how it was integrated
        JsonNode lambertian = figures(id, "&emitter=led-365&response=flat&light=" + encode("under a Lambertian source"), 200);
        assertThat(lambertian.path("light").path("integration").asString()).contains("Gauss–Legendre");
        assertThat(lambertian.path("effectiveTransmittance").path("value").asDouble()).isLessThan(square);
    }

    @Test
    void aLightValueThatIsNotAStatementOfLightIsA400NamingLight() throws Exception {
        long id = sampleId(CLEAR);
        for (String bad : new String[] {"sideways", "at 95° incidence", "over a 0° beam"}) {
            JsonNode problem = figures(id, "&light=" + encode(bad), 400);
            assertThat(problem.path("parameter").asString()).as(bad).isEqualTo("light");
            assertThat(problem.path("detail").asString()).as(bad).isNotBlank();
        }
    }

    @Test
    void aCoatedOrDiffuseSampleAtAnAngleIsAProblemNamingLightWithTheReason() throws Exception {
        JsonNode coated = figures(sampleId(COATED), "&light=" + encode("at 30° incidence"), 422);
        assertThat(coated.path("parameter").asString()).isEqualTo("light");
        assertThat(coated.path("detail").asString()).contains("coated").contains("30° incidence");
        JsonNode diffuse = figures(sampleId(DIFFUSE), "&light=" + encode("over a 60° beam"), 422);
        assertThat(diffuse.path("parameter").asString()).isEqualTo("light");
        assertThat(diffuse.path("detail").asString()).contains("scatter");
        // at normal incidence both still have their figures
        figures(sampleId(COATED), "&light=normal", 200);
        figures(sampleId(DIFFUSE), "", 200);
    }

    @Test
    void aStackAtAnAngleIsComputedAndPassesLessThanSquareOn() throws Exception {
        long id = sampleId(ABSORBING);
        String stack = "&emitter=led-365&response=flat&behind=clear-float-glass&behindMm=4";
        JsonNode normal = figures(id, stack, 200);
        JsonNode oblique = figures(id, stack + "&light=" + encode("at 60° incidence"), 200);
        assertThat(oblique.path("layer").asString()).contains("clear-float-glass");
        assertThat(oblique.path("effectiveTransmittance").path("value").asDouble())
                .isLessThan(normal.path("effectiveTransmittance").path("value").asDouble());
    }

    /** T(0°) of the sweep is the figures endpoint's normal-incidence T at that wavelength: OD at 365 nm. */
    @Test
    void theSweepStartsAtTheFiguresNormalIncidenceTransmittance() throws Exception {
        for (String material : new String[] {CLEAR, ABSORBING}) {
            long id = sampleId(material);
            for (String thickness : new String[] {"", "&thicknessMm=2.5"}) {
                JsonNode od = opticalDensity(figures(id, thickness, 200), "opticalDensity365");
                assertThat(od.path("bound").asString()).as(material).isEqualTo("value");
                JsonNode sweep = angles(id, "nm=365" + thickness, 200);
                assertThat(sweep.path("transmittance").get(0).asDouble()).as(material + thickness)
                        .isCloseTo(Math.pow(10, -od.path("value").asDouble()), within(1e-9));
                assertThat(sweep.path("rescaled").asBoolean()).isEqualTo(!thickness.isEmpty());
            }
        }
    }

    @Test
    void theSweepFallsTowardsGrazingAndMarksBrewstersAngleAtArctanN() throws Exception {
        JsonNode sweep = angles(sampleId(ABSORBING), "nm=365", 200);
        JsonNode t = sweep.path("transmittance");
        assertThat(sweep.path("anglesDeg").size()).isEqualTo(90);
        assertThat(t.size()).isEqualTo(90);
        assertThat(sweep.path("s").size()).isEqualTo(90);
        assertThat(sweep.path("p").size()).isEqualTo(90);
        assertThat(t.get(89).asDouble()).isLessThan(t.get(60).asDouble());
        assertThat(t.get(60).asDouble()).isLessThan(t.get(0).asDouble());
        // tan θB = n (Hecht, Optics, §4.6): Brewster's angle of the index the answer names
        double n = sweep.path("index").asDouble();
        assertThat(n).isBetween(1.3, 1.8);
        assertThat(sweep.path("brewsterDeg").asDouble()).isCloseTo(Math.toDegrees(Math.atan(n)), within(1e-9));
        assertThat(sweep.path("wavelengthNm").asDouble()).isEqualTo(365);
        assertThat(sweep.path("model").asString()).contains("Fresnel");
        JsonNode references = sweep.path("references");
        assertThat(references.size()).isEqualTo(3);
        for (JsonNode r : references) {
            assertThat(r.path("transmittance").asDouble()).as(r.path("light").path("description").asString())
                    .isLessThan(t.get(0).asDouble()).isGreaterThan(t.get(89).asDouble());
            assertThat(r.path("errorBound").asDouble()).isBetween(0.0, 1e-3);
            assertThat(r.path("light").path("description").asString()).isNotBlank();
        }
    }

    @Test
    void aWavelengthOutsideTheCurveOrNotANumberIsA400NamingNm() throws Exception {
        long id = sampleId(ABSORBING);
        for (String nm : new String[] {"100", "5000", "NaN", "blue"}) {
            assertThat(angles(id, "nm=" + nm, 400).path("parameter").asString()).as(nm).isEqualTo("nm");
        }
        assertThat(angles(id, "nm=365&thicknessMm=-2", 400).path("parameter").asString()).isEqualTo("thicknessMm");
        assertThat(angles(999999, "nm=365", 404).path("status").asInt()).isEqualTo(404);
    }

    @Test
    void aCoatedSampleHasNoSweepAndSaysWhy() throws Exception {
        JsonNode problem = angles(sampleId(COATED), "nm=365", 422);
        assertThat(problem.path("detail").asString()).contains("coated");
        assertThat(problem.path("parameter").asString()).isEqualTo("id");
    }

    private static JsonNode opticalDensity(JsonNode figures, String name) {
        for (JsonNode od : figures.path("opticalDensities")) {
            if (od.path("name").asString().equals(name)) {
                return od;
            }
        }
        throw new AssertionError("no " + name + " in " + figures);
    }

    private static String encode(String text) {
        return URLEncoder.encode(text, StandardCharsets.UTF_8);
    }

    private JsonNode figures(long sampleId, String query, int status) throws Exception {
        return getJson("/api/samples/" + sampleId + "/figures?x=1" + query, status);
    }

    private JsonNode angles(long sampleId, String query, int status) throws Exception {
        return getJson("/api/samples/" + sampleId + "/angles?" + query, status);
    }

    private long sampleId(String nameStart) throws Exception {
        JsonNode materials = getJson("/api/materials?q=" + encode(nameStart), 200);
        for (JsonNode m : materials) {
            if (m.path("name").asString().startsWith(nameStart)) {
                return m.path("samples").get(0).path("id").asLong();
            }
        }
        throw new AssertionError("demo library has no material named " + nameStart + "…");
    }

    private JsonNode getJson(String path, int expectedStatus) throws Exception {
        HttpResponse<String> response = HTTP.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + path))
                .GET().build(), HttpResponse.BodyHandlers.ofString());
        assertThat(response.statusCode()).as(path + " → " + response.body()).isEqualTo(expectedStatus);
        return JSON.readTree(response.body());
    }
}
