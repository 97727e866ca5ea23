package org.spectralsieve.store;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Random;
import org.junit.jupiter.api.Test;
import org.spectralsieve.requirement.Standing;

/**
 * The keys behind the store's hand-over cut (docs/store.md, "The store's error at the cut"): a store result
 * whose margin raised by the model error reaches the limit-th result's margin lowered by it is handed over, and
 * no other of its group. Random keys from a fixed seed; margins in the ranges the demo searches give.
 */
class HandOverCutTest {

    private static final double ERROR = 0.0017; // ρ at n = 1.65 plus code rounding (docs/store.md)

    @Test
    void everyKeyWithinTwiceTheErrorOfTheLimitThIsHandedOverAndNoLowerOneOfItsGroup() {
        Random random = new Random(20261204L);
        for (int trial = 0; trial < 2_000; trial++) {
            Standing group = random.nextBoolean() ? Standing.MISSES : Standing.MEETS;
            double limitMargin = group == Standing.MISSES ? -3 * random.nextDouble() : 0.01 + 2 * random.nextDouble();
            int limitKey = StoreSearch.Keys.of(group, limitMargin);
            int cut = StoreSearch.Keys.lowestReaching(StoreSearch.Keys.pessimistic(limitKey, ERROR).key(), ERROR);

            double margin = limitMargin + (random.nextDouble() - 0.5) * 8 * ERROR;
            int key = StoreSearch.Keys.of(group, margin);
            if (margin >= limitMargin - 2 * ERROR) {
                assertThat(key).as("margin %s against %s", margin, limitMargin).isGreaterThanOrEqualTo(cut);
            }
            if (margin < limitMargin - 2 * ERROR - 3 * 1e-4) { // three key units of flooring
                assertThat(key).as("margin %s against %s", margin, limitMargin).isLessThan(cut);
            }
        }
    }

    @Test
    void aLimitThRowMeetingByLessThanTheErrorHandsOverMissesNearZero() {
        int limitKey = StoreSearch.Keys.of(Standing.MEETS, 0.0005);
        int cut = StoreSearch.Keys.lowestReaching(StoreSearch.Keys.pessimistic(limitKey, ERROR).key(), ERROR);

        assertThat(StoreSearch.Keys.of(Standing.MISSES, -0.001)).isGreaterThanOrEqualTo(cut);
        assertThat(StoreSearch.Keys.of(Standing.MISSES_ON_BOUND, -0.001)).isGreaterThanOrEqualTo(cut);
        assertThat(StoreSearch.Keys.of(Standing.MISSES_ON_BOUND, -0.01)).isLessThan(cut);
    }

    @Test
    void theGroupAndMarginUnitOfAKeyAreRecovered() {
        for (Standing standing : Standing.values()) {
            for (double margin : new double[] {-2.5, -0.00015, 0, 0.00015, 1.75}) {
                int key = StoreSearch.Keys.of(standing, margin);
                assertThat(StoreSearch.Keys.standingOf(key)).isEqualTo(standing);
                assertThat(StoreSearch.Keys.optimistic(key, 0)).isGreaterThanOrEqualTo(key);
                StoreSearch.Keys.Floor floor = StoreSearch.Keys.pessimistic(key, 0);
                assertThat(floor.standing()).isEqualTo(standing);
                if (standing != Standing.NOT_JUDGED) {
                    // the lower end of the key's 1e-4-decade unit: at most the margin, less than a unit below it
                    assertThat(floor.margin()).isLessThanOrEqualTo(margin + 1e-12).isGreaterThan(margin - 1e-4 - 1e-12);
                }
            }
        }
    }
}
