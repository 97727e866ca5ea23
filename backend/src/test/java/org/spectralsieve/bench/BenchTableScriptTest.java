package org.spectralsieve.bench;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spectralsieve.cli.LauncherProcess;

/**
 * {@code .ci/bench-table} reads a benchmark log into issue 14's table of targets (docs/benchmarks.md, "The speed
 * table in one command"). The log here is hand-written in the benchmarks' own line format; nothing is timed.
 * The targets checked against are the (≤ 2 ms demo plain fixed, ≥ 100× SQL ratio, ≤ 3 s restart).
 */
class BenchTableScriptTest {

    @TempDir
    Path dir;

    @Test
    void aMeasuredRowIsComparedWithItsTargetOnTheMedian() throws Exception {
        List<String> table = table(
                "BENCH demo-search kind=plain-fixed materials=50 curves=88 runs=31 p50_ms=1.800 p95_ms=9.000 wall_p50_ms=4.0",
                "BENCH demo-search kind=plain-solve materials=50 curves=88 runs=31 p50_ms=7.250 p95_ms=9.000 wall_p50_ms=9.0");
        assertEquals("| demo library, plain fixed (server tookMs) | ≤ 2 ms | 1.8 | 9.0 | p50_ms 1.8 | kind=plain-fixed"
                + " | curves=88 materials=50 | met |", row(table, "plain fixed"));
        assertTrue(row(table, "plain solve").endsWith("| not met |"), row(table, "plain solve"));
    }

    @Test
    void aMissingLineIsReportedAsNotRunAndASkippedBenchmarkSaysSo() throws Exception {
        List<String> table = table("BENCH start skipped: no jar (run mvn package first or pass -Dbench.startJars=)");
        assertTrue(row(table, "server restart").endsWith("| not run (skipped, see the log) |"), row(table, "server restart"));
        assertTrue(row(table, "synthetic 1M, weighted solve").endsWith("| not run |"), row(table, "synthetic 1M, weighted solve"));
    }

    @Test
    void colourCodesAndMavenPrefixesAreIgnoredAndARatioMustReachItsFloor() throws Exception {
        List<String> table = table(
                "[INFO] \u001b[0mBENCH sql-baseline curves=10000 p50_ms=567.000 ratio=140",
                "BENCH sql-baseline curves=100000 p50_ms=4100.000 ratio=90");
        assertTrue(row(table, "ratio at 10k").contains("| ratio 140 |") && row(table, "ratio at 10k").endsWith("| met |"),
                row(table, "ratio at 10k"));
        assertTrue(row(table, "ratio at 100k").endsWith("| not met |"), row(table, "ratio at 100k"));
    }

    @Test
    void everyMatchingLineGivesItsOwnTableLine() throws Exception {
        List<String> table = table(
                "BENCH start jar=before.jar mode=restart runs=2 p50_ms=3500.0 p95_ms=4000.0 first_search_p50_ms=90 heap=512m",
                "BENCH start jar=after.jar mode=restart runs=2 p50_ms=2500.0 p95_ms=2900.0 first_search_p50_ms=80 heap=512m");
        List<String> restarts = table.stream().filter(l -> l.startsWith("| server restart")).toList();
        assertEquals(2, restarts.size(), String.join("\n", table));
        assertTrue(restarts.get(0).contains("jar=before.jar") && restarts.get(0).endsWith("| not met |"), restarts.get(0));
        assertTrue(restarts.get(1).contains("jar=after.jar") && restarts.get(1).endsWith("| met |"), restarts.get(1));
    }

    private List<String> table(String... logLines) throws IOException, InterruptedException {
        Optional<Path> root = LauncherProcess.repositoryRoot();
        assumeTrue(root.isPresent() && Files.isRegularFile(root.get().resolve(".ci/bench-table")),
                "skipped: .ci/bench-table not found from " + Path.of("").toAbsolutePath());
        assumeTrue(Files.isExecutable(Path.of("/bin/bash")) || Files.isExecutable(Path.of("/usr/bin/bash")),
                "skipped: no bash");
        Path log = dir.resolve("bench.log");
        Files.write(log, List.of(logLines), StandardCharsets.UTF_8);
        Process script = new ProcessBuilder("bash", root.get().resolve(".ci/bench-table").toString(), log.toString())
                .redirectErrorStream(true).start();
        String out = new String(script.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertTrue(script.waitFor(60, TimeUnit.SECONDS), "bench-table did not finish");
        assertEquals(0, script.exitValue(), out);
        return out.lines().toList();
    }

    private static String row(List<String> table, String label) {
        return table.stream().filter(l -> l.startsWith("| ") && l.contains(label)).findFirst()
                .orElseThrow(() -> new AssertionError("no row '" + label + "' in\n" + String.join("\n", table)));
    }
}
