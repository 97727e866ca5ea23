package org.spectralsieve.requirement;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.spectrum.Curve;

/** What the requirement says about thickness, per kind of sample. */
class SampleEvaluatorTest {

    private static final ConstantIndex GLASS = new ConstantIndex(1.5);
    /** T = 0.80 at 2 mm everywhere. */
    private static final Curve EIGHTY = Curve.of(new double[] {400, 410}, new double[] {0.8, 0.8}, 0);

    private static Requirement require(ThicknessSpec thickness, Clause... clauses) {
        return new Requirement(List.of(clauses), thickness, Optional.empty(), Optional.empty(), "");
    }

    private static Candidate sheet(double mm) {
        return new Candidate(7, 70, "illustrative clear sheet", EIGHTY, mm, true, GLASS);
    }

    private static Candidate layer(double mm) {
        return new Candidate(8, 80, "illustrative coated film", EIGHTY, mm, false, null);
    }

    @Test
    void asMeasuredJudgesTheMeasuredCurve() {
        SampleEvaluation e = SampleEvaluator.evaluate(sheet(2),
                require(ThicknessSpec.AS_MEASURED, ClauseEvaluatorTest.point(Direction.PASS, 405, 0.75)));
        assertThat(e.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(e.clauses().get(0).value()).isEqualTo(0.8);
        assertThat(e.thicknessMm()).isEqualTo(2);
        assertThat(e.feasibleMm()).isNull();
    }

    @Test
    void fixedThicknessRescalesABulkSampleThroughItsSurfaces() {
        // REFERENCE §7 worked example (Modern Optical Engineering eq. 10.5 + Beer–Lambert): T(2 mm) = 0.80, n = 1.5
        // → K(2 mm) = 0.867012 → K(5 mm) = 0.699942 → T(5 mm) = 0.645573
        SampleEvaluation meets = SampleEvaluator.evaluate(sheet(2),
                require(ThicknessSpec.at(5), ClauseEvaluatorTest.point(Direction.PASS, 405, 0.64)));
        assertThat(meets.clauses().get(0).value()).isCloseTo(0.645573, within(1e-6));
        assertThat(meets.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(meets.thicknessMm()).isEqualTo(5);
        SampleEvaluation misses = SampleEvaluator.evaluate(sheet(2),
                require(ThicknessSpec.at(5), ClauseEvaluatorTest.point(Direction.PASS, 405, 0.65)));
        assertThat(misses.verdict()).isEqualTo(Verdict.MISSES);
    }

    @Test
    void fixedLayerAtAnotherThicknessIsUnverifiedNotRescaled() {
        SampleEvaluation e = SampleEvaluator.evaluate(layer(0.1),
                require(ThicknessSpec.at(3), ClauseEvaluatorTest.point(Direction.PASS, 405, 0.5)));
        assertThat(e.verdict()).isEqualTo(Verdict.UNVERIFIED);
        assertThat(e.worstMarginDecades()).isNaN();
        assertThat(e.bindingClauseIndex()).isEqualTo(-1);
        assertThat(e.clauses().get(0).explanation()).isEqualTo("coated/laminated part, measured only at 0.1 mm; not rescalable to 3 mm");
    }

    @Test
    void fixedLayerAtTheAskedThicknessIsJudgedAsMeasured() {
        SampleEvaluation e = SampleEvaluator.evaluate(layer(0.1),
                require(ThicknessSpec.at(0.1), ClauseEvaluatorTest.point(Direction.PASS, 405, 0.5)));
        assertThat(e.verdict()).isEqualTo(Verdict.MEETS);
    }

    @Test
    void layerInARangeIsJudgedAsMeasuredOnlyWhenItsThicknessLiesInside() {
        Clause pass = ClauseEvaluatorTest.point(Direction.PASS, 405, 0.5);
        assertThat(SampleEvaluator.evaluate(layer(0.1), require(ThicknessSpec.range(0.05, 1), pass)).verdict())
                .isEqualTo(Verdict.MEETS);
        SampleEvaluation outside = SampleEvaluator.evaluate(layer(0.1), require(ThicknessSpec.range(1, 6), pass));
        assertThat(outside.verdict()).isEqualTo(Verdict.UNVERIFIED);
        assertThat(outside.clauses().get(0).explanation())
                .isEqualTo("coated/laminated part, measured only at 0.1 mm; not rescalable to 1–6 mm");
    }

    @Test
    void sampleWithoutRecordedThicknessCannotBeJudgedAtAnother() {
        SampleEvaluation e = SampleEvaluator.evaluate(sheet(Double.NaN),
                require(ThicknessSpec.at(3), ClauseEvaluatorTest.point(Direction.PASS, 405, 0.5)));
        assertThat(e.verdict()).isEqualTo(Verdict.UNVERIFIED);
    }

    @Test
    void sampleVerdictIsTheWorstClauseAndTheBindingClauseHasTheSmallestMargin() {
        // T = 0.8: pass over 50 % margin log10(1.6) = 0.204; pass over 79 % margin log10(0.8/0.79) = 0.00546;
        // 300 nm outside the range: unverified, NaN margin, ignored for the worst margin
        SampleEvaluation e = SampleEvaluator.evaluate(sheet(2), require(ThicknessSpec.AS_MEASURED,
                ClauseEvaluatorTest.point(Direction.PASS, 405, 0.5),
                ClauseEvaluatorTest.point(Direction.PASS, 405, 0.79),
                ClauseEvaluatorTest.point(Direction.PASS, 300, 0.5)));
        assertThat(e.verdict()).isEqualTo(Verdict.UNVERIFIED);
        assertThat(e.bindingClauseIndex()).isEqualTo(1);
        assertThat(e.worstMarginDecades()).isCloseTo(Math.log10(0.8 / 0.79), within(1e-12));
        SampleEvaluation misses = SampleEvaluator.evaluate(sheet(2), require(ThicknessSpec.AS_MEASURED,
                ClauseEvaluatorTest.point(Direction.PASS, 300, 0.5),
                ClauseEvaluatorTest.point(Direction.BLOCK, 405, 0.5)));
        assertThat(misses.verdict()).isEqualTo(Verdict.MISSES);
    }

    @Test
    void bulkCandidateWithoutARefractiveIndexIsRejectedNamingTheSample() {
        org.assertj.core.api.Assertions.assertThatIllegalArgumentException()
                .isThrownBy(() -> new Candidate(42, 1, "illustrative", EIGHTY, 2, true, null))
                .withMessageContaining("sample 42");
    }

    @Test
    void negativeThicknessIsRejectedQuotingTheValue() {
        org.assertj.core.api.Assertions.assertThatIllegalArgumentException()
                .isThrownBy(() -> new Candidate(43, 1, "illustrative", EIGHTY, -1, false, null))
                .withMessageContaining("-1.0");
    }
}
