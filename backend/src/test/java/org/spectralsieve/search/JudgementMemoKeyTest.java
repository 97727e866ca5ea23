package org.spectralsieve.search;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.requirement.Candidate;
import org.spectralsieve.requirement.MadeThicknesses;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.requirement.SampleEvaluation;
import org.spectralsieve.requirement.SampleEvaluator;
import org.spectralsieve.requirement.ThicknessInterval;
import org.spectralsieve.requirement.WeightedClause;
import org.spectralsieve.requirement.Weighting;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.weighting.Emitter;

/**
 * What {@link JudgementMemo} takes as the same judgement: exactly the same arguments, the curve the same object.
 * Each case asks twice (a question is kept from its second ask), a third time (a hit), then with one argument
 * changed: that must not be a hit, and its result must be the exact evaluator's for the changed arguments. Curves and
 * numbers are illustrative.
 */
class JudgementMemoKeyTest {

    private static final ThicknessInterval WHOLE = new ThicknessInterval(Double.MIN_VALUE, Double.MAX_VALUE);
    private static final Requirement PLAIN = RequirementParser.parse("passes over 80% at 365 nm");

    private static Curve edge(double nm) {
        double[] w = new double[276];
        double[] t = new double[w.length];
        for (int i = 0; i < w.length; i++) {
            w[i] = 250 + 2 * i;
            t[i] = 0.001 + 0.9 / (1 + Math.exp(-(w[i] - nm) / 6.0));
        }
        return Curve.of(w, t, 1e-3);
    }

    private static Candidate sheet(Curve curve, double mm, double n) {
        return new Candidate(7, 3, "Illustrative sheet", curve, mm, true, new ConstantIndex(n), MadeThicknesses.UNLIMITED);
    }

    /** Asks twice with {@code first} (kept on the second), a third time (a hit), then with {@code changed}: a miss, judged exactly. */
    private static void changedArgumentIsJudgedAfresh(Candidate first, Requirement r1, Candidate changed, Requirement r2,
                                                      ThicknessInterval span2) {
        JudgementMemo memo = new JudgementMemo(100);
        memo.evaluate(first, r1, Optional.empty(), WHOLE);
        memo.searchStarts();
        memo.evaluate(first, r1, Optional.empty(), WHOLE);
        memo.searchStarts();
        assertThat(memo.evaluate(first, r1, Optional.empty(), WHOLE)).isEqualTo(
                SampleEvaluator.evaluate(first, r1, Optional.empty(), WHOLE));
        long hits = memo.counts().hits();
        assertThat(hits).isEqualTo(1);
        memo.searchStarts();
        SampleEvaluation again = memo.evaluate(changed, r2, Optional.empty(), span2);
        assertThat(memo.counts().hits()).as("a changed argument is never a hit").isEqualTo(hits);
        assertThat(again).isEqualTo(SampleEvaluator.evaluate(changed, r2, Optional.empty(), span2));
    }

    @Test
    void theSameCurveObjectIsAHitAndAnEqualCurveReadAgainIsAMiss() {
        Curve curve = edge(340);
        Curve readAgain = edge(340);
        assertThat(readAgain).isEqualTo(curve).isNotSameAs(curve);
        changedArgumentIsJudgedAfresh(sheet(curve, 3, 1.49), PLAIN, sheet(readAgain, 3, 1.49), PLAIN, WHOLE);
    }

    @Test
    void aCorrectedThicknessIndexOrSpanIsAMiss() {
        Curve curve = edge(340);
        changedArgumentIsJudgedAfresh(sheet(curve, 3, 1.49), PLAIN, sheet(curve, 3.9, 1.49), PLAIN, WHOLE);
        changedArgumentIsJudgedAfresh(sheet(curve, 3, 1.49), PLAIN, sheet(curve, 3, 1.59), PLAIN, WHOLE);
        changedArgumentIsJudgedAfresh(sheet(curve, 3, 1.49), PLAIN, sheet(curve, 3, 1.49), PLAIN,
                new ThicknessInterval(1, 4));
    }

    @Test
    void anotherThresholdIsAMiss() {
        Curve curve = edge(340);
        changedArgumentIsJudgedAfresh(sheet(curve, 3, 1.49), PLAIN, sheet(curve, 3, 1.49),
                RequirementParser.parse("passes over 81% at 365 nm"), WHOLE);
    }

    /**
     * Weighted clauses compare their emitter by name ({@link Weighting.Spectral#equals}): an emitter imported again
     * under the same name gives an equal requirement with other light. The memo keys on the emitter object.
     */
    @Test
    void anEmitterOfTheSameNameButAnotherSpectrumIsAMiss() {
        Requirement first = new Requirement(java.util.List.of(weighted(Emitter.led("bench-led", 365, 10))),
                PLAIN.thickness(), Optional.empty(), Optional.empty(), "passes over 50% of bench-led");
        Requirement second = new Requirement(java.util.List.of(weighted(Emitter.led("bench-led", 395, 10))),
                PLAIN.thickness(), Optional.empty(), Optional.empty(), "passes over 50% of bench-led");
        assertThat(second).isEqualTo(first); // equal by name, other light
        Candidate c = sheet(edge(380), 3, 1.49);
        assertThat(SampleEvaluator.evaluate(c, second, Optional.empty(), WHOLE))
                .isNotEqualTo(SampleEvaluator.evaluate(c, first, Optional.empty(), WHOLE));
        changedArgumentIsJudgedAfresh(c, first, c, second, WHOLE);
    }

    private static WeightedClause weighted(Emitter emitter) {
        return new WeightedClause(org.spectralsieve.requirement.Direction.PASS, 0.5,
                org.spectralsieve.requirement.ThresholdUnit.PERCENT, Weighting.of(emitter, Optional.empty()),
                "passes over 50% of bench-led");
    }
}
