package org.spectralsieve.optics;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Random;
import org.junit.jupiter.api.Test;
import org.spectralsieve.spectrum.Curve;

/**
 * The stack's combination with each part's slab elements formed once per point ({@link LightPath#combine},
 * also with a fixed part's elements formed once per sweep) gives the numbers of the earlier combination,
 * which formed every element anew for the chain of T and again for each chain of the detection limit
 * ({@link #combinedTheEarlierWay}, kept here as the reference). Exact equality (Curve.equals compares
 * every double bit for bit), on random stacks of one to three parts from a fixed seed; the physics of the
 * chain is checked against handbook values in {@link LightPathTest}.
 */
class LightPathCombineTest {

    @Test
    void combiningWithElementsFormedOnceGivesTheEarlierNumbers() {
        Random random = new Random(20261204L);
        for (int trial = 0; trial < 400; trial++) {
            int parts = 1 + random.nextInt(3);
            int n = 2 + random.nextInt(60);
            double[] nm = new double[n];
            for (int i = 0; i < n; i++) {
                nm[i] = 250 + 3 * i + random.nextDouble();
            }
            Curve[] onGrid = new Curve[parts];
            double[][] reflectances = new double[parts][n];
            OpticalElement[][][] known = new OpticalElement[parts][][];
            for (int j = 0; j < parts; j++) {
                onGrid[j] = randomCurve(random, nm);
                for (int i = 0; i < n; i++) {
                    reflectances[j][i] = 0.02 + 0.1 * random.nextDouble();
                }
                if (j > 0 && random.nextBoolean()) {
                    known[j] = LightPath.elements(onGrid[j], reflectances[j]);
                }
            }
            Curve expected = combinedTheEarlierWay(nm, onGrid, reflectances);
            assertThat(LightPath.combine(nm.clone(), onGrid, reflectances)).as("trial %d", trial).isEqualTo(expected);
            assertThat(LightPath.combine(nm.clone(), onGrid, reflectances, known)).as("trial %d, known", trial)
                    .isEqualTo(expected);
        }
    }

    private static Curve randomCurve(Random random, double[] nm) {
        double[] t = new double[nm.length];
        boolean[] below = new boolean[nm.length];
        double[] limits = new double[nm.length];
        double limit = random.nextBoolean() ? 0 : Math.pow(10, -1 - 4 * random.nextDouble());
        for (int i = 0; i < nm.length; i++) {
            // spans the slab's resolved readings, readings near the lossless ceiling and noise above it
            t[i] = switch (random.nextInt(6)) {
                case 0 -> 0;
                case 1 -> 0.9 + 0.12 * random.nextDouble();
                default -> random.nextDouble() * 0.95;
            };
            limits[i] = limit;
            below[i] = t[i] <= limit;
        }
        return Curve.of(nm, t, below, limits);
    }

    /** The combination as it was before elements were formed once: kept as the reference. */
    private static Curve combinedTheEarlierWay(double[] nm, Curve[] onGrid, double[][] reflectances) {
        int count = onGrid.length;
        double[] t = new double[nm.length];
        boolean[] below = new boolean[nm.length];
        double[] limits = new double[nm.length];
        for (int i = 0; i < nm.length; i++) {
            double[] layerT = new double[count];
            double[] layerR = new double[count];
            for (int j = 0; j < count; j++) {
                layerT[j] = onGrid[j].transmittance(i);
                layerR[j] = reflectances[j][i];
                below[i] |= onGrid[j].belowDetection(i);
            }
            t[i] = chain(layerT, layerR);
            double limit = 0;
            for (int j = 0; j < count; j++) {
                double[] withLimit = layerT.clone();
                withLimit[j] = onGrid[j].detectionLimit(i);
                limit = Math.max(limit, chain(withLimit, layerR));
            }
            limits[i] = Math.min(limit, Math.nextDown(1.0));
        }
        return LightPath.withStackUncertainty(Curve.of(nm, t, below, limits), onGrid);
    }

    private static double chain(double[] layerT, double[] layerR) {
        OpticalElement path = SlabReading.of(layerT[0], layerR[0]).element();
        for (int j = 1; j < layerT.length; j++) {
            path = path.followedBy(SlabReading.of(layerT[j], layerR[j]).element());
        }
        return path.transmittance();
    }
}
