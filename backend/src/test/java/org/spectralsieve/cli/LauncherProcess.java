package org.spectralsieve.cli;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;

/**
 * The command line started as a separate process, as a user's shell starts it: through the repository's
 * {@code spectral-sieve} launcher, or as plain {@code java -jar}. Shared by the launcher's test and the
 * start-up benchmark (bench.CliStartBenchmark), which must find the same script and jar.
 */
public final class LauncherProcess {

    /** What one run printed and returned, and how long it took from start to exit. */
    public record Result(int exitCode, String out, String err, double wallMs) {
    }

    private final Path root;
    private final Map<String, String> environment;

    /** @param environment added to the inherited environment of every run (cache folder, index folder, ...) */
    public LauncherProcess(Path root, Map<String, String> environment) {
        this.root = root;
        this.environment = Map.copyOf(environment);
    }

    /** The repository root (the folder holding the launcher), looked for from the working directory up. */
    public static Optional<Path> repositoryRoot() {
        for (Path p = Path.of("").toAbsolutePath(); p != null; p = p.getParent()) {
            if (Files.isRegularFile(p.resolve("spectral-sieve")) && Files.isDirectory(p.resolve("backend"))) {
                return Optional.of(p);
            }
        }
        return Optional.empty();
    }

    /** The jar the launcher would run: the newest backend/target/backend-*.jar, when one was built. */
    public static Optional<Path> builtJar(Path root) {
        Path target = root.resolve("backend").resolve("target");
        if (!Files.isDirectory(target)) {
            return Optional.empty();
        }
        try (Stream<Path> files = Files.list(target)) {
            return files.filter(p -> p.getFileName().toString().matches("backend-.*\\.jar"))
                    .max(Comparator.comparing(LauncherProcess::modified));
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** {@code sh spectral-sieve ARGS}. */
    public Result launcher(String... args) {
        List<String> command = new ArrayList<>(List.of("sh", root.resolve("spectral-sieve").toString()));
        command.addAll(List.of(args));
        return run(command);
    }

    /** {@code java -jar JAR ARGS}, the way the README started a command before the launcher. */
    public Result plainJar(Path jar, String... args) {
        String javaHome = System.getProperty("java.home");
        List<String> command = new ArrayList<>(List.of(Path.of(javaHome, "bin", "java").toString(), "-jar", jar.toString()));
        command.addAll(List.of(args));
        return run(command);
    }

    private Result run(List<String> command) {
        try {
            Path out = Files.createTempFile("sieve-launcher-out", ".txt");
            Path err = Files.createTempFile("sieve-launcher-err", ".txt");
            try {
                ProcessBuilder builder = new ProcessBuilder(command).directory(root.toFile())
                        .redirectOutput(out.toFile()).redirectError(err.toFile());
                builder.environment().putAll(environment);
                // the launcher runs the same Java as this test
                builder.environment().put("JAVA_HOME", System.getProperty("java.home"));
                long start = System.nanoTime();
                Process process = builder.start();
                if (!process.waitFor(10, TimeUnit.MINUTES)) {
                    process.destroyForcibly();
                    throw new IllegalStateException("no answer within 10 minutes: " + command);
                }
                double wallMs = (System.nanoTime() - start) / 1e6;
                return new Result(process.exitValue(), Files.readString(out, StandardCharsets.UTF_8),
                        Files.readString(err, StandardCharsets.UTF_8), wallMs);
            } finally {
                Files.deleteIfExists(out);
                Files.deleteIfExists(err);
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException(e);
        }
    }

    private static long modified(Path p) {
        try {
            return Files.getLastModifiedTime(p).toMillis();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
