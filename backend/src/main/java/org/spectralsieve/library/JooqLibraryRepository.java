package org.spectralsieve.library;

import static org.spectralsieve.library.db.Tables.CURVE;
import static org.spectralsieve.library.db.Tables.MATERIAL;
import static org.spectralsieve.library.db.Tables.SAMPLE;
import static org.spectralsieve.library.db.Tables.SOURCE_FILE;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collection;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.jooq.Condition;
import org.jooq.DSLContext;
import org.jooq.Record;
import org.jooq.impl.DSL;
import org.spectralsieve.audit.ActingUser;
import org.spectralsieve.audit.AuditEntry;
import org.spectralsieve.audit.AuditTrail;
import org.spectralsieve.library.AuditedValues.ImportedSample;
import org.spectralsieve.library.AuditedValues.MaterialValues;
import org.spectralsieve.library.AuditedValues.SampleValues;
import org.spectralsieve.library.db.tables.records.CurveRecord;
import org.spectralsieve.library.db.tables.records.MaterialRecord;
import org.spectralsieve.library.db.tables.records.SampleRecord;
import org.spectralsieve.library.db.tables.records.SourceFileRecord;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.optics.RefractiveIndex;
import org.spectralsieve.optics.SellmeierIndex;
import org.spectralsieve.optics.TabulatedIndex;
import org.spectralsieve.optics.UnusableIndex;
import org.spectralsieve.spectrum.Curve;

/**
 * The library in the database. All SQL goes through jOOQ; callers only ever see the library's own
 * records and core types, never generated jOOQ records. Every write records itself in the audit trail in its own
 * transaction ({@link AuditTrail}), naming whoever the {@link ActingUser} says makes it.
 */
public class JooqLibraryRepository {

    private static final Logger LOG = LoggerFactory.getLogger(JooqLibraryRepository.class);

    private final DSLContext db;
    private final ActingUser actor;

    /** Writes are recorded as the embedded single user's ({@link ActingUser#LOCAL}): for tests and tools. */
    public JooqLibraryRepository(DSLContext db) {
        this(db, ActingUser.LOCAL);
    }

    /** @param actor who makes each write, asked inside the write's transaction */
    public JooqLibraryRepository(DSLContext db, ActingUser actor) {
        this.db = db;
        this.actor = java.util.Objects.requireNonNull(actor, "actor");
    }

    public long countMaterials() {
        return db.fetchCount(MATERIAL);
    }

    /** Materials, optionally of one class and matching a free-text filter over name, description and tags. */
    public List<Material> findMaterials(String materialClass, String text) {
        Condition where = MATERIAL.RETIRED_AT.isNull(); // a retired material is read by id only (docs/undo.md)
        if (materialClass != null && !materialClass.isBlank()) {
            where = where.and(MATERIAL.MATERIAL_CLASS.eq(materialClass.trim().toLowerCase(Locale.ROOT)));
        }
        if (text != null && !text.isBlank()) {
            for (String word : text.trim().split("\\s+")) {
                where = where.and(MATERIAL.NAME.containsIgnoreCase(word)
                        .or(MATERIAL.DESCRIPTION.containsIgnoreCase(word))
                        .or(MATERIAL.TAGS.containsIgnoreCase(word))
                        .or(MATERIAL.MATERIAL_CLASS.containsIgnoreCase(word)));
            }
        }
        List<MaterialRecord> materials = db.selectFrom(MATERIAL).where(where).orderBy(MATERIAL.NAME, MATERIAL.ID).fetch();
        Map<Long, List<SampleInfo>> samples = samplesOf(materials.stream().map(MaterialRecord::getId).toList());
        List<Material> out = new ArrayList<>();
        for (MaterialRecord m : materials) {
            readable(m, samples.getOrDefault(m.getId(), List.of())).ifPresent(out::add);
        }
        return out;
    }

    /**
     * A stored material as a record, or empty (and a warning in the log) when its row cannot be read at all
     * (a class or scaling no longer known): one bad row must not take every listing and search with it.
     * Numbers that fail today's checks are not a reason to leave it out: see {@link #readIndex}.
     */
    private static Optional<Material> readable(MaterialRecord m, List<SampleInfo> samples) {
        try {
            return Optional.of(toMaterial(m, samples));
        } catch (RuntimeException e) {
            LOG.warn("material " + m.getId() + " is left out: its stored row cannot be read (" + e.getMessage() + ")");
            return Optional.empty();
        }
    }

    /** The material, retired or not, with its samples in use. */
    public Optional<Material> findMaterial(long id) {
        return db.selectFrom(MATERIAL).where(MATERIAL.ID.eq(id)).fetchOptional()
                .map(m -> toMaterial(m, samplesOf(List.of(id)).getOrDefault(id, List.of())));
    }

    /**
     * The material's own row, retired or not, <em>without</em> its samples ({@link Material#samples()} is
     * empty): for a caller that needs the material's properties alone (scaling, index, tags, name, revision),
     * such as a curve read or an import, so that its cost does not grow with the samples the material holds
     * (one query instead of two; an import into a material of 400 samples no longer reads 400 rows).
     */
    public Optional<Material> findMaterialWithoutSamples(long id) {
        return db.selectFrom(MATERIAL).where(MATERIAL.ID.eq(id)).fetchOptional().map(m -> toMaterial(m, List.of()));
    }

    public Optional<Long> findMaterialIdBySlug(String slug) {
        return db.select(MATERIAL.ID).from(MATERIAL).where(MATERIAL.SLUG.eq(slug)).fetchOptional(MATERIAL.ID);
    }

    /** The sample, retired or not, as its current revision states it. */
    public Optional<SampleInfo> findSample(long id) {
        return db.selectFrom(SAMPLE).where(SAMPLE.ID.eq(id)).fetchOptional().map(JooqLibraryRepository::toSample);
    }

    /** A sample (retired or not), its material's own row ({@link #findMaterialWithoutSamples}) and its curve, when stored. */
    public record SampleWithCurve(SampleInfo sample, Material material, Optional<Curve> curve) {
    }

    /**
     * What {@link #findSample}, {@link #findMaterialWithoutSamples} and {@link #findCurve} read for one
     * sample, in one query instead of three (a curve or figures read asks for all three on every request).
     * Each part is made from its rows exactly as those methods make it; empty when the sample does not exist.
     */
    public Optional<SampleWithCurve> findSampleWithCurve(long sampleId) {
        return db.select(SAMPLE.fields()).select(MATERIAL.fields()).select(CURVE.fields())
                .from(SAMPLE).join(MATERIAL).on(MATERIAL.ID.eq(SAMPLE.MATERIAL_ID))
                .leftJoin(CURVE).on(CURVE.SAMPLE_ID.eq(SAMPLE.ID))
                .where(SAMPLE.ID.eq(sampleId)).fetchOptional()
                .map(r -> new SampleWithCurve(toSample(r.into(SAMPLE)), toMaterial(r.into(MATERIAL), List.of()),
                        r.get(CURVE.SAMPLE_ID) == null ? Optional.empty() : Optional.of(toCurve(r))));
    }

    public Optional<Curve> findCurve(long sampleId) {
        return db.select(CURVE.asterisk(), SAMPLE.DETECTION_LIMIT).from(CURVE).join(SAMPLE).on(SAMPLE.ID.eq(CURVE.SAMPLE_ID))
                .where(CURVE.SAMPLE_ID.eq(sampleId)).fetchOptional()
                .map(JooqLibraryRepository::toCurve);
    }

    /** Every curve of a sample in use (neither it nor its material retired) by sample id, for derived stores. */
    public Map<Long, Curve> findAllCurves() {
        Map<Long, Curve> curves = new LinkedHashMap<>();
        db.select(CURVE.asterisk(), SAMPLE.DETECTION_LIMIT).from(CURVE).join(SAMPLE).on(SAMPLE.ID.eq(CURVE.SAMPLE_ID))
                .join(MATERIAL).on(MATERIAL.ID.eq(SAMPLE.MATERIAL_ID))
                .where(SAMPLE.RETIRED_AT.isNull()).and(MATERIAL.RETIRED_AT.isNull())
                .orderBy(CURVE.SAMPLE_ID).fetch()
                .forEach(r -> {
                    try {
                        curves.put(r.get(CURVE.SAMPLE_ID), toCurve(r));
                    } catch (RuntimeException e) {
                        // one unreadable curve row must not stop every search: its sample is left out of the store
                        LOG.warn("the curve of sample " + r.get(CURVE.SAMPLE_ID) + " cannot be read and is left out of"
                                + " searches: " + e.getMessage());
                    }
                });
        return curves;
    }

    /**
     * Stores a sample's curve in another state (aged, printed) in one transaction: the row, its audit entry and, last,
     * the change counter's raise (docs/material-states.md).
     *
     * @return the new state curve's id (from the identity, never reused)
     * @throws NotFoundException when there is no such sample
     * @throws RetiredException  when the sample or its material is retired
     */
    public long storeStateCurve(long sampleId, NewStateCurve stateCurve) {
        return db.transactionResult(tx -> {
            long[] idAndMaterial = StateCurveRows.insert(tx.dsl(), actor, sampleId, stateCurve);
            LibraryGeneration.bumpConcerningSample(tx.dsl(), idAndMaterial[1], sampleId);
            return idAndMaterial[0];
        });
    }

    /**
     * The sample's curves in other states that are in use, ordered by id: what a requirement naming a state is judged
     * on ({@code search.MaterialCandidates#readStates}). Empty for a sample without any, or unknown.
     */
    public List<org.spectralsieve.states.StateCurve> findStateCurves(long sampleId) {
        return StateCurveRows.ofSample(db, sampleId, true).stream().map(StoredStateCurve::stateCurve).toList();
    }

    /** The sample's state curves with where they came from, ordered by id; retired ones too when {@code withRetired}. */
    public List<StoredStateCurve> findStoredStateCurves(long sampleId, boolean withRetired) {
        return StateCurveRows.ofSample(db, sampleId, !withRetired);
    }

    /** The state curves in use of these samples, by sample id (a sample without any is left out). */
    public Map<Long, List<StoredStateCurve>> findStoredStateCurves(Collection<Long> sampleIds) {
        return StateCurveRows.ofSamples(db, sampleIds);
    }

    /** One state curve, retired or not. */
    public Optional<StoredStateCurve> findStateCurve(long stateCurveId) {
        return StateCurveRows.byId(db, stateCurveId);
    }

    /** The file a state curve was read from; empty when it was stored without one. */
    public Optional<SourceFile> findStateCurveSourceFile(long stateCurveId) {
        return StateCurveRows.sourceFile(db, stateCurveId);
    }

    /**
     * Retires ({@code retire}) or restores one state curve in one transaction, with its audit entry and the change
     * counter's raise; nothing is written when it already was so.
     *
     * @return the state afterwards: when it was retired (null in use), and whether this call changed it
     * @throws NotFoundException when there is no such state curve
     */
    public StateCurveRetirement setStateCurveRetired(long stateCurveId, boolean retire) {
        return db.transactionResult(tx -> {
            StateCurveRows.Retirement r = StateCurveRows.setRetired(tx.dsl(), actor, stateCurveId, retire);
            if (r.changed()) {
                LibraryGeneration.bumpConcerningSample(tx.dsl(), StateCurveRows.materialOf(tx.dsl(), r.sampleId()),
                        r.sampleId());
            }
            return new StateCurveRetirement(r.id(), r.sampleId(), instant(r.retiredAt()), r.changed());
        });
    }

    /** The state of a state curve after {@link #setStateCurveRetired}; {@code changed} false when it already was so. */
    public record StateCurveRetirement(long id, long sampleId, java.time.Instant retiredAt, boolean changed) {
    }

    /** The material in use whose name equals {@code name} ignoring case (the oldest when several do). */
    public Optional<Long> findMaterialIdByName(String name) {
        return db.select(MATERIAL.ID).from(MATERIAL).where(DSL.lower(MATERIAL.NAME).eq(name.trim().toLowerCase(Locale.ROOT)))
                .and(MATERIAL.RETIRED_AT.isNull())
                .orderBy(MATERIAL.ID).limit(1).fetchOptional(MATERIAL.ID);
    }

    public long insertMaterial(NewMaterial material) {
        return db.transactionResult(tx -> {
            long id = insertMaterialRow(tx.dsl(), material);
            AuditTrail.record(tx.dsl(), AuditEntry.by(actor, AuditEntry.ACTION_IMPORT, AuditEntry.SUBJECT_MATERIAL, id, id,
                    "added material " + id + " '" + material.name() + "'", null, MaterialValues.created(id, material)));
            LibraryGeneration.bump(tx.dsl(), id);
            return id;
        });
    }

    /** This database's identity ({@link LibraryIdentity}), made on the first call when no process made it yet. */
    public String libraryId() {
        return LibraryIdentity.read(db);
    }

    /**
     * The materials the changes after generation {@code after} up to {@code upTo} concerned, or empty when
     * the change log cannot account for all of them ({@link LibraryChanges#materialsChanged}).
     */
    public Optional<Set<Long>> materialsChanged(long after, long upTo) {
        return LibraryChanges.materialsChanged(db, after, upTo);
    }

    /**
     * What the changes after generation {@code after} up to {@code upTo} concerned, material by material (and, where
     * a change named one, sample by sample), or empty when the change log cannot account for all of them
     * ({@link LibraryChanges#since}).
     */
    public Optional<LibraryChanges.Changes> changesSince(long after, long upTo) {
        return LibraryChanges.since(db, after, upTo);
    }

    /** The samples of these ids, retired or not, by id (as {@link #findSample} reads each); an unknown id is left out. */
    public Map<Long, SampleInfo> findSamples(Collection<Long> ids) {
        Map<Long, SampleInfo> out = new HashMap<>();
        if (!ids.isEmpty()) {
            db.selectFrom(SAMPLE).where(SAMPLE.ID.in(ids)).fetch().forEach(s -> out.put(s.getId(), toSample(s)));
        }
        return out;
    }

    /** Those of the materials that are in use, with their samples in use; a retired or unknown id is left out. */
    public List<Material> findMaterialsInUse(Collection<Long> ids) {
        if (ids.isEmpty()) {
            return List.of();
        }
        List<MaterialRecord> materials = db.selectFrom(MATERIAL).where(MATERIAL.RETIRED_AT.isNull())
                .and(MATERIAL.ID.in(ids)).orderBy(MATERIAL.ID).fetch();
        Map<Long, List<SampleInfo>> samples = samplesOf(materials.stream().map(MaterialRecord::getId).toList());
        List<Material> out = new ArrayList<>();
        for (MaterialRecord m : materials) {
            readable(m, samples.getOrDefault(m.getId(), List.of())).ifPresent(out::add);
        }
        return out;
    }

    /** The library's change counter as committed now ({@link LibraryGeneration}): one primary-key read. */
    public long generation() {
        return LibraryGeneration.read(db);
    }

    /** Stores a sample and its curve together: either both rows exist afterwards or neither does. */
    public long insertSample(long materialId, NewSample sample) {
        return db.transactionResult(tx -> {
            long id = insertSampleRows(tx.dsl(), materialId, sample);
            recordImport(tx.dsl(), materialId, null, id, sample, null);
            LibraryGeneration.bumpConcerningSample(tx.dsl(), materialId, id);
            return id;
        });
    }

    /** Stores a sample, its curve and the file it was read from together: all three rows or none. */
    public long insertSample(long materialId, NewSample sample, SourceFile file) {
        if (!file.sha256().equals(sample.sourceSha256())) {
            throw new IllegalArgumentException("the sample's checksum " + sample.sourceSha256() + " is not the file's " + file.sha256());
        }
        return db.transactionResult(tx -> {
            long id = insertSampleRows(tx.dsl(), materialId, sample);
            insertSourceFile(tx.dsl(), id, file);
            recordImport(tx.dsl(), materialId, null, id, sample, null);
            LibraryGeneration.bumpConcerningSample(tx.dsl(), materialId, id);
            return id;
        });
    }

    /**
     * Stores an imported file in one transaction: the material when it is new, the sample, its curve
     * and the file's original bytes; afterwards either all of these rows exist or none does. When the
     * material already holds a sample at the same thickness whose curve came from a file with the same
     * checksum, nothing is written and that sample is returned as a duplicate.
     *
     * @param existingMaterialId the material to store under, or null to create {@code newMaterial}
     * @param newMaterial        used only when {@code existingMaterialId} is null; its slug is made unique
     *                           by a numeric suffix when taken
     * @throws NotFoundException when the existing material does not exist
     */
    public StoredImport storeImport(Long existingMaterialId, NewMaterial newMaterial, NewSample sample, SourceFile file) {
        if ((existingMaterialId == null) == (newMaterial == null)) {
            throw new IllegalArgumentException("give either an existing material id or a new material, not both or neither");
        }
        if (!file.sha256().equals(sample.sourceSha256())) {
            throw new IllegalArgumentException("the sample's checksum " + sample.sourceSha256()
                    + " is not the file's " + file.sha256());
        }
        return db.transactionResult(tx -> {
            DSLContext t = tx.dsl();
            Target target = target(t, existingMaterialId, newMaterial);
            long materialId = target.materialId();
            String slug = target.slug();
            if (existingMaterialId != null) {
                Optional<Long> same = findDuplicate(t, materialId, sample.sourceSha256(), sample.thicknessMm());
                if (same.isPresent()) {
                    return new StoredImport(materialId, slug, same.get(), true, false);
                }
            }
            long sampleId = insertSampleRows(t, materialId, sample);
            insertSourceFile(t, sampleId, file);
            recordImport(t, materialId, slug, sampleId, sample, target.created());
            if (existingMaterialId != null) {
                LibraryGeneration.bumpConcerningSample(t, materialId, sampleId); // the material's row is as it was
            } else {
                LibraryGeneration.bump(t, materialId); // a new material: its row too
            }
            return new StoredImport(materialId, slug, sampleId, false, existingMaterialId == null);
        });
    }

    /**
     * Stores several curves read from one file, each as its own sample (the blocks of a JCAMP-DX file), in
     * one transaction: the material when it is new, every sample, its curve and a copy of the file's bytes
     * per sample (so that each sample keeps its original when another is retired); all of these rows or none.
     * A curve the material already holds from the same file, at the same thickness and with exactly the same
     * wavelengths and transmittances, is a duplicate: nothing is written for it and its sample is returned.
     * The curve takes part in the match because the blocks of one file share its checksum.
     *
     * @throws NotFoundException when the existing material does not exist
     */
    public StoredBlocks storeBlocks(Long existingMaterialId, NewMaterial newMaterial, List<NewSample> samples,
                                    SourceFile file) {
        if ((existingMaterialId == null) == (newMaterial == null)) {
            throw new IllegalArgumentException("give either an existing material id or a new material, not both or neither");
        }
        if (samples.isEmpty()) {
            throw new IllegalArgumentException("no sample to store");
        }
        for (NewSample sample : samples) {
            if (!file.sha256().equals(sample.sourceSha256())) {
                throw new IllegalArgumentException("the sample's checksum " + sample.sourceSha256()
                        + " is not the file's " + file.sha256());
            }
        }
        return db.transactionResult(tx -> {
            DSLContext t = tx.dsl();
            Target target = target(t, existingMaterialId, newMaterial);
            long materialId = target.materialId();
            String slug = target.slug();
            // duplicates are matched against what was stored before this import, not against its own blocks
            List<Optional<Long>> before = new ArrayList<>();
            for (NewSample sample : samples) {
                before.add(existingMaterialId == null ? Optional.empty() : findSameCurve(t, materialId, sample));
            }
            List<StoredBlocks.Stored> stored = new ArrayList<>();
            boolean wrote = false;
            for (int i = 0; i < samples.size(); i++) {
                if (before.get(i).isPresent()) {
                    stored.add(new StoredBlocks.Stored(before.get(i).get(), true));
                    continue;
                }
                long sampleId = insertSampleRows(t, materialId, samples.get(i));
                insertSourceFile(t, sampleId, file);
                // the first sample stored names the material it made; the others go into it
                recordImport(t, materialId, slug, sampleId, samples.get(i), wrote ? null : target.created());
                stored.add(new StoredBlocks.Stored(sampleId, false));
                wrote = true;
            }
            if (wrote || existingMaterialId == null) {
                LibraryGeneration.bump(t, materialId);
            }
            return new StoredBlocks(materialId, slug, existingMaterialId == null, stored);
        });
    }

    /** A live sample of the material at the sample's thickness holding the same curve of the same file. */
    private static Optional<Long> findSameCurve(DSLContext t, long materialId, NewSample sample) {
        byte[] nm = PackedArrays.pack(sample.curve().wavelengthsNm());
        byte[] tr = PackedArrays.pack(sample.curve().transmittances());
        return t.select(SAMPLE.ID, CURVE.WAVELENGTHS_NM, CURVE.TRANSMITTANCE).from(CURVE).join(SAMPLE)
                .on(SAMPLE.ID.eq(CURVE.SAMPLE_ID))
                .where(CURVE.SOURCE_SHA256.eq(sample.sourceSha256()))
                .and(SAMPLE.MATERIAL_ID.eq(materialId))
                .and(SAMPLE.THICKNESS_MM.eq(sample.thicknessMm()))
                .and(SAMPLE.RETIRED_AT.isNull())
                .orderBy(SAMPLE.ID).fetch().stream()
                .filter(r -> Arrays.equals(r.get(CURVE.WAVELENGTHS_NM), nm) && Arrays.equals(r.get(CURVE.TRANSMITTANCE), tr))
                .map(r -> r.get(SAMPLE.ID)).findFirst();
    }

    /** The sample of this material at this thickness whose curve came from a file with this checksum. */
    public Optional<Long> findDuplicate(long materialId, String sha256, double thicknessMm) {
        return findDuplicate(db, materialId, sha256, thicknessMm);
    }

    private static Optional<Long> findDuplicate(DSLContext t, long materialId, String sha256, double thicknessMm) {
        return t.select(SAMPLE.ID).from(CURVE).join(SAMPLE).on(SAMPLE.ID.eq(CURVE.SAMPLE_ID))
                .where(CURVE.SOURCE_SHA256.eq(sha256))
                .and(SAMPLE.MATERIAL_ID.eq(materialId))
                .and(SAMPLE.THICKNESS_MM.eq(thicknessMm))
                .and(SAMPLE.RETIRED_AT.isNull()) // a retired sample does not hold its file: importing it again stores it anew
                .orderBy(SAMPLE.ID).limit(1).fetchOptional(SAMPLE.ID);
    }

    /** The original bytes a sample was imported from; empty for samples stored without them. */
    public Optional<SourceFile> findSourceFile(long sampleId) {
        return db.selectFrom(SOURCE_FILE).where(SOURCE_FILE.SAMPLE_ID.eq(sampleId)).fetchOptional()
                .map(r -> new SourceFile(r.getFileName(), r.getMediaType(), r.getFormat(), r.getBytes(), r.getSha256()));
    }

    /**
     * The audit entry of one sample an import stored ({@link AuditEntry#ACTION_IMPORT}), in the import's transaction.
     *
     * @param materialSlug for the summary; null to name the material by id
     * @param newMaterial  the material the import made for it, or null when it went into an existing one
     */
    private void recordImport(DSLContext t, long materialId, String materialSlug, long sampleId, NewSample sample,
                              MaterialValues newMaterial) {
        String file = sample.sourceFileName() == null || sample.sourceFileName().isBlank() ? ""
                : " from " + sample.sourceFileName();
        String into = (newMaterial != null ? "new material " : "material ")
                + (materialSlug != null ? "'" + materialSlug + "' (" + materialId + ")" : String.valueOf(materialId));
        ImportedSample after = new ImportedSample(SampleValues.imported(sampleId, materialId, sample),
                sample.sourceFileName(), sample.sourceSha256(), sample.curve().size(), newMaterial);
        AuditTrail.record(t, AuditEntry.by(actor, AuditEntry.ACTION_IMPORT, AuditEntry.SUBJECT_SAMPLE, sampleId,
                materialId, "imported sample " + sampleId + " (" + sample.thicknessMm() + " mm, "
                        + sample.geometry().label() + ") into " + into + file, null, after));
    }

    /**
     * The material an import stores under: an existing one (not retired), or the new one, inserted.
     *
     * @param created the material as inserted when the import made it, else null
     */
    private record Target(long materialId, String slug, MaterialValues created) {
    }

    private static Target target(DSLContext t, Long existingMaterialId, NewMaterial newMaterial) {
        if (existingMaterialId == null) {
            NewMaterial unique = withUniqueSlug(t, newMaterial);
            long id = insertMaterialRow(t, unique);
            return new Target(id, unique.slug(), MaterialValues.created(id, unique));
        }
        Record row = t.select(MATERIAL.SLUG, MATERIAL.RETIRED_AT).from(MATERIAL).where(MATERIAL.ID.eq(existingMaterialId))
                .fetchOptional().orElseThrow(() -> new NotFoundException("material", existingMaterialId));
        if (row.get(MATERIAL.RETIRED_AT) != null) {
            throw new RetiredException("material", existingMaterialId, row.get(MATERIAL.RETIRED_AT).toInstant());
        }
        return new Target(existingMaterialId, row.get(MATERIAL.SLUG), null);
    }

    private static NewMaterial withUniqueSlug(DSLContext t, NewMaterial m) {
        String slug = m.slug();
        for (int n = 2; t.fetchExists(MATERIAL, MATERIAL.SLUG.eq(slug)); n++) {
            slug = m.slug() + "-" + n;
        }
        return new NewMaterial(slug, m.name(), m.materialClass(), m.description(), m.tags(), m.scaling(),
                m.refractiveIndex(), m.thicknesses());
    }

    /** A slug made from a material's name, for materials created by an import. */
    public static String slugFor(String name) {
        return Slugs.fromName(name);
    }

    private static long insertMaterialRow(DSLContext t, NewMaterial material) {
        MaterialRecord row = t.newRecord(MATERIAL);
        row.setSlug(material.slug());
        row.setName(material.name());
        row.setMaterialClass(material.materialClass().label());
        row.setDescription(material.description());
        row.setTags(String.join(",", material.tags()));
        row.setScaling(material.scaling().label());
        writeIndex(row, material.refractiveIndex());
        writeThicknesses(row, material.thicknesses());
        row.store();
        return row.getId();
    }

    private static long insertSampleRows(DSLContext t, long materialId, NewSample sample) {
        SampleRecord row = t.newRecord(SAMPLE);
        row.setMaterialId(materialId);
        row.setThicknessMm(sample.thicknessMm());
        row.setGeometry(sample.geometry().label());
        row.setProvenance(sample.provenance().label());
        row.setInstrument(sample.instrument());
        row.setMeasuredOn(sample.measuredOn());
        row.setLot(sample.lot());
        row.setNotes(sample.notes());
        row.setDetectionLimit(sample.detectionLimit());
        row.store();

        Curve curve = sample.curve();
        CurveRecord curveRow = t.newRecord(CURVE);
        curveRow.setSampleId(row.getId());
        curveRow.setPointCount(curve.size());
        curveRow.setWavelengthsNm(PackedArrays.pack(curve.wavelengthsNm()));
        curveRow.setTransmittance(PackedArrays.pack(curve.transmittances()));
        curveRow.setBelowDetection(PackedArrays.pack(curve.belowDetectionFlags()));
        curveRow.setDetectionLimits(perPointLimitsIfNeeded(curve, sample.detectionLimit()));
        curveRow.setAbsorbanceUncertainty(curve.hasUncertainty() ? PackedArrays.pack(curve.absorbanceUncertainties()) : null);
        curveRow.setSourceFileName(sample.sourceFileName());
        curveRow.setSourceSha256(sample.sourceSha256());
        curveRow.store();
        return row.getId();
    }

    /**
     * The last write of an import, after the sample and curve rows; protected so that a test can make
     * it fail and check that the transaction leaves no row behind.
     */
    protected void insertSourceFile(DSLContext t, long sampleId, SourceFile file) {
        SourceFileRecord row = t.newRecord(SOURCE_FILE);
        row.setSampleId(sampleId);
        row.setFileName(file.fileName());
        row.setMediaType(file.mediaType());
        row.setFormat(file.format());
        row.setSizeBytes((long) file.size());
        row.setBytes(file.bytes());
        row.setSha256(file.sha256());
        row.store();
    }

    private static byte[] perPointLimitsIfNeeded(Curve curve, double sampleLimit) {
        double[] limits = curve.detectionLimits();
        boolean uniform = Arrays.stream(limits).allMatch(l -> l == sampleLimit);
        return uniform ? null : PackedArrays.pack(limits);
    }

    private Map<Long, List<SampleInfo>> samplesOf(List<Long> materialIds) {
        Map<Long, List<SampleInfo>> byMaterial = new LinkedHashMap<>();
        if (materialIds.isEmpty()) {
            return byMaterial;
        }
        db.selectFrom(SAMPLE).where(SAMPLE.MATERIAL_ID.in(materialIds)).and(SAMPLE.RETIRED_AT.isNull())
                .orderBy(SAMPLE.THICKNESS_MM, SAMPLE.ID).fetch()
                .forEach(s -> byMaterial.computeIfAbsent(s.getMaterialId(), k -> new ArrayList<>()).add(toSample(s)));
        return byMaterial;
    }

    static Material toMaterial(MaterialRecord m, List<SampleInfo> samples) {
        List<String> tags = m.getTags().isBlank() ? List.of() : List.of(m.getTags().split(","));
        return new Material(m.getId(), m.getSlug(), m.getName(), MaterialClass.of(m.getMaterialClass()),
                m.getDescription(), tags, Scaling.parse(m.getScaling()), readIndex(m), samples, readThicknesses(m),
                m.getRevision(), instant(m.getRetiredAt()));
    }

    static SampleInfo toSample(SampleRecord s) {
        return new SampleInfo(s.getId(), s.getMaterialId(), s.getThicknessMm(), Geometry.parse(s.getGeometry()),
                Provenance.parse(s.getProvenance()), s.getInstrument(), s.getMeasuredOn(), s.getLot(), s.getNotes(),
                s.getDetectionLimit(), s.getRevision(), instant(s.getRetiredAt()));
    }

    static java.time.Instant instant(java.time.OffsetDateTime t) {
        return t == null ? null : t.toInstant();
    }

    /** Reads a curve row joined with its sample's detection limit (used where no per-point limits are stored). */
    static Curve toCurve(Record r) {
        CurveRecord c = r.into(CURVE);
        int n = c.getPointCount();
        double[] nm = PackedArrays.unpackDoubles(c.getWavelengthsNm(), n, "curve.wavelengths_nm");
        double[] t = PackedArrays.unpackDoubles(c.getTransmittance(), n, "curve.transmittance");
        boolean[] below = PackedArrays.unpackFlags(c.getBelowDetection(), n, "curve.below_detection");
        double[] limits;
        if (c.getDetectionLimits() != null) {
            limits = PackedArrays.unpackDoubles(c.getDetectionLimits(), n, "curve.detection_limits");
        } else {
            limits = new double[n];
            Arrays.fill(limits, r.get(SAMPLE.DETECTION_LIMIT));
            // a corrected detection limit (docs/undo.md) makes every value at or under it an upper bound; flags set
            // at import stay set (they may come from the file's own markers), so the reading only grows more careful
            for (int i = 0; i < n; i++) {
                below[i] = below[i] || t[i] <= limits[i];
            }
        }
        Curve curve = Curve.of(nm, t, below, limits);
        if (c.getAbsorbanceUncertainty() == null) {
            return curve;
        }
        // validated as the other arrays: the length by unpack, each value (finite and >= 0, or NaN) by the curve
        double[] sigma = PackedArrays.unpackDoubles(c.getAbsorbanceUncertainty(), n, "curve.absorbance_uncertainty");
        Curve checked = curve.withAbsorbanceUncertainty(sigma);
        for (int i = 0; i < n; i++) {
            // a point a corrected detection limit turned into a bound has no standard deviation any more
            sigma[i] = below[i] ? Double.NaN : sigma[i];
        }
        return checked.withAbsorbanceUncertainty(sigma);
    }

    static void writeIndex(MaterialRecord row, RefractiveIndex index) {
        // Java 17: no pattern switch yet, so an instanceof chain over the sealed hierarchy
        if (index instanceof ConstantIndex c) {
            row.setIndexKind("constant");
            row.setIndexN(c.n());
        } else if (index instanceof SellmeierIndex s) {
            row.setIndexKind("sellmeier");
            row.setIndexB(NumberLists.format(s.b()));
            row.setIndexC(NumberLists.format(s.cMicronsSquared()));
            row.setIndexValidFromNm(s.validFromNm());
            row.setIndexValidToNm(s.validToNm());
        } else if (index instanceof TabulatedIndex t) {
            row.setIndexKind("table");
            row.setIndexTableNm(NumberLists.format(t.wavelengthsNm()));
            row.setIndexTableN(NumberLists.format(t.n()));
        } else {
            throw new IllegalArgumentException("unsupported refractive-index model " + index);
        }
    }

    /**
     * The stored index model; one that fails today's checks (a constant of 10¹⁶, a fit with a resonance in
     * its range) is read as an {@link UnusableIndex} carrying the reason, so that the material and its
     * measured curves stay readable while every computation that needs n refuses with that reason.
     */
    static RefractiveIndex readIndex(MaterialRecord m) {
        try {
            return checkedIndex(m);
        } catch (RuntimeException e) {
            return new UnusableIndex(storedIndexText(m), e.getMessage() == null ? e.toString() : e.getMessage());
        }
    }

    private static String storedIndexText(MaterialRecord m) {
        return switch (String.valueOf(m.getIndexKind())) {
            case "constant" -> "constant n = " + m.getIndexN();
            case "sellmeier" -> "Sellmeier B = " + m.getIndexB() + ", C = " + m.getIndexC() + ", valid "
                    + m.getIndexValidFromNm() + ".." + m.getIndexValidToNm() + " nm";
            case "table" -> "table of " + String.valueOf(m.getIndexTableN()).split(",").length + " values";
            default -> "kind " + m.getIndexKind();
        };
    }

    private static RefractiveIndex checkedIndex(MaterialRecord m) {
        return switch (m.getIndexKind()) {
            case "constant" -> new ConstantIndex(m.getIndexN());
            case "sellmeier" -> new SellmeierIndex(NumberLists.parse(m.getIndexB(), "material.index_b"),
                    NumberLists.parse(m.getIndexC(), "material.index_c"), m.getIndexValidFromNm(), m.getIndexValidToNm());
            case "table" -> new TabulatedIndex(NumberLists.parse(m.getIndexTableNm(), "material.index_table_nm"),
                    NumberLists.parse(m.getIndexTableN(), "material.index_table_n"));
            default -> throw new IllegalStateException("material " + m.getId() + " has unknown index kind " + m.getIndexKind());
        };
    }

    static void writeThicknesses(MaterialRecord row, StatedThicknesses t) {
        row.setStockThicknessesMm(t.stockMm().isEmpty() ? "" : NumberLists.format(t.stockMm()));
        row.setMadeMinMm(t.rangeStated() ? t.minMm() : null);
        row.setMadeMaxMm(t.rangeStated() ? t.maxMm() : null);
    }

    /**
     * The stated thicknesses; when the stored ones fail today's checks they are not used (a warning in the
     * log) and the material is judged by the assumed rule, as one stating none is.
     */
    static StatedThicknesses readThicknesses(MaterialRecord m) {
        try {
            return checkedThicknesses(m);
        } catch (RuntimeException e) {
            LOG.warn("material " + m.getId() + ": its stored stock or made thicknesses are not used ("
                    + e.getMessage() + "); it is judged by the assumed rule");
            return StatedThicknesses.NONE;
        }
    }

    private static StatedThicknesses checkedThicknesses(MaterialRecord m) {
        String stock = m.getStockThicknessesMm();
        List<Double> stockMm = stock == null || stock.isBlank() ? List.of()
                : NumberLists.parse(stock, "material.stock_thicknesses_mm");
        Double min = m.getMadeMinMm();
        Double max = m.getMadeMaxMm();
        return new StatedThicknesses(stockMm, min == null ? Double.NaN : min, max == null ? Double.NaN : max);
    }
}
