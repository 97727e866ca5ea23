package org.spectralsieve.ingest;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.library.FieldException;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.NewStateCurve;
import org.spectralsieve.library.NotFoundException;
import org.spectralsieve.library.RetiredException;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.library.SourceFile;
import org.spectralsieve.library.StoredStateCurve;
import org.spectralsieve.optics.PhysicalRanges;
import org.spectralsieve.states.MaterialState;

/**
 * Stores a file as a sample's curve in another state, and retires and restores state curves (docs/material-states.md): read exactly as an import reads a
 * sample's file ({@link ImportService#preview}: the same formats, options, limits, detection limit and flags, so a
 * capture with negative points or readings under its floor is kept and flagged, not refused), then stored with its
 * state and the file's bytes in one transaction. The same file already stored for the sample in the same state is
 * recognised and not stored again.
 */
public final class StateCurveService {

    private final ImportService imports;
    private final JooqLibraryRepository library;
    private final Runnable afterCommit;

    /** @param afterCommit run after each committed state curve (the search service's refresh) */
    public StateCurveService(ImportService imports, JooqLibraryRepository library, Runnable afterCommit) {
        this.imports = Objects.requireNonNull(imports, "imports");
        this.library = Objects.requireNonNull(library, "library");
        this.afterCommit = Objects.requireNonNull(afterCommit, "afterCommit");
    }

    /**
     * What was stored (or found already stored).
     *
     * @param duplicate true when the same file was already stored for this sample in this state; nothing was added
     */
    public record Result(long sampleId, long materialId, StoredStateCurve stored, boolean duplicate, FilePreview preview,
                         List<String> warnings) {
    }

    /**
     * @param thicknessMm the thickness it was measured at; null for the sample's own
     * @throws NotFoundException      no such sample
     * @throws RetiredException       the sample or its material is retired
     * @throws ImportException        the file cannot be read
     * @throws ImportRequestException a field is wrong (named)
     */
    public Result store(long sampleId, String fileName, byte[] bytes, ImportOptions options, MaterialState state,
                        Double thicknessMm, String notes) throws ImportException {
        Objects.requireNonNull(state, "state");
        SampleInfo sample = library.findSample(sampleId).orElseThrow(() -> new NotFoundException("sample", sampleId));
        if (sample.retired()) {
            // refused before the file is read: a retired sample takes nothing
            throw new RetiredException("sample", sampleId, sample.retiredAt());
        }
        if (options.eachBlock()) {
            throw new ImportRequestException("eachBlock", "a state curve is one curve: choose one block (block)");
        }
        if (thicknessMm != null && !PhysicalRanges.isThicknessMm(thicknessMm)) {
            throw new ImportRequestException("thicknessMm", "a thickness must be from " + PhysicalRanges.MIN_THICKNESS_MM
                    + " mm (1 µm) to " + (long) PhysicalRanges.MAX_THICKNESS_MM + " mm, got " + thicknessMm);
        }
        FilePreview preview = imports.preview(fileName, bytes, options);
        List<String> warnings = new ArrayList<>(preview.warnings());
        double thickness = thicknessMm != null ? thicknessMm : sample.thicknessMm();
        if (thickness != sample.thicknessMm()) {
            warnings.add("measured at " + thickness + " mm, the sample's own curve at " + sample.thicknessMm()
                    + " mm: a state curve is judged as measured, never rescaled");
        }
        for (StoredStateCurve s : library.findStoredStateCurves(sampleId, false)) {
            if (s.sourceSha256().equals(preview.sha256()) && s.stateCurve().state().equals(state)) {
                warnings.add("this file (SHA-256 " + preview.sha256().substring(0, 12) + "…) is already stored for sample "
                        + sampleId + " as state curve " + s.id() + " (" + state.describe() + "); nothing was added");
                return new Result(sampleId, sample.materialId(), s, true, preview, warnings);
            }
        }
        SourceFile file = new SourceFile(preview.fileName(), preview.format().mediaType(), preview.format().label(), bytes,
                preview.sha256());
        NewStateCurve curve;
        try {
            curve = NewStateCurve.fromFile(state, preview.curve(), thickness, preview.detectionLimit(),
                    notes == null ? "" : notes, file);
        } catch (FieldException e) {
            if (e.field().equals("detectionLimit")) {
                throw new IngestException(preview.fileName(), e.field(), e.getMessage());
            }
            throw new ImportRequestException(e.field(), e.getMessage());
        }
        long id = library.storeStateCurve(sampleId, curve);
        afterCommit.run();
        return new Result(sampleId, sample.materialId(), library.findStateCurve(id).orElseThrow(), false, preview,
                warnings);
    }

    /**
     * Retires ({@code retire}) or restores a state curve; the search store is refreshed when it changed.
     *
     * @throws NotFoundException no such state curve
     */
    public JooqLibraryRepository.StateCurveRetirement setRetired(long stateCurveId, boolean retire) {
        JooqLibraryRepository.StateCurveRetirement r = library.setStateCurveRetired(stateCurveId, retire);
        if (r.changed()) {
            afterCommit.run();
        }
        return r;
    }
}
