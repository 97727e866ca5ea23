package org.spectralsieve.backup;

import static org.spectralsieve.library.db.Tables.ACCOUNT;
import static org.spectralsieve.library.db.Tables.AUDIT_ENTRY;

import java.io.BufferedInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.nio.file.Path;
import java.security.DigestInputStream;
import java.security.MessageDigest;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.function.Supplier;
import java.util.zip.ZipEntry;
import java.util.zip.ZipException;
import java.util.zip.ZipFile;
import org.jooq.DSLContext;
import org.jooq.Field;
import org.jooq.Identity;
import org.jooq.Table;
import org.jooq.impl.DSL;
import org.spectralsieve.audit.ActingUser;
import org.spectralsieve.audit.AuditEntry;
import org.spectralsieve.audit.AuditTrail;
import org.spectralsieve.backup.ArchiveManifest.CurveChecksum;
import org.spectralsieve.backup.ArchiveManifest.TableEntry;
import org.spectralsieve.library.db.Tables;
import tools.jackson.core.JacksonException;
import tools.jackson.databind.JsonNode;

/**
 * Loads an archive written by {@link LibraryBackup} into an empty library, in this order:
 * <ol>
 *   <li>read the manifest; refuse another format, a newer format version or another schema version;</li>
 *   <li>refuse a library that holds any row, except a server's own accounts, their tokens and the audit entries
 *       about them (a server in server mode has them as soon as its first admin exists): then the archive's
 *       accounts and tokens are left out, the server's own stand, and the archive's audit entries follow the
 *       server's own, their ids moved up by the server's highest (their order kept);</li>
 *   <li>check every entry before writing anything: its SHA-256, its row count, that every row reads as the
 *       target's columns, and every curve's checksums against the manifest;</li>
 *   <li>move each table's id counter past the highest id in the archive, so ids are never handed out again
 *       (on H2 this is a statement that commits on its own, which is why it comes before the rows: on an
 *       empty table it changes nothing but the next id);</li>
 *   <li>insert every row in one transaction, parents first, re-check every curve as the database now holds
 *       it, raise the library's change counter when the schema has one, record the restore as one audit entry
 *       after the archive's own (its id follows theirs), and commit — or roll back all.</li>
 * </ol>
 * The archive is read twice (check, then write) from the file, never held in memory.
 */
public class LibraryRestore {

    /** The manifest is read whole: room for about 300,000 curves' checksums, and no more (an archive is an upload). */
    static final int MAX_MANIFEST_BYTES = 64 * 1024 * 1024;

    private final DSLContext db;
    private final Supplier<String> schemaVersion;
    private final Runnable afterCommit;
    private final ActingUser actor;

    /** @param afterCommit run once the restored library is committed (drop derived in-memory copies) */
    public LibraryRestore(DSLContext db, Supplier<String> schemaVersion, Runnable afterCommit) {
        this(db, schemaVersion, afterCommit, ActingUser.LOCAL);
    }

    /** @param actor who restores, recorded in the restore's audit entry */
    public LibraryRestore(DSLContext db, Supplier<String> schemaVersion, Runnable afterCommit, ActingUser actor) {
        this.db = db;
        this.schemaVersion = schemaVersion;
        this.afterCommit = afterCommit;
        this.actor = java.util.Objects.requireNonNull(actor, "actor");
    }

    public record Summary(String schemaVersion, Map<String, Long> rowsByTable, int curves) {
    }

    /** The rows each library table holds now: all zero means a restore may go in. */
    public Map<String, Long> rowCounts() {
        return rowCounts(db);
    }

    private static Map<String, Long> rowCounts(DSLContext db) {
        Map<String, Long> counts = new LinkedHashMap<>();
        for (Table<?> table : LibraryTables.inDependencyOrder()) {
            counts.put(LibraryTables.name(table), (long) db.fetchCount(table));
        }
        return counts;
    }

    /**
     * @throws ArchiveRefusedException  the archive is unreadable, of another version, or does not match its manifest
     * @throws LibraryNotEmptyException the library holds rows
     * @throws RestoreFailedException   the database refused a row; nothing was written
     */
    public Summary restore(Path archive) {
        try (ZipFile zip = new ZipFile(archive.toFile())) {
            ArchiveManifest manifest = readManifest(zip);
            Map<TableEntry, Table<?>> tables = match(manifest);
            checkEntriesListed(zip, manifest);
            refuseUnlessEmpty(db);
            ServerOwn own = serverOwn(db);
            Map<Table<?>, Long> highestIds = verify(zip, manifest, tables);
            raiseIdCounters(highestIds, own);
            Summary summary = db.transactionResult(tx -> write(tx.dsl(), zip, manifest, tables, own));
            afterCommit.run();
            return summary;
        } catch (ZipException e) {
            throw new ArchiveRefusedException(null, "not a readable zip archive: " + e.getMessage());
        } catch (IOException e) {
            throw new ArchiveRefusedException(null, "cannot read the archive: " + e.getMessage());
        }
    }

    private static ArchiveManifest readManifest(ZipFile zip) throws IOException {
        ZipEntry entry = zip.getEntry(ArchiveManifest.ENTRY);
        if (entry == null) {
            throw new ArchiveRefusedException(ArchiveManifest.ENTRY, "the archive has no " + ArchiveManifest.ENTRY
                    + " (is it a Spectral Sieve backup, and was it written to the end?)");
        }
        ArchiveManifest manifest;
        try (InputStream in = zip.getInputStream(entry)) {
            byte[] bytes = in.readNBytes(MAX_MANIFEST_BYTES + 1);
            if (bytes.length > MAX_MANIFEST_BYTES) {
                throw new ArchiveRefusedException(ArchiveManifest.ENTRY, "the manifest is larger than "
                        + MAX_MANIFEST_BYTES + " bytes");
            }
            manifest = ArchiveManifest.fromJson(RowCodec.JSON.readTree(bytes));
        } catch (JacksonException | IllegalArgumentException e) {
            throw new ArchiveRefusedException(ArchiveManifest.ENTRY, "the manifest cannot be read: " + e.getMessage());
        }
        if (!ArchiveManifest.FORMAT.equals(manifest.format())) {
            throw new ArchiveRefusedException(ArchiveManifest.ENTRY, "format '" + manifest.format()
                    + "' is not a Spectral Sieve library archive (" + ArchiveManifest.FORMAT + ")");
        }
        if (manifest.formatVersion() < 1 || manifest.formatVersion() > ArchiveManifest.FORMAT_VERSION) {
            throw new ArchiveRefusedException(ArchiveManifest.ENTRY, "archive format version " + manifest.formatVersion()
                    + " is not one this program reads (1 to " + ArchiveManifest.FORMAT_VERSION + ")");
        }
        return manifest;
    }

    /** Each archive table paired with the target's table of that name, with the same columns; none left over. */
    private Map<TableEntry, Table<?>> match(ArchiveManifest manifest) {
        String target = schemaVersion.get();
        if (!manifest.schemaVersion().equals(target)) {
            throw new ArchiveRefusedException(ArchiveManifest.ENTRY, "the archive was written from a library at schema"
                    + " version " + manifest.schemaVersion() + "; this database is at version " + target
                    + ". Restore it with the program version that wrote it (into an empty library), then start this"
                    + " version, which migrates it.");
        }
        Map<String, Table<?>> byName = new LinkedHashMap<>();
        LibraryTables.inDependencyOrder().forEach(t -> byName.put(LibraryTables.name(t), t));
        Map<TableEntry, Table<?>> pairs = new LinkedHashMap<>();
        for (TableEntry entry : manifest.tables()) {
            Table<?> table = byName.remove(entry.table());
            if (table == null) {
                throw new ArchiveRefusedException(entry.entry(), "table '" + entry.table() + "' is not in this library's"
                        + " schema, or is listed twice");
            }
            List<String> expected = List.of(table.fields()).stream().map(LibraryTables::name).sorted().toList();
            List<String> given = entry.columns().stream().map(ArchiveManifest.Column::name).sorted().toList();
            if (!expected.equals(given)) {
                throw new ArchiveRefusedException(entry.entry(), "table '" + entry.table() + "' has columns " + given
                        + " in the archive and " + expected + " in this database");
            }
            pairs.put(entry, table);
        }
        if (!byName.isEmpty()) {
            throw new ArchiveRefusedException(ArchiveManifest.ENTRY, "the manifest lists no entry for table(s) "
                    + byName.keySet());
        }
        return pairs;
    }

    /** Every entry but the manifest is a listed table entry, and every listed entry is there. */
    private static void checkEntriesListed(ZipFile zip, ArchiveManifest manifest) {
        Set<String> listed = new LinkedHashSet<>();
        manifest.tables().forEach(t -> listed.add(t.entry()));
        Set<String> present = new LinkedHashSet<>();
        zip.stream().map(ZipEntry::getName).forEach(present::add);
        for (String name : present) {
            if (!name.equals(ArchiveManifest.ENTRY) && !listed.contains(name)) {
                throw new ArchiveRefusedException(name, "entry '" + name + "' is not listed in the manifest");
            }
        }
        for (String name : listed) {
            if (!present.contains(name)) {
                throw new ArchiveRefusedException(name, "entry '" + name + "' is listed in the manifest but missing");
            }
        }
    }

    /**
     * What a server holds of its own before a restore: whether it has accounts (then the archive's are left out), and
     * its highest audit id (the archive's entries are moved past it; 0 on an empty database, where ids are kept).
     */
    record ServerOwn(boolean hasAccounts, long auditIdOffset) {
        boolean skips(Table<?> table) {
            return hasAccounts && LibraryTables.SERVER_ACCOUNTS.contains(LibraryTables.name(table));
        }

        long idOffset(Table<?> table) {
            return LibraryTables.AUDIT.equals(LibraryTables.name(table)) ? auditIdOffset : 0;
        }

        /**
         * A private requirement preset of the archive (V14), restored into a server that keeps its own accounts: its
         * owner is one of the archive's accounts, left out, and the same id may be another person here. So the row is
         * kept but belongs to nobody and is retired (docs/presets.md): never shown to a stranger, nothing lost.
         */
        void unownPrivatePreset(Table<?> table, List<Field<?>> fields, Object[] values) {
            if (!hasAccounts || !LibraryTables.PRESETS.equals(LibraryTables.name(table))) {
                return;
            }
            int owner = index(fields, "owner_account_id");
            if (owner < 0 || values[owner] == null) {
                return;
            }
            values[owner] = null;
            set(fields, values, "owner_key", 0L);
            set(fields, values, "live_name", null);
            int retired = index(fields, "retired_at");
            if (retired >= 0 && values[retired] == null) {
                values[retired] = java.time.OffsetDateTime.now(java.time.ZoneOffset.UTC).truncatedTo(java.time.temporal.ChronoUnit.MICROS);
            }
        }

        private static int index(List<Field<?>> fields, String name) {
            for (int i = 0; i < fields.size(); i++) {
                if (fields.get(i).getName().equalsIgnoreCase(name)) {
                    return i;
                }
            }
            return -1;
        }

        private static void set(List<Field<?>> fields, Object[] values, String name, Object value) {
            int i = index(fields, name);
            if (i >= 0) {
                values[i] = value;
            }
        }
    }

    private static ServerOwn serverOwn(DSLContext db) {
        Long highestAudit = db.select(DSL.max(AUDIT_ENTRY.ID)).from(AUDIT_ENTRY).fetchOne(0, Long.class);
        return new ServerOwn(db.fetchCount(ACCOUNT) > 0, highestAudit == null ? 0 : highestAudit);
    }

    private static void refuseUnlessEmpty(DSLContext db) {
        Map<String, Long> held = new LinkedHashMap<>();
        for (Table<?> table : LibraryTables.inDependencyOrder()) {
            String name = LibraryTables.name(table);
            long rows = LibraryTables.SERVER_ACCOUNTS.contains(name) ? 0
                    : LibraryTables.AUDIT.equals(name)
                    ? db.fetchCount(AUDIT_ENTRY, AUDIT_ENTRY.SUBJECT_KIND.ne(AuditEntry.SUBJECT_ACCOUNT))
                    : db.fetchCount(table);
            if (rows > 0) {
                held.put(name, rows);
            }
        }
        if (!held.isEmpty()) {
            throw new LibraryNotEmptyException(held);
        }
    }

    /** Reads every entry once: checksum, rows, values and curves; returns each identity's highest id. */
    private static Map<Table<?>, Long> verify(ZipFile zip, ArchiveManifest manifest, Map<TableEntry, Table<?>> tables)
            throws IOException {
        Map<Long, CurveChecksum> expectedCurves = new HashMap<>();
        for (CurveChecksum c : manifest.curves()) {
            if (expectedCurves.put(c.sampleId(), c) != null) {
                throw new ArchiveRefusedException(ArchiveManifest.ENTRY, "curve of sample " + c.sampleId() + " listed twice");
            }
        }
        Map<Table<?>, Long> highestIds = new LinkedHashMap<>();
        Set<Long> curvesSeen = new LinkedHashSet<>();
        for (Map.Entry<TableEntry, Table<?>> pair : tables.entrySet()) {
            TableEntry entry = pair.getKey();
            Table<?> table = pair.getValue();
            RowCodec codec = new RowCodec(fieldsInArchiveOrder(entry, table));
            int identityIndex = identityIndex(entry, table);
            boolean curveTable = TableRows.isCurveTable(table);
            MessageDigest digest = TableRows.sha256();
            long highest = 0;
            ArchiveRefusedException rowFault = null;
            try (InputStream in = new DigestInputStream(new BufferedInputStream(new AtMost(
                    zip.getInputStream(zip.getEntry(entry.entry())), entry)), digest)) {
                BoundedLines lines = new BoundedLines(in, BoundedLines.MAX_LINE_BYTES);
                try {
                    for (String line = lines.next(); line != null; line = lines.next()) {
                        Object[] values = decode(codec, entry, lines.lineNumber(), line);
                        if (identityIndex >= 0) {
                            highest = Math.max(highest, ((Number) values[identityIndex]).longValue());
                        }
                        if (curveTable) {
                            curvesSeen.add(checkCurve(codec, values, expectedCurves, entry, lines.lineNumber()));
                        }
                    }
                    if (lines.lineNumber() != entry.rows()) {
                        rowFault = new ArchiveRefusedException(entry.entry(), "entry '" + entry.entry() + "' holds "
                                + lines.lineNumber() + " rows; the manifest says " + entry.rows());
                    }
                } catch (ArchiveRefusedException e) {
                    // read on to the end: a damaged entry is reported as such, by its checksum, not by its symptom
                    rowFault = e;
                    in.transferTo(OutputStream.nullOutputStream());
                }
            } catch (IOException e) {
                throw new ArchiveRefusedException(entry.entry(), "entry '" + entry.entry() + "' cannot be read: "
                        + e.getMessage());
            }
            String actual = HexFormat.of().formatHex(digest.digest());
            if (!actual.equalsIgnoreCase(entry.sha256())) {
                throw new ArchiveRefusedException(entry.entry(), "entry '" + entry.entry() + "' has SHA-256 " + actual
                        + "; the manifest says " + entry.sha256() + " (the archive is damaged or was altered)");
            }
            if (rowFault != null) {
                throw rowFault;
            }
            if (identityIndex >= 0) {
                highestIds.put(table, highest);
            }
        }
        expectedCurves.keySet().removeAll(curvesSeen);
        if (!expectedCurves.isEmpty()) {
            throw new ArchiveRefusedException(ArchiveManifest.ENTRY, "the manifest lists curves the archive lacks: samples "
                    + expectedCurves.keySet().stream().sorted().limit(10).toList());
        }
        return highestIds;
    }

    private static Object[] decode(RowCodec codec, TableEntry entry, long line, String text) {
        try {
            return codec.decode(RowCodec.JSON.readTree(text));
        } catch (JacksonException | IllegalArgumentException e) {
            throw new ArchiveRefusedException(entry.entry(), line, "entry '" + entry.entry() + "' line " + line + ": "
                    + e.getMessage());
        }
    }

    /** The curve's checksums from the row as the archive holds it; returns its sample id. */
    private static long checkCurve(RowCodec codec, Object[] values, Map<Long, CurveChecksum> expected, TableEntry entry,
                                   long line) {
        var row = DSL.using(org.jooq.SQLDialect.DEFAULT).newRecord(codec.fields().toArray(Field<?>[]::new));
        row.fromArray(values);
        long sampleId = row.get(Tables.CURVE.SAMPLE_ID);
        CurveChecksum listed = expected.get(sampleId);
        if (listed == null) {
            throw new ArchiveRefusedException(entry.entry(), line, "entry '" + entry.entry() + "' line " + line
                    + ": the curve of sample " + sampleId + " is not in the manifest's curve list");
        }
        String data = TableRows.curveDataSha256(row);
        if (!data.equals(listed.dataSha256()) || !row.get(Tables.CURVE.SOURCE_SHA256).equals(listed.sourceSha256())
                || row.get(Tables.CURVE.POINT_COUNT) != listed.points()) {
            throw new ArchiveRefusedException(entry.entry(), line, "entry '" + entry.entry() + "' line " + line
                    + ": the curve of sample " + sampleId + " does not match its checksums in the manifest");
        }
        return sampleId;
    }

    private static List<Field<?>> fieldsInArchiveOrder(TableEntry entry, Table<?> table) {
        List<Field<?>> fields = new ArrayList<>();
        for (ArchiveManifest.Column column : entry.columns()) {
            for (Field<?> field : table.fields()) {
                if (LibraryTables.name(field).equals(column.name())) {
                    fields.add(field);
                }
            }
        }
        return fields;
    }

    private static int identityIndex(TableEntry entry, Table<?> table) {
        Identity<?, ?> identity = table.getIdentity();
        if (identity == null) {
            return -1;
        }
        String name = LibraryTables.name(identity.getField());
        for (int i = 0; i < entry.columns().size(); i++) {
            if (entry.columns().get(i).name().equals(name)) {
                return i;
            }
        }
        return -1;
    }

    /**
     * The next id of every identity column is set past the archive's highest, in statements of their own
     * (each commits on H2). The same statement restarts an identity on H2 and on PostgreSQL.
     */
    private void raiseIdCounters(Map<Table<?>, Long> highestIds, ServerOwn own) {
        highestIds.forEach((table, highest) -> {
            if (highest > 0 && !own.skips(table)) {
                db.execute("ALTER TABLE {0} ALTER COLUMN {1} RESTART WITH {2}", table,
                        DSL.name(table.getIdentity().getField().getName()), DSL.inline(highest + own.idOffset(table) + 1));
            }
        });
    }

    private Summary write(DSLContext tx, ZipFile zip, ArchiveManifest manifest, Map<TableEntry, Table<?>> tables,
                          ServerOwn own) throws IOException {
        refuseUnlessEmpty(tx); // again, inside the transaction: another restore may have won the race
        Map<String, Long> rows = new LinkedHashMap<>();
        for (Map.Entry<TableEntry, Table<?>> pair : tables.entrySet()) {
            if (own.skips(pair.getValue())) {
                rows.put(pair.getKey().table(), 0L); // the server's own accounts stand
                continue;
            }
            rows.put(pair.getKey().table(), insertRows(tx, zip, pair.getKey(), pair.getValue(), own));
        }
        recheckCurves(tx, manifest);
        Summary summary = new Summary(manifest.schemaVersion(), rows, manifest.curves().size());
        long total = rows.values().stream().mapToLong(Long::longValue).sum();
        AuditTrail.record(tx, AuditEntry.by(actor, AuditEntry.ACTION_RESTORE_BACKUP, AuditEntry.SUBJECT_LIBRARY, null,
                null, "restored the library from a backup written " + manifest.createdAt() + " by "
                        + manifest.application() + ": " + total + " rows, " + summary.curves() + " curves"
                        + (own.hasAccounts() ? "; this server's own accounts kept, the archive's left out (with their"
                        + " private presets: kept retired, owned by nobody)" : "")
                        + (own.auditIdOffset() > 0 ? "; the archive's audit entries follow this server's own, ids moved up by "
                        + own.auditIdOffset() : ""), null, summary));
        LibraryTables.bookkeeping("library_generation")
                .ifPresent(generation -> tx.execute("UPDATE {0} SET n = n + 1", generation));
        return summary;
    }

    private static long insertRows(DSLContext tx, ZipFile zip, TableEntry entry, Table<?> table, ServerOwn own)
            throws IOException {
        long idOffset = own.idOffset(table);
        List<Field<?>> fields = fieldsInArchiveOrder(entry, table);
        RowCodec codec = new RowCodec(fields);
        int identityIndex = idOffset == 0 ? -1 : identityIndex(entry, table);
        try (InputStream in = new BufferedInputStream(zip.getInputStream(zip.getEntry(entry.entry())))) {
            BoundedLines lines = new BoundedLines(in, BoundedLines.MAX_LINE_BYTES);
            for (String line = lines.next(); line != null; line = lines.next()) {
                Object[] values = decode(codec, entry, lines.lineNumber(), line);
                if (identityIndex >= 0) {
                    values[identityIndex] = ((Number) values[identityIndex]).longValue() + idOffset;
                }
                own.unownPrivatePreset(table, fields, values);
                try {
                    tx.insertInto(table, fields).values(values).execute();
                } catch (RuntimeException e) { // jOOQ's or, under Spring, Spring's translation of it
                    throw new RestoreFailedException(entry.entry(), lines.lineNumber(), "the database refused entry '"
                            + entry.entry() + "' line " + lines.lineNumber() + " (table " + entry.table() + "): "
                            + rootMessage(e) + "; nothing was restored", e);
                }
            }
            return lines.lineNumber();
        }
    }

    /** Every curve as the target database now holds it, against the manifest: bit-identical or nothing. */
    private static void recheckCurves(DSLContext tx, ArchiveManifest manifest) {
        Map<Long, String> expected = new HashMap<>();
        manifest.curves().forEach(c -> expected.put(c.sampleId(), c.dataSha256()));
        TableRows.forEach(tx, Tables.CURVE, row -> {
            long sampleId = row.get(Tables.CURVE.SAMPLE_ID);
            if (!TableRows.curveDataSha256(row).equals(expected.get(sampleId))) {
                throw new RestoreFailedException(null, 0, "the curve of sample " + sampleId + " reads back from the"
                        + " database differently from the archive; nothing was restored", null);
            }
        });
    }

    /**
     * An entry's bytes, refused once they run past the size its manifest states: a crafted entry that
     * inflates without end costs no more than the manifest admits to.
     */
    private static final class AtMost extends java.io.FilterInputStream {
        private final TableEntry entry;
        private long read;

        AtMost(InputStream in, TableEntry entry) {
            super(in);
            this.entry = entry;
        }

        @Override
        public int read() throws IOException {
            int b = super.read();
            count(b < 0 ? 0 : 1);
            return b;
        }

        @Override
        public int read(byte[] buffer, int offset, int length) throws IOException {
            int n = super.read(buffer, offset, length);
            count(Math.max(n, 0));
            return n;
        }

        private void count(int n) throws IOException {
            read += n;
            if (read > entry.bytes()) {
                throw new IOException("it holds more than the " + entry.bytes() + " bytes the manifest states"
                        + " (the archive is damaged or was altered)");
            }
        }
    }

    private static String rootMessage(Throwable e) {
        Throwable t = e;
        while (t.getCause() != null && t.getCause() != t) {
            t = t.getCause();
        }
        String message = t.getMessage() == null ? t.getClass().getSimpleName() : t.getMessage();
        return message.lines().findFirst().orElse(message);
    }
}
