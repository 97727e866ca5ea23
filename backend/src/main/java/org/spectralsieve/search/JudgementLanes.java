package org.spectralsieve.search;

import java.util.concurrent.Semaphore;
import java.util.function.Supplier;

/**
 * A bound on how many searches judge at once (docs/search-under-load.md). Under many concurrent clients on a
 * machine with few cores, letting every search judge at the same time shares the cores among all of them:
 * each one finishes late, and the one thread rebuilding the store after an import (which every later search
 * waits for) gets only a sliver of a core. Lanes let a few searches run to completion in arrival order (a
 * fair semaphore) while the rest queue, which lowers the tail of the wait without changing any answer.
 *
 * <p>Only the judgement after the snapshot is taken runs in a lane: the freshness check and a rebuild do
 * not, so a rebuild never waits for a lane and a lane never waits for a rebuild.
 */
final class JudgementLanes {

    private final Semaphore lanes;
    private final int bound;

    private JudgementLanes(int bound) {
        this.bound = bound;
        this.lanes = bound == 0 ? null : new Semaphore(bound, true);
    }

    /** As many lanes as given; 0 puts no bound (every search judges at once, as before the lanes). */
    static JudgementLanes of(int count) {
        if (count < 0) {
            throw new IllegalArgumentException("the number of judgement lanes must be >= 0 (0: no bound), was " + count);
        }
        return new JudgementLanes(count);
    }

    /** No bound. */
    static JudgementLanes unbounded() {
        return of(0);
    }

    /** Runs the work in a lane, waiting for one when all are taken. */
    <T> T run(Supplier<T> work) {
        if (lanes == null) {
            return work.get();
        }
        lanes.acquireUninterruptibly();
        try {
            return work.get();
        } finally {
            lanes.release();
        }
    }

    /** The bound, or 0 when there is none. */
    int count() {
        return bound;
    }
}
