package org.spectralsieve.store;

import java.util.Arrays;
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
    /** Aim the first threshold at about this many times the curves asked for. */
    private static final int HEADROOM = 4;
    private static final int PLAIN_TOP = OdCode.LEVEL_MASK; // 0x7FFF: every level a code without the bound bit can hold
    private static final int BOUND_TOP = OdCode.MAX_LEVEL;

    private final SpectralStore store;
    private final StoreSearch.Plan plan;
    private final boolean everyCurveAdmitted;
    /** The probe whose column is read first. */
    private int probe = -1;
    /** Kept curves (in curve order) and their bounds, for the last threshold read. */
    private int[] kept = new int[0];
    private int[] keptBound = new int[0];
    private int keptCount;
    private int threshold = Integer.MAX_VALUE;

    ColumnFirstScan(SpectralStore store, StoreSearch.Plan plan) {
        this.store = store;
        this.plan = plan;
        this.everyCurveAdmitted = plan.totalGeometry == null && plan.materialClass == null;
    }

    /** Judged as measured (no thickness model, every curve judged) with at least one probe reading one column. */
    static boolean applies(StoreSearch.Plan plan) {
        return plan.thickness.kind() == ThicknessSpec.Kind.AS_MEASURED && oneColumnProbes(plan) > 0;
    }

    private static int oneColumnProbes(StoreSearch.Plan plan) {
        int count = 0;
        for (StoreSearch.PointProbe p : plan.pointProbes) {
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
        int stride = Math.max(1, n / SAMPLE);
        int[] sampled = new int[(n + stride - 1) / stride];
        int sampledCount = 0;
        for (int c = 0; c < n; c += stride) {
            if (everyCurveAdmitted || plan.admits(store, c)) {
                sampled[sampledCount++] = c;
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
        if (cut < threshold) {
            keep(cut);
        }
        int[] found = new int[keptCount];
        int count = 0;
        for (int i = 0; i < keptCount; i++) {
            if (keptBound[i] >= cut) {
                found[count++] = kept[i];
            }
        }
        return Arrays.copyOf(found, count);
    }

    /** The one-column probe that keeps the fewest sampled curves at cap threshold t. */
    private int mostSelective(int[] sampled, int sampledCount, int t) {
        int bestProbe = -1;
        int fewest = Integer.MAX_VALUE;
        for (int k = 0; k < plan.pointProbes.size(); k++) {
            StoreSearch.PointProbe p = plan.pointProbes.get(k);
            if (!p.probe().onGrid() || p.probe().fractionHi() != 0) {
                continue;
            }
            Filter filter = new Filter(p, t);
            short[] column = store.column(p.probe().lo());
            int keptHere = 0;
            for (int i = 0; i < sampledCount; i++) {
                if (filter.keeps(column[sampled[i]])) {
                    keptHere++;
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
        StoreSearch.PointProbe p = plan.pointProbes.get(probe);
        Filter filter = new Filter(p, t);
        short[] column = store.column(p.probe().lo());
        int n = store.size();
        int[] curves = new int[Math.max(16, keptCount)];
        int count = 0;
        int lp = filter.plainLimit;
        int lb = filter.boundLimit;
        boolean nm = filter.notMeasured;
        if (p.pass()) {
            for (int c = 0; c < n; c++) {
                int u = column[c] & 0xFFFF;
                // plain codes at or below lp, bound codes at or below lb, "not measured" if its cap reaches t
                boolean keepIt = u < 0x8000 ? u <= lp : u == 0xFFFF ? nm : u - 0x8000 <= lb;
                if (keepIt) {
                    if (count == curves.length) {
                        curves = Arrays.copyOf(curves, count * 2);
                    }
                    curves[count++] = c;
                }
            }
        } else {
            for (int c = 0; c < n; c++) {
                int u = column[c] & 0xFFFF;
                boolean keepIt = u < 0x8000 ? u >= lp : u == 0xFFFF ? nm : u - 0x8000 >= lb;
                if (keepIt) {
                    if (count == curves.length) {
                        curves = Arrays.copyOf(curves, count * 2);
                    }
                    curves[count++] = c;
                }
            }
        }
        // the bound is at most every one-column probe's cap: the other columns rule out more, read only here
        for (int k = 0; k < plan.pointProbes.size(); k++) {
            StoreSearch.PointProbe other = plan.pointProbes.get(k);
            if (k == probe || !other.probe().onGrid() || other.probe().fractionHi() != 0) {
                continue;
            }
            Filter otherFilter = new Filter(other, t);
            short[] otherColumn = store.column(other.probe().lo());
            int left = 0;
            for (int i = 0; i < count; i++) {
                if (otherFilter.keeps(otherColumn[curves[i]])) {
                    curves[left++] = curves[i];
                }
            }
            count = left;
        }
        int[] bounds = new int[count];
        int admitted = 0;
        for (int i = 0; i < count; i++) {
            int c = curves[i];
            if (everyCurveAdmitted || plan.admits(store, c)) {
                curves[admitted] = c;
                bounds[admitted++] = boundOf(c);
            }
        }
        kept = curves;
        keptBound = bounds;
        keptCount = admitted;
        threshold = t;
    }

    private static int kthHighest(int[] values, int count, int k) {
        int[] copy = Arrays.copyOf(values, count);
        Arrays.sort(copy);
        return copy[count - k];
    }

    /** A curve's bound as measured: the chunk scan's rules for one curve, probe by probe in the same order. */
    int boundOf(int curve) {
        int bits = 0;
        double lowest = Double.POSITIVE_INFINITY;
        double lowestMiss = Double.POSITIVE_INFINITY;
        for (int k = 0; k < plan.pointProbes.size(); k++) {
            StoreSearch.PointProbe p = plan.pointProbes.get(k);
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

    /**
     * The highest bound a curve can have given one probe's code alone (see the class comment); for a code
     * "not measured" the probe is unverified with no margin of its own.
     */
    static int capOf(StoreSearch.PointProbe p, int code) {
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

        Filter(StoreSearch.PointProbe p, int t) {
            pass = p.pass();
            plainLimit = limit(p, t, 0, PLAIN_TOP);
            boundLimit = limit(p, t, OdCode.BOUND_BIT, BOUND_TOP);
            notMeasured = capOf(p, OdCode.NOT_MEASURED & 0xFFFF) >= t;
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

        private static int limit(StoreSearch.PointProbe p, int t, int boundBit, int top) {
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
