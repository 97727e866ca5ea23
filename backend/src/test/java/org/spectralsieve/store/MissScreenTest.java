package org.spectralsieve.store;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.optics.Layer;
import org.spectralsieve.optics.LightPath;
import org.spectralsieve.optics.Slab;
import org.spectralsieve.requirement.Aggregate;
import org.spectralsieve.requirement.Band;
import org.spectralsieve.requirement.ClauseEvaluator;
import org.spectralsieve.requirement.ClauseResult;
import org.spectralsieve.requirement.Direction;
import org.spectralsieve.requirement.ThresholdUnit;
import org.spectralsieve.requirement.TransmittanceClause;
import org.spectralsieve.requirement.Verdict;
import org.spectralsieve.spectrum.Curve;

/**
 * The store's proof of a miss must hold for the exact evaluator: on the stored curve itself (measured on
 * other wavelengths than the store's grid, with detection floors), and for a pass, in any stack with a
 * further part (a part can only lower T: T₁T₂/(1 − R₁R₂) ≤ T₁ when T₂ + R₂ ≤ 1, Modern Optical Engineering eq. 10.5 for two
 * elements). Curves: the synthetic absorption edges and dye bands of {@link SyntheticCurves}.
 */
class MissScreenTest {

    private static final ConstantIndex N15 = new ConstantIndex(1.5);

    @Test
    void everyProvenMissIsAMissOfTheExactEvaluatorWithAMarginNoHigherThanTheBound() {
        Random random = new Random(20261204L);
        SyntheticCurves synthetic = new SyntheticCurves(7, SpectralStore.DEFAULT_GRID);
        List<Curve> curves = new ArrayList<>();
        SpectralStore.Builder builder = SpectralStore.builder(SpectralStore.DEFAULT_GRID, 600);
        StoredMaterial material = new StoredMaterial(1, "synthetic", "film");
        for (int i = 0; i < 600; i++) {
            SyntheticCurves.Spec spec = synthetic.next();
            // own wavelengths, not the store's grid: 0.7, 1, 1.3 or 2.5 nm steps from an odd start
            double step = new double[] {0.7, 1, 1.3, 2.5}[random.nextInt(4)];
            double start = 200 + random.nextDouble() * 3;
            int n = (int) ((880 - start) / step);
            double[] nm = new double[n];
            double[] t = new double[n];
            for (int k = 0; k < n; k++) {
                nm[k] = start + k * step;
                t[k] = SyntheticCurves.transmittance(spec, nm[k]);
            }
            Curve curve = Curve.of(nm, t, spec.floor());
            curves.add(curve);
            builder.add(i, material, spec.thicknessMm(), true, false, SyntheticCurves.INDICES[spec.index()], curve);
        }
        SpectralStore store = builder.build();
        List<TransmittanceClause> clauses = new ArrayList<>();
        for (int c = 0; c < 40; c++) {
            Direction direction = random.nextBoolean() ? Direction.PASS : Direction.BLOCK;
            double from = 230 + random.nextDouble() * 500;
            double to = random.nextInt(3) == 0 ? from : from + random.nextDouble() * 60;
            if (random.nextBoolean()) {
                from = Math.rint(from); // on the grid as well as between its points
                to = Math.max(from, Math.rint(to));
            }
            double threshold = direction == Direction.PASS ? 0.2 + 0.75 * random.nextDouble()
                    : Math.pow(10, -0.5 - 3 * random.nextDouble());
            clauses.add(new TransmittanceClause(direction, Aggregate.EVERY_POINT, new Band(from, to), threshold,
                    ThresholdUnit.FRACTION, direction + " " + threshold + " " + from + "-" + to));
        }
        Curve plate = flatPlate(0.6);
        Curve[] stacks = new Curve[curves.size()];
        double[][] bounds = MissScreen.marginBounds(store, clauses);
        int proofs = 0;
        int stackedProofs = 0;
        for (int c = 0; c < clauses.size(); c++) {
            TransmittanceClause clause = clauses.get(c);
            for (int i = 0; i < curves.size(); i++) {
                double bound = bounds[c][i];
                if (!(bound < 0)) {
                    continue;
                }
                proofs++;
                ClauseResult alone = ClauseEvaluator.evaluate(clause, curves.get(i));
                assertThat(alone.verdict()).as(clause.text() + " curve " + i).isEqualTo(Verdict.MISSES);
                assertThat(alone.marginDecades()).as(clause.text() + " curve " + i).isLessThanOrEqualTo(bound);
                if (clause.direction() == Direction.PASS) {
                    stackedProofs++;
                    if (stacks[i] == null) {
                        stacks[i] = LightPath.of(Layer.fixed(curves.get(i), N15), Layer.fixed(plate, N15)).transmittance();
                    }
                    ClauseResult stacked = ClauseEvaluator.evaluate(clause, stacks[i]);
                    assertThat(stacked.verdict()).as("stacked " + clause.text() + " curve " + i).isEqualTo(Verdict.MISSES);
                    assertThat(stacked.marginDecades()).isLessThanOrEqualTo(bound);
                }
            }
        }
        // the property must not hold vacuously
        assertThat(proofs).isGreaterThan(1000);
        assertThat(stackedProofs).isGreaterThan(300);
    }

    @Test
    void boundedReadingsAndMeansProveNothing() {
        // a curve entirely under its detection limit: no reading is a value, so nothing is proven
        double[] nm = {300, 400, 500};
        Curve dark = Curve.of(nm, new double[] {1e-5, 1e-5, 1e-5}, 1e-3);
        SpectralStore store = SpectralStore.builder(SpectralStore.DEFAULT_GRID, 1)
                .add(1, new StoredMaterial(1, "dark", "film"), 1, true, false, N15, dark).build();
        TransmittanceClause pass = new TransmittanceClause(Direction.PASS, Aggregate.EVERY_POINT, new Band(350, 450), 0.5,
                ThresholdUnit.FRACTION, "");
        assertThat(MissScreen.marginBounds(store, List.of(pass))[0][0]).isEqualTo(Double.POSITIVE_INFINITY);
        TransmittanceClause mean = new TransmittanceClause(Direction.PASS, Aggregate.MEAN, new Band(350, 450), 0.5,
                ThresholdUnit.FRACTION, "a mean");
        assertThatThrownBy(() -> MissScreen.marginBounds(store, List.of(mean)))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("a mean");
    }

    private static Curve flatPlate(double internal) {
        double[] nm = new double[181];
        double[] t = new double[nm.length];
        for (int i = 0; i < nm.length; i++) {
            nm[i] = 190 + 5 * i;
            t[i] = Slab.transmittance(internal, 0.04);
        }
        return Curve.of(nm, t, 0);
    }
}
