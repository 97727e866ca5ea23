package org.spectralsieve.requirement;

import java.util.Locale;

/**
 * Where a row stands in the shortlist, best first: the groups every engine, the API, the command line and
 * the page show in this one order (see docs/ranking.md).
 *
 * <ul>
 *   <li>{@link #MEETS}: every clause is proven.</li>
 *   <li>{@link #UNVERIFIED}: nothing fails, and at least one clause was judged on data, but some clause
 *       cannot be shown either way.</li>
 *   <li>{@link #MISSES}: a clause fails on a measured (or rescaled measured) value.</li>
 *   <li>{@link #MISSES_ON_BOUND}: the worst failed clause fails only on a detection-limit bound. Its margin
 *       is an upper bound (the true T lies somewhere under the bound), so it could be far worse than shown:
 *       such rows come after every miss read from a value, ordered by their bound.</li>
 *   <li>{@link #NOT_JUDGED}: no clause could be judged at all — the sample cannot be taken to the asked
 *       thickness, or its data do not reach the asked bands. These rows tell nothing about the requirement,
 *       so they come last and never push a judged row out of a shortlist.</li>
 * </ul>
 */
public enum Standing {
    MEETS, UNVERIFIED, MISSES, MISSES_ON_BOUND, NOT_JUDGED;

    /** The group a reader sees: both kinds of miss are one group ("misses"), the bound shown on the margin. */
    public String group() {
        return switch (this) {
            case MISSES, MISSES_ON_BOUND -> "misses";
            case NOT_JUDGED -> "not-judged";
            default -> name().toLowerCase(Locale.ROOT);
        };
    }

    /** The heading a reader sees over the group's rows, the same on the page and the command line. */
    public static String heading(String group) {
        return switch (group) {
            case "meets" -> "Meets: the data prove every clause";
            case "unverified" -> "Unverified: nothing fails, but the data cannot show every clause";
            case "misses" -> "Misses: the data show a clause failing; a margin marked ≤ rests on a detection limit,"
                    + " so the true miss may be larger (these come after the misses read from values)";
            case "not-judged" -> "Not judged: no clause could be judged at the asked thickness or on the measured range";
            default -> throw new IllegalArgumentException("no group '" + group + "'");
        };
    }

    /** Whether the row's worst margin is only an upper bound on the true margin (a miss shown by a bound). */
    public boolean marginIsBound() {
        return this == MISSES_ON_BOUND;
    }
}
