package org.spectralsieve.crash;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.atomic.AtomicInteger;
import org.spectralsieve.crash.CrashFiles.SentFile;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Sends imports to one server process the way a user's client would, and writes down each one the server
 * answered with 2xx. A request cut by the kill has no answer: whether it was stored is unknown and either
 * outcome is allowed, but if it was stored it must be whole.
 */
final class CrashClient {

    static final JsonMapper JSON = JsonMapper.builder().build();
    private static final String BOUNDARY = "----crash-test-boundary-51c2";

    private final ServerProcess server;
    private final Answered answered;
    private final AtomicInteger names;
    private final int round;
    private final HttpClient http = HttpClient.newBuilder().version(HttpClient.Version.HTTP_1_1)
            .connectTimeout(Duration.ofSeconds(5)).build();

    /** Milliseconds per answered single import, and per stored file of an answered batch. */
    final List<Double> singleMs = new CopyOnWriteArrayList<>();
    final List<Double> batchFileMs = new CopyOnWriteArrayList<>();
    final AtomicInteger unanswered = new AtomicInteger();
    /** Requests of any kind answered with 2xx by this process. */
    final AtomicInteger answeredRequests = new AtomicInteger();

    CrashClient(ServerProcess server, Answered answered, AtomicInteger names, int round) {
        this.server = server;
        this.answered = answered;
        this.names = names;
        this.round = round;
    }

    /** One curve through {@code POST /api/imports}: a new material, or another sample of an answered one. */
    void singleImport(Random random) throws InterruptedException {
        int n = names.incrementAndGet();
        SentFile file = CrashFiles.curve("crash-" + round + "-" + n + ".csv", random);
        Map<String, String> fields = new LinkedHashMap<>();
        Map.Entry<Long, String> existing = random.nextBoolean() ? answered.anyMaterial(random) : null;
        String materialName;
        if (existing != null) {
            fields.put("materialId", String.valueOf(existing.getKey()));
            materialName = existing.getValue();
        } else {
            materialName = "Crash stock " + round + "-" + n;
            fields.put("materialName", materialName);
            fields.put("materialClass", "plastic sheet");
            fields.put("scaling", "bulk");
        }
        fields.put("thicknessMm", String.valueOf(1 + random.nextInt(8)));
        fields.put("yKind", "fraction");
        long t0 = System.nanoTime();
        JsonNode body = post("/api/imports", fields, file);
        if (body == null) {
            return;
        }
        singleMs.add((System.nanoTime() - t0) / 1e6);
        answered.sample(new Answered.Sample(body.path("sampleId").asLong(), body.path("materialId").asLong(),
                materialName, file, round, "single"));
    }

    /** Two to four curves in one zip through {@code POST /api/imports/batch}, new and answered materials mixed. */
    void batchImport(Random random) throws InterruptedException {
        int count = 2 + random.nextInt(3);
        List<SentFile> files = new ArrayList<>();
        List<String> materialNames = new ArrayList<>();
        StringBuilder manifest = new StringBuilder("file,material,thickness,class,scaling,y_kind\n");
        for (int i = 0; i < count; i++) {
            int n = names.incrementAndGet();
            SentFile file = CrashFiles.curve("crash-" + round + "-" + n + ".csv", random);
            Map.Entry<Long, String> existing = random.nextInt(3) == 0 ? answered.anyMaterial(random) : null;
            String material = existing != null ? existing.getValue() : "Crash stock " + round + "-" + n;
            manifest.append(file.name()).append(',').append(material).append(',').append(1 + random.nextInt(8))
                    .append(existing != null ? ",,," : ",plastic sheet,bulk,").append("fraction\n");
            files.add(file);
            materialNames.add(material);
        }
        String zipName = "crash-batch-" + round + "-" + names.incrementAndGet() + ".zip";
        byte[] zip = CrashFiles.zip(manifest.toString(), files);
        long t0 = System.nanoTime();
        JsonNode report = post("/api/imports/batch", Map.of(),
                new SentFile(zipName, zip, "", new double[0], new double[0]));
        if (report == null) {
            return;
        }
        double ms = (System.nanoTime() - t0) / 1e6;
        JsonNode rows = report.path("files");
        for (int i = 0; i < rows.size(); i++) {
            JsonNode row = rows.get(i);
            if (!"STORED".equals(row.path("outcome").asString())) {
                throw new IllegalStateException("a batch row the test made valid was not stored: " + row);
            }
            answered.sample(new Answered.Sample(row.path("sampleId").asLong(), row.path("materialId").asLong(),
                    materialNames.get(i), files.get(i), round, "batch"));
            batchFileMs.add(ms / rows.size());
        }
    }

    /** An emitter or a response through {@code POST /api/emitters} or {@code /api/responses}. */
    void spectrumImport(Random random) throws InterruptedException {
        boolean emitter = random.nextBoolean();
        String name = "crash-" + (emitter ? "lamp-" : "resp-") + round + "-" + names.incrementAndGet();
        SentFile file = CrashFiles.spectrum(name + ".csv", random);
        JsonNode body = post(emitter ? "/api/emitters" : "/api/responses", Map.of("name", name), file);
        if (body == null) {
            return;
        }
        if (!file.sha256().equals(body.path("sha256").asString())) {
            throw new IllegalStateException("the answer names another checksum than the file sent: " + body);
        }
        answered.spectrum(new Answered.Spectrum(emitter ? "emitter" : "response", name, file, round));
    }

    /** The answer to one search, or null when the server gave none (killed). */
    JsonNode search(String requirement, int limit) throws InterruptedException {
        String json = JSON.writeValueAsString(Map.of("requirement", requirement, "limit", limit));
        return send(server.request("/api/search").header("Content-Type", "application/json")
                .POST(HttpRequest.BodyPublishers.ofString(json)), "POST /api/search");
    }

    JsonNode get(String path) throws InterruptedException {
        return send(server.request(path).GET(), "GET " + path);
    }

    HttpResponse<byte[]> getBytes(String path) throws IOException, InterruptedException {
        return http.send(server.request(path).timeout(Duration.ofSeconds(60)).GET().build(),
                HttpResponse.BodyHandlers.ofByteArray());
    }

    /** The JSON answer of a 2xx; null when the connection broke (the kill); a 4xx or 5xx is a test failure. */
    private JsonNode post(String path, Map<String, String> fields, SentFile file) throws InterruptedException {
        return send(server.request(path)
                .header("Content-Type", "multipart/form-data; boundary=" + BOUNDARY)
                .POST(HttpRequest.BodyPublishers.ofByteArray(multipart(fields, file))), "POST " + path + " " + file.name());
    }

    private JsonNode send(HttpRequest.Builder request, String what) throws InterruptedException {
        HttpResponse<String> response;
        try {
            response = http.send(request.timeout(Duration.ofSeconds(60)).build(), HttpResponse.BodyHandlers.ofString());
        } catch (IOException cutByTheKill) {
            unanswered.incrementAndGet();
            return null;
        }
        if (response.statusCode() / 100 != 2) {
            throw new IllegalStateException(what + " answered " + response.statusCode() + ": " + response.body());
        }
        answeredRequests.incrementAndGet();
        return JSON.readTree(response.body());
    }

    private static byte[] multipart(Map<String, String> fields, SentFile file) {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        fields.forEach((k, v) -> out.writeBytes(("--" + BOUNDARY + "\r\nContent-Disposition: form-data; name=\"" + k
                + "\"\r\n\r\n" + v + "\r\n").getBytes(StandardCharsets.UTF_8)));
        out.writeBytes(("--" + BOUNDARY + "\r\nContent-Disposition: form-data; name=\"file\"; filename=\"" + file.name()
                + "\"\r\nContent-Type: application/octet-stream\r\n\r\n").getBytes(StandardCharsets.UTF_8));
        out.writeBytes(file.bytes());
        out.writeBytes(("\r\n--" + BOUNDARY + "--\r\n").getBytes(StandardCharsets.UTF_8));
        return out.toByteArray();
    }
}
