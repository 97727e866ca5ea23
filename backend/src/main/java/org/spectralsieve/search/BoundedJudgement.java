package org.spectralsieve.search;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.PriorityQueue;
import java.util.concurrent.atomic.AtomicLong;
import java.util.function.Function;
import java.util.function.Supplier;
import java.util.function.UnaryOperator;
import java.util.stream.IntStream;
import org.spectralsieve.library.Material;
import org.spectralsieve.requirement.MaterialEvaluation;
import org.spectralsieve.requirement.RankedRow;
import org.spectralsieve.requirement.Standing;

/**
 * The exact judgement of a search the store cannot rank (docs/weighted-screening.md, "Bounds that rank"):
 * every material is a {@link Contender} with an upper bound on its row's margin, materials are judged from
 * the largest bound down, and a material is left out once the shortlist is full of rows it provably cannot
 * beat ({@link #couldEnter}). The answer is the top rows of every material's exact row, because a material
 * left out could not have been among them; which materials are judged changes only the work.
 *
 * <p>Judged in batches on the common fork-join pool and the caller's thread (in parallel when asked; the
 * search asks from {@value #PARALLEL_FROM} contenders on), each
 * batch's results taken in the contenders' order and ranked from every judgement at the end, so the rows,
 * their order included, do not depend on the threads. A batch is chosen against the rows known before it,
 * so a parallel search may judge a few materials that a one-thread search would have left out: more work,
 * never another answer.
 */
final class BoundedJudgement {

    /** Materials judged between two looks at the rows when judging in parallel: enough to share, few to waste. */
    static final int PARALLEL_BATCH = 16;
    /**
     * Fewer contenders than this are judged on the caller's thread alone: on a small library (the demo's 50
     * materials) handing batches to the pool costs more than it saves, and batches chosen against rows not
     * yet full judge proven misses a one-thread loop leaves out.
     */
    static final int PARALLEL_FROM = 256;

    private BoundedJudgement() {
    }

    /**
     * One material as the search sees it before judging it.
     *
     * @param bound        an upper bound on its row's worst margin when that row meets or misses on a value
     *                     ({@code +∞} when nothing is known): the largest of its admitted samples' bounds
     * @param provenToMiss every admitted sample is proven to miss and the material is made at the asked
     *                     thickness, so its row is at best a miss read from a value ({@link Standing#MISSES})
     * @param regular      it has a sample measured in regular geometry, so with diffuse rows ranked last it
     *                     competes with the regular rows only
     * @param cannotMeet   every sample judged for it has a clause that is unverified on the curve it is judged on,
     *                     or is proven to miss (the second stage), so its row is not in the group of met rows
     * @param unverifiedBound an upper bound on its row's worst margin should that row be unverified ({@code +∞}
     *                     when nothing is known; the second stage as measured without a layer)
     * @param sampleId     {@link #WHOLE_MATERIAL}: the material is judged whole; else the one sample of it this
     *                     contender stands for, judged alone (where a material's row is the best of its samples'
     *                     rows, each formed alone: {@code SearchService}, docs/weighted-screening.md "Samples as
     *                     contenders"), every bound and flag then that sample's own
     * @param settledNotJudged every row the exact judgement forms for it is {@link Standing#NOT_JUDGED}, known from
     *                     the thicknesses alone (a part that is never rescaled, measured outside the asked thickness:
     *                     {@link SettledRows}); such a row enters full rows only behind a not-judged last row, so it
     *                     waits behind every other contender and needs no second bound
     */
    record Contender(Material material, double bound, boolean provenToMiss, boolean regular, boolean cannotMeet,
                     double unverifiedBound, long sampleId, boolean settledNotJudged) {

        Contender(Material material, double bound, boolean provenToMiss, boolean regular, boolean cannotMeet,
                  double unverifiedBound, long sampleId) {
            this(material, bound, provenToMiss, regular, cannotMeet, unverifiedBound, sampleId, false);
        }

        Contender(Material material, double bound, boolean provenToMiss, boolean regular) {
            this(material, bound, provenToMiss, regular, false, Double.POSITIVE_INFINITY);
        }

        Contender(Material material, double bound, boolean provenToMiss, boolean regular, boolean cannotMeet,
                  double unverifiedBound) {
            this(material, bound, provenToMiss, regular, cannotMeet, unverifiedBound, WHOLE_MATERIAL);
        }

        /** Whether it stands for one sample of its material rather than the whole material. */
        boolean oneSample() {
            return sampleId != WHOLE_MATERIAL;
        }
    }

    /** {@link Contender#sampleId} of a contender that stands for its whole material (no sample has id 0). */
    static final long WHOLE_MATERIAL = 0;

    /**
     * Settled not-judged contenders last, the others largest bound first (an unknown one counts as the largest), then
     * by material id and sample: the judging order.
     */
    static final Comparator<Contender> ORDER = Comparator
            .comparing(Contender::settledNotJudged)
            .thenComparing(Comparator.comparingDouble((Contender c) -> Double.isNaN(c.bound()) ? Double.POSITIVE_INFINITY : c.bound()).reversed())
            .thenComparingLong(c -> c.material().id())
            .thenComparingLong(Contender::sampleId);

    /**
     * How the rows are ranked while judging.
     *
     * @param rows    the top rows of a list of evaluations (the search's own ranking, limit applied)
     * @param regular the top rows of the regular-geometry evaluations alone when diffuse rows go last, else null
     */
    record Ranker(Function<List<MaterialEvaluation>, List<RankedRow>> rows,
                  Function<List<MaterialEvaluation>, List<RankedRow>> regular) {

        boolean grouped() {
            return regular != null;
        }
    }

    /**
     * Judges the contenders that could reach the rows, largest bound first, and returns every evaluation made
     * (in the contenders' order). {@code judge} must be safe to call from several threads when
     * {@code parallel}.
     */
    static List<MaterialEvaluation> judge(List<Contender> contenders, int limit, Ranker ranker,
                                          Function<Material, List<MaterialEvaluation>> judge, boolean parallel) {
        return judge(contenders, limit, ranker, judge, parallel, null);
    }

    /**
     * {@link #judge(List, int, Ranker, Function, boolean)} with a second look before each judgement once the rows
     * are full (docs/weighted-screening.md, "A second, exact-curve stage"): the contender of largest bound is
     * {@code refine}d first (a bound on its own curves, sound as the first), put back by its second bound, and
     * judged only when it comes first again by that one; so materials are judged in the order of their second
     * bounds, and a second bound is formed only for contenders whose first bound reaches the rows. A contender
     * left out by either bound could not enter, so the answer is the same; only the work changes. With
     * {@code refine} null every first bound is taken as final (the loop before the second stage). In parallel up to
     * {@value #PARALLEL_BATCH} second bounds are formed at once, so {@code refine} must then be safe from several
     * threads.
     */
    static List<MaterialEvaluation> judge(List<Contender> contenders, int limit, Ranker ranker,
                                          Function<Material, List<MaterialEvaluation>> judge, boolean parallel,
                                          UnaryOperator<Contender> refine) {
        return judgeContenders(contenders, limit, ranker, c -> judge.apply(c.material()), parallel,
                refine == null ? null : (c, bar) -> refine.apply(c));
    }

    /**
     * Forms a contender's second bound (docs/weighted-screening.md, "A second, exact-curve stage"), knowing the bar it
     * must reach to enter: the margin of the full rows' last row when that row meets (a contender whose bound is
     * below it cannot enter, {@link #couldEnter}), {@code -∞} otherwise (every bound and flag is wanted). A refiner
     * may use the bar only to spare work — the second bounds of samples that cannot lift the contender's bound to
     * the bar, or that are not needed once one sample reaches it ("Second bounds up to the bar") — never to form a
     * bound that is not sound.
     */
    @FunctionalInterface
    interface Refiner {
        Contender refine(Contender contender, double bar);
    }

    /** The bar a contender must reach against these rows ({@link Refiner}): a met last row's margin, else {@code -∞}. */
    static double bar(List<RankedRow> rows, int limit) {
        if (rows.size() < limit || limit == 0) {
            return Double.NEGATIVE_INFINITY;
        }
        RankedRow last = rows.get(rows.size() - 1);
        double margin = last.evaluation().worstMarginDecades();
        return last.evaluation().standing() == Standing.MEETS && !Double.isNaN(margin) ? margin : Double.NEGATIVE_INFINITY;
    }

    /**
     * {@link #judge(List, int, Ranker, Function, boolean, UnaryOperator)} with the contender handed to {@code judge}:
     * a contender that stands for one sample ({@link Contender#oneSample}) is judged for that sample alone.
     */
    static List<MaterialEvaluation> judgeContenders(List<Contender> contenders, int limit, Ranker ranker,
                                                    Function<Contender, List<MaterialEvaluation>> judge, boolean parallel,
                                                    Refiner refine) {
        return judgeContenders(contenders, null, limit, ranker, judge, parallel, refine);
    }

    /** Reserves formed, and reserves the rows kept out whole, since the start (tests and benchmarks read them). */
    static final AtomicLong RESERVES_FORMED = new AtomicLong();
    static final AtomicLong RESERVES_LEFT = new AtomicLong();

    /**
     * Contenders not yet formed (docs/weighted-screening.md, "Figures in the store"): every one of them has a bound
     * at most {@code bound} (a number, not NaN) and is not {@link Contender#settledNotJudged}; {@code form} makes
     * them, in any order. The loop forms them only when the first in line has a bound no larger than
     * {@code bound} (or none is left), so they enter the line before any contender they would have followed; and
     * never when full rows ending in a met row with a larger margin keep every one of them out.
     */
    record Reserve(double bound, Supplier<List<Contender>> form) {

        Reserve {
            if (Double.isNaN(bound)) {
                throw new IllegalArgumentException("a reserve's bound must be a number");
            }
        }
    }

    /**
     * {@link #judgeContenders(List, int, Ranker, Function, boolean, Refiner)} with a {@link Reserve} of contenders
     * formed only if the loop reaches their bound: the same contenders are judged, in the same order, as with every
     * contender formed at the start (the reserve's enter the line before any of theirs could be first in it), so
     * the answer and the work of judging are the same; only the contenders that cannot enter are never made.
     */
    static List<MaterialEvaluation> judgeContenders(List<Contender> contenders, Reserve reserve, int limit,
                                                    Ranker ranker, Function<Contender, List<MaterialEvaluation>> judge,
                                                    boolean parallel, Refiner refine) {
        List<Pending> waiting = new ArrayList<>(contenders.size() + 1);
        // a settled contender's rows are known to be not judged: no second bound could say more
        contenders.forEach(c -> waiting.add(new Pending(c, refine == null || c.settledNotJudged())));
        // built in one pass (a heap of n in O(n)) rather than n insertions: a million curves make 333k contenders
        PriorityQueue<Pending> queue = new PriorityQueue<>(waiting);
        int batchSize = parallel ? PARALLEL_BATCH : 1;
        // -Dsieve.search.second-bounds-in-parallel=false: one second bound at a time, the loop before (benchmarks only)
        int refineSize = "false".equals(System.getProperty("sieve.search.second-bounds-in-parallel")) ? 1 : batchSize;
        List<MaterialEvaluation> exact = new ArrayList<>();
        List<RankedRow> rows = List.of();
        List<RankedRow> regularRows = List.of();
        while (!queue.isEmpty() || reserve != null) {
            List<Contender> batch = new ArrayList<>(batchSize);
            List<Contender> toRefine = new ArrayList<>(batchSize);
            List<Double> bars = new ArrayList<>(batchSize);
            while (batch.size() < batchSize && toRefine.size() < refineSize) {
                if (reserve != null && (queue.isEmpty() || !(queue.peek().contender().bound() > reserve.bound()))) {
                    // the reserve's contenders could be first in line now: form them, unless full met rows keep
                    // every one out (none has a bound above the reserve's)
                    if (!keepsOut(rows, limit, reserve.bound())
                            || ranker.grouped() && !keepsOut(regularRows, limit, reserve.bound())) {
                        boolean refineNone = refine == null;
                        reserve.form().get().forEach(c -> queue.add(new Pending(c, refineNone || c.settledNotJudged())));
                        RESERVES_FORMED.incrementAndGet();
                    } else {
                        RESERVES_LEFT.incrementAndGet();
                    }
                    reserve = null;
                }
                if (queue.isEmpty()) {
                    break;
                }
                if (noneCanEnter(queue.peek().contender(), rows, limit)
                        && (!ranker.grouped() || noneCanEnter(queue.peek().contender(), regularRows, limit))) {
                    queue.clear(); // every contender left has a bound no larger than the first's
                    break;
                }
                Pending p = queue.poll();
                // grouped: a material with a regular sample competes only with the regular rows, which come first
                List<RankedRow> competing = p.contender().regular() ? regularRows : rows;
                if (!couldEnter(competing, limit, p.contender())) {
                    continue;
                }
                if (p.refined() || competing.size() < limit) {
                    // rows not yet full take anything: a second bound could not keep the contender out
                    batch.add(p.contender());
                } else {
                    toRefine.add(p.contender());
                    bars.add(bar(competing, limit));
                }
            }
            // second bounds on both cores too (refine must then be safe from several threads); each goes back
            // in line by its own bound, so which are formed together changes only the work
            if (!toRefine.isEmpty()) {
                IntStream indices = IntStream.range(0, toRefine.size());
                (toRefine.size() > 1 ? indices.parallel() : indices)
                        .mapToObj(i -> refine.refine(toRefine.get(i), bars.get(i))).toList()
                        .forEach(c -> queue.add(new Pending(c, true)));
            }
            if (batch.isEmpty()) {
                continue;
            }
            List<MaterialEvaluation> judged = new ArrayList<>();
            (batch.size() > 1 ? batch.parallelStream() : batch.stream()).map(judge).toList().forEach(judged::addAll);
            exact.addAll(judged);
            // the top rows are kept up to date from themselves and the newly judged (a top-k of a union is the
            // top-k of the parts' top-k), not re-ranked from every judgement: that was quadratic
            rows = ranker.rows().apply(withRows(rows, judged));
            if (ranker.grouped()) {
                regularRows = ranker.regular().apply(withRows(regularRows, judged));
            }
        }
        return exact;
    }

    /** A contender waiting in the judging order, and whether its bound is final (second stage formed or none). */
    private record Pending(Contender contender, boolean refined) implements Comparable<Pending> {

        @Override
        public int compareTo(Pending other) {
            return ORDER.compare(contender, other.contender);
        }
    }

    /**
     * The {@code k}-th largest of the numbers that are finite (−∞ when there are fewer): a cut for a {@link Reserve},
     * found with a heap of {@code k} (one pass, no sort of a million bounds).
     */
    static double kthLargest(double[] values, int count, int k) {
        double[] heap = new double[Math.max(1, k)]; // a min-heap of the k largest so far
        int size = 0;
        for (int i = 0; i < count; i++) {
            double v = values[i];
            if (!Double.isFinite(v)) {
                continue;
            }
            if (size < k) {
                int at = size++;
                heap[at] = v;
                while (at > 0 && heap[(at - 1) / 2] > heap[at]) {
                    double t = heap[at];
                    heap[at] = heap[(at - 1) / 2];
                    heap[(at - 1) / 2] = t;
                    at = (at - 1) / 2;
                }
            } else if (k > 0 && v > heap[0]) {
                heap[0] = v;
                int at = 0;
                while (true) {
                    int least = at;
                    int l = 2 * at + 1;
                    int r = l + 1;
                    if (l < size && heap[l] < heap[least]) {
                        least = l;
                    }
                    if (r < size && heap[r] < heap[least]) {
                        least = r;
                    }
                    if (least == at) {
                        break;
                    }
                    double t = heap[at];
                    heap[at] = heap[least];
                    heap[least] = t;
                    at = least;
                }
            }
        }
        return size < k || k == 0 ? Double.NEGATIVE_INFINITY : heap[0];
    }

    /** Whether full rows ending in a met row whose margin exceeds {@code bound} keep out any contender of at most that bound. */
    private static boolean keepsOut(List<RankedRow> rows, int limit, double bound) {
        return bar(rows, limit) > bound;
    }

    /**
     * Whether full rows ending in a met row keep out the first contender in the judging order and so every one
     * after it: their bounds are no larger (a second bound only lowers one), and against a met last row a bound
     * below its margin keeps any contender out whatever its flags ({@link #couldEnter}).
     */
    static boolean noneCanEnter(Contender first, List<RankedRow> rows, int limit) {
        if (rows.size() < limit || limit == 0) {
            return false;
        }
        RankedRow last = rows.get(rows.size() - 1);
        if (first.settledNotJudged()) {
            // only settled contenders are left (they wait last): not-judged rows enter only behind a not-judged row
            return last.evaluation().standing() != Standing.NOT_JUDGED;
        }
        double margin = last.evaluation().worstMarginDecades();
        return last.evaluation().standing() == Standing.MEETS && !Double.isNaN(first.bound()) && first.bound() < margin;
    }

    /**
     * Whether the contender could take a place in the rows (full rows: {@code limit} of them, the last one
     * deciding). A contender proven to miss is at best a miss read from a value with margin at most its
     * bound: the screen proves the miss on a reading above detection, so the row is never in a better group,
     * and a worse group (a miss on a bound, not judged) only ranks lower. Any other contender may meet, with
     * a margin at most its bound, or be unverified, with any margin (the bounds say nothing about that group),
     * so only full rows of met rows with a larger margin keep it out, or full rows of met rows at all when it
     * cannot meet (the second stage found a clause unverified, or a miss, on every curve it is judged on); and,
     * when it cannot meet, full rows ending in an unverified row with a margin larger than its bound for an
     * unverified row. A margin equal to the last row's could
     * enter (confidence and name decide ties), and so could anything against a NaN margin, which ranks last.
     */
    static boolean couldEnter(List<RankedRow> rows, int limit, Contender contender) {
        if (rows.size() < limit) {
            return true;
        }
        RankedRow last = rows.get(rows.size() - 1);
        Standing standing = last.evaluation().standing();
        if (contender.settledNotJudged()) {
            // not judged is the last group: such a row enters full rows only behind another not-judged row, where
            // confidence, name and sample id decide (RankingOrder), so it is judged then
            return standing == Standing.NOT_JUDGED;
        }
        double margin = last.evaluation().worstMarginDecades();
        double bound = contender.bound();
        if (contender.provenToMiss()) {
            if (standing.compareTo(Standing.MISSES) < 0) {
                return false;
            }
            // the last row is a valued miss (by margin), or a bounded miss or not judged: any valued miss beats it
            return standing != Standing.MISSES || Double.isNaN(margin) || !(bound < margin);
        }
        if (standing == Standing.MEETS) {
            // a row that cannot meet is in a lower group than every met row
            return !contender.cannotMeet() && (Double.isNaN(margin) || !(bound < margin));
        }
        if (standing == Standing.UNVERIFIED && contender.cannotMeet()) {
            // its row is unverified with a worst margin at most that bound (a NaN one ranks last), or a miss
            return Double.isNaN(margin) || !(contender.unverifiedBound() < margin);
        }
        return true;
    }

    /** The rows' own evaluations and the newly judged ones: all a top-k ranking of the union needs. */
    static List<MaterialEvaluation> withRows(List<RankedRow> rows, List<MaterialEvaluation> judged) {
        List<MaterialEvaluation> out = new ArrayList<>(rows.size() + judged.size());
        for (RankedRow row : rows) {
            out.add(new MaterialEvaluation(row.materialId(), row.materialName(), row.evaluation()));
        }
        out.addAll(judged);
        return out;
    }
}
