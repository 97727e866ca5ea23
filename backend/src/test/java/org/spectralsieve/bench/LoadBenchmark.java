package org.spectralsieve.bench;

import static org.spectralsieve.bench.BenchStats.ms;
import static org.spectralsieve.bench.BenchStats.percentile;

import java.io.ByteArrayOutputStream;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.Collections;
import java.util.EnumMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Random;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ConcurrentLinkedQueue;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.Test;
import org.spectralsieve.SpectralSieveApplication;
import org.spectralsieve.accounts.Account;
import org.spectralsieve.accounts.AccountAdministration;
import org.spectralsieve.accounts.Role;
import org.spectralsieve.ingest.Checksums;
import org.spectralsieve.search.JudgementMemo;
import org.spectralsieve.search.SearchService;
import org.springframework.boot.builder.SpringApplicationBuilder;
import org.springframework.context.ConfigurableApplicationContext;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Load benchmark (run by {@code mvn -B -q -Pbench -pl backend -am verify}; not part of the test suite):
 * the real service on loopback over an H2 file database holding the illustrative demo library, 50
 * concurrent clients sending a fixed number of requests of a fixed mix (searches of several kinds, material
 * and curve reads, weighted figures, imports). The plan is sent twice: the {@code cold} pass from the
 * service's first timed request (what issue 14's row is judged on), then the same plan again, {@code warm}.
 * Each pass prints {@code BENCH load pass=<p> clients=<c> requests=<n> errors=<e> ...}, per request kind
 * {@code BENCH load-kind pass=<p> kind=<k> count p50_ms p95_ms p99_ms max_ms}, and per quarter of the pass
 * {@code BENCH load-phase} with the CPU seconds of the JIT, the collector, the request threads and the
 * benchmark's own clients ({@link ThreadCpu}).
 *
 * <p>An error is any answer other than the one the request must get (2xx; every request was tried once
 * before the run, so a 4xx is a fault too) or a failed connection; 5xx are counted apart. After the run
 * every import the server acknowledged (201) is read back, its original bytes by checksum and its curve,
 * then again after the service was stopped and started on the same database; a missing one is
 * {@code lost} ({@code BENCH load-live}, {@code BENCH load-restart}). Nothing here asserts a time; the
 * benchmark fails only when answers are wrong.
 *
 * <p>Switches: {@code -Dbench.loadRequests=2000} (per pass), {@code -Dbench.loadClients=50},
 * {@code -Dbench.loadPasses=2} (1: the cold pass alone), {@code -Dbench.loadVaried=true} (each search's thresholds
 * drawn per request from a seeded set of 200 values per number, so few questions repeat: what a memo of
 * judgements cannot help), {@code -Dsieve.search.judgement-memo=false} (the service judges every sample afresh;
 * {@code BENCH load-memo} prints the memo's hits and misses of each pass when it is on),
 * {@code -Dsieve.json.fast-doubles=false} (answers' doubles written by {@code Double.toString}, the way before),
 * {@code -Dbench.loadMode=server} (server mode: every request carries an editor's API token, and the pass line
 * reads {@code BENCH load mode=server auth=token pass=…}; docs/accounts-and-roles.md).
 */
class LoadBenchmark {

    private static final JsonMapper JSON = JsonMapper.builder().build();

    /** In server mode ({@code -Dbench.loadMode=server}): an editor's API token sent with every request. */
    private static volatile String bearer;

    /** {@code -Dbench.loadMode=server}: the service in server mode, every request with a bearer token. */
    private static boolean serverMode() {
        return "server".equals(System.getProperty("bench.loadMode"));
    }

    /** A request to the service, with the token in server mode (its check is part of what is measured). */
    private static HttpRequest.Builder withToken(URI uri) {
        HttpRequest.Builder builder = HttpRequest.newBuilder(uri);
        return bearer == null ? builder : builder.header("Authorization", "Bearer " + bearer);
    }

    enum Kind {
        SEARCH_FIXED(14), SEARCH_THICKNESS(8), SEARCH_WEIGHTED(6), SEARCH_BEHIND(4),
        MATERIALS(10), MATERIAL(12), CURVE(14), CURVE_RESCALED(8), FIGURES(10), FIGURES_RESCALED(4), IMPORT(10);

        final int weight;

        Kind(int weight) {
            this.weight = weight;
        }

        String label() {
            return name().toLowerCase(Locale.ROOT).replace('_', '-');
        }
    }

    private static final Map<Kind, String> REQUIREMENTS = Map.of(
            Kind.SEARCH_FIXED, "passes over 80% at 365 nm and blocks under 1% at 405 nm",
            Kind.SEARCH_THICKNESS, "passes over 80% at 365 nm and blocks under 1% at 405 nm, thickness 1 to 6 mm",
            Kind.SEARCH_WEIGHTED, "passes over 85% of led 365 and uv hazard under 0.1% and luminous over 70%",
            Kind.SEARCH_BEHIND, "blocks under 1% at 405 nm and luminous over 70%, behind 4 mm clear float glass");

    /**
     * @param startMs when the request was sent, from the start of the run
     * @param judged  a search's {@code judgedExactly} (samples the exact judgement judged), -1 for other kinds
     */
    private record Outcome(Kind kind, int status, double ms, String failure, double startMs, int judged) {

        boolean search() {
            return kind.ordinal() <= Kind.SEARCH_BEHIND.ordinal();
        }
    }

    private static final java.util.regex.Pattern JUDGED = java.util.regex.Pattern.compile("\"judgedExactly\"\\s*:\\s*(\\d+)");

    /** The fixed requirement of a search kind (also {@link JudgementMemoBenchmark}'s). */
    static String requirementOf(Kind kind) {
        return REQUIREMENTS.get(kind);
    }

    /** A search answer's {@code judgedExactly}, read without parsing the whole answer (the client shares the cores). */
    private static int judged(Kind kind, String body) {
        if (kind.ordinal() > Kind.SEARCH_BEHIND.ordinal()) {
            return -1;
        }
        java.util.regex.Matcher m = JUDGED.matcher(body);
        return m.find() ? Integer.parseInt(m.group(1)) : -1;
    }

    /**
     * The four requirements with their numbers drawn per request from a seeded set of 200 values each (pass and
     * weighted-pass thresholds 60.00–89.85 %, block thresholds 0.500–1.495 %, the safety threshold 0.0500–0.1495 %),
     * picked by a seeded hash of the request's number: the same plan sends the same texts every run, and one
     * text comes back about once in 200 searches of its kind.
     */
    static final class Varied {
        private static final int VALUES = 200;
        private static final int[] ORDER = shuffled(new Random(20261205L));

        private static int[] shuffled(Random random) {
            List<Integer> order = new ArrayList<>();
            for (int v = 0; v < VALUES; v++) {
                order.add(v);
            }
            Collections.shuffle(order, random);
            return order.stream().mapToInt(Integer::intValue).toArray();
        }

        /** The v-th value of the set, drawn for request i and number n of its text. */
        private static int draw(int i, int n) {
            return ORDER[Math.floorMod(i * 7907 + n * 104_729, VALUES)];
        }

        private static String pass(int i, int n) {
            return String.format(Locale.ROOT, "%.2f%%", 60 + 0.15 * draw(i, n));
        }

        private static String block(int i, int n) {
            return String.format(Locale.ROOT, "%.3f%%", 0.5 + 0.005 * draw(i, n));
        }

        static String requirement(Kind kind, int i) {
            return switch (kind) {
                case SEARCH_FIXED -> "passes over " + pass(i, 0) + " at 365 nm and blocks under " + block(i, 1) + " at 405 nm";
                case SEARCH_THICKNESS -> "passes over " + pass(i, 0) + " at 365 nm and blocks under " + block(i, 1)
                        + " at 405 nm, thickness 1 to 6 mm";
                case SEARCH_WEIGHTED -> "passes over " + pass(i, 0) + " of led 365 and uv hazard under "
                        + String.format(Locale.ROOT, "%.4f%%", 0.05 + 0.0005 * draw(i, 1)) + " and luminous over " + pass(i, 2);
                case SEARCH_BEHIND -> "blocks under " + block(i, 0) + " at 405 nm and luminous over " + pass(i, 1)
                        + ", behind 4 mm clear float glass";
                default -> throw new IllegalArgumentException(kind + " is not a search");
            };
        }
    }

    /** An import the server answered 201 for: what was sent and the sample it names. */
    private record Acknowledged(long sampleId, String sha256) {
    }

    @Test
    void fiftyClientsMixingSearchesReadsFiguresAndImports() throws Exception {
        int requests = BenchStats.intProperty("bench.loadRequests", 2000);
        int clients = BenchStats.intProperty("bench.loadClients", 50);
        Path dir = Files.createTempDirectory("sieve-load-bench");
        String dbUrl = "jdbc:h2:file:" + dir.resolve("sieve").toAbsolutePath() + ";AUTO_SERVER=FALSE";
        HttpClient http = HttpClient.newBuilder().version(HttpClient.Version.HTTP_1_1)
                .connectTimeout(Duration.ofSeconds(30)).build();

        List<Acknowledged> acknowledged = Collections.synchronizedList(new ArrayList<>());
        List<Outcome> outcomes = new ArrayList<>();
        try (ConfigurableApplicationContext app = start(dbUrl)) {
            String base = "http://127.0.0.1:" + app.getEnvironment().getProperty("local.server.port");
            if (serverMode()) {
                // an editor may import; the token stays valid across the restart below (same database)
                AccountAdministration accounts = app.getBean(AccountAdministration.class);
                Account editor = accounts.createAccount("fernhollow-load", Role.EDITOR, "larkspur-lane-bench-7");
                bearer = accounts.createToken(editor, "load benchmark").secret();
            }
            Library library = Library.prepare(http, base);
            Kind[] plan = plan(requests, new Random(20261203L));
            SearchService service = app.getBean(SearchService.class);
            for (int pass = 0; pass < passes(); pass++) {
                // the cold pass starts with the service's first timed request; a warm pass sends the same plan
                // again to the service the passes before it warmed (new import files: none is a duplicate)
                Pass run = Pass.of(pass);
                Optional<JudgementMemo.Counts> before = service.judgementMemoCounts();
                List<Outcome> these = run(http, base, library, plan, clients, pass * requests, acknowledged, run);
                outcomes.addAll(these);
                memoLine(run, before, service.judgementMemoCounts());
            }
            int lostLive = lost(http, base, acknowledged);
            System.out.printf("BENCH load-live acknowledged=%d lost=%d%n", acknowledged.size(), lostLive);
        }
        // the same database after a clean stop and start: acknowledged imports are still there
        try (ConfigurableApplicationContext again = start(dbUrl)) {
            String base = "http://127.0.0.1:" + again.getEnvironment().getProperty("local.server.port");
            int lostRestart = lost(http, base, acknowledged);
            System.out.printf("BENCH load-restart acknowledged=%d lost=%d%n", acknowledged.size(), lostRestart);
            if (lostRestart > 0) {
                throw new IllegalStateException(lostRestart + " acknowledged imports missing after restart");
            }
        }
        long serverErrors = outcomes.stream().filter(o -> o.status() >= 500).count();
        if (serverErrors > 0) {
            throw new IllegalStateException(serverErrors + " answers were 5xx; see the BENCH load-failure lines");
        }
    }

    /**
     * Which pass of the plan a line reports: {@code cold} from the service's first timed request (JIT, first
     * rebuilds and all; the figure issue 14's row is judged on), {@code warm} the same plan sent again right
     * after. The warm figure is printed beside the cold one, never instead of it.
     */
    enum Pass {
        COLD, WARM;

        static Pass of(int index) {
            return index == 0 ? COLD : WARM;
        }

        String label() {
            return name().toLowerCase(Locale.ROOT);
        }
    }

    /** The memo's hits and misses during the pass, its entries and questions at the end ({@code memo=off}: none kept). */
    private static void memoLine(Pass pass, Optional<JudgementMemo.Counts> before, Optional<JudgementMemo.Counts> after) {
        if (after.isEmpty() || before.isEmpty()) {
            System.out.printf("BENCH load-memo pass=%s memo=off requirements=%s%n", pass.label(), varied() ? "varied" : "fixed");
            return;
        }
        long hits = after.get().hits() - before.get().hits();
        long misses = after.get().misses() - before.get().misses();
        long unkept = after.get().unkept() - before.get().unkept();
        long all = hits + misses + unkept;
        System.out.printf(Locale.ROOT, "BENCH load-memo pass=%s memo=on requirements=%s hits=%d misses=%d unkept=%d"
                        + " hit_rate=%.3f entries=%d max_entries=%d questions=%d%n", pass.label(), varied() ? "varied" : "fixed",
                hits, misses, unkept, all == 0 ? 0.0 : (double) hits / all, after.get().entries(),
                after.get().maxEntries(), after.get().questions());
    }

    /** {@code -Dbench.loadVaried=true}: each search's numbers drawn per request from a seeded set (see {@link Varied}). */
    private static boolean varied() {
        return Boolean.getBoolean("bench.loadVaried");
    }

    /** {@code -Dbench.loadPasses}: 1 the cold pass alone, 2 (default) cold then warm. */
    private static int passes() {
        return Math.max(1, BenchStats.intProperty("bench.loadPasses", 2));
    }

    /** One pass of the plan by {@code clients} closed-loop clients; prints its lines and returns its outcomes. */
    private static List<Outcome> run(HttpClient http, String base, Library library, Kind[] plan, int clients, int offset,
                                     List<Acknowledged> acknowledged, Pass pass) throws Exception {
        AtomicInteger next = new AtomicInteger();
        ConcurrentLinkedQueue<Outcome> done = new ConcurrentLinkedQueue<>();
        ExecutorService pool = Executors.newFixedThreadPool(clients);
        long t0 = System.nanoTime();
        long wallNanos;
        try (ThreadCpu.Recorder cpu = new ThreadCpu.Recorder(t0, 100)) {
            for (int c = 0; c < clients; c++) {
                pool.submit(() -> {
                    for (int i = next.getAndIncrement(); i < plan.length; i = next.getAndIncrement()) {
                        done.add(send(http, base, library, plan[i], offset + i, acknowledged, t0));
                    }
                });
            }
            pool.shutdown();
            if (!pool.awaitTermination(2, TimeUnit.HOURS)) {
                throw new IllegalStateException("load run did not finish in 2 hours");
            }
            wallNanos = System.nanoTime() - t0;
            List<Outcome> outcomes = new ArrayList<>(done);
            report(clients, outcomes, wallNanos, pass);
            phases(outcomes, cpu, pass);
            return outcomes;
        }
    }

    private static ConfigurableApplicationContext start(String dbUrl) {
        return new SpringApplicationBuilder(SpectralSieveApplication.class).run(
                "--server.port=0", "--server.address=127.0.0.1", "--spring.datasource.url=" + dbUrl,
                "--logging.level.root=WARN", "--sieve.search.judgement-lanes=" + judgementLanes(),
                "--sieve.server-mode=" + serverMode());
    }

    /** The switch {@code -Dbench.judgementLanes}: -1 the service's default (one per core), 0 no bound. */
    private static int judgementLanes() {
        return BenchStats.intProperty("bench.judgementLanes", -1);
    }

    /** The kinds in a fixed, shuffled order with the weights' shares: every run sends the same mix. */
    private static Kind[] plan(int requests, Random random) {
        int total = 0;
        for (Kind k : Kind.values()) {
            total += k.weight;
        }
        List<Kind> plan = new ArrayList<>(requests);
        for (Kind k : Kind.values()) {
            int n = (int) Math.round((double) requests * k.weight / total);
            for (int i = 0; i < n; i++) {
                plan.add(k);
            }
        }
        while (plan.size() < requests) {
            plan.add(Kind.MATERIAL);
        }
        Collections.shuffle(plan, random);
        return plan.subList(0, requests).toArray(Kind[]::new);
    }

    private static Outcome send(HttpClient http, String base, Library library, Kind kind, int i,
                                List<Acknowledged> acknowledged, long runStart) {
        long t0 = System.nanoTime();
        double startMs = (t0 - runStart) / 1e6;
        try {
            HttpRequest request = library.request(base, kind, i);
            HttpResponse<String> response = http.send(request, HttpResponse.BodyHandlers.ofString());
            double ms = (System.nanoTime() - t0) / 1e6;
            int status = response.statusCode();
            boolean expected = kind == Kind.IMPORT ? status == 201 : status == 200;
            if (kind == Kind.IMPORT && status == 201) {
                acknowledged.add(new Acknowledged(JSON.readTree(response.body()).path("sampleId").asLong(),
                        Checksums.sha256(Library.importFile(i))));
            }
            return new Outcome(kind, status, ms, expected ? null : abbreviate(response.body()), startMs,
                    judged(kind, response.body()));
        } catch (Exception e) {
            return new Outcome(kind, -1, (System.nanoTime() - t0) / 1e6, e.toString(), startMs, -1);
        }
    }

    /** Acknowledged imports whose original bytes or curve cannot be read back. */
    private static int lost(HttpClient http, String base, List<Acknowledged> acknowledged) throws Exception {
        int lost = 0;
        for (Acknowledged a : List.copyOf(acknowledged)) {
            HttpResponse<byte[]> file = http.send(withToken(URI.create(base + "/api/samples/" + a.sampleId()
                    + "/source-file")).build(), HttpResponse.BodyHandlers.ofByteArray());
            HttpResponse<String> curve = http.send(withToken(URI.create(base + "/api/samples/" + a.sampleId()
                    + "/curve")).build(), HttpResponse.BodyHandlers.ofString());
            if (file.statusCode() != 200 || !Checksums.sha256(file.body()).equals(a.sha256()) || curve.statusCode() != 200) {
                lost++;
            }
        }
        return lost;
    }

    /**
     * The pass's lines: {@code BENCH load} (errors, throughput) and {@code BENCH load-kind} per kind, each with
     * {@code pass=cold|warm}; the first failures.
     */
    private static void report(int clients, List<Outcome> outcomes, long wallNanos, Pass pass) {
        long acknowledged = outcomes.stream().filter(o -> o.kind() == Kind.IMPORT && o.status() == 201).count();
        long errors = outcomes.stream().filter(o -> o.failure() != null).count();
        long serverErrors = outcomes.stream().filter(o -> o.status() >= 500).count();
        System.out.printf(Locale.ROOT, "BENCH load " + (serverMode() ? "mode=server auth=token " : "")
                        + "pass=%s clients=%d requests=%d errors=%d server_errors=%d"
                        + " imports_acknowledged=%d wall_s=%.1f throughput_per_s=%.1f judgement_lanes=%d judgement_memo=%s"
                        + " requirements=%s json_fast_doubles=%s%n", pass.label(),
                clients, outcomes.size(), errors, serverErrors, acknowledged, wallNanos / 1e9,
                outcomes.size() / (wallNanos / 1e9), judgementLanes(),
                "false".equals(System.getProperty("sieve.search.judgement-memo")) ? "off" : "on",
                varied() ? "varied" : "fixed",
                "false".equals(System.getProperty("sieve.json.fast-doubles")) ? "off" : "on");
        Map<Kind, List<Double>> byKind = new EnumMap<>(Kind.class);
        for (Outcome o : outcomes) {
            byKind.computeIfAbsent(o.kind(), k -> new ArrayList<>()).add(o.ms());
        }
        byKind.forEach((kind, times) -> {
            double[] t = times.stream().mapToDouble(Double::doubleValue).toArray();
            double judged = outcomes.stream().filter(o -> o.kind() == kind && o.judged() >= 0).mapToInt(Outcome::judged)
                    .average().orElse(Double.NaN);
            System.out.printf(Locale.ROOT, "BENCH load-kind pass=%s kind=%s count=%d p50_ms=%s p95_ms=%s p99_ms=%s max_ms=%s%s%n",
                    pass.label(), kind.label(), t.length, ms(percentile(t, 50)), ms(percentile(t, 95)),
                    ms(percentile(t, 99)), ms(percentile(t, 100)),
                    Double.isNaN(judged) ? "" : String.format(Locale.ROOT, " judged_mean=%.1f", judged));
        });
        outcomes.stream().filter(o -> o.failure() != null).limit(10).forEach(o -> System.out.printf(
                "BENCH load-failure pass=%s kind=%s status=%d %s%n", pass.label(), o.kind().label(), o.status(), o.failure()));
    }

    /**
     * Searches and the other kinds by quarter of the pass (by when each was sent), with the CPU each group of
     * threads used in that quarter ({@link ThreadCpu}: the JIT's compilers, the collector, the service's request
     * threads, the benchmark's clients): a tail made in the first quarter alone, with the compilers busy, is the
     * service warming up on the same two cores, not its steady state.
     */
    private static void phases(List<Outcome> outcomes, ThreadCpu.Recorder cpu, Pass pass) {
        double end = outcomes.stream().mapToDouble(Outcome::startMs).max().orElse(0) + 1e-9;
        for (int q = 0; q < 4; q++) {
            double from = end * q / 4;
            double to = end * (q + 1) / 4;
            List<Outcome> in = outcomes.stream().filter(o -> o.startMs() >= from && o.startMs() < to).toList();
            double[] searches = in.stream().filter(Outcome::search).mapToDouble(Outcome::ms).toArray();
            double[] others = in.stream().filter(o -> !o.search()).mapToDouble(Outcome::ms).toArray();
            double judged = in.stream().filter(o -> o.judged() >= 0).mapToInt(Outcome::judged).average().orElse(0);
            if (searches.length > 0 && others.length > 0) {
                Map<ThreadCpu.Group, Double> used = ThreadCpu.between(cpu.nearest(from), cpu.nearest(to));
                StringBuilder cpuFields = new StringBuilder();
                used.forEach((g, s) -> cpuFields.append(String.format(Locale.ROOT, " cpu_%s_s=%.2f", g.label(), s)));
                System.out.printf(Locale.ROOT, "BENCH load-phase pass=%s quarter=%d wall_s=%.2f search_count=%d search_p50_ms=%s"
                                + " search_p99_ms=%s search_judged_mean=%.1f other_count=%d other_p50_ms=%s other_p99_ms=%s%s%n", pass.label(),
                        q + 1, (to - from) / 1e3, searches.length, ms(percentile(searches, 50)), ms(percentile(searches, 99)),
                        judged, others.length, ms(percentile(others, 50)), ms(percentile(others, 99)), cpuFields);
            }
        }
    }

    private static String abbreviate(String body) {
        String oneLine = body.replaceAll("\\s+", " ");
        return oneLine.length() > 300 ? oneLine.substring(0, 300) + "…" : oneLine;
    }

    /**
     * What the clients ask about: the demo library's samples (those that may be rescaled found by asking
     * once), and one illustrative material the imports add samples to.
     */
    private record Library(List<Long> materials, List<Long> samples, List<Long> rescalable, long importMaterial) {

        private static final String BOUNDARY = "----sieve-load-bench-3c1d";
        private static final int THICKNESS_STEPS = 9;
        private static final Map<Integer, byte[]> FILES = new ConcurrentHashMap<>();

        static Library prepare(HttpClient http, String base) throws Exception {
            JsonNode listing = JSON.readTree(get(http, base + "/api/materials"));
            List<Long> materials = new ArrayList<>();
            List<Long> samples = new ArrayList<>();
            for (JsonNode m : listing.path("materials").isMissingNode() ? listing : listing.path("materials")) {
                materials.add(m.path("id").asLong());
                for (JsonNode s : m.path("samples")) {
                    samples.add(s.path("id").asLong());
                }
            }
            List<Long> rescalable = new ArrayList<>();
            for (long s : samples) {
                if (rescalableToEveryThickness(http, base, s)
                        && status(http, base + "/api/samples/" + s + "/figures?thicknessMm=1.0&emitter=led-365") == 200
                        && status(http, base + "/api/samples/" + s + "/figures?emitter=led-365&response=actinic-uv") == 200) {
                    rescalable.add(s);
                }
            }
            if (materials.isEmpty() || rescalable.isEmpty()) {
                throw new IllegalStateException("demo library not loaded: " + materials.size() + " materials, "
                        + rescalable.size() + " rescalable samples");
            }
            // one new bulk material outside the timed run; the timed imports add samples to it
            HttpResponse<String> first = http.send(multipart(base, Map.of("materialName", "Illustrative load-test sheet",
                    "materialClass", "plastic sheet", "scaling", "bulk", "indexN", "1.49", "thicknessMm", "3"),
                    importFile(-1)), HttpResponse.BodyHandlers.ofString());
            if (first.statusCode() != 201) {
                throw new IllegalStateException("setup import refused: " + first.body());
            }
            long material = JSON.readTree(first.body()).path("materialId").asLong();
            for (Kind k : REQUIREMENTS.keySet()) {
                HttpResponse<String> r = http.send(search(base, k), HttpResponse.BodyHandlers.ofString());
                if (r.statusCode() != 200) {
                    throw new IllegalStateException(k + " requirement refused: " + r.body());
                }
            }
            return new Library(materials, samples, rescalable, material);
        }

        /** A fixed layer answers 200 at its measured thickness only, so every thickness the run asks for is tried. */
        private static boolean rescalableToEveryThickness(HttpClient http, String base, long sample) throws Exception {
            for (int k = 0; k < THICKNESS_STEPS; k++) {
                if (status(http, base + "/api/samples/" + sample + "/curve?thicknessMm=" + thicknessMm(k)) != 200) {
                    return false;
                }
            }
            return true;
        }

        /** 1 to 5 mm in steps of 0.5 mm. */
        private static double thicknessMm(int i) {
            return 1 + Math.floorMod(i, THICKNESS_STEPS) * 0.5;
        }

        HttpRequest request(String base, Kind kind, int i) {
            long sample = samples.get(Math.floorMod(i * 7919, samples.size()));
            long scalable = rescalable.get(Math.floorMod(i * 104729, rescalable.size()));
            double mm = thicknessMm(i);
            return switch (kind) {
                case SEARCH_FIXED, SEARCH_THICKNESS, SEARCH_WEIGHTED, SEARCH_BEHIND ->
                        search(base, varied() ? Varied.requirement(kind, i) : REQUIREMENTS.get(kind));
                case MATERIALS -> withToken(URI.create(base + "/api/materials")).build();
                case MATERIAL -> withToken(URI.create(base + "/api/materials/"
                        + materials.get(Math.floorMod(i * 31, materials.size())))).build();
                case CURVE -> withToken(URI.create(base + "/api/samples/" + sample + "/curve")).build();
                case CURVE_RESCALED -> withToken(URI.create(base + "/api/samples/" + scalable
                        + "/curve?thicknessMm=" + mm)).build();
                case FIGURES -> withToken(URI.create(base + "/api/samples/" + scalable
                        + "/figures?emitter=led-365&response=actinic-uv")).build();
                case FIGURES_RESCALED -> withToken(URI.create(base + "/api/samples/" + scalable
                        + "/figures?emitter=led-365&thicknessMm=" + mm)).build();
                case IMPORT -> multipart(base, Map.of("materialId", String.valueOf(importMaterial),
                        "thicknessMm", String.valueOf(mm)), importFile(i));
            };
        }

        private static HttpRequest search(String base, Kind kind) {
            return search(base, REQUIREMENTS.get(kind));
        }

        private static HttpRequest search(String base, String requirement) {
            String body = "{\"requirement\": \"" + requirement + "\", \"limit\": 20}";
            return withToken(URI.create(base + "/api/search")).header("Content-Type", "application/json")
                    .POST(HttpRequest.BodyPublishers.ofString(body)).build();
        }

        /**
         * An invented sheet's curve, different for every request so that no import is a duplicate:
         * a logistic absorption edge near 370 nm with a 0.1 % detection floor, 250–800 nm every 2 nm.
         */
        static byte[] importFile(int i) {
            return FILES.computeIfAbsent(i, k -> {
                StringBuilder csv = new StringBuilder("# sample: illustrative load-test sheet, request " + k + "\n"
                        + "# detection_limit: 0.001\nwavelength_nm,transmittance\n");
                double edge = 360 + Math.floorMod(k, 20);
                for (int nm = 250; nm <= 800; nm += 2) {
                    double t = 0.001 + 0.9 / (1 + Math.exp(-(nm - edge) / 6.0));
                    csv.append(nm).append(',').append(String.format(Locale.ROOT, "%.6f", t)).append('\n');
                }
                return csv.toString().getBytes(StandardCharsets.UTF_8);
            });
        }

        private static HttpRequest multipart(String base, Map<String, String> fields, byte[] file) {
            ByteArrayOutputStream out = new ByteArrayOutputStream();
            fields.forEach((k, v) -> out.writeBytes(("--" + BOUNDARY + "\r\nContent-Disposition: form-data; name=\"" + k
                    + "\"\r\n\r\n" + v + "\r\n").getBytes(StandardCharsets.UTF_8)));
            out.writeBytes(("--" + BOUNDARY + "\r\nContent-Disposition: form-data; name=\"file\"; filename=\"load.csv\""
                    + "\r\nContent-Type: text/csv\r\n\r\n").getBytes(StandardCharsets.UTF_8));
            out.writeBytes(file);
            out.writeBytes(("\r\n--" + BOUNDARY + "--\r\n").getBytes(StandardCharsets.UTF_8));
            return withToken(URI.create(base + "/api/imports"))
                    .header("Content-Type", "multipart/form-data; boundary=" + BOUNDARY)
                    .POST(HttpRequest.BodyPublishers.ofByteArray(out.toByteArray())).build();
        }

        private static String get(HttpClient http, String url) throws Exception {
            HttpResponse<String> r = http.send(withToken(URI.create(url)).build(),
                    HttpResponse.BodyHandlers.ofString());
            if (r.statusCode() != 200) {
                throw new IllegalStateException(url + " answered " + r.statusCode() + ": " + r.body());
            }
            return r.body();
        }

        private static int status(HttpClient http, String url) throws Exception {
            return http.send(withToken(URI.create(url)).build(), HttpResponse.BodyHandlers.discarding())
                    .statusCode();
        }
    }
}
