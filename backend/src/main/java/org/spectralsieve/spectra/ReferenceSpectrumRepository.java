package org.spectralsieve.spectra;

import static org.spectralsieve.library.db.Tables.REFERENCE_SPECTRUM;

import java.sql.SQLException;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import org.jooq.Condition;
import org.jooq.DSLContext;
import org.jooq.Record;
import org.jooq.SelectField;
import org.spectralsieve.audit.ActingUser;
import org.spectralsieve.audit.AuditEntry;
import org.spectralsieve.audit.AuditTrail;
import org.spectralsieve.importers.SpectrumValues;
import org.spectralsieve.library.LibraryGeneration;
import org.spectralsieve.library.PackedArrays;
import org.spectralsieve.library.SourceFile;
import org.spectralsieve.library.db.tables.records.ReferenceSpectrumRecord;

/**
 * Imported reference spectra in the database (table {@code reference_spectrum}). All SQL goes through
 * jOOQ; callers see {@link ReferenceSpectrum} and {@link SourceFile}, never generated records. Rows are
 * inserted, then only ever retired or restored (docs/undo.md): every read but the retired listing sees the
 * spectra in use, and no ordinary path deletes a row. Each import, retirement and restoration records itself in the
 * audit trail in its transaction ({@link AuditTrail}; subject kind {@code emitter} or {@code response}).
 */
public class ReferenceSpectrumRepository {

    /** SQLSTATE of a unique-constraint violation, the same in H2 and PostgreSQL. */
    private static final String UNIQUE_VIOLATION = "23505";

    /** Every column but the file's bytes, which only the source-file download needs. */
    private static final List<SelectField<?>> WITHOUT_BYTES = List.of(REFERENCE_SPECTRUM.ID, REFERENCE_SPECTRUM.KIND,
            REFERENCE_SPECTRUM.NAME, REFERENCE_SPECTRUM.DESCRIPTION, REFERENCE_SPECTRUM.PROVENANCE_NOTE,
            REFERENCE_SPECTRUM.VALUE_COLUMN, REFERENCE_SPECTRUM.POINT_COUNT, REFERENCE_SPECTRUM.WAVELENGTHS_NM,
            REFERENCE_SPECTRUM.RELATIVE_VALUES, REFERENCE_SPECTRUM.SOURCE_FILE_NAME, REFERENCE_SPECTRUM.SOURCE_FORMAT,
            REFERENCE_SPECTRUM.SOURCE_SHA256, REFERENCE_SPECTRUM.CREATED_AT);

    /** A spectrum in use: not retired (docs/undo.md). */
    private static final Condition IN_USE = REFERENCE_SPECTRUM.RETIRED_KEY.eq(0L);

    private final DSLContext db;
    private final ActingUser actor;

    /** Changes are recorded as the embedded single user's ({@link ActingUser#LOCAL}): for tests and tools. */
    public ReferenceSpectrumRepository(DSLContext db) {
        this(db, ActingUser.LOCAL);
    }

    /** @param actor who makes each change, asked inside the change's transaction */
    public ReferenceSpectrumRepository(DSLContext db, ActingUser actor) {
        this.db = Objects.requireNonNull(db, "db");
        this.actor = Objects.requireNonNull(actor, "actor");
    }

    /** An imported spectrum as the audit trail records it: what names and traces it, not its points. */
    public record AuditedSpectrum(long id, String kind, String name, String description, String provenanceNote,
                                  String valueColumn, int points, String sourceFileName, String sourceSha256,
                                  OffsetDateTime retiredAt) {
    }

    private static AuditedSpectrum audited(DSLContext t, long id) {
        return t.select(REFERENCE_SPECTRUM.ID, REFERENCE_SPECTRUM.KIND, REFERENCE_SPECTRUM.NAME,
                        REFERENCE_SPECTRUM.DESCRIPTION, REFERENCE_SPECTRUM.PROVENANCE_NOTE, REFERENCE_SPECTRUM.VALUE_COLUMN,
                        REFERENCE_SPECTRUM.POINT_COUNT, REFERENCE_SPECTRUM.SOURCE_FILE_NAME,
                        REFERENCE_SPECTRUM.SOURCE_SHA256, REFERENCE_SPECTRUM.RETIRED_AT)
                .from(REFERENCE_SPECTRUM).where(REFERENCE_SPECTRUM.ID.eq(id))
                .fetchSingle(r -> new AuditedSpectrum(r.value1(), r.value2(), r.value3(), r.value4(), r.value5(),
                        r.value6(), r.value7(), r.value8(), r.value9(), r.value10()));
    }

    /** One audit entry of a change of spectrum {@code id}, in the change's transaction. */
    private void record(DSLContext t, String action, String verb, AuditedSpectrum before, long id) {
        AuditedSpectrum after = audited(t, id);
        AuditTrail.record(t, AuditEntry.by(actor, action, after.kind(), id, null,
                verb + " " + after.kind() + " " + id + " '" + after.name() + "'", before, after));
    }

    /**
     * Stores the spectrum and its file as one row, in one transaction.
     *
     * @throws SpectrumNameTakenException when an imported spectrum of the kind has the name already
     *                                    (checked first, and by the unique constraint for a concurrent import)
     */
    public ReferenceSpectrum insert(NewReferenceSpectrum s) {
        try {
            long id = db.transactionResult(tx -> {
                DSLContext t = tx.dsl();
                if (t.fetchExists(REFERENCE_SPECTRUM, REFERENCE_SPECTRUM.KIND.eq(s.kind().label())
                        .and(REFERENCE_SPECTRUM.NAME.eq(s.name())).and(IN_USE))) {
                    throw new SpectrumNameTakenException(s.kind(), s.name());
                }
                long stored = insertRow(t, s);
                record(t, AuditEntry.ACTION_IMPORT, "imported", null, stored);
                LibraryGeneration.bumpConcerningNoMaterial(t);
                return stored;
            });
            return find(s.kind(), s.name()).filter(r -> r.id() == id)
                    .orElseThrow(() -> new IllegalStateException("spectrum " + id + " stored but not found"));
        } catch (RuntimeException e) {
            if (e instanceof SpectrumNameTakenException || isUniqueViolation(e)) {
                throw new SpectrumNameTakenException(s.kind(), s.name());
            }
            throw e;
        }
    }

    /**
     * The last write of an import; protected so that a test can make it fail and check that no row is
     * left behind.
     */
    protected long insertRow(DSLContext t, NewReferenceSpectrum s) {
        SpectrumValues v = s.values();
        SourceFile f = s.file();
        ReferenceSpectrumRecord row = t.newRecord(REFERENCE_SPECTRUM);
        row.setKind(s.kind().label());
        row.setName(s.name());
        row.setDescription(s.description());
        row.setProvenanceNote(s.provenanceNote());
        row.setValueColumn(v.valueColumn());
        row.setPointCount(v.size());
        row.setWavelengthsNm(PackedArrays.pack(v.wavelengthsNm()));
        row.setRelativeValues(PackedArrays.pack(v.values()));
        row.setSourceFileName(f.fileName());
        row.setSourceFormat(f.format());
        row.setSourceBytes(f.bytes());
        row.setSourceSha256(f.sha256());
        row.store();
        return row.getId();
    }

    private static boolean isUniqueViolation(Throwable e) {
        for (Throwable t = e; t != null; t = t.getCause() == t ? null : t.getCause()) {
            if (t instanceof SQLException sql && UNIQUE_VIOLATION.equals(sql.getSQLState())) {
                return true;
            }
        }
        return false;
    }

    /** Every imported spectrum, emitters then responses, each by name. */
    public List<ReferenceSpectrum> findAll() {
        return db.select(WITHOUT_BYTES).from(REFERENCE_SPECTRUM).where(IN_USE)
                .orderBy(REFERENCE_SPECTRUM.KIND, REFERENCE_SPECTRUM.NAME).fetch(ReferenceSpectrumRepository::toSpectrum);
    }

    /** @param name compared exactly: stored names are lower-case slugs */
    public Optional<ReferenceSpectrum> find(SpectrumKind kind, String name) {
        return db.select(WITHOUT_BYTES).from(REFERENCE_SPECTRUM)
                .where(REFERENCE_SPECTRUM.KIND.eq(kind.label()).and(REFERENCE_SPECTRUM.NAME.eq(name)).and(IN_USE))
                .fetchOptional(ReferenceSpectrumRepository::toSpectrum);
    }

    /** The original file an imported spectrum was read from. */
    public Optional<SourceFile> findSourceFile(SpectrumKind kind, String name) {
        return db.select(REFERENCE_SPECTRUM.SOURCE_FILE_NAME, REFERENCE_SPECTRUM.SOURCE_FORMAT,
                        REFERENCE_SPECTRUM.SOURCE_BYTES, REFERENCE_SPECTRUM.SOURCE_SHA256)
                .from(REFERENCE_SPECTRUM)
                .where(REFERENCE_SPECTRUM.KIND.eq(kind.label()).and(REFERENCE_SPECTRUM.NAME.eq(name)).and(IN_USE))
                .fetchOptional(r -> new SourceFile(r.get(REFERENCE_SPECTRUM.SOURCE_FILE_NAME),
                        mediaType(r.get(REFERENCE_SPECTRUM.SOURCE_FORMAT)), r.get(REFERENCE_SPECTRUM.SOURCE_FORMAT),
                        r.get(REFERENCE_SPECTRUM.SOURCE_BYTES), r.get(REFERENCE_SPECTRUM.SOURCE_SHA256)));
    }

    /**
     * Retires the spectrum in use of this kind and name, in one statement: it is kept with its file, leaves
     * every listing and lookup, and gives up its name (a new import may take it; docs/undo.md).
     *
     * @return the retired spectrum's id, empty when none in use has the name
     */
    public Optional<Long> retire(SpectrumKind kind, String name) {
        return db.transactionResult(tx -> {
            DSLContext t = tx.dsl();
            Optional<Long> id = t.select(REFERENCE_SPECTRUM.ID).from(REFERENCE_SPECTRUM)
                    .where(REFERENCE_SPECTRUM.KIND.eq(kind.label()).and(REFERENCE_SPECTRUM.NAME.eq(name)).and(IN_USE))
                    .forUpdate().fetchOptional(REFERENCE_SPECTRUM.ID);
            AuditedSpectrum before = id.map(i -> audited(t, i)).orElse(null);
            id.ifPresent(i -> t.update(REFERENCE_SPECTRUM)
                    .set(REFERENCE_SPECTRUM.RETIRED_AT, OffsetDateTime.now(ZoneOffset.UTC).truncatedTo(java.time.temporal.ChronoUnit.MICROS))
                    .set(REFERENCE_SPECTRUM.RETIRED_KEY, i)
                    .where(REFERENCE_SPECTRUM.ID.eq(i)).execute());
            if (id.isPresent()) {
                record(t, AuditEntry.ACTION_RETIRE, "retired", before, id.get());
                LibraryGeneration.bumpConcerningNoMaterial(t);
            }
            return id;
        });
    }

    /**
     * Puts a retired spectrum back in use under its name: the one with {@code id}, or when null the most
     * recently retired of this kind and name.
     *
     * @return the restored spectrum, empty when no such retired one exists
     * @throws SpectrumNameTakenException when a spectrum in use has the name now
     */
    public Optional<ReferenceSpectrum> restore(SpectrumKind kind, String name, Long id) {
        try {
            Optional<Long> restored = db.transactionResult(tx -> {
                DSLContext t = tx.dsl();
                var where = REFERENCE_SPECTRUM.KIND.eq(kind.label()).and(REFERENCE_SPECTRUM.NAME.eq(name))
                        .and(REFERENCE_SPECTRUM.RETIRED_AT.isNotNull());
                if (id != null) {
                    where = where.and(REFERENCE_SPECTRUM.ID.eq(id));
                }
                Optional<Long> found = t.select(REFERENCE_SPECTRUM.ID).from(REFERENCE_SPECTRUM).where(where)
                        .orderBy(REFERENCE_SPECTRUM.RETIRED_AT.desc(), REFERENCE_SPECTRUM.ID.desc()).limit(1)
                        .fetchOptional(REFERENCE_SPECTRUM.ID);
                if (found.isEmpty()) {
                    return found;
                }
                if (t.fetchExists(REFERENCE_SPECTRUM, REFERENCE_SPECTRUM.KIND.eq(kind.label())
                        .and(REFERENCE_SPECTRUM.NAME.eq(name)).and(IN_USE))) {
                    throw new SpectrumNameTakenException(kind, name);
                }
                AuditedSpectrum before = audited(t, found.get());
                t.update(REFERENCE_SPECTRUM).setNull(REFERENCE_SPECTRUM.RETIRED_AT).set(REFERENCE_SPECTRUM.RETIRED_KEY, 0L)
                        .where(REFERENCE_SPECTRUM.ID.eq(found.get())).execute();
                record(t, AuditEntry.ACTION_RESTORE, "restored", before, found.get());
                LibraryGeneration.bumpConcerningNoMaterial(t);
                return found;
            });
            return restored.flatMap(i -> find(kind, name));
        } catch (RuntimeException e) {
            if (e instanceof SpectrumNameTakenException || isUniqueViolation(e)) {
                throw new SpectrumNameTakenException(kind, name);
            }
            throw e;
        }
    }

    /** One retired spectrum, without its points: enough to choose which to restore. */
    public record Retired(long id, SpectrumKind kind, String name, String description, String sourceFileName,
                          String sourceSha256, OffsetDateTime createdAt, OffsetDateTime retiredAt) {
    }

    /** The retired spectra of a kind, most recently retired first. */
    public List<Retired> findRetired(SpectrumKind kind) {
        return db.select(REFERENCE_SPECTRUM.ID, REFERENCE_SPECTRUM.NAME, REFERENCE_SPECTRUM.DESCRIPTION,
                        REFERENCE_SPECTRUM.SOURCE_FILE_NAME, REFERENCE_SPECTRUM.SOURCE_SHA256,
                        REFERENCE_SPECTRUM.CREATED_AT, REFERENCE_SPECTRUM.RETIRED_AT)
                .from(REFERENCE_SPECTRUM)
                .where(REFERENCE_SPECTRUM.KIND.eq(kind.label()).and(REFERENCE_SPECTRUM.RETIRED_AT.isNotNull()))
                .orderBy(REFERENCE_SPECTRUM.RETIRED_AT.desc(), REFERENCE_SPECTRUM.ID.desc())
                .fetch(r -> new Retired(r.get(REFERENCE_SPECTRUM.ID), kind, r.get(REFERENCE_SPECTRUM.NAME),
                        r.get(REFERENCE_SPECTRUM.DESCRIPTION), r.get(REFERENCE_SPECTRUM.SOURCE_FILE_NAME),
                        r.get(REFERENCE_SPECTRUM.SOURCE_SHA256), r.get(REFERENCE_SPECTRUM.CREATED_AT),
                        r.get(REFERENCE_SPECTRUM.RETIRED_AT)));
    }

    /** The library's change counter as committed now ({@link LibraryGeneration}), which imports and deletes raise. */
    public long generation() {
        return LibraryGeneration.read(db);
    }

    public int count() {
        return db.fetchCount(REFERENCE_SPECTRUM);
    }

    private static String mediaType(String format) {
        return format.equals("jcamp-dx") ? "chemical/x-jcamp-dx" : "text/csv";
    }

    private static ReferenceSpectrum toSpectrum(Record r) {
        int n = r.get(REFERENCE_SPECTRUM.POINT_COUNT);
        return new ReferenceSpectrum(r.get(REFERENCE_SPECTRUM.ID), SpectrumKind.parse(r.get(REFERENCE_SPECTRUM.KIND)),
                r.get(REFERENCE_SPECTRUM.NAME), r.get(REFERENCE_SPECTRUM.DESCRIPTION),
                r.get(REFERENCE_SPECTRUM.PROVENANCE_NOTE), r.get(REFERENCE_SPECTRUM.VALUE_COLUMN),
                PackedArrays.unpackDoubles(r.get(REFERENCE_SPECTRUM.WAVELENGTHS_NM), n, "reference_spectrum.wavelengths_nm"),
                PackedArrays.unpackDoubles(r.get(REFERENCE_SPECTRUM.RELATIVE_VALUES), n, "reference_spectrum.relative_values"),
                r.get(REFERENCE_SPECTRUM.SOURCE_FILE_NAME), r.get(REFERENCE_SPECTRUM.SOURCE_FORMAT),
                r.get(REFERENCE_SPECTRUM.SOURCE_SHA256), r.get(REFERENCE_SPECTRUM.CREATED_AT));
    }
}
