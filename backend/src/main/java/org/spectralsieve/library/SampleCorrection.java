package org.spectralsieve.library;

import java.time.LocalDate;
import java.util.Objects;

/**
 * What a correction changes in a sample's metadata; a null field stays as it is. The curve is not here: it
 * is the measurement and never changes. Values are checked at the edge, field by field, as an import checks
 * them ({@code org.spectralsieve.ingest.SampleCorrectionForm}).
 *
 * @param reason why, in the user's words; kept with the revision
 */
public record SampleCorrection(Double thicknessMm, Geometry geometry, String instrument, LocalDate measuredOn,
                               String lot, String notes, Double detectionLimit, String reason) {

    public SampleCorrection {
        Objects.requireNonNull(reason, "reason");
    }

    /** The sample's values with this correction applied, as the next revision (the id and curve stay). */
    public SampleInfo applyTo(SampleInfo s) {
        return new SampleInfo(s.id(), s.materialId(), or(thicknessMm, s.thicknessMm()), or(geometry, s.geometry()),
                s.provenance(), or(instrument, s.instrument()), or(measuredOn, s.measuredOn()), or(lot, s.lot()),
                or(notes, s.notes()), or(detectionLimit, s.detectionLimit()), s.revision() + 1, s.retiredAt());
    }

    public boolean changesDetectionLimit(SampleInfo s) {
        return detectionLimit != null && detectionLimit != s.detectionLimit();
    }

    /** Whether applying it changes no value at all (a revision that says nothing new is refused). */
    public boolean changesNothing(SampleInfo s) {
        SampleInfo c = applyTo(s);
        return c.thicknessMm() == s.thicknessMm() && c.geometry() == s.geometry()
                && c.instrument().equals(s.instrument()) && Objects.equals(c.measuredOn(), s.measuredOn())
                && c.lot().equals(s.lot()) && c.notes().equals(s.notes()) && c.detectionLimit() == s.detectionLimit();
    }

    private static <T> T or(T value, T current) {
        return value == null ? current : value;
    }
}
