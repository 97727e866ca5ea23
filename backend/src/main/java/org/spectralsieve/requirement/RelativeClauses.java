package org.spectralsieve.requirement;

import java.util.List;
import java.util.Objects;

/**
 * The exact judgement of a {@link RelativeClause}: at every reading of the band, the ratio of the numerator's T to
 * the reference T, against the clause's fraction, with the rules of {@link ClauseEvaluator} for bounds and range.
 *
 * <ul>
 *   <li>Readings: the numerator curve's points strictly inside the band plus the band ends (as for a transmittance
 *       clause). The reference is the same curve at {@code referenceNm} (one reading, interpolated in absorbance),
 *       or the reference state's curve at the same wavelength.</li>
 *   <li>Detection limits: a numerator at or below its limit (true T ≤ u) makes the ratio an <b>upper</b> bound u/R
 *       ("a ratio whose numerator is a bound is a bound"): it proves "under" when u/R is under the fraction and
 *       disproves "over" when it is below; a reference at or below its limit (true R ≤ v) makes the ratio a
 *       <b>lower</b> bound T/v: it disproves "under" when T/v is over the fraction and proves "over" when it reaches
 *       it. With both bounded, or a reference of 0, the ratio is not known: unverified.</li>
 *   <li>The worst reading decides, as for every-point transmittance clauses: misses if any reading misses, else
 *       unverified if any is, else meets; the margin in decades is that reading's, log10(fraction / ratio) for
 *       "under", log10(ratio / fraction) for "over" (from the bound where the ratio is one).</li>
 *   <li>Range: the reference wavelength outside the reference curve's range, or a band not covered by both curves,
 *       is unverified (margin NaN) unless the covered readings already prove a miss.</li>
 * </ul>
 */
final class RelativeClauses {

    private RelativeClauses() {
    }

    /** The clause on one curve: its own value at the reference wavelength. */
    static ClauseResult evaluate(RelativeClause clause, CurveView curve) {
        if (!clause.ownWavelength()) {
            throw new IllegalArgumentException("'" + clause.text() + "' compares two states: give both curves");
        }
        return evaluate(clause, curve, curve);
    }

    /**
     * @param numerator the curve of {@code clause.state()}
     * @param reference the curve of {@code clause.referenceState()} (the same view for the own-wavelength form)
     */
    static ClauseResult evaluate(RelativeClause clause, CurveView numerator, CurveView reference) {
        Objects.requireNonNull(clause, "clause");
        if (clause.ownWavelength() && !reference.covers(clause.referenceNm())) {
            return ClauseResult.unjudgeable(clause, clause.fraction(), "the reference wavelength "
                    + Wording.nm(clause.referenceNm()) + " lies outside the measured range " + reference.rangeText());
        }
        Band band = clause.band();
        List<Reading> readings = numerator.readings(band);
        Ratio worst = null;
        Verdict verdict = Verdict.MEETS;
        int read = 0;
        for (Reading r : readings) {
            double refNm = clause.ownWavelength() ? clause.referenceNm() : r.nm();
            if (!reference.covers(refNm)) {
                continue;
            }
            Ratio ratio = Ratio.of(r, reference.at(refNm), clause);
            read++;
            verdict = Margins.combine(verdict, ratio.verdict);
            if (worst == null || ratio.verdict.ordinal() > worst.verdict.ordinal()
                    || ratio.verdict == worst.verdict && ratio.margin < worst.margin) {
                worst = ratio;
            }
        }
        boolean covered = numerator.covers(band) && (clause.ownWavelength() || reference.covers(band));
        if (read == 0 || !covered && verdict != Verdict.MISSES) {
            String range = clause.ownWavelength() ? numerator.rangeText()
                    : numerator.rangeText() + " and " + reference.rangeText();
            return ClauseResult.unjudgeable(clause, clause.fraction(), (band.isPoint() ? Wording.band(band)
                    : "band " + Wording.band(band)) + " lies " + (read > 0 ? "partly " : "")
                    + "outside the measured range " + range);
        }
        String text = worst.explain(clause, band);
        if (!covered) {
            text += "; the band reaches outside the measured range";
        }
        return new ClauseResult(clause, worst.ratio, clause.fraction(), worst.margin, verdict, text,
                worst.upperBound);
    }

    /** One reading's ratio, what is known of it, and its verdict and margin. */
    private record Ratio(double nm, double ratio, boolean upperBound, boolean lowerBound, double numeratorT,
                         boolean numeratorBounded, double referenceT, boolean referenceBounded, Verdict verdict,
                         double margin) {

        static Ratio of(Reading numerator, Reading reference, RelativeClause clause) {
            double t = numerator.judged();
            double ref = reference.judged();
            boolean upper = numerator.bounded() && !reference.bounded();
            boolean lower = reference.bounded() && !numerator.bounded();
            boolean unknown = numerator.bounded() && reference.bounded() || !(ref > 0);
            double ratio = unknown ? Double.NaN : t / ref;
            Verdict verdict;
            if (unknown) {
                verdict = Verdict.UNVERIFIED;
            } else if (upper) {
                verdict = Margins.verdict(clause.direction(), new Reading(numerator.nm(), ratio, true, ratio),
                        clause.fraction());
            } else if (lower) {
                // the true ratio is at least this: a mirror of the upper-bound rule
                verdict = clause.direction() == Direction.BLOCK
                        ? ratio > clause.fraction() ? Verdict.MISSES : Verdict.UNVERIFIED
                        : ratio >= clause.fraction() ? Verdict.MEETS : Verdict.UNVERIFIED;
            } else {
                verdict = Margins.holds(clause.direction(), ratio, clause.fraction()) ? Verdict.MEETS : Verdict.MISSES;
            }
            double margin = unknown ? Double.NaN : Margins.of(clause.direction(), ratio, clause.fraction());
            if (verdict == Verdict.MEETS && margin < 0) {
                margin = 0; // a ratio exactly at the fraction, floored by Margins: met at the threshold
            }
            return new Ratio(numerator.nm(), ratio, upper, lower, t, numerator.bounded(), ref, reference.bounded(),
                    verdict, margin);
        }

        String explain(RelativeClause clause, Band band) {
            String of = clause.ownWavelength() ? "T(" + Wording.nm(nm) + ") / T(" + Wording.nm(clause.referenceNm()) + ")"
                    : clause.state().words() + " / " + clause.referenceState().words() + " at " + Wording.nm(nm);
            String where = band.isPoint() ? "" : (clause.direction() == Direction.BLOCK ? "highest" : "lowest")
                    + " ratio in " + Wording.band(band) + ": ";
            String need = "needs " + (clause.direction() == Direction.BLOCK ? "under " : "over ")
                    + Wording.percent(clause.fraction());
            String parts = part(numeratorT, numeratorBounded) + " against " + part(referenceT, referenceBounded);
            if (Double.isNaN(ratio)) {
                return where + of + " cannot be known (" + parts + "), " + need;
            }
            String is = upperBound ? " is at most " : lowerBound ? " is at least " : " is ";
            return where + of + is + Wording.percent(ratio) + " (" + parts + "), " + need;
        }

        private static String part(double t, boolean bounded) {
            return bounded ? "below the detection limit of " + Wording.transmittance(t) : Wording.transmittance(t);
        }
    }
}
