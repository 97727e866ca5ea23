package org.spectralsieve.crash;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import java.util.Set;
import java.util.TreeSet;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.stream.Stream;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spectralsieve.crash.CrashedFileCheck.Counts;
import org.spectralsieve.crash.CrashedFileCheck.Findings;
import org.spectralsieve.accounts.TestTokens;
import org.spectralsieve.library.TestPostgres;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.node.ObjectNode;

/**
 * Acknowledged means durable: the service runs as a separate process on an H2 file database (the default
 * URL, in a temporary working directory) while two clients import single curves, batch zips and emitters
 * or responses; the process is killed with SIGKILL at a random moment (after a random number of answered
 * imports and a random pause, so usually with imports in flight), started again, and checked, round
 * after round. See docs/durability.md.
 *
 * <p>After every kill, a copy of the crashed file is read directly ({@link CrashedFileCheck}): every
 * acknowledged import there, bit-identical, with its checksum; nothing partial; no count lower than after the
 * previous crash. The restarted service (no repair step) must then list the same materials, judge every
 * stored sample in a search (its store holds what the file holds), rank every acknowledged material, and serve
 * spot-checked curves, files and spectra bit-identical. Every
 * fourth round the clients finish first and the running service answers a search just before the kill: the
 * restarted service, whose store is rebuilt from the file, must give the very same answer, so the store the
 * running service kept up to date import by import agrees with a fresh rebuild.
 *
 * <p>Run by the {@code crash} profile ({@code mvn -B -Pcrash test -pl backend -am}); switches
 * {@code -Dsieve.crash.rounds=20}, {@code -Dsieve.crash.seed=N} (printed on every run, to replay the same
 * choices; the threads' interleaving and the kill's exact moment still vary) and
 * {@code -Dsieve.crash.writeDelay=500} (starts the service with H2's old write delay, to show the test
 * catching the loss), {@code -Dsieve.crash.db=postgres} (the service on PostgreSQL instead, in an empty schema of
 * the database {@code SIEVE_TEST_POSTGRES_URL} names; the killed process is the application, the database server
 * lives on and is checked as it stands after each kill). Prints {@code BENCH crash db=… rounds=… acknowledged=…
 * lost=… partial=…}.
 */
@Tag("crash")
class AnsweredImportsSurviveKillTest {

    private static final String ALL_PASS = "passes over 1% at 600 nm";
    private static final int SEARCH_LIMIT = 500;
    private static final int SINGLE_OPS_PER_ROUND = 6;
    private static final int BATCHES_PER_ROUND = 3;
    /**
     * The kill comes after a random number of answered imports and then a random pause, so that it falls
     * at a random point of the request stream whatever the machine's speed (a cold JVM on a loaded machine
     * can take seconds over its first import, a fixed clock would then kill before anything was answered).
     */
    private static final int MAX_ANSWERS_BEFORE_KILL = 8;
    private static final int MAX_KILL_PAUSE_MS = 250;

    @TempDir
    Path work;

    private final List<String> problems = new CopyOnWriteArrayList<>();

    @Test
    void everyAcknowledgedImportSurvivesSigkillWholeAndUnderItsOwnId() throws Exception {
        int rounds = Integer.getInteger("sieve.crash.rounds", 20);
        long seed = Long.getLong("sieve.crash.seed", System.nanoTime());
        String writeDelay = System.getProperty("sieve.crash.writeDelay", "");
        String database = System.getProperty("sieve.crash.db", "h2");
        boolean postgres = database.equals("postgres");
        if (postgres) {
            assumeTrue(System.getenv(TestPostgres.URL_VARIABLE) != null && !System.getenv(TestPostgres.URL_VARIABLE).isBlank(),
                    "-Dsieve.crash.db=postgres needs a PostgreSQL database named by " + TestPostgres.URL_VARIABLE);
        }
        System.out.println("crash test: db=" + database + " seed=" + seed + " rounds=" + rounds + " write_delay="
                + (writeDelay.isBlank() ? "default-url" : writeDelay) + " (replay with -Dsieve.crash.seed=" + seed + ")");
        // on PostgreSQL an empty schema of its own, which the database server keeps across the kills
        String postgresUrl = postgres ? TestPostgres.freshSchema("crash") : null;
        List<String> extraArgs = postgres ? ServerProcess.postgresArguments(postgresUrl, TestPostgres.user(), TestPostgres.password())
                : writeDelay.isBlank() ? List.of()
                : List.of("--spring.datasource.url=jdbc:h2:file:./data/sieve;AUTO_SERVER=FALSE;WRITE_DELAY=" + writeDelay);

        String token = null;
        Random random = new Random(seed);
        Answered answered = new Answered();
        AtomicInteger names = new AtomicInteger();
        Path log = work.resolve("server.log");
        Counts lastCounts = new Counts(0, 0, 0, 0, 0);
        Set<String> lost = new TreeSet<>();
        Set<String> partial = new TreeSet<>();
        int unanswered = 0;
        JsonNode searchBeforeKill = null;
        List<Double> singleMs = new ArrayList<>();
        List<Double> batchFileMs = new ArrayList<>();
        List<Double> startMs = new ArrayList<>();

        for (int round = 0; round <= rounds; round++) {
            long t0 = System.nanoTime();
            try (ServerProcess server = ServerProcess.start(work, log, extraArgs)) {
                startMs.add((System.nanoTime() - t0) / 1e6);
                if (postgres) {
                    // server mode (the postgres profile): an admin's token, made once the first start has migrated
                    token = token != null ? token : TestTokens.adminToken(postgresUrl, TestPostgres.user(), TestPostgres.password());
                    server.signRequestsWith(token);
                }
                CrashClient client = new CrashClient(server, answered, names, round);
                if (round > 0) {
                    checkRestarted(client, answered, lastCounts, lost, searchBeforeKill, random);
                }
                if (round == rounds) {
                    break; // the last start only checks the last crash
                }
                answered.newRound();
                boolean quiet = round % 4 == 3;
                searchBeforeKill = runAndKill(server, client, random, quiet);
                unanswered += client.unanswered.get();
                singleMs.addAll(client.singleMs);
                batchFileMs.addAll(client.batchFileMs);
            }
            Findings f = postgres ? CrashedFileCheck.checkPostgres(postgresUrl, TestPostgres.user(), TestPostgres.password(), answered)
                    : CrashedFileCheck.check(copyOfCrashedFile(round), answered);
            if (f.counts().below(lastCounts)) {
                problems.add("round " + round + ": counts fell from " + lastCounts + " to " + f.counts());
            }
            lastCounts = f.counts();
            int crashed = round;
            f.lost().forEach((key, detail) -> {
                if (lost.add(key)) { // each lost import is counted and told once, in the round it went missing
                    problems.add("round " + crashed + ": " + detail);
                }
            });
            f.partial().stream().filter(partial::add).forEach(p -> problems.add("round " + crashed + ": partial: " + p));
        }

        List<String> reused = answered.reused();
        problems.addAll(reused);
        System.out.printf(Locale.ROOT, "BENCH crash db=%s rounds=%d acknowledged=%d lost=%d partial=%d reused=%d unanswered=%d"
                        + " samples=%d spectra=%d write_delay=%s single_import_p50_ms=%.1f batch_file_p50_ms=%.1f"
                        + " start_p50_ms=%.0f seed=%d%n",
                database, rounds, answered.count(), lost.size(), partial.size(), reused.size(), unanswered, answered.samples().size(),
                answered.spectra().size(), postgres ? "n/a" : writeDelay.isBlank() ? "default-url" : writeDelay, median(singleMs),
                median(batchFileMs), median(startMs), seed);
        problems.stream().limit(30).forEach(p -> System.out.println("  " + p));

        assertThat(answered.count()).as("the rounds acknowledged imports to check").isGreaterThan(rounds);
        assertThat(problems).as("lost, partial or reused after SIGKILL (seed " + seed + ")").isEmpty();
    }

    /** Two clients import until the kill; a quiet round lets them finish and keeps a search from just before it. */
    private JsonNode runAndKill(ServerProcess server, CrashClient client, Random random, boolean quiet)
            throws InterruptedException {
        AtomicBoolean stop = new AtomicBoolean();
        client.answeredRequests.set(0); // count this round's imports only, not the checks before them
        Random singles = new Random(random.nextLong());
        Random batches = new Random(random.nextLong());
        int killAfterAnswers = random.nextInt(MAX_ANSWERS_BEFORE_KILL + 1);
        int killPauseMs = random.nextInt(MAX_KILL_PAUSE_MS + 1);
        Thread a = worker("singles", () -> {
            for (int i = 0; i < SINGLE_OPS_PER_ROUND && !stop.get(); i++) {
                if (singles.nextInt(3) == 0) {
                    client.spectrumImport(singles);
                } else {
                    client.singleImport(singles);
                }
            }
        });
        Thread b = worker("batches", () -> {
            for (int i = 0; i < BATCHES_PER_ROUND && !stop.get(); i++) {
                client.batchImport(batches);
            }
        });
        JsonNode search = null;
        if (quiet) {
            a.join();
            b.join();
            search = client.search(ALL_PASS, SEARCH_LIMIT);
        } else {
            while (client.answeredRequests.get() < killAfterAnswers && (a.isAlive() || b.isAlive())) {
                Thread.sleep(2);
            }
            Thread.sleep(killPauseMs);
        }
        stop.set(true);
        server.kill();
        a.join();
        b.join();
        return search;
    }

    private interface Work {
        void run() throws InterruptedException;
    }

    private Thread worker(String name, Work work) {
        Thread t = new Thread(() -> {
            try {
                work.run();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            } catch (RuntimeException e) {
                problems.add(name + ": " + e.getMessage());
            }
        }, "crash-" + name);
        t.start();
        return t;
    }

    /** What the restarted service answers must agree with the crashed file and with what was acknowledged. */
    private void checkRestarted(CrashClient client, Answered answered, Counts counts, Set<String> lost,
                                JsonNode searchBeforeKill, Random random) throws Exception {
        JsonNode materials = client.get("/api/materials");
        if (materials.size() != counts.materials()) {
            problems.add("the restarted service lists " + materials.size() + " materials, the file holds " + counts.materials());
        }
        // the search ranks one row per material (its best sample) and counts every sample its store judged
        JsonNode search = client.search(ALL_PASS, SEARCH_LIMIT);
        if (search.path("evaluatedSamples").asLong() != counts.samples()) {
            problems.add("the restarted service's store judged " + search.path("evaluatedSamples").asLong()
                    + " samples, the file holds " + counts.samples());
        }
        Set<Long> found = new HashSet<>();
        search.path("results").forEach(row -> found.add(row.path("materialId").asLong()));
        if (found.size() != Math.min(SEARCH_LIMIT, counts.materials())) {
            problems.add("the search after restart shows " + found.size() + " materials, the file holds " + counts.materials());
        }
        if (counts.materials() <= SEARCH_LIMIT) {
            answered.samples().stream()
                    .filter(s -> !found.contains(s.materialId()) && !lost.contains("sample:" + s.sampleId()))
                    .map(Answered.Sample::materialId).distinct()
                    .forEach(id -> problems.add("acknowledged material " + id + " is stored but not found by search"));
        }
        if (searchBeforeKill != null && !withoutTiming(search).equals(withoutTiming(searchBeforeKill))) {
            problems.add("the search answered just before the kill differs from the one after restart: "
                    + searchBeforeKill.path("results").size() + " rows before, " + search.path("results").size()
                    + " after; judged " + searchBeforeKill.path("evaluatedSamples").asLong() + " before, "
                    + search.path("evaluatedSamples").asLong() + " after");
        }
        spotCheck(client, answered, lost, random);
    }

    /** A few acknowledged imports read back through the API, bit for bit. */
    private void spotCheck(CrashClient client, Answered answered, Set<String> lost, Random random) throws Exception {
        List<Answered.Sample> samples = new ArrayList<>(answered.samples());
        samples.sort(Comparator.comparingLong(Answered.Sample::sampleId));
        for (int i = 0; i < 4 && !samples.isEmpty(); i++) {
            Answered.Sample s = samples.get(random.nextInt(samples.size()));
            if (lost.contains("sample:" + s.sampleId())) {
                continue;
            }
            JsonNode curve = client.get("/api/samples/" + s.sampleId() + "/curve");
            String problem = CrashedFileCheck.pointsProblem(s.file(), doubles(curve.path("wavelengthsNm")),
                    doubles(curve.path("transmittance")));
            HttpResponse<byte[]> file = client.getBytes("/api/samples/" + s.sampleId() + "/source-file");
            if (problem == null && (!Arrays.equals(file.body(), s.file().bytes())
                    || !file.headers().firstValue("X-Checksum-SHA256").orElse("").equals(s.file().sha256()))) {
                problem = "its source file differs";
            }
            if (problem != null) {
                problems.add("the restarted service serves sample " + s.sampleId() + " (" + s.file().name() + "): " + problem);
            }
        }
        List<Answered.Spectrum> spectra = new ArrayList<>(answered.spectra());
        spectra.sort(Comparator.comparing(Answered.Spectrum::name));
        for (int i = 0; i < 2 && !spectra.isEmpty(); i++) {
            Answered.Spectrum s = spectra.get(random.nextInt(spectra.size()));
            if (lost.contains(s.kind() + "/" + s.name())) {
                continue;
            }
            JsonNode points = client.get("/api/" + s.kind() + "s/" + s.name() + "/points");
            String problem = CrashedFileCheck.pointsProblem(s.file(), doubles(points.path("wavelengthsNm")),
                    doubles(points.path("values")));
            if (problem != null) {
                problems.add("the restarted service serves " + s.kind() + " " + s.name() + ": " + problem);
            }
        }
    }

    /** The crashed database file, copied before anything opens it again; returned without H2's extension. */
    private Path copyOfCrashedFile(int round) throws IOException {
        Path target = work.resolve("crashed-" + round);
        Files.createDirectories(target);
        Path data = work.resolve("data");
        try (Stream<Path> files = Files.list(data)) {
            for (Path f : files.filter(p -> p.getFileName().toString().endsWith(".mv.db")).toList()) {
                Files.copy(f, target.resolve(f.getFileName()), StandardCopyOption.REPLACE_EXISTING);
            }
        }
        return target.resolve("sieve");
    }

    private static JsonNode withoutTiming(JsonNode search) {
        ObjectNode copy = ((ObjectNode) search).deepCopy();
        copy.remove("tookMs");
        copy.remove("libraryGeneration"); // a counter every write raises, not part of the answer
        return copy;
    }

    private static double[] doubles(JsonNode array) {
        double[] values = new double[array.size()];
        for (int i = 0; i < values.length; i++) {
            values[i] = array.get(i).asDouble();
        }
        return values;
    }

    private static double median(List<Double> values) {
        if (values.isEmpty()) {
            return Double.NaN;
        }
        List<Double> sorted = values.stream().sorted().toList();
        return sorted.get(sorted.size() / 2);
    }
}
