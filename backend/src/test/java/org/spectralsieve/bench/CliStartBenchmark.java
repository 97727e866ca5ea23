package org.spectralsieve.bench;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assumptions.assumeTrue;
import static org.spectralsieve.bench.BenchStats.percentile;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.spectralsieve.cli.LauncherProcess;

/**
 * One command-line call on an existing library, started as its own process, the old way and the new way
 * side by side (docs/command-line-start-up.md): {@code variant=plain} is {@code java -jar backend/target/backend-*.jar},
 * {@code variant=launcher} is the repository's {@code spectral-sieve} script (unpacked jar, class-data archive,
 * quick compiler) after its first run, whose read-only commands answer on the plain-Java wiring when they can;
 * {@code variant=launcher-context} is the same launcher with {@code -Dsieve.cli.wiring=spring} (every command in
 * the Spring context, the path before the plain wiring; its own cache folder and class archive). Commands: {@code materials}, {@code search "passes over 80% at 254 nm, at 3 mm"}
 * and {@code figures --sample ID} on the demo library in an H2 file database made once before timing. The
 * runs alternate plain / launcher / launcher-context so all see the same load. Each pair's answers must be identical.
 * {@code variant=launcher-first} is the one-off first call (unpacking and recording the archive).
 * Prints {@code BENCH cli-start command=<c> variant=<v> library=demo materials=<n> runs=<r> p50_ms p95_ms}.
 * Needs the built jar (the bench profile runs before packaging: build it first with
 * {@code mvn -B -q package -DskipTests}). Switches: {@code -Dbench.cliRuns=5},
 * {@code -Dbench.cliDb=/path/to/folder} (a folder holding an existing {@code sieve.mv.db} to use instead of
 * making one; making one loads the demo library, a minute or more).
 */
class CliStartBenchmark {

    private static final String REQUIREMENT = "passes over 80% at 254 nm, at 3 mm";

    @Test
    void oneCommandOnAnExistingLibraryPlainJarAgainstLauncher() throws Exception {
        Optional<Path> root = LauncherProcess.repositoryRoot();
        assumeTrue(root.isPresent(), "skipped: no spectral-sieve launcher found");
        Optional<Path> jar = LauncherProcess.builtJar(root.get());
        assumeTrue(jar.isPresent(), "skipped: no built jar; run mvn -B -q package -DskipTests first");
        int runs = BenchStats.intProperty("bench.cliRuns", 5);

        Path work = Files.createTempDirectory("sieve-cli-start-bench");
        String given = System.getProperty("bench.cliDb", "");
        Path dbFolder = given.isBlank() ? work.resolve("db") : Path.of(given);
        String dbUrl = "jdbc:h2:file:" + dbFolder.resolve("sieve");
        LauncherProcess sieve = new LauncherProcess(root.get(), Map.of(
                "SIEVE_CACHE_DIR", work.resolve("cache").toString(),
                "SIEVE_INDEX_DIR", work.resolve("index").toString()));
        // the earlier path kept behind its switch: every command in the Spring context, with a class archive of
        // its own (recorded by its own first call), so that it maps the classes it loads as the plain wiring does
        LauncherProcess inContext = new LauncherProcess(root.get(), Map.of(
                "SIEVE_CACHE_DIR", work.resolve("cache-context").toString(),
                "SIEVE_INDEX_DIR", work.resolve("index").toString(),
                "SIEVE_JAVA_OPTS", "-Dsieve.cli.wiring=spring"));

        // the library is made (demo load on first open) and its size read before any timing
        LauncherProcess.Result made = sieve.plainJar(jar.get(), "materials", "--db-url", dbUrl);
        assertEquals(0, made.exitCode(), made.err());
        long materials = made.out().lines().count() - 1;
        LauncherProcess.Result first = sieve.launcher("materials", "--db-url", dbUrl);
        assertEquals(made.out(), first.out());
        LauncherProcess.Result contextFirst = inContext.launcher("materials", "--db-url", dbUrl);
        assertEquals(made.out(), contextFirst.out());
        long sample = firstSampleOf(sieve.plainJar(jar.get(), "search", REQUIREMENT, "--limit", "1", "--db-url", dbUrl));

        Map<String, String[]> commands = new LinkedHashMap<>();
        commands.put("materials", new String[] {"materials", "--db-url", dbUrl});
        commands.put("search", new String[] {"search", REQUIREMENT, "--db-url", dbUrl});
        commands.put("figures", new String[] {"figures", "--sample", String.valueOf(sample), "--db-url", dbUrl});

        Map<String, List<Double>> plainMs = new LinkedHashMap<>();
        Map<String, List<Double>> launcherMs = new LinkedHashMap<>();
        Map<String, List<Double>> contextMs = new LinkedHashMap<>();
        for (int run = 0; run < runs; run++) {
            for (Map.Entry<String, String[]> c : commands.entrySet()) {
                LauncherProcess.Result plain = sieve.plainJar(jar.get(), c.getValue());
                LauncherProcess.Result launched = sieve.launcher(c.getValue());
                LauncherProcess.Result context = inContext.launcher(c.getValue());
                assertEquals(0, plain.exitCode(), plain.err());
                assertEquals(plain.out(), launched.out(), c.getKey() + ": the launcher must answer as the plain jar");
                assertEquals(plain.out(), context.out(), c.getKey() + ": the Spring context must answer as the plain jar");
                contextMs.computeIfAbsent(c.getKey(), k -> new ArrayList<>()).add(context.wallMs());
                plainMs.computeIfAbsent(c.getKey(), k -> new ArrayList<>()).add(plain.wallMs());
                launcherMs.computeIfAbsent(c.getKey(), k -> new ArrayList<>()).add(launched.wallMs());
            }
        }
        print("materials", "launcher-first", materials, List.of(first.wallMs()));
        for (String command : commands.keySet()) {
            print(command, "plain", materials, plainMs.get(command));
            print(command, "launcher-context", materials, contextMs.get(command));
            print(command, "launcher", materials, launcherMs.get(command));
        }
    }

    /** The sample column of the search table's first row ("   1  name  23  regular ..."). */
    private static long firstSampleOf(LauncherProcess.Result search) {
        assertEquals(0, search.exitCode(), search.err());
        String row = search.out().lines().filter(l -> l.matches("\\s+1\\s{2}.*")).findFirst()
                .orElseThrow(() -> new IllegalStateException("no first row in:\n" + search.out()));
        return Long.parseLong(row.trim().split(" {2,}")[2]);
    }

    private static void print(String command, String variant, long materials, List<Double> ms) {
        double[] values = ms.stream().mapToDouble(Double::doubleValue).toArray();
        System.out.printf(Locale.ROOT, "BENCH cli-start command=%s variant=%s library=demo materials=%d runs=%d p50_ms=%.0f"
                + " p95_ms=%.0f%n", command, variant, materials, values.length, percentile(values, 50), percentile(values, 95));
    }
}
