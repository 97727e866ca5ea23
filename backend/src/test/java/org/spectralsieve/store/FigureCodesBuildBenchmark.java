package org.spectralsieve.store;

import java.util.Arrays;
import java.util.Locale;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.spectralsieve.spectrum.Curve;

/**
 * What the figure codes add to a curve's entry into the store ({@code SpectralStore.Builder.add}): the seven exact
 * figures (and their lower ends where points below detection weigh in) beside the weighted screen's bins, per curve,
 * on the random curves of {@link FigureCodesTest} (steps 0.5–5 nm). Alternated run by run in one JVM: {@code part=bins}
 * (the screen's bins alone, {@code WeightedBinsBuilder.add} before the codes) and {@code part=codes}
 * ({@link FigureCodes.Builder#add} alone). Prints {@code BENCH store-figure-codes-build part=… curves=… p50_us_per_curve
 * p95_us_per_curve runs}; asserts nothing about time. {@code -Dbench.figureCodesBuildCurves=2000},
 * {@code -Dbench.figureCodesBuildRuns=7}.
 */
class FigureCodesBuildBenchmark {

    @Test
    void figureCodesPerCurveAtEntry() {
        int n = Integer.getInteger("bench.figureCodesBuildCurves", 2000);
        int runs = Integer.getInteger("bench.figureCodesBuildRuns", 7);
        Random random = new Random(20261209L);
        Curve[] curves = new Curve[n];
        for (int i = 0; i < n; i++) {
            curves[i] = FigureCodesTest.randomCurve(random);
        }
        double[] codes = new double[runs];
        double[] screen = new double[runs];
        for (int r = -2; r < runs; r++) { // two warm-up rounds
            long t0 = System.nanoTime();
            FigureCodes.Builder figures = new FigureCodes.Builder(n);
            for (int i = 0; i < n; i++) {
                figures.add(i, curves[i]);
            }
            long t1 = System.nanoTime();
            WeightedBinsBuilder bins = WeightedScreen.builder(n);
            for (int i = 0; i < n; i++) {
                bins.add(i, curves[i]); // bins and codes together: the entry as it is now
            }
            long t2 = System.nanoTime();
            if (r >= 0) {
                codes[r] = (t1 - t0) / 1e3 / n;
                screen[r] = ((t2 - t1) - (t1 - t0)) / 1e3 / n; // the bins: the whole entry less the codes
            }
        }
        print("bins", screen, n, runs);
        print("codes", codes, n, runs);
    }

    private static void print(String part, double[] us, int n, int runs) {
        Arrays.sort(us);
        System.out.printf(Locale.ROOT, "BENCH store-figure-codes-build part=%s curves=%d p50_us_per_curve=%.1f"
                        + " p95_us_per_curve=%.1f runs=%d%n", part, n, us[runs / 2],
                us[Math.min(runs - 1, (int) Math.ceil(runs * 0.95) - 1)], runs);
    }
}
