package org.spectralsieve.backup;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.InputStream;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.List;
import java.util.zip.ZipFile;
import org.jooq.DSLContext;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.condition.EnabledIfEnvironmentVariable;
import org.junit.jupiter.api.io.TempDir;
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

    /**
     * H2 → PostgreSQL → H2: the archive PostgreSQL writes back is, table by table, the very bytes the H2 archive
     * held (each entry's SHA-256 in the manifests, for every table the archive lists, whatever migrations added:
     * accounts, tokens, revisions), and the H2 library restored from it is row for row and in its shortlists the
     * original. The audit trail is the one table that grows: each restore records itself, so it holds the
     * original's entries, ids kept, and one entry per restore (checked row by row in {@link RestoredLibrary}).
     */
    @Test
    void aLibraryTakenH2ToPostgresAndBackToH2KeepsEveryTablesChecksumAndItsShortlists(@TempDir Path dir) throws Exception {
        SourceLibrary source = SourceLibrary.get();
        Path fromPostgres = dir.resolve("from-postgres.zip");
        Path fromH2Again = dir.resolve("from-h2-again.zip");
        try (ConfigurableApplicationContext postgres = postgres()) {
            postgres.getBean(LibraryRestore.class).restore(source.archive);
            write(postgres, fromPostgres);
        }
        try (ConfigurableApplicationContext h2 = LibraryApp.h2("back-from-postgres", false)) {
            h2.getBean(LibraryRestore.class).restore(fromPostgres);
            RestoredLibrary.assertSameAs(source.context, h2, 2);
            write(h2, fromH2Again);
        }

        ArchiveManifest original = manifest(source.archive);
        assertThat(original.tables().stream().map(ArchiveManifest.TableEntry::table).toList())
                .as("the archive lists every library table of the generated schema")
                .containsExactlyInAnyOrderElementsOf(LibraryTables.inDependencyOrder().stream().map(LibraryTables::name).toList());
        assertThat(original.tables()).allMatch(t -> t.rows() >= 0);
        int restores = 0;
        for (Path back : List.of(fromPostgres, fromH2Again)) {
            ArchiveManifest again = manifest(back);
            restores++;
            assertThat(checksums(again)).as("per-table checksums of %s", back.getFileName())
                    .isEqualTo(checksums(original)).isNotEmpty();
            assertThat(auditRows(again)).as("audit entries of %s: the original's and one per restore", back.getFileName())
                    .isEqualTo(auditRows(original) + restores);
            assertThat(again.curves()).as("curve checksums of %s", back.getFileName()).isEqualTo(original.curves());
            assertThat(again.schemaVersion()).isEqualTo(original.schemaVersion());
        }
        assertThat(manifest(fromPostgres).sourceDatabase()).as("the middle archive came from PostgreSQL").containsIgnoringCase("postgres");
    }

    /** Table name → entry name, rows, bytes and SHA-256, in archive order; every table but the audit trail. */
    private static List<String> checksums(ArchiveManifest manifest) {
        return manifest.tables().stream()
                .filter(t -> !t.table().equals("audit_entry"))
                .map(t -> t.table() + " " + t.entry() + " rows=" + t.rows() + " bytes=" + t.bytes() + " sha256=" + t.sha256())
                .toList();
    }

    private static long auditRows(ArchiveManifest manifest) {
        return manifest.tables().stream().filter(t -> t.table().equals("audit_entry")).mapToLong(ArchiveManifest.TableEntry::rows)
                .findFirst().orElseThrow();
    }

    private static ArchiveManifest manifest(Path archive) throws Exception {
        try (ZipFile zip = new ZipFile(archive.toFile()); InputStream in = zip.getInputStream(zip.getEntry(ArchiveManifest.ENTRY))) {
            return ArchiveManifest.fromJson(RowCodec.JSON.readTree(in.readAllBytes()));
        }
    }

    private static void write(ConfigurableApplicationContext context, Path archive) throws Exception {
        try (OutputStream out = Files.newOutputStream(archive)) {
            context.getBean(LibraryBackup.class).write(out);
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
