package org.spectralsieve.audit;

import static org.spectralsieve.library.db.Tables.AUDIT_ENTRY;

import java.time.Instant;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.time.temporal.ChronoUnit;
import java.util.List;
import java.util.Map;
import org.jooq.Condition;
import org.jooq.DSLContext;
import org.jooq.impl.DSL;
import org.spectralsieve.library.db.tables.records.AuditEntryRecord;
import tools.jackson.databind.json.JsonMapper;

/**
 * The audit trail (table {@code audit_entry}, migration V12): one row per change of the library, written by
 * {@link #record} inside the change's own transaction, so that the row commits exactly when the change does (a refused
 * or rolled-back change leaves none) — and read back a page at a time, newest first ({@link #page}). See docs/audit.md.
 */
public final class AuditTrail {

    /** Longest page a reader may ask for. */
    public static final int MAX_PAGE = 500;

    /** The width of the before and after columns (V12). */
    static final int MAX_JSON = 60_000;

    private static final JsonMapper JSON = JsonMapper.builder().build();

    private final DSLContext db;

    /** @param db where {@link #page} reads; {@link #record} takes the writer's transaction instead */
    public AuditTrail(DSLContext db) {
        this.db = db;
    }

    /**
     * Records one change. Call it inside the change's transaction with that transaction's context, after the change's
     * own statements succeeded: then the row commits with the change, and goes with it when anything later in the
     * transaction fails.
     *
     * @return the new entry's id, from an identity that never hands an id out twice
     */
    public static long record(DSLContext tx, AuditEntry entry) {
        AuditEntryRecord row = tx.newRecord(AUDIT_ENTRY);
        row.setRecordedAt(OffsetDateTime.now(ZoneOffset.UTC).truncatedTo(ChronoUnit.MICROS));
        row.setActor(entry.actor());
        row.setAction(entry.action());
        row.setSubjectKind(entry.subjectKind());
        row.setSubjectId(entry.subjectId());
        row.setMaterialId(entry.materialId());
        row.setSummary(entry.summary());
        row.setBeforeJson(json(entry.before()));
        row.setAfterJson(json(entry.after()));
        row.store();
        return row.getId();
    }

    /**
     * The values as JSON, or null. The columns are wider than anything the library's own values make (their columns
     * are bounded); should a value ever be wider, the entry says so rather than failing the user's change.
     */
    static String json(Object value) {
        if (value == null) {
            return null;
        }
        String text = JSON.writeValueAsString(value);
        if (text.length() > MAX_JSON) {
            return JSON.writeValueAsString(Map.of("omitted", "the values took " + text.length()
                    + " characters, more than the " + MAX_JSON + " an audit entry keeps"));
        }
        return text;
    }

    /** One stored entry; {@code beforeJson} and {@code afterJson} as stored (JSON objects), null where none. */
    public record Stored(long id, Instant recordedAt, String actor, String action, String subjectKind, Long subjectId,
                         Long materialId, String summary, String beforeJson, String afterJson) {
    }

    /**
     * Which entries to read: those with an id below {@code before} (null: from the newest), about one sample
     * ({@code sampleId}) and/or one material and its samples ({@code materialId}); at most {@code limit}.
     */
    public record Query(Long before, int limit, Long sampleId, Long materialId) {
        public Query {
            if (limit < 1 || limit > MAX_PAGE) {
                throw new IllegalArgumentException("limit must be 1 to " + MAX_PAGE + ", got " + limit);
            }
        }
    }

    /** The entries the query selects, newest (highest id) first. */
    public List<Stored> page(Query q) {
        Condition where = DSL.noCondition();
        if (q.before() != null) {
            where = where.and(AUDIT_ENTRY.ID.lt(q.before()));
        }
        if (q.sampleId() != null) {
            where = where.and(AUDIT_ENTRY.SUBJECT_KIND.eq(AuditEntry.SUBJECT_SAMPLE)).and(AUDIT_ENTRY.SUBJECT_ID.eq(q.sampleId()));
        }
        if (q.materialId() != null) {
            where = where.and(AUDIT_ENTRY.MATERIAL_ID.eq(q.materialId()));
        }
        return db.selectFrom(AUDIT_ENTRY).where(where).orderBy(AUDIT_ENTRY.ID.desc()).limit(q.limit())
                .fetch(AuditTrail::toStored);
    }

    private static Stored toStored(AuditEntryRecord r) {
        return new Stored(r.getId(), r.getRecordedAt().toInstant(), r.getActor(), r.getAction(), r.getSubjectKind(),
                r.getSubjectId(), r.getMaterialId(), r.getSummary(), r.getBeforeJson(), r.getAfterJson());
    }
}
