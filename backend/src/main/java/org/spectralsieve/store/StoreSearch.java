package org.spectralsieve.store;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import java.util.stream.IntStream;
import org.spectralsieve.optics.SlabReading;
import org.spectralsieve.requirement.Clause;
import org.spectralsieve.requirement.RankingOrder;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.Standing;
import org.spectralsieve.requirement.ThicknessSpec;
import org.spectralsieve.requirement.Verdict;

/**
 * Ranks the store's curves against a requirement in two passes.
 *
 * <p>Pass one reads, for every curve, only the point probes (one or two columns per clause) and gets
 * an upper bound on how well the curve can do. Pass two evaluates every probe, but only for curves
 * whose bound could still reach the result: first the best few by bound, then any other whose bound
 * beats the worst row found. The result is the same as evaluating every probe of every curve.
 *
 * <p>Thickness model: the OD of a bulk sample at thickness d is s + a0·d/d0, where s = −2·log10(1 − R)
 * is the loss at the two surfaces and a0 the internal absorbance at the measured thickness d0
 * (Beer–Lambert). This drops the multiple-reflection term of the slab formula, worth at most
 * −log10(1 − R²) (0.0016 decades for n ≤ 1.65); the returned rows are re-evaluated exactly by the caller.
 * The rule for readings at or near the lossless ceiling is the exact model's ({@link SlabReading}): a
 * reading with OD at most that of C − u keeps its own OD at every thickness, and is an upper bound beyond
 * its far thickness d0·{@link SlabReading#farFactor} (see {@link SearchPlan#unresolvedOd}).
 */
public final class StoreSearch {

    /** How many rows beyond the limit pass two evaluates at first, so that the first cut is usually final. */
    private static final int FIRST_CUT_FACTOR = 4;
    /** Curves per task of the first pass: small enough that a chunk's decoded probes stay in cache. */
    private static final int CHUNK = 2048;

    /**
     * Below this many curves a search runs on the caller's thread alone: handing chunks to the common pool
     * costs more than it saves on a demo-sized library (and keeps its answer time free of pool wake-ups).
     */
    static final int PARALLEL_MIN_CURVES = 32_768;

    /**
     * From this many curves on, a search judged as measured reads one column first: below it the chunk scan
     * takes about a millisecond anyway, and the demo library keeps the path it has always taken.
     */
    static final int COLUMN_FIRST_MIN_CURVES = 32_768;

    private final SpectralStore store;
    private final SearchPlan plan;
    /** The path as it was before the scan was reworked (see {@link #searchReference}). */
    private final boolean reference;
    /** Over a range, the column-first pass screens by levels before the exact caps ({@link RangeLevelScreen}). */
    private boolean screenByLevels = true;

    private StoreSearch(SpectralStore store, Requirement requirement, boolean reference) {
        this(store, requirement, reference, PARALLEL_MIN_CURVES);
    }

    private StoreSearch(SpectralStore store, Requirement requirement, boolean reference, int parallelMinCurves) {
        this.store = store;
        this.reference = reference;
        this.plan = SearchPlan.of(store, requirement, reference, parallelMinCurves);
    }

    /**
     * The reworked scan with its own size thresholds for going parallel and for reading one column first
     * ({@link ColumnFirstScan}): lets tests take either path on small stores.
     */
    static StoreResult search(SpectralStore store, Requirement requirement, int limit, int parallelMinCurves,
                              int columnFirstMinCurves) {
        StoreSearch search = new StoreSearch(store, requirement, false, parallelMinCurves);
        search.plan.columnFirstMinCurves = columnFirstMinCurves;
        return search.run(limit, false);
    }

    /**
     * The column-first pass alone ({@link ColumnFirstScan}), null when it cannot settle the best curves and the
     * chunk scan would run instead: lets tests see that the pass itself, not its fallback, gave the answer.
     */
    static StoreResult searchColumnFirstOnly(SpectralStore store, Requirement requirement, int limit,
                                             int parallelMinCurves) {
        StoreSearch search = new StoreSearch(store, requirement, false, parallelMinCurves);
        return ColumnFirstScan.applies(search.plan) ? search.runColumnFirst(limit) : null;
    }

    /** The reworked scan with its own size threshold for going parallel: lets tests split small stores over tasks. */
    static StoreResult search(SpectralStore store, Requirement requirement, int limit, int parallelMinCurves) {
        return new StoreSearch(store, requirement, false, parallelMinCurves).run(limit, false);
    }

    /**
     * Whether the requirement reads the store between two grid wavelengths (a point, a band end or a cutoff edge at
     * a fraction of the grid's step). There the store interpolates its grid readings while the exact evaluator
     * interpolates the curve's own points, and nothing the store holds bounds the difference either way (a band
     * end between grid points mixes in a reading from outside the band), so the pick cannot be made exact at the
     * cut (docs/store.md, "The store's error at the cut"): the service judges such requirements on every sample.
     */
    public static boolean readsBetweenGridPoints(SpectralStore store, Requirement requirement) {
        for (CompiledClause clause : SearchPlan.of(store, requirement, false, PARALLEL_MIN_CURVES).clauses) {
            for (Probe probe : clause.probes()) {
                if (probe.onGrid() && probe.fractionHi() != 0) {
                    return true;
                }
            }
        }
        return false;
    }

    /**
     * Whether a block (an every-point block, or a cutoff's blocking edge) reads a grid wavelength where some curve is
     * held at the code's ceiling (OD 6.55, {@link SpectralStore#anyAtCeiling}). The store's OD there is only a lower
     * bound on the judged one, so its block margin can lie any distance below the exact margin, the opposite of what
     * the cut needs (docs/store.md, "The store's error at the cut"): the service judges such requirements on every
     * sample. A pass over such a reading is safe: the store's margin is then above the exact one.
     */
    public static boolean blocksAtTheCodeCeiling(SpectralStore store, Requirement requirement) {
        // the clauses alone, not a SearchPlan: a plan allocates per-curve span slots for a thickness search
        for (Clause c : requirement.clauses()) {
            CompiledClause clause = CompiledClause.compile(store, c);
            List<Probe> probes = clause.probes();
            List<Probe> blocking = switch (clause.kind()) {
                case EVERY_POINT_BLOCK, MEAN_BLOCK -> probes;
                case CUTOFF -> probes.subList(0, 1);
                default -> List.of();
            };
            for (Probe probe : blocking) {
                if (probe.onGrid() && (store.anyAtCeiling(probe.lo()) || store.anyAtCeiling(probe.hi()))) {
                    return true;
                }
            }
        }
        return false;
    }

    public static StoreResult search(SpectralStore store, Requirement requirement, int limit) {
        if (limit < 1) {
            throw new IllegalArgumentException("limit must be at least 1, got " + limit);
        }
        return new StoreSearch(store, requirement, false).run(limit, false);
    }

    /**
     * The same search by the earlier scan (probes decoded to doubles chunk by chunk, one top-k selection
     * and one candidate sweep on the caller's thread, spans built material by material with streams, far
     * thicknesses recomputed per reading). Kept as the reference the reworked scan must equal
     * ({@code StoreScanEquivalenceTest}) and as the "before" side of {@code SearchBenchmark}.
     */
    public static StoreResult searchReference(SpectralStore store, Requirement requirement, int limit) {
        if (limit < 1) {
            throw new IllegalArgumentException("limit must be at least 1, got " + limit);
        }
        return new StoreSearch(store, requirement, true).run(limit, false);
    }

    /**
     * The reworked scan without reading one column first ({@link ColumnFirstScan}): every curve through the
     * chunk scan, as before that step. For {@code SearchBenchmark}'s side-by-side rows only; same answers.
     */
    public static StoreResult searchByChunks(SpectralStore store, Requirement requirement, int limit) {
        if (limit < 1) {
            throw new IllegalArgumentException("limit must be at least 1, got " + limit);
        }
        return search(store, requirement, limit, PARALLEL_MIN_CURVES, Integer.MAX_VALUE);
    }

    /**
     * The reworked scan with the column-first pass as it was before its block screen (as measured: the other
     * columns gathered per curve the chosen column keeps, compared as margins). For {@code SearchBenchmark}'s
     * side-by-side rows only; same answers.
     */
    public static StoreResult searchGatheringOtherColumns(SpectralStore store, Requirement requirement, int limit) {
        if (limit < 1) {
            throw new IllegalArgumentException("limit must be at least 1, got " + limit);
        }
        StoreSearch search = new StoreSearch(store, requirement, false);
        StoreResult byColumn = store.size() >= search.plan.columnFirstMinCurves && ColumnFirstScan.applies(search.plan)
                ? search.runColumnFirst(limit, true) : null;
        return byColumn != null ? byColumn : search.run(limit, false);
    }

    /**
     * The reworked scan with the column-first pass over a range as it was before its screen by levels
     * ({@link RangeLevelScreen}): every curve's exact caps worked out. For {@code SearchBenchmark}'s side-by-side
     * rows only; same answers.
     */
    public static StoreResult searchWithoutRangeScreen(SpectralStore store, Requirement requirement, int limit) {
        if (limit < 1) {
            throw new IllegalArgumentException("limit must be at least 1, got " + limit);
        }
        return search(store, requirement, limit, PARALLEL_MIN_CURVES, COLUMN_FIRST_MIN_CURVES, false);
    }

    /**
     * The search with the spans worked out on demand as the sixth pass did, from each material's curve array and
     * object rather than the store's flat {@link MaterialTable}. For {@code SearchBenchmark}'s side-by-side rows
     * only; same answers.
     */
    public static StoreResult searchWithSpansByMaterialObjects(SpectralStore store, Requirement requirement, int limit) {
        return search(store, requirement, limit, PARALLEL_MIN_CURVES, COLUMN_FIRST_MIN_CURVES, true, false);
    }

    /**
     * As {@link #search(SpectralStore, Requirement, int, int, int, boolean)}, the spans from the store's flat table
     * or from the material objects ({@code spansByTable}).
     */
    static StoreResult search(SpectralStore store, Requirement requirement, int limit, int parallelMinCurves,
                              int columnFirstMinCurves, boolean screenByLevels, boolean spansByTable) {
        if (limit < 1) {
            throw new IllegalArgumentException("limit must be at least 1, got " + limit);
        }
        StoreSearch search = new StoreSearch(store, requirement, false, parallelMinCurves);
        search.plan.columnFirstMinCurves = columnFirstMinCurves;
        search.screenByLevels = screenByLevels;
        search.plan.spansByTable = spansByTable;
        return search.run(limit, false);
    }

    /** As {@link #search(SpectralStore, Requirement, int, int, int)}, with or without the screen by levels over a range. */
    static StoreResult search(SpectralStore store, Requirement requirement, int limit, int parallelMinCurves,
                              int columnFirstMinCurves, boolean screenByLevels) {
        StoreSearch search = new StoreSearch(store, requirement, false, parallelMinCurves);
        search.plan.columnFirstMinCurves = columnFirstMinCurves;
        search.screenByLevels = screenByLevels;
        return search.run(limit, false);
    }

    /** The same search with every probe of every curve evaluated: the reference the bounded search must equal. */
    static StoreResult searchExhaustively(SpectralStore store, Requirement requirement, int limit) {
        return new StoreSearch(store, requirement, false).run(limit, true);
    }

    private StoreResult run(int limit, boolean exhaustive) {
        return reference ? runReference(limit, exhaustive) : runScan(limit, exhaustive);
    }

    /**
     * The reworked scan: pass one keeps each task's best bounds in its own small heap (merged afterwards,
     * so no sweep over every bound on one thread), and the curves whose bound still reaches the cut are
     * collected in one sweep. Same bounds, same candidates, same refinement: the same answer.
     */
    private StoreResult runScan(int limit, boolean exhaustive) {
        if (!exhaustive && store.size() >= plan.columnFirstMinCurves && ColumnFirstScan.applies(plan)) {
            StoreResult byColumn = runColumnFirst(limit);
            if (byColumn != null) {
                return byColumn;
            }
        }
        plan.allSpans();
        int n = store.size();
        int[] bound = new int[n];
        boolean[] eligible = new boolean[n];
        int firstCut = limit * FIRST_CUT_FACTOR;
        ScanPass pass = scanPass(bound, eligible, firstCut);

        Refinement refinement = new Refinement();
        CurveModel full = new CurveModel(plan, store, false);
        for (int curve : pass.best) {
            refinement.add(curve, full);
        }
        int cut = exhaustive ? Integer.MIN_VALUE : refinement.kthBestMaterialKey(limit);
        for (int curve : reaching(bound, eligible, cut)) {
            if (!refinement.evaluations.containsKey(curve)) {
                refinement.add(curve, full);
            }
        }
        return refinement.result(limit, pass.eligibleCount, full, (at, test) -> reaching(bound, eligible, at, test));
    }

    /**
     * As measured on a large store: one column read first, every probe only for the curves it cannot rule
     * out ({@link ColumnFirstScan}); the same best curves, cut and candidates as the chunk scan. Null when
     * that column cannot settle the best curves (the chunk scan runs instead).
     */
    private StoreResult runColumnFirst(int limit) {
        return runColumnFirst(limit, false);
    }

    private StoreResult runColumnFirst(int limit, boolean gatherOtherColumns) {
        ColumnFirstScan scan = new ColumnFirstScan(store, plan, gatherOtherColumns, screenByLevels);
        int[] best = scan.best(limit * FIRST_CUT_FACTOR);
        if (best == null) {
            return null;
        }
        Refinement refinement = new Refinement();
        CurveModel full = new CurveModel(plan, store, false);
        for (int curve : best) {
            refinement.add(curve, full);
        }
        for (int curve : scan.reaching(refinement.kthBestMaterialKey(limit))) {
            if (!refinement.evaluations.containsKey(curve)) {
                refinement.add(curve, full);
            }
        }
        return refinement.result(limit, scan.eligibleCount(), full, scan::reaching);
    }

    /** The first pass's count of admitted curves and its best {@code count} curves by bound. */
    private record ScanPass(int eligibleCount, int[] best) {
    }

    private ScanPass scanPass(int[] bound, boolean[] eligible, int count) {
        int n = store.size();
        int chunks = (n + CHUNK - 1) / CHUNK;
        int tasks = n < plan.parallelMinCurves ? 1
                : Math.max(1, Math.min(chunks, 4 * Runtime.getRuntime().availableProcessors()));
        ScanTask[] done = new ScanTask[tasks];
        java.util.function.IntConsumer work = t -> {
            ScanTask task = new ScanTask(new Buffers(plan.pointProbes.size()), new TopBounds(count));
            for (int c = t; c < chunks; c += tasks) {
                int from = c * CHUNK;
                int to = Math.min(n, from + CHUNK);
                task.count += scanChunk(from, to, task.buffers, bound, eligible);
                task.top.offerAll(bound, eligible, from, to);
            }
            done[t] = task;
        };
        if (tasks == 1) {
            work.accept(0);
        } else {
            IntStream.range(0, tasks).parallel().forEach(work);
        }
        TopBounds merged = new TopBounds(count);
        int eligibleCount = 0;
        for (ScanTask task : done) {
            eligibleCount += task.count;
            merged.offerAll(task.top);
        }
        return new ScanPass(eligibleCount, merged.curves());
    }

    /** One task's scratch space, running count of admitted curves and best bounds. */
    private static final class ScanTask {
        final Buffers buffers;
        final TopBounds top;
        int count;

        ScanTask(Buffers buffers, TopBounds top) {
            this.buffers = buffers;
            this.top = top;
        }
    }

    /**
     * Pass one over one chunk: as {@link #boundChunk}, but at one thickness the probes' codes are read in
     * the margin loop itself (no decoded copy of each column) and whether a curve is rescaled is settled
     * once per curve, not once per probe.
     */
    private int scanChunk(int from, int to, Buffers b, int[] bound, boolean[] eligible) {
        if (plan.thickness.kind() == ThicknessSpec.Kind.RANGE) {
            return boundChunk(from, to, b, bound, eligible);
        }
        int len = to - from;
        boolean fixed = plan.thickness.kind() == ThicknessSpec.Kind.FIXED;
        boolean[] rescaled = b.rescaled;
        boolean anyRescaled = false;
        if (fixed) {
            for (int j = 0; j < len; j++) {
                rescaled[j] = plan.rescaledAt(store, from + j);
                anyRescaled |= rescaled[j];
            }
        }
        double[] lowest = b.lowest;
        double[] lowestMiss = b.lowestMiss;
        int[] bits = b.bits;
        Arrays.fill(lowest, 0, len, Double.POSITIVE_INFINITY);
        Arrays.fill(lowestMiss, 0, len, Double.POSITIVE_INFINITY);
        Arrays.fill(bits, 0, len, 0);
        for (int k = 0; k < plan.pointProbes.size(); k++) {
            PointProbe probe = plan.pointProbes.get(k);
            if (!probe.probe().onGrid()) {
                for (int j = 0; j < len; j++) {
                    bits[j] |= ProbeVerdict.UNVERIFIED;
                }
            } else if (anyRescaled || probe.probe().fractionHi() != 0) {
                marginsDecoded(k, from, to, b, rescaled, anyRescaled);
            } else {
                marginsOnGridPoint(probe, store.column(probe.probe().lo()), from, len, b);
            }
        }
        return settleBounds(from, to, b, bound, eligible, fixed);
    }

    /**
     * A probe on a grid point of curves read as they are: the margin straight from the 16-bit code. The
     * value is the decoder's ((1 − 0)·level + 0·level)·STEP = level·STEP, so margins are the same doubles.
     */
    private static void marginsOnGridPoint(PointProbe probe, short[] column, int from, int len, Buffers b) {
        double threshold = probe.thresholdOd();
        boolean pass = probe.pass();
        double[] lowest = b.lowest;
        double[] lowestMiss = b.lowestMiss;
        int[] bits = b.bits;
        for (int j = 0; j < len; j++) {
            short code = column[from + j];
            if (code == OdCode.NOT_MEASURED) {
                bits[j] |= ProbeVerdict.UNVERIFIED;
                continue;
            }
            double value = (code & OdCode.LEVEL_MASK) * OdCode.STEP;
            double margin = pass ? threshold - value : value - threshold;
            lowest[j] = Math.min(lowest[j], margin);
            if (margin < 0) {
                // ProbeVerdict.of spelt out for a negative margin (the profile showed the call not inlined here):
                // a miss, except a bound on a block, which is only unverified; a margin at or above 0 on a
                // bound pass is unverified, otherwise it holds
                boolean blockOnBound = !pass && (code & OdCode.BOUND_BIT) != 0;
                if (blockOnBound) {
                    bits[j] |= ProbeVerdict.UNVERIFIED;
                } else {
                    bits[j] |= ProbeVerdict.MISSES;
                    lowestMiss[j] = Math.min(lowestMiss[j], margin);
                }
            } else if (pass && (code & OdCode.BOUND_BIT) != 0) {
                bits[j] |= ProbeVerdict.UNVERIFIED;
            }
        }
    }

    /** A probe between grid points, or at an asked thickness some curves are rescaled to: the general rule. */
    private void marginsDecoded(int k, int from, int to, Buffers b, boolean[] rescaled, boolean anyRescaled) {
        PointProbe probe = plan.pointProbes.get(k);
        decode(probe.probe(), from, to, b.od[k], b.state[k]);
        double threshold = probe.thresholdOd();
        boolean pass = probe.pass();
        double target = plan.thickness.minMm();
        double[] values = b.od[k];
        byte[] states = b.state[k];
        for (int j = 0; j < to - from; j++) {
            if (states[j] == CurveModel.UNMEASURED) {
                b.bits[j] |= ProbeVerdict.UNVERIFIED;
                continue;
            }
            double value = values[j];
            int curve = from + j;
            boolean isBound = states[j] == CurveModel.BOUND;
            if (anyRescaled && rescaled[j]) {
                int model = store.indexModelOf(curve);
                double s = plan.pointProbeLoss[model][k];
                if (value <= plan.pointProbeUnresolvedOd[model][k]) {
                    double d0 = store.thicknessMm(curve);
                    isBound |= target > d0 && target > SearchPlan.farMm(value, s, d0); // never a bound when thinner
                } else {
                    value = s + Math.max(0, value - s) * target / store.thicknessMm(curve);
                }
            }
            double margin = pass ? threshold - value : value - threshold;
            b.lowest[j] = Math.min(b.lowest[j], margin);
            int verdict = ProbeVerdict.of(margin, isBound, pass);
            b.bits[j] |= verdict;
            if (verdict == ProbeVerdict.MISSES) {
                b.lowestMiss[j] = Math.min(b.lowestMiss[j], margin);
            }
        }
    }

    /** The curves of a chunk with their bounds from the combined probe bits: as in {@link #boundsAtOneThickness}. */
    private int settleBounds(int from, int to, Buffers b, int[] bound, boolean[] eligible, boolean fixed) {
        double target = plan.thickness.minMm();
        int count = 0;
        for (int j = 0; j < to - from; j++) {
            int curve = from + j;
            if (!plan.admits(store, curve)) {
                continue;
            }
            count++;
            if (!plan.judged(curve)) {
                continue;
            }
            eligible[curve] = true;
            if (fixed && !plan.judgeableAt(store, curve, target)) {
                bound[curve] = Keys.of(Standing.NOT_JUDGED, Double.NaN);
                continue;
            }
            Verdict verdict = ProbeVerdict.combine(b.bits[j]);
            if (verdict == Verdict.MISSES) {
                bound[curve] = Keys.of(Standing.MISSES, b.lowestMiss[j]);
                continue;
            }
            double worst = b.lowest[j] == Double.POSITIVE_INFINITY ? Double.NaN : b.lowest[j];
            bound[curve] = Keys.of(verdict == Verdict.MEETS ? Standing.MEETS : Standing.UNVERIFIED, worst);
        }
        return count;
    }

    /**
     * The eligible curves whose bound reaches {@code cut}, in curve order: one plain sweep (a parallel stream
     * filter measured slower here, its pipeline costing more than the two array reads per curve).
     */
    private static int[] reaching(int[] bound, boolean[] eligible, int cut) {
        return reaching(bound, eligible, cut, (curve, b) -> true);
    }

    /** A further test of a curve's first-pass bound, beyond reaching a cut. */
    @FunctionalInterface
    interface BoundTest {
        boolean passes(int curve, int bound);
    }

    /** The curves where a {@link BoundTest} is passed by the first-pass bound too: curves in the hand-over's cut. */
    @FunctionalInterface
    interface Reaching {
        int[] at(int cut, BoundTest test);
    }

    private static int[] reaching(int[] bound, boolean[] eligible, int cut, BoundTest test) {
        int[] found = new int[16];
        int count = 0;
        for (int c = 0; c < bound.length; c++) {
            if (eligible[c] && bound[c] >= cut && test.passes(c, bound[c])) {
                if (count == found.length) {
                    found = Arrays.copyOf(found, count * 2);
                }
                found[count++] = c;
            }
        }
        return Arrays.copyOf(found, count);
    }

    /**
     * The best {@code count} (bound, curve) pairs offered: a min-heap packed in longs as {@link #bestByBound},
     * so per-task heaps merge into the same set one heap over every curve would hold (the order is total).
     * {@link ColumnFirstScan} keeps its best curves in one too.
     */
    static final class TopBounds {
        final long[] heap;
        int size;

        TopBounds(int count) {
            heap = new long[count];
        }

        void offerAll(int[] bound, boolean[] eligible, int from, int to) {
            for (int curve = from; curve < to; curve++) {
                if (eligible[curve]) {
                    offer(((long) bound[curve] << 32) | (0xFFFFFFFFL & ~curve));
                }
            }
        }

        void offerAll(TopBounds other) {
            for (int i = 0; i < other.size; i++) {
                offer(other.heap[i]);
            }
        }

        void offer(long packed) {
            if (size < heap.length) {
                heap[size] = packed;
                siftUp(heap, size++);
            } else if (packed > heap[0]) {
                heap[0] = packed;
                siftDown(heap, size);
            }
        }

        int[] curves() {
            int[] curves = new int[size];
            for (int i = 0; i < size; i++) {
                curves[i] = ~(int) heap[i];
            }
            return curves;
        }
    }

    private StoreResult runReference(int limit, boolean exhaustive) {
        int n = store.size();
        int[] bound = new int[n];
        boolean[] eligible = new boolean[n];
        int eligibleCount = boundPass(bound, eligible);

        Refinement refinement = new Refinement();
        CurveModel full = new CurveModel(plan, store, false);
        for (int curve : bestByBound(bound, eligible, limit * FIRST_CUT_FACTOR)) {
            refinement.add(curve, full);
        }
        int cut = exhaustive ? Integer.MIN_VALUE : refinement.kthBestMaterialKey(limit);
        for (int curve = 0; curve < n; curve++) {
            if (eligible[curve] && bound[curve] >= cut && !refinement.evaluations.containsKey(curve)) {
                refinement.add(curve, full);
            }
        }
        return refinement.result(limit, eligibleCount, full, (at, test) -> reaching(bound, eligible, at, test));
    }

    /**
     * Pass one over all curves in parallel chunks. Within a chunk each point probe's column is decoded in
     * one tight loop (sequential reads of one array), then each curve's bound comes from one reusable model.
     * Returns how many curves pass the filters.
     */
    private int boundPass(int[] bound, boolean[] eligible) {
        int n = store.size();
        int chunks = (n + CHUNK - 1) / CHUNK;
        // a few tasks per core, each reusing its buffers over its run of chunks: allocating them per chunk
        // cost as much as the arithmetic (tens of MB zeroed per query at a million curves)
        int tasks = Math.max(1, Math.min(chunks, 4 * Runtime.getRuntime().availableProcessors()));
        return IntStream.range(0, tasks).parallel().map(t -> {
            Buffers buffers = new Buffers(plan.pointProbes.size());
            int count = 0;
            for (int c = t; c < chunks; c += tasks) {
                int from = c * CHUNK;
                count += boundChunk(from, Math.min(n, from + CHUNK), buffers, bound, eligible);
            }
            return count;
        }).sum();
    }

    /** Per-task scratch space of the first pass. */
    private final class Buffers {
        final double[][] od;
        final byte[][] state;
        final double[] lowest = new double[CHUNK];
        final double[] lowestMiss = new double[CHUNK];
        final int[] bits = new int[CHUNK];
        final double[] curveOd;
        final byte[] curveState;
        final boolean[] rescaled = new boolean[CHUNK];
        final CurveModel model = new CurveModel(plan, store, true);

        Buffers(int probes) {
            od = new double[probes][CHUNK];
            state = new byte[probes][CHUNK];
            curveOd = new double[probes];
            curveState = new byte[probes];
        }
    }

    private int boundChunk(int from, int to, Buffers b, int[] bound, boolean[] eligible) {
        int probes = plan.pointProbes.size();
        for (int k = 0; k < probes; k++) {
            decode(plan.pointProbes.get(k).probe(), from, to, b.od[k], b.state[k]);
        }
        if (plan.thickness.kind() != ThicknessSpec.Kind.RANGE) {
            return boundsAtOneThickness(from, to, b, bound, eligible);
        }
        int count = 0;
        for (int curve = from; curve < to; curve++) {
            if (!plan.admits(store, curve)) {
                continue;
            }
            count++;
            if (!plan.judged(curve)) {
                continue;
            }
            for (int k = 0; k < probes; k++) {
                b.curveOd[k] = b.od[k][curve - from];
                b.curveState[k] = b.state[k][curve - from];
            }
            eligible[curve] = true;
            bound[curve] = b.model.loadDecoded(curve, b.curveOd, b.curveState).bestKey();
        }
        return count;
    }

    /**
     * The first pass when every curve is judged at one thickness (as measured, or one asked thickness):
     * probe by probe over the chunk, so each step is a short loop over plain arrays. Same rules as
     * {@link CurveModel} ({@link ProbeVerdict}); thickness model as in the class comment.
     */
    private int boundsAtOneThickness(int from, int to, Buffers b, int[] bound, boolean[] eligible) {
        int len = to - from;
        double[][] od = b.od;
        byte[][] state = b.state;
        double[] lowest = b.lowest;
        double[] lowestMiss = b.lowestMiss;
        int[] bits = b.bits;
        Arrays.fill(lowest, 0, len, Double.POSITIVE_INFINITY);
        Arrays.fill(lowestMiss, 0, len, Double.POSITIVE_INFINITY);
        Arrays.fill(bits, 0, len, 0);
        boolean fixed = plan.thickness.kind() == ThicknessSpec.Kind.FIXED;
        double target = plan.thickness.minMm();
        for (int k = 0; k < od.length; k++) {
            PointProbe probe = plan.pointProbes.get(k);
            double threshold = probe.thresholdOd();
            boolean pass = probe.pass();
            double[] values = od[k];
            byte[] states = state[k];
            for (int j = 0; j < len; j++) {
                if (states[j] == CurveModel.UNMEASURED) {
                    bits[j] |= ProbeVerdict.UNVERIFIED;
                    continue;
                }
                double value = values[j];
                int curve = from + j;
                boolean isBound = states[j] == CurveModel.BOUND;
                if (plan.rescaledAt(store, curve)) {
                    int model = store.indexModelOf(curve);
                    double s = plan.pointProbeLoss[model][k];
                    if (value <= plan.pointProbeUnresolvedOd[model][k]) {
                        // a clear reading keeps its OD; far beyond its thickness it is only a bound
                        double d0 = store.thicknessMm(curve);
                        isBound |= target > d0 && target > SearchPlan.farMm(value, s, d0); // never a bound when thinner
                    } else {
                        value = s + Math.max(0, value - s) * target / store.thicknessMm(curve);
                    }
                }
                double margin = pass ? threshold - value : value - threshold;
                lowest[j] = Math.min(lowest[j], margin);
                int verdict = ProbeVerdict.of(margin, isBound, pass);
                bits[j] |= verdict;
                if (verdict == ProbeVerdict.MISSES) {
                    lowestMiss[j] = Math.min(lowestMiss[j], margin);
                }
            }
        }
        int count = 0;
        for (int j = 0; j < len; j++) {
            int curve = from + j;
            if (!plan.admits(store, curve)) {
                continue;
            }
            count++; // admitted; judged only where it is its material's nearest measurement
            if (!plan.judged(curve)) {
                continue;
            }
            eligible[curve] = true;
            if (fixed && !plan.judgeableAt(store, curve, target)) {
                // not rescalable, or not made at the asked thickness: no clause is judged
                bound[curve] = Keys.of(Standing.NOT_JUDGED, Double.NaN);
                continue;
            }
            // an upper bound on the full key, as in CurveModel: a miss stays in the valued-miss group
            Verdict verdict = ProbeVerdict.combine(bits[j]);
            if (verdict == Verdict.MISSES) {
                bound[curve] = Keys.of(Standing.MISSES, lowestMiss[j]);
                continue;
            }
            double worst = lowest[j] == Double.POSITIVE_INFINITY ? Double.NaN : lowest[j];
            bound[curve] = Keys.of(verdict == Verdict.MEETS ? Standing.MEETS : Standing.UNVERIFIED, worst);
        }
        return count;
    }

    /** Decodes one probe for curves [from, to): OD interpolated between its two columns, and its state. */
    private void decode(Probe probe, int from, int to, double[] od, byte[] state) {
        if (!probe.onGrid()) {
            Arrays.fill(state, CurveModel.UNMEASURED);
            return;
        }
        short[] lo = store.column(probe.lo());
        short[] hi = store.column(probe.hi());
        double f = probe.fractionHi();
        for (int curve = from, j = 0; curve < to; curve++, j++) {
            short a = lo[curve];
            short b = hi[curve];
            if (a == OdCode.NOT_MEASURED || b == OdCode.NOT_MEASURED) {
                state[j] = CurveModel.UNMEASURED;
                continue;
            }
            od[j] = ((1 - f) * (a & OdCode.LEVEL_MASK) + f * (b & OdCode.LEVEL_MASK)) * OdCode.STEP;
            boolean isBound = (a & OdCode.BOUND_BIT) != 0 || (f > 0 && (b & OdCode.BOUND_BIT) != 0);
            state[j] = isBound ? CurveModel.BOUND : CurveModel.READ;
        }
    }

    /** The curves evaluated on every probe, and the best of them per material. */
    private final class Refinement {
        final Map<Integer, Evaluation> evaluations = new HashMap<>();
        final Map<Integer, Integer> bestCurveOfMaterial = new HashMap<>();

        void add(int curve, CurveModel full) {
            Evaluation e = full.load(curve).best();
            evaluations.put(curve, e);
            bestCurveOfMaterial.merge(store.materialIndex(curve), curve,
                    (kept, offered) -> better(e.key(), offered, evaluations.get(kept).key(), kept) ? offered : kept);
        }

        /** The limit-th best material key so far; a curve whose bound is below it cannot enter the result. */
        int kthBestMaterialKey(int limit) {
            if (bestCurveOfMaterial.size() < limit) {
                return Integer.MIN_VALUE;
            }
            int[] keys = bestCurveOfMaterial.values().stream().mapToInt(c -> evaluations.get(c).key()).sorted().toArray();
            return keys[keys.length - limit];
        }

        /**
         * The top rows, and the hand-over the caller asks with its exact {@code limit}-th row ({@link CutReach}):
         * every curve whose bound could reach that row within the largest error is evaluated, and a material is
         * handed over when one of its evaluated curves reaches it within that curve's own error.
         */
        StoreResult result(int limit, int eligibleCount, CurveModel full, Reaching reachingAt) {
            List<StoreHit> rows = topRows(limit);
            int refined = evaluations.size();
            Set<Integer> handed = new HashSet<>();
            for (StoreHit hit : rows) {
                handed.add(store.materialIndex(hit.curve()));
            }
            StoreResult.HandOver handOver = (standing, margin) -> {
                int exactKey = Keys.of(standing, margin);
                CutReach reach = CutReach.of(store, plan);
                // one int cut for the scan, then each bound raised by its own curve's error (a bound stands for
                // its curve: docs/store.md); only curves that pass both are evaluated on every probe
                int[] inCut = reachingAt.at(CutReach.lowestReachingKey(exactKey, reach.largestError()),
                        (curve, bound) -> CutReach.reaches(bound, reach.errorOf(curve), exactKey));
                for (int curve : inCut) {
                    if (!evaluations.containsKey(curve)) {
                        add(curve, full);
                    }
                }
                // a curve outside the cut cannot reach: only those in it are looked at (all evaluated by now)
                TreeSet<Integer> more = new TreeSet<>();
                for (int curve : inCut) {
                    int material = store.materialIndex(curve);
                    if (!handed.contains(material)
                            && CutReach.reaches(evaluations.get(curve).key(), reach.errorOf(curve), exactKey)) {
                        more.add(material);
                    }
                }
                handed.addAll(more);
                List<StoreHit> hits = new ArrayList<>();
                for (int material : more) {
                    hits.add(hitOf(material));
                }
                return hits;
            };
            return new StoreResult(rows, eligibleCount, refined, handOver, new SampleReach(store, plan));
        }

        private StoreHit hitOf(int material) {
            int curve = bestCurveOfMaterial.get(material);
            Evaluation e = evaluations.get(curve);
            return new StoreHit(curve, store.sampleId(curve), store.materialAt(material), e.verdict(), e.worstMargin(),
                    e.thicknessMm(), e.thicknessRange());
        }

        List<StoreHit> topRows(int limit) {
            List<Integer> materials = new ArrayList<>(bestCurveOfMaterial.keySet());
            // same order as the exact ranking: verdict, margin, then material name and sample id for ties
            materials.sort(Comparator.<Integer>comparingInt(m -> -evaluations.get(bestCurveOfMaterial.get(m)).key())
                    .thenComparing(m -> store.materialAt(m).name())
                    .thenComparingLong(m -> store.sampleId(bestCurveOfMaterial.get(m))));
            // materials tied with the last row's key come too: the exact ranking orders equal margins by
            // confidence (RankingOrder), which the store does not see, so it must not choose among them
            int end = Math.min(limit, materials.size());
            while (end > 0 && end < materials.size() && evaluations.get(bestCurveOfMaterial.get(materials.get(end))).key()
                    == evaluations.get(bestCurveOfMaterial.get(materials.get(end - 1))).key()) {
                end++;
            }
            List<StoreHit> hits = new ArrayList<>();
            for (int m : materials.subList(0, end)) {
                hits.add(hitOf(m));
            }
            return hits;
        }
    }

    /** Higher key first; equal keys: the lower curve index (the earlier stored sample) wins, deterministically. */
    private static boolean better(int key, int curve, int otherKey, int otherCurve) {
        return key > otherKey || (key == otherKey && curve < otherCurve);
    }

    /**
     * The {@code count} eligible curves with the highest bounds: a primitive min-heap of (bound, curve)
     * packed in longs, so a million candidates cost no boxing.
     */
    private static int[] bestByBound(int[] bound, boolean[] eligible, int count) {
        long[] heap = new long[count];
        int size = 0;
        for (int curve = 0; curve < bound.length; curve++) {
            if (!eligible[curve]) {
                continue;
            }
            // higher bound wins; at equal bounds the lower curve index wins
            long packed = ((long) bound[curve] << 32) | (0xFFFFFFFFL & ~curve);
            if (size < count) {
                heap[size] = packed;
                siftUp(heap, size++);
            } else if (packed > heap[0]) {
                heap[0] = packed;
                siftDown(heap, size);
            }
        }
        int[] curves = new int[size];
        for (int i = 0; i < size; i++) {
            curves[i] = ~(int) heap[i];
        }
        return curves;
    }

    private static void siftUp(long[] heap, int i) {
        while (i > 0) {
            int parent = (i - 1) / 2;
            if (heap[parent] <= heap[i]) {
                return;
            }
            long t = heap[parent];
            heap[parent] = heap[i];
            heap[i] = t;
            i = parent;
        }
    }

    private static void siftDown(long[] heap, int size) {
        int i = 0;
        while (true) {
            int left = 2 * i + 1;
            int smallest = i;
            if (left < size && heap[left] < heap[smallest]) {
                smallest = left;
            }
            if (left + 1 < size && heap[left + 1] < heap[smallest]) {
                smallest = left + 1;
            }
            if (smallest == i) {
                return;
            }
            long t = heap[smallest];
            heap[smallest] = heap[i];
            heap[i] = t;
            i = smallest;
        }
    }

    /** A curve's result in the store's model. */
    record Evaluation(Verdict verdict, Standing standing, double worstMargin, double thicknessMm,
                      double[] thicknessRange) {
        int key() {
            return Keys.of(standing, worstMargin);
        }
    }

    /**
     * Orders (group, margin) as one int, in the exact ranking's order ({@link RankingOrder}): the groups of
     * {@link Standing} best first, then the margin in 1e-4 decades, NaN lowest within its group.
     */
    static final class Keys {
        static final double UNIT = 1e-4;
        private static final int SPAN = 1 << 28;
        private static final int GROUPS = Standing.values().length;

        private Keys() {
        }

        static int of(Standing standing, double margin) {
            int category = GROUPS - 1 - standing.ordinal(); // MEETS highest
            double clamped = Double.isNaN(margin) ? -SPAN / 2.0 : Math.max(-SPAN / 2.0 + 1, Math.min(SPAN / 2.0 - 1, margin / UNIT));
            return (category - GROUPS / 2) * SPAN + (int) Math.floor(clamped);
        }

        static Standing standingOf(int key) {
            int category = Math.floorDiv(key + SPAN / 2, SPAN) + GROUPS / 2;
            return Standing.values()[GROUPS - 1 - category];
        }

        /** The key's margin unit k: its margins lie in [k·UNIT, (k + 1)·UNIT); the group's lowest unit holds NaN. */
        static int unitOf(int key) {
            return Math.floorMod(key + SPAN / 2, SPAN) - SPAN / 2;
        }

        static boolean marginUnknown(int key) {
            return unitOf(key) == -SPAN / 2;
        }
    }

}
