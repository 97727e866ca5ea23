package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.URI;
import java.net.URLEncoder;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * {@code GET /api/library} over the illustrative demo library, through a real server. The exact hits and
 * counts of a hand-made corpus are LibraryTextSearchTest's; here the index's facet counts are checked
 * against the database's own listing ({@code /api/materials?class=}), and every bad parameter is a problem
 * naming it.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:library-search-api-test;DB_CLOSE_DELAY=-1")
class LibrarySearchApiTest {

    private static final HttpClient HTTP = HttpClient.newHttpClient();
    private static final JsonMapper JSON = JsonMapper.builder().build();

    @LocalServerPort
    int port;

    @Test
    void aHalfTypedWordRanksEveryMaterialNamedWithItFirst() throws Exception {
        List<String> named = new ArrayList<>();
        for (JsonNode m : getJson("/api/materials", 200)) {
            if (m.path("name").asString().toLowerCase().contains("acrylic")) {
                named.add(m.path("name").asString());
            }
        }
        assertThat(named).hasSizeGreaterThanOrEqualTo(5); // the demo shelf holds several acrylics

        JsonNode answer = getJson("/api/library?q=acryl&limit=200", 200);
        List<String> top = new ArrayList<>();
        answer.path("hits").forEach(h -> top.add(h.path("name").asString()));
        assertThat(top.subList(0, named.size())).containsExactlyInAnyOrderElementsOf(named);
        JsonNode first = answer.path("hits").get(0);
        assertThat(first.path("materialId").asLong()).isPositive();
        assertThat(first.path("samples").size()).isPositive();
        assertThat(first.path("score").asDouble()).isPositive();
    }

    @Test
    void classCountsAgreeWithTheDatabaseListing() throws Exception {
        JsonNode all = getJson("/api/library", 200);
        long sum = 0;
        for (JsonNode c : all.path("facets").path("class")) {
            String label = c.path("value").asString();
            int listed = getJson("/api/materials?class=" + encode(label), 200).size();
            assertThat(c.path("count").asLong()).as(label).isEqualTo(listed);
            sum += c.path("count").asLong();
        }
        assertThat(sum).isEqualTo(getJson("/api/materials", 200).size()).isEqualTo(all.path("total").asLong());
        assertThat(all.path("hits").size()).isEqualTo(20); // the default limit
    }

    @Test
    void choosingAClassKeepsTheOtherClassesCounted() throws Exception {
        Map<String, Long> before = counts(getJson("/api/library", 200), "class");
        JsonNode films = getJson("/api/library?class=film&limit=200", 200);

        assertThat(films.path("total").asLong()).isEqualTo(before.get("film"));
        films.path("hits").forEach(h -> assertThat(h.path("materialClass").asString()).isEqualTo("film"));
        assertThat(counts(films, "class")).isEqualTo(before);

        JsonNode either = getJson("/api/library?class=film&class=" + encode("plastic sheet") + "&limit=200", 200);
        assertThat(either.path("total").asLong()).isEqualTo(before.get("film") + before.get("plastic sheet"));
    }

    @Test
    void everyBadParameterIsAProblemNamingIt() throws Exception {
        assertThat(problemParameter("/api/library?limit=0")).isEqualTo("limit");
        assertThat(problemParameter("/api/library?limit=201")).isEqualTo("limit");
        assertThat(problemParameter("/api/library?limit=ten")).isEqualTo("limit");
        assertThat(problemParameter("/api/library?geometry=diffuse")).isEqualTo("geometry");
        assertThat(problemParameter("/api/library?provenance=guessed")).isEqualTo("provenance");
        assertThat(problemParameter("/api/library?thickness=thin")).isEqualTo("thickness");
        assertThat(problemParameter("/api/library?class=" + encode("Glass!"))).isEqualTo("class");
        assertThat(problemParameter("/api/library?q=" + "a".repeat(201))).isEqualTo("q");
        assertThat(problemParameter("/api/library?class=film" + "&class=x".repeat(21))).isEqualTo("class");
        assertThat(problemParameter("/api/library?edge=violet")).isEqualTo("edge");
        assertThat(problemParameter("/api/library?luminous=" + encode("90 %"))).isEqualTo("luminous");
        assertThat(problemParameter("/api/library?at365=opaque")).isEqualTo("at365");
    }

    @Test
    void spectralFacetsSortTheDemoShelfAsTheTradeExpects() throws Exception {
        // quartz and fused silica sleeves pass about 95 % at 254 nm; soda-lime float glass has a strong cut-off
        // below about 340 nm (../shared/PRACTICE.md §2, [S32] [S27]); the demo curves are modelled on those
        List<String> at254 = names(getJson("/api/library?at254=passes&limit=200", 200));
        assertThat(at254).contains("UV-grade synthetic fused silica windows")
                .doesNotContain("Clear float glass, glazier offcuts");
        // polycarbonate does not block 405 nm, and a UV-stabilised sheet stops 365 nm (PRACTICE.md §7 #2, [S14] [S29])
        assertThat(names(getJson("/api/library?q=polycarbonate&at405=passes&at365=blocks&limit=200", 200)))
                .contains("Clear polycarbonate sheet, UV-stabilised");
        assertThat(names(getJson("/api/library?q=polycarbonate&at405=blocks&limit=200", 200)))
                .doesNotContain("Clear polycarbonate sheet, UV-stabilised", "Clear polycarbonate sheet, food-contact grade");
    }

    @Test
    void eachSpectralValuesCountIsTheTotalItsChoiceGives() throws Exception {
        JsonNode all = getJson("/api/library", 200);
        for (String dimension : List.of("edge", "luminous", "at254", "at365", "at405")) {
            Map<String, Long> counts = counts(all, dimension);
            assertThat(counts).as(dimension).isNotEmpty();
            for (Map.Entry<String, Long> value : counts.entrySet()) {
                JsonNode chosen = getJson("/api/library?" + dimension + "=" + encode(value.getKey()), 200);
                assertThat(chosen.path("total").asLong()).as(dimension + "=" + value.getKey()).isEqualTo(value.getValue());
                assertThat(counts(chosen, dimension)).as("sideways").isEqualTo(counts);
            }
        }
    }

    private static List<String> names(JsonNode answer) {
        List<String> out = new ArrayList<>();
        answer.path("hits").forEach(h -> out.add(h.path("name").asString()));
        return out;
    }

    private String problemParameter(String path) throws Exception {
        return getJson(path, 400).path("parameter").asString();
    }

    private static Map<String, Long> counts(JsonNode answer, String dimension) {
        Map<String, Long> out = new HashMap<>();
        answer.path("facets").path(dimension).forEach(c -> out.put(c.path("value").asString(), c.path("count").asLong()));
        return out;
    }

    private static String encode(String s) {
        return URLEncoder.encode(s, StandardCharsets.UTF_8).replace("+", "%20");
    }

    private JsonNode getJson(String path, int expectedStatus) throws Exception {
        HttpResponse<String> response = HTTP.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + path))
                .GET().build(), HttpResponse.BodyHandlers.ofString());
        assertThat(response.statusCode()).as(path + " -> " + response.body()).isEqualTo(expectedStatus);
        if (expectedStatus >= 400) {
            assertThat(response.headers().firstValue("Content-Type").orElse("")).startsWith("application/problem+json");
        }
        return JSON.readTree(response.body());
    }
}
