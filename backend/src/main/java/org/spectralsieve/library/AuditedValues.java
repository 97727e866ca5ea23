package org.spectralsieve.library;

import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import java.util.Map;

/**
 * The values of a sample or material as the audit trail records them before and after a change (docs/audit.md):
 * plain records the trail writes as JSON, with the labels the API uses (geometry {@code regular}, not an enum's
 * name). The curve itself is named by its file's checksum and point count, never copied: it never changes.
 */
public final class AuditedValues {

    private AuditedValues() {
    }

    /** A sample's values at one revision. */
    public record SampleValues(long id, long materialId, int revision, double thicknessMm, String geometry,
                               String provenance, String instrument, LocalDate measuredOn, String lot, String notes,
                               double detectionLimit, Instant retiredAt) {

        public static SampleValues of(SampleInfo s) {
            return new SampleValues(s.id(), s.materialId(), s.revision(), s.thicknessMm(), s.geometry().label(),
                    s.provenance().label(), s.instrument(), s.measuredOn(), s.lot(), s.notes(), s.detectionLimit(),
                    s.retiredAt());
        }

        public SampleValues withRetiredAt(Instant at) {
            return new SampleValues(id, materialId, revision, thicknessMm, geometry, provenance, instrument, measuredOn,
                    lot, notes, detectionLimit, at);
        }

        /** A sample as an import stores it: revision 1, in use. */
        static SampleValues imported(long id, long materialId, NewSample s) {
            return new SampleValues(id, materialId, 1, s.thicknessMm(), s.geometry().label(), s.provenance().label(),
                    s.instrument(), s.measuredOn(), s.lot(), s.notes(), s.detectionLimit(), null);
        }
    }

    /** What an import stored: the sample, the file its curve came from, and whether it made its material. */
    public record ImportedSample(SampleValues sample, String sourceFileName, String sourceSha256, int points,
                                 MaterialValues newMaterial) {
    }

    /** A material's values at one revision (its own row; its samples have entries of their own). */
    public record MaterialValues(long id, String slug, String name, String materialClass, String description,
                                 List<String> tags, String scaling, int revision, Map<String, Object> refractiveIndex,
                                 Map<String, Object> thicknesses, Instant retiredAt) {

        public static MaterialValues of(Material m) {
            return new MaterialValues(m.id(), m.slug(), m.name(), m.materialClass().label(), m.description(), m.tags(),
                    m.scaling().label(), m.revision(), RefractiveIndexJson.toJson(m.refractiveIndex()),
                    StatedThicknessesJson.toJson(m.thicknesses()), m.retiredAt());
        }

        public MaterialValues withRetiredAt(Instant at) {
            return new MaterialValues(id, slug, name, materialClass, description, tags, scaling, revision,
                    refractiveIndex, thicknesses, at);
        }

        static MaterialValues created(long id, NewMaterial m) {
            return new MaterialValues(id, m.slug(), m.name(), m.materialClass().label(), m.description(), m.tags(),
                    m.scaling().label(), 1, RefractiveIndexJson.toJson(m.refractiveIndex()),
                    StatedThicknessesJson.toJson(m.thicknesses()), null);
        }
    }
}
