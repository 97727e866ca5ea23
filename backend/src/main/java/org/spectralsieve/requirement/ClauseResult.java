package org.spectralsieve.requirement;

import java.util.Objects;

/**
 * The judgement of one clause on one curve.
 *
 * <p>{@code value}: for a transmittance clause the T that decided (the point value, the band minimum for a
 * pass or maximum for a block, or the band mean); for a cutoff clause the cutoff wavelength in nm. NaN
 * when nothing could be read. {@code threshold}: the T threshold, or the cutoff level.
 * {@code marginDecades}: positive when met, see {@link ClauseEvaluator} for what it means when the value
 * is a bound. {@code valueIsBound}: the value is an upper bound on T taken from a detection limit, not a
 * reading.
 */
public record ClauseResult(Clause clause, double value, double threshold, double marginDecades, Verdict verdict,
                           String explanation, boolean valueIsBound) {

    public ClauseResult {
        Objects.requireNonNull(clause, "clause");
        Objects.requireNonNull(verdict, "verdict");
        Objects.requireNonNull(explanation, "explanation");
        if (verdict == Verdict.MEETS && !(marginDecades >= 0)) {
            throw new IllegalArgumentException("a met clause has a margin >= 0, got " + marginDecades
                    + " for '" + clause.text() + "'");
        }
    }

    public ClauseResult(Clause clause, double value, double threshold, double marginDecades, Verdict verdict,
                        String explanation) {
        this(clause, value, threshold, marginDecades, verdict, explanation, false);
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
