package org.spectralsieve.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
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
 * The {@code similar} command on the illustrative demo library: the same hits as the HTTP API, in a table, and
 * a usage error or a failure naming what was wrong.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=" + SimilarCommandTest.DB_URL)
class SimilarCommandTest {

    static final String DB_URL = "jdbc:h2:mem:similar-command-test;DB_CLOSE_DELAY=-1";
    private static final HttpClient HTTP = HttpClient.newHttpClient();
    private static final JsonMapper JSON = JsonMapper.builder().build();

    @LocalServerPort
    int port;

    @Autowired
    JooqLibraryRepository library;

    private static CliRun cli(String... args) {
        return CliRun.against(DB_URL, args);
    }

    @Test
    void theTableListsTheApisHitsInTheApisOrder() throws Exception {
        long query = firstSampleOf("bronze-tint-float-glass");
        JsonNode api = getJson("/api/samples/" + query + "/similar?limit=5&metric=correlation");

        CliRun run = cli("similar", "--sample", String.valueOf(query), "--limit", "5", "--metric", "correlation");

        assertThat(run.exitCode()).as(run.err()).isZero();
        List<String> lines = run.out().lines().toList();
        assertThat(lines.get(0)).isEqualTo("metric: correlation");
        assertThat(lines.get(1)).contains("material", "name", "sample", "distance", "points", "resolved",
                "differing most", "matches at mm");
        List<String> rows = lines.subList(2, lines.size());
        assertThat(rows).hasSize(5);
        for (int i = 0; i < rows.size(); i++) {
            JsonNode hit = api.path("hits").get(i);
            List<String> cells = Arrays.asList(rows.get(i).trim().split("\\s{2,}"));
            assertThat(cells.get(0)).isEqualTo(String.valueOf(hit.path("materialId").asLong()));
            assertThat(cells.get(1)).isEqualTo(hit.path("materialName").asString());
            assertThat(cells.get(3)).isEqualTo(String.valueOf(hit.path("sampleId").asLong()));
            assertThat(Double.parseDouble(cells.get(5))).isCloseTo(hit.path("distance").asDouble(),
                    org.assertj.core.api.Assertions.within(5e-5));
        }
    }

    @Test
    void aBadMetricIsAUsageErrorAndAnUnknownSampleAFailureNamingIt() {
        CliRun badMetric = cli("similar", "--sample", "1", "--metric", "cosine");
        assertThat(badMetric.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(badMetric.err()).contains("--metric", "centred-euclidean");

        CliRun badLimit = cli("similar", "--sample", "1", "--limit", "51");
        assertThat(badLimit.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(badLimit.err()).contains("--limit");

        CliRun unknown = cli("similar", "--sample", "987654");
        assertThat(unknown.exitCode()).isEqualTo(SieveCli.FAILED);
        assertThat(unknown.err()).contains("987654");
        assertThat(unknown.out()).isEmpty();
    }

    @Test
    void similarIsACommandLineEntryWord() {
        assertThat(SieveCli.handles(new String[] {"similar", "--sample", "1"})).isTrue();
    }

    /**
     * The 4 mm bronze-tint sample (invented, illustrative; n = 1.52 in the demo catalogue) taken to 5 mm by the
     * project's rescaler — Fresnel surfaces off, Beer–Lambert (absorbance proportional to the path, any optics
     * handbook), surfaces on — and written out as a curve file: a piece of the stock the library does not hold.
     */
    private Path offcutAtFiveMillimetres(Path dir) throws Exception {
        Curve stored = library.findCurve(firstSampleOf("bronze-tint-float-glass")).orElseThrow();
        Curve rescaled = ThicknessRescaler.rescale(stored, 4, 5, new ConstantIndex(1.52));
        boolean[] bounds = new boolean[rescaled.size()];
        for (int i = 0; i < bounds.length; i++) {
            bounds[i] = rescaled.belowDetection(i);
        }
        Path file = dir.resolve("offcut-5mm.csv");
        Files.writeString(file, DelimitedTextWriter.write(Map.of("detection_limit", "0.001"), rescaled.wavelengthsNm(),
                rescaled.transmittances(), bounds));
        return file;
    }

    private static List<List<String>> rows(String out) {
        List<List<String>> rows = new ArrayList<>();
        for (String line : out.lines().skip(2).toList()) {
            if (line.startsWith("requirement:") || line.startsWith("note:")) {
                break;
            }
            rows.add(Arrays.asList(line.trim().split("\\s{2,}")));
        }
        return rows;
    }

    @Test
    void anUnsavedFileFindsTheStockItWasCutFromAtTheThicknessItWasCut(@TempDir Path dir) throws Exception {
        Path file = offcutAtFiveMillimetres(dir);
        String stock = String.valueOf(materialId("bronze-tint-float-glass"));

        CliRun run = cli("similar", "--file", file.toString(), "--thickness", "5", "--limit", "5");

        assertThat(run.exitCode()).as(run.err()).isZero();
        assertThat(run.out().lines().findFirst().orElseThrow()).isEqualTo("metric: centred-euclidean");
        List<List<String>> rows = rows(run.out());
        assertThat(rows).hasSize(5);
        for (List<String> row : rows.subList(0, 2)) {
            assertThat(row.get(0)).isEqualTo(stock);
            // Beer–Lambert: both stored thicknesses match the piece best at 5 mm (2 %, the core's check)
            assertThat(Double.parseDouble(row.get(9))).isCloseTo(5.0, org.assertj.core.api.Assertions.within(0.1));
        }
        assertThat(run.out()).doesNotContain("note:");

        CliRun asMeasured = cli("similar", "--file", file.toString(), "--limit", "1");
        assertThat(asMeasured.exitCode()).as(asMeasured.err()).isZero();
        assertThat(asMeasured.out()).startsWith("metric: correlation"); // no thickness: compared as measured
        assertThat(rows(asMeasured.out()).get(0).get(0)).isEqualTo(stock);
    }

    @Test
    void aBandGivesTheApisHitsAndIsNamedOnTheFirstLine() throws Exception {
        long query = firstSampleOf("bronze-tint-float-glass");
        JsonNode api = getJson("/api/samples/" + query + "/similar?limit=5&band=300-400");

        CliRun run = cli("similar", "--sample", String.valueOf(query), "--limit", "5", "--band", "300-400");

        assertThat(run.exitCode()).as(run.err()).isZero();
        assertThat(run.out().lines().findFirst().orElseThrow()).isEqualTo("metric: centred-euclidean, band: 300–400 nm");
        List<List<String>> rows = rows(run.out());
        assertThat(rows).hasSize(5);
        for (int i = 0; i < rows.size(); i++) {
            assertThat(rows.get(i).get(3)).isEqualTo(String.valueOf(api.path("hits").get(i).path("sampleId").asLong()));
        }
    }

    @Test
    void aRequirementKeepsOnlyOtherMaterialsAndSaysHowManyMetIt() throws Exception {
        long query = firstSampleOf("bronze-tint-float-glass");
        String stock = String.valueOf(materialId("bronze-tint-float-glass"));

        CliRun run = cli("similar", "--sample", String.valueOf(query), "--limit", "3", "--requirement",
                "passes over 70% from 400 to 450 nm");

        assertThat(run.exitCode()).as(run.err()).isZero();
        List<List<String>> rows = rows(run.out());
        assertThat(rows).hasSize(3);
        rows.forEach(row -> assertThat(row.get(0)).isNotEqualTo(stock));
        assertThat(run.out()).containsPattern("requirement: \\d+ of the \\d+ nearest curves belong to a material that"
                + " meets 'passes over 70% from 400 to 450 nm'");
    }

    @Test
    void wordsBesideTheRequirementKeepExactlyTheSubstitutesWhoseMaterialTheWordsAdmit() throws Exception {
        String query = String.valueOf(firstSampleOf("bronze-tint-float-glass"));
        String requirement = "passes over 70% from 400 to 450 nm";
        CliRun plain = cli("similar", "--sample", query, "--limit", "50", "--requirement", requirement);
        assertThat(plain.exitCode()).as(plain.err()).isZero();
        assertThat(plain.out()).as("without words nothing is said about words").doesNotContain("its words admit");

        CliRun worded = cli("similar", "--sample", query, "--limit", "50", "--requirement", "acrylic " + requirement);

        assertThat(worded.exitCode()).as(worded.err()).isZero();
        JsonNode library = getJson("/api/library?limit=200&q=acrylic");
        List<String> admitted = library.path("hits").valueStream().map(h -> String.valueOf(h.path("materialId").asLong()))
                .toList();
        List<List<String>> expected = rows(plain.out()).stream().filter(row -> admitted.contains(row.get(0))).toList();
        assertThat(expected).as("the words must leave some substitutes out and keep some").isNotEmpty()
                .hasSizeLessThan(rows(plain.out()).size());
        assertThat(rows(worded.out())).isEqualTo(expected);
        assertThat(worded.out()).contains("requirement: " + expected.size() + " of the ", " nearest curves belong to a"
                + " material that meets 'acrylic " + requirement + "', among the " + library.path("total").asLong()
                + " materials its words admit");
    }

    @Test
    void wordsThatAdmitNoMaterialLeaveAnEmptyTableNotAnError() {
        CliRun run = cli("similar", "--sample", String.valueOf(firstSampleOfUnchecked("bronze-tint-float-glass")),
                "--requirement", "unobtainium passes over 70% from 400 to 450 nm");
        assertThat(run.exitCode()).as(run.err()).isZero();
        assertThat(rows(run.out())).isEmpty();
        assertThat(run.out()).containsPattern("requirement: 0 of the \\d+ nearest curves belong to a material that meets"
                + " 'unobtainium passes over 70% from 400 to 450 nm', among no material: its words admit none of the library");
    }

    @Test
    void aCurveAtItsDetectionFloorCarriesTheWarning() {
        CliRun run = cli("similar", "--sample", String.valueOf(firstSampleOfUnchecked("black-stencil-film")));
        assertThat(run.exitCode()).as(run.err()).isZero();
        assertThat(run.out()).contains("note: most of this curve is at the detection limit");
    }

    @Test
    void aQuestionThatCannotBeAskedIsAUsageErrorNamingTheOption(@TempDir Path dir) throws Exception {
        Path file = offcutAtFiveMillimetres(dir);
        CliRun both = cli("similar", "--sample", "1", "--file", file.toString());
        assertThat(both.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(both.err()).contains("--sample", "--file");
        assertThat(cli("similar").exitCode()).isEqualTo(SieveCli.USAGE);
        CliRun band = cli("similar", "--sample", "1", "--band", "150-300");
        assertThat(band.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(band.err()).contains("--band", "200–700 nm");
        CliRun thickness = cli("similar", "--sample", "1", "--thickness", "3");
        assertThat(thickness.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(thickness.err()).contains("--thickness");
        CliRun metric = cli("similar", "--file", file.toString(), "--metric", "centred-euclidean");
        assertThat(metric.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(metric.err()).contains("--metric", "--thickness");
        CliRun requirement = cli("similar", "--sample", "1", "--requirement", "passes over");
        assertThat(requirement.exitCode()).isEqualTo(SieveCli.USAGE);
        CliRun missing = cli("similar", "--file", dir.resolve("absent.csv").toString());
        assertThat(missing.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(missing.err()).contains("--file");
    }

    private long materialId(String slug) throws Exception {
        for (JsonNode m : getJson("/api/materials")) {
            if (m.path("slug").asString().equals(slug)) {
                return m.path("id").asLong();
            }
        }
        throw new AssertionError("the demo library has no " + slug);
    }

    private long firstSampleOfUnchecked(String slug) {
        try {
            return firstSampleOf(slug);
        } catch (Exception e) {
            throw new AssertionError(e);
        }
    }

    private long firstSampleOf(String slug) throws Exception {
        for (JsonNode m : getJson("/api/materials")) {
            if (m.path("slug").asString().equals(slug)) {
                return m.path("samples").get(0).path("id").asLong();
            }
        }
        throw new AssertionError("the demo library has no " + slug);
    }

    private JsonNode getJson(String path) throws Exception {
        HttpResponse<String> response = HTTP.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + path))
                .GET().build(), HttpResponse.BodyHandlers.ofString());
        assertThat(response.statusCode()).as(path + " -> " + response.body()).isEqualTo(200);
        return JSON.readTree(response.body());
    }
}
