package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;
import static org.spectralsieve.library.db.Tables.CURVE;
import static org.spectralsieve.library.db.Tables.MATERIAL;
import static org.spectralsieve.library.db.Tables.SAMPLE;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.stream.Stream;
import java.util.zip.ZipEntry;
import java.util.zip.ZipOutputStream;
import org.jooq.DSLContext;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.spectralsieve.ingest.ImportFiles;
import org.spectralsieve.requirement.RequirementLimits;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Requests made to break or exhaust the service, through a real server with the shipped limits: each must
 * be answered 4xx with an RFC 9457 problem detail, store nothing, and leave the server answering an
 * ordinary search. To add a case, add a row to {@link #cases()}: a name, the request, the status expected
 * and what the problem must name (a parameter, setting or field, or null).
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:hostile-input-test;DB_CLOSE_DELAY=-1")
class HostileInputTest {

    private static final JsonMapper JSON = JsonMapper.builder().build();
    private static final String NORMAL_SEARCH = "{\"requirement\": \"passes over 80% at 365 nm\", \"limit\": 3}";

    /** One hostile request: how to send it, the status it must get, and a word its problem must contain. */
    record Case(String name, Request request, int status, String names) {
        @Override
        public String toString() {
            return name;
        }
    }

    @FunctionalInterface
    interface Request {
        RawHttp.Answer send(int port) throws IOException;
    }

    @LocalServerPort
    int port;

    @Autowired
    DSLContext db;

    static Stream<Case> cases() {
        String clause = "passes over 80% at 365 nm and ";
        String longRequirement = clause.repeat(RequirementLimits.MAX_TEXT_LENGTH / clause.length() + 1) + "blocks under 1% at 405 nm";
        String megabyteRequirement = clause.repeat(1_000_000 / clause.length()) + "blocks under 1% at 405 nm";
        String manyClauses = "[" + String.join(",", java.util.Collections.nCopies(RequirementLimits.MAX_CLAUSES + 1,
                "{\"type\": \"transmittance\", \"direction\": \"pass\", \"fromNm\": 365, \"toNm\": 365, \"thresholdT\": 0.8}")) + "]";
        return Stream.of(
                new Case("requirement longer than the cap", json("/api/search",
                        "{\"requirement\": \"" + longRequirement + "\"}"), 400, "requirement"),
                new Case("requirement longer than the cap, on parse", json("/api/requirements/parse",
                        "{\"requirement\": \"" + longRequirement + "\"}"), 400, "requirement"),
                new Case("1 MB requirement of valid clauses", json("/api/search",
                        "{\"requirement\": \"" + megabyteRequirement + "\"}"), 413, "limit"),
                new Case("structured requirement with too many clauses", json("/api/search",
                        "{\"requirement\": {\"clauses\": " + manyClauses + "}}"), 400, "requirement"),
                new Case("limit beyond a 32-bit integer", json("/api/search",
                        "{\"requirement\": \"passes over 80% at 365 nm\", \"limit\": 2147483648}"), 400, "limit"),
                new Case("limit of 1e30", json("/api/search",
                        "{\"requirement\": \"passes over 80% at 365 nm\", \"limit\": 1e30}"), 400, "limit"),
                new Case("negative limit", json("/api/search",
                        "{\"requirement\": \"passes over 80% at 365 nm\", \"limit\": -1}"), 400, "limit"),
                new Case("malformed JSON", json("/api/search", "{\n  \"requirement\": \"passes over 80% at 365 nm\",\n  \"limit\": }"),
                        400, "line"),
                new Case("NaN in JSON", json("/api/search",
                        "{\"requirement\": \"passes over 80% at 365 nm\", \"limit\": NaN}"), 400, "line"),
                new Case("wrong content type", port -> RawHttp.post(port, "/api/search", "text/plain",
                        NORMAL_SEARCH.getBytes(StandardCharsets.UTF_8)), 415, null),
                new Case("unsupported method", port -> RawHttp.send(port, "DELETE /api/search HTTP/1.1", null), 405, null),
                new Case("unknown /api path", port -> RawHttp.get(port, "/api/no-such-thing"), 404, null),
                new Case("the error path asked for directly", port -> RawHttp.get(port, "/error"), 404, null),
                new Case("100 KB query string", port -> RawHttp.get(port, "/api/materials?q=" + "a".repeat(100_000)), 400, null),
                new Case("encoded slash in the path", port -> RawHttp.get(port, "/api/samples/1%2F2/curve"), 400, null),
                new Case("encoded backslash in the path", port -> RawHttp.get(port, "/api/samples/1%5C2/curve"), 400, null),
                new Case("bad Host header", port -> RawHttp.send(port, "GET /api/materials HTTP/1.1\nHost: bad host name", null),
                        400, null),
                new Case("20 KB header", port -> RawHttp.send(port, "GET /api/materials HTTP/1.1\nX-Filler: "
                        + "b".repeat(20_000), null), 400, null),
                new Case("thickness NaN", port -> RawHttp.get(port, "/api/samples/1/curve?thicknessMm=NaN"), 400, "thicknessMm"),
                new Case("thickness Infinity", port -> RawHttp.get(port, "/api/samples/1/curve?thicknessMm=Infinity"), 400, "thicknessMm"),
                new Case("negative thickness", port -> RawHttp.get(port, "/api/samples/1/curve?thicknessMm=-3"), 400, "thicknessMm"),
                new Case("thickness 1e308", port -> RawHttp.get(port, "/api/samples/1/figures?thicknessMm=1e308"), 400, "thicknessMm"),
                new Case("grid from -Infinity", port -> RawHttp.get(port, "/api/samples/1/curve?from=-Infinity&to=400"), 400, "from"),
                new Case("grid to NaN", port -> RawHttp.get(port, "/api/samples/1/curve?from=300&to=NaN"), 400, "to"),
                new Case("grid of a billion points", port -> RawHttp.get(port, "/api/samples/1/curve.csv?from=0&to=99999&step=0.01"),
                        400, "step"),
                new Case("step NaN", port -> RawHttp.get(port, "/api/samples/1/curve?from=300&to=400&step=NaN"), 400, "step"),
                new Case("behind NaN mm", port -> RawHttp.get(port, "/api/samples/1/figures?behind=float&behindMm=NaN"),
                        400, "behindMm"),
                new Case("sample id beyond a long", port -> RawHttp.get(port, "/api/samples/99999999999999999999/curve"), 400, "id"),
                new Case("zip bomb: 20 MB of zeros in one entry", multipart("/api/imports/batch", "bomb.zip",
                        zip("manifest.csv", "file,material\nzeros.csv,any\n".getBytes(StandardCharsets.UTF_8),
                                "zeros.csv", new byte[20 * 1024 * 1024])), 413, "sieve.imports.max-zip-ratio"),
                new Case("ratio bomb: 2 MB of zeros, under the file cap", multipart("/api/imports/batch", "ratio.zip",
                        zip("manifest.csv", "file,material\nzeros.csv,any\n".getBytes(StandardCharsets.UTF_8),
                                "zeros.csv", new byte[2 * 1024 * 1024])), 413, "sieve.imports.max-zip-ratio"),
                new Case("zip entry leaving the upload", multipart("/api/imports/batch", "traversal.zip",
                        zip("manifest.csv", "file,material\n../evil.csv,any\n".getBytes(StandardCharsets.UTF_8),
                                "../evil.csv", ImportFiles.percentCsv().getBytes(StandardCharsets.UTF_8))), 400, "unsafe-path"),
                new Case("not a zip", multipart("/api/imports/batch", "text.zip", "just text".getBytes(StandardCharsets.UTF_8)),
                        400, "text.zip"),
                new Case("import with indexN NaN", port -> RawHttp.post(port, "/api/imports",
                        "multipart/form-data; boundary=" + Multipart.BOUNDARY, Multipart.file("a.csv", ImportFiles.percentCsv())
                                .field("materialName", "Hostile sheet").field("materialClass", "plastic sheet")
                                .field("scaling", "bulk").field("indexN", "NaN").field("thicknessMm", "3").body()),
                        400, "indexN"));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("cases")
    void hostileRequestIsRefusedWithAProblemStoresNothingAndLeavesTheServerUp(Case hostile) throws Exception {
        List<Integer> before = counts();

        RawHttp.Answer answer = hostile.request().send(port);

        assertThat(answer.status()).as(answer.body()).isEqualTo(hostile.status());
        assertThat(answer.header("Content-Type")).as(answer.body()).startsWith("application/problem+json");
        JsonNode problem = JSON.readTree(answer.body());
        assertThat(problem.path("status").asInt()).isEqualTo(hostile.status());
        assertThat(problem.path("title").asString()).isNotBlank();
        assertThat(problem.path("detail").asString()).isNotBlank();
        if (hostile.names() != null) {
            assertThat(answer.body()).contains(hostile.names());
        }
        assertThat(counts()).as("materials, samples, curves").isEqualTo(before);
        RawHttp.Answer normal = json("/api/search", NORMAL_SEARCH).send(port);
        assertThat(normal.status()).as(normal.body()).isEqualTo(200);
        assertThat(JSON.readTree(normal.body()).path("results").isArray()).isTrue();
    }

    private List<Integer> counts() {
        return List.of(db.fetchCount(MATERIAL), db.fetchCount(SAMPLE), db.fetchCount(CURVE));
    }

    private static Request json(String path, String body) {
        return port -> RawHttp.post(port, path, "application/json", body.getBytes(StandardCharsets.UTF_8));
    }

    private static Request multipart(String path, String fileName, byte[] bytes) {
        return port -> RawHttp.post(port, path, "multipart/form-data; boundary=" + Multipart.BOUNDARY,
                Multipart.file(fileName, bytes).body());
    }

    /** @param namesAndBytes entry name, bytes, … deflated as any zip tool would */
    private static byte[] zip(Object... namesAndBytes) {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        try (ZipOutputStream zip = new ZipOutputStream(bytes)) {
            for (int i = 0; i < namesAndBytes.length; i += 2) {
                zip.putNextEntry(new ZipEntry((String) namesAndBytes[i]));
                zip.write((byte[]) namesAndBytes[i + 1]);
                zip.closeEntry();
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return bytes.toByteArray();
    }
}
