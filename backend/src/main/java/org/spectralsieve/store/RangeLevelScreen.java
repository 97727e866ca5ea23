package org.spectralsieve.store;

import org.spectralsieve.requirement.Standing;

/**
 * Over a thickness range, an integer screen of one one-column probe that keeps every curve whose cap
 * ({@link ColumnFirstScan#marginCap}, compared by {@link ColumnFirstScan.Reach}) reaches t, and perhaps a few
 * more (docs/store-scan.md, "An integer screen before the caps over a range"). The column-first pass reads it
 * over every curve and works out the exact caps only for its survivors, so the curves kept are the same as
 * before; the loop compares the 16-bit code's level with a limit looked up by the curve's
 * {@link ThicknessClasses class} and the code's stored-bound bit, with no floating-point arithmetic.
 *
 * <p>Why it keeps at least what the cap keeps. Within one kind of reading the cap's key only rises with the
 * probe's margin (a higher margin never moves a curve to a lower group: below 0 it is a miss, at or above 0
 * it holds or is unverified), so "cap reaches t" implies "margin ≥ M" for one margin M per kind: the least of
 * the group below 0's least reaching margin and the group at or above 0's ({@link #atLeast}), loosened by
 * {@link #SLACK} (far above the rounding of either side, far below a key step of 1e-4). Then, per class:
 * <ul>
 *   <li>films and coatings, and clear readings of a sheet (at or below the unresolved OD: a flat line, the
 *       reading's own margin): the margin falls (pass) or rises (block) with the level alone, so the test is
 *       a level limit, found by a binary search on the loosened test;</li>
 *   <li>other readings of a sheet: the line at its best end, {@code (thr − s) − internal·min/d0} for a pass
 *       (rising with d0), {@code (s − thr) + internal·highest/d0} for a block (falling with d0), so the bucket's
 *       thickest end (pass) or thinnest (block) keeps every thickness in it; the level limit is that line's
 *       solved for the level, widened by one level;</li>
 *   <li>a sheet's clear and other readings together: one limit that covers both sets of levels;</li>
 *   <li>a code "not measured", and a sheet whose thickness is unknown: kept.</li>
 * </ul>
 */
final class RangeLevelScreen {

    /** Relative loosening of the margin test: rounding is about 1e-16 of the terms, a key step 1e-4 decades. */
    static final double SLACK = 1e-7;
    private static final int TOP = OdCode.LEVEL_MASK;

    private final boolean pass;
    /**
     * Kept levels by class and stored-bound bit, two ranges each ({@code 4·class + 2·bit} and the next): a
     * sheet's clear readings, then its other readings (a film's one range, then none), each packed as
     * {@code first << 16 | last}.
     */
    private final int[] ranges;

    RangeLevelScreen(PointProbe p, int k, int t, double[][] loss, double[][] unresolved, double minMm,
                     double highestMm, ThicknessClasses classes) {
        this.pass = p.pass();
        double thr = p.thresholdOd();
        double[] least = new double[3];
        for (int g = 0; g < 3; g++) {
            least[g] = ColumnFirstScan.leastMargin(Standing.values()[g], t);
        }
        // min for a pass, the thickest judged (max + 2·tolerance) for a block, loosened
        double lever = pass ? minMm * (1 - SLACK) : highestMm * (1 + SLACK);
        int[] out = new int[classes.classes() * 4];
        for (int stored = 0; stored < 2; stored++) {
            // films: ProbeVerdict.of's groups (a stored pass at or above 0 is unverified, a stored block below 0)
            double film = pass ? atLeast(least, stored, 2) : atLeast(least, 0, stored == 1 ? 1 : 2);
            // a sheet: a pass's groups as a film's; a block below 0 is unverified when clear or stored
            double clear = pass ? film : atLeast(least, 0, 1);
            double sheet = pass ? film : atLeast(least, 0, stored == 1 ? 1 : 2);
            int filmLimit = levelLimit(thr, film);
            int filmAt = 4 * ThicknessClasses.FILM + 2 * stored;
            out[filmAt] = pass ? range(0, filmLimit) : range(filmLimit, TOP);
            out[filmAt + 1] = EMPTY;
            int unknownAt = 4 * ThicknessClasses.UNKNOWN_THICKNESS + 2 * stored;
            out[unknownAt] = range(0, TOP);
            out[unknownAt + 1] = EMPTY;
            int clearLimit = levelLimit(thr, clear);
            for (int m = 0; m < classes.models(); m++) {
                int clearTop = clearTop(unresolved[m][k]);
                double s = loss[m][k];
                double perD0 = perD0(thr, s, sheet);
                int clearRange = pass ? range(0, Math.min(clearTop, clearLimit)) : range(clearLimit, clearTop);
                for (int b = 0; b < classes.buckets(); b++) {
                    int at = 4 * ThicknessClasses.sheetClass(m, b, classes.buckets()) + 2 * stored;
                    out[at] = clearRange;
                    out[at + 1] = pass ? range(clearTop + 1, passLimit(s, perD0, lever, classes.bucketHighMm(b)))
                            : range(Math.max(clearTop + 1, blockLimit(s, perD0, lever, classes.bucketLowMm(b))), TOP);
                }
            }
        }
        this.ranges = out;
    }

    /** No level. */
    private static final int EMPTY = (TOP + 1) << 16;

    /** The levels first..last (both included), packed; {@link #EMPTY} when there are none. */
    private static int range(int first, int last) {
        int from = Math.max(0, first);
        int to = Math.min(TOP, last);
        return from > to ? EMPTY : from << 16 | to;
    }

    /** Whether the curve of class {@code cls} may reach t by this probe's code (never false where its cap does). */
    boolean keeps(short code, int cls) {
        int u = code & 0xFFFF;
        int level = u & OdCode.LEVEL_MASK;
        int at = (cls << 2) | (u >>> 15 << 1);
        int clear = ranges[at];
        int other = ranges[at + 1];
        return (level >= clear >>> 16 & level <= (clear & 0xFFFF))
                | (level >= other >>> 16 & level <= (other & 0xFFFF)) | u == 0xFFFF;
    }

    /**
     * The loosened margin test of a sheet's reading that is not clear, multiplied out by d0 &gt; 0: a pass keeps
     * when internal·lever ≤ perD0·d0, a block when internal·lever ≥ perD0·d0. ±∞ kept apart: a pass keeps every
     * such reading at −∞ and none at +∞ (the loosening would make ∞ − ∞).
     */
    private double perD0(double thr, double s, double atLeast) {
        if (pass) {
            double a = thr - s;
            return Double.isInfinite(atLeast) ? -atLeast : (a - atLeast) + SLACK * (1 + Math.abs(a) + Math.abs(atLeast));
        }
        double b = s - thr;
        return Double.isInfinite(atLeast) ? atLeast : (atLeast - b) - SLACK * (1 + Math.abs(b) + Math.abs(atLeast));
    }

    /**
     * A pass: the highest level with internal·lever ≤ perD0·d (internal = max(0, level·STEP − s)), plus one
     * level; d is the bucket's upper end (the margin only rises with d0).
     */
    private static int passLimit(double s, double perD0, double lever, double d) {
        if (perD0 < 0 || Double.isNaN(perD0)) {
            return -1; // internal·lever ≥ 0 is never at most a negative number
        }
        if (Double.isInfinite(perD0) || Double.isInfinite(d)) {
            return TOP;
        }
        double highestValue = s + perD0 * d / lever;
        return (int) Math.min(TOP, Math.floor(highestValue / OdCode.STEP) + 1);
    }

    /**
     * A block: the lowest level with internal·lever ≥ perD0·d, less one level; d is the bucket's lower end
     * (the margin only falls with d0).
     */
    private static int blockLimit(double s, double perD0, double lever, double d) {
        if (perD0 <= 0 || Double.isNaN(perD0)) {
            return 0; // every level: internal·lever ≥ 0 ≥ perD0·d
        }
        if (Double.isInfinite(perD0)) {
            return TOP + 1;
        }
        double lowestValue = s + perD0 * d / lever;
        return (int) Math.max(0, Math.min(TOP + 1, Math.ceil(lowestValue / OdCode.STEP) - 1));
    }


    /**
     * The least margin any reading of one kind can have and still reach t: the group at or above 0
     * ({@code nonNegativeGroup}) keeps from max(0, its least), the group below 0 from its least.
     */
    static double atLeast(double[] least, int nonNegativeGroup, int negativeGroup) {
        return Math.min(Math.max(0, least[nonNegativeGroup]), least[negativeGroup]);
    }

    /**
     * The level limit of "margin ≥ atLeast, loosened": for a pass (margin thr − v, falling with the level) the
     * highest level kept (−1: none), for a block (v − thr, rising) the lowest (above every level: none).
     */
    private int levelLimit(double thr, double atLeast) {
        if (pass) {
            int lo = -1;
            int hi = TOP;
            while (lo < hi) {
                int mid = (lo + hi + 1) >>> 1;
                if (loosenedAtLeast(thr - mid * OdCode.STEP, atLeast)) {
                    lo = mid;
                } else {
                    hi = mid - 1;
                }
            }
            return lo;
        }
        int lo = 0;
        int hi = TOP + 1;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (loosenedAtLeast(mid * OdCode.STEP - thr, atLeast)) {
                hi = mid;
            } else {
                lo = mid + 1;
            }
        }
        return lo;
    }

    private static boolean loosenedAtLeast(double margin, double atLeast) {
        if (Double.isInfinite(atLeast)) {
            return margin >= atLeast; // −∞: every level, +∞: none (a finite margin never reaches it)
        }
        return margin + SLACK * (1 + Math.abs(margin) + Math.abs(atLeast)) >= atLeast;
    }

    /** The highest level whose value reads clear ({@code level·STEP ≤ unresolved}, as the cap tests it); −1: none. */
    private static int clearTop(double unresolvedOd) {
        int lo = -1;
        int hi = TOP;
        while (lo < hi) {
            int mid = (lo + hi + 1) >>> 1;
            if (mid * OdCode.STEP <= unresolvedOd) {
                lo = mid;
            } else {
                hi = mid - 1;
            }
        }
        return lo;
    }
}
