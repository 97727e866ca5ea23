package org.spectralsieve.testsupport;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.lang.StackWalker.StackFrame;
import java.lang.reflect.AnnotatedElement;
import java.nio.file.FileSystems;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.PathMatcher;
import java.util.List;
import java.util.Optional;
import java.util.stream.Stream;
import org.junit.jupiter.api.Assumptions;

/**
 * The one place tests find the shared folder: published reference files and real measurements by other
 * people ({@code reference-data/}, with its {@code SOURCES.md}), kept beside the repository as
 * {@code ../shared} and never copied into it.
 *
 * <p>Where it is: the system property {@value #PROPERTY}, which the root POM sets for every module's tests
 * to {@code ../shared} beside the repository and which {@code mvn test -Dsieve.shared-dir=DIR} overrides;
 * without the property (a test started from an IDE that does not pass it) the folder beside the outermost
 * directory holding a {@code pom.xml}, counted up from the working directory.
 *
 * <p>A missing folder or file skips the calling test (a JUnit assumption), saying what was looked for and
 * where: a fresh clone has no {@code ../shared}, and its tests must still pass. Call it outside any
 * {@code assertThatThrownBy}/{@code catchThrowable} lambda, which would catch the skip as a failure.
 * Every caller must be marked {@link ReadsSharedFolder}; an unmarked one fails at once, because CI proves
 * the skipping by running exactly the marked tests without the folder.
 */
public final class SharedFolder {

    /** The one setting: the shared folder's path. */
    public static final String PROPERTY = "sieve.shared-dir";

    private static final StackWalker STACK = StackWalker.getInstance(StackWalker.Option.RETAIN_CLASS_REFERENCE);

    private SharedFolder() {
    }

    /** The configured folder, whether or not it exists. */
    public static Path root() {
        String configured = System.getProperty(PROPERTY);
        if (configured != null && !configured.isBlank()) {
            return Path.of(configured).toAbsolutePath().normalize();
        }
        return besideRepository();
    }

    /** A file of {@code reference-data/} (e.g. {@code "cie-1nm/a.csv"}), or the calling test is skipped. */
    public static Path referenceFile(String relative) {
        return file("reference-data/" + relative);
    }

    /**
     * A file of the measured transmittance sheets ({@code reference-data/measured-transmittance-…/}, see its
     * {@code SOURCES.md}), found by the folder's descriptive prefix so that tests name the data, not who
     * published it; or the calling test is skipped.
     */
    public static Path measuredSheet(String name) {
        requireMarkedCaller(name);
        Path data = root().resolve("reference-data");
        String folder = "measured-transmittance";
        if (Files.isDirectory(data)) {
            try (java.util.stream.Stream<Path> dirs = Files.list(data)) {
                folder = dirs.filter(Files::isDirectory).map(p -> p.getFileName().toString())
                        .filter(n -> n.startsWith("measured-transmittance")).sorted().findFirst().orElse(folder);
            } catch (java.io.IOException e) {
                throw new java.io.UncheckedIOException("cannot list " + data, e);
            }
        }
        return referenceFile(folder + "/" + name);
    }

    /**
     * The one file of {@code reference-data/} with this name (e.g. {@code "dupinc1.jdx"}), in whichever of its
     * folders it lies, so that tests name the data rather than the folder (some folders carry the name of
     * who published the data); or the calling test is skipped. Two files of the same name are an error.
     */
    public static Path referenceFileNamed(String fileName) {
        requireMarkedCaller(fileName);
        List<Path> found = referenceFiles().stream().filter(p -> p.getFileName().toString().equals(fileName)).toList();
        if (found.size() > 1) {
            throw new IllegalStateException("more than one reference file is named " + fileName + ": " + found);
        }
        Assumptions.assumeTrue(found.size() == 1, () -> "shared file not present: no " + fileName + " under "
                + root().resolve("reference-data") + "; skipping this check");
        return found.get(0);
    }

    /**
     * The files of {@code reference-data/} whose name matches a glob (e.g. {@code "*.yml"}), in any of its
     * folders, sorted; or the calling test is skipped when there is none. A glob lets a test name a kind of
     * file where the file names themselves are people's names (e.g. the authors of a table).
     */
    public static List<Path> referenceFilesNamed(String glob) {
        requireMarkedCaller(glob);
        PathMatcher matcher = FileSystems.getDefault().getPathMatcher("glob:" + glob);
        List<Path> found = referenceFiles().stream().filter(p -> matcher.matches(p.getFileName())).toList();
        Assumptions.assumeTrue(!found.isEmpty(), () -> "shared file not present: none named " + glob + " under "
                + root().resolve("reference-data") + "; skipping this check");
        return found;
    }

    /** Every file under {@code reference-data/} (sorted), or the calling test is skipped when it is absent. */
    public static List<Path> referenceFiles() {
        requireMarkedCaller("reference-data/");
        Path data = root().resolve("reference-data");
        Assumptions.assumeTrue(Files.isDirectory(data), () -> "shared folder not present: no " + data
                + " (../shared beside the repository, or -D" + PROPERTY + "=DIR); skipping this check");
        try (Stream<Path> files = Files.walk(data)) {
            return files.filter(Files::isRegularFile).sorted().toList();
        } catch (IOException e) {
            throw new UncheckedIOException("cannot list " + data, e);
        }
    }

    /** A file of the shared folder (e.g. {@code "reference-data/cie-1nm/a.csv"}), or the calling test is skipped. */
    public static Path file(String relative) {
        requireMarkedCaller(relative);
        Path root = root();
        Assumptions.assumeTrue(Files.isDirectory(root), () -> "shared folder not present: no " + root
                + " (../shared beside the repository, or -D" + PROPERTY + "=DIR); skipping this check of "
                + relative);
        Path file = root.resolve(relative);
        Assumptions.assumeTrue(Files.isRegularFile(file), () -> "shared file not present: no " + file
                + " (shared folder " + root + "); skipping this check");
        return file;
    }

    /** {@code ../shared} beside the outermost directory, from the working directory up, that holds a pom.xml. */
    private static Path besideRepository() {
        Path repository = Path.of("").toAbsolutePath();
        for (Path dir = repository; dir != null && Files.isRegularFile(dir.resolve("pom.xml")); dir = dir.getParent()) {
            repository = dir;
        }
        return repository.resolveSibling("shared");
    }

    private static void requireMarkedCaller(String relative) {
        boolean marked = STACK.walk(frames -> frames.anyMatch(SharedFolder::isMarked));
        if (!marked) {
            throw new IllegalStateException("a test reads the shared file " + relative + " but neither the test"
                    + " method nor its class is marked @" + ReadsSharedFolder.class.getSimpleName()
                    + "; mark it, so that CI's run without the shared folder checks that it skips");
        }
    }

    private static boolean isMarked(StackFrame frame) {
        for (Class<?> c = frame.getDeclaringClass(); c != null; c = c.getEnclosingClass()) {
            if (c.isAnnotationPresent(ReadsSharedFolder.class)) {
                return true;
            }
        }
        return method(frame).map(m -> m.isAnnotationPresent(ReadsSharedFolder.class)).orElse(false);
    }

    private static Optional<AnnotatedElement> method(StackFrame frame) {
        try {
            return Optional.of(frame.getDeclaringClass().getDeclaredMethod(frame.getMethodName(),
                    frame.getMethodType().parameterArray()));
        } catch (NoSuchMethodException e) {
            return Optional.empty(); // a constructor or class initialiser: only its class can be marked
        }
    }
}
