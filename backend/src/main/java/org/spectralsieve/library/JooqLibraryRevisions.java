package org.spectralsieve.library;

import static org.spectralsieve.library.db.Tables.CURVE;
import static org.spectralsieve.library.db.Tables.MATERIAL;
import static org.spectralsieve.library.db.Tables.MATERIAL_REVISION;
import static org.spectralsieve.library.db.Tables.SAMPLE;
import static org.spectralsieve.library.db.Tables.SAMPLE_REVISION;

import java.time.Instant;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.function.Consumer;
import org.jooq.DSLContext;
import org.spectralsieve.audit.ActingUser;
import org.spectralsieve.audit.AuditEntry;
import org.spectralsieve.audit.AuditTrail;
import org.spectralsieve.library.AuditedValues.MaterialValues;
import org.spectralsieve.library.AuditedValues.SampleValues;
import org.spectralsieve.library.db.tables.records.MaterialRecord;
import org.spectralsieve.library.db.tables.records.MaterialRevisionRecord;
import org.spectralsieve.library.db.tables.records.SampleRecord;
import org.spectralsieve.library.db.tables.records.SampleRevisionRecord;

/**
 * Retiring, restoring and correcting samples and materials in the database (docs/undo.md). Nothing here
 * deletes a row. Every write is one transaction in one of three methods ({@link #setRetired},
 * {@link #correctSample}, {@link #correctMaterial}), which lock the row they change first, so two
 * corrections of one sample never get the same revision number.
 *
 * <p>The sample and material rows always hold their current revision (every other read sees it with no
 * join); the revision tables hold every revision of a corrected row, revision 1 copied from the row by the
 * first correction in the same transaction. A row never corrected has no revision rows: it is its own
 * revision 1.
 *
 * <p>Each of the three writes records itself in the audit trail in its transaction, with the values before and after
 * ({@link AuditTrail}); a refused correction and a retire or restore that finds nothing to change record nothing.
 */
public class JooqLibraryRevisions {

    /** What {@link #setRetired} acts on. */
    public enum Kind {
        SAMPLE("sample"), MATERIAL("material");

        private final String label;

        Kind(String label) {
            this.label = label;
        }

        public String label() {
            return label;
        }
    }

    /**
     * The state after a retire or restore.
     *
     * @param retiredAt when it was retired, null when in use
     * @param changed   false when it already was in that state (nothing was written)
     */
    public record Retirement(Kind kind, long id, Instant retiredAt, boolean changed) {
    }

    private final DSLContext db;
    private final ActingUser actor;

    /** Changes are recorded as the embedded single user's ({@link ActingUser#LOCAL}): for tests and tools. */
    public JooqLibraryRevisions(DSLContext db) {
        this(db, ActingUser.LOCAL);
    }

    /** @param actor who makes each change, asked inside the change's transaction */
    public JooqLibraryRevisions(DSLContext db, ActingUser actor) {
        this.db = db;
        this.actor = java.util.Objects.requireNonNull(actor, "actor");
    }

    /**
     * Retires ({@code retire}) or restores a sample or a material, in one transaction. Retiring a material
     * hides its samples without touching their own state, so restoring it brings back exactly those that
     * were in use.
     *
     * @throws NotFoundException when there is no such row
     */
    public Retirement setRetired(Kind kind, long id, boolean retire) {
        return db.transactionResult(tx -> {
            DSLContext t = tx.dsl();
            OffsetDateTime now = now();
            if (kind == Kind.SAMPLE) {
                SampleRecord row = t.selectFrom(SAMPLE).where(SAMPLE.ID.eq(id)).forUpdate().fetchOptional()
                        .orElseThrow(() -> new NotFoundException("sample", id));
                if ((row.getRetiredAt() != null) == retire) {
                    return new Retirement(kind, id, JooqLibraryRepository.instant(row.getRetiredAt()), false);
                }
                t.update(SAMPLE).set(SAMPLE.RETIRED_AT, retire ? now : null).where(SAMPLE.ID.eq(id)).execute();
                SampleValues before = SampleValues.of(JooqLibraryRepository.toSample(row));
                AuditTrail.record(t, AuditEntry.by(actor, retire ? AuditEntry.ACTION_RETIRE : AuditEntry.ACTION_RESTORE,
                        AuditEntry.SUBJECT_SAMPLE, id, row.getMaterialId(), (retire ? "retired" : "restored")
                                + " sample " + id + " (" + row.getThicknessMm() + " mm) of material " + row.getMaterialId(),
                        before, before.withRetiredAt(retire ? now.toInstant() : null)));
                LibraryGeneration.bumpConcerningSample(t, row.getMaterialId(), id);
            } else {
                MaterialRecord row = t.selectFrom(MATERIAL).where(MATERIAL.ID.eq(id)).forUpdate().fetchOptional()
                        .orElseThrow(() -> new NotFoundException("material", id));
                if ((row.getRetiredAt() != null) == retire) {
                    return new Retirement(kind, id, JooqLibraryRepository.instant(row.getRetiredAt()), false);
                }
                t.update(MATERIAL).set(MATERIAL.RETIRED_AT, retire ? now : null).where(MATERIAL.ID.eq(id)).execute();
                MaterialValues before = MaterialValues.of(JooqLibraryRepository.toMaterial(row, List.of()));
                AuditTrail.record(t, AuditEntry.by(actor, retire ? AuditEntry.ACTION_RETIRE : AuditEntry.ACTION_RESTORE,
                        AuditEntry.SUBJECT_MATERIAL, id, id, (retire ? "retired" : "restored") + " material " + id
                                + " '" + row.getName() + "'", before, before.withRetiredAt(retire ? now.toInstant() : null)));
                LibraryGeneration.bump(t, id);
            }
            return new Retirement(kind, id, retire ? now.toInstant() : null, true);
        });
    }

    /**
     * Stores the correction as the sample's next revision, in one transaction: the row is locked, the
     * corrected values are handed to {@code check} (which throws to refuse them; then nothing is written),
     * revision 1 is kept first when this is the first correction, then the new revision is added and the
     * sample row set to it.
     *
     * @param check sees the corrected values and whether the curve has per-point detection limits
     * @return the new revision
     * @throws NotFoundException when there is no such sample
     */
    public SampleRevision correctSample(long id, SampleCorrection correction, SampleCheck check) {
        return db.transactionResult(tx -> {
            DSLContext t = tx.dsl();
            SampleRecord row = t.selectFrom(SAMPLE).where(SAMPLE.ID.eq(id)).forUpdate().fetchOptional()
                    .orElseThrow(() -> new NotFoundException("sample", id));
            SampleInfo now = JooqLibraryRepository.toSample(row);
            SampleInfo next = correction.applyTo(now);
            boolean perPointLimits = t.fetchExists(CURVE, CURVE.SAMPLE_ID.eq(id).and(CURVE.DETECTION_LIMITS.isNotNull()));
            check.check(now, next, perPointLimits);
            if (now.revision() == 1 && !t.fetchExists(SAMPLE_REVISION, SAMPLE_REVISION.SAMPLE_ID.eq(id))) {
                insertSampleRevision(t, now, "", row.getCreatedAt());
            }
            OffsetDateTime at = now();
            insertSampleRevision(t, next, correction.reason(), at);
            t.update(SAMPLE)
                    .set(SAMPLE.THICKNESS_MM, next.thicknessMm())
                    .set(SAMPLE.GEOMETRY, next.geometry().label())
                    .set(SAMPLE.INSTRUMENT, next.instrument())
                    .set(SAMPLE.MEASURED_ON, next.measuredOn())
                    .set(SAMPLE.LOT, next.lot())
                    .set(SAMPLE.NOTES, next.notes())
                    .set(SAMPLE.DETECTION_LIMIT, next.detectionLimit())
                    .set(SAMPLE.REVISION, next.revision())
                    .where(SAMPLE.ID.eq(id)).execute();
            AuditTrail.record(t, AuditEntry.by(actor, AuditEntry.ACTION_CORRECT, AuditEntry.SUBJECT_SAMPLE, id,
                    row.getMaterialId(), "corrected sample " + id + ": revision " + now.revision() + " to "
                            + next.revision() + reasonText(correction.reason()),
                    SampleValues.of(now), SampleValues.of(next)));
            LibraryGeneration.bumpConcerningSample(t, row.getMaterialId(), id);
            return toRevision(next, correction.reason(), at.toInstant(), true);
        });
    }

    /** Refuses corrected sample values by throwing; called inside the correcting transaction. */
    @FunctionalInterface
    public interface SampleCheck {
        void check(SampleInfo current, SampleInfo corrected, boolean perPointDetectionLimits);
    }

    /**
     * Stores the correction as the material's next revision, in one transaction, as {@link #correctSample}
     * does for a sample.
     *
     * @param check sees the material as it is now and throws to refuse the correction
     */
    public MaterialRevision correctMaterial(long id, MaterialCorrection correction, Consumer<Material> check) {
        return db.transactionResult(tx -> {
            DSLContext t = tx.dsl();
            MaterialRecord row = t.selectFrom(MATERIAL).where(MATERIAL.ID.eq(id)).forUpdate().fetchOptional()
                    .orElseThrow(() -> new NotFoundException("material", id));
            Material now = JooqLibraryRepository.toMaterial(row, List.of());
            check.accept(now);
            if (now.revision() == 1 && !t.fetchExists(MATERIAL_REVISION, MATERIAL_REVISION.MATERIAL_ID.eq(id))) {
                insertMaterialRevision(t, id, 1, now.refractiveIndex(), now.thicknesses(), "", row.getCreatedAt());
            }
            int next = now.revision() + 1;
            OffsetDateTime at = now();
            MaterialRevisionRecord stored = insertMaterialRevision(t, id, next, correction.indexFor(now),
                    correction.thicknessesFor(now), correction.reason(), at);
            MaterialRecord update = t.newRecord(MATERIAL);
            update.setId(id);
            JooqLibraryRepository.writeIndex(update, correction.indexFor(now));
            JooqLibraryRepository.writeThicknesses(update, correction.thicknessesFor(now));
            update.setRevision(next);
            // every index column is written, so a change of index kind leaves no stale numbers behind
            t.update(MATERIAL)
                    .set(MATERIAL.INDEX_KIND, update.getIndexKind())
                    .set(MATERIAL.INDEX_N, update.getIndexN())
                    .set(MATERIAL.INDEX_B, update.getIndexB())
                    .set(MATERIAL.INDEX_C, update.getIndexC())
                    .set(MATERIAL.INDEX_VALID_FROM_NM, update.getIndexValidFromNm())
                    .set(MATERIAL.INDEX_VALID_TO_NM, update.getIndexValidToNm())
                    .set(MATERIAL.INDEX_TABLE_NM, update.getIndexTableNm())
                    .set(MATERIAL.INDEX_TABLE_N, update.getIndexTableN())
                    .set(MATERIAL.STOCK_THICKNESSES_MM, update.getStockThicknessesMm())
                    .set(MATERIAL.MADE_MIN_MM, update.getMadeMinMm())
                    .set(MATERIAL.MADE_MAX_MM, update.getMadeMaxMm())
                    .set(MATERIAL.REVISION, next)
                    .where(MATERIAL.ID.eq(id)).execute();
            Material after = JooqLibraryRepository.toMaterial(t.selectFrom(MATERIAL).where(MATERIAL.ID.eq(id)).fetchSingle(),
                    List.of());
            AuditTrail.record(t, AuditEntry.by(actor, AuditEntry.ACTION_CORRECT, AuditEntry.SUBJECT_MATERIAL, id, id,
                    "corrected material " + id + " '" + row.getName() + "': revision " + now.revision() + " to " + next
                            + reasonText(correction.reason()), MaterialValues.of(now), MaterialValues.of(after)));
            LibraryGeneration.bump(t, id);
            return toRevision(stored, true);
        });
    }

    /** Every revision of the sample, oldest first; a sample never corrected has its row as revision 1. */
    public List<SampleRevision> sampleRevisions(long id) {
        SampleRecord row = db.selectFrom(SAMPLE).where(SAMPLE.ID.eq(id)).fetchOptional()
                .orElseThrow(() -> new NotFoundException("sample", id));
        List<SampleRevisionRecord> rows = db.selectFrom(SAMPLE_REVISION).where(SAMPLE_REVISION.SAMPLE_ID.eq(id))
                .orderBy(SAMPLE_REVISION.REVISION).fetch();
        if (rows.isEmpty()) {
            return List.of(toRevision(JooqLibraryRepository.toSample(row), "",
                    JooqLibraryRepository.instant(row.getCreatedAt()), true));
        }
        List<SampleRevision> out = new ArrayList<>();
        for (SampleRevisionRecord r : rows) {
            out.add(new SampleRevision(id, r.getRevision(), r.getThicknessMm(), Geometry.parse(r.getGeometry()),
                    r.getInstrument(), r.getMeasuredOn(), r.getLot(), r.getNotes(), r.getDetectionLimit(), r.getReason(),
                    JooqLibraryRepository.instant(r.getRevisedAt()), r.getRevision() == row.getRevision()));
        }
        return out;
    }

    /** Every revision of the material, oldest first; a material never corrected has its row as revision 1. */
    public List<MaterialRevision> materialRevisions(long id) {
        MaterialRecord row = db.selectFrom(MATERIAL).where(MATERIAL.ID.eq(id)).fetchOptional()
                .orElseThrow(() -> new NotFoundException("material", id));
        List<MaterialRevisionRecord> rows = db.selectFrom(MATERIAL_REVISION).where(MATERIAL_REVISION.MATERIAL_ID.eq(id))
                .orderBy(MATERIAL_REVISION.REVISION).fetch();
        if (rows.isEmpty()) {
            return List.of(new MaterialRevision(id, 1, JooqLibraryRepository.readIndex(row),
                    JooqLibraryRepository.readThicknesses(row), "", JooqLibraryRepository.instant(row.getCreatedAt()), true));
        }
        return rows.stream().map(r -> toRevision(r, r.getRevision().equals(row.getRevision()))).toList();
    }

    public Optional<SampleRevision> sampleRevision(long id, int revision) {
        return sampleRevisions(id).stream().filter(r -> r.revision() == revision).findFirst();
    }

    public Optional<MaterialRevision> materialRevision(long id, int revision) {
        return materialRevisions(id).stream().filter(r -> r.revision() == revision).findFirst();
    }

    /** The retired materials, most recently retired first, each with its samples in use. */
    public List<Material> retiredMaterials() {
        return db.selectFrom(MATERIAL).where(MATERIAL.RETIRED_AT.isNotNull()).orderBy(MATERIAL.RETIRED_AT.desc(), MATERIAL.ID)
                .fetch().stream().map(m -> JooqLibraryRepository.toMaterial(m, List.of())).toList();
    }

    /** The material's retired samples, by thickness. */
    public List<SampleInfo> retiredSamplesOf(long materialId) {
        return db.selectFrom(SAMPLE).where(SAMPLE.MATERIAL_ID.eq(materialId)).and(SAMPLE.RETIRED_AT.isNotNull())
                .orderBy(SAMPLE.THICKNESS_MM, SAMPLE.ID).fetch().stream().map(JooqLibraryRepository::toSample).toList();
    }

    private static String reasonText(String reason) {
        return reason == null || reason.isBlank() ? "" : " (" + reason.strip() + ")";
    }

    /** Now, to the microsecond both H2 and PostgreSQL keep, so the answer shows the instant stored. */
    private static OffsetDateTime now() {
        return OffsetDateTime.now(ZoneOffset.UTC).truncatedTo(ChronoUnit.MICROS);
    }

    private static void insertSampleRevision(DSLContext t, SampleInfo s, String reason, OffsetDateTime at) {
        SampleRevisionRecord r = t.newRecord(SAMPLE_REVISION);
        r.setSampleId(s.id());
        r.setRevision(s.revision());
        r.setThicknessMm(s.thicknessMm());
        r.setGeometry(s.geometry().label());
        r.setInstrument(s.instrument());
        r.setMeasuredOn(s.measuredOn());
        r.setLot(s.lot());
        r.setNotes(s.notes());
        r.setDetectionLimit(s.detectionLimit());
        r.setReason(reason);
        r.setRevisedAt(at);
        r.insert();
    }

    private static MaterialRevisionRecord insertMaterialRevision(DSLContext t, long id, int revision,
            org.spectralsieve.optics.RefractiveIndex index, StatedThicknesses thicknesses, String reason,
            OffsetDateTime at) {
        MaterialRecord columns = t.newRecord(MATERIAL);
        JooqLibraryRepository.writeIndex(columns, index);
        JooqLibraryRepository.writeThicknesses(columns, thicknesses);
        MaterialRevisionRecord r = t.newRecord(MATERIAL_REVISION);
        r.setMaterialId(id);
        r.setRevision(revision);
        r.setIndexKind(columns.getIndexKind());
        r.setIndexN(columns.getIndexN());
        r.setIndexB(columns.getIndexB());
        r.setIndexC(columns.getIndexC());
        r.setIndexValidFromNm(columns.getIndexValidFromNm());
        r.setIndexValidToNm(columns.getIndexValidToNm());
        r.setIndexTableNm(columns.getIndexTableNm());
        r.setIndexTableN(columns.getIndexTableN());
        r.setStockThicknessesMm(columns.getStockThicknessesMm());
        r.setMadeMinMm(columns.getMadeMinMm());
        r.setMadeMaxMm(columns.getMadeMaxMm());
        r.setReason(reason);
        r.setRevisedAt(at);
        r.insert();
        return r;
    }

    private static SampleRevision toRevision(SampleInfo s, String reason, Instant at, boolean current) {
        return new SampleRevision(s.id(), s.revision(), s.thicknessMm(), s.geometry(), s.instrument(), s.measuredOn(),
                s.lot(), s.notes(), s.detectionLimit(), reason, at, current);
    }

    private static MaterialRevision toRevision(MaterialRevisionRecord r, boolean current) {
        // the revision's columns read through the material mapper, so both share one reading of the index
        MaterialRecord columns = new MaterialRecord();
        columns.setId(r.getMaterialId());
        columns.setIndexKind(r.getIndexKind());
        columns.setIndexN(r.getIndexN());
        columns.setIndexB(r.getIndexB());
        columns.setIndexC(r.getIndexC());
        columns.setIndexValidFromNm(r.getIndexValidFromNm());
        columns.setIndexValidToNm(r.getIndexValidToNm());
        columns.setIndexTableNm(r.getIndexTableNm());
        columns.setIndexTableN(r.getIndexTableN());
        columns.setStockThicknessesMm(r.getStockThicknessesMm());
        columns.setMadeMinMm(r.getMadeMinMm());
        columns.setMadeMaxMm(r.getMadeMaxMm());
        return new MaterialRevision(r.getMaterialId(), r.getRevision(), JooqLibraryRepository.readIndex(columns),
                JooqLibraryRepository.readThicknesses(columns), r.getReason(),
                JooqLibraryRepository.instant(r.getRevisedAt()), current);
    }
}
