package org.spectralsieve.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Path;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A command builds only what it needs (docs/command-line-start-up.md): the text index is made on the first
 * query that has words for it, so listing materials or searching by clauses alone leaves its folder
 * unmade. Observed on the index folder, not on timings. The library is an empty in-memory H2 (no demo
 * load: what is tested is the work around the command, not its answer).
 */
class CommandStartUpWorkTest {

    private static final String DB_URL = "jdbc:h2:mem:cli-start-up-work;DB_CLOSE_DELAY=-1";

    @TempDir
    Path indexFolder;

    @BeforeEach
    void privateIndexFolderAndNoDemoLoad() {
        // system properties rank below the command's own settings and above application.properties
        System.setProperty("sieve.index.dir", indexFolder.toString());
        System.setProperty("sieve.seed.load-on-empty", "false");
    }

    @AfterEach
    void restoreSettings() {
        System.clearProperty("sieve.index.dir");
        System.clearProperty("sieve.seed.load-on-empty");
    }

    @Test
    void listingMaterialsAndSearchingByClausesAloneLeaveTheTextIndexUnbuilt() {
        CliRun materials = CliRun.against(DB_URL, "materials");
        CliRun clausesOnly = CliRun.against(DB_URL, "search", "passes over 80% at 365 nm and blocks under 1% at 405 nm");

        assertThat(materials.exitCode()).as(materials.err()).isZero();
        assertThat(clausesOnly.exitCode()).as(clausesOnly.err()).isZero();
        assertThat(indexFolder.resolve("text")).doesNotExist();
    }

    @Test
    void aCommandStartsSpringWithoutTheBackgroundWarmUpThread() {
        // the warm-up thread prepares a web server's first request; a command only shares the CPU with it
        String before = System.getProperty(LibraryContext.IGNORE_BACKGROUND_PREINITIALISATION);
        try {
            System.clearProperty(LibraryContext.IGNORE_BACKGROUND_PREINITIALISATION);
            // about the Spring context: a current library would otherwise be answered on the plain wiring
            System.setProperty(PlainWiringSettings.WIRING, "spring");
            CliRun materials = CliRun.against(DB_URL, "materials");

            assertThat(materials.exitCode()).as(materials.err()).isZero();
            assertThat(System.getProperty(LibraryContext.IGNORE_BACKGROUND_PREINITIALISATION)).isEqualTo("true");
        } finally {
            System.clearProperty(PlainWiringSettings.WIRING);
            if (before == null) {
                System.clearProperty(LibraryContext.IGNORE_BACKGROUND_PREINITIALISATION);
            } else {
                System.setProperty(LibraryContext.IGNORE_BACKGROUND_PREINITIALISATION, before);
            }
        }
    }

    @Test
    void aSearchWithWordsBuildsTheTextIndexItNeeds() {
        // the counterpart, so that the folder's absence above means something
        CliRun withWords = CliRun.against(DB_URL, "search", "acrylic passes over 80% at 365 nm");

        assertThat(withWords.exitCode()).as(withWords.err()).isZero();
        assertThat(indexFolder.resolve("text")).exists();
    }
}
