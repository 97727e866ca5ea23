package org.spectralsieve.store;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Random;
import org.junit.jupiter.api.Test;
import org.spectralsieve.requirement.Standing;
import org.spectralsieve.store.StoreSearch.Keys;

/**
 * The rule that decides which store results are handed over for exact judgement once the exact last row is known
 * (docs/store.md, "The store's error at the cut"). Random keys from a fixed seed over every group.
 */
class CutReachTest {

    /** ρ = −log10(1 − R²) at n = 1.65, R = ((n − 1)/(n + 1))² (normal-incidence Fresnel, any optics textbook), plus the rounding. */
    private static final double ERROR = -Math.log10(1 - Math.pow(Math.pow(0.65 / 2.65, 2), 2)) + CutReach.ROUNDING_DECADES;

    @Test
    void theScanCutNeverHidesABoundThatCouldReachTheExactRow() {
        Random random = new Random(20261205L);
        int reached = 0;
        for (int trial = 0; trial < 200_000; trial++) {
            int exactKey = randomKey(random);
            double error = random.nextDouble() * 0.05;
            int bound = randomKey(random);
            if (Keys.standingOf(bound) == Standing.MISSES_ON_BOUND) {
                continue; // a first-pass bound is never a miss on a bound
            }
            if (CutReach.reaches(bound, error, exactKey)) {
                reached++;
                assertThat(bound).as("bound %s, exact %s", describe(bound), describe(exactKey))
                        .isGreaterThanOrEqualTo(CutReach.lowestReachingKey(exactKey, error));
            }
        }
        assertThat(reached).as("the trials reach often enough to mean something").isGreaterThan(10_000);
    }

    @Test
    void aPlainMissBoundCoversAMissOnABoundOfNoHigherMargin() {
        Random random = new Random(11L);
        for (int trial = 0; trial < 100_000; trial++) {
            double margin = -random.nextDouble() * 2;
            double below = random.nextDouble() * 0.5;
            double error = random.nextDouble() * 0.05;
            assertThat(CutReach.raised(Keys.of(Standing.MISSES, margin), error))
                    .isGreaterThanOrEqualTo(CutReach.raised(Keys.of(Standing.MISSES_ON_BOUND, margin - below), error));
        }
    }

    @Test
    void raisingNeverLowersAResult() {
        Random random = new Random(7L);
        for (int trial = 0; trial < 100_000; trial++) {
            int key = randomKey(random);
            assertThat(CutReach.raised(key, random.nextDouble() * 0.05)).isGreaterThanOrEqualTo(key);
        }
    }

    @Test
    void aResultReachesItsOwnGroupWithinTheErrorAndNotBeyond() {
        int exact = Keys.of(Standing.MISSES, -1.9483);
        assertThat(CutReach.reaches(Keys.of(Standing.MISSES, -1.9490), ERROR, exact)).isTrue();
        assertThat(CutReach.reaches(Keys.of(Standing.MISSES, -1.9483 - ERROR - 2e-4), ERROR, exact)).isFalse();
        assertThat(CutReach.reaches(Keys.of(Standing.MISSES_ON_BOUND, -1.9490), ERROR, exact))
                .as("the worst reading may change from a bound to a reading").isTrue();
    }

    @Test
    void aMissNearZeroMayMeetAnExactRowThatMeetsByLessThanTheError() {
        int exact = Keys.of(Standing.MEETS, 0.0005);
        assertThat(CutReach.reaches(Keys.of(Standing.MISSES, -0.0008), ERROR, exact)).isTrue();
        assertThat(CutReach.reaches(Keys.of(Standing.UNVERIFIED, -0.0008), ERROR, exact))
                .as("a block on a reading below the detection limit, just above its threshold").isTrue();
        assertThat(CutReach.reaches(Keys.of(Standing.UNVERIFIED, 0.5), ERROR, exact))
                .as("a pass on a bound never meets").isFalse();
        assertThat(CutReach.reaches(Keys.of(Standing.MISSES, -0.01), ERROR, exact)).isFalse();
        assertThat(CutReach.reaches(Keys.of(Standing.MISSES, -0.0008), ERROR, Keys.of(Standing.MEETS, 0.2))).isFalse();
    }

    @Test
    void aResultWithoutAMarginIsNotMoved() {
        int nan = Keys.of(Standing.UNVERIFIED, Double.NaN);
        assertThat(CutReach.raised(nan, 1.0)).isEqualTo(nan);
        assertThat(CutReach.raised(Keys.of(Standing.NOT_JUDGED, -0.1), 1.0)).isEqualTo(Keys.of(Standing.NOT_JUDGED, -0.1));
    }

    @Test
    void theGroupAndMarginUnitOfAKeyAreRecovered() {
        for (Standing standing : Standing.values()) {
            for (double margin : new double[] {-2.5, -0.00015, 0, 0.00015, 1.75}) {
                int key = Keys.of(standing, margin);
                assertThat(Keys.standingOf(key)).isEqualTo(standing);
                assertThat(Keys.unitOf(key) * Keys.UNIT).isLessThanOrEqualTo(margin + 1e-12)
                        .isGreaterThan(margin - Keys.UNIT - 1e-12);
            }
            assertThat(Keys.marginUnknown(Keys.of(standing, Double.NaN))).isTrue();
        }
    }

    @Test
    void theErrorGrowsWithHowFarACurveIsStretched() {
        SpectralStore store = SpectralStore.builder(SpectralStore.DEFAULT_GRID, 3)
                .addEncoded(1, new StoredMaterial(1, "thin sheet (illustrative)", "plastic sheet"), 0.5, true, false,
                        SyntheticCurves.INDICES[0], clearCodes())
                .addEncoded(2, new StoredMaterial(2, "film (illustrative)", "film"), 0.05, false, false,
                        SyntheticCurves.INDICES[0], clearCodes())
                .addEncoded(3, new StoredMaterial(3, "thick sheet (illustrative)", "plastic sheet"), 5.0, true, false,
                        SyntheticCurves.INDICES[0], clearCodes())
                .build();
        CutReach solved = reach(store, "passes over 80% at 365 nm, thickness 1 to 6 mm");
        CutReach measured = reach(store, "passes over 80% at 365 nm");
        CutReach atThree = reach(store, "passes over 80% at 365 nm, at 3 mm");

        assertThat(measured.errorOf(0)).isEqualTo(CutReach.ROUNDING_DECADES);
        assertThat(solved.errorOf(1)).as("a film is never rescaled").isEqualTo(CutReach.ROUNDING_DECADES);
        assertThat(solved.errorOf(0)).as("6 mm and two tolerances over 0.5 mm").isGreaterThan(12 * CutReach.ROUNDING_DECADES);
        assertThat(solved.errorOf(2)).as("a 5 mm sheet is stretched little").isLessThan(solved.errorOf(0) / 8);
        assertThat(atThree.errorOf(0) / atThree.errorOf(2)).as("3 / 0.5 against 3 / 5 taken as 1").isCloseTo(6, org.assertj.core.data.Offset.offset(1e-9));
        assertThat(solved.largestError()).isGreaterThanOrEqualTo(solved.errorOf(0));
    }

    @Test
    void aReadingBetweenGridWavelengthsIsToldApart() {
        SpectralStore store = SpectralStore.builder(SpectralStore.DEFAULT_GRID, 1)
                .addEncoded(1, new StoredMaterial(1, "sheet (illustrative)", "plastic sheet"), 2.0, true, false,
                        SyntheticCurves.INDICES[0], clearCodes())
                .build();
        assertThat(StoreSearch.readsBetweenGridPoints(store, parse("passes over 80% at 365 nm"))).isFalse();
        assertThat(StoreSearch.readsBetweenGridPoints(store, parse("blocks under 1% from 380 to 400 nm"))).isFalse();
        assertThat(StoreSearch.readsBetweenGridPoints(store, parse("passes over 80% at 365.5 nm"))).isTrue();
        assertThat(StoreSearch.readsBetweenGridPoints(store, parse("blocks under 1% from 380.5 to 400 nm"))).isTrue();
    }

    private static org.spectralsieve.requirement.Requirement parse(String text) {
        return org.spectralsieve.requirement.RequirementParser.parse(text);
    }

    private static CutReach reach(SpectralStore store, String requirement) {
        return CutReach.of(store, SearchPlan.of(store,
                org.spectralsieve.requirement.RequirementParser.parse(requirement), false, Integer.MAX_VALUE));
    }

    private static short[] clearCodes() {
        short[] codes = new short[SpectralStore.DEFAULT_GRID.size()];
        java.util.Arrays.fill(codes, (short) 10);
        return codes;
    }

    private static int randomKey(Random random) {
        Standing standing = Standing.values()[random.nextInt(Standing.values().length)];
        double margin = random.nextInt(20) == 0 ? Double.NaN : (random.nextDouble() - 0.5) * (random.nextBoolean() ? 0.1 : 4);
        // a miss is decided by a reading that misses: its worst margin is below 0 (ClauseEvaluator)
        boolean miss = standing == Standing.MISSES || standing == Standing.MISSES_ON_BOUND;
        return Keys.of(standing, miss ? -Math.abs(margin) : margin);
    }

    private static String describe(int key) {
        return Keys.standingOf(key) + " " + (Keys.marginUnknown(key) ? "NaN" : Keys.unitOf(key) * Keys.UNIT);
    }
}
