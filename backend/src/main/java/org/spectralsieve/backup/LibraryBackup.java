package org.spectralsieve.backup;

import java.io.FilterOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.security.DigestOutputStream;
import java.security.MessageDigest;
import java.sql.Connection;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import java.util.Locale;
import java.util.function.Supplier;
import java.util.zip.ZipEntry;
import java.util.zip.ZipOutputStream;
import org.jooq.DSLContext;
import org.jooq.Field;
import org.jooq.Table;
import org.jooq.impl.DSL;
import org.spectralsieve.backup.ArchiveManifest.Column;
import org.spectralsieve.backup.ArchiveManifest.CurveChecksum;
import org.spectralsieve.backup.ArchiveManifest.TableEntry;
import org.spectralsieve.library.db.Tables;

/**
 * Writes the whole library as one zip archive: one entry of JSON lines per table ({@code tables/NN-name.jsonl},
 * parents first, rows in primary-key order) and {@value ArchiveManifest#ENTRY} last, once every entry's
 * checksum is known. Everything is read in one read-only transaction that sees a single snapshot, so an
 * import committed meanwhile is either wholly in the archive or not at all.
 *
 * <p>Memory: rows are streamed page by page ({@link TableRows#PAGE_ROWS}) and written as they are read;
 * the manifest's list of curve checksums (about 200 bytes a curve) is the only thing that grows with the
 * library.
 */
public class LibraryBackup {

    private final DSLContext db;
    private final Supplier<String> schemaVersion;
    private final String application;

    /**
     * @param schemaVersion the Flyway version the database is migrated to
     * @param application   the program and version writing the archive, for the reader's information
     */
    public LibraryBackup(DSLContext db, Supplier<String> schemaVersion, String application) {
        this.db = db;
        this.schemaVersion = schemaVersion;
        this.application = application;
    }

    /** What an archive holds, for the command line's and the log's one-line report. */
    public record Summary(String schemaVersion, List<TableCount> tables, int curves) {
    }

    public record TableCount(String table, long rows) {
    }

    /** A name like {@code spectral-sieve-backup-20261203T203000Z.zip}, for downloads and the default file. */
    public static String suggestedFileName(Instant at) {
        return "spectral-sieve-backup-" + at.truncatedTo(ChronoUnit.SECONDS).toString().replace("-", "")
                .replace(":", "") + ".zip";
    }

    /** Writes the archive to {@code out}, which is left open. */
    public Summary write(OutputStream out) {
        return db.connectionResult(connection -> {
            boolean autoCommit = connection.getAutoCommit();
            int isolation = connection.getTransactionIsolation();
            try {
                connection.setAutoCommit(false);
                connection.setTransactionIsolation(SNAPSHOT_ISOLATION);
                DSLContext tx = DSL.using(connection, db.dialect(), db.settings());
                return writeArchive(tx, out);
            } finally {
                connection.rollback(); // read only: nothing to keep
                connection.setTransactionIsolation(isolation);
                connection.setAutoCommit(autoCommit);
            }
        });
    }

    /**
     * The level at which every query of one transaction sees the same committed state, while writers go on
     * unhindered: REPEATABLE READ is a snapshot on PostgreSQL and on H2's MVStore (tried on H2 2.x: a row
     * another connection inserts meanwhile stays unseen by the open transaction, and the insert does not wait).
     */
    static final int SNAPSHOT_ISOLATION = Connection.TRANSACTION_REPEATABLE_READ;

    private Summary writeArchive(DSLContext tx, OutputStream out) throws IOException {
        String version = schemaVersion.get();
        ZipOutputStream zip = new ZipOutputStream(new KeepOpen(out), StandardCharsets.UTF_8);
        List<TableEntry> entries = new ArrayList<>();
        List<CurveChecksum> curves = new ArrayList<>();
        List<Table<?>> tables = LibraryTables.inDependencyOrder();
        for (int i = 0; i < tables.size(); i++) {
            entries.add(writeTable(tx, zip, tables.get(i), i + 1, curves));
        }
        ArchiveManifest manifest = new ArchiveManifest(ArchiveManifest.FORMAT, ArchiveManifest.FORMAT_VERSION,
                Instant.now().toString(), application, version, tx.dialect().getName(), entries, curves);
        zip.putNextEntry(new ZipEntry(ArchiveManifest.ENTRY));
        zip.write(RowCodec.JSON.writerWithDefaultPrettyPrinter().writeValueAsBytes(manifest.toJson()));
        zip.closeEntry();
        zip.finish();
        zip.flush();
        return new Summary(version, entries.stream().map(e -> new TableCount(e.table(), e.rows())).toList(), curves.size());
    }

    private static TableEntry writeTable(DSLContext tx, ZipOutputStream zip, Table<?> table, int position,
                                         List<CurveChecksum> curves) throws IOException {
        String name = LibraryTables.name(table);
        String entryName = String.format(Locale.ROOT, "tables/%02d-%s.jsonl", position, name);
        List<Field<?>> fields = List.of(table.fields());
        RowCodec codec = new RowCodec(fields);
        boolean curveTable = TableRows.isCurveTable(table);
        MessageDigest digest = TableRows.sha256();
        CountingStream counted = new CountingStream(new DigestOutputStream(new KeepOpen(zip), digest));
        zip.putNextEntry(new ZipEntry(entryName));
        long[] rows = {0};
        TableRows.forEach(tx, table, row -> {
            try {
                counted.write(codec.encode(row).getBytes(StandardCharsets.UTF_8));
                counted.write('\n');
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
            rows[0]++;
            if (curveTable) {
                curves.add(new CurveChecksum(row.get(Tables.CURVE.SAMPLE_ID), row.get(Tables.CURVE.POINT_COUNT),
                        row.get(Tables.CURVE.SOURCE_SHA256), TableRows.curveDataSha256(row)));
            }
        });
        counted.flush();
        zip.closeEntry();
        String identity = table.getIdentity() == null ? null : LibraryTables.name(table.getIdentity().getField());
        List<Column> columns = fields.stream()
                .map(f -> new Column(LibraryTables.name(f), f.getDataType().getTypeName().toUpperCase(Locale.ROOT))).toList();
        return new TableEntry(name, entryName, rows[0], HexFormat.of().formatHex(digest.digest()), counted.count,
                identity, columns);
    }

    /** Lets a writer be closed or flushed without closing the stream under it. */
    private static final class KeepOpen extends FilterOutputStream {
        KeepOpen(OutputStream out) {
            super(out);
        }

        @Override
        public void write(byte[] b, int off, int len) throws IOException {
            out.write(b, off, len);
        }

        @Override
        public void close() throws IOException {
            flush();
        }
    }

    private static final class CountingStream extends FilterOutputStream {
        long count;

        CountingStream(OutputStream out) {
            super(out);
        }

        @Override
        public void write(int b) throws IOException {
            out.write(b);
            count++;
        }

        @Override
        public void write(byte[] b, int off, int len) throws IOException {
            out.write(b, off, len);
            count += len;
        }
    }
}
