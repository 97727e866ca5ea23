package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.beans.factory.annotation.Qualifier;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.core.MethodParameter;
import org.springframework.test.context.TestPropertySource;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.RequestMethod;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.method.HandlerMethod;
import org.springframework.web.servlet.mvc.method.RequestMappingInfo;
import org.springframework.web.servlet.mvc.method.annotation.RequestMappingHandlerMapping;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The OpenAPI document scripts read (GET /api/openapi.json) describes every endpoint the service answers
 * under /api: enumerated from Spring's own handler mapping, so a new controller method that the document
 * missed fails here. Its problem responses are RFC 9457 (application/problem+json).
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:api-description-test;DB_CLOSE_DELAY=-1")
class ApiDescriptionTest {

    private static final HttpClient HTTP = HttpClient.newHttpClient();
    private static final JsonMapper JSON = JsonMapper.builder().build();

    @LocalServerPort
    int port;

    @Autowired
    @Qualifier("requestMappingHandlerMapping")
    RequestMappingHandlerMapping mappings;

    private JsonNode document;

    @BeforeEach
    void readDocument() throws Exception {
        HttpResponse<String> response = get("/api/openapi.json", Map.of());
        assertThat(response.statusCode()).isEqualTo(200);
        Path saved = Path.of("target", "openapi.json");
        Files.createDirectories(saved.getParent());
        Files.writeString(saved, response.body()); // for review; not read by any test
        document = JSON.readTree(response.body());
    }

    @Test
    void everyControllerEndpointUnderApiIsDescribedWithItsParameters() {
        List<String> missing = new ArrayList<>();
        int endpoints = 0;
        for (Map.Entry<RequestMappingInfo, HandlerMethod> entry : mappings.getHandlerMethods().entrySet()) {
            HandlerMethod handler = entry.getValue();
            if (!handler.getBeanType().getPackageName().startsWith("org.spectralsieve")) {
                continue; // springdoc's own endpoint, which serves the document
            }
            for (String pattern : entry.getKey().getPatternValues()) {
                if (!pattern.startsWith("/api/")) {
                    continue;
                }
                String path = pattern.replaceAll("\\{(\\w+):[^}]*}", "{$1}"); // a regex variable is described by name
                for (RequestMethod method : entry.getKey().getMethodsCondition().getMethods()) {
                    endpoints++;
                    JsonNode operation = document.path("paths").path(path).path(method.name().toLowerCase(Locale.ROOT));
                    if (operation.isMissingNode()) {
                        missing.add(method + " " + path);
                        continue;
                    }
                    for (String parameter : parametersOf(handler)) {
                        if (!names(operation).contains(parameter)) {
                            missing.add(method + " " + path + " parameter " + parameter);
                        }
                    }
                }
            }
        }
        assertThat(endpoints).isGreaterThan(30);
        assertThat(missing).isEmpty();
    }

    @Test
    void everyOperationAnswersItsErrorsAsProblemDetails() {
        List<String> without = new ArrayList<>();
        document.path("paths").properties().forEach(path -> path.getValue().properties().forEach(op -> {
            JsonNode bad = op.getValue().path("responses").path("400").path("content").path("application/problem+json");
            JsonNode fault = op.getValue().path("responses").path("500").path("content").path("application/problem+json");
            if (bad.path("schema").path("$ref").asString("").isEmpty() || fault.isMissingNode()
                    || bad.path("example").path("type").asString("").isEmpty()) {
                without.add(op.getKey() + " " + path.getKey());
            }
        }));
        assertThat(without).isEmpty();
        JsonNode problem = document.path("components").path("schemas").path(ApiDescription.PROBLEM);
        assertThat(problem.path("properties").has("detail")).isTrue();
        assertThat(problem.path("properties").path("type").path("description").asString()).contains("requirement-syntax");
    }

    @Test
    void anEndpointWithAnIdCanAnswerNotFound() {
        JsonNode curve = document.path("paths").path("/api/samples/{id}/curve").path("get");
        assertThat(curve.path("responses").path("404").path("content").has("application/problem+json")).isTrue();
        assertThat(curve.path("parameters").toString()).contains("\"in\":\"path\"");
    }

    @Test
    void theRequirementBodiesCarryAnExampleThatTheServiceAccepts() throws Exception {
        JsonNode body = document.path("paths").path("/api/requirements/parse").path("post").path("requestBody")
                .path("content").path("application/json");
        String example = body.path("example").toString();
        assertThat(example).contains("passes over 80% at 365 nm");
        HttpResponse<String> parsed = HTTP.send(HttpRequest.newBuilder(URI.create(base() + "/api/requirements/parse"))
                .header("Content-Type", "application/json").POST(HttpRequest.BodyPublishers.ofString(example)).build(),
                HttpResponse.BodyHandlers.ofString());
        assertThat(parsed.statusCode()).isEqualTo(200);
    }

    @Test
    void downloadsAreDescribedWithTheMediaTypeTheySend() {
        assertThat(document.path("paths").path("/api/samples/{id}/curve.csv").path("get").path("responses").path("200")
                .path("content").has("text/csv")).isTrue();
        assertThat(document.path("paths").path("/api/samples/{id}/curve.jdx").path("get").path("responses").path("200")
                .path("content").has("chemical/x-jcamp-dx")).isTrue();
        assertThat(document.path("paths").path("/api/backup").path("get").path("responses").path("200")
                .path("content").has("application/zip")).isTrue();
    }

    /** GET is never a write, so the cross-site filter lets a page or a script on another origin read it. */
    @Test
    void theDocumentIsReadableWithTheHeadersABrowserSends() throws Exception {
        HttpResponse<String> response = get("/api/openapi.json", Map.of("Sec-Fetch-Site", "cross-site",
                "Origin", "http://elsewhere.example"));
        assertThat(response.statusCode()).isEqualTo(200);
        assertThat(response.headers().firstValue("Content-Type").orElse("")).startsWith("application/json");
    }

    /** The request-facing parameters: named path variables and query parameters. */
    private static List<String> parametersOf(HandlerMethod handler) {
        List<String> names = new ArrayList<>();
        for (MethodParameter parameter : handler.getMethodParameters()) {
            PathVariable path = parameter.getParameterAnnotation(PathVariable.class);
            RequestParam query = parameter.getParameterAnnotation(RequestParam.class);
            String name = path != null ? firstNonEmpty(path.value(), path.name())
                    : query != null ? firstNonEmpty(query.value(), query.name()) : null;
            if (path == null && query == null) {
                continue;
            }
            if (query != null && Map.class.isAssignableFrom(parameter.getParameterType())) {
                continue; // a map of every parameter has no single name to describe
            }
            names.add(name == null || name.isEmpty() ? parameter.getParameterName() : name);
        }
        return names;
    }

    private static String firstNonEmpty(String a, String b) {
        return a.isEmpty() ? b : a;
    }

    private static List<String> names(JsonNode operation) {
        List<String> names = new ArrayList<>();
        operation.path("parameters").forEach(p -> names.add(p.path("name").asString()));
        // a multipart form's request parameters are described as its body's properties
        operation.path("requestBody").path("content").properties().forEach(media ->
                media.getValue().path("schema").path("properties").propertyNames().forEach(names::add));
        return names;
    }

    private HttpResponse<String> get(String path, Map<String, String> headers) throws Exception {
        HttpRequest.Builder request = HttpRequest.newBuilder(URI.create(base() + path)).GET();
        headers.forEach(request::header);
        return HTTP.send(request.build(), HttpResponse.BodyHandlers.ofString());
    }

    private String base() {
        return "http://localhost:" + port;
    }
}
