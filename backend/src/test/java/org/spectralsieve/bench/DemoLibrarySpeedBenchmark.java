package org.spectralsieve.bench;

import static org.spectralsieve.bench.BenchStats.ms;
import static org.spectralsieve.bench.BenchStats.percentile;

import java.io.IOException;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.Arrays;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.spectralsieve.SpectralSieveApplication;
import org.spectralsieve.requirement.CrossingFinder;
import org.spectralsieve.requirement.JudgementPath;
import org.springframework.boot.builder.SpringApplicationBuilder;
import org.springframework.context.ConfigurableApplicationContext;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * One search at a time on the demo library through the real service (issue 14's first two rows of targets):
 * Spring Boot and Tomcat on loopback over an H2 <em>file</em> database in a temporary folder, the illustrative
 * demo library loaded on first start, as {@code LoadBenchmark} runs it. After warm-up rounds (the first search
 * builds the store; the JIT needs a few more), each round sends one search of every kind in turn, so a noisy
 * neighbour hurts all kinds alike.
 *
 * <p>Prints {@code BENCH demo-search kind=<k> materials=<m> curves=<c> runs=<r> p50_ms p95_ms wall_p50_ms
 * wall_p95_ms judged evaluated rows}: {@code p50_ms}/{@code p95_ms} are the service's own {@code tookMs} (what
 * the targets are stated in), {@code wall_*} the client's time for the whole HTTP exchange (JSON, Tomcat,
 * loopback). Kinds: {@code plain-fixed} ({@link SearchBenchmark#REQUIREMENT}), {@code plain-solve} (the same
 * with {@code , thickness 1 to 6 mm}), {@code weighted-measured} ({@link WeightedScreenBenchmark#WEIGHTED}),
 * {@code weighted-solve} and {@code weighted-layer} ({@code , behind 4 mm clear float glass}). Asserts nothing
 * about time; fails only if a search is not answered 200. Switches: {@code -Dbench.demoRuns=31},
 * {@code -Dbench.demoWarmups=5}, {@code -Dbench.limit=20}; {@code -Dbench.demoPaths=true} also judges every
 * search the earlier way ({@link JudgementPath}) just before the default one, round by round, and prints
 * {@code BENCH demo-search-paths kind=<k> variant=earlier|formed-when-read …} for both side by side (the
 * {@code demo-search} lines stay those of the default way). {@code -Dbench.demoRoots=true} likewise runs every
 * search with the thickness solves by bisection ({@link CrossingFinder#useBisection}) just before the default
 * (ITP) and prints {@code BENCH demo-search-roots kind=<k> variant=bisection|itp …}.
 */
class DemoLibrarySpeedBenchmark {

    private static final JsonMapper JSON = JsonMapper.builder().build();

    static Map<String, String> kinds() {
        Map<String, String> kinds = new LinkedHashMap<>();
        kinds.put("plain-fixed", SearchBenchmark.REQUIREMENT);
        kinds.put("plain-solve", SearchBenchmark.REQUIREMENT + ", thickness 1 to 6 mm");
        kinds.put("weighted-measured", WeightedScreenBenchmark.WEIGHTED);
        kinds.put("weighted-solve", WeightedScreenBenchmark.WEIGHTED + ", thickness 1 to 6 mm");
        kinds.put("weighted-layer", WeightedScreenBenchmark.WEIGHTED + ", behind 4 mm clear float glass");
        return kinds;
    }

    private record Answer(double tookMs, double wallMs, int judged, int evaluated, int rows) {
    }

    @Test
    void oneSearchAtATimeOnTheDemoLibrary() throws Exception {
        int runs = BenchStats.intProperty("bench.demoRuns", 31);
        int warmups = BenchStats.intProperty("bench.demoWarmups", 5);
        int limit = BenchStats.intProperty("bench.limit", 20);
        boolean paths = Boolean.getBoolean("bench.demoPaths");
        boolean roots = Boolean.getBoolean("bench.demoRoots");
        Path dir = Files.createTempDirectory("sieve-demo-speed-bench");
        String dbUrl = "jdbc:h2:file:" + dir.resolve("sieve").toAbsolutePath() + ";AUTO_SERVER=FALSE";
        HttpClient http = HttpClient.newBuilder().version(HttpClient.Version.HTTP_1_1)
                .connectTimeout(Duration.ofSeconds(30)).build();
        Map<String, String> kinds = kinds();
        try (ConfigurableApplicationContext app = new SpringApplicationBuilder(SpectralSieveApplication.class).run(
                "--server.port=0", "--server.address=127.0.0.1", "--spring.datasource.url=" + dbUrl,
                "--sieve.index.dir=" + dir.resolve("index").toAbsolutePath(), "--logging.level.root=WARN")) {
            String base = "http://127.0.0.1:" + app.getEnvironment().getProperty("local.server.port");
            JsonNode materials = JSON.readTree(get(http, base + "/api/materials"));
            int curves = 0;
            for (JsonNode m : materials) {
                curves += m.path("samples").size();
            }
            for (int i = 0; i < warmups; i++) {
                for (String requirement : kinds.values()) {
                    if (paths) {
                        JudgementPath.useReference(true);
                        search(http, base, requirement, limit);
                        JudgementPath.useReference(false);
                    }
                    if (roots) {
                        CrossingFinder.useBisection(true);
                        search(http, base, requirement, limit);
                        CrossingFinder.useBisection(false);
                    }
                    search(http, base, requirement, limit);
                }
            }
            Map<String, Answer[]> answers = new LinkedHashMap<>();
            Map<String, Answer[]> earlier = new LinkedHashMap<>();
            Map<String, Answer[]> bisection = new LinkedHashMap<>();
            for (int i = 0; i < runs; i++) {
                for (Map.Entry<String, String> kind : kinds.entrySet()) {
                    if (paths) {
                        // the earlier judgement just before the default one, so both meet the same neighbours
                        JudgementPath.useReference(true);
                        earlier.computeIfAbsent(kind.getKey(), k -> new Answer[runs])[i] =
                                search(http, base, kind.getValue(), limit);
                        JudgementPath.useReference(false);
                    }
                    if (roots) {
                        // thickness solves by bisection just before the default (ITP), the same neighbours
                        CrossingFinder.useBisection(true);
                        bisection.computeIfAbsent(kind.getKey(), k -> new Answer[runs])[i] =
                                search(http, base, kind.getValue(), limit);
                        CrossingFinder.useBisection(false);
                    }
                    answers.computeIfAbsent(kind.getKey(), k -> new Answer[runs])[i] =
                            search(http, base, kind.getValue(), limit);
                }
            }
            if (paths) {
                print("demo-search-paths", "earlier", earlier, materials.size(), curves, runs);
                print("demo-search-paths", "formed-when-read", answers, materials.size(), curves, runs);
            }
            if (roots) {
                print("demo-search-roots", "bisection", bisection, materials.size(), curves, runs);
                print("demo-search-roots", "itp", answers, materials.size(), curves, runs);
            }
            print("demo-search", null, answers, materials.size(), curves, runs);
        } finally {
            JudgementPath.useReference(false);
            CrossingFinder.useBisection(false);
            delete(dir);
        }
    }

    private static void print(String key, String variant, Map<String, Answer[]> answers, int materials, int curves,
                              int runs) {
        {
            for (Map.Entry<String, Answer[]> e : answers.entrySet()) {
                Answer[] a = e.getValue();
                double[] took = Arrays.stream(a).mapToDouble(Answer::tookMs).toArray();
                double[] wall = Arrays.stream(a).mapToDouble(Answer::wallMs).toArray();
                Answer last = a[a.length - 1];
                System.out.printf(Locale.ROOT, "BENCH %s kind=%s%s materials=%d curves=%d runs=%d p50_ms=%s p95_ms=%s"
                                + " wall_p50_ms=%s wall_p95_ms=%s judged=%d evaluated=%d rows=%d load_average=%s judgement_memo=%s%n", key,
                        e.getKey(), variant == null ? "" : " variant=" + variant, materials, curves, runs,
                        ms(percentile(took, 50)), ms(percentile(took, 95)), ms(percentile(wall, 50)),
                        ms(percentile(wall, 95)), last.judged(), last.evaluated(), last.rows(), loadAverage(), memo());
            }
        }
    }

    /**
     * Whether the service remembers exact judgements ({@code search.JudgementMemo}): with it on, every run after the
     * first asks a question already asked, so p50 is a repeated question's time; {@code
     * -Dsieve.search.judgement-memo=false} gives a first ask's.
     */
    private static String memo() {
        return "false".equals(System.getProperty("sieve.search.judgement-memo")) ? "off" : "on";
    }

    /** The one-minute load average at printing (the machine is shared: say how busy it was). */
    private static String loadAverage() {
        double load = java.lang.management.ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage();
        return String.format(Locale.ROOT, "%.1f", load);
    }

    private static Answer search(HttpClient http, String base, String requirement, int limit) throws Exception {
        String body = JSON.writeValueAsString(Map.of("requirement", requirement, "limit", limit));
        long t0 = System.nanoTime();
        HttpResponse<String> response = http.send(HttpRequest.newBuilder(URI.create(base + "/api/search"))
                .header("Content-Type", "application/json").POST(HttpRequest.BodyPublishers.ofString(body)).build(),
                HttpResponse.BodyHandlers.ofString());
        double wallMs = (System.nanoTime() - t0) / 1e6;
        if (response.statusCode() != 200) {
            throw new IllegalStateException("search '" + requirement + "' answered " + response.statusCode() + ": "
                    + response.body());
        }
        JsonNode answer = JSON.readTree(response.body());
        return new Answer(answer.path("tookMs").asDouble(), wallMs, answer.path("judgedExactly").asInt(),
                answer.path("evaluatedSamples").asInt(), answer.path("results").size());
    }

    private static void delete(Path dir) throws IOException {
        try (Stream<Path> all = Files.walk(dir)) {
            for (Path p : all.sorted(Comparator.reverseOrder()).toList()) {
                Files.deleteIfExists(p);
            }
        }
    }

    private static String get(HttpClient http, String url) throws Exception {
        HttpResponse<String> response = http.send(HttpRequest.newBuilder(URI.create(url)).build(),
                HttpResponse.BodyHandlers.ofString());
        if (response.statusCode() != 200) {
            throw new IllegalStateException(url + " answered " + response.statusCode());
        }
        return response.body();
    }
}
