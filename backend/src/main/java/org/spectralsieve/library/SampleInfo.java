package org.spectralsieve.library;

import java.time.Instant;
import java.time.LocalDate;
import java.util.Objects;

/**
 * One specimen of a material at one thickness, without its curve, as its current revision states it.
 *
 * @param revision  the number of the revision these values are (1 as imported; see docs/undo.md)
 * @param retiredAt when it was retired (hidden from listings and searches), or null while in use
 */
public record SampleInfo(long id, long materialId, double thicknessMm, Geometry geometry, Provenance provenance,
                         String instrument, LocalDate measuredOn, String lot, String notes, double detectionLimit,
                         int revision, Instant retiredAt) {

    /** A sample at its first revision, in use. */
    public SampleInfo(long id, long materialId, double thicknessMm, Geometry geometry, Provenance provenance,
                      String instrument, LocalDate measuredOn, String lot, String notes, double detectionLimit) {
        this(id, materialId, thicknessMm, geometry, provenance, instrument, measuredOn, lot, notes, detectionLimit, 1, null);
    }

    public boolean retired() {
        return retiredAt != null;
    }

    public SampleInfo {
        if (revision < 1) {
            throw new IllegalArgumentException("revision must be 1 or more, got " + revision);
        }
        Objects.requireNonNull(geometry, "geometry");
        Objects.requireNonNull(provenance, "provenance");
        instrument = Objects.requireNonNullElse(instrument, "");
        lot = Objects.requireNonNullElse(lot, "");
        notes = Objects.requireNonNullElse(notes, "");
    }
}
