package org.spectralsieve.bench;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.net.ServerSocket;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.TreeMap;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.zip.ZipEntry;
import java.util.zip.ZipOutputStream;
import org.junit.jupiter.api.Test;

/**
 * Concurrent batch uploads against the service started as a separate process with the heap the README
 * states ({@code -Xmx512m} unless {@code -Dbench.uploadHeap} says otherwise), on its own H2 file database.
 * Two cases, each 24 clients posting at once (switch {@code -Dbench.uploadClients}):
 * <ul>
 *   <li>{@code bomb}: zips of about 180 KB whose nine entries inflate to 20 MB of zeros each (about 1000:1);</li>
 *   <li>{@code dense}: zips of nine 2 MB entries of incompressible text (about 2:1), which are inflated and
 *       read in full and refused by the importer as holding no curve (so nothing piles up in the database).</li>
 * </ul>
 * Prints {@code BENCH uploads case=<c> clients=<n> xmx=<h> status_<code>=<count>… peak_heap_mb=<m>
 * after_young_gc_max_mb=<m> oom=<bool>}; peak heap is the largest heap occupancy before a collection in the
 * child's GC log. Asserts only that no answer was a 5xx and that the child did not run out of memory.
 */
class UploadMemoryBenchmark {

    private static final String BOUNDARY = "----sieve-bench-boundary-51c2";
    private static final Pattern GC_LINE = Pattern.compile("(\\d+)M->(\\d+)M\\((\\d+)M\\)");

    @Test
    void concurrentBatchUploadsStayInsideTheStatedHeapWithoutServerErrors() throws Exception {
        String heap = System.getProperty("bench.uploadHeap", "512m");
        int clients = Integer.getInteger("bench.uploadClients", 24);
        Path dir = Files.createTempDirectory("sieve-upload-bench");
        int port;
        try (ServerSocket free = new ServerSocket(0)) {
            port = free.getLocalPort();
        }
        Path gcLog = dir.resolve("gc.log");
        Path appLog = dir.resolve("app.log");
        String classpath = System.getProperty("surefire.test.class.path", System.getProperty("java.class.path"));
        Process app = new ProcessBuilder(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                "-Xmx" + heap, "-Xlog:gc:file=" + gcLog, "-cp", classpath, "org.spectralsieve.SpectralSieveApplication",
                "--server.port=" + port, "--spring.datasource.url=jdbc:h2:file:" + dir.resolve("db"),
                "--logging.level.root=WARN")
                .redirectErrorStream(true).redirectOutput(appLog.toFile()).start();
        try {
            HttpClient http = HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(10)).build();
            awaitUp(http, port, app);
            for (String kind : List.of("bomb", "dense")) {
                byte[] zip = kind.equals("bomb") ? bombZip() : denseZip();
                Map<Integer, Integer> statuses = post(http, port, zip, clients);
                String log = Files.readString(appLog);
                boolean oom = log.contains("OutOfMemoryError");
                int[] heapMb = heapFigures(gcLog);
                StringBuilder line = new StringBuilder("BENCH uploads case=" + kind + " clients=" + clients + " xmx=" + heap
                        + " zip_kb=" + zip.length / 1024);
                statuses.forEach((status, count) -> line.append(" status_").append(status).append('=').append(count));
                line.append(" peak_heap_mb=").append(heapMb[0]).append(" after_young_gc_max_mb=").append(heapMb[1])
                        .append(" oom=").append(oom);
                System.out.println(line);
                assertThat(statuses.keySet()).as("every client answered, none with a server error").allMatch(s -> s >= 200 && s < 500);
                assertThat(oom).as("no OutOfMemoryError in the service's log").isFalse();
            }
        } finally {
            app.destroy();
            if (!app.waitFor(30, java.util.concurrent.TimeUnit.SECONDS)) {
                app.destroyForcibly();
            }
        }
    }

    private static void awaitUp(HttpClient http, int port, Process app) throws Exception {
        long until = System.nanoTime() + Duration.ofMinutes(5).toNanos();
        while (System.nanoTime() < until) {
            if (!app.isAlive()) {
                throw new IllegalStateException("the service exited with " + app.exitValue());
            }
            try {
                HttpResponse<Void> r = http.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + "/api/emitters"))
                        .build(), HttpResponse.BodyHandlers.discarding());
                if (r.statusCode() == 200) {
                    return;
                }
            } catch (IOException e) {
                // not listening yet
            }
            Thread.sleep(500);
        }
        throw new IllegalStateException("the service did not answer within 5 minutes");
    }

    private static Map<Integer, Integer> post(HttpClient http, int port, byte[] zip, int clients) throws Exception {
        byte[] body = multipart(zip);
        ExecutorService pool = Executors.newFixedThreadPool(clients);
        try {
            List<Future<Integer>> answers = new ArrayList<>();
            for (int i = 0; i < clients; i++) {
                answers.add(pool.submit(() -> http.send(HttpRequest.newBuilder(
                                URI.create("http://localhost:" + port + "/api/imports/batch"))
                        .timeout(Duration.ofMinutes(5))
                        .header("Content-Type", "multipart/form-data; boundary=" + BOUNDARY)
                        .POST(HttpRequest.BodyPublishers.ofByteArray(body)).build(),
                        HttpResponse.BodyHandlers.discarding()).statusCode()));
            }
            Map<Integer, Integer> statuses = new TreeMap<>();
            for (Future<Integer> a : answers) {
                int status;
                try {
                    status = a.get();
                } catch (java.util.concurrent.ExecutionException e) {
                    status = 0; // no answer: the connection failed (printed as status_0)
                }
                statuses.merge(status, 1, Integer::sum);
            }
            return statuses;
        } finally {
            pool.shutdownNow();
        }
    }

    /** [largest occupancy before a collection, largest after one], in MB, from the child's GC log. */
    private static int[] heapFigures(Path gcLog) throws IOException {
        int before = 0;
        int after = 0;
        for (String line : Files.readAllLines(gcLog)) {
            Matcher m = GC_LINE.matcher(line);
            if (m.find()) {
                before = Math.max(before, Integer.parseInt(m.group(1)));
                // only a young collection's "after" is the live heap: G1's Remark and Cleanup pauses free
                // nothing, so their "after" is the occupancy before, and would overstate the figure
                if (line.contains("Pause Young")) {
                    after = Math.max(after, Integer.parseInt(m.group(2)));
                }
            }
        }
        return new int[] {before, after};
    }

    private static byte[] bombZip() {
        return zip(new byte[20 * 1024 * 1024]);
    }

    private static byte[] denseZip() {
        Random random = new Random(42);
        StringBuilder text = new StringBuilder(2 * 1024 * 1024 + 64);
        while (text.length() < 2 * 1024 * 1024) {
            text.append("# ").append(Long.toString(random.nextLong(), 36)).append(' ')
                    .append(Long.toString(random.nextLong(), 36)).append('\n');
        }
        return zip(text.toString().getBytes(StandardCharsets.US_ASCII));
    }

    private static byte[] zip(byte[] entry) {
        StringBuilder manifest = new StringBuilder("file,material,thickness,class,scaling\n");
        for (int i = 0; i < 9; i++) {
            manifest.append("part-").append(i).append(".csv,Bench upload sheet (illustrative),3,plastic sheet,bulk\n");
        }
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        try (ZipOutputStream zip = new ZipOutputStream(bytes)) {
            zip.putNextEntry(new ZipEntry("manifest.csv"));
            zip.write(manifest.toString().getBytes(StandardCharsets.UTF_8));
            for (int i = 0; i < 9; i++) {
                zip.putNextEntry(new ZipEntry("part-" + i + ".csv"));
                zip.write(entry);
                zip.closeEntry();
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return bytes.toByteArray();
    }

    private static byte[] multipart(byte[] zip) {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        out.writeBytes(("--" + BOUNDARY + "\r\nContent-Disposition: form-data; name=\"file\"; filename=\"bench.zip\"\r\n"
                + "Content-Type: application/zip\r\n\r\n").getBytes(StandardCharsets.UTF_8));
        out.writeBytes(zip);
        out.writeBytes(("\r\n--" + BOUNDARY + "--\r\n").getBytes(StandardCharsets.UTF_8));
        return out.toByteArray();
    }
}
