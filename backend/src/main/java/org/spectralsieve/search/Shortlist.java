package org.spectralsieve.search;

import java.util.List;
import java.util.Objects;
import java.util.Optional;
import org.spectralsieve.requirement.RankedRow;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.StackLayer;

/**
 * The ranked, explained answer to one requirement. {@code evaluatedSamples}: the samples the requirement
 * was evaluated on (after the class and geometry filters); {@code judgedExactly}: how many of them the
 * exact evaluator judged on their stored curves (the store ruled out the rest). {@code layer} is the
 * library sample that stood in every candidate's light path when the requirement names a fixed layer.
 */
public record Shortlist(Requirement requirement, List<RankedRow> rows, int evaluatedSamples, int judgedExactly,
                        double tookMs, Optional<StackLayer> layer) {

    public Shortlist {
        rows = List.copyOf(rows);
        Objects.requireNonNull(layer, "layer");
    }
}
