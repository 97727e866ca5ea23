package org.spectralsieve.requirement;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.optics.Slab;
import org.spectralsieve.optics.ThicknessRescaler;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.Cutoffs;

/**
 * Random absorption edges (internal transmittance a logistic step at a random wavelength with random
 * steepness, n = 1.5 so R = 0.04, surfaces by Modern Optical Engineering eq. 10.5) with random requirements. The solver's
 * answers are re-checked by a plain loop written here, independent of the evaluator, on
 * {@link ThicknessRescaler#rescale} of the curve — the thickness conversion of REFERENCE §7.
 */
class ThicknessSolverPropertyTest {

    private static final ConstantIndex N15 = new ConstantIndex(1.5);
    private static final double MIN_MM = 0.2;
    private static final double MAX_MM = 20;

    @Test
    void everyMeetsAtTheRecommendedThicknessHoldsClauseByClauseOnTheRescaledCurve() {
        Random random = new Random(20261202L);
        int meets = 0;
        int withInterval = 0;
        int boundedBelow = 0;
        int boundedAbove = 0;
        int withoutInterval = 0;
        int judgedOnBound = 0;
        for (int trial = 0; trial < 400; trial++) {
            Case c = randomCase(random);
            Candidate candidate = new Candidate(trial, trial, "synthetic " + trial, c.curve, c.d0, true, N15);
            Requirement req = new Requirement(c.clauses, ThicknessSpec.range(MIN_MM, MAX_MM), Optional.empty(),
                    Optional.empty(), "synthetic");
            SampleEvaluation e = SampleEvaluator.evaluate(candidate, req);
            String context = "trial " + trial + " " + c;
            if (e.verdict() == Verdict.MEETS) {
                meets++;
                assertThat(holdsAt(c, e.thicknessMm())).as(context).isTrue();
            }
            ThicknessInterval interval = e.feasibleMm();
            if (interval != null) {
                withInterval++;
                assertThat(e.verdict()).as(context).isEqualTo(Verdict.MEETS);
                assertThat(interval.contains(e.thicknessMm())).as(context).isTrue();
                assertThat(holdsAt(c, interval.loMm())).as(context + " at interval start").isTrue();
                assertThat(holdsAt(c, interval.hiMm())).as(context + " at interval end").isTrue();
                judgedOnBound += e.clauses().stream().anyMatch(ClauseResult::valueIsBound) ? 1 : 0;
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
                for (int k = 0; k <= 60; k++) {
                    double d = MIN_MM + (MAX_MM - MIN_MM) * k / 60;
                    assertThat(holdsAt(c, d)).as(context + " no interval, yet holds at " + d + " mm").isFalse();
                }
            }
        }
        // the property must not hold vacuously
        // seed 20261202 gives 296 met, 231 intervals bounded below, 182 above, 104 without, 25 met on a bound
        assertThat(meets).isGreaterThan(150);
        assertThat(boundedBelow).isGreaterThan(100);
        assertThat(boundedAbove).isGreaterThan(80);
        assertThat(withoutInterval).isGreaterThan(50);
        assertThat(judgedOnBound).isGreaterThan(10);
        assertThat(withInterval).isEqualTo(meets);
    }

    private record Case(Curve curve, double d0, List<Clause> clauses) {
        @Override
        public String toString() {
            return "d0=" + d0 + " clauses=" + clauses.stream().map(Clause::text).toList();
        }
    }

    private static Case randomCase(Random random) {
        double step = 2 + random.nextInt(9);
        int n = (int) Math.floor(200 / step) + 1;
        double[] nm = new double[n];
        double[] t = new double[n];
        double edge = 340 + 120 * random.nextDouble();
        double width = 1 + 24 * random.nextDouble();
        double kMax = 0.8 + 0.2 * random.nextDouble();
        double kMin = Math.pow(10, -2 - 6 * random.nextDouble());
        for (int i = 0; i < n; i++) {
            nm[i] = 300 + step * i;
            double k = kMin + (kMax - kMin) / (1 + Math.exp(-(nm[i] - edge) / width));
            t[i] = Slab.transmittance(k, 0.04);
        }
        double limit = random.nextBoolean() ? 0 : Math.pow(10, -2 - 2 * random.nextDouble());
        Curve curve = Curve.of(nm, t, limit);
        double d0 = 0.5 + 4.5 * random.nextDouble();
        List<Clause> clauses = new ArrayList<>();
        int count = 1 + random.nextInt(3);
        double last = nm[n - 1];
        for (int j = 0; j < count; j++) {
            switch (random.nextInt(3)) {
                case 0 -> clauses.add(transmittance(random, Direction.BLOCK, 300, edge,
                        Math.pow(10, -1 - 3 * random.nextDouble())));
                case 1 -> clauses.add(transmittance(random, Direction.PASS, edge, last, 0.3 + 0.58 * random.nextDouble()));
                default -> {
                    double level = new double[] {0.5, 0.1, 0.01}[random.nextInt(3)];
                    double from = Math.max(300, edge - 30 * random.nextDouble());
                    double to = Math.min(last, edge + 1 + 30 * random.nextDouble());
                    clauses.add(new CutoffClause(level, new Band(from, to), "cutoff " + level + " in " + from + "-" + to));
                }
            }
        }
        return new Case(curve, d0, clauses);
    }

    private static TransmittanceClause transmittance(Random random, Direction direction, double lo, double hi,
                                                     double threshold) {
        double from = lo + (hi - lo) * random.nextDouble();
        double to = random.nextBoolean() ? from : Math.min(hi, from + 20 * random.nextDouble());
        Aggregate aggregate = to > from && random.nextBoolean() ? Aggregate.MEAN : Aggregate.EVERY_POINT;
        return new TransmittanceClause(direction, aggregate, new Band(from, to), threshold, ThresholdUnit.FRACTION,
                direction + " " + aggregate + " " + threshold + " " + from + "-" + to);
    }

    // ---- the independent check: plain loops over the rescaled curve ----

    private static boolean holdsAt(Case c, double d) {
        Curve curve = ThicknessRescaler.rescale(c.curve, c.d0, d, N15);
        for (Clause clause : c.clauses) {
            if (!holds(clause, curve)) {
                return false;
            }
        }
        return true;
    }

    private static boolean holds(Clause clause, Curve curve) {
        if (clause instanceof CutoffClause cut) {
            OptionalDouble at = Cutoffs.cutoffNm(curve, cut.levelT());
            return at.isPresent() && at.getAsDouble() >= cut.window().fromNm() && at.getAsDouble() <= cut.window().toNm();
        }
        TransmittanceClause tc = (TransmittanceClause) clause;
        double from = tc.band().fromNm();
        double to = tc.band().toNm();
        List<double[]> points = new ArrayList<>(); // {nm, judged T, bounded ? 1 : 0}
        points.add(reading(curve, from));
        for (int i = 0; i < curve.size(); i++) {
            if (curve.wavelengthNm(i) > from && curve.wavelengthNm(i) < to) {
                points.add(reading(curve, curve.wavelengthNm(i)));
            }
        }
        if (to > from) {
            points.add(reading(curve, to));
        }
        boolean pass = tc.direction() == Direction.PASS;
        if (tc.aggregate() == Aggregate.MEAN) {
            double area = 0;
            boolean anyBound = false;
            for (int i = 0; i < points.size(); i++) {
                anyBound |= points.get(i)[2] == 1;
                if (i > 0) {
                    area += (points.get(i - 1)[1] + points.get(i)[1]) / 2 * (points.get(i)[0] - points.get(i - 1)[0]);
                }
            }
            double mean = area / (to - from);
            return pass ? !anyBound && mean >= tc.thresholdT() : mean <= tc.thresholdT();
        }
        for (double[] p : points) {
            boolean ok = pass ? p[2] == 0 && p[1] >= tc.thresholdT() : p[1] <= tc.thresholdT();
            if (!ok) {
                return false;
            }
        }
        return true;
    }

    /** {nm, T or its upper bound, bounded}; an interpolated bound is the absorbance interpolation of the neighbours' bounds. */
    private static double[] reading(Curve curve, double nm) {
        int i = 0;
        while (i < curve.size() - 1 && curve.wavelengthNm(i + 1) <= nm) {
            i++;
        }
        if (curve.wavelengthNm(i) == nm) {
            boolean b = curve.belowDetection(i);
            double t = curve.transmittance(i);
            return new double[] {nm, b ? Math.max(t, curve.detectionLimit(i)) : t, b ? 1 : 0};
        }
        boolean bounded = curve.belowDetection(i) || curve.belowDetection(i + 1);
        if (!bounded) {
            return new double[] {nm, curve.transmittanceAt(nm).orElseThrow(), 0};
        }
        double f = (nm - curve.wavelengthNm(i)) / (curve.wavelengthNm(i + 1) - curve.wavelengthNm(i));
        double a = absorbance(upper(curve, i)) * (1 - f) + absorbance(upper(curve, i + 1)) * f;
        return new double[] {nm, Math.pow(10, -a), 1};
    }

    private static double upper(Curve curve, int i) {
        return curve.belowDetection(i) ? Math.max(curve.transmittance(i), curve.detectionLimit(i)) : curve.transmittance(i);
    }

    private static double absorbance(double t) {
        return -Math.log10(Math.max(t, Curve.ABSORBANCE_FLOOR_T));
    }
}
