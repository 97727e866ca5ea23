package org.spectralsieve.requirement;

import java.util.Objects;

/**
 * "passes over 80% at 365 nm", "blocks under 0.1% from 250 to 320 nm", "OD 3 or more at 405 nm",
 * "mean over 85% from 360 to 370 nm". The threshold is always held as a transmittance fraction; an OD
 * threshold d is the block threshold 10^-d.
 */
public record TransmittanceClause(Direction direction, Aggregate aggregate, Band band, double thresholdT,
                                  ThresholdUnit unit, String text) implements Clause {

    public TransmittanceClause {
        Objects.requireNonNull(direction, "direction");
        Objects.requireNonNull(aggregate, "aggregate");
        Objects.requireNonNull(band, "band");
        Objects.requireNonNull(unit, "unit");
        if (!(thresholdT > 0 && thresholdT <= 1)) {
            throw new IllegalArgumentException("threshold must be a transmittance above 0 and at most 100 %, got " + thresholdT);
        }
        if (aggregate == Aggregate.MEAN && band.isPoint()) {
            throw new IllegalArgumentException("a mean needs a band with two different wavelengths");
        }
        text = Objects.requireNonNullElse(text, "");
    }
}
