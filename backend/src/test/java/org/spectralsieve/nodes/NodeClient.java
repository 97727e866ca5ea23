package org.spectralsieve.nodes;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.net.URLEncoder;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.function.Function;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The HTTP API of one application node, as a lab client calls it. Every request is built in
 * {@link #request(String)}, the one place a login or token for a server in server mode is added.
 */
final class NodeClient {

    static final JsonMapper JSON = JsonMapper.builder().build();
    private static final String BOUNDARY = "----node-test-boundary-7e4a";

    private final String name;
    private final Function<String, HttpRequest.Builder> requests;
    private final HttpClient http = HttpClient.newBuilder().version(HttpClient.Version.HTTP_1_1)
            .connectTimeout(Duration.ofSeconds(5)).build();

    /**
     * @param name    how failures name the node ("node 1")
     * @param requests a request to the node for a path, signed with the node's API token
     */
    NodeClient(String name, Function<String, HttpRequest.Builder> requests) {
        this.name = name;
        this.requests = requests;
    }

    String name() {
        return name;
    }

    /** Every request to the node starts here. */
    private HttpRequest.Builder request(String path) {
        return requests.apply(path).timeout(Duration.ofSeconds(120));
    }

    /** One curve as a new material through {@code POST /api/imports}; the answer names sampleId and materialId. */
    JsonNode importNewMaterial(String materialName, String materialClass, double thicknessMm, String fileName, String csv) {
        Map<String, String> fields = new LinkedHashMap<>();
        fields.put("materialName", materialName);
        fields.put("materialClass", materialClass);
        fields.put("scaling", "bulk");
        fields.put("thicknessMm", String.valueOf(thicknessMm));
        fields.put("yKind", "fraction");
        return multipart("/api/imports", fields, fileName, csv);
    }

    /** One more sample of a stored material through {@code POST /api/imports}. */
    JsonNode importSampleOf(long materialId, double thicknessMm, String fileName, String csv) {
        Map<String, String> fields = new LinkedHashMap<>();
        fields.put("materialId", String.valueOf(materialId));
        fields.put("thicknessMm", String.valueOf(thicknessMm));
        fields.put("yKind", "fraction");
        return multipart("/api/imports", fields, fileName, csv);
    }

    JsonNode search(String requirement, int limit) {
        return postJson("/api/search", Map.of("requirement", requirement, "limit", limit));
    }

    JsonNode library(String words, int limit) {
        return get("/api/library?q=" + URLEncoder.encode(words, StandardCharsets.UTF_8) + "&limit=" + limit);
    }

    /** {@code kinds} is "samples" or "materials". */
    JsonNode retire(String kinds, long id) {
        return send(request("/api/" + kinds + "/" + id + "/retire").POST(HttpRequest.BodyPublishers.noBody()),
                "POST retire " + kinds + " " + id);
    }

    JsonNode correctSample(long sampleId, Map<String, Object> values) {
        return postJson("/api/samples/" + sampleId + "/revisions", values);
    }

    JsonNode get(String path) {
        return send(request(path).GET(), "GET " + path);
    }

    private JsonNode postJson(String path, Map<String, ?> body) {
        return send(request(path).header("Content-Type", "application/json")
                .POST(HttpRequest.BodyPublishers.ofString(JSON.writeValueAsString(body))), "POST " + path);
    }

    private JsonNode multipart(String path, Map<String, String> fields, String fileName, String content) {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        fields.forEach((k, v) -> out.writeBytes(("--" + BOUNDARY + "\r\nContent-Disposition: form-data; name=\"" + k
                + "\"\r\n\r\n" + v + "\r\n").getBytes(StandardCharsets.UTF_8)));
        out.writeBytes(("--" + BOUNDARY + "\r\nContent-Disposition: form-data; name=\"file\"; filename=\"" + fileName
                + "\"\r\nContent-Type: text/csv\r\n\r\n" + content + "\r\n--" + BOUNDARY + "--\r\n")
                .getBytes(StandardCharsets.UTF_8));
        return send(request(path).header("Content-Type", "multipart/form-data; boundary=" + BOUNDARY)
                .POST(HttpRequest.BodyPublishers.ofByteArray(out.toByteArray())), "POST " + path + " " + fileName);
    }

    /** The JSON answer of a 2xx; anything else fails the test with the node's answer. */
    private JsonNode send(HttpRequest.Builder builder, String what) {
        HttpResponse<String> response;
        try {
            response = http.send(builder.build(), HttpResponse.BodyHandlers.ofString());
        } catch (IOException e) {
            throw new UncheckedIOException(name + ": " + what + " got no answer", e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException(name + ": " + what + " interrupted", e);
        }
        if (response.statusCode() / 100 != 2) {
            throw new IllegalStateException(name + ": " + what + " answered " + response.statusCode() + ": " + response.body());
        }
        return JSON.readTree(response.body());
    }
}
