package org.spectralsieve.nodes;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.function.Predicate;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.condition.EnabledIfEnvironmentVariable;
import org.junit.jupiter.api.io.TempDir;
import org.spectralsieve.crash.ServerProcess;
import org.spectralsieve.accounts.TestTokens;
import org.spectralsieve.library.TestPostgres;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.node.ObjectNode;

/**
 * Two application nodes, each a separate operating-system process with its own port, memory and text index on
 * disk, on one PostgreSQL schema (docs/shared-server.md). A change acknowledged by one node is in the other
 * node's very next search and library query: each checks the library's change counter before it answers
 * (docs/freshness.md), so nothing here waits or retries before asserting. Concurrent imports on both nodes
 * lose nothing, and both nodes then give the same shortlist.
 *
 * <p>Prints {@code BENCH nodes propagation …}: the time from one node's acknowledgment to the other node's
 * first answers (search and library query) that show the change, medians over the rounds.
 */
@EnabledIfEnvironmentVariable(named = TestPostgres.URL_VARIABLE, matches = ".+",
        disabledReason = "no PostgreSQL for tests: set SIEVE_TEST_POSTGRES_URL (and SIEVE_TEST_POSTGRES_USER/_PASSWORD)")
class TwoNodesOnOnePostgresTest {

    private static final int ROUNDS = 5;
    private static final String ALL_PASS = "passes over 1% at 600 nm";
    private static final int LIMIT = 500;

    @TempDir
    static Path work;

    private static ServerProcess first;
    private static ServerProcess second;
    private static NodeClient node1;
    private static NodeClient node2;
    private static final String RUN = Long.toString(System.currentTimeMillis(), 36);

    @BeforeAll
    static void startTwoNodes() throws Exception {
        String schemaUrl = TestPostgres.freshSchema("two_nodes");
        // one after the other: the first migrates the empty schema, the second finds it migrated
        first = start("node1", schemaUrl);
        second = start("node2", schemaUrl);
        // the postgres profile runs in server mode: both clients sign with one admin's API token
        String token = TestTokens.adminToken(schemaUrl, TestPostgres.user(), TestPostgres.password());
        first.signRequestsWith(token);
        second.signRequestsWith(token);
        node1 = new NodeClient("node 1", first::request);
        node2 = new NodeClient("node 2", second::request);
    }

    @AfterAll
    static void stopNodes() throws Exception {
        if (second != null) {
            second.close();
        }
        if (first != null) {
            first.close();
        }
    }

    /** A node's own working directory (its text index under data/index) and log, on the shared database. */
    private static ServerProcess start(String name, String databaseUrl) throws Exception {
        Path dir = Files.createDirectories(work.resolve(name));
        return ServerProcess.start(dir, dir.resolve("node.log"), nodeArguments(databaseUrl));
    }

    /** Everything a node is told about the shared database, in one place. */
    private static List<String> nodeArguments(String databaseUrl) {
        return ServerProcess.postgresArguments(databaseUrl, TestPostgres.user(), TestPostgres.password());
    }

    @Test
    void aChangeAcknowledgedByOneNodeIsInTheOtherNodesNextSearchAndLibraryQuery() {
        List<Double> importMs = new ArrayList<>();
        List<Double> retireMs = new ArrayList<>();
        List<Double> revisionMs = new ArrayList<>();
        for (int round = 0; round < ROUNDS; round++) {
            String word = "probe" + RUN + "r" + round;
            String name = "Larkspur node " + word + " (illustrative)";

            JsonNode stored = node1.importNewMaterial(name, "plastic sheet", 2, word + ".csv", curve(round, 0));
            long ackImport = System.nanoTime();
            long materialId = stored.path("materialId").asLong();
            long sampleId = stored.path("sampleId").asLong();
            importMs.add(firstAnswersShow(node2, ackImport, "the import of " + name,
                    search -> rowOf(search, materialId) != null,
                    library -> hasHit(library, materialId), word));

            String lot = "lot" + word;
            node2.correctSample(sampleId, Map.of("thicknessMm", 3.5, "lot", lot,
                    "reason", "thickness re-measured with a caliper (illustrative)"));
            long ackRevision = System.nanoTime();
            revisionMs.add(firstAnswersShow(node1, ackRevision, "the correction of sample " + sampleId,
                    search -> rowOf(search, materialId) != null && rowOf(search, materialId).path("measuredMm").asDouble() == 3.5,
                    library -> hasHit(library, materialId), lot));

            node2.retire("materials", materialId);
            long ackRetire = System.nanoTime();
            retireMs.add(firstAnswersShow(node1, ackRetire, "the retirement of material " + materialId,
                    search -> rowOf(search, materialId) == null,
                    library -> !hasHit(library, materialId), word));
        }
        System.out.printf(Locale.ROOT, "BENCH nodes propagation rounds=%d import_ms=%.1f retire_ms=%.1f revision_ms=%.1f"
                        + " (acknowledgment on one node to the other node's first search and library answers showing it)%n",
                ROUNDS, median(importMs), median(retireMs), median(revisionMs));
    }

    /**
     * The other node's first search and first library query after the acknowledgment must both show the change.
     *
     * @return milliseconds from the acknowledgment to the second of those answers
     */
    private static double firstAnswersShow(NodeClient node, long ackNanos, String change, Predicate<JsonNode> searchShows,
                                           Predicate<JsonNode> libraryShows, String words) {
        JsonNode search = node.search(ALL_PASS, LIMIT);
        JsonNode library = node.library(words, 50);
        double ms = (System.nanoTime() - ackNanos) / 1e6;
        assertThat(searchShows.test(search)).as("%s's first search after %s was acknowledged shows it", node.name(), change)
                .isTrue();
        assertThat(libraryShows.test(library))
                .as("%s's first library query '%s' after %s was acknowledged shows it", node.name(), words, change).isTrue();
        return ms;
    }

    @Test
    void concurrentImportsOnBothNodesLoseNothingAndBothNodesGiveTheSameShortlist() throws Exception {
        String prefix = "Larkspur busy " + RUN;
        JsonNode shared = node1.importNewMaterial(prefix + " shared stock (illustrative)", "plastic sheet", 1,
                "shared-0.csv", curve(100, 0));
        long sharedId = shared.path("materialId").asLong();

        int writersPerNode = 2;
        int importsEach = 6;
        List<JsonNode> acknowledged = new CopyOnWriteArrayList<>();
        Map<Long, String> newMaterials = new HashMap<>();
        List<String> readerProblems = new CopyOnWriteArrayList<>();
        AtomicBoolean writing = new AtomicBoolean(true);
        ExecutorService pool = Executors.newFixedThreadPool(2 * writersPerNode + 2);
        try {
            List<Future<?>> writers = new ArrayList<>();
            for (int w = 0; w < 2 * writersPerNode; w++) {
                NodeClient node = w % 2 == 0 ? node1 : node2;
                int writer = w;
                writers.add(pool.submit(() -> {
                    for (int i = 0; i < importsEach; i++) {
                        int n = writer * importsEach + i;
                        JsonNode answer = i % 2 == 0
                                ? node.importNewMaterial(prefix + " w" + writer + "n" + i + " (illustrative)", "plastic sheet",
                                        2, "busy-" + n + ".csv", curve(200 + n, n))
                                : node.importSampleOf(sharedId, 1 + n * 0.25, "shared-" + n + ".csv", curve(100, n));
                        acknowledged.add(answer);
                        if (i % 2 == 0) {
                            synchronized (newMaterials) {
                                newMaterials.put(answer.path("materialId").asLong(), prefix + " w" + writer + "n" + i + " (illustrative)");
                            }
                        }
                    }
                    return null;
                }));
            }
            List<Future<?>> readers = new ArrayList<>();
            for (NodeClient node : List.of(node1, node2)) {
                readers.add(pool.submit(() -> {
                    while (writing.get()) {
                        JsonNode search = node.search(ALL_PASS, LIMIT);
                        if (!search.path("results").isArray()) {
                            readerProblems.add(node.name() + " answered a search without results: " + search);
                        }
                        node.library("larkspur", 50);
                    }
                    return null;
                }));
            }
            for (Future<?> f : writers) {
                f.get();
            }
            writing.set(false);
            for (Future<?> f : readers) {
                f.get();
            }
        } finally {
            writing.set(false);
            pool.shutdown();
        }

        assertThat(readerProblems).isEmpty();
        int expected = 2 * writersPerNode * importsEach;
        assertThat(acknowledged).hasSize(expected);
        Set<Long> sampleIds = new HashSet<>();
        acknowledged.forEach(a -> sampleIds.add(a.path("sampleId").asLong()));
        assertThat(sampleIds).as("every acknowledged import has a sample id of its own").hasSize(expected)
                .doesNotContain(shared.path("sampleId").asLong());
        assertThat(newMaterials).as("every new material has an id of its own").hasSize(expected / 2)
                .doesNotContainKey(sharedId);

        for (NodeClient node : List.of(node1, node2)) {
            JsonNode sharedNow = node.get("/api/materials/" + sharedId);
            Set<Long> sharedSamples = new HashSet<>();
            sharedNow.path("samples").forEach(s -> sharedSamples.add(s.path("id").asLong()));
            Set<Long> sentToShared = new HashSet<>();
            acknowledged.stream().filter(a -> a.path("materialId").asLong() == sharedId)
                    .forEach(a -> sentToShared.add(a.path("sampleId").asLong()));
            sentToShared.add(shared.path("sampleId").asLong());
            assertThat(sharedSamples).as("%s: the shared material's samples, each acknowledged one once", node.name())
                    .containsExactlyInAnyOrderElementsOf(sentToShared);
            assertThat(sharedNow.path("samples").size()).isEqualTo(sentToShared.size());

            List<String> listed = new ArrayList<>();
            node.get("/api/materials").forEach(m -> {
                if (m.path("name").asString().startsWith(prefix)) {
                    listed.add(m.path("name").asString());
                }
            });
            List<String> sent = new ArrayList<>(newMaterials.values());
            sent.add(prefix + " shared stock (illustrative)");
            assertThat(listed).as("%s lists every acknowledged material exactly once", node.name())
                    .containsExactlyInAnyOrderElementsOf(sent);

            List<Long> ranked = new ArrayList<>();
            node.search(ALL_PASS, LIMIT).path("results").forEach(r -> ranked.add(r.path("materialId").asLong()));
            Set<Long> ours = new HashSet<>(newMaterials.keySet());
            ours.add(sharedId);
            assertThat(ranked.stream().filter(ours::contains).toList())
                    .as("%s ranks every acknowledged material exactly once", node.name())
                    .containsExactlyInAnyOrderElementsOf(ours);
        }

        for (String requirement : List.of(ALL_PASS, "passes over 40% at 400 nm", "passes over 40% at 400 nm, thickness 1 to 6 mm")) {
            JsonNode one = node1.search(requirement, LIMIT);
            assertThat(one.path("results").size()).as("rows for '%s'", requirement).isGreaterThan(expected / 2);
            assertThat(withoutTiming(node2.search(requirement, LIMIT)))
                    .as("both nodes' shortlists for '%s' (same rows, same order)", requirement)
                    .isEqualTo(withoutTiming(one));
        }
        assertThat(node2.library("larkspur busy", 100)).isEqualTo(node1.library("larkspur busy", 100));
    }

    /**
     * An illustrative sheet's curve: rises from 300 nm to a plateau; {@code shape} moves the edge (so the
     * shortlist has an order to agree on), {@code variant} changes the last digits (no two files alike).
     */
    private static String curve(int shape, int variant) {
        StringBuilder csv = new StringBuilder("wavelength_nm,T\n");
        double edge = 330 + (shape % 37) * 2;
        for (int nm = 280; nm <= 800; nm += 10) {
            double t = 0.9 / (1 + Math.exp(-(nm - edge) / 12.0)) + 0.001 * (variant % 7) + 0.0001 * (variant / 7);
            csv.append(nm).append(',').append(String.format(Locale.ROOT, "%.5f", Math.min(t, 0.99))).append('\n');
        }
        return csv.toString();
    }

    private static JsonNode rowOf(JsonNode search, long materialId) {
        for (JsonNode row : search.path("results")) {
            if (row.path("materialId").asLong() == materialId) {
                return row;
            }
        }
        return null;
    }

    private static boolean hasHit(JsonNode library, long materialId) {
        for (JsonNode hit : library.path("hits")) {
            if (hit.path("materialId").asLong() == materialId) {
                return true;
            }
        }
        return false;
    }

    private static JsonNode withoutTiming(JsonNode search) {
        ObjectNode copy = ((ObjectNode) search).deepCopy();
        copy.remove("tookMs");
        return copy;
    }

    private static double median(List<Double> values) {
        List<Double> sorted = values.stream().sorted().toList();
        return sorted.get(sorted.size() / 2);
    }
}
