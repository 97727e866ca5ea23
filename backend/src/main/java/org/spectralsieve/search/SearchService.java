package org.spectralsieve.search;

import static org.spectralsieve.search.DiffuseLastRanking.rank;
import static org.spectralsieve.search.RowDecoration.measured;

import java.util.ArrayList;
import java.util.Collection;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.Set;
import java.util.function.LongConsumer;
import java.util.function.LongFunction;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.LibraryGeneration;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.library.StatedThicknesses;
import org.spectralsieve.optics.PhysicalRanges;
import org.spectralsieve.requirement.Direction;
import org.spectralsieve.requirement.FixedLayer;
import org.spectralsieve.requirement.MadeThicknesses;
import org.spectralsieve.requirement.MaterialEvaluation;
import org.spectralsieve.requirement.MaterialJudge;
import org.spectralsieve.requirement.RankedRow;
import org.spectralsieve.requirement.Ranking;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.SampleEvaluation;
import org.spectralsieve.requirement.StackLayer;
import org.spectralsieve.requirement.ThicknessSpec;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.store.SpectralStore;

/**
 * Answers requirements: the in-memory store picks the materials that can be in the shortlist, then the samples
 * of those materials are judged exactly on their stored curves, best store ceiling first, leaving out those that
 * provably cannot change a material's row ({@link BestSampleFirst}), and the exact judgements are ranked.
 * The store is derived from the database and rebuilt when the database changed, by this process or
 * another: before each answer the library's change counter ({@link LibraryGeneration}) is read, and a
 * snapshot read at an older number is rebuilt (see {@link #current()} and docs/freshness.md).
 *
 * <p>Requirements the store cannot rank — weighted figures, a critical wavelength, a fixed layer — are judged by
 * {@link BoundedExactSearch}, bounded by the store's screens ({@link FirstBoundScreens}, whose comment says which
 * clauses are screened and why a proof holds). The parts, one capability each: {@link SnapshotHolder} (the snapshot
 * and its freshness), {@link StorePickedSearch} (requirements the store ranks), {@link BoundedExactSearch} and
 * {@link EarlierExactSearch} (the others), {@link MaterialCandidates} (samples made ready for the exact judgement,
 * the fixed layer resolved), {@link DiffuseLastRanking} and {@link RowDecoration} (the answer's rows); this class
 * keeps the public methods and the switches tests and benchmarks set.
 *
 * <p>Each material's samples are judged together ({@link MaterialJudge}): the nearest measurement speaks
 * for each thickness, and rescaling stays inside the thicknesses the material is made in ({@link #made}).
 */
public class SearchService {

    /** Shortlist length when the caller names none, and the most a caller may ask for (HTTP and command line). */
    public static final int DEFAULT_LIMIT = 20;
    public static final int MAX_LIMIT = 500;
    /**
     * Heap for decoded curves by default (setting {@code sieve.search.curve-cache-mb}): 128 MB holds about
     * 15,000 curves of 911 points, so the demo library and a 10k library are judged from memory in a 512 MB
     * heap (docs/curve-cache.md).
     */
    public static final long DEFAULT_CURVE_CACHE_BYTES = 128L << 20;
    /** Materials formed before the contender reserve, beyond four per row asked ({@link BoundedExactSearch}). */
    static final int RESERVE_AFTER = BoundedExactSearch.RESERVE_AFTER;

    /** The snapshot answered from, rebuilt when the library changed. */
    private final SnapshotHolder snapshots;
    /** A material's samples made ready for the exact judgement, their curves read through the snapshot's cache. */
    private final MaterialCandidates candidates;
    /** The store's screens giving each search its first bounds, with their switches. */
    private final FirstBoundScreens screens = new FirstBoundScreens();
    /** The exact judgement, bounded by the store's screens, of requirements the store cannot rank; with its switches. */
    private final BoundedExactSearch exact;
    /** How many searches judge at once ({@link #limitConcurrentJudgements}); unbounded unless configured. */
    private volatile JudgementLanes lanes = JudgementLanes.unbounded();
    /** The search of requirements the store can rank (it hands the others to {@link #exact}). */
    private final StorePickedSearch picked;

    /**
     * How the exact judgement of a requirement the store cannot rank chooses and runs its materials; every way
     * gives the same answer (docs/weighted-screening.md, "Bounds that rank").
     */
    public enum Judging {
        /** Every material not proven to miss, in id order, then proven misses while they could enter; one thread. */
        EARLIER,
        /** Largest margin bound first, left out once the rows are full of rows it cannot beat ({@link BoundedJudgement}); one thread. */
        BOUNDED,
        /** {@link #BOUNDED}, each batch of materials judged on the common fork-join pool and the caller's thread. */
        BOUNDED_PARALLEL
    }

    /** Judges in parallel from this many contenders on (tests: 0, so a small library exercises the parallel loop). */
    SearchService parallelFrom(int contenders) {
        exact.parallelFrom = contenders;
        return this;
    }

    /**
     * The same service judging every sample of each material the store picks, as before {@link BestSampleFirst}:
     * the same answers, more samples judged; for tests and benchmarks that compare both side by side.
     */
    public SearchService judgingEverySample() {
        picked.boundSamples = false;
        return this;
    }

    /** The same service judging every sample afresh, as before {@link JudgementMemo}: the same answers. */
    public SearchService withoutJudgementMemo() {
        candidates.memo = null;
        return this;
    }

    /** The same service keeping its exact judgements in {@code kept} (tests: a small or a deliberately stale one). */
    SearchService withJudgementMemo(JudgementMemo kept) {
        candidates.memo = Objects.requireNonNull(kept, "kept");
        return this;
    }

    /** Tells the memo a search begins, so a requirement object searched again counts as asked again. */
    private void startsASearch() {
        JudgementMemo kept = candidates.memo;
        if (kept != null) {
            kept.searchStarts();
        }
    }

    /** The memo's hits, misses and entries (empty when the service keeps none): for the debug and BENCH lines. */
    public Optional<JudgementMemo.Counts> judgementMemoCounts() {
        JudgementMemo kept = candidates.memo;
        return kept == null ? Optional.empty() : Optional.of(kept.counts());
    }

    /** The same service judging the other way (benchmarks and equivalence tests; answers never depend on it). */
    public SearchService judging(Judging way) {
        exact.judging = Objects.requireNonNull(way, "way");
        return this;
    }

    public SearchService(JooqLibraryRepository library) {
        this(library, DEFAULT_CURVE_CACHE_BYTES);
    }

    /**
     * @param curveCacheBytes heap for decoded curves, so the exact judgement reads memory; 0 reads each judged
     *                        curve from the database (the way before the cache, kept for the benchmark)
     */
    public SearchService(JooqLibraryRepository library, long curveCacheBytes) {
        this(library, generation -> { }, curveCacheBytes);
    }

    /**
     * A service that judges weighted clauses on every admitted sample, as before the store screened them:
     * the same answers, slower; for benchmarks that time both side by side (docs/weighted-screening.md).
     */
    public static SearchService withoutWeightedScreen(JooqLibraryRepository library) {
        SearchService service = new SearchService(library);
        service.screens.screenWeighted = false;
        return service;
    }

    /**
     * A service whose weighted screen proves misses by the earlier rule (passes as measured, thinned and behind
     * a layer; no block judged thicker than measured, no split of a solved range): the same answers; for
     * benchmarks that time the rules side by side (docs/weighted-screening.md).
     */
    public static SearchService withEarlierWeightedScreen(JooqLibraryRepository library) {
        SearchService service = new SearchService(library);
        service.screens.earlierWeightedScreen = true;
        return service;
    }

    /**
     * The same service with the layer bounds before weighted blocks behind a layer were bounded and the layer
     * was read per integration point ({@code WeightedScreen.Query#behindLayer}): the same answers, more samples
     * judged; for benchmarks and tests that compare both side by side.
     */
    public SearchService withEarlierLayerBounds() {
        screens.weightedLayerBlocks = false;
        return this;
    }

    /**
     * The same service without the second, exact-curve stage of the bounded judging loop
     * (docs/weighted-screening.md, "A second, exact-curve stage"): the same answers, more samples judged; for
     * benchmarks and tests that compare both side by side.
     */
    public SearchService withoutSecondStage() {
        exact.secondStage = false;
        return this;
    }

    /**
     * The same service rebuilding the way before the ninth pass ({@code -Dsieve.search.rebuild-what-changed=false}): every changed
     * material read whole, also where the change log names the samples that changed, and every sample's row looked
     * up one by one; the same snapshot, more work; for benchmarks and tests that compare both side by side.
     */
    public SearchService withEarlierRebuild() {
        snapshots.rebuildTheEarlierWay();
        return this;
    }

    /**
     * The same service judging every material whole (the loop before samples became contenders of their own,
     * docs/weighted-screening.md "Samples as contenders"): the same answers, more samples judged; for benchmarks
     * and tests that compare both side by side.
     */
    public SearchService withMaterialsWhole() {
        exact.samplesAsContenders = false;
        return this;
    }

    /**
     * The same service forming every contender before judging (no {@link BoundedJudgement.Reserve}): the same
     * answers and the same judgements; for benchmarks and tests side by side.
     */
    public SearchService withoutContenderReserve() {
        exact.contenderReserve = false;
        return this;
    }

    /** The same service with its per-search bounds in row arrays (true) or in maps keyed by sample id (benchmarks, tests). */
    SearchService withRowArrays(boolean on) {
        exact.rowArrays = on;
        return this;
    }

    /**
     * The same service with the twelfth pass's sweep over the index's slots and the screen's bounds read in place
     * ({@code on}, the default) or the eleventh pass's loop and arrays: benchmarks and tests
     * ({@code -Dsieve.search.slot-sweep=false}; docs/weighted-screening.md, "The service as measured at a million curves").
     */
    SearchService withSlotSweep(boolean on) {
        exact.slotSweep = on;
        screens.screenAloneInPlace = on;
        return this;
    }

    /**
     * The same service with a solve's bins left unread where the figure codes prove no miss, read in full for the
     * contenders formed ({@code on}, the default from 100,000 curves; here at any size), or every curve's bins read by
     * the screen: benchmarks and tests
     * ({@code -Dsieve.search.deferred-bins=false}; docs/weighted-screening.md, "Wired into the service").
     */
    SearchService withDeferredBins(boolean on) {
        screens.deferredBins = on;
        screens.deferredBinsFrom = 0; // whatever the library's size: tests and benchmarks
        return this;
    }

    /** The same service sweeping the slots in two halves from this many materials on (tests: a small library's). */
    SearchService sweepInTwoFrom(int materials) {
        exact.sweepInTwoFrom = materials;
        return this;
    }

    /** The same service with a reserve after this many materials beyond four per row (tests: a small library's reserve). */
    SearchService reserveAfter(int materials) {
        exact.reserveAfter = materials;
        return this;
    }

    /** The same service forming only this many materials before the reserve, whatever the limit (tests). */
    SearchService reserveCut(int materials) {
        exact.reserveCut = materials;
        return this;
    }

    /**
     * The same service judging rows known to be "not judged" from their thicknesses as any other contender (the loop
     * before {@link SettledRows}): the same answers, more samples judged; for benchmarks and tests side by side.
     */
    public SearchService withoutSettledRows() {
        exact.settledRows = false;
        return this;
    }

    /**
     * The same service forming every admitted sample's second bound for a material contender (the loop before
     * second bounds went up to the bar, docs/weighted-screening.md): the same answers; for benchmarks and tests.
     */
    public SearchService withEverySecondBound() {
        exact.secondBoundsToTheBar = false;
        return this;
    }

    /**
     * At most {@code lanes} searches judge at once, the others wait their turn in arrival order; 0 puts no
     * bound. The freshness check and a rebuild of the store run outside the lanes (docs/search-under-load.md).
     */
    public SearchService limitConcurrentJudgements(int lanes) {
        this.lanes = JudgementLanes.of(lanes);
        return this;
    }

    /** @param beforeInstall called with the built snapshot's generation just before it is installed (tests) */
    SearchService(JooqLibraryRepository library, LongConsumer beforeInstall) {
        this(library, beforeInstall, DEFAULT_CURVE_CACHE_BYTES);
    }

    private SearchService(JooqLibraryRepository library, LongConsumer beforeInstall, long curveCacheBytes) {
        this.snapshots = new SnapshotHolder(library, beforeInstall, curveCacheBytes);
        this.candidates = new MaterialCandidates(library::findCurve);
        this.candidates.readStates = library::findStateCurves;
        this.exact = new BoundedExactSearch(candidates, screens);
        this.picked = new StorePickedSearch(candidates, exact);
    }

    private SearchService(Snapshot fixed, LongFunction<Optional<Curve>> readCurve) {
        this.candidates = new MaterialCandidates(readCurve);
        this.exact = new BoundedExactSearch(candidates, screens);
        this.picked = new StorePickedSearch(candidates, exact);
        this.snapshots = new SnapshotHolder(fixed);
    }

    /**
     * A service answering from one snapshot formed without a database ({@link SnapshotReader#ofRecords}), reading a
     * curve its cache does not hold from {@code readCurve}: for the benchmark at a million curves, which no database
     * is filled with in a benchmark's time. Only searches: it never rebuilds (there is no change counter to read).
     */
    static SearchService over(Snapshot fixed, LongFunction<Optional<Curve>> readCurve) {
        return new SearchService(fixed, readCurve);
    }

    public Shortlist search(Requirement requirement, int limit) {
        long started = System.nanoTime();
        Snapshot s = current();
        return lanes.run(() -> {
            startsASearch();
            return picked.searchOn(s, requirement, limit, started);
        });
    }

    /**
     * The requirement judged on the given materials alone (those the library's text index admitted for words
     * written with it, docs/library-search.md): every admitted sample of them judged exactly, ranked as
     * {@link #search(Requirement, int)} ranks; a material id not in the library is ignored. The answer's rows
     * are the rows the whole library's answer would give for these materials, in the same order.
     */
    public Shortlist search(Requirement requirement, int limit, Set<Long> withinMaterials) {
        long started = System.nanoTime();
        Set<Long> within = Set.copyOf(withinMaterials);
        Snapshot s = current();
        return lanes.run(() -> {
            startsASearch();
            return exact.searchExactly(s, requirement, limit, started, m -> within.contains(m.id()));
        });
    }

    /** The thicknesses a library material exists in: as its record states, else the assumed rule on its samples. */
    public static MadeThicknesses made(Material material) {
        StatedThicknesses t = material.thicknesses();
        // a thickness stored before it was checked (1e-300 mm) says nothing about what is made
        List<Double> measured = material.samples().stream().map(SampleInfo::thicknessMm)
                .filter(PhysicalRanges::isThicknessMm).toList();
        return MadeThicknesses.of(t.stockMm(), t.minMm(), t.maxMm(), measured);
    }

    /**
     * Each named material's row as {@link #search} would show it — its admitted samples judged exactly
     * ({@link MaterialJudge}, at the requirement's thickness, behind its layer), the best kept by
     * {@link Ranking} — for questions that judge a chosen few materials (similar curves filtered by a
     * requirement, docs/similar-curves.md). A material with no admitted sample has no row; an unknown id is
     * skipped.
     *
     * @throws LayerResolutionException when the requirement's layer names no single library sample
     */
    public Map<Long, SampleEvaluationRow> judgeMaterials(Requirement requirement, Collection<Long> materialIds) {
        Snapshot s = current();
        Optional<StackLayer> layer = requirement.layer().map(l -> candidates.resolveLayer(l, s));
        boolean diffuseLayer = layer.map(l -> s.samples().get(l.sampleId()).geometry() == Geometry.TOTAL).orElse(false);
        List<MaterialEvaluation> exact = new ArrayList<>();
        for (long id : new LinkedHashSet<>(materialIds)) {
            Material material = s.materials().get(id);
            if (material != null) {
                exact.addAll(candidates.judge(s, material, requirement, layer, diffuseLayer));
            }
        }
        Map<Long, SampleEvaluationRow> out = new LinkedHashMap<>();
        for (RankedRow row : Ranking.rank(exact, exact.size())) {
            out.put(row.materialId(), new SampleEvaluationRow(row.materialId(), row.evaluation()));
        }
        return out;
    }

    /** One material's row: the sample that speaks for it and its evaluation. */
    public record SampleEvaluationRow(long materialId, org.spectralsieve.requirement.SampleEvaluation evaluation) {
    }

    /**
     * A fixed layer resolved against the current library exactly as a requirement's layer is (same matching
     * rule, same sample choice, rescaled the same way), for figures of a sample seen through that part.
     *
     * @throws LayerResolutionException when the words name no material, several, or a fixed part not
     *                                  measured at that thickness
     */
    public StackLayer resolveLayer(FixedLayer layer) {
        return candidates.resolveLayer(layer, current());
    }

    /**
     * The class labels the library's materials are filed under, sorted: the classes a requirement's class
     * filter may name (any other would search nothing).
     */
    public List<String> materialClasses() {
        return current().materials().values().stream().map(m -> m.materialClass().label()).distinct().sorted().toList();
    }

    /**
     * The current store (rebuilt first when the library changed): every curve in use, for searches that read
     * all of them, such as {@link SimilarSamples}.
     */
    public SpectralStore store() {
        return current().store();
    }

    /** The current snapshot's decoded curves: how many, their heap (estimate) and the budget (docs/curve-cache.md). */
    public CurveCacheUse curveCacheUse() {
        CurveCache cache = current().curves();
        return new CurveCacheUse(cache.size(), cache.heapBytes(), cache.budgetBytes());
    }

    /** @param heapBytes estimated heap of the cached curves and the arrays they share */
    public record CurveCacheUse(int curves, long heapBytes, long budgetBytes) {
    }

    /**
     * Brings the snapshot up to the library's change counter now, on the caller's thread, after this process
     * committed a write; returns at once when another thread is rebuilding, and a failure is left to the next
     * search ({@link SnapshotHolder#refresh}).
     */
    public void refresh() {
        snapshots.refresh();
    }

    /** Marks the derived store stale; the next search rebuilds it from the database ({@link SnapshotHolder#invalidate}). */
    public void invalidate() {
        snapshots.invalidate();
    }

    /** The snapshot to answer from, rebuilt first when the library changed ({@link SnapshotHolder#current}). */
    private Snapshot current() {
        return snapshots.current();
    }

    /**
     * Whether a miss proven on the measured curve stays proven at the thickness the sample is judged at
     * ({@link FirstBoundScreens#keepsProof}; the weighted screen's proofs follow the same rule).
     */
    static boolean keepsProof(Direction direction, ThicknessSpec spec, double d0, boolean rescalable) {
        return FirstBoundScreens.keepsProof(direction, spec, d0, rescalable);
    }
}
