package org.spectralsieve.requirement;

import java.util.List;
import java.util.Objects;
import java.util.OptionalDouble;

/**
 * The judgement of one sample against a whole requirement.
 *
 * <p>{@code thicknessMm}: the thickness the clauses were judged at (the measured one, the asked one, or the
 * recommended one in a range; NaN when not recorded). {@code feasibleMm}: for thickness as a design
 * variable, the thicknesses within the asked range at which every clause is proven to hold; null when
 * thickness is not a variable or no thickness works. {@code verdict}: MEETS only if every clause meets,
 * MISSES if any misses, otherwise UNVERIFIED. {@code worstMarginDecades}: the smallest clause margin
 * ignoring NaN (NaN when all are NaN) — for a miss, the smallest margin among the clauses that fail, since
 * a miss is bound by the clause it fails, not by one it cannot verify; {@code bindingClauseIndex}: the
 * index of that clause, −1 when none. {@link #standing()} places the row in the shortlist's groups.
 * {@code stockAdvice}: the stock sizes to buy when thickness was a design variable ({@link StockAdvice#NONE}
 * otherwise).
 */
public record SampleEvaluation(long sampleId, double thicknessMm, ThicknessInterval feasibleMm, Verdict verdict,
                               double worstMarginDecades, int bindingClauseIndex, List<ClauseResult> clauses,
                               StockAdvice stockAdvice) {

    public SampleEvaluation(long sampleId, double thicknessMm, ThicknessInterval feasibleMm, Verdict verdict,
                            double worstMarginDecades, int bindingClauseIndex, List<ClauseResult> clauses) {
        this(sampleId, thicknessMm, feasibleMm, verdict, worstMarginDecades, bindingClauseIndex, clauses, StockAdvice.NONE);
    }

    public SampleEvaluation {
        Objects.requireNonNull(verdict, "verdict");
        Objects.requireNonNull(stockAdvice, "stockAdvice");
        clauses = List.copyOf(clauses);
        if (bindingClauseIndex < -1 || bindingClauseIndex >= clauses.size()) {
            throw new IllegalArgumentException("bindingClauseIndex " + bindingClauseIndex + " is not a clause index (0.."
                    + (clauses.size() - 1) + ") or -1");
        }
    }

    /** Verdict, worst margin and binding clause derived from the clause results. */
    public static SampleEvaluation of(long sampleId, double thicknessMm, ThicknessInterval feasibleMm,
                                      List<ClauseResult> clauses) {
        if (clauses.isEmpty()) {
            throw new IllegalArgumentException("sample " + sampleId + " was judged against no clause");
        }
        Verdict verdict = Verdict.MEETS;
        for (ClauseResult r : clauses) {
            verdict = Margins.combine(verdict, r.verdict());
        }
        double worst = Double.NaN;
        int binding = -1;
        for (int i = 0; i < clauses.size(); i++) {
            ClauseResult r = clauses.get(i);
            double m = r.marginDecades();
            boolean counts = verdict != Verdict.MISSES || r.verdict() == Verdict.MISSES;
            if (counts && !Double.isNaN(m) && (binding < 0 || m < worst)) {
                worst = m;
                binding = i;
            }
        }
        return new SampleEvaluation(sampleId, thicknessMm, feasibleMm, verdict, worst, binding, clauses);
    }

    /** The same judgement with the material's whole feasible interval and stock advice. */
    public SampleEvaluation withThicknessAdvice(ThicknessInterval feasible, StockAdvice advice) {
        return new SampleEvaluation(sampleId, thicknessMm, feasible, verdict, worstMarginDecades, bindingClauseIndex,
                clauses, advice);
    }

    /**
     * Whether the clauses were judged on a curve rescaled from a sample measured at {@code measuredMm} (true),
     * or on the measured curve itself (false); empty when that cannot be said: the thickness of either is not
     * recorded, or no clause was judged at all ({@link Standing#NOT_JUDGED}: then no curve stands behind the
     * row). A sample measured at the asked thickness ({@link NominalThickness}) is judged at its own measured
     * thickness, so "the same thickness" here is the evaluator's numerical one ({@link SampleEvaluator#SAME_THICKNESS_MM}).
     */
    public java.util.Optional<Boolean> rescaledFrom(double measuredMm) {
        if (!Double.isFinite(measuredMm) || !Double.isFinite(thicknessMm) || standing() == Standing.NOT_JUDGED) {
            return java.util.Optional.empty();
        }
        return java.util.Optional.of(Math.abs(thicknessMm - measuredMm) > SampleEvaluator.SAME_THICKNESS_MM);
    }

    /**
     * How sure the row's standing is, for ranking rows of equal margin: the confidence of the binding clause
     * (the one whose margin is the row's), empty when there is none or it is unknown ({@link ClauseResult#confidence}).
     */
    public OptionalDouble confidence() {
        return bindingClauseIndex < 0 ? OptionalDouble.empty() : clauses.get(bindingClauseIndex).confidence();
    }

    /**
     * The row's group in the shortlist ({@link Standing}): no clause judged at all comes last; a miss whose
     * binding (worst failed) clause rests on a detection-limit bound comes after every miss read from a value.
     */
    public Standing standing() {
        if (clauses.stream().allMatch(ClauseResult::unjudged)) {
            return Standing.NOT_JUDGED;
        }
        return switch (verdict) {
            case MEETS -> Standing.MEETS;
            case UNVERIFIED -> Standing.UNVERIFIED;
            case MISSES -> bindingClauseIndex >= 0 && clauses.get(bindingClauseIndex).valueIsBound()
                    ? Standing.MISSES_ON_BOUND : Standing.MISSES;
        };
    }
}
