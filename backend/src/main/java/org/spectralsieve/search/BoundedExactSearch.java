package org.spectralsieve.search;

import static org.spectralsieve.search.Admission.admits;
import static org.spectralsieve.search.DiffuseLastRanking.diffuseLast;
import static org.spectralsieve.search.DiffuseLastRanking.rank;
import static org.spectralsieve.search.DiffuseLastRanking.regularOnly;
import static org.spectralsieve.search.RowDecoration.geometries;
import static org.spectralsieve.search.RowDecoration.measured;
import static org.spectralsieve.search.RowDecoration.revisions;
import static org.spectralsieve.search.SearchService.made;
import static org.spectralsieve.search.SettledRows.settledAtThickness;
import static org.spectralsieve.search.SettledRows.settledOverRange;
import static org.spectralsieve.search.SettledRows.settledOverRangeByRow;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Queue;
import java.util.Set;
import java.util.concurrent.ConcurrentLinkedQueue;
import java.util.function.Predicate;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.library.SampleRescaling;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.requirement.MadeThicknesses;
import org.spectralsieve.requirement.MaterialEvaluation;
import org.spectralsieve.requirement.MaterialJudge;
import org.spectralsieve.requirement.RankedRow;
import org.spectralsieve.requirement.Ranking;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.StackLayer;
import org.spectralsieve.requirement.ThicknessSpec;
import org.spectralsieve.search.MaterialCandidates.Prepared;
import org.spectralsieve.search.SearchService.Judging;
import org.spectralsieve.spectrum.Curve;

/**
 * The exact judgement of a requirement the store cannot rank — weighted figures, a critical wavelength, a fixed layer,
 * a mean or a confidence demand — bounded by the store's screens ({@link BoundedJudgement}): every admitted sample's
 * first bounds ({@link FirstBoundScreens}), one contender per material or per sample, the settled rows last, the
 * materials far below the cut in a reserve, a second bound on a contender's own decoded curve just before it is
 * judged, and the exact judgements ranked ({@link DiffuseLastRanking}). The answer is the one judging every admitted
 * sample would give (docs/weighted-screening.md). The loop before materials were ordered by their bounds
 * ({@link SearchService.Judging#EARLIER}) is kept beside it for benchmarks and tests.
 */
final class BoundedExactSearch {

    private final MaterialCandidates candidates;
    private final FirstBoundScreens screens;
    /** The loop before this one ({@link Judging#EARLIER}), for benchmarks and tests. */
    private final EarlierExactSearch earlier;
    /**
     * Whether a contender about to be judged gets a second bound on its own decoded curve
     * ({@link WeightedMisses#secondStage}); off only so a benchmark and tests can compare both ways
     * ({@link SearchService#withoutSecondStage}).
     */
    boolean secondStage = true;
    /**
     * Whether, where a material's row is the best of its samples' rows each formed alone (as measured and at one
     * asked thickness), each sample is a contender of its own
     * (docs/weighted-screening.md, "Samples as contenders"); off only so a benchmark and tests can compare both
     * ways ({@link SearchService#withMaterialsWhole}).
     */
    boolean samplesAsContenders = true;
    /** Rows known to be "not judged" from thicknesses alone wait last ({@link SettledRows}); off: judged as any other. */
    boolean settledRows = true;
    /**
     * Whether, as measured, materials whose bounds lie below a cut wait in a reserve formed on demand
     * ({@link BoundedJudgement.Reserve}); {@code -Dsieve.search.contender-reserve=false} forms every contender first.
     */
    boolean contenderReserve = !"false".equals(System.getProperty("sieve.search.contender-reserve"));
    /** Materials formed before the reserve, beyond four per row asked. */
    static final int RESERVE_AFTER = 256;
    int reserveAfter = RESERVE_AFTER;
    /** A material's second bounds formed only up to the bar it must reach ({@link #refined}); off: every sample's. */
    boolean secondBoundsToTheBar = !"false".equals(System.getProperty("sieve.search.second-bounds-to-the-bar"));
    /**
     * Whether {@link #searchExactly} keeps each sample's first bounds in arrays indexed by the store's row, formed once
     * per search ({@link FirstBounds#byRow}), walks the materials in the store's order over the snapshot's index
     * ({@link SnapshotIndex}) and chooses the samples judged at an asked thickness from the records
     * ({@link #judgedFromRecords}); {@code -Dsieve.search.row-arrays=false} keeps the maps keyed by sample id and the
     * rest the way before, only so a benchmark can time both ways (the same answers; docs/weighted-screening.md).
     */
    boolean rowArrays = !"false".equals(System.getProperty("sieve.search.row-arrays"));
    /**
     * Whether, as measured without a layer over the whole library, the contenders and the reserve are formed by the
     * sweep over the snapshot index's slots ({@link SlotSweep}) and the first bounds read in the weighted screen's own
     * array where no other screen bounded anything ({@link FirstBounds#screenAlone});
     * {@code -Dsieve.search.slot-sweep=false} keeps the eleventh pass's loop and arrays, only so a benchmark can time
     * both ways (the same answers; docs/weighted-screening.md, "The service as measured at a million curves").
     */
    boolean slotSweep = !"false".equals(System.getProperty("sieve.search.slot-sweep"));
    /**
     * Materials of a solve that waited for their unread bins, and of those the ones put in a reserve
     * ({@link #formBinsDeferred}), since the start (tests and benchmarks read them).
     */
    static final java.util.concurrent.atomic.AtomicLong BINS_UNREAD_MATERIALS = new java.util.concurrent.atomic.AtomicLong();
    static final java.util.concurrent.atomic.AtomicLong BINS_UNREAD_IN_RESERVE = new java.util.concurrent.atomic.AtomicLong();
    /**
     * A solve's cut for the materials waiting for their bins, in multiples of the reserve's cut: at a million curves
     * the service's solve judged ~1,400 materials at limit 20, beyond a cut of 336, so the reserve was formed in every
     * search and all 147k waiting materials read in full; four times it, the reserve was never formed
     * (docs/weighted-screening.md, "Wired into the service"). Only the work depends on it, never the answer.
     */
    static final int BINS_UNREAD_CUT_TIMES = 4;
    /** Materials from which the sweep runs in two halves when judging in parallel ({@link SlotSweep#PARALLEL_FROM}; tests lower it). */
    int sweepInTwoFrom = SlotSweep.PARALLEL_FROM;
    /** {@link #searchExactly}'s {@code within} for the whole library: the sweep serves only it. */
    static final Predicate<Material> EVERY_MATERIAL = m -> true;
    /** How requirements the store cannot rank are judged ({@link #searchExactly}); other ways for benchmarks and tests. */
    Judging judging = Judging.BOUNDED_PARALLEL;
    /** Contenders from which the judgement runs in parallel ({@link BoundedJudgement#PARALLEL_FROM}; tests lower it). */
    int parallelFrom = BoundedJudgement.PARALLEL_FROM;
    /** Materials formed before the reserve whatever the limit (tests), or -1: the reserve's own rule. */
    int reserveCut = -1;

    BoundedExactSearch(MaterialCandidates candidates, FirstBoundScreens screens) {
        this.candidates = candidates;
        this.screens = screens;
        this.earlier = new EarlierExactSearch(candidates, screens);
    }

    /**
     * The exact evaluator on every admitted sample that could reach the rows ({@link BoundedJudgement}): each
     * material comes with an upper bound on its row's margin from the store's screens, materials are judged
     * from the largest bound down, and one is left out once the rows are full of rows it provably cannot beat
     * (a proven miss behind rows better than its bound, or any material behind full rows of met rows whose
     * margins exceed its bound). The answer is the one judging every admitted sample would give.
     */
    Shortlist searchExactly(Snapshot s, Requirement requirement, int limit, long started,
                                    Predicate<Material> within) {
        if (judging == Judging.EARLIER) {
            return earlier.searchExactlyTheEarlierWay(s, requirement, limit, started, within);
        }
        Optional<StackLayer> layer = requirement.layer().map(l -> candidates.resolveLayer(l, s));
        boolean diffuseLayer = layer.map(l -> s.samples().get(l.sampleId()).geometry() == Geometry.TOTAL).orElse(false);
        WeightedMisses.SecondStage[] formedSecondOut = new WeightedMisses.SecondStage[1];
        // the store's curves are at normal incidence: for light at an angle no screen bounds a row, every one is judged
        FirstBounds firstBounds = requirement.oblique() ? FirstBounds.bySampleId(new HashMap<>(), new HashMap<>(), new HashMap<>())
                : rowArrays ? screens.boundsByRow(s, requirement, layer, diffuseLayer, formedSecondOut)
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
        // over the whole library the sweep over the index's slots forms the same contenders and reserve without a
        // record or an object per material (SlotSweep); else the loop below, the eleventh pass's
        boolean swept = slotSweep && rowArrays && deferrable && within == EVERY_MATERIAL;
        int deferring = deferrable && !swept ? s.materials().size() : 0;
        // by row sized for every material at once: at a million curves a third of a million are deferred, and growing
        // the lists copied them over and over
        List<Material> deferred = new ArrayList<>(rowArrays && deferring > 0 ? deferring : 10);
        List<Boolean> deferredRegular = new ArrayList<>(rowArrays && deferring > 0 ? deferring : 10);
        double[] deferredBound = deferrable ? new double[deferring] : null;
        // by row: each deferred material's made thicknesses, as the snapshot formed them
        MadeThicknesses[] deferredMade = deferrable ? new MadeThicknesses[deferring] : null;
        // each deferred material's first slot in the snapshot's index (by row only: the maps read no rows)
        int[] deferredSlot = deferrable ? new int[deferring] : null;
        int admitted = 0;
        // by row: the snapshot's materials in the order of the store's rows, so the bounds by row are read nearly in
        // sequence; by sample id: sorted by id per search, as before. The order contenders are formed in does not
        // matter: they are judged in BoundedJudgement.ORDER (bound, then material id and sample: a total order), and
        // the cut and the reserve's bound are a k-th largest and a maximum
        Admission admission = new Admission(requirement);
        SnapshotIndex.Slots slots = rowArrays ? s.index().slots() : null;
        List<Material> inOrder = rowArrays ? slots.materials
                : s.materials().values().stream().sorted(Comparator.comparingLong(Material::id)).toList();
        BoundedJudgement.Reserve reserve = null;
        int inReserve = 0;
        // a solve whose screen left bins unread: materials with such a row wait here, by their codes' bound, until
        // their rows are read in full (formBinsDeferred); none otherwise
        WeightedMisses.DeferredBins unread = rowArrays ? firstBounds.deferredBins() : null;
        BinsDeferred binsDeferred = unread == null ? null : new BinsDeferred(s.materials().size());
        if (swept) {
            SlotSweep.Formed formed = SlotSweep.form(slots, firstBounds, admission, grouped,
                    reserveCut > 0 ? reserveCut : reserveAfter + 4 * limit,
                    judging == Judging.BOUNDED_PARALLEL ? sweepInTwoFrom : Integer.MAX_VALUE);
            contenders.addAll(formed.contenders());
            reserve = formed.reserve();
            inReserve = formed.inReserve();
            admitted = formed.admitted();
        }
        for (int mi = 0; !swept && mi < inOrder.size(); mi++) {
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
            boolean anyUnread = false;
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
                    anyUnread |= unread != null && row >= 0 && unread.deferred()[row];
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
            } else if (count > 0 && anyUnread) {
                binsDeferred.add(mi, bound, regular); // at least the bound its rows read in full give
            } else if (count > 0) {
                contenders.add(new BoundedJudgement.Contender(material, bound,
                        allMiss && madeFor(s, spec, material), regular));
            }
        }
        if (binsDeferred != null && binsDeferred.count > 0) {
            // a solve over a range: never with the as-measured reserve above (both cannot be formed in one search)
            int binsCut = reserveCut > 0 ? reserveCut : BINS_UNREAD_CUT_TIMES * (reserveAfter + 4 * limit);
            reserve = formBinsDeferred(s, requirement, binsDeferred, unread, firstBounds, judgedOf, admission, contenders,
                    binsCut);
            inReserve = binsDeferred.inReserve;
        }
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
                revisions(s, rows), measured(s, rows), s.generation());
    }

    /** The materials of a solve with a row whose bins the screen left unread, by index in the snapshot's slots. */
    private static final class BinsDeferred {
        final int[] material;
        final double[] codesBound;
        final boolean[] regular;
        int count;
        int inReserve;

        BinsDeferred(int materials) {
            material = new int[materials];
            codesBound = new double[materials];
            regular = new boolean[materials];
        }

        void add(int mi, double bound, boolean isRegular) {
            material[count] = mi;
            codesBound[count] = bound;
            regular[count++] = isRegular;
        }
    }

    /**
     * The contenders of a solve's materials whose rows the screen left partly unread ({@link BinsDeferred}), each with
     * the very bound and proven-miss flag the screen read in full gives it (docs/weighted-screening.md, "Wired into the
     * service"): the materials with the {@code 4·cut} largest codes' bounds (or no number) are read in full and formed
     * first; F is then the {@code cut}-th largest bound of every contender formed (full bounds); a material whose
     * codes' bound (at least its full one) reaches F is read in full and formed now, the others wait
     * in a {@link BoundedJudgement.Reserve} whose bound is the largest of their codes' bounds and which reads them in
     * full only if the loop forms it. The reserve's contract makes the judged contenders and their order those of every
     * contender formed at the start with its full bound, whatever F is; F only chooses how many are read now.
     *
     * @return the reserve, or null when every material was formed now
     */
    private BoundedJudgement.Reserve formBinsDeferred(Snapshot s, Requirement requirement, BinsDeferred waiting,
                                                      WeightedMisses.DeferredBins unread, FirstBounds firstBounds,
                                                      Map<Long, Set<Long>> judgedOf, Admission admission,
                                                      List<BoundedJudgement.Contender> contenders,
                                                      int cut) {
        // first the 4·cut largest codes' bounds, read in full: their full bounds can only raise F, so fewer are read
        // after (a k-th largest of more numbers is no smaller)
        double firstAt = BoundedJudgement.kthLargest(waiting.codesBound, waiting.count, 4 * cut);
        int[] first = new int[waiting.count];
        int firstCount = 0;
        for (int i = 0; i < waiting.count; i++) {
            double b = waiting.codesBound[i];
            if (!Double.isFinite(b) || b >= firstAt) {
                first[firstCount++] = i;
            }
        }
        contenders.addAll(readInFullAndForm(s, requirement, waiting, first, firstCount, unread, firstBounds, judgedOf,
                admission));
        double[] formedBounds = new double[contenders.size()];
        for (int i = 0; i < formedBounds.length; i++) {
            formedBounds[i] = contenders.get(i).bound();
        }
        double atLeast = BoundedJudgement.kthLargest(formedBounds, formedBounds.length, cut);
        int[] now = new int[waiting.count];
        int[] later = new int[waiting.count];
        int nowCount = 0;
        double reserveBound = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < waiting.count; i++) {
            double b = waiting.codesBound[i];
            if (!Double.isFinite(b) || b >= firstAt) {
                continue; // formed above
            }
            if (b >= atLeast) {
                now[nowCount++] = i;
            } else {
                later[waiting.inReserve++] = i;
                reserveBound = Math.max(reserveBound, b);
            }
        }
        contenders.addAll(readInFullAndForm(s, requirement, waiting, now, nowCount, unread, firstBounds, judgedOf,
                admission));
        BINS_UNREAD_MATERIALS.addAndGet(waiting.count);
        BINS_UNREAD_IN_RESERVE.addAndGet(waiting.inReserve);
        if (waiting.inReserve == 0) {
            return null;
        }
        int inReserve = waiting.inReserve;
        return new BoundedJudgement.Reserve(reserveBound, () -> readInFullAndForm(s, requirement, waiting, later,
                inReserve, unread, firstBounds, judgedOf, admission));
    }

    /** Reads in full the unread rows of the listed waiting materials, then forms their contenders as the loop does. */
    private List<BoundedJudgement.Contender> readInFullAndForm(Snapshot s, Requirement requirement, BinsDeferred waiting,
                                                               int[] which, int count,
                                                               WeightedMisses.DeferredBins unread,
                                                               FirstBounds firstBounds, Map<Long, Set<Long>> judgedOf,
                                                               Admission admission) {
        SnapshotIndex.Slots slots = s.index().slots();
        int rowCount = 0;
        for (int i = 0; i < count; i++) {
            int mi = waiting.material[which[i]];
            rowCount += slots.firstSlot[mi + 1] - slots.firstSlot[mi];
        }
        int[] rows = new int[rowCount];
        int n = 0;
        for (int i = 0; i < count; i++) {
            int mi = waiting.material[which[i]];
            for (int slot = slots.firstSlot[mi]; slot < slots.firstSlot[mi + 1]; slot++) {
                int row = slots.rowBySlot[slot];
                if (row >= 0 && unread.deferred()[row]) {
                    rows[n++] = row;
                }
            }
        }
        unread.readInFull(rows, n);
        List<BoundedJudgement.Contender> formed = new ArrayList<>(count);
        ThicknessSpec spec = requirement.thickness();
        for (int i = 0; i < count; i++) {
            int mi = waiting.material[which[i]];
            Material material = slots.materials.get(mi);
            Set<Long> judgedSamples = judgedOf.get(material.id());
            boolean classAdmits = admission.material(material);
            double bound = Double.NEGATIVE_INFINITY;
            boolean allMiss = true;
            // the same bound and flag as the loop of searchExactly, over the same admitted samples
            for (int slot = slots.firstSlot[mi]; slot < slots.firstSlot[mi + 1]; slot++) {
                if (classAdmits && admission.geometry(slots.geometryBySlot[slot])) {
                    long sampleId = slots.sampleIdBySlot[slot];
                    int row = slots.rowBySlot[slot];
                    allMiss &= !Double.isNaN(firstBounds.miss(sampleId, row));
                    if (judgedSamples == null || judgedSamples.contains(sampleId)) {
                        bound = Math.max(bound, firstBounds.bound(sampleId, row));
                    }
                }
            }
            formed.add(new BoundedJudgement.Contender(material, bound, allMiss && madeFor(s, spec, material),
                    waiting.regular[which[i]]));
        }
        return formed;
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
     * Whether the material can be judged at the asked thickness at all: where it is not made, its rows are
     * unverified (which ranks above a miss), so a proven miss on its curves says nothing about its row.
     */
    private boolean madeFor(Snapshot s, ThicknessSpec spec, Material material) {
        // by row: the snapshot's made thicknesses, formed once (the same object gives the same); else formed per call
        return madeFor(spec, material, rowArrays ? MaterialCandidates.madeOf(s, material) : made(material));
    }

    static boolean madeFor(ThicknessSpec spec, Material material, MadeThicknesses made) {
        return switch (spec.kind()) {
            case AS_MEASURED -> true;
            case FIXED -> material.scaling() != Scaling.BULK || made.makes(spec.minMm());
            case RANGE -> material.scaling() != Scaling.BULK || made.within(spec.minMm(), spec.maxMm()) != null;
        };
    }
}
