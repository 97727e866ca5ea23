package org.spectralsieve.search;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.ForkJoinPool;
import java.util.concurrent.ForkJoinTask;
import java.util.concurrent.atomic.AtomicLong;
import org.spectralsieve.library.Geometry;

/**
 * As measured without a layer, over the whole library: every material's contender bound from the snapshot index's
 * slots alone — no material or sample record read, nothing formed per material but a number — and the sample
 * contenders formed only for the few materials the judging loop may reach (docs/weighted-screening.md, "The service as
 * measured at a million curves"). The same contenders, reserve and admitted count as the eleventh pass's loop in
 * {@code BoundedExactSearch.searchExactly}, which kept a {@code Material} and a boxed flag per deferred material (a
 * third of a million at a million curves) and read each through its record: a material whose admitted samples all have
 * a bound waits by its index into the snapshot index, with the largest of those bounds; one with a sample without a
 * bound ({@code +∞}) has its sample contenders formed at once; the waiting ones at or above the cut (the
 * {@code formFirst}-th largest bound) are formed after them, the others wait in the reserve. From
 * {@value #PARALLEL_FROM} materials on the materials are swept in two halves on two threads; each half writes only its
 * own materials' entries and keeps its own largest bounds, and the halves are joined in material order, so the outcome
 * does not depend on the threads.
 */
final class SlotSweep {

    /** Materials from which the sweep runs on two threads (below it handing half to the pool costs more than it saves). */
    static final int PARALLEL_FROM = 32_768;

    private static final int REGULAR = Geometry.REGULAR.ordinal();

    /** Sweeps made, and those made in two halves on two threads, since the start (tests read them). */
    static final AtomicLong SWEEPS = new AtomicLong();
    static final AtomicLong SWEEPS_IN_TWO = new AtomicLong();

    private final SnapshotIndex.Slots slots;
    private final FirstBounds bounds;
    private final boolean grouped;
    private final boolean[] classAdmits;
    private final boolean[] geometryAdmits;
    /** Every class and every geometry admitted: a material's admitted samples are all its slots. */
    private final boolean admitsEverySlot;

    private SlotSweep(SnapshotIndex.Slots slots, FirstBounds bounds, Admission admission, boolean grouped) {
        this.slots = slots;
        this.bounds = bounds;
        this.grouped = grouped;
        this.classAdmits = admission.classes(slots.classLabels);
        this.geometryAdmits = new boolean[Geometry.values().length];
        boolean every = true;
        for (int g = 0; g < geometryAdmits.length; g++) {
            geometryAdmits[g] = admission.geometry(g);
            every &= geometryAdmits[g];
        }
        for (boolean c : classAdmits) {
            every &= c;
        }
        this.admitsEverySlot = every;
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
     * @param formFirst how many waiting materials, by largest bound, are formed before the reserve (the cut)
     * @param inTwoFrom from how many materials the sweep runs in two halves on two threads
     *                  ({@value #PARALLEL_FROM}; {@link Integer#MAX_VALUE}: on the caller's thread alone)
     */
    static Formed form(SnapshotIndex.Slots slots, FirstBounds bounds, Admission admission, boolean grouped,
                       int formFirst, int inTwoFrom) {
        return new SlotSweep(slots, bounds, admission, grouped).form(formFirst, inTwoFrom);
    }

    private Formed form(int formFirst, int inTwoFrom) {
        int n = slots.materials.size();
        Swept swept = new Swept(n, formFirst);
        SWEEPS.incrementAndGet();
        int half = n >= Math.max(2, inTwoFrom) ? n / 2 : n;
        if (half < n) {
            SWEEPS_IN_TWO.incrementAndGet();
            ForkJoinTask<?> second = ForkJoinPool.commonPool().submit(() -> sweep(swept, half, n, 1));
            sweep(swept, 0, half, 0);
            second.join();
        } else {
            sweep(swept, 0, n, 0);
        }
        List<BoundedJudgement.Contender> formed = new ArrayList<>();
        for (int part = 0; part < 2; part++) {
            for (int k = 0; k < swept.unboundedCount[part]; k++) {
                addSampleContenders(formed, swept.unbounded[part][k], swept);
            }
        }
        // the waiting materials at or above the cut (the formFirst-th largest bound) are formed now, the others on
        // demand: the cut leaves room for every row to be judged several times over before the loop could reach the
        // reserve. Found from the halves' largest bounds, without a pass over every material (ReserveCut)
        double[] waitingBound = swept.waitingBound;
        ReserveCut.Chosen chosen = ReserveCut.choose(waitingBound, new int[] {0, half, n}, swept.largest,
                swept.waiting, formFirst);
        for (int mi : chosen.formed()) {
            addSampleContenders(formed, mi, swept);
        }
        int inReserve = chosen.inReserve();
        double reserveBound = chosen.reserveBound();
        double cut = chosen.cut();
        BoundedJudgement.Reserve reserve = null;
        if (inReserve > 0) {
            // formed on demand, rarely: the materials below the cut found again by their bounds, in material order
            reserve = new BoundedJudgement.Reserve(reserveBound, () -> {
                List<BoundedJudgement.Contender> out = new ArrayList<>();
                for (int mi = 0; mi < n; mi++) {
                    if (waitingBound[mi] < cut) {
                        addSampleContenders(out, mi, swept);
                    }
                }
                return out;
            });
        }
        return new Formed(formed, reserve, inReserve, swept.admitted[0] + swept.admitted[1]);
    }

    /**
     * Materials [from, to): each one's largest admitted sample bound into {@link Swept#waitingBound} (NaN when it has
     * no admitted sample, or one without a bound: those are listed in {@link Swept#unbounded}), whether it has an
     * admitted regular sample, and the half's largest bounds.
     */
    private void sweep(Swept swept, int from, int to, int part) {
        int[] firstSlot = slots.firstSlot;
        int[] classOf = slots.classOf;
        byte[] geometryOf = slots.geometryOrdinalBySlot;
        int[] rowOf = slots.rowBySlot;
        boolean plain = admitsEverySlot && slots.slotIsRow;
        double[] waitingBound = swept.waitingBound;
        int[] noBound = new int[16];
        int noBoundCount = 0;
        ReserveCut.Largest largest = swept.largest[part];
        int waitingHere = 0;
        int admitted = 0;
        for (int mi = from; mi < to; mi++) {
            double bound = Double.NEGATIVE_INFINITY;
            boolean hasRegular = false;
            int count = 0;
            if (plain) {
                // the common case: every slot admitted and read at its own row, the geometry from the index
                for (int slot = firstSlot[mi]; slot < firstSlot[mi + 1]; slot++) {
                    bound = Math.max(bound, bounds.boundAtRow(slot));
                }
                count = firstSlot[mi + 1] - firstSlot[mi];
                hasRegular = slots.hasRegular[mi];
            } else if (classAdmits[classOf[mi]]) {
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
            admitted += count;
            boolean waits = count > 0 && bound != Double.POSITIVE_INFINITY;
            if (count > 0 && !waits) {
                if (noBoundCount == noBound.length) {
                    noBound = Arrays.copyOf(noBound, 2 * noBoundCount);
                }
                noBound[noBoundCount++] = mi;
            }
            waitingBound[mi] = waits ? bound : Double.NaN;
            if (waits) {
                waitingHere++;
                if (bound > Double.NEGATIVE_INFINITY) { // finite: the cut counts finite bounds only
                    largest.offer(bound, mi);
                }
            }
            if (grouped) {
                swept.regular[mi] = hasRegular;
            }
        }
        swept.waiting[part] = waitingHere;
        swept.unbounded[part] = noBound;
        swept.unboundedCount[part] = noBoundCount;
        swept.admitted[part] = admitted;
    }

    /**
     * One contender per admitted sample of material {@code mi}, as {@code BoundedExactSearch.addSampleContenders} forms
     * them as measured (no sample is settled by thickness, every material is made as measured, so a negative bound
     * proves a miss), read from the index's slots.
     */
    private void addSampleContenders(List<BoundedJudgement.Contender> out, int mi, Swept swept) {
        var material = slots.materials.get(mi);
        if (!classAdmits[slots.classOf[mi]]) {
            return;
        }
        boolean regular = grouped && swept.regular[mi];
        for (int slot = slots.firstSlot[mi]; slot < slots.firstSlot[mi + 1]; slot++) {
            if (geometryAdmits[slots.geometryOrdinalBySlot[slot]]) {
                long sampleId = slots.sampleIdBySlot[slot];
                double b = bounds.bound(sampleId, slots.rowBySlot[slot]);
                out.add(new BoundedJudgement.Contender(material, b, b < 0, regular, false, Double.POSITIVE_INFINITY,
                        sampleId));
            }
        }
    }

    /** Each material's outcome, by its index in the snapshot index; two halves write disjoint materials. */
    private static final class Swept {

        /** The waiting material's bound (the largest of its admitted samples'), NaN when it does not wait. */
        final double[] waitingBound;
        /** Whether the material has an admitted regular sample (read only when diffuse rows are ranked apart). */
        final boolean[] regular;
        /** Per half: the materials with an admitted sample without a bound, in material order. */
        final int[][] unbounded = {new int[0], new int[0]};
        final int[] unboundedCount = new int[2];
        final int[] admitted = new int[2];
        /** Per half: its {@code keep} largest finite waiting bounds, and how many of its materials wait. */
        final ReserveCut.Largest[] largest;
        final int[] waiting = new int[2];

        Swept(int materials, int keep) {
            waitingBound = new double[materials];
            regular = new boolean[materials];
            largest = new ReserveCut.Largest[] {new ReserveCut.Largest(keep), new ReserveCut.Largest(keep)};
        }
    }
}
