package org.spectralsieve.testsupport;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.opentest4j.TestAbortedException;

/**
 * The lookup every test of the project uses for {@code ../shared}. These tests are deliberately not
 * marked: they make their own folders and must run (not skip) in CI's run without the shared folder;
 * they call the lookup through {@link #lookUp}, which is marked as a reading test's method would be.
 */
class SharedFolderTest {

    private String before;

    @BeforeEach
    void remember() {
        before = System.getProperty(SharedFolder.PROPERTY);
    }

    @AfterEach
    void restore() {
        if (before == null) {
            System.clearProperty(SharedFolder.PROPERTY);
        } else {
            System.setProperty(SharedFolder.PROPERTY, before);
        }
    }

    @ReadsSharedFolder
    private static Path lookUp(String relative) {
        return SharedFolder.referenceFile(relative);
    }

    @ReadsSharedFolder
    private static Path lookUpByName(String fileName) {
        return SharedFolder.referenceFileNamed(fileName);
    }

    @Test
    void aReferenceFileIsFoundByItsNameInWhicheverFolderItLies(@TempDir Path shared) throws IOException {
        Path file = Files.createDirectories(shared.resolve("reference-data/some-collection")).resolve("series.jdx");
        Files.writeString(file, "##TITLE=illustrative\n");
        Files.writeString(Files.createDirectories(shared.resolve("reference-data/other")).resolve("b.csv"), "300,1\n");
        System.setProperty(SharedFolder.PROPERTY, shared.toString());

        assertThat(lookUpByName("series.jdx")).isEqualTo(file);
    }

    @Test
    void aNameNoReferenceFileHasSkipsTheTestNamingIt(@TempDir Path shared) throws IOException {
        Files.createDirectories(shared.resolve("reference-data/other"));
        System.setProperty(SharedFolder.PROPERTY, shared.toString());

        assertThatThrownBy(() -> lookUpByName("series.jdx")).isInstanceOf(TestAbortedException.class)
                .hasMessageContaining("no series.jdx under " + shared.resolve("reference-data"));
    }

    @ReadsSharedFolder
    private static java.util.List<Path> lookUpByGlob(String glob) {
        return SharedFolder.referenceFilesNamed(glob);
    }

    @Test
    void aGlobFindsEveryReferenceFileOfItsKindInAnyFolder(@TempDir Path shared) throws IOException {
        Path one = Files.createDirectories(shared.resolve("reference-data/tables/a")).resolve("first.yml");
        Path two = Files.createDirectories(shared.resolve("reference-data/tables/b")).resolve("second.yml");
        Files.writeString(one, "data: 1\n");
        Files.writeString(two, "data: 2\n");
        Files.writeString(shared.resolve("reference-data/tables/notes.md"), "# notes\n");
        System.setProperty(SharedFolder.PROPERTY, shared.toString());

        assertThat(lookUpByGlob("*.yml")).containsExactly(one, two);
        assertThatThrownBy(() -> lookUpByGlob("*.jdx")).isInstanceOf(TestAbortedException.class)
                .hasMessageContaining("none named *.jdx");
    }

    @Test
    void twoReferenceFilesOfOneNameAreAnErrorNotAGuess(@TempDir Path shared) throws IOException {
        Files.writeString(Files.createDirectories(shared.resolve("reference-data/one")).resolve("a.csv"), "300,1\n");
        Files.writeString(Files.createDirectories(shared.resolve("reference-data/two")).resolve("a.csv"), "300,2\n");
        System.setProperty(SharedFolder.PROPERTY, shared.toString());

        assertThatThrownBy(() -> lookUpByName("a.csv")).isInstanceOf(IllegalStateException.class)
                .hasMessageContaining("more than one reference file is named a.csv");
    }

    @Test
    void aReferenceFileInTheConfiguredFolderIsFound(@TempDir Path shared) throws IOException {
        Path file = Files.createDirectories(shared.resolve("reference-data/cie-1nm")).resolve("a.csv");
        Files.writeString(file, "300,0.930483\n");
        System.setProperty(SharedFolder.PROPERTY, shared.toString());

        assertThat(lookUp("cie-1nm/a.csv")).isEqualTo(file);
    }

    @Test
    void aMissingFolderSkipsTheTestSayingWhereItLooked(@TempDir Path parent) {
        Path absent = parent.resolve("no-such-folder");
        System.setProperty(SharedFolder.PROPERTY, absent.toString());

        assertThatThrownBy(() -> lookUp("cie-1nm/a.csv")).isInstanceOf(TestAbortedException.class)
                .hasMessageContaining("shared folder not present: no " + absent)
                .hasMessageContaining("cie-1nm/a.csv");
    }

    @Test
    void aMissingFileInAnEmptyFolderSkipsTheTestNamingTheFile(@TempDir Path empty) {
        System.setProperty(SharedFolder.PROPERTY, empty.toString());

        assertThatThrownBy(() -> lookUp("astm-g173-pvlib/ASTMG173.csv")).isInstanceOf(TestAbortedException.class)
                .hasMessageContaining("shared file not present: no "
                        + empty.resolve("reference-data/astm-g173-pvlib/ASTMG173.csv"));
    }

    @Test
    void anUnmarkedCallerIsRefusedSoCiCannotLeaveItOutOfTheRunWithoutTheFolder(@TempDir Path shared) {
        System.setProperty(SharedFolder.PROPERTY, shared.toString());

        assertThatThrownBy(() -> SharedFolder.referenceFile("cie-1nm/a.csv"))
                .isInstanceOf(IllegalStateException.class)
                .hasMessageContaining("@ReadsSharedFolder");
    }

    @Test
    void withoutThePropertyTheFolderBesideTheRepositoryIsUsed() {
        System.clearProperty(SharedFolder.PROPERTY);
        // Maven runs these tests in importers/, one level below the repository root
        Path module = Path.of("").toAbsolutePath();
        assertThat(module.resolve("pom.xml")).exists();
        assertThat(module.resolveSibling("pom.xml")).exists();

        assertThat(SharedFolder.root()).isEqualTo(module.getParent().resolveSibling("shared"));
    }
}
