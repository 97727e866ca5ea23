package org.spectralsieve.requirement;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Random;
import java.util.function.DoubleUnaryOperator;
import org.junit.jupiter.api.Test;

/**
 * Random monotone margins with a crossing placed first, so the true answer is known before any search: smooth
 * (Beer–Lambert decades, linear in d; exponentials of d), kinked (the least of two readings), stepped (a
 * plateau each side of a jump), flat at exactly zero up to the crossing (a margin that holds with no room), and
 * NaN on the failing side. Through {@link ThicknessConstraint#holdsWithin} as the solver calls it, and through
 * {@link CrossingFinder#itp} for the step count. Fixed seed, so a failure reproduces.
 */
class CrossingFinderPropertyTest {

    private static final double WIDTH = ThicknessSolver.TOLERANCE_MM;

    /** A non-increasing margin that is >= 0 exactly up to {@code crossing}. */
    private record Falling(String shape, double crossing, DoubleUnaryOperator margin) {

        boolean smooth() {
            return shape.equals("linear") || shape.equals("exponentials");
        }
    }

    @Test
    void theKeptEndHoldsLiesWithinTheToleranceOfTheTrueCrossingAndTakesAtMostBisectionsStepsPlusTheSlack() {
        Random random = new Random(20261205L);
        int smooth = 0;
        int trials = 4000;
        for (int trial = 0; trial < trials; trial++) {
            double min = 0.2 + random.nextDouble() * 2;
            double max = min + 0.5 + random.nextDouble() * 18;
            double crossing = min + (0.001 + 0.998 * random.nextDouble()) * (max - min);
            Falling falling = randomFalling(random, crossing);
            boolean rising = random.nextBoolean();
            // a rising margin is the falling one mirrored about the middle of [min, max]
            DoubleUnaryOperator margin = rising
                    ? d -> falling.margin().applyAsDouble(min + max - d)
                    : falling.margin();
            double trueEnd = rising ? min + max - crossing : crossing;
            String context = "trial " + trial + " " + falling.shape() + (rising ? " rising" : " falling")
                    + " on [" + min + ", " + max + "], crossing " + trueEnd;

            double[] holds = new PathConstraints.OnPath(!rising, true, margin).holdsWithin(min, max);

            assertThat(holds).as(context).isNotNull();
            double end = rising ? holds[0] : holds[1];
            assertThat(margin.applyAsDouble(end)).as(context + ": the end holds").isGreaterThanOrEqualTo(0);
            // the width, plus a few ulps: the mirrored thickness and a smooth margin's own rounding move the
            // crossing the arithmetic sees by that much from the one placed
            assertThat(Math.abs(end - trueEnd)).as(context + ": end " + end).isLessThanOrEqualTo(WIDTH + 1e-12);

            CrossingFinder.Side left = rising ? m -> !(m >= 0) : m -> m >= 0;
            CrossingFinder.Keep keep = rising ? CrossingFinder.Keep.RIGHT : CrossingFinder.Keep.LEFT;
            CrossingFinder.Bracket itp = CrossingFinder.itp(margin, left, min, margin.applyAsDouble(min), max,
                    margin.applyAsDouble(max), WIDTH, keep);
            int bisection = CrossingFinder.bisect(margin, left, min, max, WIDTH).steps();
            // ITP's bound (n½ + n0) for half the width, and the trial placing the end: bisection's count + n0 + 2
            assertThat(itp.steps()).as(context).isLessThanOrEqualTo(bisection + CrossingFinder.SLACK_STEPS + 2);
            assertThat(itp.steps()).as(context).isLessThanOrEqualTo(CrossingFinder.mostTrials(max - min, WIDTH, keep));
            // the end with room from the crossing: a quarter of the width, less the rounding of the placed crossing
            assertThat(Math.abs(end - trueEnd)).as(context + ": room").isGreaterThanOrEqualTo(0.25 * WIDTH - 1e-12);
            // the recommendation's use (both ends, no room sought): bisection's count + n0
            CrossingFinder.Bracket either = CrossingFinder.itp(margin, left, min, margin.applyAsDouble(min), max,
                    margin.applyAsDouble(max), WIDTH, CrossingFinder.Keep.EITHER);
            assertThat(either.steps()).as(context).isLessThanOrEqualTo(bisection + CrossingFinder.SLACK_STEPS);
            assertThat(either.right() - either.left()).as(context).isLessThanOrEqualTo(WIDTH);
            // the crossing stays inside the bracket (less the rounding of the placed crossing)
            assertThat(either.left()).as(context).isLessThanOrEqualTo(trueEnd + 1e-12);
            assertThat(either.right()).as(context).isGreaterThanOrEqualTo(trueEnd - 1e-12);
            if (falling.smooth()) {
                // not a bound of the method, a check that the interpolation is in use: on a smooth margin the
                // steps converge superlinearly (about 9 where bisection takes about 27 with these brackets, 12 at
                // most; regula falsi without the Illinois change took up to 21 on a crossing near one end)
                smooth++;
                assertThat(itp.steps()).as(context).isLessThan(bisection / 2);
            }
        }
        assertThat(smooth).as("smooth shapes drawn").isGreaterThan(trials / 4);
    }

    private static Falling randomFalling(Random random, double crossing) {
        double slope = Math.pow(10, -2 + 4 * random.nextDouble());
        switch (random.nextInt(6)) {
            case 0 -> {
                // Beer–Lambert in decades: log10(K0^(d/d0) / K*) is linear in d
                return new Falling("linear", crossing, d -> slope * (crossing - d));
            }
            case 1 -> {
                // a sum of two absorbers' transmittances against a threshold, in decades: smooth and convex
                double k1 = 0.1 + 2 * random.nextDouble();
                double k2 = 0.1 + 2 * random.nextDouble();
                double at = Math.exp(-k1 * crossing) + Math.exp(-k2 * crossing);
                return new Falling("exponentials", crossing,
                        d -> Math.log10((Math.exp(-k1 * d) + Math.exp(-k2 * d)) / at));
            }
            case 2 -> {
                // the least (or, to keep the crossing where it was placed, the greatest) of two readings' margins:
                // a kink on one side of the crossing
                double other = crossing + (random.nextDouble() - 0.5) * 3;
                double steeper = slope * (1 + 20 * random.nextDouble());
                return other >= crossing
                        ? new Falling("kink", crossing, d -> Math.min(slope * (crossing - d), steeper * (other - d)))
                        : new Falling("kink", crossing, d -> Math.max(slope * (crossing - d), steeper * (other - d)));
            }
            case 3 -> {
                // plateaus each side of a jump (a reading that flips between bounds)
                double up = random.nextDouble() * 2;
                double down = 1e-6 + random.nextDouble() * 2;
                return new Falling("step", crossing, d -> d <= crossing ? up : -down);
            }
            case 4 -> {
                // exactly zero from some way before the crossing up to it: holds with no room, then fails
                double flatFrom = crossing - random.nextDouble() * 2;
                return new Falling("flat-zero", crossing,
                        d -> d <= crossing ? slope * Math.max(0, flatFrom - d) : -slope * (d - crossing) - 1e-9);
            }
            default -> {
                // a figure that cannot be formed beyond the crossing: NaN there counts as failing
                return new Falling("nan-beyond", crossing, d -> d <= crossing ? slope * (crossing - d) : Double.NaN);
            }
        }
    }
}
