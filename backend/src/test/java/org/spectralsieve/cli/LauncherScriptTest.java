package org.spectralsieve.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.time.Instant;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The repository's {@code spectral-sieve} launcher, run as a user runs it (a separate process through
 * {@code sh}) against a private cache folder and a temporary H2 file database. Needs the built jar
 * ({@code mvn -B -q package -DskipTests}); skipped, saying so, when there is none. The library is left
 * empty (SIEVE_SEED_LOADONEMPTY=false): the demo load would take minutes and is not what is tested here.
 */
class LauncherScriptTest {

    @TempDir
    Path tmp;

    private Path root;
    private Path jar;
    private Path cache;
    private LauncherProcess sieve;

    @BeforeEach
    void findLauncherAndJar() {
        Optional<Path> foundRoot = LauncherProcess.repositoryRoot();
        assumeTrue(foundRoot.isPresent(), "skipped: no spectral-sieve launcher above " + Path.of("").toAbsolutePath());
        root = foundRoot.get();
        Optional<Path> foundJar = LauncherProcess.builtJar(root);
        assumeTrue(foundJar.isPresent(), "skipped: no built jar under " + root.resolve("backend/target")
                + "; build it with mvn -B -q package -DskipTests to run the launcher's test");
        jar = foundJar.get();
        cache = tmp.resolve("cache");
        sieve = new LauncherProcess(root, Map.of(
                "SIEVE_CACHE_DIR", cache.toString(),
                "SIEVE_INDEX_DIR", tmp.resolve("index").toString(),
                "SIEVE_SEED_LOADONEMPTY", "false"));
    }

    @Test
    void versionSaysTheSameAsThePlainJar() {
        LauncherProcess.Result launched = sieve.launcher("--version");
        LauncherProcess.Result plain = sieve.plainJar(jar, "--version");

        assertThat(launched.exitCode()).as(launched.err()).isZero();
        assertThat(launched.out()).startsWith("Spectral Sieve ").isEqualTo(plain.out());
    }

    @Test
    void materialsOpensTheGivenDatabaseAndAnswersAlikeBeforeAndAfterTheClassArchiveIsRecorded() throws IOException {
        String dbUrl = "jdbc:h2:file:" + tmp.resolve("db").resolve("sieve");

        LauncherProcess.Result recording = sieve.launcher("materials", "--db-url", dbUrl);
        assertThat(recording.exitCode()).as(recording.err()).isZero();
        assertThat(archives()).as("the first library command records the class archive").hasSize(1);
        LauncherProcess.Result mapped = sieve.launcher("materials", "--db-url", dbUrl);

        assertThat(mapped.exitCode()).as(mapped.err()).isZero();
        // an empty library: the table's heading alone, and nothing else on stdout (no JVM or Spring chatter)
        List<String> lines = mapped.out().lines().toList();
        assertThat(lines).hasSize(1);
        assertThat(lines.get(0)).startsWith("id").contains("name", "class", "measured mm", "made in");
        assertThat(mapped.out()).isEqualTo(recording.out());
        assertThat(mapped.err()).doesNotContain("warning");
        assertThat(tmp.resolve("db").resolve("sieve.mv.db")).as("the database named by --db-url").exists();
    }

    @Test
    void aBadRequirementStillExitsWithTwoThroughTheLauncherAndRecordsNoArchive() throws IOException {
        LauncherProcess.Result run = sieve.launcher("search", "passes over 80% at 254 nxm",
                "--db-url", "jdbc:h2:file:" + tmp.resolve("db").resolve("sieve"));

        assertThat(run.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(run.err()).contains("did you mean 'nm'");
        assertThat(run.out()).isEmpty();
        // it stopped before opening the library: too few classes loaded to be worth an archive
        assertThat(archives()).isEmpty();
    }

    @Test
    void aJarRewrittenAfterItWasUnpackedIsUnpackedAgain() throws IOException {
        Path copy = Files.copy(jar, tmp.resolve("backend-copy.jar"));
        LauncherProcess copied = new LauncherProcess(root, Map.of("SIEVE_CACHE_DIR", cache.toString(),
                "SIEVE_JAR", copy.toString()));
        assertThat(copied.launcher("--version").exitCode()).isZero();
        Path stamp = single(stamps());
        FileTime firstUnpack = Files.getLastModifiedTime(stamp);

        // as a rebuild would: the jar is newer than its unpacked copy
        Files.setLastModifiedTime(copy, FileTime.from(Instant.now().plusSeconds(5)));
        assertThat(copied.launcher("--version").exitCode()).isZero();

        assertThat(Files.getLastModifiedTime(single(stamps()))).isNotEqualTo(firstUnpack);
    }

    @Test
    void theWebServiceRecordsItsOwnArchiveWhenStoppedAndStartsFromItNextTime() throws Exception {
        Path folder = Files.createDirectories(tmp.resolve("service"));
        Service recording = Service.start(root, cache, folder, tmp.resolve("service-db").resolve("sieve"));
        String recorded = recording.firstAnswer();
        int recordingExit = recording.stop();

        assertThat(recordingExit).as(recording.log()).isIn(0, 130, 143);
        assertThat(cacheFiles("server.jsa")).as("recorded when the service stopped").hasSize(1);
        assertThat(archives()).as("the commands' archive is a different one").isEmpty();

        Service mapped = Service.start(root, cache, folder, tmp.resolve("service-db").resolve("sieve"));
        try {
            assertThat(mapped.firstAnswer()).isEqualTo(recorded);
            assertThat(mapped.commandLine()).contains("-XX:SharedArchiveFile=").contains("server.jsa");
        } finally {
            mapped.stop();
        }
        assertThat(mapped.log()).doesNotContainIgnoringCase("warning");
    }

    /** The web service started through the launcher with no command, on a free port, until stopped. */
    private record Service(Process process, int port, Path logFile) {
        static Service start(Path root, Path cache, Path folder, Path db) throws IOException {
            int port;
            try (java.net.ServerSocket free = new java.net.ServerSocket(0)) {
                port = free.getLocalPort();
            }
            Path log = folder.resolve("log-" + port + ".txt");
            ProcessBuilder builder = new ProcessBuilder("sh", root.resolve("spectral-sieve").toString(), "--server.port=" + port)
                    .directory(folder.toFile()).redirectErrorStream(true).redirectOutput(log.toFile());
            builder.environment().putAll(Map.of("SIEVE_CACHE_DIR", cache.toString(),
                    "SIEVE_DB_URL", "jdbc:h2:file:" + db, "SIEVE_INDEX_DIR", folder.resolve("index").toString(),
                    "SIEVE_SEED_LOADONEMPTY", "false", "JAVA_HOME", System.getProperty("java.home")));
            return new Service(builder.start(), port, log);
        }

        /** The body of the first GET /api/materials answered 200. */
        String firstAnswer() throws Exception {
            java.net.http.HttpClient http = java.net.http.HttpClient.newHttpClient();
            java.net.URI uri = java.net.URI.create("http://127.0.0.1:" + port + "/api/materials");
            long deadline = System.nanoTime() + java.util.concurrent.TimeUnit.MINUTES.toNanos(5);
            while (System.nanoTime() < deadline) {
                assertThat(process.isAlive()).as("the service stopped:%n%s", log()).isTrue();
                try {
                    java.net.http.HttpResponse<String> r = http.send(java.net.http.HttpRequest.newBuilder(uri).build(),
                            java.net.http.HttpResponse.BodyHandlers.ofString());
                    if (r.statusCode() == 200) {
                        return r.body();
                    }
                } catch (IOException notYet) {
                    // not listening yet
                }
                Thread.sleep(100);
            }
            throw new AssertionError("no answer within 5 minutes:\n" + log());
        }

        String commandLine() {
            return process.info().commandLine().orElse("");
        }

        /** SIGTERM, as a service manager or Ctrl-C stops it; @return the exit code */
        int stop() throws InterruptedException {
            process.destroy();
            if (!process.waitFor(5, java.util.concurrent.TimeUnit.MINUTES)) {
                process.destroyForcibly();
            }
            return process.exitValue();
        }

        String log() {
            try {
                return Files.readString(logFile);
            } catch (IOException e) {
                return "(no log: " + e + ")";
            }
        }
    }

    private List<Path> archives() throws IOException {
        return cacheFiles("classes.jsa");
    }

    private List<Path> stamps() throws IOException {
        return cacheFiles("extracted");
    }

    private List<Path> cacheFiles(String name) throws IOException {
        if (!Files.isDirectory(cache)) {
            return List.of();
        }
        try (Stream<Path> files = Files.walk(cache)) {
            return files.filter(p -> p.getFileName().toString().equals(name)).toList();
        }
    }

    private static Path single(List<Path> paths) {
        assertThat(paths).hasSize(1);
        return paths.get(0);
    }
}
