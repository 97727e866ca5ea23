package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;
import static org.spectralsieve.api.SearchApiCalls.body;

import java.net.URLEncoder;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Requirement search with words about the stock ({@code POST /api/search}) over the illustrative demo
 * library, through a real server. The rule checked: the rows are exactly the rows of the clauses alone,
 * kept for the materials the words admit ({@code GET /api/library?q=} lists those), in the same order.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:worded-search-api-test;DB_CLOSE_DELAY=-1")
class WordedSearchApiTest {

    private static final JsonMapper JSON = SearchApiCalls.JSON;
    private static final int ALL = 500;

    @LocalServerPort
    int port;

    private SearchApiCalls api;

    @BeforeEach
    void callsThisServer() {
        api = new SearchApiCalls(port);
    }

    @Test
    void wordsKeepTheClausesRowsForTheMaterialsTheyAdmitInTheSameOrder() throws Exception {
        JsonNode worded = api.search("acrylic passes over 80% at 400 nm", ALL);
        Set<Long> admitted = admitted("acrylic");

        assertThat(admitted).hasSizeGreaterThanOrEqualTo(5); // the demo shelf holds several acrylics
        assertThat(worded.path("words").path("text").asString()).isEqualTo("acrylic");
        assertThat(worded.path("words").path("admitted").asInt()).isEqualTo(admitted.size());
        assertThat(worded.path("requirement").path("text").asString()).isEqualTo("passes over 80% at 400 nm");
        List<String> expected = rows(api.search("passes over 80% at 400 nm", ALL), admitted);
        assertThat(rows(worded, null)).isNotEmpty().isEqualTo(expected);
        assertThat(rows(worded, null)).anyMatch(r -> r.startsWith("Clear cast acrylic sheet, general stock"));
    }

    @Test
    void wordsKeepTheLightTheRequirementStates() throws Exception {
        JsonNode worded = api.search("acrylic passes over 80% at 400 nm, under an LED with 120° beam angle", ALL);

        assertThat(worded.path("assumedLight").asString()).contains("LED with 120° beam angle");
        assertThat(worded.path("requirement").path("light").path("kind").asString()).isEqualTo("led");
        // the admitted materials' rows are those the same requirement gives on the whole library, light and all
        Set<Long> admitted = admitted("acrylic");
        assertThat(rows(worded, null)).isEqualTo(rows(api.search("passes over 80% at 400 nm, under an LED with 120° beam"
                + " angle", ALL), admitted));
        assertThat(values(worded)).isNotEqualTo(values(api.search("acrylic passes over 80% at 400 nm", ALL)));
    }

    /** Each row's first clause value: the figures themselves, which the light changes. */
    private static List<Double> values(JsonNode answer) {
        List<Double> out = new ArrayList<>();
        for (JsonNode row : answer.path("results")) {
            out.add(row.path("clauses").get(0).path("value").asDouble());
        }
        return out;
    }

    @Test
    void aHalfTypedWordAdmitsWhatItBegins() throws Exception {
        JsonNode worded = api.search("acryl passes over 80% at 400 nm", ALL);
        Set<Long> admitted = admitted("acryl");

        assertThat(worded.path("words").path("admitted").asInt()).isEqualTo(admitted.size()).isPositive();
        assertThat(rows(worded, null)).isEqualTo(rows(api.search("passes over 80% at 400 nm", ALL), admitted));
    }

    @Test
    void aClassTermNarrowsTheWordsToo() throws Exception {
        JsonNode worded = api.search("clear class film and blocks under 1% at 405 nm", ALL);
        Set<Long> admitted = admitted("clear&class=film");

        assertThat(worded.path("words").path("admitted").asInt()).isEqualTo(admitted.size()).isPositive();
        assertThat(rows(worded, null)).isEqualTo(rows(api.search("blocks under 1% at 405 nm, class film", ALL), admitted));
    }

    @Test
    void aRequirementWithoutWordsAnswersAsBeforeWithNoWordsInIt() throws Exception {
        JsonNode plain = api.search("class film and blocks under 1% at 405 nm", ALL);

        assertThat(plain.has("words")).isFalse();
        assertThat(rows(plain, null)).isEqualTo(rows(api.search("blocks under 1% at 405 nm, class film", ALL), null));
    }

    @Test
    void aProvenanceTermIsTheLibrarysProvenanceFacet() throws Exception {
        // every demo sample is modelled, so the term admits the whole library and changes no row
        JsonNode worded = api.search("passes over 80% at 400 nm and provenance modelled", ALL);

        assertThat(worded.path("words").path("admitted").asLong())
                .isEqualTo(api.get("/api/library?provenance=modelled").path("total").asLong());
        assertThat(worded.path("words").path("provenance").get(0).asString()).isEqualTo("modelled");
        assertThat(rows(worded, null)).isEqualTo(rows(api.search("passes over 80% at 400 nm", ALL), null));
        assertThat(api.search("passes over 80% at 400 nm and provenance measured", ALL).path("words").path("admitted").asInt())
                .isZero();
    }

    @Test
    void wordsThatAdmitNothingGiveAnEmptyShortlistThatSaysSo() throws Exception {
        JsonNode none = api.search("quartzite passes over 80% at 400 nm", 20);

        assertThat(none.path("words").path("admitted").asInt()).isZero();
        assertThat(none.path("results").size()).isZero();
        assertThat(none.path("evaluatedSamples").asInt()).isZero();
    }

    @Test
    void anUnknownProvenanceIsAProblemNamingTheTerm() throws Exception {
        String text = "acrylic provenance guessed and passes over 80% at 400 nm";
        HttpResponse<String> response = api.send("/api/search", body(text, 5));
        JsonNode problem = JSON.readTree(response.body());

        assertThat(response.statusCode()).isEqualTo(400);
        assertThat(problem.path("position").asInt()).isEqualTo(text.indexOf("guessed"));
        assertThat(problem.path("detail").asString()).contains("provenance").contains("guessed").contains("measured");
    }

    @Test
    void aSlipInTheFirstKeywordIsStillCaughtAfterWords() throws Exception {
        String text = "acrylic pases over 80% at 400 nm";
        HttpResponse<String> response = api.send("/api/search", body(text, 5));
        JsonNode problem = JSON.readTree(response.body());

        assertThat(response.statusCode()).as(response.body()).isEqualTo(400);
        assertThat(problem.path("position").asInt()).isEqualTo(text.indexOf("pases"));
        assertThat(problem.path("suggestion").asString()).isEqualTo("passes");
    }

    @Test
    void theParseAnswerShowsTheWordsBesideTheClauses() throws Exception {
        JsonNode parsed = api.post("/api/requirements/parse", body("clear acrylic passes over 80% at 400 nm", 1));

        assertThat(parsed.path("words").path("text").asString()).isEqualTo("clear acrylic");
        assertThat(parsed.path("clauses").size()).isEqualTo(1);
    }

    /** The ids of every material /api/library admits for the words (and facet parameters after an "&"). */
    private Set<Long> admitted(String query) throws Exception {
        String[] parts = query.split("&", 2);
        JsonNode answer = api.get("/api/library?limit=200&q=" + URLEncoder.encode(parts[0], StandardCharsets.UTF_8)
                + (parts.length > 1 ? "&" + parts[1] : ""));
        assertThat(answer.path("total").asLong()).isLessThanOrEqualTo(200);
        Set<Long> ids = new HashSet<>();
        answer.path("hits").forEach(h -> ids.add(h.path("materialId").asLong()));
        return ids;
    }

    /** The rows as "material name | sample | verdict", kept to the materials in {@code within} (all when null). */
    private static List<String> rows(JsonNode answer, Set<Long> within) {
        List<String> out = new ArrayList<>();
        for (JsonNode row : answer.path("results")) {
            if (within == null || within.contains(row.path("materialId").asLong())) {
                out.add(row.path("materialName").asString() + " | " + row.path("sampleId").asLong() + " | "
                        + row.path("verdict").asString());
            }
        }
        return out;
    }
}
