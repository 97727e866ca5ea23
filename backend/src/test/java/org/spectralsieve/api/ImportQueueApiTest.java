package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;
import static org.spectralsieve.library.db.Tables.SAMPLE;

import java.net.http.HttpResponse;
import org.jooq.DSLContext;
import org.junit.jupiter.api.Test;
import org.spectralsieve.ingest.ImportFiles;
import org.spectralsieve.ingest.ImportGate;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * With one import at work and no room to wait, the next import is answered 429 with Retry-After and a
 * problem detail, stores nothing, and goes through once the turn is free. The turn is held by the test
 * through the server's own gate, so nothing depends on timing.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = {
        "spring.datasource.url=jdbc:h2:mem:import-queue-api-test;DB_CLOSE_DELAY=-1",
        "sieve.imports.max-concurrent-imports=1",
        "sieve.imports.max-queued-imports=0"})
class ImportQueueApiTest {

    private static final JsonMapper JSON = JsonMapper.builder().build();

    @LocalServerPort
    int port;

    @Autowired
    ImportGate gate;

    @Autowired
    DSLContext db;

    private Multipart batch() {
        return Multipart.file("queue.zip", Zips.of("manifest.csv",
                "file,material,thickness,class,scaling\nsheet.csv,Queue test sheet (illustrative),3,plastic sheet,bulk\n",
                "sheet.csv", ImportFiles.percentCsv()));
    }

    @Test
    void batchImportBeyondTheQueueIsAnswered429WithRetryAfterAndGoesThroughOnceFree() throws Exception {
        int samplesBefore = db.fetchCount(SAMPLE);
        HttpResponse<String> refused;
        try (ImportGate.Turn busyElsewhere = gate.enter()) {
            refused = batch().post(port, "/api/imports/batch");
        }

        assertThat(refused.statusCode()).as(refused.body()).isEqualTo(429);
        assertThat(refused.headers().firstValue("Content-Type")).hasValueSatisfying(
                t -> assertThat(t).startsWith("application/problem+json"));
        int retryAfter = Integer.parseInt(refused.headers().firstValue("Retry-After").orElseThrow());
        assertThat(retryAfter).isPositive();
        JsonNode problem = JSON.readTree(refused.body());
        assertThat(problem.path("status").asInt()).isEqualTo(429);
        assertThat(problem.path("retryAfterSeconds").asInt()).isEqualTo(retryAfter);
        assertThat(db.fetchCount(SAMPLE)).isEqualTo(samplesBefore);

        HttpResponse<String> later = batch().post(port, "/api/imports/batch");
        assertThat(later.statusCode()).as(later.body()).isEqualTo(200);
        assertThat(db.fetchCount(SAMPLE)).isEqualTo(samplesBefore + 1);
    }

    @Test
    void singleFileImportTakesATurnToo() throws Exception {
        HttpResponse<String> refused;
        try (ImportGate.Turn busyElsewhere = gate.enter()) {
            refused = Multipart.file("a.csv", ImportFiles.percentCsv()).post(port, "/api/imports/preview");
        }

        assertThat(refused.statusCode()).as(refused.body()).isEqualTo(429);
        assertThat(refused.headers().firstValue("Retry-After")).isPresent();
    }
}
