package org.spectralsieve.search;

import java.util.Map;

/**
 * Each sample's first bounds in one exact search ({@code BoundedExactSearch.searchExactly}): the proven-miss bound
 * (negative; from the every-point, layer-block and weighted screens) and the weighted screen's margin bound of either
 * sign, and the store row its second stage refines (only where it has a margin bound: the second stage only tightens
 * one). Three forms, the same values: arrays indexed by the store's row, filled once per search in the store's row order
 * ({@link #byRow}); the weighted screen's own array read in place where no other screen bounded anything
 * ({@link #screenAlone}); and the maps keyed by sample id kept from before ({@link #bySampleId},
 * {@code -Dsieve.search.row-arrays=false}), whose million boxed entries per search at a million curves cost more than
 * the search's judgement (docs/weighted-screening.md, "The service at a million curves"). Callers give both the sample
 * id and its store row ({@code -1} when it has none, or when the bounds are kept by id and the row is not looked up).
 */
abstract class FirstBounds {

    /** The proven-miss bound (negative), NaN when the sample has none. */
    abstract double miss(long sampleId, int row);

    /** The margin bound, NaN when the sample has none. */
    abstract double margin(long sampleId, int row);

    /** The store row the second stage refines for the sample, {@code -1} when it has no margin bound. */
    abstract int secondStageRow(long sampleId, int row);

    /** Whether any sample has a margin bound (the weighted screen ran and bounded something). */
    abstract boolean anyMargin();

    /** Whether the bounds are read by store row: callers then give each sample's row, else {@code -1} will do. */
    abstract boolean readsRows();

    /**
     * The screen of a solve whose bins were left unread on some curves ({@link WeightedMisses#screenWithBinsDeferred}),
     * whose bounds this reads in place; null when every bound is the full one. The caller reads in full
     * ({@link WeightedMisses.DeferredBins#readInFull}) every deferred row of a contender before it is formed.
     */
    WeightedMisses.DeferredBins deferredBins() {
        return null;
    }

    /** The smaller of the sample's first bounds, {@code +∞} when it has none. */
    double bound(long sampleId, int row) {
        double miss = miss(sampleId, row);
        double margin = margin(sampleId, row);
        return Math.min(Double.isNaN(miss) ? Double.POSITIVE_INFINITY : miss,
                Double.isNaN(margin) ? Double.POSITIVE_INFINITY : margin);
    }

    /**
     * {@link #bound} of the sample in store row {@code row} (at least 0), for a form that {@link #readsRows}: the
     * sweep over every slot reads it without a sample id.
     */
    double boundAtRow(int row) {
        return bound(0, row);
    }

    /**
     * @param miss    by store row, the proven-miss bound or NaN
     * @param margin  by store row, the margin bound or NaN; null when the weighted screen did not run
     * @param margins how many rows of {@code margin} hold a bound
     */
    static FirstBounds byRow(double[] miss, double[] margin, int margins) {
        return new ByRow(miss, margin, margins);
    }

    /**
     * The weighted screen's bounds by store row as they are, where no other screen bounded anything (no every-point
     * clause screened, no layer): the same values {@link #byRow} would copy out of them — a bound below 0 is the
     * proven-miss bound, any bound below {@code +∞} the margin bound, NaN or {@code +∞} neither — read in place
     * instead of copied into two arrays of a million per search at a million curves (docs/weighted-screening.md,
     * "The service as measured at a million curves"). The array is the search's own (the screen forms it per search);
     * {@code clearedRows}, the rows of samples whose records fail today's checks, are cleared in it.
     */
    static FirstBounds screenAlone(double[] screenBounds, int[] clearedRows) {
        return new ScreenAlone(screenBounds, clearedRows, null);
    }

    /**
     * {@link #screenAlone} over the bounds of a solve's screen with some bins left unread ({@link #deferredBins}): a
     * cleared row is no longer deferred (reading it in full would give it a bound again).
     */
    static FirstBounds screenAlone(WeightedMisses.DeferredBins screen, int[] clearedRows) {
        for (int row : clearedRows) {
            screen.deferred()[row] = false;
        }
        return new ScreenAlone(screen.bounds(), clearedRows, screen);
    }

    static FirstBounds bySampleId(Map<Long, Double> provenMiss, Map<Long, Double> marginBound, Map<Long, Integer> rowOf) {
        return new BySampleId(provenMiss, marginBound, rowOf);
    }

    private static final class ByRow extends FirstBounds {

        private final double[] miss;
        private final double[] margin;
        private final int margins;

        ByRow(double[] miss, double[] margin, int margins) {
            this.miss = miss;
            this.margin = margin;
            this.margins = margins;
        }

        @Override
        double miss(long sampleId, int row) {
            return row < 0 ? Double.NaN : miss[row];
        }

        @Override
        double boundAtRow(int row) {
            double m = miss[row];
            double g = margin == null ? Double.NaN : margin[row];
            return Math.min(Double.isNaN(m) ? Double.POSITIVE_INFINITY : m, Double.isNaN(g) ? Double.POSITIVE_INFINITY : g);
        }

        @Override
        double margin(long sampleId, int row) {
            return row < 0 || margin == null ? Double.NaN : margin[row];
        }

        @Override
        int secondStageRow(long sampleId, int row) {
            return Double.isNaN(margin(sampleId, row)) ? -1 : row;
        }

        @Override
        boolean anyMargin() {
            return margins > 0;
        }

        @Override
        boolean readsRows() {
            return true;
        }
    }

    /** {@link #screenAlone}: one array of the screen's bounds by store row, read in place. */
    private static final class ScreenAlone extends FirstBounds {

        private final double[] bounds;
        private final boolean anyMargin;
        private final WeightedMisses.DeferredBins deferredBins;

        ScreenAlone(double[] bounds, int[] clearedRows, WeightedMisses.DeferredBins deferredBins) {
            this.bounds = bounds;
            this.deferredBins = deferredBins;
            for (int row : clearedRows) {
                bounds[row] = Double.NaN; // neither bound, as byRow leaves such a row
            }
            boolean found = false;
            for (int row = 0; row < bounds.length && !found; row++) {
                found = bounds[row] < Double.POSITIVE_INFINITY;
            }
            this.anyMargin = found;
        }

        @Override
        WeightedMisses.DeferredBins deferredBins() {
            return deferredBins;
        }

        @Override
        double miss(long sampleId, int row) {
            double b = row < 0 ? Double.NaN : bounds[row];
            return b < 0 ? b : Double.NaN;
        }

        @Override
        double margin(long sampleId, int row) {
            double b = row < 0 ? Double.NaN : bounds[row];
            return b < Double.POSITIVE_INFINITY ? b : Double.NaN;
        }

        @Override
        double bound(long sampleId, int row) {
            return row < 0 ? Double.POSITIVE_INFINITY : boundAtRow(row);
        }

        @Override
        double boundAtRow(int row) {
            double b = bounds[row];
            // min(miss, margin) with NaN as +∞: b itself below +∞ (either bound, both b below 0), else +∞
            return b < Double.POSITIVE_INFINITY ? b : Double.POSITIVE_INFINITY;
        }

        @Override
        int secondStageRow(long sampleId, int row) {
            return Double.isNaN(margin(sampleId, row)) ? -1 : row;
        }

        @Override
        boolean anyMargin() {
            return anyMargin;
        }

        @Override
        boolean readsRows() {
            return true;
        }
    }

    private static final class BySampleId extends FirstBounds {

        private final Map<Long, Double> provenMiss;
        private final Map<Long, Double> marginBound;
        private final Map<Long, Integer> rowOf;

        BySampleId(Map<Long, Double> provenMiss, Map<Long, Double> marginBound, Map<Long, Integer> rowOf) {
            this.provenMiss = provenMiss;
            this.marginBound = marginBound;
            this.rowOf = rowOf;
        }

        @Override
        double miss(long sampleId, int row) {
            Double b = provenMiss.get(sampleId);
            return b == null ? Double.NaN : b;
        }

        @Override
        double margin(long sampleId, int row) {
            Double b = marginBound.get(sampleId);
            return b == null ? Double.NaN : b;
        }

        @Override
        int secondStageRow(long sampleId, int row) {
            Integer r = rowOf.get(sampleId);
            return r == null ? -1 : r;
        }

        @Override
        boolean anyMargin() {
            return !marginBound.isEmpty();
        }

        @Override
        boolean readsRows() {
            return false;
        }
    }
}
