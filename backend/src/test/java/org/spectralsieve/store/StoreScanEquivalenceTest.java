package org.spectralsieve.store;

import static org.assertj.core.api.Assertions.assertThat;
import static org.spectralsieve.store.StoreSearchTest.block;
import static org.spectralsieve.store.StoreSearchTest.mean;
import static org.spectralsieve.store.StoreSearchTest.pass;
import static org.spectralsieve.store.StoreSearchTest.passBand;
import static org.spectralsieve.store.StoreSearchTest.requirement;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.spectralsieve.requirement.Band;
import org.spectralsieve.requirement.Clause;
import org.spectralsieve.requirement.CutoffClause;
import org.spectralsieve.requirement.Direction;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.ThicknessInterval;
import org.spectralsieve.requirement.ThicknessSpec;

/**
 * The reworked scan (codes read in the margin loop, per-task top bounds merged, spans
 * gathered in parallel, far thicknesses remembered) against the earlier scan kept as
 * {@link StoreSearch#searchReference}: on random synthetic stores and random plain requirements both
 * return the same rows in the same order with the same verdicts, margins, thicknesses and thickness ranges,
 * and refine the same number of curves. The reworked scan is run both on one thread and split over tasks
 * (a parallel threshold of one curve), so the merge of per-task results is exercised on small stores.
 * The reference itself is checked against evaluating every probe of every curve in {@link StoreSearchTest}.
 */
class StoreScanEquivalenceTest {

    /** Seeded, so a failure repeats; 3 stores × 40 requirements. */
    private static final long SEED = 20261204L;

    @Test
    void theReworkedScanReturnsWhatTheEarlierScanReturnsOnRandomStoresAndRequirements() {
        Random random = new Random(SEED);
        for (int s = 0; s < 3; s++) {
            // more than two chunks of 2,048 curves, so several tasks each keep their own best bounds
            int curves = 4500 + random.nextInt(3000);
            SpectralStore store = StoreSearchTest.randomStore(curves, 300 + random.nextInt(1500), random.nextLong());
            for (int q = 0; q < 40; q++) {
                Requirement r = randomRequirement(random);
                int limit = 1 + random.nextInt(30);
                StoreResult before = StoreSearch.searchReference(store, r, limit);
                for (int parallelFrom : new int[] {Integer.MAX_VALUE, 1}) {
                    StoreResult after = StoreSearch.search(store, r, limit, parallelFrom);

                    assertThat(after.hits()).as("%s, limit %d, parallel from %d", r.text(), limit, parallelFrom)
                            .usingRecursiveFieldByFieldElementComparator().containsExactlyElementsOf(before.hits());
                    assertThat(after.evaluatedSamples()).isEqualTo(before.evaluatedSamples());
                    assertThat(after.refinedSamples()).as(r.text()).isEqualTo(before.refinedSamples());
                }
            }
        }
    }

    /**
     * Reading one column first ({@link ColumnFirstScan}, forced on small stores by a threshold of zero curves)
     * returns what the earlier scan returns, for searches as measured: single probes on and off the grid,
     * bands, means, cutoffs, limits 1–60 (so the first cut is sometimes most of a material-poor store), with and
     * without a material-class filter, on one thread and over tasks.
     */
    @Test
    void readingOneColumnFirstReturnsWhatTheEarlierScanReturns() {
        Random random = new Random(SEED + 1);
        int columnFirstRuns = 0;
        for (int s = 0; s < 4; s++) {
            int curves = 3000 + random.nextInt(5000);
            SpectralStore store = StoreSearchTest.randomStore(curves, 20 + random.nextInt(1500), random.nextLong());
            for (int q = 0; q < 50; q++) {
                Requirement drawn = randomRequirement(random);
                Optional<String> materialClass = random.nextInt(4) == 0 ? Optional.of("film") : Optional.empty();
                Requirement r = new Requirement(drawn.clauses(), ThicknessSpec.AS_MEASURED, materialClass,
                        Optional.empty(), drawn.text() + materialClass.map(c -> " " + c).orElse(""));
                int limit = 1 + random.nextInt(60);
                StoreResult before = StoreSearch.searchReference(store, r, limit);
                columnFirstRuns += ColumnFirstScan.applies(planOf(store, r)) ? 1 : 0;
                for (int parallelFrom : new int[] {Integer.MAX_VALUE, 1}) {
                    StoreResult after = StoreSearch.search(store, r, limit, parallelFrom, 0);

                    assertThat(after.hits()).as("%s, limit %d", r.text(), limit)
                            .usingRecursiveFieldByFieldElementComparator().containsExactlyElementsOf(before.hits());
                    assertThat(after.evaluatedSamples()).isEqualTo(before.evaluatedSamples());
                    assertThat(after.refinedSamples()).as(r.text()).isEqualTo(before.refinedSamples());
                }
            }
        }
        assertThat(columnFirstRuns).as("searches that took the column-first path").isGreaterThan(100);
    }

    /** A curve's cap from one probe's code is never below its bound from every probe (the rule that makes it safe). */
    @Test
    void oneProbesCapIsNeverBelowTheBoundFromEveryProbe() {
        Random random = new Random(SEED + 2);
        SpectralStore store = StoreSearchTest.randomStore(4000, 900, random.nextLong());
        for (int q = 0; q < 40; q++) {
            Requirement drawn = randomRequirement(random);
            Requirement r = requirement(ThicknessSpec.AS_MEASURED, drawn.clauses().toArray(Clause[]::new));
            SearchPlan plan = planOf(store, r);
            ColumnFirstScan scan = new ColumnFirstScan(store, plan);
            for (PointProbe p : plan.pointProbes) {
                if (!p.probe().onGrid() || p.probe().fractionHi() != 0) {
                    continue;
                }
                short[] column = store.column(p.probe().lo());
                for (int c = 0; c < store.size(); c++) {
                    assertThat(ColumnFirstScan.capOf(p, column[c] & 0xFFFF)).as("%s curve %d", r.text(), c)
                            .isGreaterThanOrEqualTo(scan.boundOf(c));
                }
            }
        }
    }

    /**
     * Reading one column first with a thickness asked or solved for (forced on small stores by a threshold of
     * zero curves) returns what the earlier scan returns: random plain requirements at one asked thickness
     * and over ranges, including ranges that end just short of a material's made range (which then starts
     * within the nominal tolerance beyond the asked end), with and without a material-class filter, limits
     * 1–60, on one thread and with the column read in two halves.
     */
    @Test
    void readingOneColumnFirstWithAThicknessReturnsWhatTheEarlierScanReturns() {
        Random random = new Random(SEED + 3);
        int columnFirstRuns = 0;
        for (int s = 0; s < 4; s++) {
            int curves = 3000 + random.nextInt(5000);
            SpectralStore store = StoreSearchTest.randomStore(curves, 20 + random.nextInt(1500), random.nextLong());
            for (int q = 0; q < 50; q++) {
                Requirement drawn = randomRequirement(random);
                Optional<String> materialClass = random.nextInt(4) == 0 ? Optional.of("film") : Optional.empty();
                ThicknessSpec thickness = randomThickness(random);
                Requirement r = new Requirement(drawn.clauses(), thickness, materialClass, Optional.empty(),
                        drawn.text() + " " + thickness + materialClass.map(c -> " " + c).orElse(""));
                int limit = 1 + random.nextInt(60);
                StoreResult before = StoreSearch.searchReference(store, r, limit);
                for (int parallelFrom : new int[] {Integer.MAX_VALUE, 1}) {
                    StoreResult after = StoreSearch.search(store, r, limit, parallelFrom, 0);

                    assertThat(after.hits()).as("%s, limit %d", r.text(), limit)
                            .usingRecursiveFieldByFieldElementComparator().containsExactlyElementsOf(before.hits());
                    assertThat(after.evaluatedSamples()).isEqualTo(before.evaluatedSamples());
                    assertThat(after.refinedSamples()).as(r.text()).isEqualTo(before.refinedSamples());
                    StoreResult alone = StoreSearch.searchColumnFirstOnly(store, r, limit, parallelFrom);
                    if (alone != null) {
                        assertThat(alone.hits()).usingRecursiveFieldByFieldElementComparator()
                                .containsExactlyElementsOf(before.hits());
                        assertThat(alone.refinedSamples()).isEqualTo(before.refinedSamples());
                        columnFirstRuns++;
                    }
                }
            }
        }
        // the pass settles most searches itself (the rest fall back to the chunk scan, also checked above)
        assertThat(columnFirstRuns).as("searches the column-first pass settled").isGreaterThan(200);
    }

    /**
     * With a thickness, a curve's cap from one probe's code (its margin and group at the thicknesses the curve
     * can be judged at) is never below its bound from every probe, for every curve and one-column probe.
     */
    @Test
    void oneProbesCapWithAThicknessIsNeverBelowTheBoundFromEveryProbe() {
        Random random = new Random(SEED + 4);
        SpectralStore store = StoreSearchTest.randomStore(4000, 900, random.nextLong());
        int compared = 0;
        for (int q = 0; q < 40; q++) {
            Requirement drawn = randomRequirement(random);
            Requirement r = requirement(randomThickness(random), drawn.clauses().toArray(Clause[]::new));
            SearchPlan plan = planOf(store, r);
            ColumnFirstScan scan = new ColumnFirstScan(store, plan);
            for (int k = 0; k < plan.pointProbes.size(); k++) {
                PointProbe p = plan.pointProbes.get(k);
                if (!p.probe().onGrid() || p.probe().fractionHi() != 0) {
                    continue;
                }
                short[] column = store.column(p.probe().lo());
                for (int c = 0; c < store.size(); c++) {
                    if (!plan.judged(c)) {
                        continue;
                    }
                    int bound = scan.boundOf(c);
                    ColumnFirstScan.Reach reachesBound = scan.new Reach(k, bound);
                    assertThat(reachesBound.keeps(c, column[c])).as("%s curve %d probe %d", r.text(), c, k).isTrue();
                    compared++;
                }
            }
        }
        assertThat(compared).isGreaterThan(10_000);
    }

    /**
     * Over a thickness range, the cap from every one-column probe together (a miss unless one thickness lets
     * each of them escape a miss) is never below the bound from every probe, for every judged curve.
     */
    @Test
    void theJointCapOverARangeIsNeverBelowTheBoundFromEveryProbe() {
        Random random = new Random(SEED + 5);
        SpectralStore store = StoreSearchTest.randomStore(4000, 900, random.nextLong());
        int compared = 0;
        int belowMeets = 0;
        for (int q = 0; q < 60; q++) {
            Requirement drawn = randomRequirement(random);
            ThicknessSpec range = randomThickness(random);
            if (range.kind() != ThicknessSpec.Kind.RANGE) {
                continue;
            }
            Requirement r = requirement(range, drawn.clauses().toArray(Clause[]::new));
            SearchPlan plan = planOf(store, r);
            ColumnFirstScan scan = new ColumnFirstScan(store, plan);
            int[] probes = scan.oneColumnProbeIndices();
            short[][] columns = new short[probes.length][];
            for (int i = 0; i < probes.length; i++) {
                columns[i] = store.column(plan.pointProbes.get(probes[i]).probe().lo());
            }
            for (int c = 0; c < store.size(); c++) {
                if (probes.length == 0 || !plan.judged(c)) {
                    continue;
                }
                int cap = scan.jointCapOverRange(c, probes, columns);
                assertThat(cap).as("%s curve %d", r.text(), c).isGreaterThanOrEqualTo(scan.boundOf(c));
                belowMeets += cap < StoreSearch.Keys.of(org.spectralsieve.requirement.Standing.MEETS, Double.NaN) ? 1 : 0;
                compared++;
            }
        }
        assertThat(compared).isGreaterThan(10_000);
        assertThat(belowMeets).as("curves the joint cap puts among the misses").isGreaterThan(1_000);
    }

    /**
     * The block screen's table of codes (one bit per code, read without a branch) keeps exactly the codes
     * {@code Filter.keeps} keeps, whose levels are "cap ≥ t": every one of the 65,536 codes, for the one-column
     * probes of random requirements and thresholds drawn from real bounds, the keys' group edges and random
     * keys; and the block loops keep, in order, the curves a plain loop over {@code keeps} keeps.
     */
    @Test
    void theTableOfCodesKeepsExactlyWhatTheLevelsKeep() {
        Random random = new Random(SEED + 6);
        SpectralStore store = StoreSearchTest.randomStore(4000, 900, random.nextLong());
        int checked = 0;
        for (int q = 0; q < 30; q++) {
            Requirement drawn = randomRequirement(random);
            Requirement r = requirement(ThicknessSpec.AS_MEASURED, drawn.clauses().toArray(Clause[]::new));
            SearchPlan plan = planOf(store, r);
            ColumnFirstScan scan = new ColumnFirstScan(store, plan);
            for (int k : scan.oneColumnProbeIndices()) {
                PointProbe p = plan.pointProbes.get(k);
                short[] column = store.column(p.probe().lo());
                int[] thresholds = {scan.boundOf(random.nextInt(store.size())), scan.boundOf(random.nextInt(store.size())),
                    StoreSearch.Keys.of(org.spectralsieve.requirement.Standing.MEETS, Double.NaN),
                    StoreSearch.Keys.of(org.spectralsieve.requirement.Standing.UNVERIFIED, Double.POSITIVE_INFINITY),
                    StoreSearch.Keys.of(org.spectralsieve.requirement.Standing.MISSES, Double.NaN),
                    Integer.MIN_VALUE, Integer.MAX_VALUE, random.nextInt() / 4};
                for (int t : thresholds) {
                    ColumnFirstScan.Filter filter = new ColumnFirstScan.Filter(p, t);
                    for (int u = 0; u <= 0xFFFF; u++) {
                        assertThat(filter.keptBit((short) u)).as("%s code %x t %d", r.text(), u, t)
                                .isEqualTo(filter.keeps((short) u) ? 1 : 0);
                    }
                    int from = random.nextInt(store.size() / 2);
                    int to = from + random.nextInt(Math.min(2048, store.size() - from) + 1);
                    int[] expected = new int[to - from];
                    int expectedCount = 0;
                    for (int c = from; c < to; c++) {
                        if (filter.keeps(column[c])) {
                            expected[expectedCount++] = c;
                        }
                    }
                    int[] block = new int[2048];
                    int count = filter.keepInto(column, from, to, block);
                    assertThat(java.util.Arrays.copyOf(block, count)).isEqualTo(java.util.Arrays.copyOf(expected, expectedCount));
                    int[] all = new int[to - from];
                    for (int c = from; c < to; c++) {
                        all[c - from] = c;
                    }
                    int thinned = filter.thin(column, all, all.length);
                    assertThat(java.util.Arrays.copyOf(all, thinned)).isEqualTo(java.util.Arrays.copyOf(expected, expectedCount));
                    checked++;
                }
            }
        }
        assertThat(checked).isGreaterThan(100);
    }

    /**
     * Over a range, the integer screen ({@link RangeLevelScreen}: a level limit by the curve's thickness class)
     * keeps every curve the exact cap ({@link ColumnFirstScan.Reach}) keeps: for every one-column probe of random
     * requirements over random ranges, at thresholds drawn from real bounds, the keys' group edges and random
     * keys, for every curve with its own code, and for sampled curves with every one of the 65,536 codes. It is
     * also tight (it keeps few curves the cap drops), and the comparison can fail: the same screen at a threshold
     * far above catches curves the cap at t keeps.
     */
    @Test
    void theScreenByLevelsOverARangeKeepsEveryCurveTheExactCapKeeps() {
        Random random = new Random(SEED + 7);
        SpectralStore store = StoreSearchTest.randomStore(4000, 900, random.nextLong());
        ThicknessClasses classes = store.thicknessClasses();
        assertThat(classes).isNotNull();
        short[] classOf = classes.classOfCurve();
        long exactKept = 0;
        long screenKept = 0;
        long codesChecked = 0;
        int droppedAboveT = 0;
        for (int q = 0; q < 24; q++) {
            Requirement drawn = randomRequirement(random);
            ThicknessSpec range = randomThickness(random);
            if (range.kind() != ThicknessSpec.Kind.RANGE) {
                q--;
                continue;
            }
            Requirement r = requirement(range, drawn.clauses().toArray(Clause[]::new));
            SearchPlan plan = planOf(store, r);
            ColumnFirstScan scan = new ColumnFirstScan(store, plan);
            for (int k : scan.oneColumnProbeIndices()) {
                short[] column = store.column(plan.pointProbes.get(k).probe().lo());
                int[] thresholds = {scan.boundOf(random.nextInt(store.size())), scan.boundOf(random.nextInt(store.size())),
                    StoreSearch.Keys.of(org.spectralsieve.requirement.Standing.MEETS, Double.NaN),
                    StoreSearch.Keys.of(org.spectralsieve.requirement.Standing.UNVERIFIED, Double.POSITIVE_INFINITY),
                    StoreSearch.Keys.of(org.spectralsieve.requirement.Standing.MISSES, Double.NaN),
                    StoreSearch.Keys.of(org.spectralsieve.requirement.Standing.MISSES, -0.5 * random.nextDouble()),
                    Integer.MIN_VALUE, Integer.MAX_VALUE, random.nextInt() / 4};
                for (int t : thresholds) {
                    ColumnFirstScan.Reach exact = scan.new Reach(k, t);
                    RangeLevelScreen screen = scan.screenOf(k, t, classes);
                    RangeLevelScreen farAbove = scan.screenOf(k, t == Integer.MAX_VALUE ? t : t + 20_000, classes);
                    for (int c = 0; c < store.size(); c++) {
                        boolean capKeeps = exact.keeps(c, column[c]);
                        boolean screenKeeps = screen.keeps(column[c], classOf[c]);
                        if (capKeeps) {
                            assertThat(screenKeeps).as("%s probe %d t %d curve %d code %x", r.text(), k, t, c,
                                    column[c] & 0xFFFF).isTrue();
                            droppedAboveT += farAbove.keeps(column[c], classOf[c]) ? 0 : 1;
                        }
                        exactKept += capKeeps ? 1 : 0;
                        screenKept += screenKeeps ? 1 : 0;
                    }
                    for (int i = 0; i < 3; i++) {
                        int c = random.nextInt(store.size());
                        for (int u = 0; u <= 0xFFFF; u++) {
                            if (exact.keeps(c, (short) u)) {
                                assertThat(screen.keeps((short) u, classOf[c])).as("%s probe %d t %d curve %d code %x",
                                        r.text(), k, t, c, u).isTrue();
                            }
                            codesChecked++;
                        }
                    }
                }
            }
        }
        assertThat(codesChecked).isGreaterThan(1_000_000);
        // not a screen that keeps everything: within a few per cent of what the exact caps keep
        assertThat(exactKept).isGreaterThan(100_000);
        assertThat(screenKept).as("kept by the screen, %d by the caps", exactKept).isLessThan(exactKept + exactKept / 20);
        // the comparison can fail: the screen at a threshold far above t drops curves the caps at t keep
        assertThat(droppedAboveT).isGreaterThan(1_000);
    }

    /**
     * Over a range on random stores, the column-first pass with its integer screen, without it (every curve's
     * exact caps), and the earlier scan return the same rows, counts and refinements, on one thread and over
     * tasks; the column-first pass alone (no fallback) with and without the screen too, where it settles.
     */
    @Test
    void theScreenByLevelsLeavesTheSearchOverARangeUnchanged() {
        Random random = new Random(SEED + 8);
        int settled = 0;
        for (int s = 0; s < 2; s++) {
            SpectralStore store = StoreSearchTest.randomStore(3000 + random.nextInt(5000), 20 + random.nextInt(1500),
                    random.nextLong());
            for (int q = 0; q < 50; q++) {
                Requirement drawn = randomRequirement(random);
                ThicknessSpec range = randomThickness(random);
                if (range.kind() != ThicknessSpec.Kind.RANGE) {
                    q--;
                    continue;
                }
                Requirement r = requirement(range, drawn.clauses().toArray(Clause[]::new));
                int limit = 1 + random.nextInt(40);
                StoreResult before = StoreSearch.searchReference(store, r, limit);
                for (int parallelFrom : new int[] {Integer.MAX_VALUE, 1}) {
                    for (boolean screen : new boolean[] {true, false}) {
                        StoreResult after = StoreSearch.search(store, r, limit, parallelFrom, 0, screen);
                        assertThat(after.hits()).as("%s, limit %d, screen %s", r.text(), limit, screen)
                                .usingRecursiveFieldByFieldElementComparator().containsExactlyElementsOf(before.hits());
                        assertThat(after.evaluatedSamples()).isEqualTo(before.evaluatedSamples());
                        assertThat(after.refinedSamples()).as(r.text()).isEqualTo(before.refinedSamples());
                    }
                    // the spans from the material objects, as the sixth pass worked them out
                    StoreResult byObjects = StoreSearch.search(store, r, limit, parallelFrom, 0, true, false);
                    assertThat(byObjects.hits()).as("%s, limit %d, spans by objects", r.text(), limit)
                            .usingRecursiveFieldByFieldElementComparator().containsExactlyElementsOf(before.hits());
                    assertThat(byObjects.refinedSamples()).as(r.text()).isEqualTo(before.refinedSamples());
                }
                StoreResult alone = StoreSearch.searchColumnFirstOnly(store, r, limit, 1);
                if (alone != null) {
                    assertThat(alone.hits()).usingRecursiveFieldByFieldElementComparator()
                            .containsExactlyElementsOf(before.hits());
                    settled++;
                }
            }
        }
        assertThat(settled).as("searches the column-first pass settled").isGreaterThan(40);
    }

    /**
     * The spans worked out on demand from the store's flat material table are those worked out from each
     * material's curve array and object, for every curve of random stores (materials interleaved, a third made only
     * 0.5–4 mm thick, some films) at random asked thicknesses and ranges, with and without a class filter, taken
     * in random order (a material is worked out from whichever of its curves comes first). So the check can fail:
     * the spans must differ between curves (a table off by one curve gives other spans) and some curves must be
     * not judged.
     */
    @Test
    void theSpansFromTheMaterialTableAreTheSpansFromTheMaterialObjects() {
        Random random = new Random(SEED + 9);
        int compared = 0;
        int notJudged = 0;
        int differingFromTheNextCurve = 0;
        for (int s = 0; s < 3; s++) {
            SpectralStore store = StoreSearchTest.randomStore(2000 + random.nextInt(3000), 20 + random.nextInt(900),
                    random.nextLong());
            for (int q = 0; q < 20; q++) {
                Requirement drawn = randomRequirement(random);
                Optional<String> materialClass = random.nextInt(4) == 0 ? Optional.of("film") : Optional.empty();
                ThicknessSpec thickness = randomThickness(random);
                Requirement r = new Requirement(drawn.clauses(), thickness, materialClass, Optional.empty(),
                        drawn.text() + " " + thickness + materialClass.map(c -> " " + c).orElse(""));
                SearchPlan byTable = planOf(store, r);
                SearchPlan byObjects = planOf(store, r);
                byObjects.spansByTable = false;
                int[] order = shuffled(store.size(), random);
                ThicknessInterval[] fromTable = new ThicknessInterval[store.size()];
                for (int c : order) {
                    fromTable[c] = byTable.spanOf(c);
                }
                for (int c : shuffled(store.size(), random)) {
                    ThicknessInterval expected = byObjects.spanOf(c);
                    assertThat(fromTable[c]).as("curve %d, %s", c, r.text()).isEqualTo(expected);
                    compared++;
                    notJudged += expected == null ? 1 : 0;
                }
                for (int c = 0; c + 1 < store.size(); c++) {
                    differingFromTheNextCurve += java.util.Objects.equals(fromTable[c], fromTable[c + 1]) ? 0 : 1;
                }
            }
        }
        assertThat(compared).isGreaterThan(100_000);
        assertThat(notJudged).as("curves not judged").isGreaterThan(1_000).isLessThan(compared);
        assertThat(differingFromTheNextCurve).as("spans that differ from the next curve's").isGreaterThan(compared / 10);
    }

    private static int[] shuffled(int n, Random random) {
        int[] out = new int[n];
        for (int i = 0; i < n; i++) {
            out[i] = i;
        }
        for (int i = n - 1; i > 0; i--) {
            int j = random.nextInt(i + 1);
            int swap = out[i];
            out[i] = out[j];
            out[j] = swap;
        }
        return out;
    }

    /** One asked thickness or a range, some ending within the nominal tolerance short of a made range (0.5–4 mm). */
    private static ThicknessSpec randomThickness(Random random) {
        return switch (random.nextInt(4)) {
            case 0 -> ThicknessSpec.at(pick(random, 0.5, 1, 2, 3, 4.5, 6, 10, 0.495, 4.05));
            case 1 -> ThicknessSpec.range(pick(random, 0.2, 0.3), pick(random, 0.495, 0.492));
            case 2 -> ThicknessSpec.range(pick(random, 4.05, 4.07), pick(random, 6, 9));
            default -> {
                double lo = pick(random, 0.3, 0.5, 1, 2);
                yield ThicknessSpec.range(lo, lo + pick(random, 0.5, 2, 5, 10));
            }
        };
    }

    private static SearchPlan planOf(SpectralStore store, Requirement r) {
        return SearchPlan.of(store, r, false, StoreSearch.PARALLEL_MIN_CURVES);
    }

    @Test
    void theDefaultSearchTakesTheReworkedScan() {
        SpectralStore store = StoreSearchTest.randomStore(3000, 700, 7);
        Requirement r = requirement(ThicknessSpec.range(1, 6), pass(0.8, 365), block(0.01, 405));

        assertThat(StoreSearch.search(store, r, 20).hits()).usingRecursiveFieldByFieldElementComparator()
                .containsExactlyElementsOf(StoreSearch.searchReference(store, r, 20).hits());
    }

    private static Requirement randomRequirement(Random random) {
        List<Clause> clauses = new ArrayList<>();
        int count = 1 + random.nextInt(3);
        for (int i = 0; i < count; i++) {
            clauses.add(randomClause(random));
        }
        ThicknessSpec thickness = switch (random.nextInt(3)) {
            case 0 -> ThicknessSpec.AS_MEASURED;
            case 1 -> ThicknessSpec.at(pick(random, 0.5, 1, 2, 3, 4.5, 6, 10));
            default -> {
                double lo = pick(random, 0.3, 0.5, 1, 2);
                yield ThicknessSpec.range(lo, lo + pick(random, 0.5, 2, 5, 10));
            }
        };
        return requirement(thickness, clauses.toArray(Clause[]::new));
    }

    private static Clause randomClause(Random random) {
        // wavelengths both on the 1 nm grid and between its points, thresholds from clear to dense
        double nm = 250 + random.nextInt(300) + (random.nextBoolean() ? 0 : 0.5);
        double t = pick(random, 0.0001, 0.001, 0.01, 0.1, 0.5, 0.7, 0.8, 0.9, 0.95);
        double width = 2 + random.nextInt(40);
        return switch (random.nextInt(6)) {
            case 0 -> pass(t, nm);
            case 1 -> block(t, nm);
            case 2 -> passBand(t, nm, nm + width);
            case 3 -> block(t, nm, nm + width);
            case 4 -> mean(random.nextBoolean() ? Direction.PASS : Direction.BLOCK, t, nm, nm + width);
            default -> new CutoffClause(pick(random, 0.1, 0.5), new Band(nm, nm + width), "cutoff");
        };
    }

    private static double pick(Random random, double... values) {
        return values[random.nextInt(values.length)];
    }
}
