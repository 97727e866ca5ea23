package org.spectralsieve.requirement;

import java.util.Comparator;
import java.util.OptionalDouble;
import java.util.function.Function;
import java.util.function.ToDoubleFunction;
import java.util.function.ToLongFunction;

/**
 * The one order of results, kept here so every engine ranks alike (docs/ranking.md):
 * <ol>
 *   <li>by {@link Standing}: meets, unverified (judged on some data), misses read from a value, misses
 *       shown only by a detection-limit bound, and last the rows where no clause could be judged;</li>
 *   <li>within a group, worst margin descending (the least-missing miss first; a bounded miss by its bound),
 *       NaN margins last;</li>
 *   <li>equal margins by confidence descending: the row whose binding clause is more likely to hold
 *       ({@link SampleEvaluation#confidence()}) first, rows whose confidence is unknown after those with one;</li>
 *   <li>ties by material name (case-insensitive, then exact, so the order is total) and then sample id
 *       ascending. −0.0 and 0.0 count as equal.</li>
 * </ol>
 * Why bounded misses go after every valued miss: a bound says only that T lies somewhere under it, and a
 * rescaled detection limit can sit decades above the real value, so ranking by the bound would make a
 * sample that passes almost nothing look nearly good enough.
 */
public final class RankingOrder {

    private static final Comparator<String> NAMES =
            String.CASE_INSENSITIVE_ORDER.thenComparing(Comparator.naturalOrder());

    /** The order on material evaluations (used by {@link Ranking}). */
    public static final Comparator<MaterialEvaluation> MATERIAL_EVALUATIONS = (a, b) -> compare(
            a.evaluation().standing(), a.evaluation().worstMarginDecades(), a.evaluation().confidence(),
            a.materialName(), a.evaluation().sampleId(),
            b.evaluation().standing(), b.evaluation().worstMarginDecades(), b.evaluation().confidence(),
            b.materialName(), b.evaluation().sampleId());

    private RankingOrder() {
    }

    /** The same order on any row type, for engines with their own result rows. */
    public static <T> Comparator<T> of(Function<T, Standing> standing, ToDoubleFunction<T> worstMargin,
                                       Function<T, String> materialName, ToLongFunction<T> sampleId) {
        return (a, b) -> compare(standing.apply(a), worstMargin.applyAsDouble(a), materialName.apply(a),
                sampleId.applyAsLong(a), standing.apply(b), worstMargin.applyAsDouble(b), materialName.apply(b),
                sampleId.applyAsLong(b));
    }

    /** The order for rows without a confidence (both unknown, so that step never decides). */
    public static int compare(Standing standingA, double marginA, String nameA, long sampleA,
                              Standing standingB, double marginB, String nameB, long sampleB) {
        return compare(standingA, marginA, OptionalDouble.empty(), nameA, sampleA,
                standingB, marginB, OptionalDouble.empty(), nameB, sampleB);
    }

    public static int compare(Standing standingA, double marginA, OptionalDouble confidenceA, String nameA, long sampleA,
                              Standing standingB, double marginB, OptionalDouble confidenceB, String nameB, long sampleB) {
        int byStanding = standingA.compareTo(standingB);
        if (byStanding != 0) {
            return byStanding;
        }
        int byMargin = marginDescendingNaNLast(marginA, marginB);
        if (byMargin != 0) {
            return byMargin;
        }
        int byConfidence = confidenceDescendingUnknownLast(confidenceA, confidenceB);
        if (byConfidence != 0) {
            return byConfidence;
        }
        int byName = NAMES.compare(nameA, nameB);
        return byName != 0 ? byName : Long.compare(sampleA, sampleB);
    }

    /** A known confidence is more certain than an unknown one; two known ones, the higher first. */
    private static int confidenceDescendingUnknownLast(OptionalDouble a, OptionalDouble b) {
        if (a.isEmpty() || b.isEmpty()) {
            return Boolean.compare(a.isEmpty(), b.isEmpty());
        }
        return Double.compare(b.getAsDouble(), a.getAsDouble());
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
