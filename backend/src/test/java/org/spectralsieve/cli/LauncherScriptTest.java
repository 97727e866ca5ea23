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
