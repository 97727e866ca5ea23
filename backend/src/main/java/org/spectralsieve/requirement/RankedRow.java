package org.spectralsieve.requirement;

import java.util.Objects;

/** One material in a ranking: its 1-based position and its best sample's evaluation. */
public record RankedRow(int position, long materialId, String materialName, SampleEvaluation evaluation) {

    public RankedRow {
        if (position < 1) {
            throw new IllegalArgumentException("position counts from 1, got " + position);
        }
        Objects.requireNonNull(materialName, "materialName");
        Objects.requireNonNull(evaluation, "evaluation");
    }
}
