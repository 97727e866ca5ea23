package org.spectralsieve.spectrum;

/**
 * Which way one sample's exact judgement does its per-point arithmetic: the lean way (the default; issue 14,
 * sixth pass, docs/exact-judgement-speed.md, "One judgement cheaper") — a curve resampled by one walk with each
 * stored absorbance taken once, a stack's slab elements and chains in plain numbers, a rescaled point's slab
 * formula reused while its internal transmittance repeats, a thickness's points kept in a small array — or the
 * way before it. Both give the same numbers, bit for bit (PerPointArithmeticEquivalenceTest); the earlier way
 * is kept only so a benchmark can time both side by side in one run (WeightedScreenBenchmark,
 * {@code -Dbench.screenArithmetic=earlier}). Answers never switch it.
 */
public final class PerPointArithmetic {

    private static volatile boolean earlier;

    private PerPointArithmetic() {
    }

    /** For benchmarks and the equivalence test: true does the arithmetic the earlier way, false (default) the lean way. */
    public static void useEarlier(boolean useEarlier) {
        earlier = useEarlier;
    }

    /** Whether the per-point arithmetic is done the earlier way (a benchmark or test switched it). */
    public static boolean earlier() {
        return earlier;
    }
}
