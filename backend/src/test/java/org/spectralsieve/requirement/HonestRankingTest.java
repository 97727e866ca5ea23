package org.spectralsieve.requirement;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.spectrum.Curve;

/**
 * Misses ranked by what the data show, the clause a miss fails, and rows with nothing judged kept last
 * (the order is our own definition, docs/ranking.md). Margins are decades by definition: log10 of the
 * ratio of T to the threshold.
 */
class HonestRankingTest {

    private static final double[] NM = {360, 365, 370};
    private static final TransmittanceClause PASS_80_AT_365 = ClauseEvaluatorTest.point(Direction.PASS, 365, 0.8);

    private static Requirement require(ThicknessSpec thickness, Clause... clauses) {
        return new Requirement(List.of(clauses), thickness, Optional.empty(), Optional.empty(), "");
    }

    private static Candidate sheet(long id, String name, Curve curve) {
        return new Candidate(id, id * 10, name, curve, 3, true, new ConstantIndex(1.5));
    }

    /** T read as 1 % everywhere: a value, not a bound. */
    private static Curve measured(double t) {
        return Curve.of(NM, new double[] {t, t, t}, 0);
    }

    /** Nothing detected: every point under a detection limit of {@code limit}. */
    private static Curve underDetection(double limit) {
        return Curve.of(NM, new double[] {0, 0, 0}, limit);
    }

    @Test
    void aMissShownOnlyByABoundAt8Point94PercentRanksAfterAMeasuredMissAt1Percent() {
        // bound: margin at most log10(0.0894 / 0.8) = -0.952; measured: log10(0.01 / 0.8) = -1.903.
        // By margin alone the bound would rank first although its T may be anything under 8.94 %.
        List<RankedRow> rows = Ranking.evaluateAndRank(List.of(
                sheet(1, "lid under detection", underDetection(0.0894)),
                sheet(2, "dark sheet", measured(0.01))), require(ThicknessSpec.AS_MEASURED, PASS_80_AT_365), 10);

        assertThat(rows).extracting(RankedRow::materialName).containsExactly("dark sheet", "lid under detection");
        SampleEvaluation bounded = rows.get(1).evaluation();
        assertThat(bounded.verdict()).isEqualTo(Verdict.MISSES);
        assertThat(bounded.standing()).isEqualTo(Standing.MISSES_ON_BOUND);
        assertThat(bounded.worstMarginDecades()).isCloseTo(Math.log10(0.0894 / 0.8), within(1e-12));
        assertThat(rows.get(0).evaluation().worstMarginDecades()).isCloseTo(Math.log10(0.01 / 0.8), within(1e-12));
    }

    @Test
    void aMissShownByABoundStillRanksAfterAMeasuredMissAt50Percent() {
        List<RankedRow> rows = Ranking.evaluateAndRank(List.of(
                sheet(1, "lid under detection", underDetection(0.0894)),
                sheet(2, "tinted sheet", measured(0.5))), require(ThicknessSpec.AS_MEASURED, PASS_80_AT_365), 10);

        assertThat(rows).extracting(r -> r.evaluation().standing())
                .containsExactly(Standing.MISSES, Standing.MISSES_ON_BOUND);
    }

    @Test
    void boundedMissesAmongThemselvesRankByTheirBound() {
        List<RankedRow> rows = Ranking.evaluateAndRank(List.of(
                sheet(1, "lid a", underDetection(0.001)),
                sheet(2, "lid b", underDetection(0.05))), require(ThicknessSpec.AS_MEASURED, PASS_80_AT_365), 10);

        assertThat(rows).extracting(RankedRow::materialName).containsExactly("lid b", "lid a");
    }

    @Test
    void theBindingClauseOfAMissIsTheClauseItFailsNotOneItCannotVerify() {
        // block under 0.01 % with a detection limit of 0.1 %: unverified, margin log10(1e-4 / 1e-3) = -1 (a
        // lower bound); pass over 80 % with T = 70 %: fails, margin log10(0.7 / 0.8) = -0.058
        Curve curve = Curve.of(new double[] {300, 600}, new double[] {0.0005, 0.7}, new boolean[] {true, false},
                new double[] {0.001, 0.001});
        SampleEvaluation e = SampleEvaluator.evaluate(sheet(1, "clear sheet", curve), require(ThicknessSpec.AS_MEASURED,
                ClauseEvaluatorTest.point(Direction.BLOCK, 300, 0.0001), ClauseEvaluatorTest.point(Direction.PASS, 600, 0.8)));

        assertThat(e.clauses()).extracting(ClauseResult::verdict).containsExactly(Verdict.UNVERIFIED, Verdict.MISSES);
        assertThat(e.bindingClauseIndex()).isEqualTo(1);
        assertThat(e.worstMarginDecades()).isCloseTo(Math.log10(0.7 / 0.8), within(1e-12));
        assertThat(e.standing()).isEqualTo(Standing.MISSES);
    }

    @Test
    void rowsWithNoClauseJudgedComeAfterEveryMissAndNeverTakeAJudgedRowsPlace() {
        // a part that is not rescaled (coating) measured at 0.1 mm, asked at 3 mm: nothing can be judged
        Candidate coating = new Candidate(1, 10, "coated film", measured(0.9), 0.1, false, null);
        Candidate dark = sheet(2, "dark sheet", measured(0.0001));
        Requirement r = require(ThicknessSpec.at(3), PASS_80_AT_365);

        List<RankedRow> all = Ranking.evaluateAndRank(List.of(coating, dark), r, 10);
        List<RankedRow> first = Ranking.evaluateAndRank(List.of(coating, dark), r, 1);

        assertThat(all).extracting(row -> row.evaluation().standing())
                .containsExactly(Standing.MISSES, Standing.NOT_JUDGED);
        assertThat(all.get(1).evaluation().verdict()).isEqualTo(Verdict.UNVERIFIED);
        assertThat(first).extracting(RankedRow::materialName).containsExactly("dark sheet");
    }

    @Test
    void aBandOutsideTheMeasuredRangeIsNotJudgedButABoundThatCannotShowAPassIsUnverifiedOnData() {
        Requirement r = require(ThicknessSpec.AS_MEASURED, ClauseEvaluatorTest.point(Direction.PASS, 365, 0.001));
        SampleEvaluation outside = SampleEvaluator.evaluate(sheet(1, "visible-only file",
                Curve.of(new double[] {400, 700}, new double[] {0.9, 0.9}, 0)), r);
        SampleEvaluation bounded = SampleEvaluator.evaluate(sheet(2, "lid", underDetection(0.0894)), r);

        assertThat(outside.standing()).isEqualTo(Standing.NOT_JUDGED);
        assertThat(bounded.standing()).isEqualTo(Standing.UNVERIFIED);
    }

    @Test
    void groupsShowBothKindsOfMissAsOneGroupWithTheBoundMarked() {
        assertThat(Standing.MISSES.group()).isEqualTo("misses");
        assertThat(Standing.MISSES_ON_BOUND.group()).isEqualTo("misses");
        assertThat(Standing.MISSES_ON_BOUND.marginIsBound()).isTrue();
        assertThat(Standing.MISSES.marginIsBound()).isFalse();
        assertThat(Standing.NOT_JUDGED.group()).isEqualTo("not-judged");
        assertThat(Standing.heading("not-judged")).doesNotContain("fixed layer");
    }
}
