package org.spectralsieve.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.Statement;
import java.util.List;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The read-only commands on the plain-Java wiring (docs/command-line-start-up.md, "Commands without the Spring
 * context") answer exactly as in the Spring context: the same standard output, standard error and exit code,
 * command by command, on one H2 file holding the illustrative demo library; and the wiring steps aside for the
 * context whenever the context would do something it does not (migrate, load the demo library, honour a setting
 * it does not read). The reference is the earlier path itself, kept behind {@code -Dsieve.cli.wiring=spring}.
 */
class PlainWiringTest {

    @TempDir
    static Path folder;

    private static String demoLibrary;

    @BeforeAll
    static void aLibraryWithTheDemoMaterials() {
        demoLibrary = "jdbc:h2:file:" + folder.resolve("demo/sieve");
        CliRun first = CliRun.against(demoLibrary, "materials"); // migrates and loads the demo library
        assertThat(first.exitCode()).as(first.err()).isZero();
        assertThat(first.outLines().size()).isGreaterThan(10);
    }

    @BeforeEach
    void privateIndexFolder() {
        System.setProperty("sieve.index.dir", folder.resolve("index").toString());
    }

    @AfterEach
    void restoreSettings() {
        System.clearProperty("sieve.index.dir");
        System.clearProperty(PlainWiringSettings.WIRING);
        System.clearProperty("spring.datasource.hikari.maximum-pool-size");
        System.clearProperty("sieve.seed.load-on-empty");
    }

    @Test
    void eachReadCommandPrintsWhatTheSpringContextPrints() {
        long sample = firstSampleOf(CliRun.against(demoLibrary, "search", "passes over 80% at 254 nm, at 3 mm"));
        List<String[]> commands = List.of(
                new String[] {"materials"},
                new String[] {"materials", "--class", "plastic sheet"},
                new String[] {"materials", "--q", "acrylic"},
                new String[] {"search", "passes over 80% at 365 nm and blocks under 1% at 405 nm, thickness 1 to 6 mm"},
                new String[] {"search", "acrylic passes over 80% at 365 nm"},
                new String[] {"search", "passes over 50% at 365 nm behind 3 mm lamp-cover", "--limit", "3"},
                new String[] {"search", "blocks 99% UV, thickness 2 to 5 mm", "--limit", "5"},
                new String[] {"search", "passes over 80% at 365 nmm"},
                new String[] {"figures", "--sample", String.valueOf(sample)},
                new String[] {"figures", "--sample", String.valueOf(sample), "--emitter", "led-365", "--response", "uv-hazard"},
                new String[] {"figures", "--sample", String.valueOf(sample), "--thickness-mm", "2"},
                new String[] {"figures", "--sample", String.valueOf(sample), "--behind", "lamp-cover", "--behind-mm", "3"},
                new String[] {"figures", "--sample", "999999"});
        for (String[] command : commands) {
            System.clearProperty(PlainWiringSettings.WIRING);
            CliRun plain = CliRun.against(demoLibrary, command);
            System.setProperty(PlainWiringSettings.WIRING, "spring");
            CliRun context = CliRun.against(demoLibrary, command);

            String what = String.join(" ", command);
            assertThat(plain.exitCode()).as(what).isEqualTo(context.exitCode());
            assertThat(plain.out()).as(what).isEqualTo(context.out());
            assertThat(plain.err()).as(what).isEqualTo(context.err());
        }
    }

    @Test
    void aCurrentLibraryIsOpenedOnThePlainWiring() {
        try (LibraryServices library = LibraryContext.open(demoLibrary)) {
            assertThat(library.wiring()).isEqualTo("plain");
            assertThat(library.repository().countMaterials()).isPositive();
        }
    }

    @Test
    void theSwitchKeepsTheSpringContext() {
        System.setProperty(PlainWiringSettings.WIRING, "spring");
        try (LibraryServices library = LibraryContext.open(demoLibrary)) {
            assertThat(library.wiring()).isEqualTo("spring");
        }
    }

    @Test
    void aSettingThePlainWiringDoesNotReadLeavesTheCommandToTheContext() {
        System.setProperty("spring.datasource.hikari.maximum-pool-size", "3");
        try (LibraryServices library = LibraryContext.open(demoLibrary)) {
            assertThat(library.wiring()).isEqualTo("spring");
        }
    }

    @Test
    void aNewDatabaseIsMigratedAndGivenTheDemoLibraryByTheContext() {
        String fresh = "jdbc:h2:file:" + folder.resolve("fresh/sieve");
        try (LibraryServices library = LibraryContext.open(fresh)) {
            assertThat(library.wiring()).isEqualTo("spring");
            assertThat(library.repository().countMaterials()).isPositive();
        }
        try (LibraryServices again = LibraryContext.open(fresh)) {
            assertThat(again.wiring()).isEqualTo("plain");
        }
    }

    @Test
    void anEmptyLibraryWithTheDemoLoadSwitchedOffIsAnsweredPlainly() {
        System.setProperty("sieve.seed.load-on-empty", "false");
        String empty = "jdbc:h2:file:" + folder.resolve("empty/sieve");
        CliRun.against(empty, "materials"); // migrated by the context, left empty
        try (LibraryServices library = LibraryContext.open(empty)) {
            assertThat(library.wiring()).isEqualTo("plain");
            assertThat(library.repository().countMaterials()).isZero();
        }
    }

    @Test
    void aSchemaFlywayWouldRefuseIsReportedByTheContextInTheSameWords() throws Exception {
        String altered = "jdbc:h2:file:" + folder.resolve("altered/sieve");
        System.setProperty("sieve.seed.load-on-empty", "false");
        assertThat(CliRun.against(altered, "materials").exitCode()).isZero();
        try (Connection c = DriverManager.getConnection(altered, "sa", "");
             Statement s = c.createStatement()) {
            // a migration recorded with another checksum: the file was not made by this program's migrations
            s.executeUpdate("UPDATE \"flyway_schema_history\" SET \"checksum\" = 12345 WHERE \"version\" = '1'");
        }
        CliRun plain = CliRun.against(altered, "materials");
        System.setProperty(PlainWiringSettings.WIRING, "spring");
        CliRun context = CliRun.against(altered, "materials");

        assertThat(plain.exitCode()).isEqualTo(SieveCli.FAILED).isEqualTo(context.exitCode());
        assertThat(plain.err()).contains("cannot open the library").isEqualTo(context.err());
    }

    @Test
    void thePostgresProfileIsReadFromItsOwnPropertiesFile() {
        PlainWiringSettings settings = PlainWiringSettings.read(List.of("--spring.profiles.active=postgres"));

        assertThat(settings.dialect()).contains(org.jooq.SQLDialect.POSTGRES);
        assertThat(settings.databaseUrl()).hasValueSatisfying(url -> assertThat(url).startsWith("jdbc:postgresql:"));
        assertThat(settings.unhonoured()).isEmpty();
    }

    @Test
    void theCommandLinesOwnQuietSettingsAreHonouredAndOthersAreNot() {
        List<String> quiet = LibraryContext.QUIET;
        assertThat(PlainWiringSettings.read(quiet).unhonoured()).isEmpty();

        List<String> more = new java.util.ArrayList<>(quiet);
        more.add("--logging.level.org.jooq=DEBUG");
        more.add("--spring.jooq.config=settings.xml");
        assertThat(PlainWiringSettings.read(more).unhonoured())
                .containsExactlyInAnyOrder("logging.level.org.jooq", "spring.jooq.config");
    }

    /** The sample column of the search table's first row ("   1  name  23  regular ..."). */
    private static long firstSampleOf(CliRun search) {
        assertThat(search.exitCode()).as(search.err()).isZero();
        String row = search.outLines().stream().filter(l -> l.matches("\\s+1\\s{2}.*")).findFirst().orElseThrow();
        return Long.parseLong(row.trim().split(" {2,}")[2]);
    }
}
