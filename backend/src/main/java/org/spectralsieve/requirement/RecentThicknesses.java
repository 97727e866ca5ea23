package org.spectralsieve.requirement;

/**
 * The last few thicknesses' points of one candidate, keyed by the thickness's bits (what {@code Double.equals}
 * compares, as the map it replaces did), found by a scan of a small primitive array and replaced oldest first.
 * Why not a map: a thickness solve asks for dozens of new thicknesses per sample and reads each again only
 * within the same step (every condition at the recommendation's trial thickness) or at the end (the recommended thickness,
 * the interval's ends); a boxed key and a map entry per thickness were about a seventh of a weighted solve
 * (docs/exact-judgement-speed.md, "One judgement cheaper"). A miss recomputes the same numbers, so the size only
 * changes the speed. Not shared between threads.
 */
final class RecentThicknesses<T> {

    private final long[] keys;
    private final Object[] values;
    private int count;
    private int next;

    RecentThicknesses(int capacity) {
        keys = new long[capacity];
        values = new Object[capacity];
    }

    /** What was kept for thickness d, or null. */
    @SuppressWarnings("unchecked")
    T get(double d) {
        long key = Double.doubleToLongBits(d);
        // newest first: the thickness asked last is the one asked again most often
        for (int k = 1; k <= count; k++) {
            int slot = Math.floorMod(next - k, keys.length);
            if (keys[slot] == key) {
                return (T) values[slot];
            }
        }
        return null;
    }

    /** Keeps {@code value} for thickness d, over the oldest kept when full. */
    void put(double d, T value) {
        keys[next] = Double.doubleToLongBits(d);
        values[next] = value;
        next = (next + 1) % keys.length;
        count = Math.min(count + 1, keys.length);
    }
}
