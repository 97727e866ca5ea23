package org.spectralsieve.search;

import java.util.ArrayList;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.SharedCurveArrays;

/**
 * The library's decoded curves by sample id, so the exact judgement of a search reads memory, not the
 * database (docs/curve-cache.md). Bounded by a heap budget: the least recently judged curve goes first.
 * Curves measured alike share their wavelength and detection-limit arrays ({@link SharedCurveArrays}), so
 * a curve costs about 9 bytes a point (8.3 KB on the store's 911-point grid) instead of 25.
 *
 * <p>One cache belongs to one search snapshot and is filled from the curves that snapshot was built from:
 * when the library's change counter moves, the snapshot and its cache are replaced together, so a cached
 * curve is never older than the store beside it (docs/freshness.md). A budget of 0 caches nothing: every
 * judgement reads the database, as before the cache.
 */
final class CurveCache {

    /** A quarter of the budget at most for the shared arrays: a library of many grids keeps its own. */
    private static final int SHARED_SHARE = 4;

    private final long budgetBytes;
    private final SharedCurveArrays shared;
    /** Access order: iteration starts at the least recently used. */
    private final LinkedHashMap<Long, Entry> curves = new LinkedHashMap<>(256, 0.75f, true);
    /** The curves' own heap, beside the shared arrays. */
    private long ownBytes;

    private record Entry(Curve curve, long bytes) {
    }

    CurveCache(long budgetBytes) {
        this(budgetBytes, new SharedCurveArrays(budgetBytes / SHARED_SHARE));
    }

    private CurveCache(long budgetBytes, SharedCurveArrays shared) {
        if (budgetBytes < 0) {
            throw new IllegalArgumentException("the curve cache's budget must be >= 0 bytes, was " + budgetBytes);
        }
        this.budgetBytes = budgetBytes;
        this.shared = shared;
    }

    /**
     * An empty cache for the next snapshot of a partial rebuild, with this cache's budget and its pool of shared
     * arrays, so that {@link #offerKept} can take this cache's curves as they are. The pool may then hold arrays
     * of curves no longer in the library: it stays within its quarter of the budget, and a whole rebuild starts
     * a new one.
     */
    CurveCache successor() {
        return new CurveCache(budgetBytes, shared);
    }

    /**
     * Offers {@code previous}'s curve of the sample as it is — already sharing the pool's arrays, its size already
     * known — so a rebuild does not hash every curve's arrays again; a curve {@code previous} does not hold is
     * not offered. Like {@link #offer}, adds only what fits without evicting. {@code previous} must be the cache
     * this one is the {@link #successor} of (the pool is theirs together).
     *
     * @return whether it was added
     */
    boolean offerKept(CurveCache previous, long sampleId) {
        if (previous.shared != shared) {
            throw new IllegalArgumentException("not this cache's predecessor");
        }
        Entry kept = previous.entryOf(sampleId); // the predecessor's lock alone, then this one's: never both at once
        if (kept == null) {
            return false;
        }
        synchronized (this) {
            if (budgetBytes == 0 || curves.containsKey(sampleId) || heapBytes() + kept.bytes() > budgetBytes) {
                return false;
            }
            add(sampleId, kept);
            return true;
        }
    }

    /**
     * {@link #offerKept(CurveCache, long)} for each sample in turn, in order, holding each cache's lock once rather
     * than once per sample: what a rebuild does for a material it carries as a whole.
     *
     * @return how many were added
     */
    int offerKept(CurveCache previous, List<Long> sampleIds) {
        if (previous.shared != shared) {
            throw new IllegalArgumentException("not this cache's predecessor");
        }
        List<Entry> kept = previous.entriesOf(sampleIds); // the predecessor's lock alone, then this one's
        int added = 0;
        synchronized (this) {
            for (int i = 0; i < kept.size(); i++) {
                Entry e = kept.get(i);
                long sampleId = sampleIds.get(i);
                if (e == null || budgetBytes == 0 || curves.containsKey(sampleId) || heapBytes() + e.bytes() > budgetBytes) {
                    continue;
                }
                add(sampleId, e);
                added++;
            }
        }
        return added;
    }

    /** The samples' entries (null where none), in order. */
    private synchronized List<Entry> entriesOf(List<Long> sampleIds) {
        List<Entry> out = new ArrayList<>(sampleIds.size());
        for (Long id : sampleIds) {
            out.add(curves.get(id));
        }
        return out;
    }

    /** The sample's entry, or null (the predecessor's access order moves; it is about to be dropped). */
    private synchronized Entry entryOf(long sampleId) {
        return curves.get(sampleId);
    }

    /** The cached curve of the sample, or null. */
    synchronized Curve get(long sampleId) {
        Entry e = curves.get(sampleId);
        return e == null ? null : e.curve();
    }

    /**
     * Adds the curve if it fits without evicting another: how a new snapshot's cache is filled from the
     * curves it was built from, the earliest samples first, up to the budget.
     *
     * @return whether it was added
     */
    synchronized boolean offer(long sampleId, Curve curve) {
        if (budgetBytes == 0 || curves.containsKey(sampleId)) {
            return false;
        }
        Entry e = entry(curve);
        if (heapBytes() + e.bytes() > budgetBytes) {
            return false;
        }
        add(sampleId, e);
        return true;
    }

    /** Adds the curve (read from the database on a miss), dropping the least recently used to stay in budget. */
    synchronized void put(long sampleId, Curve curve) {
        if (budgetBytes == 0) {
            return;
        }
        Entry e = entry(curve);
        if (e.bytes() + shared.heapBytes() > budgetBytes) {
            return; // larger than the whole budget: judged from the database each time
        }
        Entry old = curves.remove(sampleId);
        if (old != null) {
            ownBytes -= old.bytes();
        }
        Iterator<Map.Entry<Long, Entry>> eldest = curves.entrySet().iterator();
        while (heapBytes() + e.bytes() > budgetBytes && eldest.hasNext()) {
            ownBytes -= eldest.next().getValue().bytes();
            eldest.remove();
        }
        add(sampleId, e);
    }

    private Entry entry(Curve curve) {
        Curve compact = curve.sharingArraysWith(shared);
        return new Entry(compact, compact.heapBytesBeside(shared) + 64); // + the map entry, key and record
    }

    private void add(long sampleId, Entry e) {
        curves.put(sampleId, e);
        ownBytes += e.bytes();
    }

    /** The heap the cache takes (estimate): the curves' own arrays and the shared ones. */
    synchronized long heapBytes() {
        return ownBytes + shared.heapBytes();
    }

    synchronized int size() {
        return curves.size();
    }

    long budgetBytes() {
        return budgetBytes;
    }
}
