package org.spectralsieve.spectra;

import static org.spectralsieve.library.db.Tables.REFERENCE_SPECTRUM;

import java.sql.SQLException;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import org.jooq.DSLContext;
import org.jooq.Record;
import org.jooq.SelectField;
import org.spectralsieve.importers.SpectrumValues;
import org.spectralsieve.library.LibraryGeneration;
import org.spectralsieve.library.PackedArrays;
import org.spectralsieve.library.SourceFile;
import org.spectralsieve.library.db.tables.records.ReferenceSpectrumRecord;

/**
 * Imported reference spectra in the database (table {@code reference_spectrum}). All SQL goes through
 * jOOQ; callers see {@link ReferenceSpectrum} and {@link SourceFile}, never generated records. Rows are
 * inserted or deleted, never updated.
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

    private final DSLContext db;

    public ReferenceSpectrumRepository(DSLContext db) {
        this.db = Objects.requireNonNull(db, "db");
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
                        .and(REFERENCE_SPECTRUM.NAME.eq(s.name())))) {
                    throw new SpectrumNameTakenException(s.kind(), s.name());
                }
                long stored = insertRow(t, s);
                LibraryGeneration.bump(t);
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
        return db.select(WITHOUT_BYTES).from(REFERENCE_SPECTRUM)
                .orderBy(REFERENCE_SPECTRUM.KIND, REFERENCE_SPECTRUM.NAME).fetch(ReferenceSpectrumRepository::toSpectrum);
    }

    /** @param name compared exactly: stored names are lower-case slugs */
    public Optional<ReferenceSpectrum> find(SpectrumKind kind, String name) {
        return db.select(WITHOUT_BYTES).from(REFERENCE_SPECTRUM)
                .where(REFERENCE_SPECTRUM.KIND.eq(kind.label()).and(REFERENCE_SPECTRUM.NAME.eq(name)))
                .fetchOptional(ReferenceSpectrumRepository::toSpectrum);
    }

    /** The original file an imported spectrum was read from. */
    public Optional<SourceFile> findSourceFile(SpectrumKind kind, String name) {
        return db.select(REFERENCE_SPECTRUM.SOURCE_FILE_NAME, REFERENCE_SPECTRUM.SOURCE_FORMAT,
                        REFERENCE_SPECTRUM.SOURCE_BYTES, REFERENCE_SPECTRUM.SOURCE_SHA256)
                .from(REFERENCE_SPECTRUM)
                .where(REFERENCE_SPECTRUM.KIND.eq(kind.label()).and(REFERENCE_SPECTRUM.NAME.eq(name)))
                .fetchOptional(r -> new SourceFile(r.get(REFERENCE_SPECTRUM.SOURCE_FILE_NAME),
                        mediaType(r.get(REFERENCE_SPECTRUM.SOURCE_FORMAT)), r.get(REFERENCE_SPECTRUM.SOURCE_FORMAT),
                        r.get(REFERENCE_SPECTRUM.SOURCE_BYTES), r.get(REFERENCE_SPECTRUM.SOURCE_SHA256)));
    }

    /** @return true when a row was deleted */
    public boolean delete(SpectrumKind kind, String name) {
        return db.transactionResult(tx -> {
            boolean deleted = tx.dsl().deleteFrom(REFERENCE_SPECTRUM)
                    .where(REFERENCE_SPECTRUM.KIND.eq(kind.label()).and(REFERENCE_SPECTRUM.NAME.eq(name)))
                    .execute() > 0;
            if (deleted) {
                LibraryGeneration.bump(tx.dsl());
            }
            return deleted;
        });
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
