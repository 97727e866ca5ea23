package org.spectralsieve.requirement;

import java.util.Comparator;
import java.util.function.Function;
import java.util.function.ToDoubleFunction;
import java.util.function.ToLongFunction;

/**
 * The one order of results, kept here so every engine ranks alike: MEETS, then UNVERIFIED, then MISSES;
 * within each, worst margin descending (the least-missing miss first), NaN margins last; ties by material
 * name (case-insensitive, then exact, so the order is total) and then sample id ascending. −0.0 and 0.0
 * count as equal.
 */
public final class RankingOrder {

    private static final Comparator<String> NAMES =
            String.CASE_INSENSITIVE_ORDER.thenComparing(Comparator.naturalOrder());

    /** The order on material evaluations (used by {@link Ranking}). */
    public static final Comparator<MaterialEvaluation> MATERIAL_EVALUATIONS = of(
            m -> m.evaluation().verdict(), m -> m.evaluation().worstMarginDecades(),
            MaterialEvaluation::materialName, m -> m.evaluation().sampleId());

    private RankingOrder() {
    }

    /** The same order on any row type, for engines with their own result rows. */
    public static <T> Comparator<T> of(Function<T, Verdict> verdict, ToDoubleFunction<T> worstMargin,
                                       Function<T, String> materialName, ToLongFunction<T> sampleId) {
        return (a, b) -> compare(verdict.apply(a), worstMargin.applyAsDouble(a), materialName.apply(a),
                sampleId.applyAsLong(a), verdict.apply(b), worstMargin.applyAsDouble(b), materialName.apply(b),
                sampleId.applyAsLong(b));
    }

    public static int compare(Verdict verdictA, double marginA, String nameA, long sampleA,
                              Verdict verdictB, double marginB, String nameB, long sampleB) {
        int byVerdict = Integer.compare(rank(verdictA), rank(verdictB));
        if (byVerdict != 0) {
            return byVerdict;
        }
        int byMargin = marginDescendingNaNLast(marginA, marginB);
        if (byMargin != 0) {
            return byMargin;
        }
        int byName = NAMES.compare(nameA, nameB);
        return byName != 0 ? byName : Long.compare(sampleA, sampleB);
    }

    private static int rank(Verdict verdict) {
        return switch (verdict) {
            case MEETS -> 0;
            case UNVERIFIED -> 1;
            case MISSES -> 2;
        };
    }

    private static int marginDescendingNaNLast(double a, double b) {
        boolean nanA = Double.isNaN(a);
        boolean nanB = Double.isNaN(b);
        if (nanA || nanB) {
            return Boolean.compare(nanA, nanB);
        }
        return a > b ? -1 : a < b ? 1 : 0;
    }
}
