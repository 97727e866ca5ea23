package org.spectralsieve.requirement;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.function.DoubleUnaryOperator;
import org.junit.jupiter.api.Test;

/**
 * The bracketing root finder against roots known independently of it. Each check names where its root comes
 * from; the step count is compared with what bisection takes for the same bracket and width, counted here by
 * running bisection on the same function.
 */
class CrossingFinderTest {

    private static final double WIDTH = ThicknessSolver.TOLERANCE_MM;

    @Test
    void findsTheRealRootOfXCubedMinusXMinusTwoGivenByCardanosFormulaInFewerStepsThanBisection() {
        // x³ + px + q with p = −1, q = −2; Cardano: x = ∛(−q/2 + √(q²/4 + p³/27)) + ∛(−q/2 − √(q²/4 + p³/27));
        // the classic test equation of bracketing methods (the ITP paper's examples use it too), root ≈ 1.52138
        double s = Math.sqrt(1 - 1.0 / 27);
        double cardano = Math.cbrt(1 + s) + Math.cbrt(1 - s);
        DoubleUnaryOperator f = x -> x * x * x - x - 2;
        // rising through the root: the left side is where f < 0
        CrossingFinder.Bracket itp = CrossingFinder.itp(f, v -> v < 0, 1, f.applyAsDouble(1), 2, f.applyAsDouble(2), WIDTH,
                CrossingFinder.Keep.EITHER);
        CrossingFinder.Bracket bisection = CrossingFinder.bisect(f, v -> v < 0, 1, 2, WIDTH);

        assertThat(itp.left()).isLessThanOrEqualTo(cardano);
        assertThat(itp.right()).isGreaterThanOrEqualTo(cardano);
        assertThat(itp.right() - itp.left()).isLessThanOrEqualTo(WIDTH);
        assertThat(itp.steps()).isLessThan(bisection.steps());
    }

    @Test
    void findsTheBeerLambertThicknessWhereAPassStopsHoldingAsTheClosedFormGivesIt() {
        // internal transmittance K(d) = K0^(d/d0) (Beer–Lambert, textbook); a pass needs K(d) ≥ K*, so it holds up
        // to d* = d0·ln K*/ln K0. The margin in decades, log10(K(d)/K*), is what the solver bisected before.
        double k0 = 0.62;
        double d0 = 2.0;
        double kStar = 0.30;
        double closedForm = d0 * Math.log(kStar) / Math.log(k0);
        DoubleUnaryOperator margin = d -> Math.log10(Math.pow(k0, d / d0) / kStar);
        CrossingFinder.Bracket itp = CrossingFinder.itp(margin, m -> m >= 0, 1, margin.applyAsDouble(1), 6,
                margin.applyAsDouble(6), WIDTH, CrossingFinder.Keep.LEFT);
        CrossingFinder.Bracket bisection = CrossingFinder.bisect(margin, m -> m >= 0, 1, 6, WIDTH);

        assertThat(margin.applyAsDouble(itp.left())).as("the kept end holds").isGreaterThanOrEqualTo(0);
        assertThat(itp.left()).isCloseTo(closedForm, within(WIDTH));
        // the kept end is placed with room: at least a quarter of the width short of the crossing (less rounding)
        assertThat(closedForm - itp.left()).isGreaterThanOrEqualTo(0.25 * WIDTH - 1e-12);
        assertThat(itp.steps()).isLessThan(bisection.steps());
    }

    @Test
    void aStepFunctionIsNarrowedToItsJumpWithinTheBoundOfBisectionsStepsPlusTheSlack() {
        // a margin that is a plateau on each side of a jump at 2.7182818 (a reading judged against a bound that
        // flips between two values): no interpolation helps, the bound on steps must still hold
        double jump = 2.7182818;
        DoubleUnaryOperator step = d -> d <= jump ? 0.5 : -0.5;
        // interpolation cannot help on it, so this is the worst case: bisection's count narrowed to half the width
        // (one more than to the width), the one slack step and the trial placing the end (ITP paper, theorem 2.1)
        CrossingFinder.Bracket itp = CrossingFinder.itp(step, m -> m >= 0, 1, 0.5, 6, -0.5, WIDTH,
                CrossingFinder.Keep.LEFT);
        CrossingFinder.Bracket either = CrossingFinder.itp(step, m -> m >= 0, 1, 0.5, 6, -0.5, WIDTH,
                CrossingFinder.Keep.EITHER);
        CrossingFinder.Bracket bisection = CrossingFinder.bisect(step, m -> m >= 0, 1, 6, WIDTH);

        assertThat(itp.left()).isLessThanOrEqualTo(jump).isCloseTo(jump, within(WIDTH));
        assertThat(itp.right()).isGreaterThan(jump);
        assertThat(itp.right() - itp.left()).isLessThanOrEqualTo(WIDTH);
        assertThat(itp.steps()).isLessThanOrEqualTo(bisection.steps() + CrossingFinder.SLACK_STEPS + 2);
        assertThat(either.steps()).isLessThanOrEqualTo(bisection.steps() + CrossingFinder.SLACK_STEPS);
    }

    @Test
    void aNotANumberMarginCountsAsFailingAsInBisectionAndStepsStayWithinTheBound() {
        // a margin that holds up to 3.25 and is NaN beyond (a figure that cannot be formed there): the NaN side
        // fails, so the kept end is the last thickness that holds
        DoubleUnaryOperator margin = d -> d <= 3.25 ? 3.25 - d : Double.NaN;
        CrossingFinder.Bracket itp = CrossingFinder.itp(margin, m -> m >= 0, 1, 2.25, 6, Double.NaN, WIDTH,
                CrossingFinder.Keep.LEFT);

        assertThat(itp.left()).isCloseTo(3.25, within(WIDTH)).isLessThanOrEqualTo(3.25);
        assertThat(itp.steps()).isLessThanOrEqualTo(CrossingFinder.mostTrials(5, WIDTH, CrossingFinder.Keep.LEFT));
    }

    @Test
    void bisectionsStepCountIsTheCeilingOfTheBinaryLogarithmOfTheBracketOverTheWidth() {
        // n½ = ⌈log2((b − a)/2ε)⌉ with 2ε the final width (the ITP paper's bound for bisection)
        assertThat(CrossingFinder.bisectionSteps(5, 1e-7)).isEqualTo((int) Math.ceil(Math.log(5 / 1e-7) / Math.log(2)));
        assertThat(CrossingFinder.bisectionSteps(1, 0.25)).isEqualTo(2);
        assertThat(CrossingFinder.bisectionSteps(0.25, 0.25)).isZero();
    }
}
