package org.spectralsieve.library;

import static org.spectralsieve.library.db.Tables.MATERIAL;
import static org.spectralsieve.library.db.Tables.SAMPLE;
import static org.spectralsieve.library.db.Tables.SAMPLE_STATE_CURVE;

import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.jooq.DSLContext;
import org.jooq.Record;
import org.spectralsieve.audit.ActingUser;
import org.spectralsieve.audit.AuditEntry;
import org.spectralsieve.audit.AuditTrail;
import org.spectralsieve.library.db.tables.records.SampleStateCurveRecord;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.states.Exposure;
import org.spectralsieve.states.MaterialState;
import org.spectralsieve.states.Printing;
import org.spectralsieve.states.StateCurve;
import org.spectralsieve.states.StateKind;

/**
 * The rows of {@code sample_state_curve} (V13): a sample's curves in other states, stored, read, retired and
 * restored for {@link JooqLibraryRepository}. The curve is packed as a sample's curve is ({@link PackedArrays}); a
 * row is never updated but for its {@code retired_at}, and never deleted.
 */
final class StateCurveRows {

    private StateCurveRows() {
    }

    /** What {@link #setRetired} did: the state after it, and whether anything changed. */
    record Retirement(long id, long sampleId, OffsetDateTime retiredAt, boolean changed) {
    }

    /** The values the audit trail records for a state curve (its curve by checksum and point count, never copied). */
    record AuditedState(long id, long sampleId, String kind, String description, Double thicknessMm,
                        String sourceFileName, String sourceSha256, int points, java.time.Instant retiredAt) {
        static AuditedState of(StoredStateCurve s) {
            double t = s.stateCurve().thicknessMm();
            return new AuditedState(s.id(), s.sampleId(), s.stateCurve().state().kind().word(),
                    s.stateCurve().state().describe(), Double.isNaN(t) ? null : t, s.sourceFileName(), s.sourceSha256(),
                    s.stateCurve().curve().size(), s.retiredAt());
        }
    }

    /**
     * Stores the state curve of a sample in use, in the caller's transaction, with its audit entry; the caller raises
     * the change counter last.
     *
     * @return the new row's id and the sample's material
     * @throws NotFoundException when there is no such sample
     * @throws RetiredException  when the sample or its material is retired
     */
    static long[] insert(DSLContext t, ActingUser actor, long sampleId, NewStateCurve c) {
        // the sample row is locked so that a retirement in another transaction cannot slip between check and insert
        Record owner = t.select(SAMPLE.MATERIAL_ID, SAMPLE.RETIRED_AT).from(SAMPLE).where(SAMPLE.ID.eq(sampleId))
                .forUpdate().fetchOptional().orElseThrow(() -> new NotFoundException("sample", sampleId));
        long materialId = owner.get(SAMPLE.MATERIAL_ID);
        if (owner.get(SAMPLE.RETIRED_AT) != null) {
            throw new RetiredException("sample", sampleId, owner.get(SAMPLE.RETIRED_AT).toInstant());
        }
        OffsetDateTime materialRetired = t.select(MATERIAL.RETIRED_AT).from(MATERIAL).where(MATERIAL.ID.eq(materialId))
                .fetchOne(MATERIAL.RETIRED_AT);
        if (materialRetired != null) {
            throw new RetiredException("material", materialId, materialRetired.toInstant());
        }
        SampleStateCurveRecord row = t.newRecord(SAMPLE_STATE_CURVE);
        row.setSampleId(sampleId);
        MaterialState state = c.state();
        row.setKind(state.kind().word());
        Exposure e = state.exposure();
        if (e != null) {
            row.setExposureHours(e.inHours() ? e.hours() : null);
            row.setExposureSource(e.source());
            row.setDoseJPerCm2(e.inHours() ? null : e.doseJPerCm2());
            row.setDoseNm(e.inHours() ? null : e.doseNm());
        }
        Printing p = state.printing();
        if (p != null) {
            row.setInkLoadPercent(orNull(p.inkLoadPercent()));
            row.setStatedDensity(orNull(p.statedDensity()));
        }
        row.setThicknessMm(orNull(c.thicknessMm()));
        Curve curve = c.curve();
        row.setDetectionLimit(c.detectionLimit());
        row.setPointCount(curve.size());
        row.setWavelengthsNm(PackedArrays.pack(curve.wavelengthsNm()));
        row.setTransmittance(PackedArrays.pack(curve.transmittances()));
        row.setBelowDetection(PackedArrays.pack(curve.belowDetectionFlags()));
        double[] limits = curve.detectionLimits();
        row.setDetectionLimits(Arrays.stream(limits).allMatch(l -> l == c.detectionLimit()) ? null : PackedArrays.pack(limits));
        row.setAbsorbanceUncertainty(curve.hasUncertainty() ? PackedArrays.pack(curve.absorbanceUncertainties()) : null);
        row.setSourceFileName(c.sourceFileName());
        row.setSourceSha256(c.sourceSha256());
        if (c.file() != null) {
            row.setSourceMediaType(c.file().mediaType());
            row.setSourceFormat(c.file().format());
            row.setSourceBytes(c.file().bytes());
        }
        row.setNotes(c.notes());
        row.store();
        row.refresh(); // created_at as the database set it, for the audit entry
        StoredStateCurve stored = toStored(row);
        AuditTrail.record(t, AuditEntry.by(actor, AuditEntry.ACTION_IMPORT, AuditEntry.SUBJECT_STATE_CURVE, row.getId(),
                materialId, "added state curve " + row.getId() + " (" + state.describe() + ") to sample " + sampleId
                        + (c.sourceFileName().isEmpty() ? "" : " from " + c.sourceFileName()),
                null, AuditedState.of(stored)));
        return new long[] {row.getId(), materialId};
    }

    /** The sample's state curves, in use only or all, ordered by id; a row that cannot be read is left out (logged). */
    static List<StoredStateCurve> ofSample(DSLContext db, long sampleId, boolean inUseOnly) {
        var where = SAMPLE_STATE_CURVE.SAMPLE_ID.eq(sampleId);
        if (inUseOnly) {
            where = where.and(SAMPLE_STATE_CURVE.RETIRED_AT.isNull());
        }
        return db.selectFrom(SAMPLE_STATE_CURVE).where(where).orderBy(SAMPLE_STATE_CURVE.ID).fetch().stream()
                .map(StateCurveRows::readable).flatMap(Optional::stream).toList();
    }

    /** The state curves in use of these samples, by sample id, each list ordered by id. */
    static Map<Long, List<StoredStateCurve>> ofSamples(DSLContext db, java.util.Collection<Long> sampleIds) {
        Map<Long, List<StoredStateCurve>> out = new LinkedHashMap<>();
        if (sampleIds.isEmpty()) {
            return out;
        }
        db.selectFrom(SAMPLE_STATE_CURVE).where(SAMPLE_STATE_CURVE.SAMPLE_ID.in(sampleIds))
                .and(SAMPLE_STATE_CURVE.RETIRED_AT.isNull()).orderBy(SAMPLE_STATE_CURVE.ID).fetch().stream()
                .map(StateCurveRows::readable).flatMap(Optional::stream)
                .forEach(s -> out.computeIfAbsent(s.sampleId(), k -> new java.util.ArrayList<>()).add(s));
        return out;
    }

    static Optional<StoredStateCurve> byId(DSLContext db, long id) {
        return db.selectFrom(SAMPLE_STATE_CURVE).where(SAMPLE_STATE_CURVE.ID.eq(id)).fetchOptional()
                .map(StateCurveRows::toStored);
    }

    static Optional<SourceFile> sourceFile(DSLContext db, long id) {
        return db.selectFrom(SAMPLE_STATE_CURVE).where(SAMPLE_STATE_CURVE.ID.eq(id))
                .and(SAMPLE_STATE_CURVE.SOURCE_BYTES.isNotNull()).fetchOptional()
                .map(r -> new SourceFile(r.getSourceFileName(), r.getSourceMediaType(), r.getSourceFormat(),
                        r.getSourceBytes(), r.getSourceSha256()));
    }

    /**
     * Retires or restores one state curve in the caller's transaction, with its audit entry; the caller raises the
     * change counter last when {@link Retirement#changed()}.
     */
    static Retirement setRetired(DSLContext t, ActingUser actor, long id, boolean retire) {
        SampleStateCurveRecord row = t.selectFrom(SAMPLE_STATE_CURVE).where(SAMPLE_STATE_CURVE.ID.eq(id)).forUpdate()
                .fetchOptional().orElseThrow(() -> new NotFoundException("state curve", id));
        if ((row.getRetiredAt() != null) == retire) {
            return new Retirement(id, row.getSampleId(), row.getRetiredAt(), false);
        }
        OffsetDateTime now = OffsetDateTime.now(ZoneOffset.UTC);
        StoredStateCurve before = toStored(row);
        t.update(SAMPLE_STATE_CURVE).set(SAMPLE_STATE_CURVE.RETIRED_AT, retire ? now : null)
                .where(SAMPLE_STATE_CURVE.ID.eq(id)).execute();
        long materialId = t.select(SAMPLE.MATERIAL_ID).from(SAMPLE).where(SAMPLE.ID.eq(row.getSampleId()))
                .fetchOne(SAMPLE.MATERIAL_ID);
        AuditedState was = AuditedState.of(before);
        AuditedState is = new AuditedState(was.id(), was.sampleId(), was.kind(), was.description(), was.thicknessMm(),
                was.sourceFileName(), was.sourceSha256(), was.points(), retire ? now.toInstant() : null);
        AuditTrail.record(t, AuditEntry.by(actor, retire ? AuditEntry.ACTION_RETIRE : AuditEntry.ACTION_RESTORE,
                AuditEntry.SUBJECT_STATE_CURVE, id, materialId, (retire ? "retired" : "restored") + " state curve " + id
                        + " (" + was.description() + ") of sample " + row.getSampleId(), was, is));
        return new Retirement(id, row.getSampleId(), retire ? now : null, true);
    }

    static long materialOf(DSLContext t, long sampleId) {
        return t.select(SAMPLE.MATERIAL_ID).from(SAMPLE).where(SAMPLE.ID.eq(sampleId)).fetchOne(SAMPLE.MATERIAL_ID);
    }

    private static Optional<StoredStateCurve> readable(SampleStateCurveRecord r) {
        try {
            return Optional.of(toStored(r));
        } catch (RuntimeException e) {
            // one unreadable row must not hide the sample or its other states
            org.slf4j.LoggerFactory.getLogger(StateCurveRows.class).warn("state curve " + r.getId() + " of sample "
                    + r.getSampleId() + " cannot be read and is left out: " + e.getMessage());
            return Optional.empty();
        }
    }

    static StoredStateCurve toStored(SampleStateCurveRecord r) {
        StateCurve sc = new StateCurve(r.getId(), state(r), curve(r), r.getThicknessMm() == null ? Double.NaN
                : r.getThicknessMm());
        return new StoredStateCurve(sc, r.getSampleId(), r.getDetectionLimit(), r.getNotes(), r.getSourceFileName(),
                r.getSourceSha256(), r.getSourceBytes() != null, JooqLibraryRepository.instant(r.getCreatedAt()),
                JooqLibraryRepository.instant(r.getRetiredAt()));
    }

    private static MaterialState state(SampleStateCurveRecord r) {
        StateKind kind = StateKind.fromWord(r.getKind());
        if (kind == StateKind.AGED) {
            return MaterialState.aged(r.getExposureHours() != null ? Exposure.hours(r.getExposureHours(), r.getExposureSource())
                    : Exposure.dose(r.getDoseJPerCm2(), r.getDoseNm()));
        }
        if (kind == StateKind.PRINTED) {
            return MaterialState.printed(new Printing(nan(r.getInkLoadPercent()), nan(r.getStatedDensity())));
        }
        throw new IllegalStateException("state curve " + r.getId() + " has unknown kind '" + r.getKind() + "'");
    }

    /** As {@link JooqLibraryRepository#toCurve} reads a sample's curve, with the row's own detection limit. */
    private static Curve curve(SampleStateCurveRecord r) {
        int n = r.getPointCount();
        double[] nm = PackedArrays.unpackDoubles(r.getWavelengthsNm(), n, "sample_state_curve.wavelengths_nm");
        double[] t = PackedArrays.unpackDoubles(r.getTransmittance(), n, "sample_state_curve.transmittance");
        boolean[] below = PackedArrays.unpackFlags(r.getBelowDetection(), n, "sample_state_curve.below_detection");
        double[] limits;
        if (r.getDetectionLimits() != null) {
            limits = PackedArrays.unpackDoubles(r.getDetectionLimits(), n, "sample_state_curve.detection_limits");
        } else {
            limits = new double[n];
            Arrays.fill(limits, r.getDetectionLimit());
        }
        Curve curve = Curve.of(nm, t, below, limits);
        if (r.getAbsorbanceUncertainty() == null) {
            return curve;
        }
        return curve.withAbsorbanceUncertainty(PackedArrays.unpackDoubles(r.getAbsorbanceUncertainty(), n,
                "sample_state_curve.absorbance_uncertainty"));
    }

    private static Double orNull(double v) {
        return Double.isNaN(v) ? null : v;
    }

    private static double nan(Double v) {
        return v == null ? Double.NaN : v;
    }
}
