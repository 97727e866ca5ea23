package org.spectralsieve.library;

import java.time.Instant;
import java.time.LocalDate;
import java.util.Objects;

/**
 * One revision of a sample's metadata: the values a correction may change, why they changed, and when.
 * Revision 1 holds the values as imported (reason empty, revisedAt the import's time).
 *
 * @param current whether this is the revision searches, exports and figures use now
 */
public record SampleRevision(long sampleId, int revision, double thicknessMm, Geometry geometry, String instrument,
                             LocalDate measuredOn, String lot, String notes, double detectionLimit, String reason,
                             Instant revisedAt, boolean current) {

    public SampleRevision {
        if (revision < 1) {
            throw new IllegalArgumentException("revision must be 1 or more, got " + revision);
        }
        Objects.requireNonNull(geometry, "geometry");
        instrument = Objects.requireNonNullElse(instrument, "");
        lot = Objects.requireNonNullElse(lot, "");
        notes = Objects.requireNonNullElse(notes, "");
        reason = Objects.requireNonNullElse(reason, "");
    }
}
