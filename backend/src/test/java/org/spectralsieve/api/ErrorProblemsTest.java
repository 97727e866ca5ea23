package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** What the problem details of errors no controller raised say: the place of a JSON mistake, the container's reason. */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:error-problems-test;DB_CLOSE_DELAY=-1")
class ErrorProblemsTest {

    private static final JsonMapper JSON = JsonMapper.builder().build();

    @LocalServerPort
    int port;

    private JsonNode problem(RawHttp.Answer answer, int status) {
        assertThat(answer.status()).as(answer.body()).isEqualTo(status);
        assertThat(answer.header("Content-Type")).startsWith("application/problem+json");
        return JSON.readTree(answer.body());
    }

    @Test
    void malformedJsonNamesTheLineAndColumnWhereTheParserStopped() throws Exception {
        // line 3: `  "limit": }` — the value is missing where the '}' stands, column 12 (1-based)
        String body = "{\n  \"requirement\": \"passes over 80% at 365 nm\",\n  \"limit\": }";
        JsonNode p = problem(RawHttp.post(port, "/api/search", "application/json", body.getBytes(StandardCharsets.UTF_8)), 400);

        assertThat(p.path("line").asInt()).isEqualTo(3);
        assertThat(p.path("column").asInt()).isEqualTo(12);
        assertThat(p.path("detail").asString()).startsWith("line 3, column 12: ");
        assertThat(p.path("type").asString()).isEqualTo("/problems/bad-json");
    }

    @Test
    void emptyBodyIsAProblemNotAFailure() throws Exception {
        JsonNode p = problem(RawHttp.post(port, "/api/search", "application/json", new byte[0]), 400);

        assertThat(p.path("title").asString()).isNotBlank();
    }

    @Test
    void errorPathAskedForDirectlyIsNotFoundRatherThanAServerFailure() throws Exception {
        JsonNode p = problem(RawHttp.get(port, "/error"), 404);

        assertThat(p.path("type").asString()).isEqualTo("/problems/not-found");
    }

    @Test
    void encodedSlashRefusedByTheContainerIsAProblemWithoutServerDetails() throws Exception {
        RawHttp.Answer answer = RawHttp.get(port, "/api/samples/1%2F2/curve");
        JsonNode p = problem(answer, 400);

        assertThat(p.path("type").asString()).isEqualTo("/problems/bad-request");
        assertThat(answer.body()).doesNotContain("Tomcat").doesNotContain("<html");
    }

    @Test
    void tooLargeHeaderRefusedByTheContainerIsAProblem() throws Exception {
        problem(RawHttp.send(port, "GET /api/materials HTTP/1.1\nX-Filler: " + "b".repeat(20_000), null), 400);
    }

    @Test
    void oversizedJsonBodyIsRefusedByItsLengthBeforeBeingRead() throws Exception {
        byte[] body = ("{\"requirement\": \"" + "x".repeat(200_000) + "\"}").getBytes(StandardCharsets.UTF_8);
        JsonNode p = problem(RawHttp.post(port, "/api/search", "application/json", body), 413);

        assertThat(p.path("limit").asLong()).isEqualTo(RequestBudgetFilter.MAX_JSON_BYTES);
    }

    @Test
    void chunkedJsonBodyIsStoppedAtTheCapWhileBeingRead() throws Exception {
        String chunk = "x".repeat(8000);
        StringBuilder body = new StringBuilder();
        String opening = "{\"requirement\": \"";
        body.append(Integer.toHexString(opening.length())).append("\r\n").append(opening).append("\r\n");
        for (int i = 0; i < 20; i++) {
            body.append(Integer.toHexString(chunk.length())).append("\r\n").append(chunk).append("\r\n");
        }
        body.append("0\r\n\r\n");
        JsonNode p = problem(RawHttp.send(port, "POST /api/search HTTP/1.1\nContent-Type: application/json\n"
                + "Transfer-Encoding: chunked", body.toString().getBytes(StandardCharsets.US_ASCII)), 413);

        assertThat(p.path("limit").asLong()).isEqualTo(RequestBudgetFilter.MAX_JSON_BYTES);
    }
}
