package org.spectralsieve.search;

import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.optics.PhysicalRanges;
import org.spectralsieve.requirement.RankedRow;

/**
 * What a shortlist shows beside each ranked row, read from the snapshot the rows were judged on: the sample's
 * geometry, the thickness it was measured at and the revisions of the sample and material (docs/result-rows.md).
 */
final class RowDecoration {

    private RowDecoration() {
    }

    /** Sample id → geometry label ("regular" or "total") of every row's sample, for the answer to show. */
    static Map<Long, String> geometries(Snapshot s, List<RankedRow> rows) {
        Map<Long, String> out = new HashMap<>();
        for (RankedRow row : rows) {
            long id = row.evaluation().sampleId();
            out.put(id, s.samples().get(id).geometry().label());
        }
        return out;
    }

    /** Sample id → the thickness every row's sample was measured at, where recorded (docs/result-rows.md). */
    static Map<Long, Double> measured(Snapshot s, List<RankedRow> rows) {
        Map<Long, Double> out = new HashMap<>();
        for (RankedRow row : rows) {
            SampleInfo sample = s.samples().get(row.evaluation().sampleId());
            if (PhysicalRanges.isThicknessMm(sample.thicknessMm())) {
                out.put(sample.id(), sample.thicknessMm());
            }
        }
        return out;
    }

    /** Sample id → the revisions of every row's sample and material the row was judged on (docs/undo.md). */
    static Map<Long, Shortlist.Revisions> revisions(Snapshot s, List<RankedRow> rows) {
        Map<Long, Shortlist.Revisions> out = new HashMap<>();
        for (RankedRow row : rows) {
            SampleInfo sample = s.samples().get(row.evaluation().sampleId());
            out.put(sample.id(), new Shortlist.Revisions(sample.revision(), s.materials().get(sample.materialId()).revision()));
        }
        return out;
    }
}
