package org.spectralsieve.store;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.optics.RefractiveIndex;
import org.spectralsieve.optics.UnusableIndex;
import org.spectralsieve.requirement.Aggregate;
import org.spectralsieve.requirement.Band;
import org.spectralsieve.requirement.Candidate;
import org.spectralsieve.requirement.ClauseResult;
import org.spectralsieve.requirement.Direction;
import org.spectralsieve.requirement.FixedLayer;
import org.spectralsieve.requirement.MadeThicknesses;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.SampleEvaluator;
import org.spectralsieve.requirement.StackLayer;
import org.spectralsieve.requirement.ThicknessSpec;
import org.spectralsieve.requirement.ThresholdUnit;
import org.spectralsieve.requirement.TransmittanceClause;
import org.spectralsieve.requirement.Verdict;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.RandomEdgeCurves;

/**
 * The block bound behind a fixed layer holds the exact judgement: wherever {@link LayerBlockScreen} says a
 * sample misses a block clause behind the layer, the exact evaluator ({@link SampleEvaluator}, which stacks the
 * candidate and the layer with {@code optics.LightPath}: Smith, Modern Optical Engineering, eq. 10.5 for each
 * air gap, checked in its own tests) says MISSES for that clause with a margin no better than the bound. The
 * bound is arithmetic on that model (T₁T₂/(1 − ρ₁ρ₂) ≥ T₁T₂). Random curves with a fixed seed: samplings finer
 * and coarser than the store's grid and off it, points below detection, readings above T = 1 (noise) and at
 * T = 0, clear sheets at the lossless ceiling, layers with gaps below detection or above T = 1, and an index that
 * cannot be used (its rows are unverified, never misses).
 */
class LayerBlockScreenTest {

    private static final List<RefractiveIndex> INDICES = List.of(new ConstantIndex(1.49), new ConstantIndex(1.585),
            new ConstantIndex(1.46), new UnusableIndex("constant n = 1.0E16", "refractive index n must be from 1.0 to 4.0"));

    @Test
    void everyBlockMissProvenBehindALayerIsAMissOfTheExactStackWithAMarginNoBetter() {
        Random random = new Random(20261204L);
        List<Curve> curves = new ArrayList<>();
        SpectralStore.Builder builder = SpectralStore.builder(SpectralStore.DEFAULT_GRID, 8);
        StoredMaterial material = new StoredMaterial(1, "illustrative sheet", "plastic sheet", MadeThicknesses.of(
                List.of(), Double.NaN, Double.NaN, List.of(2.0)));
        for (int i = 0; i < 160; i++) {
            Curve curve = i % 8 == 7 ? clearCurve(random) : randomCurve(random);
            curves.add(curve);
            builder.add(i + 1, material, 2.0, i % 2 == 0, i % 5 == 0, INDICES.get(i % 4), curve);
        }
        SpectralStore store = builder.build();
        int proven = 0;
        int missesLeft = 0;
        for (int l = 0; l < 8; l++) {
            Curve layerCurve = l % 4 == 3 ? clearCurve(random) : randomCurve(random);
            RefractiveIndex layerIndex = INDICES.get(l % 3);
            FixedLayer spec = new FixedLayer(FixedLayer.Placement.BEHIND, 3, "synthetic plate", "behind 3 mm synthetic plate");
            StackLayer layer = StackLayer.of(spec, 99, "synthetic plate", "synthetic-plate", 990, layerCurve, 3, false,
                    layerIndex);
            List<TransmittanceClause> clauses = randomBlocks(random);
            double[][] bounds = LayerBlockScreen.marginBounds(store, clauses, layer.curve(), layer.index());
            for (int c = 0; c < clauses.size(); c++) {
                Requirement requirement = new Requirement(List.of(clauses.get(c)), ThicknessSpec.AS_MEASURED,
                        Optional.empty(), Optional.empty(), Optional.of(spec), "");
                for (int i = 0; i < curves.size(); i++) {
                    Candidate candidate = new Candidate(i + 1, 1, "illustrative sheet", curves.get(i), 2.0, i % 2 == 0,
                            INDICES.get(i % 4), MadeThicknesses.UNLIMITED, i % 5 == 0, null);
                    ClauseResult exact = SampleEvaluator.evaluate(candidate, requirement, Optional.of(layer))
                            .clauses().get(0);
                    double bound = bounds[c][i];
                    if (bound < 0) {
                        proven++;
                        assertThat(exact.verdict()).as(clauses.get(c).text() + ", curve " + i + " behind layer " + l)
                                .isEqualTo(Verdict.MISSES);
                        assertThat(exact.marginDecades()).as(clauses.get(c).text() + ", curve " + i + " behind layer " + l)
                                .isLessThanOrEqualTo(bound);
                    } else if (exact.verdict() == Verdict.MISSES) {
                        missesLeft++;
                    }
                }
            }
        }
        assertThat(proven).as("not vacuous").isGreaterThan(300);
        assertThat(proven).as("proves most misses of a value (left: " + missesLeft + ")").isGreaterThan(missesLeft);
    }

    @Test
    void aLayerWhoseIndexCannotBeUsedProvesNothing() {
        SpectralStore.Builder builder = SpectralStore.builder(SpectralStore.DEFAULT_GRID, 1);
        Curve clear = Curve.of(new double[] {300, 800}, new double[] {0.9, 0.9}, 0);
        builder.add(1, new StoredMaterial(1, "illustrative sheet", "plastic sheet", MadeThicknesses.UNLIMITED), 2.0, true,
                false, new ConstantIndex(1.5), clear);
        double[][] bounds = LayerBlockScreen.marginBounds(builder.build(), List.of(block(405, 405, 0.01)), clear,
                INDICES.get(3));
        assertThat(bounds[0][0]).isInfinite();
    }

    @Test
    void theLayersReadingIsLeftOutWhereItIsBelowDetectionOrAboveOne() {
        Curve layer = Curve.of(new double[] {400, 410, 420, 430}, new double[] {0.5, 1e-5, 1.2, 0.5},
                new boolean[] {false, true, false, false}, new double[] {0, 1e-4, 0, 0});
        assertThat(LayerBlockScreen.layerAbsorbance(layer, 405)).isNaN();
        assertThat(LayerBlockScreen.layerAbsorbance(layer, 425)).isNaN();
        assertThat(LayerBlockScreen.layerAbsorbance(layer, 430)).isCloseTo(-Math.log10(0.5), org.assertj.core.data.Offset.offset(1e-12));
        assertThat(LayerBlockScreen.layerAbsorbance(layer, 399)).isNaN();
    }

    private static TransmittanceClause block(double from, double to, double threshold) {
        return new TransmittanceClause(Direction.BLOCK, Aggregate.EVERY_POINT, new Band(from, to), threshold,
                ThresholdUnit.FRACTION, "blocks under " + threshold + " over " + from + "–" + to + " nm");
    }

    /** Point bands on and off the grid, and bands of a few nm, with thresholds from 0.01 % to 50 %. */
    private static List<TransmittanceClause> randomBlocks(Random random) {
        List<TransmittanceClause> out = new ArrayList<>();
        for (int k = 0; k < 6; k++) {
            double from = 250 + 500 * random.nextDouble();
            if (k % 2 == 0) {
                from = Math.rint(from);
            }
            double to = k % 3 == 0 ? from : from + 20 * random.nextDouble();
            out.add(block(from, to, Math.pow(10, -4 + 3.7 * random.nextDouble())));
        }
        return out;
    }

    /** A long-pass edge with ripple, sampled on a random step from a random start; some points bounded, some zero or above 1. */
    private static Curve randomCurve(Random random) {
        double step = new double[] {0.37, 0.5, 1, 2, 5, 17}[random.nextInt(6)];
        double start = 190 + random.nextInt(80) + (random.nextBoolean() ? 0.25 : 0);
        double end = 700 + random.nextInt(400);
        int n = (int) ((end - start) / step) + 1;
        double edge = 250 + 300 * random.nextDouble();
        double width = 2 + 30 * random.nextDouble();
        double top = 0.3 + 0.75 * random.nextDouble();
        double limit = random.nextBoolean() ? 1e-4 : 0;
        return RandomEdgeCurves.edge(random, start, step, n, edge, width, top, limit, Curve.MAX_TRANSMITTANCE, 200);
    }

    /** A clear sheet at or just under the lossless ceiling of n ≈ 1.5, with noise. */
    private static Curve clearCurve(Random random) {
        int n = 300;
        double[] nm = new double[n];
        double[] t = new double[n];
        for (int i = 0; i < n; i++) {
            nm[i] = 300 + 2 * i;
            t[i] = 0.915 + 0.01 * (random.nextDouble() - 0.5);
        }
        return Curve.of(nm, t, 0);
    }
}
