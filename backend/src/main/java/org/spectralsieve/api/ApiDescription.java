package org.spectralsieve.api;

import io.swagger.v3.oas.models.Components;
import io.swagger.v3.oas.models.OpenAPI;
import io.swagger.v3.oas.models.Operation;
import io.swagger.v3.oas.models.PathItem;
import io.swagger.v3.oas.models.info.Info;
import io.swagger.v3.oas.models.info.License;
import io.swagger.v3.oas.models.media.Content;
import io.swagger.v3.oas.models.media.IntegerSchema;
import io.swagger.v3.oas.models.media.MediaType;
import io.swagger.v3.oas.models.media.ObjectSchema;
import io.swagger.v3.oas.models.media.Schema;
import io.swagger.v3.oas.models.media.StringSchema;
import io.swagger.v3.oas.models.parameters.RequestBody;
import io.swagger.v3.oas.models.responses.ApiResponse;
import io.swagger.v3.oas.models.responses.ApiResponses;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.springdoc.core.customizers.OpenApiCustomizer;
import org.springdoc.core.utils.SpringDocUtils;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;
import tools.jackson.databind.JsonNode;

/**
 * The OpenAPI document of the HTTP API ({@code GET /api/openapi.json}, springdoc generating the operations
 * and parameters from the controllers). What springdoc cannot see is added here once, rather than as
 * annotations on every controller: every error leaves the API as an RFC 9457 problem detail
 * ({@code application/problem+json}, {@link ApiProblems}, the edge filters), so each operation gets the problem
 * responses that can reach it, with an example; and the JSON bodies read as trees get their shape and an
 * example. docs/api-description.md says what is described and how it is checked.
 */
@Configuration(proxyBeanMethods = false)
class ApiDescription {

    static {
        // a body read as a JSON tree (Jackson 3) is any JSON object, not the tree node's getters
        SpringDocUtils.getConfig().replaceWithSchema(JsonNode.class, new ObjectSchema());
    }

    static final String PROBLEM = "Problem";
    private static final String PROBLEM_JSON = "application/problem+json";
    private static final String PROBLEM_REF = "#/components/schemas/" + PROBLEM;

    /**
     * The problem types the API answers with (the last part of {@code type}), by status; ApiProblems,
     * ContainerProblems, RequestBudgetFilter and the access filters name them.
     */
    static final Map<String, List<String>> PROBLEM_TYPES = problemTypes();

    private static Map<String, List<String>> problemTypes() {
        Map<String, List<String>> types = new LinkedHashMap<>();
        types.put("400", List.of("bad-parameter", "bad-file", "bad-json", "bad-request", "requirement-syntax",
                "requirement-too-large", "layer-material", "curve-refused", "not-rescalable", "import-limit", "unsafe-path"));
        types.put("403", List.of("cross-site-write", "foreign-host"));
        types.put("404", List.of("not-found"));
        types.put("409", List.of("retired", "stored-record-unusable", "library-not-empty"));
        types.put("413", List.of("import-limit", "request-too-large"));
        types.put("422", List.of("not-at-angle"));
        types.put("429", List.of("imports-busy"));
        types.put("500", List.of("internal"));
        return types;
    }

    @Bean
    OpenAPI apiDescriptionInfo() {
        return new OpenAPI()
                .info(new Info().title("Spectral Sieve HTTP API").version("1")
                        .description("Search a library of UV and visible transmittance curves by requirement, import"
                                + " curves and reference spectra, read weighted figures. Every error is an RFC 9457"
                                + " problem detail (application/problem+json). Figures that bear on eye or skin safety"
                                + " are screening estimates from stored curves, not a certification.")
                        .license(new License().name("see the repository's LICENSE")))
                .components(new Components().addSchemas(PROBLEM, problemSchema()));
    }

    /** Adds the problem responses and the tree-shaped bodies' examples to every operation under /api. */
    @Bean
    OpenApiCustomizer problemResponses() {
        return openApi -> {
            if (openApi.getComponents() == null) {
                openApi.setComponents(new Components());
            }
            openApi.getComponents().addSchemas(PROBLEM, problemSchema());
            if (openApi.getPaths() == null) {
                return;
            }
            openApi.getPaths().forEach((path, item) -> item.readOperationsMap().forEach((method, operation) -> {
                addProblems(path, method, operation);
                describeBody(path, operation);
                describeDownload(path, operation);
            }));
        };
    }

    private static void addProblems(String path, PathItem.HttpMethod method, Operation operation) {
        if (operation.getResponses() == null) {
            operation.setResponses(new ApiResponses());
        }
        ApiResponses responses = operation.getResponses();
        boolean writes = method != PathItem.HttpMethod.GET && method != PathItem.HttpMethod.HEAD;
        problem(responses, "400", "Bad request: a parameter, body, file or requirement the API cannot use; says which"
                + " (parameter, file, line, field or position)", "bad-parameter", "Bad parameter",
                "parameter 'limit': must be a whole number from 1 to " + SearchController.MAX_LIMIT + ", got 0");
        problem(responses, "403", writes ? "Refused at the edge: a write sent by another site's page (cross-site-write)"
                + " or a foreign host name while listening on loopback (foreign-host)"
                : "Refused at the edge: a host name other than a loopback name while listening on loopback (foreign-host)",
                writes ? "cross-site-write" : "foreign-host", writes ? "Request from another site refused" : "Unknown host name",
                writes ? "the browser marked this POST as sent from another page (Sec-Fetch-Site: cross-site)"
                        : "this tool listens on the loopback interface only and answers to localhost, 127.0.0.1 or [::1]");
        if (path.contains("{")) {
            problem(responses, "404", "Nothing stored under that id or name", "not-found", "Not found",
                    "no sample with id 999");
        }
        if (writes) {
            problem(responses, "409", "Conflicts with what is stored: retired (restore it first), unusable stored"
                    + " record, library not empty", "retired", "Retired", "material 12 is retired; restore it first");
            problem(responses, "413", "Body or upload larger than the configured limit (the problem names the setting)",
                    "import-limit", "Upload too large", "the upload is larger than the 20971520 bytes allowed"
                            + " (sieve.imports.max-file-bytes)");
        }
        // light at an angle asked of a coated, laminated, diffuse or scattering sample (NotAtAngleException)
        if (path.matches("/api/samples/\\{[^}]+}/(figures|angles)")) {
            problem(responses, "422", "The sample has no figure at an angle (coated or laminated, diffuse or"
                    + " scattering); says why and names the parameter that asked for the angle", "not-at-angle",
                    "Not computed at an angle", "coated/laminated part: a coating's spectrum shifts with angle, which"
                            + " its normal-incidence curve cannot show; not computed for collimated light at 45° incidence");
        }
        // a state curve's import takes a turn from the same gate (RequestBudgetFilter)
        if (path.startsWith("/api/imports") || path.matches("/api/samples/\\{[^}]+}/states")) {
            problem(responses, "429", "Too many imports at once; try again shortly", "imports-busy",
                    "Too many imports at once", "another import is running");
        }
        problem(responses, "500", "A fault of the service, reported without internals", "internal", "Internal error",
                "the request could not be completed; the log has the details");
    }

    private static void problem(ApiResponses responses, String status, String description, String type, String title,
                                String detail) {
        Map<String, Object> example = new LinkedHashMap<>();
        example.put("type", "/problems/" + type);
        example.put("title", title);
        example.put("status", Integer.parseInt(status));
        example.put("detail", detail);
        example.put("instance", "/api/…");
        MediaType media = new MediaType().schema(new Schema<>().$ref(PROBLEM_REF)).example(example);
        ApiResponse response = responses.get(status);
        if (response == null) {
            response = new ApiResponse();
            responses.addApiResponse(status, response);
        }
        response.description(description + ". Problem types: " + String.join(", ", PROBLEM_TYPES.get(status)));
        response.setContent(new Content().addMediaType(PROBLEM_JSON, media));
    }

    /** The bodies read as JSON trees (requirement text or its structured form): their shape and an example. */
    private static void describeBody(String path, Operation operation) {
        Map<String, Object> example = switch (path) {
            case "/api/requirements/parse" -> Map.of("requirement", "passes over 80% at 365 nm and blocks under 1% at 405 nm");
            case "/api/search" -> Map.of("requirement", "passes over 80% at 365 nm, thickness 1 to 6 mm", "limit", 10);
            default -> null;
        };
        if (example == null) {
            return;
        }
        Schema<Object> body = new ObjectSchema()
                .addProperty("requirement", new Schema<>().description("the requirement as text (the requirement"
                        + " language, GET /api/requirements/guide) or in its structured form (as"
                        + " POST /api/requirements/parse answers)"))
                .description("a requirement, as text or structured");
        if (path.equals("/api/search")) {
            body.addProperty("limit", new IntegerSchema().minimum(java.math.BigDecimal.ONE)
                    .maximum(java.math.BigDecimal.valueOf(SearchController.MAX_LIMIT))
                    .description("how many rows, " + SearchController.DEFAULT_LIMIT + " when absent"));
        }
        body.setRequired(List.of("requirement"));
        operation.setRequestBody(new RequestBody().required(true).content(new Content().addMediaType(
                org.springframework.http.MediaType.APPLICATION_JSON_VALUE, new MediaType().schema(body).example(example))));
    }

    /**
     * The endpoints that answer a file, not JSON: springdoc sees only the Java type (bytes, a string, a
     * stream), so the media type they send is named here.
     */
    private static void describeDownload(String path, Operation operation) {
        String type = path.endsWith("/curve.csv") ? "text/csv"
                : path.endsWith("/curve.jdx") ? "chemical/x-jcamp-dx"
                : path.equals("/api/backup") ? "application/zip"
                : path.endsWith("/source-file") ? "application/octet-stream" : null;
        ApiResponse ok = operation.getResponses() == null ? null : operation.getResponses().get("200");
        if (type == null || ok == null) {
            return;
        }
        if (path.endsWith("/source-file")) {
            ok.description("the file as imported, byte for byte, under the media type it was stored with");
        }
        ok.setContent(new Content().addMediaType(type, new MediaType().schema(new StringSchema().format("binary"))));
    }

    /** RFC 9457 §3.1 members, plus the extension members the API adds (parameter, file, line, position, …). */
    private static Schema<Object> problemSchema() {
        Schema<Object> schema = new ObjectSchema()
                .addProperty("type", new StringSchema().description("/problems/<kind>: one of "
                        + String.join(", ", PROBLEM_TYPES.values().stream().flatMap(List::stream).distinct().toList())))
                .addProperty("title", new StringSchema().description("short summary of the kind of problem"))
                .addProperty("status", new IntegerSchema().description("the HTTP status code"))
                .addProperty("detail", new StringSchema().description("what went wrong and what to change"))
                .addProperty("instance", new StringSchema().description("the path of the request"))
                .addProperty("parameter", new StringSchema().description("bad-parameter: the parameter or body field"))
                .addProperty("file", new StringSchema().description("bad-file, import-limit: the file named"))
                .addProperty("line", new IntegerSchema().description("bad-file: the 1-based line, when known"))
                .addProperty("field", new StringSchema().description("bad-file: the field of the line"))
                .addProperty("position", new IntegerSchema().description("requirement-syntax: 0-based offset in the text"))
                .addProperty("length", new IntegerSchema().description("requirement-syntax: how many characters it spans"))
                .addProperty("expected", new Schema<>().description("requirement-syntax: what fits there"))
                .addProperty("suggestion", new StringSchema().description("requirement-syntax: the likeliest fix"))
                .addProperty("suggestions", new Schema<>().description("requirement-syntax: fixes to offer"))
                .addProperty("setting", new StringSchema().description("import-limit: the setting that sets the limit"))
                .addProperty("resource", new StringSchema().description("not-found, retired: what was looked for"))
                .addProperty("id", new Schema<>().description("not-found, retired: its id or name"));
        schema.setAdditionalProperties(Boolean.TRUE);
        schema.setDescription("An RFC 9457 problem detail; extension members depend on the type");
        schema.setRequired(List.of("type", "title", "status"));
        return schema;
    }
}
