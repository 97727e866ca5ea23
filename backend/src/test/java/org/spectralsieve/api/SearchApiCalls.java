package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ObjectNode;

/**
 * The HTTP calls the search API tests make against the running test server: a search, a JSON POST or GET that
 * must answer 200 (else the failure shows the answer), or the raw answer when a test checks a refusal itself.
 * Built per test with the server's port, which Spring injects into the test instance.
 */
record SearchApiCalls(int port) {

    static final JsonMapper JSON = JsonMapper.builder().build();
    private static final HttpClient HTTP = HttpClient.newHttpClient();

    /** {@code POST /api/search} with the requirement and the number of rows asked for; must answer 200. */
    JsonNode search(String text, int limit) throws Exception {
        return post("/api/search", body(text, limit));
    }

    /** The JSON body of a search: {@code {"requirement": text, "limit": limit}}. */
    static String body(String text, int limit) {
        ObjectNode body = JSON.createObjectNode();
        body.put("requirement", text);
        body.put("limit", limit);
        return body.toString();
    }

    JsonNode post(String path, String body) throws Exception {
        HttpResponse<String> response = send(path, body);
        assertThat(response.statusCode()).as(path + " " + body + " -> " + response.body()).isEqualTo(200);
        return JSON.readTree(response.body());
    }

    /** POSTs a JSON body and returns the answer whatever its status. */
    HttpResponse<String> send(String path, String body) throws Exception {
        return HTTP.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + path))
                .header("Content-Type", "application/json").POST(HttpRequest.BodyPublishers.ofString(body)).build(),
                HttpResponse.BodyHandlers.ofString());
    }

    JsonNode get(String path) throws Exception {
        HttpResponse<String> response = HTTP.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + path))
                .GET().build(), HttpResponse.BodyHandlers.ofString());
        assertThat(response.statusCode()).as(path + " -> " + response.body()).isEqualTo(200);
        return JSON.readTree(response.body());
    }
}
