package org.spectralsieve.search;

import java.util.Objects;
import java.util.concurrent.atomic.AtomicLong;
import java.util.concurrent.atomic.AtomicReference;
import java.util.concurrent.locks.ReentrantLock;
import java.util.function.LongConsumer;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.LibraryGeneration;

/**
 * The snapshot a {@link SearchService} answers from and its freshness: read from the library, rebuilt when the
 * library's change counter ({@link LibraryGeneration}) moved past it or {@link #invalidate()} was called, one build
 * at a time, and installed so that an older snapshot never replaces a newer one (docs/freshness.md).
 */
final class SnapshotHolder {

    private static final Logger LOG = LoggerFactory.getLogger(SearchService.class);

    /** Null only for a holder of a fixed snapshot ({@link SearchService#over}). */
    private final JooqLibraryRepository library;
    private final AtomicReference<Snapshot> snapshot = new AtomicReference<>();
    /** Raised by {@link #invalidate()}: a snapshot read before the last call is stale whatever its generation. */
    private final AtomicLong invalidations = new AtomicLong();
    /** One build at a time: concurrent searches that find the snapshot stale wait for one rebuild, not start many. */
    private final ReentrantLock building = new ReentrantLock();
    /** Runs between reading the library and installing the snapshot: a seam for the race test, else nothing. */
    private final LongConsumer beforeInstall;
    /** Heap for each snapshot's decoded curves ({@link CurveCache}); 0 reads every judged curve from the database. */
    private final long curveCacheBytes;
    /**
     * Whether a partial rebuild works on what changed alone: after writes that each changed one sample it reads only
     * those samples again, not their materials whole ({@link MaterialsRead#after}), and a material not read again
     * keeps its rows, made thicknesses and cached curves as a whole ({@link StoreRowSource#carryMaterial});
     * {@code -Dsieve.search.rebuild-what-changed=false} rebuilds the way before (changed materials read whole, every
     * sample looked up one by one), only so the load benchmark can time both ways (the same snapshot).
     */
    private boolean rebuildWhatChanged = !"false".equals(System.getProperty("sieve.search.rebuild-what-changed"));

    SnapshotHolder(JooqLibraryRepository library, LongConsumer beforeInstall, long curveCacheBytes) {
        this.library = library;
        this.beforeInstall = beforeInstall;
        this.curveCacheBytes = curveCacheBytes;
    }

    /** A holder of one fixed snapshot: it never rebuilds (there is no change counter to read). */
    SnapshotHolder(Snapshot fixed) {
        this.library = null;
        this.beforeInstall = generation -> { };
        this.curveCacheBytes = 0;
        this.snapshot.set(Objects.requireNonNull(fixed, "fixed"));
    }

    /** Rebuilds the way before the ninth pass ({@link SearchService#withEarlierRebuild}). */
    void rebuildTheEarlierWay() {
        this.rebuildWhatChanged = false;
    }

    /**
     * Brings the snapshot up to the library's change counter now, on the caller's thread: called after this
     * process committed a write (an import, a retirement, a correction), so that the store is usually rebuilt
     * before the next search asks for it. The write raised the counter naming its material, so the rebuild
     * reads only that material again ({@link MaterialsRead}); freshness does not depend on this call (every
     * search reads the counter first, docs/freshness.md). When another thread is rebuilding, this returns at
     * once rather than queue behind it (a writer never waits for a rebuild; that rebuild, or the next search's,
     * brings the store up). A failure is logged and left to the next search, which rebuilds (or fails) as it
     * would have without this call: the write itself is committed.
     */
    void refresh() {
        try {
            long generation = library.generation();
            if (fresh(snapshot.get(), generation) || !building.tryLock()) {
                return; // up to date, or another thread is rebuilding: that rebuild or the next search's brings it up
            }
            try {
                rebuildUnlessFresh(generation);
            } finally {
                building.unlock();
            }
        } catch (RuntimeException e) {
            LOG.warn("the search store could not be brought up to date after a write; the next search tries again", e);
        }
    }

    /**
     * Marks the derived store stale; the next search rebuilds it from the database. Every write path raises
     * the database's change counter ({@link LibraryGeneration#bump}), which the next search notices anyway;
     * this is the in-process signal for a write that does not (yet) raise it.
     */
    void invalidate() {
        invalidations.incrementAndGet();
    }

    /**
     * The snapshot to answer from, rebuilt when the database's change counter has moved past the installed
     * one's or {@link #invalidate()} was called since it was read. Costs one primary-key read per call (no
     * throttle: a few tens of microseconds against a search's milliseconds, see docs/freshness.md), so a
     * change committed by any process before this call is in the answer.
     */
    Snapshot current() {
        if (library == null) {
            return snapshot.get(); // a fixed snapshot (over): nothing to rebuild from
        }
        long generation = library.generation();
        Snapshot s = snapshot.get();
        if (fresh(s, generation)) {
            return s;
        }
        building.lock();
        try {
            return rebuildUnlessFresh(generation);
        } finally {
            building.unlock();
        }
    }

    /** Reads snapshots with this service's cache budget and rebuild rule (a copy made by a {@code with…} call keeps its own). */
    private SnapshotReader reader() {
        return new SnapshotReader(library, curveCacheBytes, rebuildWhatChanged);
    }

    /** Under {@link #building}: the installed snapshot if it holds {@code generation}, else a new one built and installed. */
    private Snapshot rebuildUnlessFresh(long generation) {
        Snapshot s = snapshot.get();
        if (fresh(s, generation)) {
            return s; // built by another search while this one waited
        }
        Snapshot built = reader().read(s, invalidations.get());
        beforeInstall.accept(built.generation());
        install(built);
        // answer from what was just read even if a write landed meanwhile: it holds every change up to
        // the moment this search began, and the next search sees the newer number and rebuilds
        return built;
    }

    private boolean fresh(Snapshot s, long generation) {
        return s != null && s.generation() >= generation && s.invalidations() == invalidations.get();
    }

    /**
     * Installs the snapshot unless one read later is installed already: a compare-and-set that never
     * replaces a newer snapshot with an older one, however the builds interleave.
     */
    private void install(Snapshot built) {
        while (true) {
            Snapshot installed = snapshot.get();
            if (installed != null && !built.notOlderThan(installed)) {
                return;
            }
            if (snapshot.compareAndSet(installed, built)) {
                return;
            }
        }
    }
}
