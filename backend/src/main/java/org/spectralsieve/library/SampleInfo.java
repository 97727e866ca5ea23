package org.spectralsieve.library;

import java.time.LocalDate;
import java.util.Objects;

/** One specimen of a material at one thickness, without its curve. */
public record SampleInfo(long id, long materialId, double thicknessMm, Geometry geometry, Provenance provenance,
                         String instrument, LocalDate measuredOn, String lot, String notes, double detectionLimit) {

    public SampleInfo {
        Objects.requireNonNull(geometry, "geometry");
        Objects.requireNonNull(provenance, "provenance");
        instrument = Objects.requireNonNullElse(instrument, "");
        lot = Objects.requireNonNullElse(lot, "");
        notes = Objects.requireNonNullElse(notes, "");
    }
}
