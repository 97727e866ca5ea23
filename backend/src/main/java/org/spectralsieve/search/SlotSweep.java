package org.spectralsieve.search;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.ForkJoinPool;
import java.util.concurrent.ForkJoinTask;
import java.util.concurrent.atomic.AtomicLong;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.Material;
import org.spectralsieve.requirement.MadeThicknesses;

/**
 * As measured without a layer, over the whole library: every material's contender bound from the snapshot index's
 * slots alone — no material or sample record read, nothing formed per material but a number — and the contenders
 * formed only for the few materials the judging loop may reach (docs/weighted-screening.md, "The service as measured at
 * a million curves"). The same contenders, reserve and admitted count as the eleventh pass's loop in
 * {@code BoundedExactSearch.searchExactly}, which kept a {@code Material} and a boxed flag per deferred material (a
 * third of a million at a million curves) and read each through its record: a material whose admitted samples all have
 * a bound waits by its index into the snapshot index, with the largest of those bounds; one with a sample without a
 * bound ({@code +∞}) has its sample contenders formed at once; the deferred ones at or above the cut are formed after
 * them, the others wait in the reserve. The materials are split in two halves swept on both cores from
 * {@value #PARALLEL_FROM} materials on; each half writes only its own materials' entries, and the halves' results are
 * joined in material order, so the outcome does not depend on the threads.
 */
final class SlotSweep {

    /** Materials from which the sweep runs on two threads (below it handing half to the pool costs more than it saves). */
    static final int PARALLEL_FROM = 32_768;

    private static final int REGULAR = Geometry.REGULAR.ordinal();

    /** Sweeps made, and those made in two halves on two threads, since the start (tests read them). */
    static final AtomicLong SWEEPS = new AtomicLong();
    static final AtomicLong SWEEPS_IN_TWO = new AtomicLong();

    private SlotSweep() {
    }

    /** Forms the sample contenders of a material of the index (its first slot, regular flag and made thicknesses). */
    @FunctionalInterface
    interface Contenders {
        void add(List<BoundedJudgement.Contender> out, Material material, int firstSlot, boolean regular,
                 MadeThicknesses made);
    }

    /**
     * The contenders formed now and the reserve of the others.
     *
     * @param reserve   null when no material waits
     * @param inReserve how many materials wait in it
     * @param admitted  the admitted samples of every material
     */
    record Formed(List<BoundedJudgement.Contender> contenders, BoundedJudgement.Reserve reserve, int inReserve,
                  int admitted) {
    }

    /**
     * @param bounds    the search's first bounds, read by row ({@link FirstBounds#readsRows})
     * @param grouped   diffuse rows are ranked apart: a contender records whether its material has a regular sample
     * @param formFirst how many deferred materials, by largest bound, are formed before the reserve (the cut)
     * @param inTwoFrom from how many materials the sweep runs in two halves on two threads
     *                  ({@value #PARALLEL_FROM}; {@link Integer#MAX_VALUE}: on the caller's thread alone)
     */
    static Formed form(SnapshotIndex.Slots slots, FirstBounds bounds, Admission admission, boolean grouped,
                       int formFirst, int inTwoFrom, Contenders contenders) {
        int n = slots.materials.size();
        Swept swept = new Swept(n, grouped);
        boolean[] classAdmits = admission.classes(slots.classLabels);
        boolean[] geometryAdmits = new boolean[Geometry.values().length];
        for (int g = 0; g < geometryAdmits.length; g++) {
            geometryAdmits[g] = admission.geometry(g);
        }
        SWEEPS.incrementAndGet();
        if (n >= Math.max(2, inTwoFrom)) {
            SWEEPS_IN_TWO.incrementAndGet();
            int half = n / 2;
            ForkJoinTask<?> second = ForkJoinPool.commonPool().submit(
                    () -> swept.sweep(slots, bounds, classAdmits, geometryAdmits, half, n, 1));
            swept.sweep(slots, bounds, classAdmits, geometryAdmits, 0, half, 0);
            second.join();
        } else {
            swept.sweep(slots, bounds, classAdmits, geometryAdmits, 0, n, 0);
        }
        List<BoundedJudgement.Contender> formed = new ArrayList<>();
        for (int part = 0; part < 2; part++) {
            for (int k = 0; k < swept.unboundedCount[part]; k++) {
                int mi = swept.unbounded[part][k];
                contenders.add(formed, slots.materials.get(mi), slots.firstSlot[mi], swept.regular(mi), slots.made[mi]);
            }
        }
        // the deferred materials at or above the cut are formed now, the others on demand: the cut leaves room for
        // every row to be judged several times over before the loop could reach the reserve
        double cut = BoundedJudgement.kthLargest(swept.deferredBound, n, formFirst);
        int[] later = new int[n];
        int inReserve = 0;
        double reserveBound = Double.NEGATIVE_INFINITY;
        for (int mi = 0; mi < n; mi++) {
            double b = swept.deferredBound[mi];
            if (Double.isNaN(b)) {
                continue; // not deferred
            }
            if (b >= cut) {
                contenders.add(formed, slots.materials.get(mi), slots.firstSlot[mi], swept.regular(mi), slots.made[mi]);
            } else {
                later[inReserve++] = mi;
                reserveBound = Math.max(reserveBound, b);
            }
        }
        BoundedJudgement.Reserve reserve = null;
        if (inReserve > 0) {
            int waiting = inReserve;
            reserve = new BoundedJudgement.Reserve(reserveBound, () -> {
                List<BoundedJudgement.Contender> out = new ArrayList<>();
                for (int k = 0; k < waiting; k++) {
                    int mi = later[k];
                    contenders.add(out, slots.materials.get(mi), slots.firstSlot[mi], swept.regular(mi), slots.made[mi]);
                }
                return out;
            });
        }
        return new Formed(formed, reserve, inReserve, swept.admitted[0] + swept.admitted[1]);
    }

    /** Each material's outcome, by its index in the snapshot index; two parts write disjoint materials. */
    private static final class Swept {

        /** The deferred material's bound (the largest of its admitted samples'), NaN when it is not deferred. */
        final double[] deferredBound;
        /** Whether the material has an admitted regular sample (only when diffuse rows are ranked apart), else null. */
        final boolean[] regular;
        /** Per part: the materials with an admitted sample without a bound, in material order. */
        final int[][] unbounded = new int[2][];
        final int[] unboundedCount = new int[2];
        final int[] admitted = new int[2];

        Swept(int materials, boolean grouped) {
            deferredBound = new double[materials];
            regular = grouped ? new boolean[materials] : null;
        }

        boolean regular(int mi) {
            return regular != null && regular[mi];
        }

        void sweep(SnapshotIndex.Slots slots, FirstBounds bounds, boolean[] classAdmits, boolean[] geometryAdmits,
                   int from, int to, int part) {
            int[] firstSlot = slots.firstSlot;
            int[] classOf = slots.classOf;
            byte[] geometryOf = slots.geometryOrdinalBySlot;
            int[] rowOf = slots.rowBySlot;
            int[] noBound = new int[16];
            int noBoundCount = 0;
            int admittedHere = 0;
            for (int mi = from; mi < to; mi++) {
                double bound = Double.NEGATIVE_INFINITY;
                boolean hasRegular = false;
                int count = 0;
                if (classAdmits[classOf[mi]]) {
                    for (int slot = firstSlot[mi]; slot < firstSlot[mi + 1]; slot++) {
                        int g = geometryOf[slot];
                        if (geometryAdmits[g]) {
                            count++;
                            int row = rowOf[slot];
                            // as FirstBounds.bound: +∞ for a sample the store holds no row for
                            bound = Math.max(bound, row < 0 ? Double.POSITIVE_INFINITY : bounds.boundAtRow(row));
                            hasRegular |= g == REGULAR;
                        }
                    }
                }
                admittedHere += count;
                if (count > 0 && bound == Double.POSITIVE_INFINITY) {
                    if (noBoundCount == noBound.length) {
                        noBound = Arrays.copyOf(noBound, 2 * noBoundCount);
                    }
                    noBound[noBoundCount++] = mi;
                }
                deferredBound[mi] = count > 0 && bound != Double.POSITIVE_INFINITY ? bound : Double.NaN;
                if (regular != null) {
                    regular[mi] = hasRegular;
                }
            }
            unbounded[part] = noBound;
            unboundedCount[part] = noBoundCount;
            admitted[part] = admittedHere;
        }
    }
}
