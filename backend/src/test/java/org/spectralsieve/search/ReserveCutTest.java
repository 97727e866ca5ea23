package org.spectralsieve.search;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * Property: the waiting materials formed before the judging loop and those left in the reserve, found from each half's
 * largest bounds ({@link ReserveCut#choose}, the slot sweep's way), are exactly those a pass over every material finds
 * ({@link ReserveCut#byScan} at the {@code keep}-th largest finite bound, the eleventh pass's loop): the same cut, the
 * same materials formed in the same order, the same count and largest bound in the reserve. Bounds drawn from a few
 * values on a 0.02-decade grid (many ties at the cut, as the figure codes' quantised bounds give), some {@code -∞}, some
 * materials not waiting (NaN), halves of random sizes, {@code keep} from 0 to beyond the number of bounds; a fixed seed
 * (jqwik is not available offline).
 */
class ReserveCutTest {

    @Test
    void theHalvesLargestBoundsChooseWhatAPassOverEveryMaterialChooses() {
        Random random = new Random(20261207L);
        int scannedHalves = 0;
        int decidedHalves = 0;
        for (int trial = 0; trial < 2000; trial++) {
            int n = 1 + random.nextInt(400);
            int half = random.nextInt(n + 1);
            int keep = random.nextInt(3) == 0 ? random.nextInt(n + 20) : random.nextInt(40);
            int levels = 1 + random.nextInt(random.nextBoolean() ? 4 : 60);
            double[] waitingBound = new double[n];
            for (int mi = 0; mi < n; mi++) {
                int kind = random.nextInt(20);
                waitingBound[mi] = kind == 0 ? Double.NaN
                        : kind == 1 ? Double.NEGATIVE_INFINITY
                        : 0.02 * (random.nextInt(levels) - levels / 2);
            }
            ReserveCut.Largest[] largest = {new ReserveCut.Largest(keep), new ReserveCut.Largest(keep)};
            int[] waiting = new int[2];
            double[] finite = new double[n];
            int finiteCount = 0;
            for (int mi = 0; mi < n; mi++) {
                double b = waitingBound[mi];
                int h = mi < half ? 0 : 1;
                if (!Double.isNaN(b)) {
                    waiting[h]++;
                    if (b > Double.NEGATIVE_INFINITY) {
                        largest[h].offer(b, mi);
                        finite[finiteCount++] = b;
                    }
                }
            }
            double cut = BoundedJudgement.kthLargest(finite, finiteCount, keep);
            ReserveCut.Chosen expected = ReserveCut.byScan(waitingBound, 0, n, cut);
            ReserveCut.Chosen chosen = ReserveCut.choose(waitingBound, new int[] {0, half, n}, largest, waiting, keep);

            String what = "trial " + trial + " (n " + n + ", half " + half + ", keep " + keep + ", levels " + levels + ")";
            assertThat(chosen.cut()).as(what + ": the cut").isEqualTo(cut);
            assertThat(chosen.formed()).as(what + ": formed now").containsExactly(expected.formed());
            assertThat(chosen.inReserve()).as(what + ": in the reserve").isEqualTo(expected.inReserve());
            assertThat(chosen.reserveBound()).as(what + ": the reserve's bound").isEqualTo(expected.reserveBound());
            for (ReserveCut.Largest l : largest) {
                boolean scanned = l.full() && l.size > 0 && !(l.bound[0] < cut) && cut > Double.NEGATIVE_INFINITY;
                scannedHalves += scanned ? 1 : 0;
                decidedHalves += !scanned && l.size > 0 && cut > Double.NEGATIVE_INFINITY ? 1 : 0;
            }
        }
        // not vacuous: both ways of a half were taken many times
        assertThat(scannedHalves).isGreaterThan(100);
        assertThat(decidedHalves).isGreaterThan(500);
    }
}
