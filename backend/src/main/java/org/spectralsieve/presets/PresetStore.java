package org.spectralsieve.presets;

import static org.spectralsieve.library.db.Tables.REQUIREMENT_PRESET;

import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.jooq.Condition;
import org.jooq.DSLContext;
import org.spectralsieve.audit.ActingUser;
import org.spectralsieve.audit.AuditEntry;
import org.spectralsieve.audit.AuditTrail;
import org.spectralsieve.library.db.tables.records.RequirementPresetRecord;

/**
 * The stored presets (table {@code requirement_preset}, V14), through jOOQ. Every change is one transaction with its
 * audit entry (subject kind {@value #SUBJECT}); deleting retires; a live name is unique per owner, ignoring case,
 * checked here for a clear answer and held by the database's unique constraint against a concurrent writer.
 * Who may change what is {@link PresetCaller}'s to decide, before these methods are called.
 */
public final class PresetStore {

    public static final String SUBJECT = "preset";
    /** Most presets one owner keeps live: a list, an export and the page's menu stay small. */
    public static final int MAX_LIVE_PER_OWNER = 500;

    private final DSLContext db;
    private final ActingUser actor;

    public PresetStore(DSLContext db, ActingUser actor) {
        this.db = db;
        this.actor = actor;
    }

    /** The live presets the caller sees: the shared ones, then its own (embedded: the shared ones), by name. */
    public List<SavedPreset> visibleTo(PresetCaller caller) {
        Condition whose = REQUIREMENT_PRESET.OWNER_KEY.eq(0L);
        if (!caller.embedded()) {
            whose = whose.or(REQUIREMENT_PRESET.OWNER_KEY.eq(caller.accountId()));
        }
        return db.selectFrom(REQUIREMENT_PRESET).where(whose).and(REQUIREMENT_PRESET.RETIRED_AT.isNull())
                .orderBy(REQUIREMENT_PRESET.OWNER_KEY, REQUIREMENT_PRESET.LIVE_NAME)
                .limit(2 * MAX_LIVE_PER_OWNER).fetch(PresetStore::toPreset);
    }

    /** The live presets of one owner (null: everyone's), by name. */
    public List<SavedPreset> ownedBy(Long owner) {
        return db.selectFrom(REQUIREMENT_PRESET).where(REQUIREMENT_PRESET.OWNER_KEY.eq(key(owner)))
                .and(REQUIREMENT_PRESET.RETIRED_AT.isNull()).orderBy(REQUIREMENT_PRESET.LIVE_NAME)
                .limit(MAX_LIVE_PER_OWNER).fetch(PresetStore::toPreset);
    }

    /** A live preset by id, whoever owns it (the caller decides what may be seen). */
    public Optional<SavedPreset> live(long id) {
        return db.selectFrom(REQUIREMENT_PRESET).where(REQUIREMENT_PRESET.ID.eq(id))
                .and(REQUIREMENT_PRESET.RETIRED_AT.isNull()).fetchOptional(PresetStore::toPreset);
    }

    /** A live preset of one owner (null: everyone's) by name, ignoring case. */
    public Optional<SavedPreset> liveByName(Long owner, String name) {
        return db.selectFrom(REQUIREMENT_PRESET).where(REQUIREMENT_PRESET.OWNER_KEY.eq(key(owner)))
                .and(REQUIREMENT_PRESET.LIVE_NAME.eq(PresetDraft.nameKey(name))).fetchOptional(PresetStore::toPreset);
    }

    /** Stores a new preset; {@code draft} is already {@link PresetDraft#checked}. */
    public SavedPreset create(Long owner, PresetDraft draft) {
        return createAll(owner, List.of(draft), "").get(0);
    }

    /**
     * Stores every draft in one transaction, or none: a name an owner's live preset already holds, or one given twice,
     * refuses the lot with {@link PresetNameTakenException} naming the entry ({@code prefix + "[i].name"}; with an
     * empty prefix just {@code name}).
     */
    public List<SavedPreset> createAll(Long owner, List<PresetDraft> drafts, String prefix) {
        try {
            return db.transactionResult(cfg -> {
                DSLContext tx = cfg.dsl();
                int live = tx.fetchCount(REQUIREMENT_PRESET, REQUIREMENT_PRESET.OWNER_KEY.eq(key(owner))
                        .and(REQUIREMENT_PRESET.RETIRED_AT.isNull()));
                if (live + drafts.size() > MAX_LIVE_PER_OWNER) {
                    throw new org.spectralsieve.library.FieldException(prefix.isEmpty() ? "name" : prefix,
                            "would make " + (live + drafts.size()) + " live presets; one owner keeps at most "
                                    + MAX_LIVE_PER_OWNER + " (delete some first)");
                }
                Set<String> seen = new HashSet<>();
                List<SavedPreset> stored = new ArrayList<>();
                OffsetDateTime now = now();
                for (int i = 0; i < drafts.size(); i++) {
                    PresetDraft d = drafts.get(i);
                    String field = prefix.isEmpty() ? "name" : prefix + "[" + i + "].name";
                    if (!seen.add(PresetDraft.nameKey(d.name()))) {
                        throw new PresetNameTakenException(field, d.name(), "earlier entries of this file");
                    }
                    refuseTaken(tx, owner, d.name(), null, field);
                    RequirementPresetRecord row = tx.newRecord(REQUIREMENT_PRESET);
                    row.setName(d.name());
                    row.setLiveName(PresetDraft.nameKey(d.name()));
                    row.setRequirementText(d.text());
                    row.setNote(d.note());
                    row.setOwnerAccountId(owner);
                    row.setOwnerKey(key(owner));
                    row.setCreatedAt(now);
                    row.setUpdatedAt(now);
                    row.store();
                    SavedPreset p = toPreset(row);
                    AuditTrail.record(tx, AuditEntry.by(actor, prefix.isEmpty() ? "create" : "import", SUBJECT, p.id(),
                            null, "saved preset '" + p.name() + "'" + (p.shared() ? " (shared)" : ""), null, values(p)));
                    stored.add(p);
                }
                return stored;
            });
        } catch (RuntimeException e) {
            // another writer took a name between our check and our insert
            if (uniqueViolation(e)) {
                throw new PresetNameTakenException(prefix.isEmpty() ? "name" : prefix, "(one of the names)", "presets");
            }
            throw e;
        }
    }

    /** Replaces name, text and note of a live preset; the audit entry keeps the values before and after. */
    public SavedPreset edit(long id, PresetDraft draft) {
        try {
            return db.transactionResult(cfg -> {
                DSLContext tx = cfg.dsl();
                RequirementPresetRecord row = liveRow(tx, id);
                SavedPreset before = toPreset(row);
                refuseTaken(tx, before.ownerAccountId(), draft.name(), id, "name");
                row.setName(draft.name());
                row.setLiveName(PresetDraft.nameKey(draft.name()));
                row.setRequirementText(draft.text());
                row.setNote(draft.note());
                row.setUpdatedAt(now());
                row.store();
                SavedPreset after = toPreset(row);
                AuditTrail.record(tx, AuditEntry.by(actor, "edit", SUBJECT, id, null, "edited preset '" + after.name()
                        + "'", values(before), values(after)));
                return after;
            });
        } catch (RuntimeException e) {
            if (uniqueViolation(e)) {
                throw new PresetNameTakenException("name", draft.name(), "presets");
            }
            throw e;
        }
    }

    /** Retires a live preset: gone from every list, kept in the table, its name free for a new preset. */
    public SavedPreset retire(long id) {
        return db.transactionResult(cfg -> {
            DSLContext tx = cfg.dsl();
            RequirementPresetRecord row = liveRow(tx, id);
            SavedPreset before = toPreset(row);
            row.setRetiredAt(now());
            row.setLiveName(null);
            row.store();
            SavedPreset after = toPreset(row);
            AuditTrail.record(tx, AuditEntry.by(actor, AuditEntry.ACTION_RETIRE, SUBJECT, id, null,
                    "deleted (retired) preset '" + before.name() + "'", values(before), values(after)));
            return after;
        });
    }

    private static RequirementPresetRecord liveRow(DSLContext tx, long id) {
        RequirementPresetRecord row = tx.selectFrom(REQUIREMENT_PRESET).where(REQUIREMENT_PRESET.ID.eq(id))
                .and(REQUIREMENT_PRESET.RETIRED_AT.isNull()).forUpdate().fetchOne();
        if (row == null) {
            throw new PresetNotFoundException(String.valueOf(id));
        }
        return row;
    }

    private static void refuseTaken(DSLContext tx, Long owner, String name, Long except, String field) {
        Condition same = REQUIREMENT_PRESET.OWNER_KEY.eq(key(owner)).and(REQUIREMENT_PRESET.LIVE_NAME.eq(PresetDraft.nameKey(name)));
        if (except != null) {
            same = same.and(REQUIREMENT_PRESET.ID.ne(except));
        }
        if (tx.fetchExists(REQUIREMENT_PRESET, same)) {
            throw new PresetNameTakenException(field, name, owner == null ? "the shared presets" : "your presets");
        }
    }

    /**
     * The unique constraint on live names refused a row (SQLSTATE 23505 in H2 and PostgreSQL alike), whichever layer
     * (jOOQ's or Spring's exception translation) wrapped the driver's exception.
     */
    static boolean uniqueViolation(Throwable e) {
        for (Throwable t = e; t != null; t = t.getCause()) {
            if (t instanceof java.sql.SQLException sql && "23505".equals(sql.getSQLState())) {
                return true;
            }
        }
        return false;
    }

    private static long key(Long owner) {
        return owner == null ? 0L : owner;
    }

    private static OffsetDateTime now() {
        return OffsetDateTime.now(ZoneOffset.UTC).truncatedTo(ChronoUnit.MICROS);
    }

    private static Map<String, Object> values(SavedPreset p) {
        Map<String, Object> v = new LinkedHashMap<>();
        v.put("name", p.name());
        v.put("text", p.text());
        v.put("note", p.note());
        v.put("owner", p.ownerAccountId());
        v.put("retiredAt", p.retiredAt() == null ? null : p.retiredAt().toString());
        return v;
    }

    private static SavedPreset toPreset(RequirementPresetRecord r) {
        return new SavedPreset(r.getId(), r.getName(), r.getRequirementText(), r.getNote(), r.getOwnerAccountId(),
                r.getCreatedAt().toInstant(), r.getUpdatedAt().toInstant(),
                r.getRetiredAt() == null ? null : r.getRetiredAt().toInstant());
    }
}
