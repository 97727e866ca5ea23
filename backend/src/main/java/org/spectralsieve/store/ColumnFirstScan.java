package org.spectralsieve.store;

import java.util.Arrays;
import org.spectralsieve.requirement.NominalThickness;
import org.spectralsieve.requirement.Standing;
import org.spectralsieve.requirement.ThicknessSpec;
import org.spectralsieve.requirement.Verdict;

/**
 * The first pass of a search judged as measured, by one column first (docs/store-scan.md): instead of
 * every probe of every curve, one probe's 16-bit codes are compared with two integer thresholds, and only
 * the curves that pass them get their bound from every probe.
 *
 * <p>Why it gives the same answer: one probe alone already caps a curve's bound. A probe that misses
 * makes the curve a miss no better than that probe's margin; an unverified probe caps it at unverified
 * with that margin; a holding probe at "meets" with that margin (the bound's margin is the smallest of
 * all probes'). So {@link #capOf} is an upper bound on the bound ({@link StoreSearch.Keys} order). Within
 * codes read as values or as bounds, that cap only falls (a pass) or only rises (a block) with the code's
 * level, so "cap at least t" is "level at most L" (or at least L) for two levels L found once per search:
 * the inner loop compares shorts only. A curve left out has a cap below t, so its bound is below t too:
 * when the best {@code count} bounds of the curves kept are all at least t, no curve left out could be
 * among them (the order is total: higher bound, then lower index), and for any cut at least t none left
 * out reaches the cut. Where that does not hold, t is lowered and the column read again; the last resort
 * is the plain scan ({@code null}).
 *
 * <p>The bound is at most the smallest cap of all one-column probes, so the curves the first column keeps
 * are thinned by the other columns' thresholds (read for those curves only) before their bounds are taken.
 *
 * <p>Bounds of kept curves come from {@link #boundOf}: the chunk scan's rules ({@code marginsOnGridPoint},
 * {@code marginsDecoded} without rescaling, {@code settleBounds}) per curve, in the same probe order, so
 * the same doubles and the same keys.
 */
final class ColumnFirstScan {

    /** Curves sampled to pick the column and a first threshold: about this many. */
    private static final int SAMPLE = 16_384;
    /** The same with a thickness asked or solved for. */
    private static final int SAMPLE_WITH_THICKNESS = 4_096;
    /** Neighbouring curves sampled together (see {@link #best}). */
    private static final int SAMPLE_RUN = 64;
    /** Aim the first threshold at about this many times the curves asked for. */
    private static final int HEADROOM = 4;
    /** Curves screened together by every column as measured: a few kilobytes of each column stay in cache. */
    private static final int BLOCK = 2_048;
    private static final int PLAIN_TOP = OdCode.LEVEL_MASK; // 0x7FFF: every level a code without the bound bit can hold
    private static final int BOUND_TOP = OdCode.MAX_LEVEL;

    private final SpectralStore store;
    private final SearchPlan plan;
    private final boolean everyCurveAdmitted;
    /** The probe whose column is read first. */
    private int probe = -1;
    /** Kept curves (in curve order) and their bounds, for the last threshold read. */
    private int[] kept = new int[0];
    private int[] keptBound = new int[0];
    private int keptCount;
    private int threshold = Integer.MAX_VALUE;
    private final boolean asMeasured;
    private final boolean gatherOtherColumns;
    private final boolean screenByLevels;
    /** Every one-column probe's levels at {@link #filtersT} (null elsewhere): worked out once per threshold. */
    private Filter[] filters;
    private int filtersT;
    /** Over a thickness range (null otherwise): the points-only model's kind of bound is read. */
    private final CurveModel rangeModel;
    /** The caller thread's scratch space for bounds; each half of the column has its own. */
    private final BoundScratch scratch;
    /** Each point probe's side (pass or block) and threshold OD, read per curve by the joint cap. */
    private final boolean[] probePass;
    private final double[] probeThresholdOd;
    /** The thickest a curve can be judged at over the asked range (max + 2·tolerance), or NaN. */
    private final double highestMm;

    ColumnFirstScan(SpectralStore store, SearchPlan plan) {
        this(store, plan, false);
    }

    /**
     * {@code gatherOtherColumns}: as measured, screen by the chosen column alone and thin its survivors by
     * the other columns gathered per curve (the pass before the block screen); for the benchmark's side by
     * side only, same answers.
     */
    ColumnFirstScan(SpectralStore store, SearchPlan plan, boolean gatherOtherColumns) {
        this(store, plan, gatherOtherColumns, true);
    }

    /**
     * {@code screenByLevels}: over a range, screen every curve by {@link RangeLevelScreen} before its exact
     * caps; false gives every curve the exact caps, as the pass before the screen (the benchmark's side by
     * side only, same answers).
     */
    ColumnFirstScan(SpectralStore store, SearchPlan plan, boolean gatherOtherColumns, boolean screenByLevels) {
        this.screenByLevels = screenByLevels;
        this.gatherOtherColumns = gatherOtherColumns;
        this.store = store;
        this.plan = plan;
        this.everyCurveAdmitted = plan.totalGeometry == null && plan.materialClass == null;
        this.asMeasured = plan.thickness.kind() == ThicknessSpec.Kind.AS_MEASURED;
        this.rangeModel = plan.thickness.kind() == ThicknessSpec.Kind.RANGE ? new CurveModel(plan, store, true) : null;
        this.scratch = new BoundScratch();
        int probes = plan.pointProbes.size();
        this.probePass = new boolean[probes];
        this.probeThresholdOd = new double[probes];
        for (int k = 0; k < probes; k++) {
            probePass[k] = plan.pointProbes.get(k).pass();
            probeThresholdOd[k] = plan.pointProbes.get(k).thresholdOd();
        }
        double hi = plan.thickness.maxMm();
        this.highestMm = asMeasured ? Double.NaN : hi + 2 * NominalThickness.toleranceMm(hi);
    }

    /**
     * One thread's space for working out bounds ({@link #boundOf}): the points-only model over a range and the
     * decoded probes. The two halves of the column each take their own, so their bounds are worked out
     * side by side.
     */
    private final class BoundScratch {
        final CurveModel model = rangeModel != null ? new CurveModel(plan, store, true) : null;
        final double[] probeOd = new double[plan.pointProbes.size()];
        final byte[] probeState = new byte[plan.pointProbes.size()];
    }

    /** At least one probe reads one column (a grid point): as measured, at an asked thickness or over a range. */
    static boolean applies(SearchPlan plan) {
        return oneColumnProbes(plan) > 0;
    }

    private static int oneColumnProbes(SearchPlan plan) {
        int count = 0;
        for (PointProbe p : plan.pointProbes) {
            if (p.probe().onGrid() && p.probe().fractionHi() == 0) {
                count++;
            }
        }
        return count;
    }

    /** How many curves the filters admit (every curve, when there are no filters). */
    int eligibleCount() {
        if (everyCurveAdmitted) {
            return store.size();
        }
        int count = 0;
        for (int c = 0; c < store.size(); c++) {
            if (plan.admits(store, c)) {
                count++;
            }
        }
        return count;
    }

    /**
     * The {@code count} admitted curves with the highest bounds (higher bound, then lower index), as the
     * full scan finds them; null when the column cannot settle it (the caller scans every curve).
     */
    int[] best(int count) {
        int n = store.size();
        // with a thickness each sampled bound costs a span and a thickness model: a smaller sample
        int stride = Math.max(1, n / (asMeasured ? SAMPLE : SAMPLE_WITH_THICKNESS));
        // one curve in stride, taken as runs of SAMPLE_RUN neighbours: each run reads a few whole cache lines
        // of a column (and its curves' materials once), where single curves read one line per curve and column
        long runStep = (long) stride * SAMPLE_RUN;
        int[] sampled = new int[(int) Math.min(n, (n + runStep - 1) / runStep * SAMPLE_RUN)];
        int sampledCount = 0;
        for (long start = 0; start < n; start += runStep) {
            for (int c = (int) start; c < Math.min(n, start + SAMPLE_RUN); c++) {
                if (counted(c) && plan.judged(c)) {
                    sampled[sampledCount++] = c;
                }
            }
        }
        int[] sampledBound = new int[sampledCount];
        for (int i = 0; i < sampledCount; i++) {
            sampledBound[i] = boundOf(sampled[i]);
        }
        int[] sorted = Arrays.copyOf(sampledBound, sampledCount);
        Arrays.sort(sorted);
        int rank = Math.max(1, (int) Math.min(sampledCount, (long) HEADROOM * count / stride + 1));
        for (int attempt = 0; attempt < 4 && sampledCount > 0; attempt++) {
            int t = sorted[sampledCount - rank];
            if (probe < 0) {
                probe = mostSelective(sampled, sampledCount, t);
            }
            keep(t);
            if (keptCount >= count && kthHighest(keptBound, keptCount, count) >= t) {
                StoreSearch.TopBounds top = new StoreSearch.TopBounds(count);
                for (int i = 0; i < keptCount; i++) {
                    top.offer(((long) keptBound[i] << 32) | (0xFFFFFFFFL & ~kept[i]));
                }
                return top.curves();
            }
            if (rank == sampledCount) {
                break;
            }
            rank = (int) Math.min(sampledCount, (long) rank * 8);
        }
        return null;
    }

    /** The admitted curves whose bound reaches {@code cut}, in curve order (after {@link #best}). */
    int[] reaching(int cut) {
        return reaching(cut, (curve, bound) -> true);
    }

    /** As {@link #reaching(int)}, keeping only the curves whose bound also passes {@code test}. */
    int[] reaching(int cut, StoreSearch.BoundTest test) {
        if (cut < threshold) {
            keep(cut);
        }
        int[] found = new int[keptCount];
        int count = 0;
        for (int i = 0; i < keptCount; i++) {
            if (keptBound[i] >= cut && test.passes(kept[i], keptBound[i])) {
                found[count++] = kept[i];
            }
        }
        return Arrays.copyOf(found, count);
    }

    /**
     * Every one-column probe's levels at t, by probe index (null for other probes). Each is two binary
     * searches over the key of a code, so they are worked out once per threshold and shared by the probe's
     * choice and both halves of the column, before those halves start.
     */
    private Filter[] filtersAt(int t) {
        if (filters == null || filtersT != t) {
            Filter[] at = new Filter[plan.pointProbes.size()];
            for (int k : oneColumnProbeIndices()) {
                // the gathered pass (benchmark only) reads the chosen column alone by levels, as it did
                if (!gatherOtherColumns || k == probe) {
                    at[k] = new Filter(plan.pointProbes.get(k), t);
                }
            }
            filters = at;
            filtersT = t;
        }
        return filters;
    }

    /** The one-column probe that keeps the fewest sampled curves at cap threshold t. */
    private int mostSelective(int[] sampled, int sampledCount, int t) {
        int bestProbe = -1;
        int fewest = Integer.MAX_VALUE;
        for (int k = 0; k < plan.pointProbes.size(); k++) {
            PointProbe p = plan.pointProbes.get(k);
            if (!p.probe().onGrid() || p.probe().fractionHi() != 0) {
                continue;
            }
            short[] column = store.column(p.probe().lo());
            int keptHere = 0;
            if (asMeasured && !gatherOtherColumns) {
                // the integer levels firstColumn reads with (exactly "cap ≥ t"), not a margin per curve
                Filter filter = filtersAt(t)[k];
                for (int i = 0; i < sampledCount; i++) {
                    if (filter.keeps(column[sampled[i]])) {
                        keptHere++;
                    }
                }
            } else {
                Reach reach = new Reach(k, t);
                for (int i = 0; i < sampledCount; i++) {
                    if (reach.keeps(sampled[i], column[sampled[i]])) {
                        keptHere++;
                    }
                }
            }
            if (keptHere < fewest) {
                fewest = keptHere;
                bestProbe = k;
            }
        }
        return bestProbe;
    }

    /** Reads the chosen column once: every admitted curve whose cap reaches t, with its bound. */
    private void keep(int t) {
        if (gatherOtherColumns) {
            keepGathering(t);
            return;
        }
        int n = store.size();
        if (asMeasured) {
            filtersAt(t); // before the halves start: they only read it
        }
        Kept[] parts;
        if (n >= plan.parallelMinCurves) {
            // the two halves of the column on two threads, each with the bounds of what it keeps (its own
            // scratch space), joined in curve order: the same curves and bounds as one thread in one pass
            int half = n / 2;
            parts = new Kept[2];
            java.util.stream.IntStream.range(0, 2).parallel().forEach(h -> parts[h] = h == 0
                    ? keptWithBounds(t, 0, half, scratch) : keptWithBounds(t, half, n, new BoundScratch()));
        } else {
            parts = new Kept[] {keptWithBounds(t, 0, n, scratch)};
        }
        int count = 0;
        for (Kept part : parts) {
            count += part.count;
        }
        int[] curves = new int[count];
        int[] bounds = new int[count];
        int at = 0;
        for (Kept part : parts) {
            System.arraycopy(part.curves, 0, curves, at, part.count);
            System.arraycopy(part.bounds, 0, bounds, at, part.count);
            at += part.count;
        }
        kept = curves;
        keptBound = bounds;
        keptCount = count;
        threshold = t;
    }

    /** Admitted, judged curves of one part of the column whose caps reach t, in curve order, with their bounds. */
    private record Kept(int[] curves, int[] bounds, int count) {
    }

    private Kept keptWithBounds(int t, int from, int to, BoundScratch own) {
        int[] part = firstColumn(t, from, to);
        int count = part[0];
        int[] curves = new int[count];
        int[] bounds = new int[count];
        int admitted = 0;
        for (int i = 1; i <= count; i++) {
            int c = part[i];
            if (counted(c) && plan.judged(c)) {
                curves[admitted] = c;
                bounds[admitted++] = boundOf(c, own);
            }
        }
        return new Kept(curves, bounds, admitted);
    }

    /**
     * The pass before the block screen (benchmark only, as measured): the chosen column on two threads, its
     * survivors thinned by the other columns gathered per curve and compared as margins, bounds on the
     * caller's thread.
     */
    private void keepGathering(int t) {
        int n = store.size();
        int[] curves;
        int count;
        if (n >= plan.parallelMinCurves) {
            int half = n / 2;
            int[][] parts = new int[2][];
            java.util.stream.IntStream.range(0, 2).parallel()
                    .forEach(h -> parts[h] = firstColumn(t, h == 0 ? 0 : half, h == 0 ? half : n));
            count = parts[0][0] + parts[1][0];
            curves = new int[Math.max(16, count)];
            System.arraycopy(parts[0], 1, curves, 0, parts[0][0]);
            System.arraycopy(parts[1], 1, curves, parts[0][0], parts[1][0]);
        } else {
            int[] part = firstColumn(t, 0, n);
            count = part[0];
            curves = Arrays.copyOfRange(part, 1, Math.max(17, count + 1));
        }
        // the bound is at most every one-column probe's cap: the other columns rule out more, read only here
        // (as measured firstColumn has already read them, block by block)
        for (int k = 0; k < plan.pointProbes.size(); k++) {
            PointProbe other = plan.pointProbes.get(k);
            if (k == probe || rangeModel != null || !other.probe().onGrid() || other.probe().fractionHi() != 0) {
                continue;
            }
            Reach reach = new Reach(k, t);
            short[] otherColumn = store.column(other.probe().lo());
            int left = 0;
            for (int i = 0; i < count; i++) {
                if (reach.keeps(curves[i], otherColumn[curves[i]])) {
                    curves[left++] = curves[i];
                }
            }
            count = left;
        }
        int[] bounds = new int[count];
        int admitted = 0;
        for (int i = 0; i < count; i++) {
            int c = curves[i];
            if (counted(c) && plan.judged(c)) {
                curves[admitted] = c;
                bounds[admitted++] = boundOf(c);
            }
        }
        kept = curves;
        keptBound = bounds;
        keptCount = admitted;
        threshold = t;
    }

    /** Admitted by the filters (the first pass's count). */
    private boolean counted(int curve) {
        return everyCurveAdmitted || plan.admits(store, curve);
    }

    /**
     * The curves in [from, to) whose cap from every one-column probe reaches t, in curve order: element 0 is
     * the count, the curves follow. As measured the loops compare codes only ({@link Filter}, block by block);
     * with a thickness each curve's cap takes its thickness model ({@link Reach}), and over a range the joint
     * cap of every one-column probe follows ({@link #jointCapOverRange}).
     */
    private int[] firstColumn(int t, int from, int to) {
        PointProbe p = plan.pointProbes.get(probe);
        short[] column = store.column(p.probe().lo());
        int[] curves = new int[64];
        int count = 0;
        if (!asMeasured) {
            int[] probes = oneColumnProbeIndices();
            short[][] columns = new short[probes.length][];
            for (int i = 0; i < probes.length; i++) {
                columns[i] = store.column(plan.pointProbes.get(probes[i]).probe().lo());
            }
            // the chosen column first (it keeps the fewest), then each other one-column probe's cap alone (a
            // few operations, the curve left at the first that falls below t), and over a range every
            // one-column probe together, only for the curves all of them keep: the bound is at most each cap
            Reach[] reaches = new Reach[probes.length];
            short[][] otherColumns = new short[probes.length][];
            int others = 0;
            for (int i = 0; i < probes.length; i++) {
                if (probes[i] != probe) {
                    reaches[others] = new Reach(probes[i], t);
                    otherColumns[others++] = columns[i];
                }
            }
            Reach reach = new Reach(probe, t);
            ThicknessClasses classes = rangeModel != null && screenByLevels ? store.thicknessClasses() : null;
            if (classes != null) {
                return overRangeByLevels(t, from, to, probes, columns, reach, reaches, otherColumns, others, classes);
            }
            for (int c = from; c < to; c++) {
                if (!reach.keeps(c, column[c])) {
                    continue;
                }
                boolean kept = true;
                for (int i = 0; i < others && kept; i++) {
                    kept = reaches[i].keeps(c, otherColumns[i][c]);
                }
                if (kept && (rangeModel == null || jointCapOverRange(c, probes, columns) >= t)) {
                    if (count + 1 == curves.length) {
                        curves = Arrays.copyOf(curves, curves.length * 2);
                    }
                    curves[++count] = c;
                }
            }
            curves[0] = count;
            return curves;
        }
        return everyColumnByBlocks(t, from, to);
    }

    /**
     * Over a range: the same curves as the exact caps keep (element 0 is the count), the exact caps worked out
     * only for the curves every one-column probe's {@link RangeLevelScreen} keeps. A screen keeps every curve its
     * probe's exact cap keeps, so the curves it drops would have been dropped by that cap; the survivors then
     * take the exact caps and the joint cap in the order of before, so what is kept is exactly what was kept.
     * Block by block: the chosen column's screen writes every curve and advances past the kept ones, and the
     * other columns thin the block, each read for a few kilobytes at a time.
     */
    private int[] overRangeByLevels(int t, int from, int to, int[] probes, short[][] columns, Reach reach,
                                    Reach[] reaches, short[][] otherColumns, int others, ThicknessClasses classes) {
        RangeLevelScreen[] screens = new RangeLevelScreen[others + 1];
        screens[0] = screenOf(probe, t, classes);
        for (int i = 0; i < others; i++) {
            screens[i + 1] = screenOf(reaches[i].k, t, classes);
        }
        short[] classOf = classes.classOfCurve();
        short[] column = store.column(plan.pointProbes.get(probe).probe().lo());
        int[] curves = new int[64];
        int count = 0;
        int[] block = new int[BLOCK];
        for (int start = from; start < to; start += BLOCK) {
            int end = Math.min(to, start + BLOCK);
            int left = 0;
            RangeLevelScreen first = screens[0];
            for (int c = start; c < end; c++) {
                block[left] = c;
                left += first.keeps(column[c], classOf[c]) ? 1 : 0;
            }
            for (int i = 0; i < others && left > 0; i++) {
                RangeLevelScreen screen = screens[i + 1];
                short[] other = otherColumns[i];
                int kept = 0;
                for (int j = 0; j < left; j++) {
                    int c = block[j];
                    block[kept] = c;
                    kept += screen.keeps(other[c], classOf[c]) ? 1 : 0;
                }
                left = kept;
            }
            for (int j = 0; j < left; j++) {
                int c = block[j];
                boolean kept = reach.keeps(c, column[c]);
                for (int i = 0; i < others && kept; i++) {
                    kept = reaches[i].keeps(c, otherColumns[i][c]);
                }
                if (kept && jointCapOverRange(c, probes, columns) >= t) {
                    if (count + 1 == curves.length) {
                        curves = Arrays.copyOf(curves, curves.length * 2);
                    }
                    curves[++count] = c;
                }
            }
        }
        curves[0] = count;
        return curves;
    }

    /** Probe k's screen over the asked range at threshold t. */
    RangeLevelScreen screenOf(int k, int t, ThicknessClasses classes) {
        return new RangeLevelScreen(plan.pointProbes.get(k), k, t, plan.pointProbeLoss, plan.pointProbeUnresolvedOd,
                plan.thickness.minMm(), highestMm, classes);
    }

    /**
     * As measured: the curves in [from, to) whose cap reaches t in every one-column probe, block by block
     * (element 0 is the count). The chosen column screens a block of {@link #BLOCK} curves by its two integer
     * levels; the survivors are thinned by each other column's levels read in the same block, so every
     * column is read in order (a few kilobytes at a time) and compared as shorts, instead of gathered per
     * kept curve and compared as margins. {@link Filter} keeps exactly "cap ≥ t"; the bound is at most each
     * cap, so no curve whose bound reaches t is dropped (the curves dropped here and kept by {@link Reach}'s
     * looser margin test have bounds below t, which never enter the best or the candidates).
     */
    private int[] everyColumnByBlocks(int t, int from, int to) {
        int[] probes = oneColumnProbeIndices();
        Filter[] filters = new Filter[probes.length];
        short[][] columns = new short[probes.length][];
        // the chosen probe first: it keeps the fewest, so the other columns are read for few curves
        Filter[] at = filtersAt(t);
        filters[0] = at[probe];
        columns[0] = store.column(plan.pointProbes.get(probe).probe().lo());
        int f = 1;
        for (int k : probes) {
            if (k != probe && !gatherOtherColumns) {
                filters[f] = at[k];
                columns[f++] = store.column(plan.pointProbes.get(k).probe().lo());
            }
        }
        int[] curves = new int[64];
        int count = 0;
        int[] block = new int[BLOCK];
        for (int start = from; start < to; start += BLOCK) {
            int end = Math.min(to, start + BLOCK);
            int left = filters[0].keepInto(columns[0], start, end, block);
            for (int i = 1; i < f && left > 0; i++) {
                left = filters[i].thin(columns[i], block, left);
            }
            if (count + 1 + left > curves.length) {
                curves = Arrays.copyOf(curves, Math.max(curves.length * 2, count + 1 + left));
            }
            System.arraycopy(block, 0, curves, count + 1, left);
            count += left;
        }
        curves[0] = count;
        return curves;
    }

    private static int kthHighest(int[] values, int count, int k) {
        int[] copy = Arrays.copyOf(values, count);
        Arrays.sort(copy);
        return copy[count - k];
    }

    /**
     * A curve's bound, by the chunk scan's rules for one curve, probe by probe in the same order: as measured
     * and at an asked thickness those of {@code scanChunk} and {@code settleBounds}, over a range the
     * points-only thickness model of {@code boundChunk}.
     */
    int boundOf(int curve) {
        return boundOf(curve, scratch);
    }

    private int boundOf(int curve, BoundScratch own) {
        if (rangeModel != null) {
            return boundOverRange(curve, own);
        }
        double target = plan.thickness.minMm();
        boolean fixed = plan.thickness.kind() == ThicknessSpec.Kind.FIXED;
        if (fixed && !plan.judgeableAt(store, curve, target)) {
            return StoreSearch.Keys.of(Standing.NOT_JUDGED, Double.NaN);
        }
        boolean rescaled = fixed && plan.rescaledAt(store, curve);
        int bits = 0;
        double lowest = Double.POSITIVE_INFINITY;
        double lowestMiss = Double.POSITIVE_INFINITY;
        for (int k = 0; k < plan.pointProbes.size(); k++) {
            PointProbe p = plan.pointProbes.get(k);
            Probe probe = p.probe();
            if (!probe.onGrid()) {
                bits |= ProbeVerdict.UNVERIFIED;
                continue;
            }
            short a = store.column(probe.lo())[curve];
            short b = store.column(probe.hi())[curve];
            if (a == OdCode.NOT_MEASURED || b == OdCode.NOT_MEASURED) {
                bits |= ProbeVerdict.UNVERIFIED;
                continue;
            }
            double f = probe.fractionHi();
            // the decoder's value; with f = 0 it is level·STEP, the on-grid loop's value, to the bit
            double value = ((1 - f) * (a & OdCode.LEVEL_MASK) + f * (b & OdCode.LEVEL_MASK)) * OdCode.STEP;
            boolean isBound = (a & OdCode.BOUND_BIT) != 0 || (f > 0 && (b & OdCode.BOUND_BIT) != 0);
            if (rescaled) {
                // marginsDecoded's rule for a curve read rescaled to the asked thickness, the same doubles
                int model = store.indexModelOf(curve);
                double s = plan.pointProbeLoss[model][k];
                if (value <= plan.pointProbeUnresolvedOd[model][k]) {
                    double d0 = store.thicknessMm(curve);
                    isBound |= target > d0 && target > SearchPlan.farMm(value, s, d0);
                } else {
                    value = s + Math.max(0, value - s) * target / store.thicknessMm(curve);
                }
            }
            double margin = p.pass() ? p.thresholdOd() - value : value - p.thresholdOd();
            lowest = Math.min(lowest, margin);
            int verdict = ProbeVerdict.of(margin, isBound, p.pass());
            bits |= verdict;
            if (verdict == ProbeVerdict.MISSES) {
                lowestMiss = Math.min(lowestMiss, margin);
            }
        }
        Verdict verdict = ProbeVerdict.combine(bits);
        if (verdict == Verdict.MISSES) {
            return StoreSearch.Keys.of(Standing.MISSES, lowestMiss);
        }
        double worst = lowest == Double.POSITIVE_INFINITY ? Double.NaN : lowest;
        return StoreSearch.Keys.of(verdict == Verdict.MEETS ? Standing.MEETS : Standing.UNVERIFIED, worst);
    }

    /** Over a thickness range: the probes decoded as {@code decode} does, then the points-only model's best key. */
    private int boundOverRange(int curve, BoundScratch own) {
        double[] probeOd = own.probeOd;
        byte[] probeState = own.probeState;
        for (int k = 0; k < plan.pointProbes.size(); k++) {
            Probe p = plan.pointProbes.get(k).probe();
            if (!p.onGrid()) {
                probeState[k] = CurveModel.UNMEASURED;
                continue;
            }
            short a = store.column(p.lo())[curve];
            short b = store.column(p.hi())[curve];
            if (a == OdCode.NOT_MEASURED || b == OdCode.NOT_MEASURED) {
                probeState[k] = CurveModel.UNMEASURED;
                continue;
            }
            double f = p.fractionHi();
            probeOd[k] = ((1 - f) * (a & OdCode.LEVEL_MASK) + f * (b & OdCode.LEVEL_MASK)) * OdCode.STEP;
            boolean isBound = (a & OdCode.BOUND_BIT) != 0 || (f > 0 && (b & OdCode.BOUND_BIT) != 0);
            probeState[k] = isBound ? CurveModel.BOUND : CurveModel.READ;
        }
        return own.model.loadDecoded(curve, probeOd, probeState).bestKey();
    }

    /** The point probes that read one column (a grid point), in the plan's order. */
    int[] oneColumnProbeIndices() {
        int[] out = new int[plan.pointProbes.size()];
        int count = 0;
        for (int k = 0; k < plan.pointProbes.size(); k++) {
            Probe p = plan.pointProbes.get(k).probe();
            if (p.onGrid() && p.fractionHi() == 0) {
                out[count++] = k;
            }
        }
        return Arrays.copyOf(out, count);
    }

    /**
     * Over a thickness range: a cap on the curve's bound from every one-column probe together. Each probe's
     * margin is CurveModel's line in d (the same doubles); the curve is judged at one d in
     * [min, max + 2·tolerance] (see {@link #marginCap}).
     * <ul>
     *   <li>If no d there lets every one of these probes escape a miss (pass lines fall below 0 after their
     *       root, block lines rise above it after theirs; a block on a stored bound or on a clear reading,
     *       which may turn into a bound, is never counted as a miss), the bound is a miss, whose margin in the
     *       points-only model is the least over its lines of the line's larger end on [min, max] (films: the
     *       least missing margin): at most that least over these probes' lines, the same expression on
     *       fewer lines.</li>
     *   <li>Otherwise the cap is "meets" with the least over these lines of each line's highest value on the
     *       thicknesses above: the worst margin at any d is at most each line's value there.</li>
     * </ul>
     * The roots are widened by 1e-6 mm, so rounding can only keep more curves. {@link #KEEP_ALL} when the
     * curve's thickness is unknown.
     */
    int jointCapOverRange(int curve, int[] probes, short[][] columns) {
        boolean bulk = store.isBulk(curve);
        double d0 = store.thicknessMm(curve);
        if (bulk && (!(d0 > 0) || Double.isInfinite(d0))) {
            return KEEP_ALL;
        }
        ThicknessSpec spec = plan.thickness;
        double lo = spec.minMm();
        double hi = spec.maxMm();
        double highest = highestMm;
        int model = store.indexModelOf(curve);
        double[] loss = plan.pointProbeLoss[model];
        double[] unresolved = plan.pointProbeUnresolvedOd[model];
        double feasibleLo = lo;
        double feasibleHi = highest;
        boolean never = false;
        double missCap = Double.POSITIVE_INFINITY;
        double meetCap = Double.POSITIVE_INFINITY;
        for (int i = 0; i < probes.length; i++) {
            short code = columns[i][curve];
            if (code == OdCode.NOT_MEASURED) {
                continue; // unverified, no line: it neither misses nor lowers a margin
            }
            int k = probes[i];
            boolean pass = probePass[k];
            boolean stored = (code & OdCode.BOUND_BIT) != 0;
            double value = (code & OdCode.LEVEL_MASK) * OdCode.STEP;
            // CurveModel.addDecoded's line
            double s = loss[k];
            boolean clear = bulk && value <= unresolved[k];
            double internal = Math.max(0, value - s);
            double perMm = bulk && !clear ? internal / d0 : 0;
            double base = bulk && !clear ? s : value;
            double intercept = pass ? probeThresholdOd[k] - base : base - probeThresholdOd[k];
            double slope = pass ? -perMm : perMm;
            if (!(stored && !pass)) {
                missCap = Math.min(missCap, Math.max(intercept + slope * lo, intercept + slope * hi));
            }
            meetCap = Math.min(meetCap, intercept + slope * (pass ? lo : highest));
            if (!pass && (stored || clear)) {
                continue; // a block on a bound is unverified, never a miss
            }
            if (slope == 0) {
                never |= intercept < 0;
            } else if (pass) {
                feasibleHi = Math.min(feasibleHi, -intercept / slope + 1e-6);
            } else {
                feasibleLo = Math.max(feasibleLo, -intercept / slope - 1e-6);
            }
        }
        if (!never && feasibleLo <= feasibleHi) {
            return StoreSearch.Keys.of(Standing.MEETS, meetCap);
        }
        return StoreSearch.Keys.of(Standing.MISSES, missCap);
    }

    /** {@link #jointCapOverRange}'s answer when it works out no cap: above every key. */
    static final int KEEP_ALL = Integer.MAX_VALUE;

    /**
     * "The curve's cap from one probe's code reaches t", for any thickness: as measured {@link #capOf}; at an
     * asked thickness and over a range a cap that holds for every thickness the curve can be judged at
     * ({@link #marginCap}). Compared as a margin against the least margin that reaches t in the cap's group
     * ({@link #leastMargin}), loosened by far less than a key step, so it keeps at least what the key keeps.
     */
    final class Reach {
        private final PointProbe p;
        final int k;
        /** Least margin per group (MEETS, UNVERIFIED, MISSES) whose key reaches t. */
        private final double[] least = new double[3];

        Reach(int k, int t) {
            this.k = k;
            this.p = plan.pointProbes.get(k);
            for (int g = 0; g < least.length; g++) {
                least[g] = leastMargin(Standing.values()[g], t);
            }
        }

        boolean keeps(int curve, short code) {
            long cap = marginCap(p, k, curve, code);
            if (cap == KEEP) {
                return true;
            }
            return Double.longBitsToDouble(cap >>> 2 << 2) >= least[(int) (cap & 3)];
        }
    }

    /** {@link #marginCap}'s answer when no cap is worked out (the curve is kept). */
    static final long KEEP = Long.MIN_VALUE + 1;

    /**
     * One probe's cap on a curve's bound, as a margin and its group (0 meets, 1 unverified, 2 misses) packed
     * as the margin's bits with the group in the two lowest bits (truncating the margin there only lowers it
     * by under 1e-15 of itself; {@link Reach} compares with a slack far above that), or {@link #KEEP}.
     *
     * <p>Why it is a cap on the bound (the chunk scan's rules): the curve's bound is at most this probe's
     * group and margin at the thickness d the curve is judged at (its worst margin is the smallest over the
     * probes; a missing probe makes it a miss no better than that margin). At one asked thickness d is that
     * thickness for a curve read rescaled, and the margin is the rescaled one (a clear reading may turn into a
     * bound beyond its far thickness: for a pass that only lowers the group, so it is left out; for a block it
     * turns a miss into unverified, so it is assumed whenever d is above the measured thickness). Over a
     * range, a bulk curve's margin is a straight line in d (pass: falling, block: rising) and d lies in
     * [min, max + 2·tolerance] (the made range may start just beyond the asked end, {@code MadeThicknesses.within}):
     * the cap takes the line at the end where it is highest, which also bounds the points-only model's miss
     * margin (the line's larger end over [min, max]); a curve not read through the thickness model (films,
     * coatings) is read as measured.
     */
    long marginCap(PointProbe p, int k, int curve, short code) {
        if (code == OdCode.NOT_MEASURED) {
            return pack(Double.POSITIVE_INFINITY, 1);
        }
        boolean pass = p.pass();
        boolean stored = (code & OdCode.BOUND_BIT) != 0;
        double value = (code & OdCode.LEVEL_MASK) * OdCode.STEP;
        ThicknessSpec spec = plan.thickness;
        if (spec.kind() == ThicknessSpec.Kind.AS_MEASURED || !store.isBulk(curve)
                || (spec.kind() == ThicknessSpec.Kind.FIXED && !plan.rescaledAt(store, curve))) {
            double margin = pass ? p.thresholdOd() - value : value - p.thresholdOd();
            return pack(margin, group(ProbeVerdict.of(margin, stored, pass)));
        }
        double d0 = store.thicknessMm(curve);
        if (!(d0 > 0) || Double.isInfinite(d0)) {
            return KEEP;
        }
        int model = store.indexModelOf(curve);
        double s = plan.pointProbeLoss[model][k];
        boolean clear = value <= plan.pointProbeUnresolvedOd[model][k];
        if (spec.kind() == ThicknessSpec.Kind.FIXED) {
            double target = spec.minMm();
            boolean mayTurnBound = clear && target > d0;
            if (!clear) {
                value = s + Math.max(0, value - s) * target / d0;
            }
            double margin = pass ? p.thresholdOd() - value : value - p.thresholdOd();
            return pack(margin, group(ProbeVerdict.of(margin, stored || (!pass && mayTurnBound), pass)));
        }
        // over a range: CurveModel.addDecoded's line, margin = intercept + slope·d
        double internal = Math.max(0, value - s);
        double perMm = !clear ? internal / d0 : 0;
        double base = !clear ? s : value;
        if (pass) {
            double margin = (p.thresholdOd() - base) + (-perMm) * spec.minMm();
            return pack(margin, margin < 0 ? 2 : stored ? 1 : 0);
        }
        double margin = (base - p.thresholdOd()) + perMm * highestMm;
        return pack(margin, margin >= 0 ? 0 : stored || clear ? 1 : 2);
    }

    private static long pack(double margin, int group) {
        return (Double.doubleToRawLongBits(margin) >>> 2 << 2) | group;
    }

    private static int group(int verdict) {
        return verdict == ProbeVerdict.MISSES ? 2 : verdict == ProbeVerdict.UNVERIFIED ? 1 : 0;
    }

    /**
     * The least margin whose key in {@code standing}'s group reaches t ({@link StoreSearch.Keys}: floor of the
     * margin in 1e-4 decades), less 1e-6 decades so that rounding never drops a curve; −∞ when the whole
     * group reaches t, +∞ when none of it does.
     */
    static double leastMargin(Standing standing, int t) {
        int top = StoreSearch.Keys.of(standing, Double.POSITIVE_INFINITY);
        int bottom = StoreSearch.Keys.of(standing, Double.NaN);
        if (bottom >= t) {
            return Double.NEGATIVE_INFINITY;
        }
        if (top < t) {
            return Double.POSITIVE_INFINITY;
        }
        long steps = (long) t - StoreSearch.Keys.of(standing, 0.0);
        return steps * 1e-4 - 1e-6;
    }

    /**
     * The highest bound a curve can have given one probe's code alone (see the class comment); for a code
     * "not measured" the probe is unverified with no margin of its own.
     */
    static int capOf(PointProbe p, int code) {
        if ((short) code == OdCode.NOT_MEASURED) {
            return StoreSearch.Keys.of(Standing.UNVERIFIED, Double.POSITIVE_INFINITY);
        }
        double value = (code & OdCode.LEVEL_MASK) * OdCode.STEP;
        double margin = p.pass() ? p.thresholdOd() - value : value - p.thresholdOd();
        int verdict = ProbeVerdict.of(margin, (code & OdCode.BOUND_BIT) != 0, p.pass());
        Standing standing = verdict == ProbeVerdict.MISSES ? Standing.MISSES
                : verdict == ProbeVerdict.UNVERIFIED ? Standing.UNVERIFIED : Standing.MEETS;
        return StoreSearch.Keys.of(standing, margin);
    }

    /**
     * "Cap at least t" as levels: for a pass the cap falls as the level rises, so the kept levels are those at
     * most a limit (−1: none); for a block it rises, so they are those at least a limit (above the top: none).
     */
    static final class Filter {
        final int plainLimit;
        final int boundLimit;
        final boolean notMeasured;
        private final boolean pass;
        /**
         * {@link #keeps} for every one of the 65,536 codes, one bit each (8 KB, in the first-level cache): the
         * block loops test a code by a load, a shift and a mask, with no branch on the code. A third of the
         * codes pass a typical first column at random, so the branches of the comparison were mispredicted
         * about as often as not (JFR profile, docs/store-scan.md).
         */
        private final long[] keptCodes = new long[1 << 10];

        Filter(PointProbe p, int t) {
            pass = p.pass();
            plainLimit = limit(p, t, 0, PLAIN_TOP);
            boundLimit = limit(p, t, OdCode.BOUND_BIT, BOUND_TOP);
            notMeasured = capOf(p, OdCode.NOT_MEASURED & 0xFFFF) >= t;
            // the same comparisons as keeps, as ranges of codes: plain codes 0..0x7FFF, bounds 0x8000..0xFFFE
            if (pass) {
                setCodes(0, Math.min(plainLimit, PLAIN_TOP));
                setCodes(OdCode.BOUND_BIT, OdCode.BOUND_BIT + Math.min(boundLimit, 0x7FFE));
            } else {
                setCodes(Math.max(plainLimit, 0), PLAIN_TOP);
                setCodes(OdCode.BOUND_BIT + Math.max(boundLimit, 0), 0xFFFE);
            }
            if (notMeasured) {
                setCodes(0xFFFF, 0xFFFF);
            }
        }

        /** Marks the codes from {@code first} to {@code last} (both included; none when last < first) as kept. */
        private void setCodes(int first, int last) {
            if (last < first) {
                return;
            }
            int firstWord = first >>> 6;
            int lastWord = last >>> 6;
            long fromFirst = -1L << first; // bits (first mod 64) to 63 of the first word
            long toLast = -1L >>> (63 - (last & 63)); // bits 0 to (last mod 64) of the last word
            if (firstWord == lastWord) {
                keptCodes[firstWord] |= fromFirst & toLast;
                return;
            }
            keptCodes[firstWord] |= fromFirst;
            Arrays.fill(keptCodes, firstWord + 1, lastWord, -1L);
            keptCodes[lastWord] |= toLast;
        }

        /** {@link #keeps} read from the table of codes: 1 when kept, 0 otherwise. */
        int keptBit(short code) {
            int u = code & 0xFFFF;
            return (int) (keptCodes[u >>> 6] >>> u) & 1;
        }

        boolean keeps(short code) {
            int u = code & 0xFFFF;
            if (u == 0xFFFF) {
                return notMeasured;
            }
            int level = u & OdCode.LEVEL_MASK;
            int limit = u < 0x8000 ? plainLimit : boundLimit;
            return pass ? level <= limit : level >= limit;
        }

        /** The curves in [from, to) this filter keeps, written to {@code out} in curve order; their count. */
        int keepInto(short[] column, int from, int to, int[] out) {
            long[] table = keptCodes;
            int count = 0;
            for (int c = from; c < to; c++) {
                int u = column[c] & 0xFFFF;
                // every curve is written; the count moves on only past a kept one (no branch on the code)
                out[count] = c;
                count += (int) (table[u >>> 6] >>> u) & 1;
            }
            return count;
        }

        /** Keeps, in place and in order, the first {@code count} curves of {@code curves} this filter keeps. */
        int thin(short[] column, int[] curves, int count) {
            long[] table = keptCodes;
            int left = 0;
            for (int i = 0; i < count; i++) {
                int c = curves[i];
                int u = column[c] & 0xFFFF;
                curves[left] = c;
                left += (int) (table[u >>> 6] >>> u) & 1;
            }
            return left;
        }

        private static int limit(PointProbe p, int t, int boundBit, int top) {
            if (p.pass()) {
                // largest level whose cap reaches t; caps fall with the level
                int lo = -1;
                int hi = top;
                while (lo < hi) {
                    int mid = (lo + hi + 1) >>> 1;
                    if (capOf(p, boundBit | mid) >= t) {
                        lo = mid;
                    } else {
                        hi = mid - 1;
                    }
                }
                return lo;
            }
            // smallest level whose cap reaches t; caps rise with the level
            int lo = 0;
            int hi = top + 1;
            while (lo < hi) {
                int mid = (lo + hi) >>> 1;
                if (capOf(p, boundBit | mid) >= t) {
                    hi = mid;
                } else {
                    lo = mid + 1;
                }
            }
            return lo;
        }
    }
}
