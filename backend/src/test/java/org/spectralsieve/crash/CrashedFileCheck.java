package org.spectralsieve.crash;

import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.spectralsieve.crash.CrashFiles.SentFile;
import org.spectralsieve.library.PackedArrays;

/**
 * Reads a copy of the database file as the kill left it, before the service opens the original again (on
 * PostgreSQL, the database itself, which the kill does not touch): every
 * acknowledged import must be there whole and bit-identical, and nothing partial may exist. Reading a copy
 * leaves the crashed file itself untouched, so the restart that follows still has to open it unaided.
 */
final class CrashedFileCheck {

    /**
     * Row counts of the copy: what must never fall from one crash to the next. The audit trail's highest id must not
     * fall either: with its rows never lost and its ids a primary key, an id handed out again would have to collide.
     */
    record Counts(long materials, long samples, long spectra, long auditEntries, long highestAuditId) {
        boolean below(Counts earlier) {
            return materials < earlier.materials || samples < earlier.samples || spectra < earlier.spectra
                    || auditEntries < earlier.auditEntries || highestAuditId < earlier.highestAuditId;
        }
    }

    /**
     * @param lost    acknowledged imports missing or changed, by key ("sample:id" or "kind/name") with what is wrong
     * @param partial descriptions of partial rows
     */
    record Findings(Counts counts, Map<String, String> lost, List<String> partial) {
    }

    private CrashedFileCheck() {
    }

    static Findings check(Path copyWithoutExtension, Answered answered) throws SQLException {
        try (Connection db = DriverManager.getConnection("jdbc:h2:file:" + copyWithoutExtension, "sa", "")) {
            return check(db, answered);
        }
    }

    /**
     * The same checks on a PostgreSQL database the killed service wrote: the database server outlives the
     * application process, so it is read as it is, with no copy (nothing else writes it between kill and restart).
     */
    static Findings checkPostgres(String jdbcUrl, String user, String password, Answered answered) throws SQLException {
        try (Connection db = DriverManager.getConnection(jdbcUrl, user, password)) {
            return check(db, answered);
        }
    }

    private static Findings check(Connection db, Answered answered) throws SQLException {
        Map<String, String> lost = new TreeMap<>();
        for (Answered.Sample s : answered.samples()) {
            String problem = sampleProblem(db, s);
            if (problem != null) {
                lost.put("sample:" + s.sampleId(), problem);
            }
        }
        for (Answered.Spectrum s : answered.spectra()) {
            String problem = spectrumProblem(db, s);
            if (problem != null) {
                lost.put(s.kind() + "/" + s.name(), problem);
            }
        }
        return new Findings(counts(db), lost, partial(db));
    }

    private static String sampleProblem(Connection db, Answered.Sample s) throws SQLException {
        String what = "sample " + s.sampleId() + " (" + s.file().name() + ", round " + s.round() + ", " + s.route() + ")";
        try (PreparedStatement q = db.prepareStatement("""
                SELECT s.material_id, m.name, c.point_count, c.wavelengths_nm, c.transmittance, c.source_sha256,
                       f.sha256, f.bytes
                FROM sample s JOIN material m ON m.id = s.material_id
                LEFT JOIN curve c ON c.sample_id = s.id LEFT JOIN source_file f ON f.sample_id = s.id
                WHERE s.id = ?""")) {
            q.setLong(1, s.sampleId());
            try (ResultSet r = q.executeQuery()) {
                if (!r.next()) {
                    return what + " is gone";
                }
                if (r.getLong(1) != s.materialId() || !s.materialName().equals(r.getString(2))) {
                    return what + " now belongs to material " + r.getLong(1) + " '" + r.getString(2) + "', acknowledged "
                            + s.materialId() + " '" + s.materialName() + "'";
                }
                if (r.getBytes(4) == null || r.getBytes(8) == null) {
                    return what + " lacks its curve or its source file";
                }
                int n = r.getInt(3);
                String curveProblem = pointsProblem(s.file(), PackedArrays.unpackDoubles(r.getBytes(4), n, "wavelengths_nm"),
                        PackedArrays.unpackDoubles(r.getBytes(5), n, "transmittance"));
                if (curveProblem != null) {
                    return what + ": " + curveProblem;
                }
                if (!s.file().sha256().equals(r.getString(6)) || !s.file().sha256().equals(r.getString(7))
                        || !Arrays.equals(s.file().bytes(), r.getBytes(8))) {
                    return what + " names another file now (checksums " + r.getString(6) + " / " + r.getString(7) + ")";
                }
                return null;
            }
        }
    }

    private static String spectrumProblem(Connection db, Answered.Spectrum s) throws SQLException {
        String what = s.kind() + " " + s.name() + " (round " + s.round() + ")";
        try (PreparedStatement q = db.prepareStatement("""
                SELECT point_count, wavelengths_nm, relative_values, source_sha256, source_bytes
                FROM reference_spectrum WHERE kind = ? AND name = ?""")) {
            q.setString(1, s.kind());
            q.setString(2, s.name());
            try (ResultSet r = q.executeQuery()) {
                if (!r.next()) {
                    return what + " is gone";
                }
                int n = r.getInt(1);
                String pointsProblem = pointsProblem(s.file(), PackedArrays.unpackDoubles(r.getBytes(2), n, "wavelengths_nm"),
                        PackedArrays.unpackDoubles(r.getBytes(3), n, "relative_values"));
                if (pointsProblem != null) {
                    return what + ": " + pointsProblem;
                }
                if (!s.file().sha256().equals(r.getString(4)) || !Arrays.equals(s.file().bytes(), r.getBytes(5))) {
                    return what + " holds another file now";
                }
                return null;
            }
        }
    }

    /** Bit for bit: the raw IEEE 754 patterns must be equal, not merely close. */
    static String pointsProblem(SentFile sent, double[] nm, double[] values) {
        if (!sameBits(sent.nm(), nm)) {
            return "wavelengths differ from the file sent";
        }
        if (!sameBits(sent.values(), values)) {
            return "values differ from the file sent";
        }
        return null;
    }

    static boolean sameBits(double[] a, double[] b) {
        if (a.length != b.length) {
            return false;
        }
        for (int i = 0; i < a.length; i++) {
            if (Double.doubleToRawLongBits(a[i]) != Double.doubleToRawLongBits(b[i])) {
                return false;
            }
        }
        return true;
    }

    /** Rows that only part of an import would leave: every import writes all of them in one transaction. */
    private static List<String> partial(Connection db) throws SQLException {
        List<String> found = new ArrayList<>();
        query(db, "SELECT id, name FROM material m WHERE NOT EXISTS (SELECT 1 FROM sample s WHERE s.material_id = m.id)",
                r -> "material " + r.getLong(1) + " '" + r.getString(2) + "' has no sample", found);
        query(db, "SELECT id FROM sample s WHERE NOT EXISTS (SELECT 1 FROM curve c WHERE c.sample_id = s.id)",
                r -> "sample " + r.getLong(1) + " has no curve", found);
        query(db, "SELECT id FROM sample s WHERE NOT EXISTS (SELECT 1 FROM source_file f WHERE f.sample_id = s.id)",
                r -> "sample " + r.getLong(1) + " has no source file", found);
        query(db, "SELECT c.sample_id FROM curve c JOIN source_file f ON f.sample_id = c.sample_id"
                        + " WHERE c.source_sha256 <> f.sha256 OR f.size_bytes <> OCTET_LENGTH(f.bytes)",
                r -> "sample " + r.getLong(1) + ": its curve and its source file disagree", found);
        // the audit entry is written in the import's transaction: a stored sample or spectrum without one is half a change
        query(db, "SELECT id FROM sample s WHERE NOT EXISTS (SELECT 1 FROM audit_entry a WHERE a.subject_kind = 'sample'"
                        + " AND a.subject_id = s.id AND a.action = 'import')",
                r -> "sample " + r.getLong(1) + " has no import entry in the audit trail", found);
        query(db, "SELECT kind, name FROM reference_spectrum r WHERE NOT EXISTS (SELECT 1 FROM audit_entry a"
                        + " WHERE a.subject_kind = r.kind AND a.subject_id = r.id AND a.action = 'import')",
                r -> r.getString(1) + " " + r.getString(2) + " has no import entry in the audit trail", found);
        query(db, "SELECT a.id FROM audit_entry a WHERE a.subject_kind = 'sample' AND a.action = 'import'"
                        + " AND NOT EXISTS (SELECT 1 FROM sample s WHERE s.id = a.subject_id)",
                r -> "audit entry " + r.getLong(1) + " records an import whose sample is not stored", found);
        query(db, "SELECT kind, name FROM reference_spectrum WHERE OCTET_LENGTH(wavelengths_nm) <> 8 * point_count"
                        + " OR OCTET_LENGTH(relative_values) <> 8 * point_count",
                r -> r.getString(1) + " " + r.getString(2) + " has a cut array", found);
        return found;
    }

    private static Counts counts(Connection db) throws SQLException {
        return new Counts(single(db, "SELECT COUNT(*) FROM material"), single(db, "SELECT COUNT(*) FROM sample"),
                single(db, "SELECT COUNT(*) FROM reference_spectrum"), single(db, "SELECT COUNT(*) FROM audit_entry"),
                single(db, "SELECT COALESCE(MAX(id), 0) FROM audit_entry"));
    }

    private interface Row {
        String describe(ResultSet r) throws SQLException;
    }

    private static void query(Connection db, String sql, Row row, List<String> into) throws SQLException {
        try (Statement s = db.createStatement(); ResultSet r = s.executeQuery(sql)) {
            while (r.next()) {
                into.add(row.describe(r));
            }
        }
    }

    private static long single(Connection db, String sql) throws SQLException {
        try (Statement s = db.createStatement(); ResultSet r = s.executeQuery(sql)) {
            r.next();
            return r.getLong(1);
        }
    }
}
