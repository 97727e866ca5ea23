package org.spectralsieve.spectrum;

import java.util.Collections;
import java.util.HashMap;
import java.util.IdentityHashMap;
import java.util.Map;
import java.util.Set;

/**
 * Arrays that many curves hold alike — the wavelengths of one instrument grid, one detection limit at every
 * point — kept once for all the curves that share them ({@link Curve#sharingArraysWith}). A library measured
 * on a few grids then holds, per curve, little more than its transmittances: about 9 bytes a point instead
 * of 25. Sharing is safe because a curve never lets its arrays out (every accessor copies) and this pool
 * hands its arrays only to curves.
 *
 * <p>Bounded by bytes: once full, a curve keeps its own arrays. Thread-safe.
 */
public final class SharedCurveArrays {

    private final long maxBytes;
    private final Map<ArrayContent, double[]> byContent = new HashMap<>();
    private final Set<double[]> held = Collections.newSetFromMap(new IdentityHashMap<>());
    private long bytes;

    /** @param maxBytes the most heap the pooled arrays may take together (estimate, {@link #arrayBytes}) */
    public SharedCurveArrays(long maxBytes) {
        if (maxBytes < 0) {
            throw new IllegalArgumentException("maxBytes must be >= 0, was " + maxBytes);
        }
        this.maxBytes = maxBytes;
    }

    /** The heap the pooled arrays take (estimate). */
    public synchronized long heapBytes() {
        return bytes;
    }

    /** How many distinct arrays are pooled. */
    public synchronized int size() {
        return held.size();
    }

    /** Heap of a double array on a 64-bit JVM with compressed references: a 16-byte header, 8 bytes a value. */
    static long arrayBytes(int length) {
        return 16L + 8L * length;
    }

    /** The pooled array equal to {@code array}; else {@code array} itself, pooled while there is room. */
    synchronized double[] canonical(double[] array) {
        ArrayContent key = new ArrayContent(array);
        double[] pooled = byContent.get(key);
        if (pooled != null) {
            return pooled;
        }
        long size = arrayBytes(array.length);
        if (bytes + size <= maxBytes) {
            byContent.put(key, array);
            held.add(array);
            bytes += size;
        }
        return array;
    }

    synchronized boolean holds(double[] array) {
        return held.contains(array);
    }
}
