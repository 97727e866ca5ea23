package org.spectralsieve.seedmodel;

import java.nio.file.Files;
import java.nio.file.Path;

/** Where the committed demo library lives, seen from the backend module's test working directory. */
final class SeedLibraryFixture {

    /** Set {@code -Dseed.regenerate=true} to rewrite the committed files from the generator first. */
    static final boolean REGENERATE = Boolean.getBoolean("seed.regenerate");

    private SeedLibraryFixture() {
    }

    static Path committedFolder() {
        Path fromBackend = Path.of("..", "seed-materials");
        return Files.isDirectory(fromBackend) || REGENERATE ? fromBackend : Path.of("seed-materials");
    }
}
