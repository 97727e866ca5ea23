package org.spectralsieve.search;

import java.util.Arrays;

/**
 * Which waiting materials of a {@link SlotSweep} are formed before the judging loop starts and which wait in the
 * reserve: those whose bound is at least the cut, the {@code keep}-th largest finite bound, are formed; the others wait,
 * the reserve's bound the largest of theirs (docs/weighted-screening.md, "The service as measured at a million
 * curves"). {@link #byScan} finds them with a pass over every material, as the eleventh pass's loop did; {@link #choose}
 * finds the very same ones from each half's {@code keep} largest bounds kept during the sweep ({@link Largest}),
 * without that pass, wherever they decide it, and scans a half only where they cannot: a half whose largest bounds
 * include one below the cut, or that has fewer than {@code keep} finite bounds, holds among them every bound of the
 * half at or above the cut (any other is at most their least), and its largest one below the cut is the half's; a half
 * whose {@code keep} largest are all at or above the cut may hold more equal to it, so it is scanned.
 */
final class ReserveCut {

    private ReserveCut() {
    }

    /**
     * @param cut          the {@code keep}-th largest finite bound ({@code -∞} when there are fewer)
     * @param formed       the materials formed now (bound at least the cut), ascending
     * @param inReserve    how many waiting materials are not formed (bound below the cut)
     * @param reserveBound the largest bound of those ({@code -∞} when none)
     */
    record Chosen(double cut, int[] formed, int inReserve, double reserveBound) {
    }

    /** One half's {@code keep} largest finite bounds and their materials: a min-heap by bound (its least first). */
    static final class Largest {

        final double[] bound;
        final int[] material;
        int size;

        Largest(int keep) {
            bound = new double[Math.max(0, keep)];
            material = new int[bound.length];
        }

        /** Offers material {@code mi}'s finite bound {@code b}. */
        void offer(double b, int mi) {
            if (size < bound.length) {
                int at = size++;
                bound[at] = b;
                material[at] = mi;
                while (at > 0 && bound[(at - 1) / 2] > bound[at]) {
                    swap(at, (at - 1) / 2);
                    at = (at - 1) / 2;
                }
            } else if (bound.length > 0 && b > bound[0]) {
                bound[0] = b;
                material[0] = mi;
                int at = 0;
                while (true) {
                    int least = at;
                    int l = 2 * at + 1;
                    if (l < size && bound[l] < bound[least]) {
                        least = l;
                    }
                    if (l + 1 < size && bound[l + 1] < bound[least]) {
                        least = l + 1;
                    }
                    if (least == at) {
                        return;
                    }
                    swap(at, least);
                    at = least;
                }
            }
        }

        boolean full() {
            return size == bound.length;
        }

        private void swap(int i, int j) {
            double b = bound[i];
            bound[i] = bound[j];
            bound[j] = b;
            int m = material[i];
            material[i] = material[j];
            material[j] = m;
        }
    }

    /**
     * The waiting materials of halves {@code [halfFrom[h], halfFrom[h + 1])} split at the cut, from the halves'
     * largest bounds where they decide it.
     *
     * @param waitingBound by material: its bound when it waits, NaN when it does not (finite or {@code -∞})
     * @param waiting      per half, how many of its materials wait
     */
    static Chosen choose(double[] waitingBound, int[] halfFrom, Largest[] largest, int[] waiting, int keep) {
        int finite = 0;
        for (Largest l : largest) {
            finite += l.size;
        }
        double[] both = new double[finite];
        int at = 0;
        for (Largest l : largest) {
            System.arraycopy(l.bound, 0, both, at, l.size);
            at += l.size;
        }
        // the keep-th largest of all is the keep-th largest of the halves' keep largest
        double cut = BoundedJudgement.kthLargest(both, finite, keep);
        if (cut == Double.NEGATIVE_INFINITY) {
            return byScan(waitingBound, halfFrom[0], halfFrom[halfFrom.length - 1], cut); // every waiting one is formed
        }
        int[] formed = new int[0];
        int formedCount = 0;
        int waitingCount = 0;
        double reserveBound = Double.NEGATIVE_INFINITY;
        for (int h = 0; h < largest.length; h++) {
            Largest l = largest[h];
            waitingCount += waiting[h];
            double leastKept = l.size == 0 ? Double.POSITIVE_INFINITY : l.bound[0];
            if (l.full() && !(leastKept < cut)) {
                // its keep largest all reach the cut: more equal to it may lie outside them
                Chosen scanned = byScan(waitingBound, halfFrom[h], halfFrom[h + 1], cut);
                formed = append(formed, formedCount, scanned.formed());
                formedCount += scanned.formed().length;
                reserveBound = Math.max(reserveBound, scanned.reserveBound());
                continue;
            }
            double belowCut = Double.NEGATIVE_INFINITY;
            boolean anyBelow = false;
            int[] mine = new int[l.size];
            int n = 0;
            for (int i = 0; i < l.size; i++) {
                if (l.bound[i] >= cut) {
                    mine[n++] = l.material[i];
                } else {
                    belowCut = Math.max(belowCut, l.bound[i]);
                    anyBelow = true;
                }
            }
            formed = append(formed, formedCount, Arrays.copyOf(mine, n));
            formedCount += n;
            // the half's others wait too (counted below): each at most the least kept when the kept ones are full (so
            // at most belowCut), else -∞ (every finite one was kept), which leaves the reserve's bound as it is
            if (anyBelow) {
                reserveBound = Math.max(reserveBound, belowCut);
            }
        }
        int[] chosen = Arrays.copyOf(formed, formedCount);
        Arrays.sort(chosen);
        return new Chosen(cut, chosen, waitingCount - formedCount, reserveBound);
    }

    /** The waiting materials of {@code [from, to)} at or above {@code cut}, and the rest, by a pass over each. */
    static Chosen byScan(double[] waitingBound, int from, int to, double cut) {
        int[] formed = new int[16];
        int n = 0;
        int inReserve = 0;
        double reserveBound = Double.NEGATIVE_INFINITY;
        for (int mi = from; mi < to; mi++) {
            double b = waitingBound[mi];
            if (b >= cut) {
                if (n == formed.length) {
                    formed = Arrays.copyOf(formed, 2 * n);
                }
                formed[n++] = mi;
            } else if (!Double.isNaN(b)) { // NaN: not waiting
                inReserve++;
                reserveBound = Math.max(reserveBound, b);
            }
        }
        return new Chosen(cut, Arrays.copyOf(formed, n), inReserve, reserveBound);
    }

    private static int[] append(int[] to, int count, int[] more) {
        int[] out = to.length >= count + more.length ? to : Arrays.copyOf(to, Math.max(2 * to.length, count + more.length));
        System.arraycopy(more, 0, out, count, more.length);
        return out;
    }
}
