package org.spectralsieve.search;

import java.util.Locale;
import java.util.Random;

/**
 * The random weighted clauses the search property tests start their requirements with, drawn in one fixed order so
 * that each test's seeded cases stay what they were when it drew them itself: a pass of an LED (365, 385 or 405 nm)
 * over 55–90 %, in two of three draws a UV-hazard limit of 0.03–3 %, in half of them a luminous pass over 30–80 %. The
 * wordings are the trade's (common practice, no source); each test appends its own further clauses, thickness,
 * layer, class or geometry.
 */
final class RandomWeightedClauses {

    private RandomWeightedClauses() {
    }

    /** "passes over 71.20% of led 385 and uv hazard under 0.41% and luminous over 55.03%", or a shorter part of it. */
    static String ledPassHazardLuminous(Random random) {
        String clauses = "passes over " + percent(55 + 35 * random.nextDouble()) + " of led "
                + new String[] {"365", "385", "405"}[random.nextInt(3)];
        if (random.nextInt(3) > 0) {
            clauses += " and uv hazard under " + percent(Math.pow(10, 0.5 - 2 * random.nextDouble()));
        }
        if (random.nextBoolean()) {
            clauses += " and luminous over " + percent(30 + 50 * random.nextDouble());
        }
        return clauses;
    }

    /** A percentage as the requirement language reads it, two decimals, whatever the machine's locale. */
    static String percent(double p) {
        return String.format(Locale.ROOT, "%.2f%%", p);
    }
}
