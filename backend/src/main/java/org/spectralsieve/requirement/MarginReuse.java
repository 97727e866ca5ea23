package org.spectralsieve.requirement;

import org.spectralsieve.weighting.WeightedFigures;

/**
 * The switch for reading a path condition's margin once per thickness in a solve ({@link RecentMargins}), for
 * checking a weighted clause's figure exists without writing its note, and for keeping the texts of the shares a
 * figure leaves out ({@link org.spectralsieve.weighting.WeightedFigures#keepPercentTexts}): on by default;
 * {@code -Dsieve.solve.reuse-margins=false} (read once) or {@link #use} turns all three off, so a benchmark can
 * time the rule before them side by side. Either way the answers are the same, bit for bit
 * ({@code MarginReuseEquivalenceTest}).
 */
public final class MarginReuse {

    private static volatile boolean on = !"false".equals(System.getProperty("sieve.solve.reuse-margins"));

    private MarginReuse() {
    }

    /** For benchmarks and tests: false computes every margin asked and writes every share anew, as before. */
    public static void use(boolean reuse) {
        on = reuse;
        WeightedFigures.keepPercentTexts(reuse);
    }

    public static boolean enabled() {
        return on;
    }
}
