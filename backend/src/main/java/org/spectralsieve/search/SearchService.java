package org.spectralsieve.search;

import static org.spectralsieve.search.Admission.admits;
import static org.spectralsieve.search.DiffuseLastRanking.diffuseLast;
import static org.spectralsieve.search.DiffuseLastRanking.rank;
import static org.spectralsieve.search.DiffuseLastRanking.regularOnly;
import static org.spectralsieve.search.RowDecoration.geometries;
import static org.spectralsieve.search.RowDecoration.measured;
import static org.spectralsieve.search.RowDecoration.revisions;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collection;
import java.util.Comparator;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.Queue;
import java.util.Set;
import java.util.concurrent.ConcurrentLinkedQueue;
import java.util.function.LongConsumer;
import java.util.function.LongFunction;
import java.util.function.Predicate;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.LibraryGeneration;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.library.SampleRescaling;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.library.StatedThicknesses;
import org.spectralsieve.library.UnusableRecordException;
import org.spectralsieve.optics.PhysicalRanges;
import org.spectralsieve.requirement.Aggregate;
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
import org.spectralsieve.requirement.TransmittanceClause;
import org.spectralsieve.search.MaterialCandidates.Prepared;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.store.MissScreen;
import org.spectralsieve.store.SampleReach;
import org.spectralsieve.store.SpectralStore;
import org.spectralsieve.store.StoreHit;
import org.spectralsieve.store.StoreResult;
import org.spectralsieve.store.StoreSearch;

/**
 * Answers requirements: the in-memory store picks the materials that can be in the shortlist, then the samples
 * of those materials are judged exactly on their stored curves, best store ceiling first, leaving out those that
 * provably cannot change a material's row ({@link BestSampleFirst}), and the exact judgements are ranked.
 * The store is derived from the database and rebuilt when the database changed, by this process or
 * another: before each answer the library's change counter ({@link LibraryGeneration}) is read, and a
 * snapshot read at an older number is rebuilt (see {@link #current()} and docs/freshness.md).
 *
 * <p>Requirements the store cannot rank — weighted figures, a critical wavelength, a fixed layer — are
 * judged exactly on every admitted sample, except samples the store proves to miss ({@link MissScreen}):
 * those are judged only while their bound could still reach the shortlist; and a material whose bound on a
 * met row's margin is below the margins of a shortlist already full of met rows is not judged at all
 * ({@link BoundedJudgement}, docs/weighted-screening.md, "Bounds that rank"). The screen uses the
 * requirement's every-point transmittance clauses that remain necessary conditions on the candidate
 * alone: without a layer, all of them (they are judged on the same curve); with a layer, only the passes,
 * and only over bands inside the layer's range, because a layer can only lower T (the stack's T is at most
 * each part's, T₁T₂/(1 − R₁R₂) ≤ T₁ since T₂ + R₂ ≤ 1), so a candidate too dark alone is too dark in the
 * stack, while one too bright alone may be dark enough behind the layer. Thickness keeps the proof where
 * T can only fall: a pass judged at or above the measured thickness, a block at or below it, any clause on
 * a sample measured at the asked thickness; and a material is held back only where the asked thickness can
 * be made for it (elsewhere its row is unverified, which ranks above a miss).
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

    /** The snapshot answered from, rebuilt when the library changed. */
    private final SnapshotHolder snapshots;
    /** A material's samples made ready for the exact judgement, their curves read through the snapshot's cache. */
    private final MaterialCandidates candidates;
    /** How many searches judge at once ({@link #limitConcurrentJudgements}); unbounded unless configured. */
    private volatile JudgementLanes lanes = JudgementLanes.unbounded();
    /** The store's screens giving each search its first bounds, with their switches. */
    private final FirstBoundScreens screens = new FirstBoundScreens();
    /**
     * Whether a contender about to be judged gets a second bound on its own decoded curve
     * ({@link WeightedMisses#secondStage}); off only so a benchmark and tests can compare both ways
     * ({@link #withoutSecondStage}).
     */
    private boolean secondStage = true;
    /**
     * Whether a picked material's samples are judged best store ceiling first, leaving out those that cannot change
     * its row ({@link BestSampleFirst}); the system property {@code sieve.search.sample-bound=false} judges every
     * sample, only so a benchmark can time both ways side by side (the answers are the same).
     */
    private boolean boundSamples = !"false".equals(System.getProperty("sieve.search.sample-bound"));
    /**
     * Whether, where a material's row is the best of its samples' rows each formed alone (as measured and at one
     * asked thickness), each sample is a contender of its own
     * (docs/weighted-screening.md, "Samples as contenders"); off only so a benchmark and tests can compare both
     * ways ({@link #withMaterialsWhole}).
     */
    private boolean samplesAsContenders = true;
    /** Rows known to be "not judged" from thicknesses alone wait last ({@link SettledRows}); off: judged as any other. */
    private boolean settledRows = true;
    /**
     * Whether, as measured, materials whose bounds lie below a cut wait in a reserve formed on demand
     * ({@link BoundedJudgement.Reserve}); {@code -Dsieve.search.contender-reserve=false} forms every contender first.
     */
    private boolean contenderReserve = !"false".equals(System.getProperty("sieve.search.contender-reserve"));
    /** Materials formed before the reserve, beyond four per row asked. */
    static final int RESERVE_AFTER = 256;
    private int reserveAfter = RESERVE_AFTER;
    /** A material's second bounds formed only up to the bar it must reach ({@link #refined}); off: every sample's. */
    private boolean secondBoundsToTheBar = !"false".equals(System.getProperty("sieve.search.second-bounds-to-the-bar"));
    /**
     * Whether {@link #searchExactly} keeps each sample's first bounds in arrays indexed by the store's row, formed once
     * per search ({@link FirstBounds#byRow}), walks the materials in the store's order over the snapshot's index
     * ({@link SnapshotIndex}) and chooses the samples judged at an asked thickness from the records
     * ({@link #judgedFromRecords}); {@code -Dsieve.search.row-arrays=false} keeps the maps keyed by sample id and the
     * rest the way before, only so a benchmark can time both ways (the same answers; docs/weighted-screening.md).
     */
    private boolean rowArrays = !"false".equals(System.getProperty("sieve.search.row-arrays"));
    /** How requirements the store cannot rank are judged ({@link #searchExactly}); other ways for benchmarks and tests. */
    private Judging judging = Judging.BOUNDED_PARALLEL;

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

    /** Contenders from which the judgement runs in parallel ({@link BoundedJudgement#PARALLEL_FROM}; tests lower it). */
    private int parallelFrom = BoundedJudgement.PARALLEL_FROM;

    /** Judges in parallel from this many contenders on (tests: 0, so a small library exercises the parallel loop). */
    SearchService parallelFrom(int contenders) {
        this.parallelFrom = contenders;
        return this;
    }

    /**
     * The same service judging every sample of each material the store picks, as before {@link BestSampleFirst}:
     * the same answers, more samples judged; for tests and benchmarks that compare both side by side.
     */
    public SearchService judgingEverySample() {
        this.boundSamples = false;
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
        this.judging = Objects.requireNonNull(way, "way");
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
        this.secondStage = false;
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
        this.samplesAsContenders = false;
        return this;
    }

    /**
     * The same service forming every contender before judging (no {@link BoundedJudgement.Reserve}): the same
     * answers and the same judgements; for benchmarks and tests side by side.
     */
    public SearchService withoutContenderReserve() {
        this.contenderReserve = false;
        return this;
    }

    /** The same service with its per-search bounds in row arrays (true) or in maps keyed by sample id (benchmarks, tests). */
    SearchService withRowArrays(boolean on) {
        this.rowArrays = on;
        return this;
    }

    /** The same service with a reserve after this many materials beyond four per row (tests: a small library's reserve). */
    SearchService reserveAfter(int materials) {
        this.reserveAfter = materials;
        return this;
    }

    /** The same service forming only this many materials before the reserve, whatever the limit (tests). */
    SearchService reserveCut(int materials) {
        this.reserveCut = materials;
        return this;
    }

    private int reserveCut = -1;

    /**
     * The same service judging rows known to be "not judged" from their thicknesses as any other contender (the loop
     * before {@link SettledRows}): the same answers, more samples judged; for benchmarks and tests side by side.
     */
    public SearchService withoutSettledRows() {
        this.settledRows = false;
        return this;
    }

    /**
     * The same service forming every admitted sample's second bound for a material contender (the loop before
     * second bounds went up to the bar, docs/weighted-screening.md): the same answers; for benchmarks and tests.
     */
    public SearchService withEverySecondBound() {
        this.secondBoundsToTheBar = false;
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
    }

    private SearchService(Snapshot fixed, LongFunction<Optional<Curve>> readCurve) {
        this.candidates = new MaterialCandidates(readCurve);
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
            return searchOn(s, requirement, limit, started);
        });
    }

    private Shortlist searchOn(Snapshot s, Requirement requirement, int limit, long started) {
        // a confidence demand can make a wide margin unverified: the store's margins cannot pick those rows; a
        // mean over a band, or a reading between grid wavelengths, the store takes on its grid and the exact
        // evaluator on the curve's own points, with no bound on the difference, so the store cannot pick those
        // rows either; nor a block over readings held at the store's OD ceiling (docs/store.md, "The store's error at
        // the cut")
        if (!requirement.plain() || requirement.asksConfidence() || hasMeanClause(requirement)
                || StoreSearch.readsBetweenGridPoints(s.store(), requirement)
                || StoreSearch.blocksAtTheCodeCeiling(s.store(), requirement)) {
            return searchExactly(s, requirement, limit, started, m -> true);
        }
        StoreResult picked = StoreSearch.search(s.store(), requirement, limit);
        // material id → one of its store curves (to find its samples' ceilings), NO_CURVE: judged whole
        Map<Long, Integer> materialIds = new LinkedHashMap<>();
        for (StoreHit hit : picked.hits()) {
            materialIds.put(hit.material().id(), hit.curve());
        }
        // the store holds an unusable sample at a thickness and index of its own: its store result bounds nothing
        s.unusable().forEach(sampleId -> materialIds.put(s.samples().get(sampleId).materialId(), NO_CURVE));
        List<MaterialEvaluation> exact = new ArrayList<>();
        judgeInto(s, requirement, materialIds, picked.sampleReach(), exact);
        List<RankedRow> rows = rank(s, requirement, exact, limit);
        if (rows.size() >= limit) {
            // the store's margins are off by a little: every material whose store result could still reach the
            // exact last row is judged too (docs/store.md, "The store's error at the cut")
            SampleEvaluation last = rows.get(limit - 1).evaluation();
            Map<Long, Integer> more = new LinkedHashMap<>();
            for (StoreHit hit : picked.handOver().reaching(last.standing(), last.worstMarginDecades())) {
                if (!materialIds.containsKey(hit.material().id())) {
                    more.put(hit.material().id(), hit.curve());
                }
            }
            if (!more.isEmpty()) {
                judgeInto(s, requirement, more, picked.sampleReach(), exact);
                rows = rank(s, requirement, exact, limit);
            }
        }
        double tookMs = (System.nanoTime() - started) / 1e6;
        return new Shortlist(requirement, rows, picked.evaluatedSamples(), exact.size(), tookMs, Optional.empty(),
                geometries(s, rows), revisions(s, rows), measured(s, rows));
    }

    /** In {@link #searchOn}'s map of materials to judge: no store curve speaks for the material's samples. */
    private static final int NO_CURVE = -1;

    /**
     * Judges the picked materials: each best sample first, leaving out samples whose store ceiling proves they
     * cannot change the material's row ({@link BestSampleFirst}), unless a sample of the material has an unusable
     * record (its store row bounds nothing, and it moves the others' spans) or the switch is off.
     */
    private void judgeInto(Snapshot s, Requirement requirement, Map<Long, Integer> curveOfMaterial, SampleReach reach,
                           List<MaterialEvaluation> exact) {
        boolean grouped = diffuseLast(requirement);
        curveOfMaterial.forEach((materialId, curve) -> {
            Material material = s.materials().get(materialId);
            if (boundSamples && curve != NO_CURVE) {
                Prepared p = candidates.prepare(s, material, requirement, false);
                Optional<List<MaterialEvaluation>> bestFirst = BestSampleFirst.judge(p.candidates(), p.failed(),
                        requirement, reach.curvesOfMaterialOf(curve), reach, grouped, p.sampleJudge());
                exact.addAll(bestFirst.orElseGet(() -> p.judge(requirement, Optional.empty())));
            } else {
                exact.addAll(candidates.judge(s, material, requirement, Optional.empty(), false));
            }
        });
    }

    private static boolean hasMeanClause(Requirement requirement) {
        return requirement.clauses().stream()
                .anyMatch(c -> c instanceof TransmittanceClause t && t.aggregate() == Aggregate.MEAN);
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
            return searchExactly(s, requirement, limit, started, m -> within.contains(m.id()));
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
     * The exact evaluator on every admitted sample that could reach the rows ({@link BoundedJudgement}): each
     * material comes with an upper bound on its row's margin from the store's screens, materials are judged
     * from the largest bound down, and one is left out once the rows are full of rows it provably cannot beat
     * (a proven miss behind rows better than its bound, or any material behind full rows of met rows whose
     * margins exceed its bound). The answer is the one judging every admitted sample would give.
     */
    private Shortlist searchExactly(Snapshot s, Requirement requirement, int limit, long started,
                                    Predicate<Material> within) {
        if (judging == Judging.EARLIER) {
            return searchExactlyTheEarlierWay(s, requirement, limit, started, within);
        }
        Optional<StackLayer> layer = requirement.layer().map(l -> resolveLayer(l, s));
        boolean diffuseLayer = layer.map(l -> s.samples().get(l.sampleId()).geometry() == Geometry.TOTAL).orElse(false);
        WeightedMisses.SecondStage[] formedSecondOut = new WeightedMisses.SecondStage[1];
        FirstBounds firstBounds = rowArrays ? screens.boundsByRow(s, requirement, layer, diffuseLayer, formedSecondOut)
                : screens.boundsBySampleId(s, requirement, layer, diffuseLayer, formedSecondOut);
        WeightedMisses.SecondStage formedSecond = formedSecondOut[0];
        boolean grouped = diffuseLast(requirement);
        ThicknessSpec spec = requirement.thickness();
        // at an asked thickness a material's samples are judged only where each is the nearest measurement: its
        // bound is the largest over those alone, so the candidates are made first (and kept for the judgement)
        boolean onlyJudgedSamples = spec.kind() != ThicknessSpec.Kind.AS_MEASURED && firstBounds.anyMargin();
        // a sample is a contender of its own where its row is formed alone and the material's row is the best of
        // its samples' rows: ranking by material keeps that best, so a sample that cannot enter is never it
        boolean bySample = samplesAsContenders && firstBounds.anyMargin() && spec.kind() != ThicknessSpec.Kind.RANGE;
        Map<Long, Prepared> prepared = new HashMap<>();
        Map<Long, Set<Long>> judgedOf = new HashMap<>();
        List<BoundedJudgement.Contender> contenders = new ArrayList<>();
        // as measured each sample's contender is formed from its bounds alone: a material all of whose samples' bounds
        // lie below the cut waits in a reserve, formed only if the judging loop reaches it (BoundedJudgement.Reserve).
        // Not behind a layer: there the figure codes are not read, and the bins' looser bounds mostly reach the reserve
        boolean deferrable = bySample && spec.kind() == ThicknessSpec.Kind.AS_MEASURED && layer.isEmpty() && contenderReserve;
        // by row sized for every material at once: at a million curves a third of a million are deferred, and growing
        // the lists copied them over and over
        List<Material> deferred = new ArrayList<>(rowArrays && deferrable ? s.materials().size() : 10);
        List<Boolean> deferredRegular = new ArrayList<>(rowArrays && deferrable ? s.materials().size() : 10);
        double[] deferredBound = deferrable ? new double[s.materials().size()] : null;
        // by row: each deferred material's made thicknesses, as the snapshot formed them
        MadeThicknesses[] deferredMade = deferrable ? new MadeThicknesses[s.materials().size()] : null;
        // each deferred material's first slot in the snapshot's index (by row only: the maps read no rows)
        int[] deferredSlot = deferrable ? new int[s.materials().size()] : null;
        int admitted = 0;
        // by row: the snapshot's materials in the order of the store's rows, so the bounds by row are read nearly in
        // sequence; by sample id: sorted by id per search, as before. The order contenders are formed in does not
        // matter: they are judged in BoundedJudgement.ORDER (bound, then material id and sample: a total order), and
        // the cut and the reserve's bound are a k-th largest and a maximum
        Admission admission = new Admission(requirement);
        SnapshotIndex.Slots slots = rowArrays ? s.index().slots() : null;
        List<Material> inOrder = rowArrays ? slots.materials
                : s.materials().values().stream().sorted(Comparator.comparingLong(Material::id)).toList();
        for (int mi = 0; mi < inOrder.size(); mi++) {
            Material material = inOrder.get(mi);
            if (!within.test(material)) {
                continue;
            }
            int firstSlot = rowArrays ? slots.firstSlot[mi] : -1;
            // by row: the class compared once per material, the geometry read from a table formed once per search
            boolean classAdmits = !rowArrays || admission.material(material);
            MadeThicknesses madeOfMaterial = rowArrays ? slots.made[mi] : null;
            Set<Long> judgedSamples = null;
            // over a range, a material whose every row is "not judged" from its thicknesses alone waits last and is
            // left out once better rows fill the limit (SettledRows); no curve of it is read unless it is judged
            boolean settled = settledRows && (rowArrays
                    ? settledOverRangeByRow(s, material, requirement, firstSlot, madeOfMaterial, admission)
                    : settledOverRange(material, requirement));
            // by row: the choice from the records where every admitted sample becomes a candidate, no curve read
            Optional<Set<Long>> chosen = onlyJudgedSamples && !settled && rowArrays
                    ? judgedFromRecords(s, material, spec, firstSlot, madeOfMaterial, admission) : Optional.empty();
            if (chosen.isPresent()) {
                judgedSamples = chosen.get();
                judgedOf.put(material.id(), judgedSamples);
            } else if (onlyJudgedSamples && !settled) {
                Prepared p = candidates.prepare(s, material, requirement, diffuseLayer);
                prepared.put(material.id(), p);
                judgedSamples = p.judgedSamples(spec);
                judgedOf.put(material.id(), judgedSamples);
            }
            double bound = Double.NEGATIVE_INFINITY;
            boolean allMiss = true;
            boolean regular = false;
            int count = 0;
            // by row: each sample's id, geometry and row from the index's arrays, its record not read
            List<SampleInfo> samples = rowArrays ? null : material.samples();
            int sampleCount = rowArrays ? slots.firstSlot[mi + 1] - firstSlot : samples.size();
            for (int k = 0; k < sampleCount; k++) {
                long sampleId = rowArrays ? slots.sampleIdBySlot[firstSlot + k] : samples.get(k).id();
                Geometry geometry = rowArrays ? slots.geometryBySlot[firstSlot + k] : samples.get(k).geometry();
                if (rowArrays ? classAdmits && admission.geometry(geometry) : admits(requirement, material, samples.get(k))) {
                    count++;
                    int row = rowArrays ? slots.rowBySlot[firstSlot + k] : -1;
                    allMiss &= !Double.isNaN(firstBounds.miss(sampleId, row));
                    regular |= grouped && geometry == Geometry.REGULAR;
                    if (judgedSamples == null || judgedSamples.contains(sampleId)) {
                        // a sample not judged gives no row (or one that says why it could not be judged, which
                        // never meets); for the others both bounds hold the same exact margin, the smaller too
                        bound = Math.max(bound, firstBounds.bound(sampleId, row));
                    }
                }
            }
            admitted += count;
            // judged whole: a material whose choice of samples failed (none judged; every row then says why). With
            // diffuse rows ranked apart, every sample of a material with a regular one competes with the regular rows
            // (as the material did): it is left out only once they are full, and then no diffuse row is shown at all
            if (count > 0 && deferrable && !(bound == Double.POSITIVE_INFINITY)) {
                deferredBound[deferred.size()] = bound; // at least each of its samples' contender bounds
                deferredSlot[deferred.size()] = firstSlot;
                deferredMade[deferred.size()] = madeOfMaterial;
                deferred.add(material);
                deferredRegular.add(regular);
            } else if (count > 0 && bySample && (judgedSamples == null || !judgedSamples.isEmpty())) {
                addSampleContenders(contenders, s, material, requirement, judgedSamples, prepared.get(material.id()),
                        firstBounds, firstSlot, regular, madeOfMaterial);
            } else if (count > 0 && settled) {
                contenders.add(new BoundedJudgement.Contender(material, Double.NEGATIVE_INFINITY, false, regular, true,
                        Double.NEGATIVE_INFINITY, BoundedJudgement.WHOLE_MATERIAL, true));
            } else if (count > 0) {
                contenders.add(new BoundedJudgement.Contender(material, bound,
                        allMiss && madeFor(s, spec, material), regular));
            }
        }
        BoundedJudgement.Reserve reserve = null;
        int inReserve = 0;
        if (!deferred.isEmpty()) {
            // materials above the cut are formed now, the others on demand: the cut leaves room for every row to be
            // judged several times over before the loop could reach the reserve
            double cut = BoundedJudgement.kthLargest(deferredBound, deferred.size(),
                    reserveCut > 0 ? reserveCut : reserveAfter + 4 * limit);
            // the deferred materials below the cut by index, in a plain array: at a million curves a third of a
            // million of them, one boxed number each before
            int[] later = new int[deferred.size()];
            double reserveBound = Double.NEGATIVE_INFINITY;
            for (int i = 0; i < deferred.size(); i++) {
                if (deferredBound[i] >= cut || Double.isNaN(deferredBound[i])) {
                    addSampleContenders(contenders, s, deferred.get(i), requirement, null, null, firstBounds,
                            deferredSlot[i], deferredRegular.get(i), deferredMade[i]);
                } else {
                    later[inReserve++] = i;
                    reserveBound = Math.max(reserveBound, deferredBound[i]);
                }
            }
            if (inReserve > 0) {
                double reserveAt = reserveBound;
                int waiting = inReserve;
                reserve = new BoundedJudgement.Reserve(reserveAt, () -> {
                    List<BoundedJudgement.Contender> formed = new ArrayList<>();
                    for (int k = 0; k < waiting; k++) {
                        int i = later[k];
                        addSampleContenders(formed, s, deferred.get(i), requirement, null, null,
                                firstBounds, deferredSlot[i], deferredRegular.get(i), deferredMade[i]);
                    }
                    return formed;
                });
            }
        }
        BoundedJudgement.Ranker ranker = new BoundedJudgement.Ranker(list -> rank(s, requirement, list, limit),
                grouped ? list -> Ranking.rank(regularOnly(s, list), limit) : null);
        // once the rows are full: the screen's own queries, and for a second bound formed at the same time on another
        // thread a second stage of its own (a stage keeps the curve it reads), kept for the rest of this search only
        WeightedMisses.SecondStage formed = formedSecond;
        Queue<WeightedMisses.SecondStage> idle = new ConcurrentLinkedQueue<>();
        if (formed != null) {
            idle.add(formed);
        }
        BoundedJudgement.Refiner refine = secondStage && formed != null && firstBounds.anyMargin()
                ? (c, bar) -> {
                    WeightedMisses.SecondStage stage = idle.poll();
                    stage = stage != null ? stage
                            : WeightedMisses.secondStage(s.store(), requirement, layer, diffuseLayer, screens.weightedLayerBlocks);
                    try {
                        return c.oneSample() ? refinedSample(s, c, requirement, firstBounds, stage,
                                        secondBoundsToTheBar ? bar : Double.NEGATIVE_INFINITY)
                                : refined(s, c, requirement, firstBounds, judgedOf.get(c.material().id()), stage,
                                        secondBoundsToTheBar ? bar : Double.NEGATIVE_INFINITY);
                    } finally {
                        idle.add(stage);
                    }
                }
                : null;
        // the prepared map is complete before any judging thread reads it, and never written after
        List<MaterialEvaluation> exact = BoundedJudgement.judgeContenders(contenders, reserve, limit, ranker,
                c -> {
                    Material m = c.material();
                    Prepared ready = prepared.get(m.id());
                    if (c.oneSample()) {
                        // alone only as measured: at one thickness which samples are judged, and over what span, still
                        // depends on all of them (MaterialJudge.evaluateOne), so the material is prepared whole
                        Prepared p = ready != null ? ready : spec.kind() == ThicknessSpec.Kind.AS_MEASURED
                                ? candidates.prepare(s, m, requirement, diffuseLayer, c.sampleId())
                                : candidates.prepare(s, m, requirement, diffuseLayer);
                        return p.judgeOne(requirement, layer, c.sampleId());
                    }
                    return ready != null ? ready.judge(requirement, layer) : candidates.judge(s, m, requirement, layer, diffuseLayer);
                }, judging == Judging.BOUNDED_PARALLEL && contenders.size() + inReserve >= parallelFrom, refine);
        List<RankedRow> rows = rank(s, requirement, exact, limit); // once, from every judgement: the answer's own rows
        double tookMs = (System.nanoTime() - started) / 1e6;
        return new Shortlist(requirement, rows, admitted, exact.size(), tookMs, layer, geometries(s, rows),
                revisions(s, rows), measured(s, rows));
    }

    /**
     * The samples {@link MaterialJudge#choose} judges at the asked thickness, from the material's records alone —
     * their thicknesses, the first one's rescaling and the made thicknesses, the very numbers the choice reads of the
     * candidates ({@link MaterialJudge#spans}) — where every admitted sample would become a candidate: its record is
     * usable ({@link SampleRescaling#unusable}: a thickness in range, so a candidate's checks hold) and the store holds
     * its row (its curve was read for this snapshot, and a curve row is never changed). Else empty: the material is
     * prepared, its curves read, as before. Forming the candidates of every material read every curve of the library
     * per search, a million at a million curves (docs/weighted-screening.md, "The service at a million curves").
     */
    private static Optional<Set<Long>> judgedFromRecords(Snapshot s, Material material, ThicknessSpec spec, int firstSlot,
                                                         MadeThicknesses made, Admission admission) {
        List<SampleInfo> samples = material.samples();
        double[] thicknessMm = new double[samples.size()];
        long[] ids = new long[samples.size()];
        int n = 0;
        int firstRow = -1;
        boolean classAdmits = admission.material(material);
        for (int k = 0; k < samples.size(); k++) {
            SampleInfo sample = samples.get(k);
            if (!(classAdmits && admission.geometry(sample))) {
                continue;
            }
            if (s.index().row(firstSlot + k) < 0 || SampleRescaling.unusable(material, sample).isPresent()) {
                return Optional.empty();
            }
            firstRow = n == 0 ? s.index().row(firstSlot + k) : firstRow;
            thicknessMm[n] = sample.thicknessMm();
            ids[n++] = sample.id();
        }
        if (n == 0) {
            return Optional.of(Set.of()); // no candidate: nothing is chosen
        }
        // the first candidate's rescaling, as its store row was formed with it (SampleRescaling.of of these records)
        boolean bulk = s.store().isBulk(firstRow);
        try {
            var spans = MaterialJudge.spans(Arrays.copyOf(thicknessMm, n), bulk, made, spec);
            Long[] judged = new Long[n];
            int count = 0;
            for (int i = 0; i < n; i++) {
                if (spans[i] != null) {
                    judged[count++] = ids[i];
                }
            }
            return Optional.of(Set.of(Arrays.copyOf(judged, count)));
        } catch (RuntimeException e) {
            return Optional.empty(); // prepared as before: its choice fails the same way there
        }
    }

    /**
     * The contender again with each admitted sample's bound lowered by the second stage on its decoded curve
     * ({@link WeightedMisses#secondStage}): the same rule as the first bounds in {@link #searchExactly} (the
     * largest over the samples judged, proven to miss when every admitted sample's bound is negative and the
     * material is made at the asked thickness), each sample's bound the smallest of its sound bounds; and it
     * cannot meet when every sample judged has a clause the second stage finds unverified on the very curve it
     * is judged on, or a negative bound. Against a met last row ({@code bar} its margin; {@code -∞} otherwise) only the
     * judged samples, largest first bound first, and only until the bound is settled against the bar; "proven to miss"
     * is then not claimed (docs/weighted-screening.md, "Second bounds up to the bar").
     */
    private BoundedJudgement.Contender refined(Snapshot s, BoundedJudgement.Contender c, Requirement requirement,
                                               FirstBounds firstBounds, Set<Long> judgedSamples,
                                               WeightedMisses.SecondStage second, double bar) {
        Material material = c.material();
        // every sample's: against a met last row (bar > -∞) the flags below are not read (couldEnter), only the bound
        boolean everySample = !(bar > Double.NEGATIVE_INFINITY);
        List<SampleInfo> admitted = new ArrayList<>();
        for (SampleInfo sample : material.samples()) {
            if (admits(requirement, material, sample)
                    && (everySample || judgedSamples == null || judgedSamples.contains(sample.id()))) {
                admitted.add(sample);
            }
        }
        double[] first = new double[admitted.size()];
        int[] rows = new int[admitted.size()];
        Integer[] order = new Integer[admitted.size()];
        for (int i = 0; i < first.length; i++) {
            long id = admitted.get(i).id();
            rows[i] = firstBounds.readsRows() ? s.index().rowOf(material, id) : -1;
            first[i] = firstBounds.bound(id, rows[i]);
            order[i] = i;
        }
        if (!everySample) {
            // largest first bound first, so the loop below stops as soon as the bound is settled against the bar
            Arrays.sort(order, (a, b) -> Double.compare(first[b], first[a]));
        }
        double bound = Double.NEGATIVE_INFINITY;
        boolean allMiss = true;
        boolean noneMeets = true;
        double unverifiedBound = Double.NEGATIVE_INFINITY;
        boolean reached = false; // a sample's second bound reached the bar: the material is judged whatever the others'
        for (int i : order) {
            SampleInfo sample = admitted.get(i);
            boolean cannotMeet = false;
            double ifUnverified = Double.POSITIVE_INFINITY;
            double b = first[i];
            int row = second == null ? -1 : firstBounds.secondStageRow(sample.id(), rows[i]);
            // up to the bar: a first bound below it cannot lift the material's bound to it, and once one sample's
            // second bound reaches it no other second bound keeps the material out (docs/weighted-screening.md)
            boolean form = everySample || !reached && !(b < bar);
            if (row >= 0 && form) {
                Optional<Curve> measured = candidates.curve(s, sample.id()); // the curve the judgement reads, cached for it
                if (measured.isPresent()) {
                    double onCurve = second.bound(row, measured.get(), bar);
                    cannotMeet = second.cannotMeet();
                    ifUnverified = second.unverifiedBound();
                    if (onCurve < b) {
                        b = onCurve;
                    }
                }
            }
            allMiss &= b < 0;
            if (judgedSamples == null || judgedSamples.contains(sample.id())) {
                bound = Math.max(bound, b);
                reached |= !(b < bar);
                // a negative bound proves a miss (a met row's every margin is at least 0): no met row either
                noneMeets &= cannotMeet || b < 0;
                unverifiedBound = Math.max(unverifiedBound, ifUnverified);
            }
        }
        // as measured and without a layer each sample is judged on the very curve read here, so an unverified
        // row's clauses read the margins the second stage found (docs/weighted-screening.md)
        boolean onTheCurve = requirement.thickness().kind() == ThicknessSpec.Kind.AS_MEASURED && requirement.layer().isEmpty();
        return new BoundedJudgement.Contender(material, bound,
                everySample && allMiss && madeFor(s, requirement.thickness(), material),
                c.regular(), noneMeets, onTheCurve ? unverifiedBound : Double.POSITIVE_INFINITY);
    }

    /**
     * One contender per sample of the material that gives a row (docs/weighted-screening.md, "Samples as
     * contenders"): every admitted sample as measured; at an asked thickness those {@link MaterialJudge} judges and
     * those that could not become a candidate (their rows say why). Each bound is the sample's own (the smaller of
     * its sound bounds, {@code +∞} when none), proven to miss when it is negative and the material is made at the
     * asked thickness.
     */
    private void addSampleContenders(List<BoundedJudgement.Contender> contenders, Snapshot s, Material material,
                                     Requirement requirement, Set<Long> judgedSamples, Prepared prepared,
                                     FirstBounds firstBounds, int firstSlot, boolean regular, MadeThicknesses madeOrNull) {
        // by row: no set per material when none failed (at a million curves a third of a million sets per search)
        Set<Long> failed = rowArrays && (prepared == null || prepared.failed().isEmpty()) ? Set.of() : new HashSet<>();
        if (prepared != null) {
            prepared.failed().forEach(e -> failed.add(e.evaluation().sampleId()));
        }
        boolean made = madeOrNull != null ? madeFor(requirement.thickness(), material, madeOrNull)
                : madeFor(s, requirement.thickness(), material);
        List<SampleInfo> samples = material.samples();
        for (int k = 0; k < samples.size(); k++) {
            SampleInfo sample = samples.get(k);
            if (!admits(requirement, material, sample)
                    || judgedSamples != null && !judgedSamples.contains(sample.id()) && !failed.contains(sample.id())) {
                continue;
            }
            // a sample that could not become a candidate says why, and so does one never rescaled or not made at the
            // asked thickness: rows not judged, known without reading the curve (SettledRows)
            if (settledRows && (failed.contains(sample.id()) || settledAtThickness(material, sample, requirement))) {
                contenders.add(new BoundedJudgement.Contender(material, Double.NEGATIVE_INFINITY, false, regular, true,
                        Double.NEGATIVE_INFINITY, sample.id(), true));
                continue;
            }
            double b = firstBounds.bound(sample.id(), firstSlot < 0 ? -1 : s.index().row(firstSlot + k));
            contenders.add(new BoundedJudgement.Contender(material, b, b < 0 && made, regular, false,
                    Double.POSITIVE_INFINITY, sample.id()));
        }
    }

    /**
     * Whether every row {@link MaterialJudge} forms for the material over the requirement's range is "not judged",
     * from its admitted samples' thicknesses, rescaling and made thicknesses alone ({@link SettledRows#overRange}).
     */
    static boolean settledOverRange(Material material, Requirement requirement) {
        return settledOverRange(material, requirement, null);
    }

    /**
     * {@link #settledOverRange(Material, Requirement)} in a loop over a million samples: no stream, the admission from
     * its table, the made thicknesses the snapshot formed, and each sample's rescaling read from its store row where it
     * has one (the row was formed with {@link SampleRescaling#of} of these very records, {@link SnapshotReader}).
     */
    private static boolean settledOverRangeByRow(Snapshot s, Material material, Requirement requirement, int firstSlot,
                                                 MadeThicknesses made, Admission admission) {
        if (requirement.thickness().kind() != ThicknessSpec.Kind.RANGE) {
            return false;
        }
        List<SampleInfo> samples = material.samples();
        double[] thicknessMm = new double[samples.size()];
        boolean[] rescalable = new boolean[samples.size()];
        int n = 0;
        boolean classAdmits = admission.material(material);
        for (int k = 0; k < samples.size(); k++) {
            SampleInfo sample = samples.get(k);
            if (classAdmits && admission.geometry(sample)) {
                int row = s.index().row(firstSlot + k);
                thicknessMm[n] = sample.thicknessMm();
                rescalable[n++] = row >= 0 ? s.store().isBulk(row) : SampleRescaling.of(material, sample).rescalable();
            }
        }
        return SettledRows.overRange(n == thicknessMm.length ? thicknessMm : Arrays.copyOf(thicknessMm, n),
                n == rescalable.length ? rescalable : Arrays.copyOf(rescalable, n), made, requirement.thickness());
    }

    /** {@link #settledOverRange(Material, Requirement)} with the material's made thicknesses, or null to form them. */
    private static boolean settledOverRange(Material material, Requirement requirement, MadeThicknesses madeOrNull) {
        if (requirement.thickness().kind() != ThicknessSpec.Kind.RANGE) {
            return false;
        }
        List<SampleInfo> admitted = material.samples().stream().filter(x -> admits(requirement, material, x)).toList();
        double[] thicknessMm = new double[admitted.size()];
        boolean[] rescalable = new boolean[admitted.size()];
        for (int i = 0; i < thicknessMm.length; i++) {
            thicknessMm[i] = admitted.get(i).thicknessMm();
            rescalable[i] = SampleRescaling.of(material, admitted.get(i)).rescalable();
        }
        return SettledRows.overRange(thicknessMm, rescalable, madeOrNull != null ? madeOrNull : made(material),
                requirement.thickness());
    }

    /**
     * Whether the row {@link MaterialJudge} forms for the sample alone at the requirement's one asked thickness is
     * "not judged", from its thickness, rescaling and its material's made thicknesses ({@link SettledRows#atThickness}).
     */
    static boolean settledAtThickness(Material material, SampleInfo sample, Requirement requirement) {
        // only at one asked thickness: the rescaling rule and the made thicknesses are not formed for other searches
        // (as measured this ran for every sample, a measurable part of a 10k search)
        return requirement.thickness().kind() == ThicknessSpec.Kind.FIXED
                && SettledRows.atThickness(sample.thicknessMm(), SampleRescaling.of(material, sample).rescalable(),
                made(material), requirement.thickness());
    }

    /**
     * A sample's contender again with its bound lowered by the second stage on its decoded curve, as
     * {@link #refined} does for each sample of a material: it cannot meet when a clause is unverified on the very
     * curve it is judged on or its bound is negative; as measured without a layer, its bound for an unverified row.
     */
    private BoundedJudgement.Contender refinedSample(Snapshot s, BoundedJudgement.Contender c, Requirement requirement,
                                                     FirstBounds firstBounds, WeightedMisses.SecondStage second,
                                                     double bar) {
        int storeRow = firstBounds.readsRows() ? s.index().rowOf(c.material(), c.sampleId()) : -1;
        double b = firstBounds.bound(c.sampleId(), storeRow);
        boolean cannotMeet = false;
        double ifUnverified = Double.POSITIVE_INFINITY;
        int row = firstBounds.secondStageRow(c.sampleId(), storeRow);
        if (row >= 0) {
            Optional<Curve> measured = candidates.curve(s, c.sampleId()); // the curve the judgement reads, cached for it
            if (measured.isPresent()) {
                // against a met last row the clauses after one below the bar are not read (WeightedMisses.SecondStage)
                double onCurve = second.bound(row, measured.get(), bar);
                cannotMeet = second.cannotMeet();
                ifUnverified = second.unverifiedBound();
                b = Math.min(b, onCurve);
            }
        }
        boolean onTheCurve = requirement.thickness().kind() == ThicknessSpec.Kind.AS_MEASURED && requirement.layer().isEmpty();
        return new BoundedJudgement.Contender(c.material(), b, b < 0 && madeFor(s, requirement.thickness(), c.material()),
                c.regular(), cannotMeet || b < 0, onTheCurve ? ifUnverified : Double.POSITIVE_INFINITY, c.sampleId());
    }

    /**
     * The exact evaluator on every admitted sample, with the store's proven misses held back: a material all
     * of whose admitted samples are proven to miss has an exact result no better than (misses, its largest
     * bound), so it is judged only while that could still beat the shortlist's last row. The answer is the
     * one judging every admitted sample would give. The judging loop before materials were ordered and left
     * out by their bounds of either sign ({@link Judging#EARLIER}); benchmarks and tests only.
     */
    private Shortlist searchExactlyTheEarlierWay(Snapshot s, Requirement requirement, int limit, long started,
                                    Predicate<Material> within) {
        Optional<StackLayer> layer = requirement.layer().map(l -> resolveLayer(l, s));
        boolean diffuseLayer = layer.map(l -> s.samples().get(l.sampleId()).geometry() == Geometry.TOTAL).orElse(false);
        Map<Long, Double> provenMiss = FirstBoundScreens.provenMisses(s, requirement, layer);
        if (screens.screenLayerBlocks) {
            layer.ifPresent(l -> FirstBoundScreens.addLayerBlockMisses(provenMiss, s.store(), requirement, l));
        }
        if (screens.screenWeighted && screens.earlierWeightedScreen) {
            WeightedMisses.addEarlier(provenMiss, s.store(), requirement, layer, diffuseLayer);
        } else if (screens.screenWeighted) {
            WeightedMisses.add(provenMiss, s.store(), requirement, layer, diffuseLayer);
        }
        // the store holds a sample whose record fails today's checks at a storable thickness with n = 1.5, while
        // the exact judgement reads its own record (a stack with the material's own index, say): a bound formed
        // on the store's stand-in proves nothing about that row, so such a sample is always judged exactly
        s.unusable().forEach(provenMiss::remove);
        List<MaterialEvaluation> exact = new ArrayList<>();
        Map<Material, Double> held = new LinkedHashMap<>();
        int admitted = 0;
        for (Material material : s.materials().values().stream().sorted(Comparator.comparingLong(Material::id))
                .filter(within).toList()) {
            double bound = Double.NEGATIVE_INFINITY;
            boolean allMiss = true;
            int count = 0;
            for (SampleInfo sample : material.samples()) {
                if (admits(requirement, material, sample)) {
                    count++;
                    Double b = provenMiss.get(sample.id());
                    allMiss &= b != null;
                    bound = b == null ? bound : Math.max(bound, b);
                }
            }
            admitted += count;
            if (count == 0) {
                continue;
            }
            if (allMiss && madeFor(requirement.thickness(), material, made(material))) {
                held.put(material, bound);
            } else {
                exact.addAll(candidates.judge(s, material, requirement, layer, diffuseLayer));
            }
        }
        List<RankedRow> rows = rank(s, requirement, exact, limit);
        List<Map.Entry<Material, Double>> byBound = new ArrayList<>(held.entrySet());
        byBound.sort(Map.Entry.<Material, Double>comparingByValue().reversed());
        boolean grouped = diffuseLast(requirement);
        // the top rows are kept up to date from themselves and each newly judged material (a top-k of a union
        // is the top-k of the parts' top-k), not re-ranked from every judgement: that was quadratic
        List<RankedRow> regularRows = grouped ? Ranking.rank(regularOnly(s, exact), limit) : List.of();
        boolean judgedHeld = false;
        for (Map.Entry<Material, Double> entry : byBound) {
            // grouped: a material with a regular sample competes only with the regular rows, which come first
            boolean regular = grouped && entry.getKey().samples().stream()
                    .anyMatch(x -> admits(requirement, entry.getKey(), x) && x.geometry() == Geometry.REGULAR);
            List<RankedRow> competing = regular ? regularRows : rows;
            if (!BoundedJudgement.couldEnter(competing, limit,
                    new BoundedJudgement.Contender(entry.getKey(), entry.getValue(), true, regular))) {
                if (grouped) {
                    continue; // the two groups' bounds are not ordered together
                }
                break; // bounds only fall from here on
            }
            List<MaterialEvaluation> judged = candidates.judge(s, entry.getKey(), requirement, layer, diffuseLayer);
            exact.addAll(judged);
            judgedHeld = true;
            rows = rank(s, requirement, BoundedJudgement.withRows(rows, judged), limit);
            if (grouped) {
                regularRows = Ranking.rank(regularOnly(s, BoundedJudgement.withRows(regularRows, judged)), limit);
            }
        }
        if (judgedHeld) {
            rows = rank(s, requirement, exact, limit); // once, from every judgement: the answer's own rows
        }
        double tookMs = (System.nanoTime() - started) / 1e6;
        return new Shortlist(requirement, rows, admitted, exact.size(), tookMs, layer, geometries(s, rows),
                revisions(s, rows), measured(s, rows));
    }

    /**
     * Whether the material can be judged at the asked thickness at all: where it is not made, its rows are
     * unverified (which ranks above a miss), so a proven miss on its curves says nothing about its row.
     */
    private boolean madeFor(Snapshot s, ThicknessSpec spec, Material material) {
        // by row: the snapshot's made thicknesses, formed once (the same object gives the same); else formed per call
        return madeFor(spec, material, rowArrays ? MaterialCandidates.madeOf(s, material) : made(material));
    }

    private static boolean madeFor(ThicknessSpec spec, Material material, MadeThicknesses made) {
        return switch (spec.kind()) {
            case AS_MEASURED -> true;
            case FIXED -> material.scaling() != Scaling.BULK || made.makes(spec.minMm());
            case RANGE -> material.scaling() != Scaling.BULK || made.within(spec.minMm(), spec.maxMm()) != null;
        };
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
        Optional<StackLayer> layer = requirement.layer().map(l -> resolveLayer(l, s));
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
        return resolveLayer(layer, current());
    }

    /** The fixed layer's material and sample from the library, the curve as the layer will be used. */
    private StackLayer resolveLayer(FixedLayer layer, Snapshot s) {
        List<Material> materials = s.materials().values().stream().sorted(Comparator.comparingLong(Material::id)).toList();
        LayerMatcher.Match match = LayerMatcher.resolve(layer, materials);
        Material m = match.material();
        SampleInfo sample = match.sample();
        Optional<String> unusable = SampleRescaling.unusable(m, sample);
        if (unusable.isPresent()) {
            throw new UnusableRecordException("the part in front, sample " + sample.id() + " of '" + m.name() + "', "
                    + unusable.get());
        }
        Curve curve = candidates.curve(s, sample.id()).orElseThrow(() -> new UnusableRecordException(
                "the part in front, sample " + sample.id() + " of '" + m.name() + "', has no readable curve"));
        return StackLayer.of(layer, m.id(), m.name(), m.slug(), sample.id(), curve, sample.thicknessMm(),
                SampleRescaling.of(m, sample).rescalable(), m.refractiveIndex());
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
