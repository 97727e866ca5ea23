package org.spectralsieve.requirement;

import java.util.Objects;
import java.util.OptionalDouble;

/**
 * "passes over 80% at 365 nm", "blocks under 0.1% from 250 to 320 nm", "OD 3 or more at 405 nm",
 * "mean over 85% from 360 to 370 nm". The threshold is always held as a transmittance fraction; an OD
 * threshold d is the block threshold 10^-d.
 *
 * <p>{@code confidenceDemand}: "… with 95% confidence" as a fraction (0.95); the clause then meets only when
 * its {@link ClauseConfidence confidence} reaches it. Empty when not asked. Allowed from
 * {@link #MIN_CONFIDENCE} to {@link #MAX_CONFIDENCE}: under 50 % a value that misses the threshold could
 * still satisfy the demand (its confidence lies just under 50 %), so "meets" would contradict the reading;
 * above 99.9 % (3.1 standard deviations) the answer rests on the far tail of the Gaussian model, where
 * a real instrument's errors and an estimated standard deviation are not known to follow it.
 */
public record TransmittanceClause(Direction direction, Aggregate aggregate, Band band, double thresholdT,
                                  ThresholdUnit unit, String text, OptionalDouble confidenceDemand) implements Clause {

    /** The least confidence a clause may ask for (50 %). */
    public static final double MIN_CONFIDENCE = 0.5;
    /** The most confidence a clause may ask for (99.9 %). */
    public static final double MAX_CONFIDENCE = 0.999;

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
        Objects.requireNonNull(confidenceDemand, "confidenceDemand");
        if (confidenceDemand.isPresent() && !allowedDemand(confidenceDemand.getAsDouble())) {
            throw new IllegalArgumentException("a confidence demand lies from 50 % to 99.9 %, got "
                    + confidenceDemand.getAsDouble());
        }
    }

    /** A clause without a confidence demand. */
    public TransmittanceClause(Direction direction, Aggregate aggregate, Band band, double thresholdT,
                               ThresholdUnit unit, String text) {
        this(direction, aggregate, band, thresholdT, unit, text, OptionalDouble.empty());
    }

    /** Whether a fraction may be asked as a confidence (see the class comment for the range). */
    public static boolean allowedDemand(double fraction) {
        return fraction >= MIN_CONFIDENCE && fraction <= MAX_CONFIDENCE;
    }

    /** The same clause asking for a confidence, with the text that says so. */
    public TransmittanceClause withConfidenceDemand(double fraction, String text) {
        return new TransmittanceClause(direction, aggregate, band, thresholdT, unit, text, OptionalDouble.of(fraction));
    }
}
