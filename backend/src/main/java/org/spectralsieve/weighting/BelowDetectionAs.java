package org.spectralsieve.weighting;

/**
 * How a figure reads the points of a curve that lie below the detection limit: as stored, at their upper
 * bound max(T, limit) ({@link BoundedCurves#upperBounds}), or at 0 ({@link BoundedCurves#lowerBounds}).
 * Reading a curve this way gives the same numbers as building the bounded curve first and reading that,
 * without building it (docs/exact-judgement-speed.md).
 */
public enum BelowDetectionAs {

    /** Every point as stored. */
    STORED,
    /** A below-detection point at max(T, its limit): the most the true curve can be. */
    LIMIT,
    /** A below-detection point at 0: the least the true curve can be. */
    ZERO
}
