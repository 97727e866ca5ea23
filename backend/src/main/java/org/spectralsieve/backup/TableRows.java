package org.spectralsieve.backup;

import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import java.util.List;
import java.util.function.Consumer;
import org.jooq.Condition;
import org.jooq.DSLContext;
import org.jooq.Field;
import org.jooq.Record;
import org.jooq.Result;
import org.jooq.SelectSelectStep;
import org.jooq.Table;
import org.jooq.TableField;
import org.jooq.impl.DSL;
import org.spectralsieve.library.db.Tables;

/**
 * Reads a table's rows a page at a time in primary-key order, so that neither the database driver nor we
 * hold more than {@link #PAGE_ROWS} rows of a table at once (H2 keeps a whole result in memory, and a
 * PostgreSQL cursor needs settings a pooled connection may not have; keyset paging needs neither).
 */
final class TableRows {

    /** Rows fetched at once: with the largest row (an original file, 20 MB by default) about 160 MB at worst. */
    static final int PAGE_ROWS = 8;

    private TableRows() {
    }

    static void forEach(DSLContext db, Table<?> table, Consumer<Record> action) {
        List<TableField<?, ?>> key = LibraryTables.primaryKey(table);
        Object[] last = null;
        while (true) {
            SelectSelectStep<Record> select = db.select(table.fields());
            Result<Record> page = (last == null ? select.from(table) : select.from(table).where(after(key, last)))
                    .orderBy(key)
                    .limit(PAGE_ROWS)
                    .fetch();
            page.forEach(action);
            if (page.size() < PAGE_ROWS) {
                return;
            }
            Record lastRow = page.get(page.size() - 1);
            last = key.stream().map(lastRow::get).toArray();
        }
    }

    @SuppressWarnings("unchecked")
    private static Condition after(List<TableField<?, ?>> key, Object[] last) {
        if (key.size() == 1) {
            return ((Field<Object>) key.get(0)).gt(last[0]);
        }
        return DSL.row(key.toArray(Field<?>[]::new)).gt(last);
    }

    /**
     * A curve's stored arrays as they are (wavelengths, transmittance, below-detection flags, per-point
     * detection limits and absorbance uncertainties when present), hashed in that order: equal hashes mean bit-identical curves.
     */
    static String curveDataSha256(Record curve) {
        MessageDigest digest = sha256();
        digest.update(curve.get(Tables.CURVE.WAVELENGTHS_NM));
        digest.update(curve.get(Tables.CURVE.TRANSMITTANCE));
        digest.update(curve.get(Tables.CURVE.BELOW_DETECTION));
        byte[] limits = curve.get(Tables.CURVE.DETECTION_LIMITS);
        if (limits != null) {
            digest.update(limits);
        }
        // then the measurement uncertainty when present (V8); a curve without one hashes as it always did
        byte[] sigma = curve.get(Tables.CURVE.ABSORBANCE_UNCERTAINTY);
        if (sigma != null) {
            digest.update(sigma);
        }
        return HexFormat.of().formatHex(digest.digest());
    }

    static MessageDigest sha256() {
        try {
            return MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every Java runtime has SHA-256", e);
        }
    }

    static boolean isCurveTable(Table<?> table) {
        return LibraryTables.name(table).equals(LibraryTables.name(Tables.CURVE));
    }
}
