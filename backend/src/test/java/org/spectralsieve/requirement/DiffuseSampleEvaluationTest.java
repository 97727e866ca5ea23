package org.spectralsieve.requirement;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import java.util.Optional;
import java.util.stream.IntStream;
import org.junit.jupiter.api.Test;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.spectrum.Curve;

/**
 * Samples measured in total geometry (scattered light included) against a requirement: never rescaled by
 * Beer–Lambert (scatter is not absorption; thickness conversion fails for diffuse materials, PRACTICE.md
 * [S47]), and not judged on see-through clauses unless the requirement accepts total transmittance.
 */
class DiffuseSampleEvaluationTest {

    private static final String DIFFUSE = "diffuse sample (total transmittance): scatter is not absorption, so it is not rescaled";

    /** T = 0.80 from 360 to 800 nm: its luminous transmittance is 0.80 for any weighting (a weighted mean of a constant). */
    private static final Curve FLAT_EIGHTY = Curve.of(IntStream.rangeClosed(0, 44).mapToDouble(i -> 360 + 10 * i).toArray(),
            IntStream.rangeClosed(0, 44).mapToDouble(i -> 0.8).toArray(), 0);

    private static final WeightedClause LUMINOUS_OVER_70 =
            new WeightedClause(Direction.PASS, 0.7, ThresholdUnit.PERCENT, Weighting.luminous(), "luminous over 70%");
    private static final Clause PASSES_405 = ClauseEvaluatorTest.point(Direction.PASS, 405, 0.5);

    private static Candidate diffuse(double mm) {
        return new Candidate(9, 90, "illustrative opal sheet", FLAT_EIGHTY, mm, false, new ConstantIndex(1.49), true, DIFFUSE);
    }

    private static Candidate clear(double mm) {
        return new Candidate(10, 100, "illustrative clear sheet", FLAT_EIGHTY, mm, true, new ConstantIndex(1.49));
    }

    private static Requirement require(ThicknessSpec thickness, String geometry, Clause... clauses) {
        return new Requirement(List.of(clauses), thickness, Optional.empty(), Optional.ofNullable(geometry), "");
    }

    @Test
    void aDiffuseSampleAtAnotherThicknessIsUnverifiedWithTheReason() {
        SampleEvaluation e = SampleEvaluator.evaluate(diffuse(3), require(ThicknessSpec.at(6), null, PASSES_405));

        assertThat(e.verdict()).isEqualTo(Verdict.UNVERIFIED);
        assertThat(e.thicknessMm()).isEqualTo(3);
        assertThat(e.clauses().get(0).explanation()).startsWith(DIFFUSE).contains("measured at 3 mm").contains("6 mm");
    }

    @Test
    void aThicknessRangeIsNeverSolvedForADiffuseSample() {
        SampleEvaluation outside = SampleEvaluator.evaluate(diffuse(3), require(ThicknessSpec.range(4, 8), null, PASSES_405));
        assertThat(outside.verdict()).isEqualTo(Verdict.UNVERIFIED);
        assertThat(outside.feasibleMm()).isNull();
        assertThat(outside.clauses().get(0).explanation()).startsWith(DIFFUSE);

        // inside the range it is judged where it was measured, like any part that keeps its own thickness
        SampleEvaluation inside = SampleEvaluator.evaluate(diffuse(3), require(ThicknessSpec.range(2, 8), null, PASSES_405));
        assertThat(inside.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(inside.thicknessMm()).isEqualTo(3);
        assertThat(inside.feasibleMm()).isNull();
    }

    @Test
    void aDiffuseSampleCannotMeetALuminousClause() {
        SampleEvaluation e = SampleEvaluator.evaluate(diffuse(3), require(ThicknessSpec.AS_MEASURED, null, LUMINOUS_OVER_70));

        ClauseResult luminous = e.clauses().get(0);
        assertThat(luminous.verdict()).isEqualTo(Verdict.UNVERIFIED);
        assertThat(luminous.marginDecades()).isNaN();
        assertThat(luminous.explanation()).contains("total transmittance").contains("geometry any");
        // the figure itself is kept for the reader: τv of a flat 80 % curve is 0.80
        assertThat(luminous.value()).isCloseTo(0.8, within(1e-9));
    }

    @Test
    void geometryAnyOrTotalAcceptsTotalTransmittanceForALuminousClause() {
        for (String geometry : new String[] {"any", "total"}) {
            SampleEvaluation e = SampleEvaluator.evaluate(diffuse(3),
                    require(ThicknessSpec.AS_MEASURED, geometry, LUMINOUS_OVER_70));
            assertThat(e.verdict()).as(geometry).isEqualTo(Verdict.MEETS);
        }
    }

    @Test
    void aRegularSampleIsJudgedOnItsLuminousTransmittanceAsBefore() {
        SampleEvaluation e = SampleEvaluator.evaluate(clear(3), require(ThicknessSpec.AS_MEASURED, null, LUMINOUS_OVER_70));
        assertThat(e.verdict()).isEqualTo(Verdict.MEETS);
    }

    @Test
    void onlyLuminousTransmittanceIsASeeThroughClause() {
        assertThat(SeeThrough.needsRegular(LUMINOUS_OVER_70)).isTrue();
        assertThat(SeeThrough.needsRegular(PASSES_405)).isFalse();
        // a band clause on a diffuse sample is judged on its total transmittance (light reaching a resin or a mask)
        SampleEvaluation e = SampleEvaluator.evaluate(diffuse(3), require(ThicknessSpec.AS_MEASURED, null, PASSES_405));
        assertThat(e.verdict()).isEqualTo(Verdict.MEETS);
    }

    @Test
    void aCandidateCannotBeBothRescaledAndHeldAtItsThickness() {
        org.assertj.core.api.Assertions.assertThatThrownBy(() -> new Candidate(1, 1, "x", FLAT_EIGHTY, 1, true,
                new ConstantIndex(1.5), true, DIFFUSE)).isInstanceOf(IllegalArgumentException.class);
    }
}
