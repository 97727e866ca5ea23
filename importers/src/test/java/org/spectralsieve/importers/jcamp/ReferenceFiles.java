package org.spectralsieve.importers.jcamp;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Optional;
import org.junit.jupiter.api.Assumptions;

/**
 * Finds the shared reference data (never copied into the repository): {@code shared/reference-data}
 * beside the repository, searched upwards from the module directory Maven runs the tests in.
 */
final class ReferenceFiles {

    private static final String FOLDER = "shared/reference-data";

    private ReferenceFiles() {
    }

    static Optional<Path> folder() {
        for (Path dir = Path.of("").toAbsolutePath(); dir != null; dir = dir.getParent()) {
            Path candidate = dir.resolve(FOLDER);
            if (Files.isDirectory(candidate)) {
                return Optional.of(candidate);
            }
        }
        return Optional.empty();
    }

    /** The file, or the test is skipped with a message saying where it was looked for. */
    static Path require(String relative) {
        Optional<Path> folder = folder();
        Assumptions.assumeTrue(folder.isPresent(), "shared reference data not present: ../" + FOLDER
                + " above " + Path.of("").toAbsolutePath());
        Path file = folder.get().resolve(relative);
        Assumptions.assumeTrue(Files.isRegularFile(file), "shared reference data not present: " + file);
        return file;
    }
}
