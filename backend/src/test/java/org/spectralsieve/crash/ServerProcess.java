package org.spectralsieve.crash;

import java.io.File;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.net.ServerSocket;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Collectors;

/**
 * The service as a separate operating-system process, started the way a user starts it (the application's
 * main class, the default database URL resolved in the working directory) so that killing it is a real
 * crash: nothing in the test JVM shares its memory, its file handles or its shutdown hooks.
 *
 * <p>The classpath is the one surefire runs the tests with ({@code surefire.test.class.path}, else
 * {@code java.class.path}) less the test classes: the freshly compiled classes of this build with every
 * dependency, so the test needs no packaged jar (none is built by {@code mvn test}) and always runs the code
 * under test.
 *
 * <p>Also the application node of the several-nodes test ({@code nodes.TwoNodesOnOnePostgresTest}): there the
 * extra arguments name the PostgreSQL database, and each node's working directory holds its own text index.
 */
public final class ServerProcess implements AutoCloseable {

    private static final Duration START_TIMEOUT = Duration.ofSeconds(180);

    private final Process process;
    private final int port;
    private final Path log;
    private final long startMs;
    /** The API token every request of the tests' clients carries, where the service runs in server mode; else null. */
    private volatile String bearerToken;

    private ServerProcess(Process process, int port, Path log, long startMs) {
        this.process = process;
        this.port = port;
        this.log = log;
        this.startMs = startMs;
    }

    /**
     * Starts the service in {@code workDir} (its database is then {@code workDir/data/sieve}, the default
     * URL) and waits until it answers.
     *
     * @param extraArgs more Spring arguments, e.g. a database URL that states another write delay
     */
    public static ServerProcess start(Path workDir, Path log, List<String> extraArgs) throws IOException, InterruptedException {
        int port = freePort();
        String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        // without the test classes: the application's component scan must see only the application
        String classpath = Arrays.stream(System.getProperty("surefire.test.class.path",
                        System.getProperty("java.class.path")).split(File.pathSeparator))
                .filter(entry -> !entry.endsWith("test-classes") && !entry.endsWith("test-classes/"))
                .collect(Collectors.joining(File.pathSeparator));
        List<String> command = new ArrayList<>(List.of(java,
                // small and quick to start: the machine is shared, and a round is mostly start-up
                "-Xmx384m", "-XX:+UseSerialGC", "-XX:TieredStopAtLevel=1", "-Xshare:auto",
                "-Dorg.jooq.no-logo=true", "-Dorg.jooq.no-tips=true",
                "-cp", classpath, "org.spectralsieve.SpectralSieveApplication",
                "--server.port=" + port, "--server.address=127.0.0.1",
                "--server.tomcat.basedir=" + workDir.resolve("tomcat"),
                // an empty library: every row in it is one the test sent, so every row can be checked
                "--sieve.seed.load-on-empty=false",
                "--logging.level.root=WARN", "--spring.main.banner-mode=off"));
        command.addAll(extraArgs);
        long startMs = System.currentTimeMillis();
        Process p = new ProcessBuilder(command).directory(workDir.toFile()).redirectErrorStream(true)
                .redirectOutput(ProcessBuilder.Redirect.appendTo(log.toFile())).start();
        ServerProcess server = new ServerProcess(p, port, log, startMs);
        server.awaitAnswer();
        return server;
    }

    /**
     * The extra arguments that put the service on a PostgreSQL database (the {@code postgres} profile): every
     * process the tests start on PostgreSQL, a crash-test server or an application node, is told this and only
     * this about the database.
     */
    public static List<String> postgresArguments(String jdbcUrl, String user, String password) {
        return List.of("--spring.profiles.active=postgres", "--spring.datasource.url=" + jdbcUrl,
                "--spring.datasource.username=" + user, "--spring.datasource.password=" + password);
    }

    public int port() {
        return port;
    }

    public URI uri(String path) {
        return URI.create("http://127.0.0.1:" + port + path);
    }

    /**
     * From now on {@link #request} signs every request with this API token: a service on the {@code postgres} profile
     * runs in server mode (docs/accounts-and-roles.md), and the token ({@code TestTokens.adminToken}) can only be made
     * once the first process has migrated the schema.
     */
    public void signRequestsWith(String token) {
        this.bearerToken = token;
    }

    /** A request to {@code path}, with the API token when one was given. */
    public HttpRequest.Builder request(String path) {
        HttpRequest.Builder builder = HttpRequest.newBuilder(uri(path));
        String token = bearerToken;
        return token == null ? builder : builder.header("Authorization", "Bearer " + token);
    }

    /** SIGKILL on Linux (Process.destroyForcibly): no shutdown hook, no H2 close, no flush. */
    public void kill() throws InterruptedException {
        process.destroyForcibly();
        if (!process.waitFor(30, TimeUnit.SECONDS)) {
            throw new IllegalStateException("the killed server process " + process.pid() + " did not end");
        }
    }

    public boolean alive() {
        return process.isAlive();
    }

    long startMillis() {
        return startMs;
    }

    @Override
    public void close() throws InterruptedException {
        if (process.isAlive()) {
            kill();
        }
    }

    private void awaitAnswer() throws InterruptedException {
        HttpClient http = HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(2)).build();
        long deadline = System.nanoTime() + START_TIMEOUT.toNanos();
        while (System.nanoTime() < deadline) {
            if (!process.isAlive()) {
                throw new IllegalStateException("the server ended on start (exit " + process.exitValue()
                        + ") without any manual repair possible; its log:\n" + tail());
            }
            try {
                HttpResponse<Void> r = http.send(HttpRequest.newBuilder(uri("/api/materials")).timeout(Duration.ofSeconds(5))
                        .GET().build(), HttpResponse.BodyHandlers.discarding());
                // 401: a service in server mode answering a request that carries no token yet (it is made afterwards)
                if (r.statusCode() == 200 || r.statusCode() == 401) {
                    return;
                }
            } catch (IOException notYet) {
                // not listening yet
            }
            Thread.sleep(150);
        }
        process.destroyForcibly();
        throw new IllegalStateException("the server did not answer within " + START_TIMEOUT + "; its log:\n" + tail());
    }

    public String tail() {
        try {
            List<String> lines = Files.readAllLines(log);
            return String.join("\n", lines.subList(Math.max(0, lines.size() - 40), lines.size()));
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    private static int freePort() throws IOException {
        try (ServerSocket s = new ServerSocket(0)) {
            return s.getLocalPort();
        }
    }
}
