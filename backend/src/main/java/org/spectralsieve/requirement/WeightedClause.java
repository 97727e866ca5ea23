package org.spectralsieve.requirement;

import java.util.Objects;

/**
 * A weighted transmittance against a threshold: "passes over 85% of led 365", "passes over 60% of led 395
 * weighted by my-initiator", "erythemal under 1%", "uv hazard under 0.1%", "luminous over 40%". The figure
 * is the effective transmittance of {@link Weighting}; the threshold is a transmittance fraction as in
 * {@link TransmittanceClause} (an OD threshold d is the block threshold 10^-d).
 */
public record WeightedClause(Direction direction, double thresholdT, ThresholdUnit unit, Weighting weighting,
                             String text) implements Clause {

    public WeightedClause {
        Objects.requireNonNull(direction, "direction");
        Objects.requireNonNull(unit, "unit");
        Objects.requireNonNull(weighting, "weighting");
        if (!(thresholdT > 0 && thresholdT <= 1)) {
            throw new IllegalArgumentException("threshold must be a transmittance above 0 and at most 100 %, got " + thresholdT);
        }
        text = Objects.requireNonNullElse(text, "");
    }
}
