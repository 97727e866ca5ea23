package org.spectralsieve.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;
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

    private record Run(int exitCode, String out, String err) {
    }

    private static Run cli(String... args) {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        List<String> all = new ArrayList<>(Arrays.asList(args));
        all.add("--db-url");
        all.add(DB_URL);
        int code = SieveCli.run(all.toArray(String[]::new), new PrintStream(out, true, StandardCharsets.UTF_8),
                new PrintStream(err, true, StandardCharsets.UTF_8));
        return new Run(code, out.toString(StandardCharsets.UTF_8), err.toString(StandardCharsets.UTF_8));
    }

    @Test
    void theTableListsTheApisHitsInTheApisOrder() throws Exception {
        long query = firstSampleOf("bronze-tint-float-glass");
        JsonNode api = getJson("/api/samples/" + query + "/similar?limit=5&metric=correlation");

        Run run = cli("similar", "--sample", String.valueOf(query), "--limit", "5", "--metric", "correlation");

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
        Run badMetric = cli("similar", "--sample", "1", "--metric", "cosine");
        assertThat(badMetric.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(badMetric.err()).contains("--metric", "centred-euclidean");

        Run badLimit = cli("similar", "--sample", "1", "--limit", "51");
        assertThat(badLimit.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(badLimit.err()).contains("--limit");

        Run unknown = cli("similar", "--sample", "987654");
        assertThat(unknown.exitCode()).isEqualTo(SieveCli.FAILED);
        assertThat(unknown.err()).contains("987654");
        assertThat(unknown.out()).isEmpty();
    }

    @Test
    void similarIsACommandLineEntryWord() {
        assertThat(SieveCli.handles(new String[] {"similar", "--sample", "1"})).isTrue();
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
