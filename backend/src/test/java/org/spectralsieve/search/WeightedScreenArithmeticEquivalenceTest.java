package org.spectralsieve.search;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Random;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.requirement.WeightedClause;
import org.spectralsieve.store.SpectralStore;
import org.spectralsieve.store.WeightedScreen;

/**
 * The screen's faster arithmetic (powers of bin values from per-curve tables, the surfaces formed once per
 * index and range, both halves of a large store at once) proves exactly the misses the arithmetic before it
 * proved (one {@code Math.exp} per bin, a boxed reflectance cache, one thread), with bounds never tighter and
 * at most 1e-9 decades looser: so every proof it makes, the earlier arithmetic made too, whose soundness
 * against the exact figures {@code store.WeightedScreenTest} checks, and the search's answers stay those of
 * the exact judgement ({@code WeightedScreenSearchPropertyTest}, {@code SearchEqualsExactJudgementPropertyTest}).
 * Synthetic curves of {@link StoreWeightedBenchmark#screenedStore} (thicknesses 0.5–10 mm, three indices);
 * random requirements in the trade's wordings (common practice, no source), fixed seeds. The bins' arithmetic
 * alone: the store's figure codes (a bound of their own, checked by {@code FigureCodesTest} and
 * {@code FigureCodesSearchPropertyTest}) are switched off here.
 */
class WeightedScreenArithmeticEquivalenceTest {

    @org.junit.jupiter.api.BeforeEach
    void binsAlone() {
        System.setProperty("sieve.store.figure-codes", "false");
    }

    @org.junit.jupiter.api.AfterEach
    void codesAgain() {
        System.clearProperty("sieve.store.figure-codes");
    }

    private static SpectralStore store;

    @BeforeAll
    static void syntheticStore() {
        store = StoreWeightedBenchmark.screenedStore(1500, 20261204L);
    }

    @Test
    void everyCurvesThinnedAndThickenedBoundsMatchTheArithmeticBefore() {
        Random random = new Random(20261214L);
        int finite = 0;
        int negative = 0;
        for (int trial = 0; trial < 12; trial++) {
            Requirement requirement = RequirementParser.parse(randomClause(random));
            WeightedClause clause = (WeightedClause) requirement.clauses().get(0);
            WeightedScreen.Query fast = store.weightedScreen().query(store, clause, Optional.empty());
            WeightedScreen.Query before = store.weightedScreen().query(store, clause, Optional.empty()).withReferenceArithmetic();
            double mm = 0.3 + 11 * random.nextDouble();
            for (int curve = 0; curve < store.size(); curve++) {
                double now = fast.passes() ? fast.thinned(curve, mm) : fast.thickened(curve, mm);
                double then = before.passes() ? before.thinned(curve, mm) : before.thickened(curve, mm);
                String where = String.format(Locale.ROOT, "%s at %.3f mm, curve %d", clause, mm, curve);
                if (Double.isInfinite(then)) {
                    assertThat(now).as(where).isEqualTo(then);
                    continue;
                }
                assertThat(now).as(where).isGreaterThanOrEqualTo(then).isLessThanOrEqualTo(then + 1e-9);
                finite++;
                negative += then < 0 ? 1 : 0;
            }
        }
        assertThat(finite).as("not vacuous").isGreaterThan(2000);
        assertThat(negative).as("not vacuous").isGreaterThan(200);
    }

    @Test
    void theScreenInPartsProvesTheMissesOfTheArithmeticBeforeOnOneThread() {
        Random random = new Random(20261215L);
        int proven = 0;
        for (int trial = 0; trial < 20; trial++) {
            List<String> clauses = new ArrayList<>();
            for (int i = 0, n = 1 + random.nextInt(3); i < n; i++) {
                clauses.add(randomClause(random));
            }
            String text = String.join(" and ", clauses) + switch (random.nextInt(4)) {
                case 1 -> ", at " + new String[] {"2", "3", "4", "6"}[random.nextInt(4)] + " mm";
                case 2, 3 -> ", thickness " + new String[] {"1 to 6", "0.5 to 3", "2 to 10"}[random.nextInt(3)] + " mm";
                default -> "";
            };
            Requirement requirement = RequirementParser.parse(text);
            Map<Long, Double> before = new HashMap<>();
            WeightedMisses.add(before, store, requirement, Optional.empty(), false, true);
            Map<Long, Double> inParts = new HashMap<>();
            // parts from the first curve on, so this small store is screened in parts as a large one is
            WeightedMisses.add(inParts, store, requirement, Optional.empty(), false, false, 1);
            assertThat(inParts.keySet()).as(text).isEqualTo(before.keySet());
            for (Map.Entry<Long, Double> e : before.entrySet()) {
                assertThat(inParts.get(e.getKey())).as(text + " sample " + e.getKey())
                        .isGreaterThanOrEqualTo(e.getValue()).isLessThanOrEqualTo(e.getValue() + 1e-9);
            }
            proven += before.size();
        }
        assertThat(proven).as("not vacuous").isGreaterThan(1000);
    }

    private static String randomClause(Random random) {
        String led = "led " + new String[] {"365", "385", "395", "405"}[random.nextInt(4)];
        return switch (random.nextInt(7)) {
            case 0, 1 -> "passes over " + percent(50 + 45 * random.nextDouble()) + " of " + led;
            case 2 -> "blocks under " + percent(Math.pow(10, 1 - 3 * random.nextDouble())) + " of " + led;
            case 3 -> "erythemal under " + percent(Math.pow(10, 1 - 3 * random.nextDouble()));
            case 4 -> "uv hazard under " + percent(Math.pow(10, 1 - 3 * random.nextDouble()));
            case 5 -> "luminous over " + percent(20 + 70 * random.nextDouble());
            default -> "passes over " + percent(40 + 50 * random.nextDouble()) + " of led 395 weighted by blue-light";
        };
    }

    private static String percent(double p) {
        return String.format(Locale.ROOT, "%.2f%%", p);
    }
}
