package org.spectralsieve.importers;

import java.util.Objects;

/**
 * One raw capture: detector counts per pixel (one per wavelength of its {@link RawCounts}), taken at one
 * exposure and averaged over {@code scans} scans. Immutable; the counts are copied in and out.
 */
public final class Capture {

    private final CaptureRole role;
    private final double exposureMs;
    private final int scans;
    private final String label;
    private final double[] counts;

    private Capture(CaptureRole role, double exposureMs, int scans, String label, double[] counts) {
        this.role = role;
        this.exposureMs = exposureMs;
        this.scans = scans;
        this.label = label;
        this.counts = counts;
    }

    /**
     * @param label where it came from, for messages (e.g. {@code "dark.csv column 'dark'"})
     * @throws IllegalArgumentException for a non-positive or non-finite exposure, scans below 1, or a
     *                                  non-finite count (quoting its index)
     */
    public static Capture of(CaptureRole role, double exposureMs, int scans, String label, double[] counts) {
        Objects.requireNonNull(role, "role");
        Objects.requireNonNull(label, "label");
        if (!(exposureMs > 0) || !Double.isFinite(exposureMs)) {
            throw new IllegalArgumentException(label + ": exposure must be a positive number of ms, was " + exposureMs);
        }
        if (scans < 1) {
            throw new IllegalArgumentException(label + ": scans must be at least 1, was " + scans);
        }
        double[] copy = counts.clone();
        for (int i = 0; i < copy.length; i++) {
            if (!Double.isFinite(copy[i])) {
                throw new IllegalArgumentException(label + ": count at index " + i + " is not finite: " + copy[i]);
            }
        }
        return new Capture(role, exposureMs, scans, label, copy);
    }

    public CaptureRole role() {
        return role;
    }

    public double exposureMs() {
        return exposureMs;
    }

    /** Number of scans averaged into these counts (1 = a single scan). */
    public int scans() {
        return scans;
    }

    public String label() {
        return label;
    }

    /** Counts per pixel, a copy. */
    public double[] counts() {
        return counts.clone();
    }

    double count(int i) {
        return counts[i];
    }

    int size() {
        return counts.length;
    }

    @Override
    public String toString() {
        return role + " " + exposureMs + " ms × " + scans + " (" + label + ")";
    }
}
