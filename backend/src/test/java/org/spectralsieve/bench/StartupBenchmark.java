package org.spectralsieve.bench;

import static org.spectralsieve.bench.BenchStats.ms;
import static org.spectralsieve.bench.BenchStats.percentile;

import java.io.IOException;
import java.net.ServerSocket;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.spectralsieve.cli.LauncherProcess;

/**
 * Start-up benchmark (run by {@code mvn -B -q -Pbench -pl backend -am verify}; not part of the test suite):
 * the built jar started as its own process in a fresh temporary folder, timed from the launch to the first
 * answered request ({@code GET /api/materials} answering 200), then one search timed after it (what the first
 * user's search costs while nothing is warm). {@code mode=first}: an empty folder, so the migrations run and
 * the illustrative demo library is loaded; {@code mode=restart}: the same folder started again (schema up to
 * date, library present, text index on disk). Prints {@code BENCH start jar=<name> mode=<m> runs p50_ms p95_ms
 * first_search_p50_ms}.
 *
 * <p>Several jars are timed side by side, one start of each in turn ({@code -Dbench.startJars=a.jar,b.jar};
 * default the module's own {@code target/backend-*.jar}, which needs an earlier {@code mvn package}: the bench
 * profile's tests run before this run's packaging). Switches: {@code -Dbench.startRuns=5},
 * {@code -Dbench.startHeap=512m}.
 *
 * <p>An entry written {@code launcher:a.jar} starts that jar through the repository's {@code spectral-sieve}
 * script instead of {@code java -jar} (unpacked jar, the web service's own class-data archive;
 * docs/start-and-load.md), with a private cache folder that one untimed start and stop fills first (the
 * archive is recorded once per build, not per start). Its name in the BENCH line is {@code launcher:<jar>}.
 * {@code launcher-default-jit:a.jar} is the same with {@code SIEVE_SERVER_JIT=default}: the launcher's web
 * service with the JVM's own compile thresholds, the way it started before the raised C2 thresholds.
 * The default is the module's jar both ways, side by side.
 */
class StartupBenchmark {

    private static final String SEARCH = "{\"requirement\":\"passes over 80% at 365 nm and blocks under 1% at 405 nm\"}";

    private record Times(List<Double> answer, List<Double> search) {
        Times() {
            this(new ArrayList<>(), new ArrayList<>());
        }
    }

    @Test
    void startsTheBuiltJar() throws Exception {
        List<Started> jars = jars();
        if (jars.isEmpty()) {
            System.out.println("BENCH start skipped: no jar (run mvn package first or pass -Dbench.startJars=)");
            return;
        }
        int runs = BenchStats.intProperty("bench.startRuns", 5);
        String heap = System.getProperty("bench.startHeap", "512m");
        Map<String, Times> times = new LinkedHashMap<>();
        for (Started jar : jars) {
            if (jar.launcher()) {
                Path dir = Files.createTempDirectory("sieve-start-recording");
                try {
                    start(jar, dir, heap); // untimed: unpacks the jar and records the service's archive
                } finally {
                    delete(dir);
                }
            }
        }
        for (int run = 0; run < runs; run++) {
            for (Started jar : jars) {
                Path dir = Files.createTempDirectory("sieve-start");
                try {
                    for (String mode : List.of("first", "restart")) {
                        double[] t = start(jar, dir, heap);
                        Times tt = times.computeIfAbsent(jar.name() + " " + mode, k -> new Times());
                        tt.answer().add(t[0]);
                        tt.search().add(t[1]);
                    }
                } finally {
                    delete(dir);
                }
            }
        }
        for (Started jar : jars) {
            if (jar.launcher()) {
                delete(jar.cache());
            }
        }
        for (Map.Entry<String, Times> e : times.entrySet()) {
            String[] key = e.getKey().split(" ");
            double[] answer = e.getValue().answer().stream().mapToDouble(Double::doubleValue).toArray();
            double[] search = e.getValue().search().stream().mapToDouble(Double::doubleValue).toArray();
            System.out.printf("BENCH start jar=%s mode=%s runs=%d p50_ms=%s p95_ms=%s first_search_p50_ms=%s heap=%s%n",
                    key[0], key[1], answer.length, ms(percentile(answer, 50)), ms(percentile(answer, 95)),
                    ms(percentile(search, 50)), heap);
        }
    }

    /** @return ms from launch to the first 200, and ms of the first search after it */
    /** One way of starting a jar: plain {@code java -jar}, or the launcher script with its own cache folder. */
    private record Started(Path jar, boolean launcher, boolean defaultJit, Path root, Path cache) {
        String name() {
            return (launcher ? (defaultJit ? "launcher-default-jit:" : "launcher:") : "") + jar.getFileName();
        }

        ProcessBuilder process(String heap, int port) {
            if (!launcher) {
                return new ProcessBuilder(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                        "-Xmx" + heap, "-jar", jar.toAbsolutePath().toString(), "--server.port=" + port);
            }
            ProcessBuilder builder = new ProcessBuilder("sh", root.resolve("spectral-sieve").toString(), "--server.port=" + port);
            builder.environment().put("SIEVE_JAR", jar.toAbsolutePath().toString());
            builder.environment().put("SIEVE_CACHE_DIR", cache.toString());
            builder.environment().put("SIEVE_JAVA_OPTS", "-Xmx" + heap);
            if (defaultJit) {
                builder.environment().put("SIEVE_SERVER_JIT", "default");
            }
            builder.environment().put("JAVA_HOME", System.getProperty("java.home"));
            return builder;
        }
    }

    private static double[] start(Started jar, Path dir, String heap) throws Exception {
        int port;
        try (ServerSocket free = new ServerSocket(0)) {
            port = free.getLocalPort();
        }
        String base = "http://127.0.0.1:" + port;
        HttpClient http = HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(2)).build();
        long launched = System.nanoTime();
        Process app = jar.process(heap, port)
                .directory(dir.toFile()).redirectErrorStream(true).redirectOutput(dir.resolve("log.txt").toFile()).start();
        try {
            while (true) {
                if (!app.isAlive()) {
                    throw new IllegalStateException("the service stopped; see " + dir.resolve("log.txt") + ":\n"
                            + Files.readString(dir.resolve("log.txt")));
                }
                try {
                    HttpResponse<Void> r = http.send(HttpRequest.newBuilder(URI.create(base + "/api/materials")).build(),
                            HttpResponse.BodyHandlers.discarding());
                    if (r.statusCode() == 200) {
                        break;
                    }
                } catch (IOException notYet) {
                    // not listening yet
                }
                Thread.sleep(20);
            }
            double answered = (System.nanoTime() - launched) / 1e6;
            long asked = System.nanoTime();
            HttpResponse<String> searched = http.send(HttpRequest.newBuilder(URI.create(base + "/api/search"))
                    .header("Content-Type", "application/json").POST(HttpRequest.BodyPublishers.ofString(SEARCH)).build(),
                    HttpResponse.BodyHandlers.ofString());
            double search = (System.nanoTime() - asked) / 1e6;
            if (searched.statusCode() != 200) {
                throw new IllegalStateException("search answered " + searched.statusCode() + ": " + searched.body());
            }
            return new double[] {answered, search};
        } finally {
            app.destroy(); // SIGTERM: the service shuts down gracefully and closes the database
            app.waitFor();
        }
    }

    private static List<Started> jars() throws IOException {
        Path root = LauncherProcess.repositoryRoot().orElse(null);
        List<String> named = new ArrayList<>();
        String given = System.getProperty("bench.startJars", "");
        if (!given.isBlank()) {
            Stream.of(given.split(",")).map(String::trim).forEach(named::add);
        } else {
            Path target = Path.of("target");
            if (!Files.isDirectory(target)) {
                return List.of();
            }
            try (Stream<Path> files = Files.list(target)) {
                files.filter(p -> p.getFileName().toString().matches("backend-.*\\.jar"))
                        .sorted(Comparator.naturalOrder()).limit(1)
                        .forEach(jar -> named.addAll(List.of(jar.toString(), "launcher:" + jar)));
            }
        }
        List<Started> started = new ArrayList<>();
        for (String entry : named) {
            boolean defaultJit = entry.startsWith("launcher-default-jit:");
            boolean launcher = defaultJit || entry.startsWith("launcher:");
            if (launcher && root == null) {
                System.out.println("BENCH start: no spectral-sieve launcher found; " + entry + " left out");
                continue;
            }
            String jar = launcher ? entry.substring(entry.indexOf(':') + 1) : entry;
            started.add(new Started(Path.of(jar), launcher, defaultJit, root,
                    launcher ? Files.createTempDirectory("sieve-start-cache") : null));
        }
        return started;
    }

    private static void delete(Path dir) throws IOException {
        try (Stream<Path> all = Files.walk(dir)) {
            for (Path p : all.sorted(Comparator.reverseOrder()).toList()) {
                Files.deleteIfExists(p);
            }
        }
    }
}
