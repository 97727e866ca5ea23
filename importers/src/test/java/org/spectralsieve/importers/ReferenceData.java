package org.spectralsieve.importers;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Optional;
import org.junit.jupiter.api.Assumptions;

/** Locates ../shared/reference-data beside the repository (never copied in) by walking up from the working directory. */
final class ReferenceData {

    private static final String ROOT = "shared/reference-data";

    private ReferenceData() {
    }

    static Optional<Path> locate() {
        for (Path dir = Path.of("").toAbsolutePath(); dir != null; dir = dir.getParent()) {
            Path candidate = dir.resolve(ROOT);
            if (Files.isDirectory(candidate)) {
                return Optional.of(candidate);
            }
        }
        return Optional.empty();
    }

    /** The file, or the test is skipped with a message saying what was looked for and where. */
    static Path file(String relative) {
        Optional<Path> root = locate();
        Assumptions.assumeTrue(root.isPresent(), "shared reference data not present: no ../" + ROOT
                + " above " + Path.of("").toAbsolutePath() + "; skipping the reference-file check of " + relative);
        Path file = root.get().resolve(relative);
        Assumptions.assumeTrue(Files.isRegularFile(file), "reference file missing: " + file);
        return file;
    }
}
