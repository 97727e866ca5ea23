package org.spectralsieve.requirement;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.optics.Layer;
import org.spectralsieve.optics.LightPath;
import org.spectralsieve.optics.Slab;
import org.spectralsieve.optics.ThicknessRescaler;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.weighting.SpectrumLookup;

/**
 * Thickness solving for requirements judged on the whole light path (weighted clauses, a fixed layer):
 * random absorption edges (internal transmittance a logistic step, n = 1.5, surfaces by Modern Optical Engineering eq. 10.5)
 * with random weighted and plain clauses, with and without a fixed plate in the path. Each answer is
 * re-judged on the path built here from {@link ThicknessRescaler} and {@link LightPath} (REFERENCE §7 and
 * incoherent stacking), clause by clause: the interval's ends hold, just outside them something fails,
 * and where no interval is reported no sampled thickness holds.
 */
class PathSolverPropertyTest {

    private static final ConstantIndex N15 = new ConstantIndex(1.5);
    private static final SpectrumLookup SPECTRA = SpectrumLookup.builtIn();
    private static final double MIN_MM = 0.2;
    private static final double MAX_MM = 20;

    private record Case(Curve curve, double d0, List<Clause> clauses, Optional<StackLayer> layer) {
        @Override
        public String toString() {
            return "d0=" + d0 + " clauses=" + clauses.stream().map(Clause::text).toList() + " layer="
                    + layer.map(l -> l.curve().transmittanceAt(400).getAsDouble()).orElse(Double.NaN);
        }
    }

    @Test
    void intervalsOnThePathHoldAtTheirEndsAndNowhereOutside() {
        Random random = new Random(20261203L);
        int meets = 0;
        int boundedBelow = 0;
        int boundedAbove = 0;
        int withoutInterval = 0;
        int stacked = 0;
        for (int trial = 0; trial < 120; trial++) {
            Case c = randomCase(random);
            Candidate candidate = new Candidate(trial, trial, "synthetic " + trial, c.curve, c.d0, true, N15);
            Requirement req = new Requirement(c.clauses, ThicknessSpec.range(MIN_MM, MAX_MM), Optional.empty(),
                    Optional.empty(), c.layer.map(StackLayer::spec), "synthetic");
            SampleEvaluation e = SampleEvaluator.evaluate(candidate, req, c.layer);
            String context = "trial " + trial + " " + c;
            stacked += c.layer.isPresent() ? 1 : 0;
            if (e.verdict() == Verdict.MEETS) {
                meets++;
                assertThat(holdsAt(c, e.thicknessMm())).as(context).isTrue();
            }
            ThicknessInterval interval = e.feasibleMm();
            if (interval != null) {
                assertThat(e.verdict()).as(context).isEqualTo(Verdict.MEETS);
                assertThat(holdsAt(c, interval.loMm())).as(context + " at interval start").isTrue();
                assertThat(holdsAt(c, interval.hiMm())).as(context + " at interval end").isTrue();
                if (interval.loMm() > MIN_MM + 1e-4) {
                    boundedBelow++;
                    assertThat(holdsAt(c, interval.loMm() - 1e-4)).as(context + " just under the interval").isFalse();
                }
                if (interval.hiMm() < MAX_MM - 1e-4) {
                    boundedAbove++;
                    assertThat(holdsAt(c, interval.hiMm() + 1e-4)).as(context + " just over the interval").isFalse();
                }
            } else {
                withoutInterval++;
                for (int k = 0; k <= 40; k++) {
                    double d = MIN_MM + (MAX_MM - MIN_MM) * k / 40;
                    assertThat(holdsAt(c, d)).as(context + " no interval, yet holds at " + d + " mm").isFalse();
                }
            }
        }
        // the property must not hold vacuously
        assertThat(meets).isGreaterThan(30);
        assertThat(boundedBelow).isGreaterThan(10);
        assertThat(boundedAbove).isGreaterThan(10);
        assertThat(withoutInterval).isGreaterThan(10);
        assertThat(stacked).isGreaterThan(40);
    }

    private static Case randomCase(Random random) {
        double step = 1 + random.nextInt(5);
        int n = (int) Math.floor(600 / step) + 1;
        double[] nm = new double[n];
        double[] t = new double[n];
        double edge = 330 + 130 * random.nextDouble();
        double width = 2 + 20 * random.nextDouble();
        double kMax = 0.85 + 0.15 * random.nextDouble();
        double kMin = Math.pow(10, -1 - 4 * random.nextDouble());
        for (int i = 0; i < n; i++) {
            nm[i] = 240 + step * i;
            double k = kMin + (kMax - kMin) / (1 + Math.exp(-(nm[i] - edge) / width));
            t[i] = Slab.transmittance(k, 0.04);
        }
        double limit = random.nextInt(3) == 0 ? Math.pow(10, -3 - 2 * random.nextDouble()) : 0;
        Curve curve = Curve.of(nm, t, limit);
        double d0 = 0.5 + 4.5 * random.nextDouble();
        List<Clause> clauses = new ArrayList<>();
        int count = 1 + random.nextInt(3);
        String[] leds = {"led 365", "led 385", "led 395", "led 405"};
        for (int j = 0; j < count; j++) {
            String text = switch (random.nextInt(5)) {
                case 0 -> "passes over " + percent(30 + 55 * random.nextDouble()) + " of " + leds[random.nextInt(4)];
                case 1 -> "blocks under " + percent(Math.pow(10, 1 - 3 * random.nextDouble())) + " of " + leds[random.nextInt(4)];
                case 2 -> "erythemal under " + percent(Math.pow(10, 1 - 2.5 * random.nextDouble()));
                case 3 -> "passes over " + percent(40 + 45 * random.nextDouble()) + " of led 405 weighted by blue-light";
                default -> "blocks under " + percent(Math.pow(10, 1 - 3 * random.nextDouble())) + " at "
                        + (int) (300 + 60 * random.nextDouble()) + " nm";
            };
            clauses.add(RequirementParser.parse(text, SPECTRA).clauses().get(0));
        }
        Optional<StackLayer> layer = Optional.empty();
        if (random.nextInt(3) != 0) {
            double plateK = 0.5 + 0.5 * random.nextDouble();
            double plateEdge = 250 + 100 * random.nextDouble();
            double[] lt = new double[n];
            for (int i = 0; i < n; i++) {
                lt[i] = Slab.transmittance(plateK / (1 + Math.exp(-(nm[i] - plateEdge) / 6)), 0.04);
            }
            FixedLayer spec = new FixedLayer(FixedLayer.Placement.BEHIND, 3, "synthetic plate", "behind 3 mm synthetic plate");
            layer = Optional.of(StackLayer.of(spec, 99, "synthetic plate", "synthetic-plate", 990, Curve.of(nm, lt, 0), 3,
                    false, N15));
        }
        return new Case(curve, d0, clauses, layer);
    }

    private static String percent(double p) {
        return String.format(java.util.Locale.ROOT, "%.3f%%", p);
    }

    /** Every clause met on the path built here: the candidate rescaled to d, stacked with the plate when there is one. */
    private static boolean holdsAt(Case c, double d) {
        Curve candidate = ThicknessRescaler.rescale(c.curve, c.d0, d, N15);
        Curve path = c.layer.isEmpty() ? candidate
                : LightPath.of(Layer.fixed(candidate, N15), Layer.fixed(c.layer.get().curve(), N15)).transmittance();
        for (Clause clause : c.clauses) {
            if (ClauseEvaluator.evaluate(clause, path).verdict() != Verdict.MEETS) {
                return false;
            }
        }
        return true;
    }
}
