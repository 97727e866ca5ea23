package org.spectralsieve.curation;

import java.util.Objects;
import org.spectralsieve.ingest.ImportRequestException;
import org.spectralsieve.library.JooqLibraryRevisions;
import org.spectralsieve.library.JooqLibraryRevisions.Kind;
import org.spectralsieve.library.JooqLibraryRevisions.Retirement;
import org.spectralsieve.library.MaterialCorrection;
import org.spectralsieve.library.MaterialRevision;
import org.spectralsieve.library.SampleCorrection;
import org.spectralsieve.library.SampleRevision;

/**
 * Retires, restores and corrects samples and materials; after each committed change it runs
 * {@code afterCommit} (the search store's refresh, as after an import), and never after a refused one.
 */
public class LibraryCuration {

    private final JooqLibraryRevisions revisions;
    private final Runnable afterCommit;

    public LibraryCuration(JooqLibraryRevisions revisions, Runnable afterCommit) {
        this.revisions = Objects.requireNonNull(revisions, "revisions");
        this.afterCommit = Objects.requireNonNull(afterCommit, "afterCommit");
    }

    /** @throws org.spectralsieve.library.NotFoundException no such sample or material */
    public Retirement retire(Kind kind, long id) {
        return changed(revisions.setRetired(kind, id, true));
    }

    /** @throws org.spectralsieve.library.NotFoundException no such sample or material */
    public Retirement restore(Kind kind, long id) {
        return changed(revisions.setRetired(kind, id, false));
    }

    /**
     * Stores the correction as the sample's next revision.
     *
     * @throws ImportRequestException the correction changes nothing, or changes the detection limit of a
     *                                curve whose limits were computed point by point
     */
    public SampleRevision correct(long sampleId, SampleCorrection correction) {
        SampleRevision stored = revisions.correctSample(sampleId, correction, (now, next, perPointLimits) -> {
            if (correction.changesNothing(now)) {
                throw new ImportRequestException(firstGiven(correction), "every value given equals revision "
                        + now.revision() + "; a correction must change something");
            }
            if (perPointLimits && correction.changesDetectionLimit(now)) {
                throw new ImportRequestException("detectionLimit", "this curve's detection limits were computed point by"
                        + " point from its raw counts (the largest is " + now.detectionLimit() + "); one number cannot"
                        + " replace them: import the counts again with the right options instead");
            }
        });
        afterCommit.run();
        return stored;
    }

    /**
     * Stores the correction as the material's next revision (its samples are read through it from then on).
     *
     * @throws ImportRequestException the correction changes nothing
     */
    public MaterialRevision correct(long materialId, MaterialCorrection correction) {
        MaterialRevision stored = revisions.correctMaterial(materialId, correction, now -> {
            if (correction.changesNothing(now)) {
                throw new ImportRequestException(correction.refractiveIndex() != null ? "indexN" : "stockThicknesses",
                        "every value given equals revision " + now.revision() + "; a correction must change something");
            }
        });
        afterCommit.run();
        return stored;
    }

    private Retirement changed(Retirement r) {
        if (r.changed()) {
            afterCommit.run();
        }
        return r;
    }

    private static String firstGiven(SampleCorrection c) {
        if (c.thicknessMm() != null) {
            return "thicknessMm";
        }
        if (c.geometry() != null) {
            return "geometry";
        }
        if (c.detectionLimit() != null) {
            return "detectionLimit";
        }
        return c.notes() != null ? "notes" : c.instrument() != null ? "instrument" : c.lot() != null ? "lot" : "measuredOn";
    }
}
