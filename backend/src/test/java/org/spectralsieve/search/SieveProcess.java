package org.spectralsieve.search;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import org.spectralsieve.SpectralSieveApplication;

/**
 * One command-line call of the application in a separate JVM, on this test's class path, as a user would run
 * {@code java -jar spectral-sieve.jar import …} beside a running server: another process on the same database.
 */
final class SieveProcess {

    /** What the command printed and how it ended. */
    record Result(int exitCode, String out, String err) {

        /** Fails the test with everything the command printed unless it exited 0. */
        Result succeeded() {
            assertThat(exitCode).as("exit code; stdout:%n%s%nstderr:%n%s", out, err).isZero();
            return this;
        }
    }

    private SieveProcess() {
    }

    /**
     * @param environment added to (and overriding) this JVM's environment; the database variables and the
     *                    active profile are cleared first, so only what is given here reaches the command
     */
    static Result run(Path workDir, Map<String, String> environment, String... args) throws IOException, InterruptedException {
        List<String> command = new ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                // a short-lived command: small heap, quick start
                "-Xmx256m", "-XX:TieredStopAtLevel=1", "-XX:+UseSerialGC",
                "-cp", System.getProperty("java.class.path"), SpectralSieveApplication.class.getName()));
        command.addAll(List.of(args));
        Path out = Files.createTempFile(workDir, "stdout", ".txt");
        Path err = Files.createTempFile(workDir, "stderr", ".txt");
        ProcessBuilder builder = new ProcessBuilder(command).directory(workDir.toFile())
                .redirectOutput(out.toFile()).redirectError(err.toFile());
        List.of("SIEVE_DB_URL", "SIEVE_DB_USER", "SIEVE_DB_PASSWORD", "SPRING_PROFILES_ACTIVE")
                .forEach(builder.environment()::remove);
        builder.environment().putAll(environment);
        Process process = builder.start();
        if (!process.waitFor(3, TimeUnit.MINUTES)) {
            process.destroyForcibly();
            throw new IllegalStateException("the command " + List.of(args) + " did not end within 3 minutes");
        }
        return new Result(process.exitValue(), Files.readString(out, StandardCharsets.UTF_8),
                Files.readString(err, StandardCharsets.UTF_8));
    }

    /** A folder for {@code import}: one curve file and the manifest row that files it under a new material. */
    static Path importFolder(Path dir, String materialName, String materialClass) throws IOException {
        Path folder = Files.createDirectories(dir.resolve("batch"));
        Files.writeString(folder.resolve("manifest.csv"), """
                file,material,thickness,geometry,provenance,class,scaling,index_n
                probe-2mm.csv,%s,2,regular,measured,%s,bulk,1.49
                """.formatted(materialName, materialClass), StandardCharsets.UTF_8);
        Files.writeString(folder.resolve("probe-2mm.csv"), "wavelength_nm,T\n300,0.3\n400,0.8\n", StandardCharsets.UTF_8);
        return folder;
    }

    /** An emitter file for {@code import-spectrum}: a narrow band at 365 nm (illustrative). */
    static Path emitterFile(Path dir) throws IOException {
        Path file = dir.resolve("probe-lamp.csv");
        Files.writeString(file, "wavelength_nm,power\n360,0\n365,1\n370,0\n", StandardCharsets.UTF_8);
        return file;
    }
}
