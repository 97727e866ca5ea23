package org.spectralsieve.requirement;

import java.util.Objects;

/** A sample's evaluation with the material it belongs to: the input of {@link Ranking}. */
public record MaterialEvaluation(long materialId, String materialName, SampleEvaluation evaluation) {

    public MaterialEvaluation {
        Objects.requireNonNull(materialName, "materialName");
        Objects.requireNonNull(evaluation, "evaluation");
    }

    public static MaterialEvaluation of(Candidate candidate, SampleEvaluation evaluation) {
        return new MaterialEvaluation(candidate.materialId(), candidate.materialName(), evaluation);
    }
}
