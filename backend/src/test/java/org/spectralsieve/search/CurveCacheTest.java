package org.spectralsieve.search;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.WavelengthGrid;

/**
 * The decoded-curve cache keeps to its heap budget, drops the least recently judged curve first and serves
 * curves equal to those put in. Sizes follow the JVM's array layout with compressed references (16-byte
 * array header, 8 bytes a double, 1 a boolean: the HotSpot layout, from memory).
 */
class CurveCacheTest {

    private static final double[] GRID = new WavelengthGrid(190, 1100, 1).points(); // 911 points

    private static Curve curve(double level) {
        double[] t = new double[GRID.length];
        for (int i = 0; i < t.length; i++) {
            t[i] = level * (i + 1) / t.length;
        }
        return Curve.of(GRID, t, 1e-3);
    }

    @Test
    void curvesOnOneGridShareTheirWavelengthsAndCostAboutNineBytesAPoint() {
        CurveCache cache = new CurveCache(64L << 20);
        for (int i = 0; i < 100; i++) {
            assertThat(cache.offer(i, curve(0.5 + i / 1000.0))).isTrue();
        }
        // each curve's own: transmittances 16 + 8·911, flags 16 + 911, object and entry ≈ 100 bytes;
        // the grid and the detection limits once for all
        long perCurve = (cache.heapBytes() - 2 * (16 + 8L * GRID.length)) / 100;
        assertThat(perCurve).isBetween(9L * GRID.length, 9L * GRID.length + 200);
    }

    @Test
    void aCachedCurveEqualsTheCurvePutIn() {
        CurveCache cache = new CurveCache(1L << 20);
        Curve original = curve(0.8);
        cache.offer(7, original);
        cache.put(8, curve(0.6));
        assertThat(cache.get(7)).isEqualTo(original);
        assertThat(cache.get(8)).isEqualTo(curve(0.6));
        assertThat(cache.get(9)).isNull();
    }

    @Test
    void theLeastRecentlyJudgedCurveMakesRoomAndTheBudgetHolds() {
        long budget = 100_000; // the shared grid and limits (2 × 7,304 bytes) and ten curves of 8.3 KB
        CurveCache cache = new CurveCache(budget);
        for (int id = 1; id <= 10; id++) {
            cache.put(id, curve(id / 20.0));
        }
        assertThat(cache.size()).isEqualTo(10);
        cache.get(1); // judged again: 2 is now the least recently used
        for (int id = 11; id <= 15; id++) {
            cache.put(id, curve(id / 20.0));
            assertThat(cache.heapBytes()).isLessThanOrEqualTo(budget);
        }
        assertThat(cache.get(1)).isNotNull();
        assertThat(cache.get(2)).isNull();
        assertThat(cache.get(15)).isEqualTo(curve(15 / 20.0));
    }

    @Test
    void fillingFromASnapshotStopsAtTheBudgetWithoutEvicting() {
        CurveCache cache = new CurveCache(100_000);
        int offered = 0;
        while (cache.offer(offered, curve(0.5))) {
            offered++;
        }
        assertThat(offered).isBetween(8, 12);
        assertThat(cache.get(0)).isNotNull();
        assertThat(cache.heapBytes()).isLessThanOrEqualTo(100_000);
    }

    @Test
    void aSuccessorTakesItsPredecessorsCurvesAsTheyAreWithinTheSameBudget() {
        long budget = 100_000;
        CurveCache previous = new CurveCache(budget);
        for (int id = 1; id <= 6; id++) {
            previous.offer(id, curve(id / 10.0));
        }
        CurveCache next = previous.successor();
        for (int id = 1; id <= 6; id++) {
            assertThat(next.offerKept(previous, id)).isTrue();
            // the very curve, not a copy decoded or compacted again
            assertThat(next.get(id)).isSameAs(previous.get(id)).isEqualTo(curve(id / 10.0));
        }
        assertThat(next.offerKept(previous, 99)).as("a curve the predecessor does not hold").isFalse();
        assertThat(next.heapBytes()).isEqualTo(previous.heapBytes());
        // filled up to the budget like offer, never evicting
        for (int id = 7; next.offer(id, curve(id / 100.0)); id++) {
            assertThat(next.heapBytes()).isLessThanOrEqualTo(budget);
        }
        assertThat(next.get(1)).isNotNull();
        CurveCache empty = new CurveCache(budget);
        assertThat(empty.successor().offerKept(empty, 1)).as("nothing to take from an empty predecessor").isFalse();
    }

    @Test
    void takingSeveralKeptCurvesAtOnceTakesWhatTakingThemOneByOneTakes() {
        // new curves first, so the budget runs out part way; ids the predecessor lacks; one already taken: the same
        // curves either way
        CurveCache previous = new CurveCache(400_000);
        for (int id = 1; id <= 40; id++) {
            if (id % 7 != 0) {
                previous.offer(id, curve(id / 100.0));
            }
        }
        CurveCache oneByOne = previous.successor();
        CurveCache atOnce = previous.successor();
        for (int id = 100; id < 120; id++) {
            oneByOne.offer(id, curve(id / 1000.0));
            atOnce.offer(id, curve(id / 1000.0));
        }
        List<Long> ids = new ArrayList<>();
        oneByOne.offerKept(previous, 3L);
        atOnce.offerKept(previous, 3L);
        for (long id = 1; id <= 45; id++) {
            ids.add(id);
            oneByOne.offerKept(previous, id);
        }
        int added = atOnce.offerKept(previous, ids);
        assertThat(atOnce.size()).isEqualTo(oneByOne.size());
        assertThat(added).isPositive().isLessThan(previous.size() - 1); // not vacuous: some taken, the budget stopped others
        for (long id = 1; id <= 45; id++) {
            assertThat(atOnce.get(id)).as("sample %d", id).isSameAs(oneByOne.get(id));
        }
        assertThat(atOnce.heapBytes()).isEqualTo(oneByOne.heapBytes());
    }

    @Test
    void onlyASuccessorTakesCurvesFromACache() {
        CurveCache previous = new CurveCache(100_000);
        previous.offer(1, curve(0.5));
        org.assertj.core.api.Assertions.assertThatThrownBy(() -> new CurveCache(100_000).offerKept(previous, 1))
                .isInstanceOf(IllegalArgumentException.class);
    }

    @Test
    void aBudgetOfZeroCachesNothing() {
        CurveCache cache = new CurveCache(0);
        assertThat(cache.offer(1, curve(0.5))).isFalse();
        cache.put(1, curve(0.5));
        assertThat(cache.get(1)).isNull();
        assertThat(cache.heapBytes()).isZero();
    }
}
