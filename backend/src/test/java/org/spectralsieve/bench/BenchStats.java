package org.spectralsieve.bench;

import java.util.Arrays;

/** Medians and percentiles of repeated timings; the machine is shared and noisy, so medians are reported. */
final class BenchStats {

    private BenchStats() {
    }

    static double percentile(double[] values, double p) {
        double[] sorted = values.clone();
        Arrays.sort(sorted);
        int index = (int) Math.ceil(p / 100.0 * sorted.length) - 1;
        return sorted[Math.max(0, Math.min(sorted.length - 1, index))];
    }

    static String ms(double value) {
        return String.format(java.util.Locale.ROOT, "%.3f", value);
    }

    static int intProperty(String name, int fallback) {
        return Integer.parseInt(System.getProperty(name, String.valueOf(fallback)));
    }

    static int[] intList(String name, String fallback) {
        return Arrays.stream(System.getProperty(name, fallback).split(",")).map(String::trim)
                .filter(s -> !s.isEmpty()).mapToInt(Integer::parseInt).toArray();
    }

    /** A comma-separated list of words, blanks dropped. */
    static java.util.List<String> stringList(String name, String fallback) {
        return Arrays.stream(System.getProperty(name, fallback).split(",")).map(String::trim)
                .filter(s -> !s.isEmpty()).toList();
    }

    static long usedHeapAfterGc() {
        Runtime runtime = Runtime.getRuntime();
        for (int i = 0; i < 3; i++) {
            System.gc();
            try {
                Thread.sleep(50);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
        }
        return runtime.totalMemory() - runtime.freeMemory();
    }
}
