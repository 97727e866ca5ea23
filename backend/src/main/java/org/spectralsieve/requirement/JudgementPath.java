package org.spectralsieve.requirement;

/**
 * Which way a sample's exact judgement forms what it reads: only what a clause or figure reads (the default;
 * docs/exact-judgement-speed.md, "Per-sample work formed when read"), or everything up front as before — every
 * point's slab readings built per candidate, one more set for the thickness solver's model, a whole rescaled
 * curve for every verdict, each weighted margin with its note written, and a stack's fixed layer resampled and
 * its elements formed anew for every candidate. Both give the same answers, bit for bit
 * (JudgementPathEquivalenceTest); the earlier way is kept only so a benchmark can time both side by side in
 * one run (ExactJudgementBenchmark, DemoLibrarySpeedBenchmark). Answers never switch it.
 */
public final class JudgementPath {

    private static volatile boolean reference;

    private JudgementPath() {
    }

    /** For benchmarks and the equivalence test: true judges the earlier way, false (the default) the new way. */
    public static void useReference(boolean earlier) {
        reference = earlier;
    }

    /** Whether samples are judged the earlier way (a benchmark or test switched it). */
    public static boolean reference() {
        return reference;
    }
}
