package org.spectralsieve.weighting;

/**
 * Which way weighted figures are computed: along cached integration points ({@link IntegrationNodes},
 * {@link SortedReading}; the default), or point by point as before, each T looked up by a binary search on a
 * bounded curve built first. Both give the same figures (WeightedFiguresFastPathTest); the earlier way is
 * kept only so a benchmark can time both side by side in one run (ExactJudgementBenchmark). Answers never
 * switch it.
 */
public final class FigurePath {

    private static volatile boolean byLookup;

    private FigurePath() {
    }

    /** For benchmarks: true computes every weighted figure the earlier way, false (the default) the fast way. */
    public static void useLookup(boolean lookup) {
        byLookup = lookup;
    }

    /** Whether weighted figures are computed the earlier way (a benchmark switched it). */
    public static boolean byLookup() {
        return byLookup;
    }

    /** The curve with its below-detection points as {@code as} says, built (the earlier way). */
    static org.spectralsieve.spectrum.Curve bounded(org.spectralsieve.spectrum.Curve curve, BelowDetectionAs as) {
        return switch (as) {
            case STORED -> curve;
            case LIMIT -> BoundedCurves.upperBounds(curve);
            case ZERO -> BoundedCurves.lowerBounds(curve);
        };
    }
}
