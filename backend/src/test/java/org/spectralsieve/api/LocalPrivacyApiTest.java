package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.junit.jupiter.api.Assumptions.assumeTrue;
import static org.spectralsieve.library.db.Tables.REFERENCE_SPECTRUM;
import static org.spectralsieve.library.db.Tables.SAMPLE;
import static org.spectralsieve.library.db.Tables.SOURCE_FILE;

import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.net.ConnectException;
import java.net.Inet4Address;
import java.net.InetAddress;
import java.net.InetSocketAddress;
import java.net.NetworkInterface;
import java.net.Socket;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.Charset;
import java.nio.charset.StandardCharsets;
import java.util.Collections;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.atomic.AtomicInteger;
import org.jooq.DSLContext;
import org.junit.jupiter.api.Test;
import org.spectralsieve.ingest.ImportFiles;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.core.env.Environment;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The embedded tool is private to its machine: it listens on the loopback interface, refuses writes that
 * another site's page sends through the visitor's browser (and stores nothing of them), answers only to
 * loopback host names, and serves stored source files with the charset their text was read in. Through a
 * real server over the (illustrative) demo library.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:local-privacy-api-test;DB_CLOSE_DELAY=-1")
class LocalPrivacyApiTest {

    private static final HttpClient HTTP = HttpClient.newHttpClient();
    private static final JsonMapper JSON = JsonMapper.builder().build();
    private static final String EVIL = "http://evil.example";
    private static final AtomicInteger NAMES = new AtomicInteger();

    @LocalServerPort
    int port;

    @Autowired
    DSLContext db;

    @Autowired
    Environment environment;

    // ---------------------------------------------------------------- listening address

    @Test
    void theDefaultListensOnTheLoopbackInterfaceOnly() throws Exception {
        assertThat(environment.getProperty("server.address")).isEqualTo("127.0.0.1");
        Optional<InetAddress> outward = Collections.list(NetworkInterface.getNetworkInterfaces()).stream()
                .flatMap(i -> Collections.list(i.getInetAddresses()).stream())
                .filter(a -> a instanceof Inet4Address && !a.isLoopbackAddress() && !a.isLinkLocalAddress())
                .findFirst();
        assumeTrue(outward.isPresent(), "no non-loopback IPv4 address on this machine to try the port from");

        assertThatThrownBy(() -> {
            try (Socket s = new Socket()) {
                s.connect(new InetSocketAddress(outward.get(), port), 2000);
            }
        }).isInstanceOf(ConnectException.class);
    }

    // ---------------------------------------------------------------- writes from other sites

    @Test
    void anImportPostedFromAnotherSitesPageIsRefusedAndStoresNothing() throws Exception {
        int samples = db.fetchCount(SAMPLE);

        HttpResponse<String> r = importForm().post(port, "/api/imports", Map.of("Origin", EVIL));

        assertThat(r.statusCode()).isEqualTo(403);
        assertThat(r.headers().firstValue("Content-Type").orElse("")).startsWith("application/problem+json");
        JsonNode problem = JSON.readTree(r.body());
        assertThat(problem.path("type").asString()).isEqualTo("/problems/cross-site-write");
        assertThat(problem.path("status").asInt()).isEqualTo(403);
        assertThat(problem.path("detail").asString()).contains(EVIL).contains("http://localhost:" + port);
        assertThat(db.fetchCount(SAMPLE)).isEqualTo(samples);
    }

    @Test
    void anImportFromTheToolsOwnPageIsStored() throws Exception {
        HttpResponse<String> r = importForm().post(port, "/api/imports",
                Map.of("Origin", "http://localhost:" + port, "Sec-Fetch-Site", "same-origin"));

        assertThat(r.statusCode()).as(r.body()).isEqualTo(201);
    }

    @Test
    void anImportWithoutOriginFromCurlOrAScriptIsStored() throws Exception {
        int samples = db.fetchCount(SAMPLE);

        HttpResponse<String> r = importForm().post(port, "/api/imports");

        assertThat(r.statusCode()).as(r.body()).isEqualTo(201);
        assertThat(db.fetchCount(SAMPLE)).isEqualTo(samples + 1);
    }

    @Test
    void fetchMetadataMarkingTheRequestCrossSiteIsRefusedEvenWithoutOrigin() throws Exception {
        int samples = db.fetchCount(SAMPLE);

        HttpResponse<String> r = importForm().post(port, "/api/imports", Map.of("Sec-Fetch-Site", "cross-site"));

        assertThat(r.statusCode()).isEqualTo(403);
        assertThat(JSON.readTree(r.body()).path("detail").asString()).contains("Sec-Fetch-Site: cross-site");
        assertThat(db.fetchCount(SAMPLE)).isEqualTo(samples);
    }

    @Test
    void anotherPortOnLocalhostIsTheSameSiteButNotThisTool() throws Exception {
        assertThat(searchPost(Map.of("Sec-Fetch-Site", "same-site")).statusCode()).isEqualTo(403);
        assertThat(searchPost(Map.of("Origin", "http://localhost:" + (port == 3000 ? 3001 : 3000))).statusCode())
                .isEqualTo(403);
    }

    @Test
    void theOpaqueOriginOfSandboxedFramesAndLocalFilesIsRefused() throws Exception {
        assertThat(searchPost(Map.of("Origin", "null")).statusCode()).isEqualTo(403);
    }

    @Test
    void aSearchFromTheToolsOwnPageIsAnswered() throws Exception {
        HttpResponse<String> r = searchPost(Map.of("Origin", "http://localhost:" + port, "Sec-Fetch-Site", "same-origin"));

        assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    }

    @Test
    void aDeleteFromAnotherSiteIsRefusedAndTheSpectrumStays() throws Exception {
        String name = "illustrative-lamp-" + NAMES.incrementAndGet();
        assertThat(Multipart.file("lamp.csv", "wavelength_nm,power\n360,0.2\n365,1\n370,0.3\n").field("name", name)
                .post(port, "/api/emitters").statusCode()).isEqualTo(201);

        HttpResponse<String> r = send("DELETE", "/api/emitters/" + name, Map.of("Origin", EVIL, "Sec-Fetch-Site", "cross-site"));

        assertThat(r.statusCode()).isEqualTo(403);
        assertThat(db.fetchCount(REFERENCE_SPECTRUM, REFERENCE_SPECTRUM.NAME.eq(name))).isEqualTo(1);
        assertThat(send("DELETE", "/api/emitters/" + name, Map.of()).statusCode()).isEqualTo(204);
    }

    @Test
    void readsAreNotAffectedByOriginAndGrantNoCrossOriginAccess() throws Exception {
        HttpResponse<String> r = send("GET", "/api/materials", Map.of("Origin", EVIL, "Sec-Fetch-Site", "cross-site"));

        assertThat(r.statusCode()).isEqualTo(200);
        // the browser keeps the answer from the other page: no CORS grant is given
        assertThat(r.headers().firstValue("Access-Control-Allow-Origin")).isEmpty();
    }

    // ---------------------------------------------------------------- host names (DNS rebinding)

    @Test
    void aRequestNamingAForeignHostIsRefusedWhileListeningOnLoopback() throws Exception {
        String answer = rawGet("/api/materials", "rebound.evil.example:" + port);

        assertThat(answer).startsWith("HTTP/1.1 403");
        assertThat(answer).contains("application/problem+json").contains("/problems/foreign-host")
                .contains("rebound.evil.example");
    }

    @Test
    void loopbackHostNamesAreAnswered() throws Exception {
        assertThat(rawGet("/api/materials", "127.0.0.1:" + port)).startsWith("HTTP/1.1 200");
        assertThat(rawGet("/api/materials", "localhost:" + port)).startsWith("HTTP/1.1 200");
        assertThat(rawGet("/api/materials", "[::1]:" + port)).startsWith("HTTP/1.1 200");
    }

    // ---------------------------------------------------------------- source files and their charset

    @Test
    void theDemoSourceFilesEmDashArrivesAsAnEmDash() throws Exception {
        long sampleId = db.select(SOURCE_FILE.SAMPLE_ID).from(SOURCE_FILE).orderBy(SOURCE_FILE.SAMPLE_ID).limit(1)
                .fetchOne(SOURCE_FILE.SAMPLE_ID);

        HttpResponse<byte[]> r = getBytes("/api/samples/" + sampleId + "/source-file");

        assertThat(r.statusCode()).isEqualTo(200);
        String type = r.headers().firstValue("Content-Type").orElse("");
        assertThat(type).startsWith("text/csv").containsIgnoringCase("charset=UTF-8");
        assertThat(r.headers().firstValue("X-Content-Type-Options")).contains("nosniff");
        // the demo curves carry the note "modelled, illustrative — not for design decisions" (U+2014)
        assertThat(new String(r.body(), charsetOf(type))).contains("illustrative \u2014 not");
    }

    @Test
    void aLatin1FileIsServedAsLatin1SoItsDegreeSignSurvives() throws Exception {
        String text = "# sample: illustrative cast sheet at 23 \u00b0C\n" + ImportFiles.percentCsv();
        byte[] latin1 = text.getBytes(StandardCharsets.ISO_8859_1);
        HttpResponse<String> stored = Multipart.file("latin1-sheet.csv", latin1).field("materialName", nextMaterial())
                .field("materialClass", "plastic sheet").field("scaling", "bulk").field("thicknessMm", 3)
                .post(port, "/api/imports");
        assertThat(stored.statusCode()).as(stored.body()).isEqualTo(201);

        HttpResponse<byte[]> r = getBytes("/api/samples/" + JSON.readTree(stored.body()).path("sampleId").asLong()
                + "/source-file");

        String type = r.headers().firstValue("Content-Type").orElse("");
        assertThat(type).containsIgnoringCase("charset=ISO-8859-1");
        assertThat(r.body()).isEqualTo(latin1);
        assertThat(new String(r.body(), charsetOf(type))).contains("23 \u00b0C");
    }

    @Test
    void anImportedEmittersSourceFileCarriesItsCharset() throws Exception {
        String name = "illustrative-lamp-" + NAMES.incrementAndGet();
        String csv = "# illustrative lamp \u2014 invented\nwavelength_nm,power\n360,0.2\n365,1\n370,0.3\n";
        assertThat(Multipart.file("lamp.csv", csv).field("name", name).post(port, "/api/emitters").statusCode())
                .isEqualTo(201);

        HttpResponse<byte[]> r = getBytes("/api/emitters/" + name + "/source-file");

        String type = r.headers().firstValue("Content-Type").orElse("");
        assertThat(type).startsWith("text/csv").containsIgnoringCase("charset=UTF-8");
        assertThat(new String(r.body(), charsetOf(type))).isEqualTo(csv);
    }

    // ---------------------------------------------------------------- helpers

    private static Multipart importForm() {
        return Multipart.file("sheet.csv", ImportFiles.percentCsv()).field("materialName", nextMaterial())
                .field("materialClass", "plastic sheet").field("scaling", "bulk").field("thicknessMm", 3);
    }

    private static String nextMaterial() {
        return "Illustrative privacy sheet " + NAMES.incrementAndGet();
    }

    private HttpResponse<String> searchPost(Map<String, String> headers) throws Exception {
        HttpRequest.Builder b = HttpRequest.newBuilder(URI.create("http://localhost:" + port + "/api/search"))
                .header("Content-Type", "application/json")
                .POST(HttpRequest.BodyPublishers.ofString("{\"requirement\": \"passes over 50% at 400 nm\", \"limit\": 3}"));
        headers.forEach(b::header);
        return HTTP.send(b.build(), HttpResponse.BodyHandlers.ofString());
    }

    private HttpResponse<String> send(String method, String path, Map<String, String> headers) throws Exception {
        HttpRequest.Builder b = HttpRequest.newBuilder(URI.create("http://localhost:" + port + path))
                .method(method, HttpRequest.BodyPublishers.noBody());
        headers.forEach(b::header);
        return HTTP.send(b.build(), HttpResponse.BodyHandlers.ofString());
    }

    private HttpResponse<byte[]> getBytes(String path) throws Exception {
        return HTTP.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + path)).GET().build(),
                HttpResponse.BodyHandlers.ofByteArray());
    }

    private static Charset charsetOf(String contentType) {
        return Charset.forName(contentType.replaceAll("(?i).*charset=([^;]+).*", "$1").trim());
    }

    /** A request with a Host header of our choosing, which Java's HTTP client does not allow to set. */
    private String rawGet(String path, String host) throws IOException {
        try (Socket s = new Socket(InetAddress.getLoopbackAddress(), port)) {
            s.setSoTimeout(10_000);
            OutputStream out = s.getOutputStream();
            out.write(("GET " + path + " HTTP/1.1\r\nHost: " + host + "\r\nConnection: close\r\n\r\n")
                    .getBytes(StandardCharsets.US_ASCII));
            out.flush();
            InputStream in = s.getInputStream();
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        }
    }
}
