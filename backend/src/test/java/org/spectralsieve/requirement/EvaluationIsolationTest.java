package org.spectralsieve.requirement;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.optics.UnusableIndex;
import org.spectralsieve.spectrum.Curve;

/**
 * A sample whose stored numbers defeat the computation is judged UNVERIFIED with the reason, and the
 * samples beside it are judged as usual (docs/validation.md).
 */
class EvaluationIsolationTest {

    private static final Curve EIGHTY = Curve.of(new double[] {400, 410}, new double[] {0.8, 0.8}, 0);
    private static final Requirement AT_5MM = new Requirement(
            List.of(ClauseEvaluatorTest.point(Direction.PASS, 405, 0.5)), ThicknessSpec.at(5), Optional.empty(),
            Optional.empty(), "");

    @Test
    void aSampleWhoseIndexCannotBeUsedIsUnverifiedWithTheReasonInsteadOfFailing() {
        Candidate bad = new Candidate(1, 10, "illustrative bad sheet", EIGHTY, 2, true,
                new UnusableIndex("constant n = 1.0E16", "refractive index n must be from 1.0 to 4.0"));

        SampleEvaluation e = SampleEvaluator.evaluate(bad, AT_5MM);

        assertThat(e.verdict()).isEqualTo(Verdict.UNVERIFIED);
        assertThat(e.clauses().get(0).explanation()).startsWith("could not be computed: ")
                .contains("constant n = 1.0E16");
    }

    @Test
    void theSamplesBesideAFailingOneAreStillJudgedAndRanked() {
        Candidate bad = new Candidate(1, 10, "illustrative bad sheet", EIGHTY, 2, true,
                new UnusableIndex("constant n = 1.0E16", "out of range"));
        Candidate good = new Candidate(2, 20, "illustrative good sheet", EIGHTY, 2, true, new ConstantIndex(1.5));

        List<MaterialEvaluation> judged = List.of(
                MaterialEvaluation.of(bad, SampleEvaluator.evaluate(bad, AT_5MM)),
                MaterialEvaluation.of(good, SampleEvaluator.evaluate(good, AT_5MM)));
        List<RankedRow> rows = Ranking.rank(judged, 10);

        // REFERENCE §7 worked example: T(2 mm) = 0.80, n = 1.5 → T(5 mm) = 0.645573, above 0.5
        assertThat(rows.get(0).materialName()).isEqualTo("illustrative good sheet");
        assertThat(rows.get(0).evaluation().verdict()).isEqualTo(Verdict.MEETS);
        assertThat(rows.get(1).evaluation().verdict()).isEqualTo(Verdict.UNVERIFIED);
    }
}
