package org.spectralsieve.requirement;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.states.Exposure;
import org.spectralsieve.states.MaterialState;
import org.spectralsieve.states.Printing;
import org.spectralsieve.states.StateCurve;

/**
 * Clauses naming a state, judged on a sample's curves in that state, worked by hand on made-up curves. The direction
 * of change follows PRACTICE.md §1 (UV transmission falls with exposure, most near the cut-off: common practice) and
 * §2 (a printed black is far darker than its base over 350–420 nm).
 */
class StateClauseTest {

    private static final double[] NM = {300, 365, 420, 550};
    private static final Curve NEW = Curve.of(NM, new double[] {0.70, 0.90, 0.91, 0.92}, 0);
    private static final Curve AFTER_500 = Curve.of(NM, new double[] {0.50, 0.86, 0.90, 0.92}, 0);
    private static final Curve AFTER_2000 = Curve.of(NM, new double[] {0.30, 0.82, 0.89, 0.91}, 0);
    private static final Curve AFTER_4000 = Curve.of(NM, new double[] {0.20, 0.76, 0.88, 0.91}, 0);

    private static StateCurve aged(long id, double hours, String source, Curve curve) {
        return new StateCurve(id, MaterialState.aged(Exposure.hours(hours, source)), curve, 3);
    }

    private static Candidate lampCover(List<StateCurve> states) {
        return new Candidate(7, 3, "illustrative lamp cover", NEW, 3, true, new ConstantIndex(1.49)).withStates(states);
    }

    private static SampleEvaluation judge(String text, Candidate candidate) {
        return SampleEvaluator.evaluate(candidate, RequirementParser.parse(text));
    }

    @Test
    void aCurveAtTheAskedExposureIsJudgedAsMeasured() {
        SampleEvaluation e = judge("after 2000 h passes over 80% at 365 nm",
                lampCover(List.of(aged(1, 2000, "lamp bank A", AFTER_2000))));
        ClauseResult r = e.clauses().get(0);
        assertThat(r.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(r.value()).isEqualTo(0.82);
        // log10(0.82 / 0.8) = 0.010724
        assertThat(r.marginDecades()).isCloseTo(0.010724, within(1e-6));
        assertThat(r.explanation()).startsWith("aged 2000 h under lamp bank A: T at 365 nm is 82 %");
    }

    @Test
    void anExposureBetweenTwoCurvesIsJudgedOnBothWithoutInterpolating() {
        Candidate c = lampCover(List.of(aged(1, 500, "lamp bank A", AFTER_500), aged(2, 2000, "lamp bank A", AFTER_2000)));
        // 1000 h lies between 500 h (86 %) and 2000 h (82 %): both over 80 % → meets, on the smaller margin
        ClauseResult meets = judge("after 1000 h passes over 80% at 365 nm", c).clauses().get(0);
        assertThat(meets.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(meets.value()).isEqualTo(0.82);
        assertThat(meets.explanation()).contains("not interpolated");
        // both under 90 %: misses whichever way T went between them
        assertThat(judge("after 1000 h passes over 90% at 365 nm", c).clauses().get(0).verdict())
                .isEqualTo(Verdict.MISSES);
        // 86 % and 82 % around 84 %: the asked exposure could lie either side
        ClauseResult between = judge("after 1000 h passes over 84% at 365 nm", c).clauses().get(0);
        assertThat(between.verdict()).isEqualTo(Verdict.UNVERIFIED);
        assertThat(between.explanation()).contains("disagree");
    }

    @Test
    void beforeTheFirstAgedCurveTheAsSuppliedCurveIsExposureZero() {
        Candidate c = lampCover(List.of(aged(1, 2000, "lamp bank A", AFTER_2000)));
        ClauseResult r = judge("after 1000 h passes over 85% at 365 nm", c).clauses().get(0);
        // as supplied 90 %, after 2000 h 82 %: they disagree about 85 %
        assertThat(r.verdict()).isEqualTo(Verdict.UNVERIFIED);
        assertThat(r.explanation()).contains("as supplied").contains("aged 2000 h under lamp bank A");
    }

    @Test
    void pastTheLongestExposureOrWithoutAnyAgedCurveTheClauseIsUnverifiedNeverGuessed() {
        Candidate c = lampCover(List.of(aged(1, 2000, "lamp bank A", AFTER_2000)));
        ClauseResult beyond = judge("after 5000 h passes over 50% at 365 nm", c).clauses().get(0);
        assertThat(beyond.verdict()).isEqualTo(Verdict.UNVERIFIED);
        assertThat(beyond.explanation()).contains("not extrapolated");
        ClauseResult none = judge("after 1000 h passes over 50% at 365 nm", lampCover(List.of())).clauses().get(0);
        assertThat(none.verdict()).isEqualTo(Verdict.UNVERIFIED);
        assertThat(none.explanation()).contains("no aged curve");
        // a dose is another scale: hours say nothing about J/cm²
        ClauseResult dose = judge("after 50 J/cm² at 365 nm passes over 50% at 365 nm", c).clauses().get(0);
        assertThat(dose.verdict()).isEqualTo(Verdict.UNVERIFIED);
    }

    @Test
    void underSeveralSourcesTheWorstSeriesStandsAndEachIsNamed() {
        Candidate c = lampCover(List.of(aged(1, 4000, "lamp bank A", AFTER_2000), aged(2, 4000, "lamp bank B", AFTER_4000)));
        ClauseResult r = judge("after 4000 h passes over 80% at 365 nm", c).clauses().get(0);
        assertThat(r.verdict()).isEqualTo(Verdict.MISSES);
        assertThat(r.value()).isEqualTo(0.76);
        assertThat(r.explanation()).contains("lamp bank A").contains("lamp bank B");
    }

    @Test
    void aStateCurveIsNotRescaledSoAnotherThicknessLeavesItUnverified() {
        Candidate c = lampCover(List.of(aged(1, 2000, "lamp bank A", AFTER_2000)));
        SampleEvaluation e = judge("passes over 50% at 365 nm and after 2000 h passes over 80% at 365 nm, at 6 mm", c);
        assertThat(e.thicknessMm()).isEqualTo(6);
        assertThat(e.clauses().get(0).verdict()).isEqualTo(Verdict.MEETS);
        assertThat(e.clauses().get(1).verdict()).isEqualTo(Verdict.UNVERIFIED);
        assertThat(e.clauses().get(1).explanation()).contains("not rescaled");
        assertThat(e.verdict()).isEqualTo(Verdict.UNVERIFIED);
    }

    @Test
    void aThicknessRangeHoldingTheMeasuredThicknessIsJudgedWhereTheStateCurvesWereMeasured() {
        Candidate c = lampCover(List.of(aged(1, 2000, "lamp bank A", AFTER_2000)));
        SampleEvaluation e = judge("passes over 50% at 365 nm and after 2000 h passes over 80% at 365 nm,"
                + " thickness 1 to 6 mm", c);
        assertThat(e.thicknessMm()).isEqualTo(3);
        assertThat(e.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(e.feasibleMm()).isNull();
        // a range that leaves the measured thickness out: the state clause cannot be judged there
        SampleEvaluation thick = judge("passes over 50% at 365 nm and after 2000 h passes over 80% at 365 nm,"
                + " thickness 4 to 6 mm", c);
        assertThat(thick.clauses().get(1).verdict()).isEqualTo(Verdict.UNVERIFIED);
    }

    @Test
    void aPrintedBlackIsJudgedOnItsHeaviestPrintAndAgainstItsBase() {
        double[] nm = {350, 385, 420, 550};
        Curve base = Curve.of(nm, new double[] {0.84, 0.86, 0.87, 0.88}, 0);
        Curve light = Curve.of(nm, new double[] {0.01, 0.01, 0.012, 0.05}, 0);
        Curve full = Curve.of(nm, new double[] {0.0002, 0.0003, 0.0004, 0.004}, 0);
        Candidate film = new Candidate(9, 4, "illustrative mask film", base, 0.1, false, null).withStates(List.of(
                new StateCurve(1, MaterialState.printed(new Printing(50, Double.NaN)), light, 0.1),
                new StateCurve(2, MaterialState.printed(new Printing(100, Double.NaN)), full, 0.1)));
        SampleEvaluation e = judge("printed black blocks to OD 3 or more from 350 to 420 nm and base passes over 80%"
                + " from 350 to 420 nm and from 350 to 420 nm the printed black under 0.1% of the base", film);
        ClauseResult black = e.clauses().get(0);
        // the 100 % print: highest T 0.0004 ≤ 0.001 (OD 3); log10(0.001 / 0.0004) = 0.39794
        assertThat(black.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(black.marginDecades()).isCloseTo(0.39794, within(1e-5));
        assertThat(black.explanation()).startsWith("printed black, 100 % ink");
        assertThat(e.clauses().get(1).verdict()).isEqualTo(Verdict.MEETS);
        ClauseResult ratio = e.clauses().get(2);
        // highest ratio 0.0004 / 0.87 = 0.046 % at 420 nm, under 0.1 %
        assertThat(ratio.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(ratio.value()).isCloseTo(0.0004 / 0.87, within(1e-12));
        assertThat(e.verdict()).isEqualTo(Verdict.MEETS);
        // a film without a printed curve: unverified, not a guess
        Candidate unprinted = new Candidate(10, 4, "illustrative mask film", base, 0.1, false, null);
        assertThat(judge("printed black blocks to OD 3 or more from 350 to 420 nm", unprinted).verdict())
                .isEqualTo(Verdict.UNVERIFIED);
    }

    @Test
    void aFixedLayerIsNotCombinedWithAStateCurve() {
        Candidate c = lampCover(List.of(aged(1, 2000, "lamp bank A", AFTER_2000)));
        Requirement r = RequirementParser.parse("after 2000 h passes over 50% at 365 nm, behind 2 mm glass");
        StackLayer layer = StackLayer.of(r.layer().orElseThrow(), 99, "illustrative glass", "glass", 98,
                Curve.of(NM, new double[] {0.8, 0.9, 0.9, 0.9}, 0), 2, false, new ConstantIndex(1.52));
        SampleEvaluation e = SampleEvaluator.evaluate(c, r, java.util.Optional.of(layer));
        assertThat(e.clauses().get(0).verdict()).isEqualTo(Verdict.UNVERIFIED);
        assertThat(e.clauses().get(0).explanation()).contains("not combined");
    }
}
