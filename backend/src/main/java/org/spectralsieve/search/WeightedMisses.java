package org.spectralsieve.search;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.stream.IntStream;
import org.spectralsieve.requirement.Direction;
import org.spectralsieve.requirement.NominalThickness;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.SeeThrough;
import org.spectralsieve.requirement.StackLayer;
import org.spectralsieve.requirement.ThicknessSpec;
import org.spectralsieve.requirement.WeightedClause;
import org.spectralsieve.store.SpectralStore;
import org.spectralsieve.store.WeightedScreen;

/**
 * The store's proven misses of weighted clauses ({@link WeightedScreen}), added to those of the every-point
 * clauses (docs/weighted-screening.md, "Why a bound is a proof").
 *
 * <p>A sample judged on its measured curve (as measured, at its own thickness, or a part that is never
 * rescaled) keeps the rules of {@link SearchService#keepsProof}. A bulk sample judged on its rescaled curve
 * at a thickness d in [lo, hi] (one asked thickness: lo = hi; a solve: the asked range, which holds the
 * solver's recommended thickness or best stock size wherever the sample's span cuts it) is bounded by two
 * monotone families: P(x) bounds every pass margin at any judged d ≥ x (T only falls as the sample thickens;
 * thinner than measured through {@link WeightedScreen.Query#thinned}), Q(x) every block margin at any judged
 * d ≤ x ({@link WeightedScreen.Query#thickened}). For a split s in [lo, hi], every d in [lo, s] has worst
 * margin ≤ min(P(lo), Q(s)) and every d in [s, hi] ≤ min(P(s), Q(hi)); so the larger of the two bounds the
 * sample's exact worst margin wherever the judgement lands, and it is a proven miss when that is negative.
 * Which split is tried changes only how often a miss is proven, never whether a proof is sound.
 */
final class WeightedMisses {

    /** Splits tried inside a solved range, geometric between its ends. */
    private static final int SPLITS = 7;
    /** Bisection steps for the crossing of the figure codes' P and Q in a solved range ({@code Bounds#aroundTheCrossing}). */
    private static final int CROSSING_STEPS = 10;

    private WeightedMisses() {
    }

    /** A fixed thickness the sample was measured at is judged on the measured curve, never rescaled. */
    private static boolean judgedAsMeasured(ThicknessSpec spec, double d0) {
        return spec.kind() == ThicknessSpec.Kind.FIXED && NominalThickness.same(d0, spec.minMm());
    }

    /**
     * Lowers, or adds, each sample's bound on its exact worst margin where a weighted clause is proven
     * missed: every clause's bound is an upper bound on that clause's margin, so the smallest of them bounds
     * the worst margin.
     */
    static void add(Map<Long, Double> provenMiss, SpectralStore store, Requirement requirement,
                    Optional<StackLayer> layer) {
        add(provenMiss, store, requirement, layer, false);
    }

    /**
     * @param diffuseLayer the layer was measured in total geometry: every path then includes scatter, so a
     *                     see-through clause is unverified on every candidate ({@code SeeThrough}), never a miss
     */
    static void add(Map<Long, Double> provenMiss, SpectralStore store, Requirement requirement,
                    Optional<StackLayer> layer, boolean diffuseLayer) {
        add(provenMiss, store, requirement, layer, diffuseLayer, false);
    }

    /**
     * @param reference the arithmetic before the per-curve power tables, on one thread
     *                  ({@link WeightedScreen.Query#withReferenceArithmetic}): the same proofs to within 1e-12 of a
     *                  margin, kept so a benchmark can time both side by side
     */
    static void add(Map<Long, Double> provenMiss, SpectralStore store, Requirement requirement,
                    Optional<StackLayer> layer, boolean diffuseLayer, boolean reference) {
        add(provenMiss, store, requirement, layer, diffuseLayer, reference, PARALLEL_FROM);
    }

    /** {@link #add(Map, SpectralStore, Requirement, Optional, boolean, boolean)} in parts from {@code parallelFrom} curves. */
    static void add(Map<Long, Double> provenMiss, SpectralStore store, Requirement requirement,
                    Optional<StackLayer> layer, boolean diffuseLayer, boolean reference, int parallelFrom) {
        double[] bounds = marginBounds(store, requirement, layer, diffuseLayer, reference, parallelFrom);
        for (int curve = 0; curve < bounds.length; curve++) {
            if (bounds[curve] < 0) {
                provenMiss.merge(store.sampleId(curve), bounds[curve], Math::min);
            }
        }
    }

    /**
     * Per store curve, an upper bound on the sample's exact worst margin wherever it is judged, of either
     * sign: the smallest of its weighted clauses' bounds, {@code +∞} where no clause is bounded (empty when
     * the requirement has no weighted clause the screen bounds). Negative: a proven miss (see {@link #add}).
     * Non-negative: a row that meets has a worst margin at most this (every clause of a met row meets, and
     * each clause's margin is at most its bound: a pass's on L or U ≤ Ū, a block's on U or L ≥ L̲), which
     * lets {@code SearchService} leave out rows that cannot beat a full shortlist of met rows
     * (docs/weighted-screening.md, "Bounds that rank").
     */
    static double[] marginBounds(SpectralStore store, Requirement requirement, Optional<StackLayer> layer,
                                 boolean diffuseLayer) {
        return marginBounds(store, requirement, layer, diffuseLayer, true);
    }

    /**
     * @param layerBlocks whether weighted blocks behind a fixed layer are bounded
     *                    ({@code WeightedScreen.Query#behindLayer}); false only so a benchmark can time the rule
     *                    before them side by side
     */
    static double[] marginBounds(SpectralStore store, Requirement requirement, Optional<StackLayer> layer,
                                 boolean diffuseLayer, boolean layerBlocks) {
        return marginBounds(store, requirement, layer, diffuseLayer, false, PARALLEL_FROM, layerBlocks);
    }

    private static double[] marginBounds(SpectralStore store, Requirement requirement, Optional<StackLayer> layer,
                                         boolean diffuseLayer, boolean reference, int parallelFrom) {
        return marginBounds(store, requirement, layer, diffuseLayer, reference, parallelFrom, true);
    }

    private static double[] marginBounds(SpectralStore store, Requirement requirement, Optional<StackLayer> layer,
                                         boolean diffuseLayer, boolean reference, int parallelFrom, boolean layerBlocks) {
        Optional<WeightedScreen.LayerBins> layerBins = layer.map(l -> WeightedScreen.LayerBins.of(l.curve(), l.index()));
        if (bounds(store, requirement, layer, layerBins, diffuseLayer, reference, layerBlocks, 0, 0) == null) {
            return new double[0]; // no weighted clause the screen can bound
        }
        int size = store.size();
        // above PARALLEL_FROM curves, both halves at once; each part has its own queries (they cache), every
        // curve's bound depends on that curve alone, so the array is the one a single thread fills
        int parts = reference || size < parallelFrom ? 1 : Math.max(1, Math.min(PARTS, Runtime.getRuntime().availableProcessors()));
        double[] bound = new double[size];
        IntStream.range(0, parts).parallel().forEach(p -> bounds(store, requirement, layer, layerBins, diffuseLayer,
                reference, layerBlocks, (int) ((long) size * p / parts), (int) ((long) size * (p + 1) / parts)).into(bound));
        return bound;
    }

    /**
     * The second stage (docs/weighted-screening.md, "A second, exact-curve stage"): per sample, on its decoded
     * curve, a bound on its exact worst margin that no bin or code rounding loosens, for a contender about to be
     * judged; null when the requirement has no weighted clause the screen bounds. Not thread-safe: one per thread
     * at a time (a search forms one more for each second bound it forms at the same time as another).
     */
    static SecondStage secondStage(SpectralStore store, Requirement requirement, Optional<StackLayer> layer,
                                   boolean diffuseLayer, boolean layerBlocks) {
        Optional<WeightedScreen.LayerBins> layerBins = layer.map(l -> WeightedScreen.LayerBins.of(l.curve(), l.index()));
        Bounds bounds = bounds(store, requirement, layer, layerBins, diffuseLayer, false, layerBlocks, 0, store.size());
        return bounds;
    }

    /** A bound on a sample's exact worst margin read on its decoded curve: +∞ where this stage proves nothing. */
    interface SecondStage {
        /**
         * @param curve    the sample's store row
         * @param measured the curve the store holds for it, as decoded for the judgement
         */
        double bound(int curve, org.spectralsieve.spectrum.Curve measured);

        /**
         * {@link #bound(int, org.spectralsieve.spectrum.Curve)} knowing the bar the contender must reach (a met last
         * row's margin, ≥ 0; {@code -∞}: none, {@link BoundedJudgement.Refiner}): once a clause's bound falls below
         * the bar the others are not read, so the bound returned is the smallest over the clauses read — sound, and
         * below the bar exactly when the full one is. {@link #cannotMeet} and {@link #unverifiedBound} then cover the
         * clauses read only (unknown for the others: false and +∞).
         */
        default double bound(int curve, org.spectralsieve.spectrum.Curve measured, double bar) {
            return bound(curve, measured);
        }

        /** Whether the sample of the last {@link #bound} is judged on that curve with a clause unverified: its row cannot meet. */
        boolean cannotMeet();

        /**
         * After {@link #bound}: a bound on the worst margin of the sample's row should it be unverified (−∞: it
         * cannot be, +∞: nothing known), from the clauses read on the very curve the sample is judged on.
         */
        double unverifiedBound();
    }

    /**
     * {@link #marginBounds(SpectralStore, Requirement, Optional, boolean, boolean)} and the second stage of the same
     * search; below {@link #PARALLEL_FROM} curves the second stage is the very queries the bounds were formed with,
     * so their per-range tables (shares, integration points, surfaces) are formed once per search.
     */
    static Screen screen(SpectralStore store, Requirement requirement, Optional<StackLayer> layer, boolean diffuseLayer,
                         boolean layerBlocks) {
        Optional<WeightedScreen.LayerBins> layerBins = layer.map(l -> WeightedScreen.LayerBins.of(l.curve(), l.index()));
        int size = store.size();
        Bounds whole = bounds(store, requirement, layer, layerBins, diffuseLayer, false, layerBlocks, 0, size);
        if (whole == null) {
            return new Screen(new double[0], null);
        }
        if (size >= PARALLEL_FROM) {
            return new Screen(marginBounds(store, requirement, layer, diffuseLayer, false, PARALLEL_FROM, layerBlocks), whole);
        }
        double[] bound = new double[size];
        whole.into(bound);
        return new Screen(bound, whole);
    }

    /** Each curve's bound ({@link #marginBounds}) and the search's second stage (null when no clause is screened). */
    record Screen(double[] bounds, SecondStage secondStage) {
    }

    /**
     * {@link #screen} for a solve without a layer whose first stage stops at the figure codes' whole-range bound
     * min(P(lo), Q(hi)) on the curves the codes do not prove missed (issue 14, twelfth pass: there the bins' thinned
     * bound at lo, B, Q(hi) from the bins and the split rule cost most of the screen, and only the curves of contenders
     * that could reach the rows need them). Every bound is sound (the codes' P(lo) and Q(hi) bound every pass and block
     * margin over the range); {@code deferred} marks the curves whose bound is only the codes' one, which
     * {@link DeferredBins#readInFull} replaces by the bound {@link #screen} forms, bit for bit. Elsewhere (as measured,
     * at one thickness, behind a layer, the codes switched off) this is {@link #screen} with nothing deferred.
     */
    static DeferredBins screenWithBinsDeferred(SpectralStore store, Requirement requirement) {
        return screenWithBinsDeferred(store, requirement, true);
    }

    /** @param deferring false: nothing deferred, every bound {@link #screen}'s (benchmarks: the same work side by side) */
    static DeferredBins screenWithBinsDeferred(SpectralStore store, Requirement requirement, boolean deferring) {
        int size = store.size();
        Bounds whole = bounds(store, requirement, Optional.empty(), Optional.empty(), false, false, true, 0, size);
        boolean[] deferred = new boolean[size];
        if (whole == null) {
            return new DeferredBins(new double[0], deferred, null, store, requirement);
        }
        boolean defer = deferring && requirement.thickness().kind() == ThicknessSpec.Kind.RANGE && requirement.layer().isEmpty();
        double[] bound = new double[size];
        int parts = size < PARALLEL_FROM ? 1 : Math.max(1, Math.min(PARTS, Runtime.getRuntime().availableProcessors()));
        IntStream.range(0, parts).parallel().forEach(p -> {
            Bounds b = bounds(store, requirement, Optional.empty(), Optional.empty(), false, false, true,
                    (int) ((long) size * p / parts), (int) ((long) size * (p + 1) / parts));
            b.deferBins = defer;
            b.deferredOut = deferred;
            b.into(bound);
        });
        return new DeferredBins(bound, deferred, whole, store, requirement);
    }

    /**
     * A screen whose solve left some curves' bins unread ({@link #screenWithBinsDeferred}): each curve's bound
     * ({@link #bounds}), which curves carry the codes' bound only ({@link #deferred}), and the second stage (null when
     * no clause is screened).
     */
    static final class DeferredBins {
        private final double[] bounds;
        private final boolean[] deferred;
        private final SecondStage secondStage;
        private final SpectralStore store;
        private final Requirement requirement;
        /** One reader per part, kept across calls: a query forms its per-range tables (shares, surfaces) once. */
        private final Bounds[] readers = new Bounds[PARTS];

        DeferredBins(double[] bounds, boolean[] deferred, SecondStage secondStage, SpectralStore store,
                     Requirement requirement) {
            this.bounds = bounds;
            this.deferred = deferred;
            this.secondStage = secondStage;
            this.store = store;
            this.requirement = requirement;
        }

        double[] bounds() {
            return bounds;
        }

        boolean[] deferred() {
            return deferred;
        }

        SecondStage secondStage() {
            return secondStage;
        }

        /**
         * Replaces the bound of each deferred curve among {@code curves[0, count)} by the full first-stage bound
         * (the one {@link #screen} forms, bit for bit) and clears its mark; on both cores from
         * {@link #PARALLEL_FROM_DEFERRED} curves. Not to be called from two threads at once, nor while another thread
         * reads these curves' bounds.
         *
         * @return how many bounds were read in full
         */
        int readInFull(int[] curves, int count) {
            if (bounds.length == 0) {
                return 0;
            }
            int parts = count < PARALLEL_FROM_DEFERRED ? 1
                    : Math.max(1, Math.min(PARTS, Runtime.getRuntime().availableProcessors()));
            for (int p = 0; p < parts; p++) {
                if (readers[p] == null) {
                    readers[p] = WeightedMisses.bounds(store, requirement, Optional.empty(), Optional.empty(), false,
                            false, true, 0, store.size());
                }
            }
            java.util.concurrent.atomic.AtomicInteger read = new java.util.concurrent.atomic.AtomicInteger();
            IntStream.range(0, parts).parallel().forEach(p -> {
                Bounds b = readers[p];
                int n = 0;
                for (int i = (int) ((long) count * p / parts); i < (int) ((long) count * (p + 1) / parts); i++) {
                    int c = curves[i];
                    if (deferred[c]) {
                        bounds[c] = b.readInFull(c);
                        deferred[c] = false;
                        n++;
                    }
                }
                read.addAndGet(n);
            });
            return read.get();
        }
    }

    /** Curves from which {@link DeferredBins#readInFull} runs on both cores. */
    private static final int PARALLEL_FROM_DEFERRED = 4096;

    /**
     * Whether the screen's pass over the figure codes goes in blocks of curves, clause after clause, with the bins of a
     * block's unknown lower end in the same block (the tenth pass of issue 14), or curve after curve with those bins in
     * a pass of their own after it, block by block (the ninth pass: {@code
     * -Dsieve.store.bins-in-the-code-pass=false}, read per search: benchmarks and tests). The same numbers either way.
     */
    static boolean binsInTheCodePass() {
        return !"false".equals(System.getProperty("sieve.store.bins-in-the-code-pass"));
    }

    /** Curves the screen's code pass forms at a time, clause after clause (their bounds, codes and bins stay in the cache). */
    private static final int CURVES_PER_BLOCK = 2048;

    /** Curves from which the screen runs on more than one thread. */
    private static final int PARALLEL_FROM = 65_536;
    /** At most this many parts (the service's machines have two cores; more parts only queue). */
    private static final int PARTS = 2;

    /** The clauses' queries for curves [from, to), or null when no weighted clause is screened. */
    private static Bounds bounds(SpectralStore store, Requirement requirement, Optional<StackLayer> layer,
                                 Optional<WeightedScreen.LayerBins> layerBins, boolean diffuseLayer, boolean reference,
                                 boolean layerBlocks, int from, int to) {
        Optional<double[]> layerRange = layer.map(l -> new double[] {l.curve().minWavelengthNm(), l.curve().maxWavelengthNm()});
        WeightedScreen screen = store.weightedScreen();
        List<WeightedScreen.Query> queries = new ArrayList<>();
        List<Boolean> seeThrough = new ArrayList<>();
        for (var clause : requirement.clauses()) {
            // behind a layer a block is bounded only on the stack as measured (Query#behindLayer)
            if (clause instanceof WeightedClause w && (layer.isEmpty() || w.direction() == Direction.PASS
                    || layerBlocks && layerBins.isPresent())) {
                WeightedScreen.Query q = layerBins.isPresent()
                        ? screen.query(store, w, layerBins.get()).blockBehindLayer(layerBlocks).layerByPoint(layerBlocks)
                        : screen.query(store, w, layerRange);
                queries.add(reference ? q.withReferenceArithmetic() : q);
                // on a diffuse sample a see-through clause is unverified (SeeThrough), never a miss
                seeThrough.add(SeeThrough.needsRegular(w) && !requirement.acceptsTotalTransmittance());
            }
        }
        return queries.isEmpty() ? null
                : new Bounds(store, requirement.thickness(), queries, seeThrough, diffuseLayer, reference, from, to);
    }

    /**
     * The rule before blocks were bounded thicker than measured and solved ranges were split: passes as
     * measured, thinned and behind a layer, blocks only where the measured curve's proof carries over
     * ({@link SearchService#keepsProof}). Kept so a benchmark can time both side by side
     * ({@link SearchService#withEarlierWeightedScreen}); answers are the same, only fewer misses are proven.
     */
    static void addEarlier(Map<Long, Double> provenMiss, SpectralStore store, Requirement requirement,
                           Optional<StackLayer> layer) {
        addEarlier(provenMiss, store, requirement, layer, false);
    }

    /** {@link #addEarlier(Map, SpectralStore, Requirement, Optional)} behind a layer measured in total geometry or not. */
    static void addEarlier(Map<Long, Double> provenMiss, SpectralStore store, Requirement requirement,
                           Optional<StackLayer> layer, boolean diffuseLayer) {
        Optional<double[]> layerRange = layer.map(l -> new double[] {l.curve().minWavelengthNm(), l.curve().maxWavelengthNm()});
        WeightedScreen screen = store.weightedScreen();
        for (var clause : requirement.clauses()) {
            if (!(clause instanceof WeightedClause w) || layer.isPresent() && w.direction() != Direction.PASS) {
                continue;
            }
            boolean seeThrough = SeeThrough.needsRegular(w) && !requirement.acceptsTotalTransmittance();
            double[] bounds = screen.marginBounds(w, layerRange);
            ThicknessSpec spec = requirement.thickness();
            double[] thinned = spec.kind() == ThicknessSpec.Kind.AS_MEASURED ? null
                    : screen.marginBoundsThinned(store, w, layerRange, spec.minMm());
            for (int curve = 0; curve < store.size(); curve++) {
                double bound = bounds[curve];
                double d0 = store.thicknessMm(curve);
                if (seeThrough && (store.isTotalGeometry(curve) || diffuseLayer)) {
                    continue; // unverified on a diffuse sample (SeeThrough), never a miss
                }
                if (bound < 0 && SearchService.keepsProof(w.direction(), spec, d0, store.isBulk(curve))) {
                    provenMiss.merge(store.sampleId(curve), bound, Math::min);
                } else if (thinned != null && thinned[curve] < 0 && !judgedAsMeasured(spec, d0)) {
                    provenMiss.merge(store.sampleId(curve), thinned[curve], Math::min);
                }
            }
        }
    }

    /** The clauses' bounds for one curve at a time, over curves [from, to). */
    private static final class Bounds implements SecondStage {

        private final SpectralStore store;
        private final ThicknessSpec spec;
        private final List<WeightedScreen.Query> queries;
        private final List<Boolean> seeThrough;
        private final boolean diffuseLayer;
        private final boolean reference;
        private final int from;
        private final int to;
        private int curve;
        private boolean total;
        private boolean cannotMeet;
        private double unverifiedBound = Double.POSITIVE_INFINITY;
        /** The decoded curve while the second stage runs ({@link #bound}), else null: P(x) then reads it too. */
        private org.spectralsieve.spectrum.Curve measured;
        /** The bar of the second bound being formed ({@link SecondStage#bound(int, org.spectralsieve.spectrum.Curve, double)}), else -∞. */
        private double bar = Double.NEGATIVE_INFINITY;
        /** Whether some clause reads the figure codes' bounds over thickness ({@link WeightedScreen.Query#solvesFromCode}). */
        private final boolean solvesFromCodes;
        /** Whether some block clause reads the figure codes' bounds over thickness. */
        private final boolean blocksFromCodes;
        /** {@link #codesFirst()}, read once per search. */
        private final boolean codesFirst = codesFirst();
        /**
         * Where the first stage of a solve records a curve whose bins it left unread ({@link #screenWithBinsDeferred}),
         * null when it reads them on every curve.
         */
        private boolean[] deferredOut;
        /** Whether the first stage of a solve stops at the codes' bound ({@link #screenWithBinsDeferred}). */
        private boolean deferBins;
        /** Whether the last {@link #rescaled} stopped at the codes' bound. */
        private boolean deferredNow;

        Bounds(SpectralStore store, ThicknessSpec spec, List<WeightedScreen.Query> queries, List<Boolean> seeThrough,
               boolean diffuseLayer, boolean reference, int from, int to) {
            this.store = store;
            this.spec = spec;
            this.queries = queries;
            this.seeThrough = seeThrough;
            this.diffuseLayer = diffuseLayer;
            this.reference = reference;
            this.from = from;
            this.to = to;
            this.solvesFromCodes = !reference && queries.stream().anyMatch(WeightedScreen.Query::solvesFromCode);
            this.blocksFromCodes = solvesFromCodes && queries.stream().anyMatch(q -> !q.passes() && q.solvesFromCode());
        }

        /** Each curve's bound on its exact worst margin (+∞ or ≥ 0 where nothing is proven) into {@code out}. */
        void into(double[] out) {
            if (spec.kind() == ThicknessSpec.Kind.AS_MEASURED && !reference && !diffuseLayer
                    && queries.stream().allMatch(WeightedScreen.Query::readsFigureCodes)) {
                // as measured without a layer (the codes are read only then) a curve's bound is the smallest of its
                // clauses' asMeasured (keepsProof holds, behindLayer is +∞): formed clause by clause, column-wise
                // (the bins of a block with an unknown lower end only where no clause has proven a miss already)
                WeightedScreen.Query[] q = queries.toArray(new WeightedScreen.Query[0]);
                boolean[] skipTotal = new boolean[q.length];
                boolean anySkip = false;
                for (int i = 0; i < q.length; i++) {
                    skipTotal[i] = seeThrough.get(i);
                    anySkip |= skipTotal[i];
                }
                // the blocks whose bins are read where their codes leave L unknown (in clause order, as a pass each)
                int[] withBins = IntStream.range(0, q.length).filter(i -> q[i].readsBinsForUnknownLowerEnds()).toArray();
                if (binsInTheCodePass()) {
                    // in blocks of curves, clause after clause (each clause's loop a tight one over its own column, its
                    // fields read once), the bins of an unknown lower end in the same block while its bounds are in the
                    // cache: per curve the same operations in the same order as the pass below, so the same numbers
                    for (int start = from; start < to; start += CURVES_PER_BLOCK) {
                        int end = Math.min(to, start + CURVES_PER_BLOCK);
                        Arrays.fill(out, start, end, Double.POSITIVE_INFINITY);
                        for (int i = 0; i < q.length; i++) {
                            q[i].lowerToCodeBounds(out, start, end, skipTotal[i]);
                        }
                        for (int i : withBins) {
                            q[i].binsForUnknownLowerEnds(out, start, end, skipTotal[i]);
                        }
                    }
                    return;
                }
                // the ninth pass's way: one pass over the curves, every clause's code read in it, then the bins of an
                // unknown lower end in a pass of their own, block by block
                for (int c = from; c < to; c++) {
                    boolean total = anySkip && store.isTotalGeometry(c);
                    double bound = Double.POSITIVE_INFINITY;
                    for (int i = 0; i < q.length; i++) {
                        if (!(total && skipTotal[i])) {
                            double b = q[i].asMeasuredWithoutBinsForL(c);
                            if (b < bound) {
                                bound = b;
                            }
                        }
                    }
                    out[c] = bound;
                }
                for (int i : withBins) {
                    q[i].binsForUnknownLowerEnds(out, from, to, skipTotal[i]);
                }
                return;
            }
            for (int c = from; c < to; c++) {
                double d0 = store.thicknessMm(c);
                curve(c, store.isTotalGeometry(c) || diffuseLayer);
                if (spec.kind() == ThicknessSpec.Kind.AS_MEASURED || judgedAsMeasured(spec, d0) || !store.isBulk(c)
                        || !(d0 > 0)) {
                    out[c] = onMeasuredCurve(spec, d0, store.isBulk(c));
                } else {
                    deferredNow = false;
                    out[c] = rescaled(spec.minMm(), spec.kind() == ThicknessSpec.Kind.FIXED ? spec.minMm() : spec.maxMm());
                    if (deferredNow) {
                        deferredOut[c] = true;
                    }
                }
            }
        }

        /**
         * The first stage's bound of a bulk curve judged rescaled, read in full (bins included) for a curve whose bins
         * {@link #into} left unread: the very bound it forms when it reads them ({@link #rescaled}, same operations in
         * the same order).
         */
        double readInFull(int c) {
            boolean was = deferBins;
            deferBins = false;
            try {
                curve(c, store.isTotalGeometry(c) || diffuseLayer);
                return rescaled(spec.minMm(), spec.kind() == ThicknessSpec.Kind.FIXED ? spec.minMm() : spec.maxMm());
            } finally {
                deferBins = was;
            }
        }

        void curve(int curve, boolean totalGeometry) {
            this.curve = curve;
            this.total = totalGeometry;
        }

        private boolean skipped(int i) {
            return total && seeThrough.get(i);
        }

        /** Judged on the measured curve (or proofs that carry over to it, {@link SearchService#keepsProof}). */
        double onMeasuredCurve(ThicknessSpec spec, double d0, boolean bulk) {
            double bound = Double.POSITIVE_INFINITY;
            for (int i = 0; i < queries.size(); i++) {
                WeightedScreen.Query q = queries.get(i);
                if (!skipped(i) && SearchService.keepsProof(q.passes() ? Direction.PASS : Direction.BLOCK, spec, d0, bulk)) {
                    bound = Math.min(bound, Math.min(q.asMeasured(curve), q.behindLayer(curve, d0)));
                }
            }
            return bound;
        }

        /**
         * The second stage on the decoded curve, routed as {@link #into}: judged on the measured curve, every
         * clause whose proof carries over ({@link SearchService#keepsProof}) on the exact figure or, behind a
         * layer, the stack's per-point product; judged rescaled in [lo, hi], the split rule of {@link #rescaled}
         * with P(x) also read on the curve (as measured where x is not thinner than measured, else thinned; T only
         * falls as the sample thickens) and Q(x) too (thickened). Each bound is the smaller of two sound ones.
         */
        @Override
        public boolean cannotMeet() {
            return cannotMeet;
        }

        @Override
        public double unverifiedBound() {
            return unverifiedBound;
        }

        @Override
        public double bound(int c, org.spectralsieve.spectrum.Curve curveToRead, double bar) {
            this.bar = bar;
            try {
                return bound(c, curveToRead);
            } finally {
                this.bar = Double.NEGATIVE_INFINITY;
            }
        }

        /** Whether a bound formed so far already lies below the bar: the clauses not yet read cannot change that. */
        private boolean belowBar(double bound) {
            return bound < bar;
        }

        @Override
        public double bound(int c, org.spectralsieve.spectrum.Curve curveToRead) {
            cannotMeet = false;
            unverifiedBound = Double.POSITIVE_INFINITY;
            double d0 = store.thicknessMm(c);
            curve(c, store.isTotalGeometry(c) || diffuseLayer);
            boolean onMeasured = spec.kind() == ThicknessSpec.Kind.AS_MEASURED || judgedAsMeasured(spec, d0)
                    || !store.isBulk(c) || !(d0 > 0);
            if (!onMeasured) {
                // rescaled somewhere in [lo, hi]: the split rule of rescaled(), its passes also read on the curve
                measured = curveToRead;
                try {
                    return rescaled(spec.minMm(), spec.kind() == ThicknessSpec.Kind.FIXED ? spec.minMm() : spec.maxMm());
                } finally {
                    measured = null;
                }
            }
            double bound = Double.POSITIVE_INFINITY;
            for (int i = 0; i < queries.size() && !belowBar(bound); i++) {
                WeightedScreen.Query q = queries.get(i);
                Direction direction = q.passes() ? Direction.PASS : Direction.BLOCK;
                if (!skipped(i) && SearchService.keepsProof(direction, spec, d0, store.isBulk(c))) {
                    bound = Math.min(bound, Math.min(q.asMeasuredOnCurve(curveToRead), q.behindLayerOnCurve(c, curveToRead, d0)));
                    // judged on this very curve (keepsProof on the measured curve): an unverified clause there stays so
                    cannotMeet |= q.unverifiedOnCurve();
                    unverifiedBound = Math.min(unverifiedBound, q.unverifiedMarginBound());
                }
            }
            return bound;
        }

        /**
         * A pass at any judged thickness ≥ x read on the decoded curve (the second stage): as measured for x ≥ d0
         * (the exact figure, or behind a layer the stack's per-point product), thinned below.
         */
        private double passOnCurve(WeightedScreen.Query q, double x) {
            if (x >= store.thicknessMm(curve)) {
                return Math.min(q.asMeasuredOnCurve(measured), q.behindLayerOnCurve(curve, measured, x));
            }
            return q.thinnedOnCurve(curve, measured, x);
        }

        /** P(x): an upper bound on every pass margin at any judged thickness ≥ x. */
        private double pass(double x) {
            double bound = Double.POSITIVE_INFINITY;
            for (int i = 0; i < queries.size() && !belowBar(bound); i++) {
                WeightedScreen.Query q = queries.get(i);
                if (q.passes() && !skipped(i)) {
                    bound = Math.min(bound, Math.min(q.thinned(curve, x),
                            Math.min(q.asMeasuredIfNotThinner(curve, x), q.behindLayer(curve, x))));
                    if (measured != null) {
                        bound = Math.min(bound, passOnCurve(q, x));
                    }
                }
            }
            return bound;
        }

        /** Q(x): an upper bound on every block margin at any judged thickness ≤ x. */
        private double block(double x) {
            double bound = Double.POSITIVE_INFINITY;
            for (int i = 0; i < queries.size() && !belowBar(bound); i++) {
                WeightedScreen.Query q = queries.get(i);
                if (!q.passes() && !skipped(i)) {
                    bound = Math.min(bound, q.thickened(curve, x));
                    if (measured != null) {
                        bound = Math.min(bound, q.thickenedOnCurve(curve, measured, x));
                    }
                }
            }
            return bound;
        }

        /** A bulk sample judged on its rescaled curve somewhere in [lo, hi]: see the class comment. */
        double rescaled(double lo, double hi) {
            double passCodes = Double.POSITIVE_INFINITY;
            double blockCodes = Double.POSITIVE_INFINITY;
            if (solvesFromCodes) {
                // the codes' P(lo) and Q(hi), a few flops each. In the first stage, where they already prove a miss the
                // bins are not read: they could only lower a proven miss's bound further, which proves nothing more
                // (Q(hi) is formed only where P(lo) proves nothing: it reads B over the curve's bins)
                boolean first = measured == null && codesFirst;
                passCodes = passFromCodes(lo, Double.POSITIVE_INFINITY);
                if (first && passCodes < 0) {
                    return passCodes;
                }
                blockCodes = blockFromCodes(hi, Double.POSITIVE_INFINITY);
                if (first && blockCodes < 0) {
                    return Math.min(passCodes, blockCodes);
                }
                if (first && deferBins) {
                    // the whole range's bound from the codes alone (P(lo) and Q(hi) bound every judged d in it): sound,
                    // never below the full one; the bins are read later only if this could still reach the rows
                    deferredNow = true;
                    return Math.min(passCodes, blockCodes);
                }
            }
            double passAtLo = Math.min(passCodes, pass(lo));
            // below the bar (a met row's margin, ≥ 0) already: the split rule only matters for proving a miss
            double blockAtHi = belowBar(passAtLo) ? Double.POSITIVE_INFINITY : Math.min(blockCodes, block(hi));
            double whole = Math.min(passAtLo, blockAtHi);
            if (whole < 0 || !(hi > lo) || belowBar(whole)) {
                return whole;
            }
            if (solvesFromCodes && (measured != null || Double.isFinite(passCodes) && blocksFromCodes)) {
                // split around the crossing (never above whole): in the first stage only where the codes bound a pass
                // and some block reads codes (without either the splits give the whole range's bound back); in the
                // second stage always, as P and Q are then also read on the curve at the splits
                whole = Math.min(whole, aroundTheCrossing(lo, hi, passAtLo, blockAtHi));
                if (whole < 0 || belowBar(whole)) {
                    return whole;
                }
            }
            // a split proves more only where both the pass is missed above it and the block below it
            double passAtHi = pass(hi);
            double blockAtLo = block(lo);
            if (!(passAtHi < 0) || !(blockAtLo < 0)) {
                return whole;
            }
            if (reference) { // the path before formed both ends' bounds twice
                passAtLo = pass(lo);
                blockAtHi = block(hi);
            }
            double ratio = hi / lo;
            for (int j = 1; j <= SPLITS; j++) {
                double s = lo * Math.pow(ratio, (double) j / (SPLITS + 1));
                double left = Math.min(passAtLo, block(s));
                if (!(left < 0)) {
                    break; // the block side only weakens as the split moves up
                }
                double right = Math.min(pass(s), blockAtHi);
                if (right < 0) {
                    return Math.min(whole, Math.max(left, right));
                }
            }
            return whole;
        }

        /**
         * The sample's bound over [lo, hi] from three splits placed around the crossing of the figure codes' P and Q
         * (docs/weighted-screening.md, "Bounds over thickness from the figure codes"): for any lo ≤ a ≤ b ≤ hi every
         * judged d lies in [lo, a], [a, b] or [b, hi], where its worst margin is at most min(P(lo), Q(a)),
         * min(P(a), Q(b)) or min(P(b), Q(hi)) (P(x) bounds every pass margin at d ≥ x, Q(x) every block margin at
         * d ≤ x); so the largest of the three bounds it wherever the judgement lands, sound whichever a and b are
         * taken. They are found by bisecting P − Q on the codes' closed forms ({@link WeightedScreen.Query#thinnedFromCode},
         * {@link WeightedScreen.Query#thickenedFromCode}, a few flops each), each capped by the whole range's
         * P(lo) and Q(hi) (which bound every smaller range's too); in the second stage P and Q at a and b are also
         * read on the curve.
         */
        private double aroundTheCrossing(double lo, double hi, double passAtLo, double blockAtHi) {
            double a = lo;
            double b = hi;
            for (int i = 0; i < CROSSING_STEPS; i++) {
                double m = 0.5 * (a + b);
                if (passFromCodes(m, passAtLo) > blockFromCodes(m, blockAtHi)) {
                    a = m; // the pass side still above: the crossing lies above m
                } else {
                    b = m;
                }
            }
            double passAtA = passFromCodes(a, passAtLo);
            double passAtB = passFromCodes(b, passAtLo);
            double blockAtA = blockFromCodes(a, blockAtHi);
            double blockAtB = blockFromCodes(b, blockAtHi);
            if (measured != null) { // the second stage: the curve's own bounds at the two splits as well
                passAtA = Math.min(passAtA, pass(a));
                passAtB = Math.min(passAtB, pass(b));
                blockAtA = Math.min(blockAtA, block(a));
                blockAtB = Math.min(blockAtB, block(b));
            }
            return Math.max(Math.min(passAtLo, blockAtA), Math.max(Math.min(passAtA, blockAtB), Math.min(passAtB, blockAtHi)));
        }

        /**
         * Whether the first stage of a solve reads the codes' bounds first and skips the bins where they prove a miss
         * ({@code -Dsieve.store.solve-codes-first=false}: the bins on every curve, for benchmarks and tests).
         */
        private static boolean codesFirst() {
            return !"false".equals(System.getProperty("sieve.store.solve-codes-first"));
        }

        /** P(x) from the figure codes alone, capped by {@code cap} (a P at a thinner x): every pass margin at d ≥ x. */
        private double passFromCodes(double x, double cap) {
            double bound = cap;
            for (int i = 0; i < queries.size(); i++) {
                WeightedScreen.Query q = queries.get(i);
                if (q.passes() && !skipped(i)) {
                    bound = Math.min(bound, q.thinnedFromCode(curve, x));
                }
            }
            return bound;
        }

        /** Q(x) from the figure codes alone, capped by {@code cap} (a Q at a thicker x): every block margin at d ≤ x. */
        private double blockFromCodes(double x, double cap) {
            double bound = cap;
            for (int i = 0; i < queries.size(); i++) {
                WeightedScreen.Query q = queries.get(i);
                if (!q.passes() && !skipped(i)) {
                    bound = Math.min(bound, q.thickenedFromCode(curve, x));
                }
            }
            return bound;
        }
    }
}
