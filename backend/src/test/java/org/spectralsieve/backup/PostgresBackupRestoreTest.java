package org.spectralsieve.backup;

import static org.assertj.core.api.Assertions.assertThat;

import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.List;
import org.jooq.DSLContext;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.condition.EnabledIfEnvironmentVariable;
import org.spectralsieve.library.TestPostgres;
import org.springframework.context.ConfigurableApplicationContext;

/**
 * A backup of the H2 library restored into PostgreSQL, in a schema of its own that is dropped afterwards
 * (the test database may be shared with other tests). Runs where {@code SIEVE_TEST_POSTGRES_URL} names a
 * database; skipped elsewhere.
 */
@EnabledIfEnvironmentVariable(named = TestPostgres.URL_VARIABLE, matches = ".+",
        disabledReason = "no PostgreSQL for tests: set SIEVE_TEST_POSTGRES_URL (and SIEVE_TEST_POSTGRES_USER/_PASSWORD)")
class PostgresBackupRestoreTest {

    private final String schema = "backup_restore_" + Long.toString(System.nanoTime(), 36);

    @BeforeEach
    void createSchema() throws SQLException {
        sql("CREATE SCHEMA " + schema);
    }

    @AfterEach
    void dropSchema() throws SQLException {
        sql("DROP SCHEMA " + schema + " CASCADE");
    }

    @Test
    void anH2LibraryRestoredIntoPostgresIsRowForRowAndBitForBitTheSameAndAnswersTheSame() throws Exception {
        SourceLibrary source = SourceLibrary.get();
        try (ConfigurableApplicationContext target = postgres()) {
            LibraryRestore restore = target.getBean(LibraryRestore.class);
            assertThat(restore.rowCounts().values()).allMatch(rows -> rows == 0);

            restore.restore(source.archive);

            RestoredLibrary.assertSameAs(source.context, target);
            BackupRestoreTest.assertNewRowsGetUnusedIds(target, source.context.getBean(DSLContext.class));
        }
    }

    @Test
    void aRestoreThePostgresDatabaseRefusesMidwayLeavesItEmpty() throws Exception {
        java.nio.file.Path broken = Archives.altered(SourceLibrary.get().archive,
                java.nio.file.Files.createTempFile("broken-", ".zip"), "reference_spectrum",
                text -> text.replaceFirst("\"kind\":\"emitter\"", "\"kind\":\"lamp\""), true);
        try (ConfigurableApplicationContext target = postgres()) {
            org.assertj.core.api.Assertions.assertThatThrownBy(() -> target.getBean(LibraryRestore.class).restore(broken))
                    .isInstanceOf(RestoreFailedException.class).hasMessageContaining("reference_spectrum_kind_known");
            assertThat(RestoredLibrary.count(target.getBean(DSLContext.class))).isZero();
        } finally {
            java.nio.file.Files.deleteIfExists(broken);
        }
    }

    private ConfigurableApplicationContext postgres() {
        return LibraryApp.start(url(), false, List.of("--spring.profiles.active=postgres",
                "--spring.datasource.username=" + user(), "--spring.datasource.password=" + password()));
    }

    private String url() {
        String base = System.getenv(TestPostgres.URL_VARIABLE);
        return base + (base.contains("?") ? "&" : "?") + "currentSchema=" + schema;
    }

    private void sql(String statement) throws SQLException {
        try (Connection c = DriverManager.getConnection(System.getenv(TestPostgres.URL_VARIABLE), user(), password());
             Statement s = c.createStatement()) {
            s.execute(statement);
        }
    }

    private static String user() {
        return envOr("SIEVE_TEST_POSTGRES_USER", "sieve");
    }

    private static String password() {
        return envOr("SIEVE_TEST_POSTGRES_PASSWORD", "sieve");
    }

    private static String envOr(String name, String fallback) {
        String value = System.getenv(name);
        return value == null ? fallback : value;
    }
}
