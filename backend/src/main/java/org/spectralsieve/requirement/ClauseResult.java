package org.spectralsieve.requirement;

import java.util.Objects;
import java.util.OptionalDouble;

/**
 * The judgement of one clause on one curve.
 *
 * <p>{@code value}: for a transmittance clause the T that decided (the point value, the band minimum for a
 * pass or maximum for a block, or the band mean); for a cutoff clause the cutoff wavelength in nm. NaN
 * when nothing could be read. {@code threshold}: the T threshold, or the cutoff level.
 * {@code marginDecades}: positive when met, see {@link ClauseEvaluator} for what it means when the value
 * is a bound. {@code valueIsBound}: the value is an upper bound on T taken from a detection limit, not a
 * reading. {@code confidence}: the probability, from 0 to 1, that the true value meets the threshold under
 * the error model of {@link ClauseConfidence}; empty when it cannot be said (no uncertainty known, a bound,
 * a cutoff or figure clause, a clause not judged).
 */
public record ClauseResult(Clause clause, double value, double threshold, double marginDecades, Verdict verdict,
                           String explanation, boolean valueIsBound, OptionalDouble confidence) {

    public ClauseResult {
        Objects.requireNonNull(clause, "clause");
        Objects.requireNonNull(verdict, "verdict");
        Objects.requireNonNull(explanation, "explanation");
        if (verdict == Verdict.MEETS && !(marginDecades >= 0)) {
            throw new IllegalArgumentException("a met clause has a margin >= 0, got " + marginDecades
                    + " for '" + clause.text() + "'");
        }
        Objects.requireNonNull(confidence, "confidence");
        if (confidence.isPresent() && !(confidence.getAsDouble() >= 0 && confidence.getAsDouble() <= 1)) {
            throw new IllegalArgumentException("a confidence is a probability from 0 to 1, got " + confidence.getAsDouble());
        }
    }

    /** A result whose confidence is not known. */
    public ClauseResult(Clause clause, double value, double threshold, double marginDecades, Verdict verdict,
                        String explanation, boolean valueIsBound) {
        this(clause, value, threshold, marginDecades, verdict, explanation, valueIsBound, OptionalDouble.empty());
    }

    public ClauseResult(Clause clause, double value, double threshold, double marginDecades, Verdict verdict,
                        String explanation) {
        this(clause, value, threshold, marginDecades, verdict, explanation, false);
    }

    /**
     * The confidence as shown beside the verdict: "97.3 % confidence it holds" (rounded down, never surer
     * than computed), or "confidence unknown".
     */
    public String confidenceText() {
        return confidence.isPresent() ? Wording.confidence(confidence.getAsDouble()) + " confidence it holds"
                : "confidence unknown";
    }

    /** Whether the data said nothing on this clause: no reading, no margin (see {@link #unjudgeable}). */
    public boolean unjudged() {
        return verdict == Verdict.UNVERIFIED && Double.isNaN(value) && Double.isNaN(marginDecades);
    }

    /** A clause the data cannot judge at all (no reading): value and margin NaN. */
    static ClauseResult unjudgeable(Clause clause, double threshold, String explanation) {
        return new ClauseResult(clause, Double.NaN, threshold, Double.NaN, Verdict.UNVERIFIED, explanation, false);
    }
}
