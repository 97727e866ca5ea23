package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayOutputStream;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.util.LinkedHashMap;
import java.util.Map;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** A multipart/form-data request body with one file part and text fields, for tests over real HTTP. */
final class Multipart {

    private static final HttpClient HTTP = HttpClient.newHttpClient();
    private static final JsonMapper JSON = JsonMapper.builder().build();
    static final String BOUNDARY = "----sieve-test-boundary-7f3a";

    private final String fileName;
    private final byte[] bytes;
    private final Map<String, String> fields = new LinkedHashMap<>();

    private Multipart(String fileName, byte[] bytes) {
        this.fileName = fileName;
        this.bytes = bytes;
    }

    static Multipart file(String fileName, byte[] bytes) {
        return new Multipart(fileName, bytes);
    }

    /** Text fields only, no file part (e.g. a question about a stored sample). */
    static Multipart fields() {
        return new Multipart(null, null);
    }

    static Multipart file(String fileName, String text) {
        return file(fileName, text.getBytes(StandardCharsets.UTF_8));
    }

    Multipart field(String name, Object value) {
        fields.put(name, String.valueOf(value));
        return this;
    }

    byte[] body() {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        fields.forEach((k, v) -> write(out, "--" + BOUNDARY + "\r\nContent-Disposition: form-data; name=\"" + k
                + "\"\r\n\r\n" + v + "\r\n"));
        if (fileName != null) {
            write(out, "--" + BOUNDARY + "\r\nContent-Disposition: form-data; name=\"file\"; filename=\"" + fileName
                    + "\"\r\nContent-Type: application/octet-stream\r\n\r\n");
            out.writeBytes(bytes);
            write(out, "\r\n");
        }
        write(out, "--" + BOUNDARY + "--\r\n");
        return out.toByteArray();
    }

    HttpResponse<String> post(int port, String path) throws Exception {
        return post(port, path, Map.of());
    }

    /** With extra request headers, e.g. the {@code Origin} and {@code Sec-Fetch-Site} a browser adds. */
    HttpResponse<String> post(int port, String path, Map<String, String> headers) throws Exception {
        HttpRequest.Builder request = HttpRequest.newBuilder(URI.create("http://localhost:" + port + path))
                .header("Content-Type", "multipart/form-data; boundary=" + BOUNDARY)
                .POST(HttpRequest.BodyPublishers.ofByteArray(body()));
        headers.forEach(request::header);
        return HTTP.send(request.build(), HttpResponse.BodyHandlers.ofString());
    }

    private static void write(ByteArrayOutputStream out, String s) {
        out.writeBytes(s.getBytes(StandardCharsets.UTF_8));
    }

    /** Posts the form; the answer must have {@code status} (else the failure shows it) and is read as JSON. */
    JsonNode postExpecting(int port, String path, int status) throws Exception {
        HttpResponse<String> response = post(port, path);
        assertThat(response.statusCode()).as(response.body()).isEqualTo(status);
        return JSON.readTree(response.body());
    }
}
