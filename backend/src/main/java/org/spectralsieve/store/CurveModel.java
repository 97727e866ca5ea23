package org.spectralsieve.store;

import java.util.List;
import org.spectralsieve.requirement.Standing;
import org.spectralsieve.requirement.ThicknessSpec;
import org.spectralsieve.requirement.Verdict;

/**
 * One curve under one requirement, in the store's model: every probe becomes a condition whose margin
 * (in decades) is a straight line in thickness — falling for light that must pass, rising for light that
 * must be blocked — because OD grows linearly with thickness (Beer–Lambert) on top of a fixed surface loss.
 * Means of T are not lines; with a mean in the requirement the optimum is found by bisection instead.
 *
 * <p>With {@code pointsOnly} only the ends of each band are read (both edges of a cutoff window)
 * and means are skipped: fewer conditions can only raise the worst margin, so the result bounds the full one.
 */
final class CurveModel {

    /** Thickness tolerance of the bisections, in mm. */
    private static final double TOLERANCE_MM = 1e-6;
    private static final double SAME_THICKNESS_MM = 1e-9;

    private final SearchPlan plan;

    // point conditions: margin(d) = intercept + slope·d
    private int points;
    private final double[] intercept;
    private final double[] slope;
    private final boolean[] pass;
    private final boolean[] bound;
    /** Beyond this thickness the point is a bound too (a clear reading extrapolated far); +∞ when never. */
    private final double[] farMm;
    private final int[] clauseOf;
    private boolean anyUnmeasured;
    /** Full model only: clauses with a probe outside the measured data (judged only if a miss is proven). */
    private final boolean[] clauseUnmeasured;
    private final boolean[] missedClause;
    private int loadingClause;

    // mean conditions, only in a full evaluation
    private final List<MeanCondition> means = new java.util.ArrayList<>();

    private final SpectralStore store;
    private final boolean pointsOnly;
    private double d0;
    private boolean bulk;
    private int curve;

    /** One model per thread; {@link #load} points it at a curve without allocating, for the pass over every curve. */
    CurveModel(SearchPlan plan, SpectralStore store, boolean pointsOnly) {
        this.plan = plan;
        this.store = store;
        this.pointsOnly = pointsOnly;
        int capacity = 0;
        for (CompiledClause c : plan.clauses) {
            capacity += pointsOnly ? Math.min(2, c.probes().size()) : c.probes().size();
        }
        intercept = new double[capacity];
        slope = new double[capacity];
        pass = new boolean[capacity];
        bound = new boolean[capacity];
        farMm = new double[capacity];
        clauseOf = new int[capacity];
        clauseUnmeasured = new boolean[plan.clauses.size()];
        missedClause = new boolean[plan.clauses.size()];
    }

    /** Points a full model at a curve: every probe of every clause, means included. */
    CurveModel load(int curve) {
        if (pointsOnly) {
            throw new IllegalStateException("a points-only model is loaded with loadDecoded");
        }
        this.curve = curve;
        this.d0 = store.thicknessMm(curve);
        // as measured, even a bulk sample is read as it is: no thickness model between data and verdict
        this.bulk = rescalable(curve);
        points = 0;
        anyUnmeasured = false;
        java.util.Arrays.fill(clauseUnmeasured, false);
        means.clear();
        int model = store.indexModelOf(curve);
        for (int c = 0; c < plan.clauses.size(); c++) {
            loadingClause = c;
            CompiledClause clause = plan.clauses.get(c);
            double[] loss = plan.surfaceLoss[model][c];
            double[] clear = plan.unresolvedOd[model][c];
            List<Probe> probes = clause.probes();
            switch (clause.kind()) {
                case EVERY_POINT_PASS, EVERY_POINT_BLOCK -> {
                    boolean isPass = clause.kind() == CompiledClause.Kind.EVERY_POINT_PASS;
                    if (pointsOnly) {
                        // a band's two ends: where edges and bands usually decide it, at the cost of two columns
                        int last = probes.size() - 1;
                        addPoint(store, curve, probes.get(0), loss[0], clear[0], clause.thresholdOd(), isPass);
                        if (last > 0) {
                            addPoint(store, curve, probes.get(last), loss[last], clear[last], clause.thresholdOd(),
                                    isPass);
                        }
                    } else {
                        for (int p = 0; p < probes.size(); p++) {
                            addPoint(store, curve, probes.get(p), loss[p], clear[p], clause.thresholdOd(), isPass);
                        }
                    }
                }
                case CUTOFF -> {
                    addPoint(store, curve, probes.get(0), loss[0], clear[0], clause.thresholdOd(), false);
                    addPoint(store, curve, probes.get(1), loss[1], clear[1], clause.thresholdOd(), true);
                }
                case MEAN_PASS, MEAN_BLOCK -> means.add(MeanCondition.of(store, curve, clause, loss, clear, d0));
            }
        }
        return this;
    }

    private void addPoint(SpectralStore store, int curve, Probe probe, double surfaceLoss, double unresolvedOd,
                          double thresholdOd, boolean isPass) {
        if (!probe.onGrid()) {
            anyUnmeasured = true;
            clauseUnmeasured[loadingClause] = true;
            return;
        }
        short lo = store.column(probe.lo())[curve];
        short hi = store.column(probe.hi())[curve];
        if (!OdCode.isMeasured(lo) || !OdCode.isMeasured(hi)) {
            anyUnmeasured = true;
            clauseUnmeasured[loadingClause] = true;
            return;
        }
        double f = probe.fractionHi();
        double od0 = (1 - f) * OdCode.opticalDensity(lo) + f * OdCode.opticalDensity(hi);
        boolean isBound = OdCode.isBound(lo) || (f > 0 && OdCode.isBound(hi));
        addDecoded(od0, isBound, surfaceLoss, unresolvedOd, thresholdOd, isPass);
    }

    /**
     * Points the model at a curve whose point probes were already decoded column by column (the fast pass):
     * {@code state[k]} is {@link #READ}, {@link #BOUND} or {@link #UNMEASURED} for point probe k of
     * {@link SearchPlan#pointProbes}.
     */
    CurveModel loadDecoded(int curve, double[] od0, byte[] state) {
        this.curve = curve;
        this.d0 = store.thicknessMm(curve);
        this.bulk = rescalable(curve);
        points = 0;
        anyUnmeasured = false;
        double[] loss = plan.pointProbeLoss[store.indexModelOf(curve)];
        double[] clear = plan.pointProbeUnresolvedOd[store.indexModelOf(curve)];
        List<PointProbe> probes = plan.pointProbes;
        for (int k = 0; k < od0.length; k++) {
            if (state[k] == UNMEASURED) {
                anyUnmeasured = true;
            } else {
                PointProbe probe = probes.get(k);
                addDecoded(od0[k], state[k] == BOUND, loss[k], clear[k], probe.thresholdOd(), probe.pass());
            }
        }
        return this;
    }

    /** Read through the thickness model: bulk, not as measured, and not measured at the one asked thickness. */
    private boolean rescalable(int curve) {
        ThicknessSpec spec = plan.thickness;
        if (!store.isBulk(curve) || spec.kind() == ThicknessSpec.Kind.AS_MEASURED) {
            return false;
        }
        return spec.kind() == ThicknessSpec.Kind.RANGE || plan.rescaledAt(store, curve);
    }

    static final byte READ = 0;
    static final byte BOUND = 1;
    static final byte UNMEASURED = 2;

    private void addDecoded(double od0, boolean isBound, double surfaceLoss, double unresolvedOd, double thresholdOd,
                            boolean isPass) {
        // OD(d) = s + a0·d/d0 for a resolved reading; a clear one (at most the OD of C − u) keeps its own OD
        // and is a bound beyond its far thickness (SlabReading, the exact model's rule)
        boolean clear = bulk && od0 <= unresolvedOd;
        double internal = Math.max(0, od0 - surfaceLoss);
        double perMm = bulk && !clear ? internal / d0 : 0;
        double base = bulk && !clear ? surfaceLoss : od0;
        int i = points++;
        pass[i] = isPass;
        bound[i] = isBound;
        // the far thickness is at least d0: only worth computing when the asked thicknesses reach past d0
        farMm[i] = clear && plan.thickness.maxMm() > d0 ? farMmOf(od0, surfaceLoss, d0) : Double.POSITIVE_INFINITY;
        clauseOf[i] = loadingClause;
        if (isPass) {           // margin = thresholdOd − OD(d)
            intercept[i] = thresholdOd - base;
            slope[i] = -perMm;
        } else {                // margin = OD(d) − thresholdOd
            intercept[i] = base - thresholdOd;
            slope[i] = perMm;
        }
    }

    // far factors of clear readings, remembered per (OD, surface loss): a store holds few distinct quantized clear
    // ODs per probe, and each factor costs two powers and a SlabReading; a direct-mapped table, one per model
    // (one per thread), so no locking. The value equals Plan.farMm's: d0 times the same factor.
    private static final int FAR_SLOTS = 1024;
    private final double[] farKeyOd = new double[FAR_SLOTS];
    private final double[] farKeyLoss = new double[FAR_SLOTS];
    private final double[] farFactor = new double[FAR_SLOTS];

    private double farMmOf(double od0, double surfaceLoss, double d0) {
        if (plan.reference) {
            return SearchPlan.farMm(od0, surfaceLoss, d0);
        }
        int slot = (Double.hashCode(od0) * 31 + Double.hashCode(surfaceLoss)) & (FAR_SLOTS - 1);
        // a factor is at least 1, so an untouched slot (0) never matches
        if (farFactor[slot] == 0 || farKeyOd[slot] != od0 || farKeyLoss[slot] != surfaceLoss) {
            farKeyOd[slot] = od0;
            farKeyLoss[slot] = surfaceLoss;
            farFactor[slot] = SearchPlan.farFactor(od0, surfaceLoss);
        }
        return d0 * farFactor[slot];
    }

    /** The ranking key of the best this curve can do, without allocating. */
    int bestKey() {
        ThicknessSpec spec = plan.thickness;
        double d = bestThickness(spec);
        judge(d, forcedUnverified(spec));
        return StoreSearch.Keys.of(standing, worst);
    }

    private double bestThickness(ThicknessSpec spec) {
        switch (spec.kind()) {
            case AS_MEASURED:
                return d0;
            case FIXED:
                return bulk ? spec.minMm() : d0;
            default:
                if (!bulk || !plan.rangeJudgeable(store, curve)) {
                    return d0;
                }
                double[] range = plan.rangeOf(curve);
                double free = crossing(range[0], range[1]);
                double cap = provableCap();
                if (!(cap >= range[0] && cap < range[1])) {
                    return free;
                }
                // beyond the cap a pass rests on a far clear reading (a bound): the best below it may rank higher
                double capped = crossing(range[0], cap);
                judge(free, false);
                int freeKey = StoreSearch.Keys.of(standing, worst);
                judge(capped, false);
                return StoreSearch.Keys.of(standing, worst) > freeKey ? capped : free;
        }
    }

    private double crossing(double min, double max) {
        return means.isEmpty() ? crossingOfLines(min, max) : crossingByBisection(min, max);
    }

    /** The thickness up to which every pass condition can still be proven (the least far thickness of one). */
    private double provableCap() {
        double cap = Double.POSITIVE_INFINITY;
        for (int i = 0; i < points; i++) {
            if (pass[i]) {
                cap = Math.min(cap, farMm[i]);
            }
        }
        for (MeanCondition mean : means) {
            if (mean.pass()) {
                cap = Math.min(cap, mean.farMm(bulk));
            }
        }
        return cap;
    }

    private boolean forcedUnverified(ThicknessSpec spec) {
        return switch (spec.kind()) {
            case AS_MEASURED -> false;
            // not rescalable, or not made at the asked thickness
            case FIXED -> !plan.judgeableAt(store, curve, spec.minMm());
            case RANGE -> !plan.rangeJudgeable(store, curve);
        };
    }

    StoreSearch.Evaluation best() {
        ThicknessSpec spec = plan.thickness;
        double d = bestThickness(spec);
        boolean forced = forcedUnverified(spec);
        judge(d, forced);
        double[] range = null;
        if (spec.kind() == ThicknessSpec.Kind.RANGE && bulk && !forced && verdict == Verdict.MEETS) {
            double[] within = plan.rangeOf(curve);
            range = feasibleRange(within[0], within[1]);
        }
        return new StoreSearch.Evaluation(verdict, standing, worst, d, range);
    }

    // the last judgement, kept in fields so the pass over every curve allocates nothing
    private Verdict verdict;
    private Standing standing;
    private double worst;

    /**
     * The verdict, group and worst margin at thickness d (a fixed layer's margins do not depend on d), in
     * the exact order's terms ({@link org.spectralsieve.requirement.RankingOrder}): a miss is ranked by its
     * worst missing reading and goes to the bounded-miss group when that reading is a bound; a curve with
     * no clause judged (a fixed part asked at another thickness, every clause outside the data) goes last.
     *
     * <p>A points-only model gives an upper bound on the full model's key: it reads a subset of the
     * probes, so its lowest margin and its lowest missing margin are at least the full ones, and it never
     * demotes a miss to the bounded group nor (except for the thickness reason, which does not depend on
     * the probes) a curve to the not-judged group, because the probes it skips could change either.
     */
    private void judge(double d, boolean forcedUnverified) {
        if (forcedUnverified) {
            // the exact evaluator judges no clause of a fixed part asked at another thickness
            verdict = Verdict.UNVERIFIED;
            standing = Standing.NOT_JUDGED;
            worst = Double.NaN;
            return;
        }
        int bits = anyUnmeasured ? ProbeVerdict.UNVERIFIED : ProbeVerdict.HOLDS;
        double lowest = Double.POSITIVE_INFINITY;
        double lowestMiss = Double.POSITIVE_INFINITY;
        boolean lowestMissIsBound = false;
        boolean[] missed = pointsOnly ? null : missedClause;
        if (missed != null) {
            java.util.Arrays.fill(missed, false);
        }
        boolean anyJudged = false;
        for (int i = 0; i < points; i++) {
            double margin = intercept[i] + slope[i] * d; // slope is 0 for a fixed layer
            lowest = Math.min(lowest, margin);
            boolean isBound = bound[i] || d > farMm[i];
            int v = ProbeVerdict.of(margin, isBound, pass[i]);
            bits |= v;
            if (v == ProbeVerdict.MISSES) {
                if (margin < lowestMiss) {
                    lowestMiss = margin;
                    lowestMissIsBound = isBound;
                }
                if (missed != null) {
                    missed[clauseOf[i]] = true;
                }
            }
        }
        if (missed != null) {
            for (int i = 0; i < points; i++) {
                anyJudged |= !clauseUnmeasured[clauseOf[i]] || missed[clauseOf[i]];
            }
        }
        boolean misses = (bits & ProbeVerdict.MISSES) != 0;
        boolean unverified = (bits & ProbeVerdict.UNVERIFIED) != 0;
        for (MeanCondition mean : means) {
            double margin = mean.margin(d, bulk);
            if (mean.unmeasured()) {
                unverified = true;
                continue;
            }
            anyJudged = true;
            lowest = Math.min(lowest, margin);
            boolean meanBound = mean.anyBoundAt(d, bulk);
            boolean meanMisses = meanBound ? mean.pass() && margin < 0 : margin < 0;
            if (meanMisses) {
                misses = true;
                if (margin < lowestMiss) {
                    lowestMiss = margin;
                    lowestMissIsBound = meanBound;
                }
            } else if (meanBound) {
                unverified = true;
            }
        }
        verdict = misses ? Verdict.MISSES : unverified ? Verdict.UNVERIFIED : Verdict.MEETS;
        if (misses) {
            worst = pointsOnly && bulk && plan.thickness.kind() == ThicknessSpec.Kind.RANGE
                    ? missBoundOverTheRange() : lowestMiss;
            standing = lowestMissIsBound && !pointsOnly ? Standing.MISSES_ON_BOUND : Standing.MISSES;
            return;
        }
        worst = lowest == Double.POSITIVE_INFINITY ? Double.NaN : lowest; // NaN: nothing measured to judge by
        standing = !pointsOnly && !anyJudged ? Standing.NOT_JUDGED
                : verdict == Verdict.MEETS ? Standing.MEETS : Standing.UNVERIFIED;
    }

    /**
     * For the points-only bound in a thickness range, where the full model may settle on another thickness
     * than this one: an upper bound on the full model's lowest missing margin at any thickness. A probe
     * that can miss (all but a bound on a block, which is never a miss) has a margin line; the full
     * model's lowest missing margin at its thickness d is at most each such line of ours at d, so at most
     * the least, over our lines, of the line's larger end in the range.
     */
    private double missBoundOverTheRange() {
        double lo = plan.thickness.minMm();
        double hi = plan.thickness.maxMm();
        double least = Double.POSITIVE_INFINITY;
        for (int i = 0; i < points; i++) {
            if (bound[i] && !pass[i]) {
                continue;
            }
            least = Math.min(least, Math.max(intercept[i] + slope[i] * lo, intercept[i] + slope[i] * hi));
        }
        return least;
    }

    /**
     * Where the falling (pass) side meets the rising (block) side: with f the minimum of falling lines and g
     * the minimum of rising ones, f ≥ g exactly for d ≤ max over rising j of min over falling i of d_ij.
     */
    private double crossingOfLines(double min, double max) {
        boolean anyPass = false;
        boolean anyBlock = false;
        for (int i = 0; i < points; i++) {
            if (slope[i] < 0 || (slope[i] == 0 && pass[i])) {
                anyPass = true;
            } else {
                anyBlock = true;
            }
        }
        if (!anyBlock) {
            return min;
        }
        if (!anyPass) {
            return max;
        }
        double crossing = Double.NEGATIVE_INFINITY;
        for (int j = 0; j < points; j++) {
            if (isFalling(j)) {
                continue;
            }
            double firstMeeting = Double.POSITIVE_INFINITY;
            for (int i = 0; i < points; i++) {
                if (isFalling(i)) {
                    firstMeeting = Math.min(firstMeeting, meeting(i, j));
                }
            }
            crossing = Math.max(crossing, firstMeeting);
        }
        return Math.max(min, Math.min(max, crossing));
    }

    private boolean isFalling(int i) {
        return slope[i] < 0 || (slope[i] == 0 && pass[i]);
    }

    /** The d up to which falling line i stays at or above rising line j. */
    private double meeting(int i, int j) {
        double closing = slope[j] - slope[i];
        double gap = intercept[i] - intercept[j];
        if (closing <= 0) {
            return gap >= 0 ? Double.POSITIVE_INFINITY : Double.NEGATIVE_INFINITY;
        }
        return gap / closing;
    }

    private double crossingByBisection(double min, double max) {
        if (sides(min)[0] <= sides(min)[1]) {
            return min;
        }
        if (sides(max)[0] >= sides(max)[1]) {
            return max;
        }
        double lo = min;
        double hi = max;
        while (hi - lo > TOLERANCE_MM) {
            double mid = (lo + hi) / 2;
            double[] s = sides(mid);
            if (s[0] >= s[1]) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return (lo + hi) / 2;
    }

    /** {minimum of falling margins, minimum of rising margins} at thickness d. */
    private double[] sides(double d) {
        double falling = Double.POSITIVE_INFINITY;
        double rising = Double.POSITIVE_INFINITY;
        for (int i = 0; i < points; i++) {
            double margin = intercept[i] + slope[i] * d;
            if (isFalling(i)) {
                falling = Math.min(falling, margin);
            } else {
                rising = Math.min(rising, margin);
            }
        }
        for (MeanCondition mean : means) {
            if (mean.unmeasured()) {
                continue;
            }
            double margin = mean.margin(d, true);
            if (mean.pass()) {
                falling = Math.min(falling, margin);
            } else {
                rising = Math.min(rising, margin);
            }
        }
        return new double[] {falling, rising};
    }

    /** Thicknesses in [min, max] where every margin is at least zero; null when none. */
    private double[] feasibleRange(double min, double max) {
        double lo = min;
        double hi = max;
        for (int i = 0; i < points; i++) {
            if (pass[i]) {
                hi = Math.min(hi, farMm[i]); // a pass on a far clear reading cannot be proven
            }
        }
        for (MeanCondition mean : means) {
            if (mean.pass()) {
                hi = Math.min(hi, mean.farMm(bulk));
            }
        }
        if (means.isEmpty()) {
            for (int i = 0; i < points; i++) {
                if (slope[i] < 0) {
                    hi = Math.min(hi, -intercept[i] / slope[i]);
                } else if (slope[i] > 0) {
                    lo = Math.max(lo, -intercept[i] / slope[i]);
                } else if (intercept[i] < 0) {
                    return null;
                }
            }
        } else {
            lo = firstThicknessWhere(min, max, false);
            hi = Math.min(hi, firstThicknessWhere(min, max, true));
        }
        return lo <= hi ? new double[] {lo, hi} : null;
    }

    /** For the rising side: the least d with margin ≥ 0; for the falling side: the greatest. */
    private double firstThicknessWhere(double min, double max, boolean fallingSide) {
        int side = fallingSide ? 0 : 1;
        if (fallingSide ? sides(max)[side] >= 0 : sides(min)[side] >= 0) {
            return fallingSide ? max : min;
        }
        double lo = min;
        double hi = max;
        while (hi - lo > TOLERANCE_MM) {
            double mid = (lo + hi) / 2;
            boolean ok = sides(mid)[side] >= 0;
            if (fallingSide == ok) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return fallingSide ? lo : hi;
    }
}
