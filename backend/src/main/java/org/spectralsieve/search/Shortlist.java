package org.spectralsieve.search;

import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import org.spectralsieve.requirement.RankedRow;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.StackLayer;

/**
 * The ranked, explained answer to one requirement. {@code evaluatedSamples}: the samples the requirement
 * was evaluated on (after the class and geometry filters); {@code judgedExactly}: how many of them the
 * exact evaluator judged on their stored curves (the store ruled out the rest); a judgement the service's memo
 * handed out again ({@link JudgementMemo}) counts: it is the exact evaluator's result for exactly these arguments,
 * made earlier (docs/judgement-memo.md). {@code layer} is the
 * library sample that stood in every candidate's light path when the requirement names a fixed layer.
 * {@code sampleGeometry}: how each row's sample was measured ("regular" or "total"), keyed by sample id.
 * {@code revisions}: the revision of each row's sample and of its material the row was judged on, keyed by
 * sample id (docs/undo.md). {@code sampleMeasuredMm}: the thickness each row's sample was measured at, keyed by
 * sample id (absent when not recorded), so a row can say whether its curve is the measured one or rescaled
 * from it (docs/result-rows.md). {@code libraryGeneration}: the library's change counter the answer was computed at
 * (its snapshot holds every change committed up to that number; {@link #UNKNOWN_GENERATION} when not known), so that
 * with each row's revisions a result can be traced and reproduced later (docs/audit.md).
 */
public record Shortlist(Requirement requirement, List<RankedRow> rows, int evaluatedSamples, int judgedExactly,
                        double tookMs, Optional<StackLayer> layer, Map<Long, String> sampleGeometry,
                        Map<Long, Revisions> revisions, Map<Long, Double> sampleMeasuredMm, long libraryGeneration) {

    /** {@link #libraryGeneration()} of an answer not computed from a snapshot of the library. */
    public static final long UNKNOWN_GENERATION = -1;

    /** Which revision of a row's sample and of its material the row was judged on. */
    public record Revisions(int sample, int material) {
    }

    public Shortlist(Requirement requirement, List<RankedRow> rows, int evaluatedSamples, int judgedExactly,
                     double tookMs, Optional<StackLayer> layer, Map<Long, String> sampleGeometry) {
        this(requirement, rows, evaluatedSamples, judgedExactly, tookMs, layer, sampleGeometry, Map.of());
    }

    public Shortlist(Requirement requirement, List<RankedRow> rows, int evaluatedSamples, int judgedExactly,
                     double tookMs, Optional<StackLayer> layer, Map<Long, String> sampleGeometry,
                     Map<Long, Revisions> revisions) {
        this(requirement, rows, evaluatedSamples, judgedExactly, tookMs, layer, sampleGeometry, revisions, Map.of());
    }

    public Shortlist(Requirement requirement, List<RankedRow> rows, int evaluatedSamples, int judgedExactly,
                     double tookMs, Optional<StackLayer> layer, Map<Long, String> sampleGeometry,
                     Map<Long, Revisions> revisions, Map<Long, Double> sampleMeasuredMm) {
        this(requirement, rows, evaluatedSamples, judgedExactly, tookMs, layer, sampleGeometry, revisions,
                sampleMeasuredMm, UNKNOWN_GENERATION);
    }

    public Shortlist {
        rows = List.copyOf(rows);
        Objects.requireNonNull(layer, "layer");
        sampleGeometry = Map.copyOf(sampleGeometry);
        revisions = Map.copyOf(revisions);
        sampleMeasuredMm = Map.copyOf(sampleMeasuredMm);
    }

    /** The revisions a row was judged on, or null when not known. */
    public Revisions revisions(RankedRow row) {
        return revisions.get(row.evaluation().sampleId());
    }

    /** The geometry a row's sample was measured in: "regular", "total", or null when not known. */
    public String geometry(RankedRow row) {
        return sampleGeometry.get(row.evaluation().sampleId());
    }

    /** The thickness a row's sample was measured at, NaN when not recorded. */
    public double measuredMm(RankedRow row) {
        return sampleMeasuredMm.getOrDefault(row.evaluation().sampleId(), Double.NaN);
    }

    /**
     * Whether the row was judged on its sample's curve rescaled from the measured thickness (true) or on the
     * measured curve (false); empty when it cannot be said ({@link org.spectralsieve.requirement.SampleEvaluation#rescaledFrom}).
     */
    public Optional<Boolean> rescaled(RankedRow row) {
        return row.evaluation().rescaledFrom(measuredMm(row));
    }
}
