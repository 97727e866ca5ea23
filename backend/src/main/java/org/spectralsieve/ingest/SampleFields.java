package org.spectralsieve.ingest;

import java.time.LocalDate;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.Provenance;

/**
 * What the user says about the specimen; null means "not given".
 *
 * @param thicknessMm required for a bulk material; when not given, the file's {@code thickness_mm}
 * @param geometry    default regular (direct beam)
 * @param provenance  default: datasheet for datasheet points, else the file's {@code provenance}, else measured
 * @param instrument  default: the file's {@code instrument} metadata
 */
public record SampleFields(Double thicknessMm, Geometry geometry, Provenance provenance, String instrument,
                           LocalDate measuredOn, String lot, String notes) {

    public static SampleFields thickness(double mm) {
        return new SampleFields(mm, null, null, null, null, null, null);
    }
}
