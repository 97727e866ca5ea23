package org.spectralsieve.requirement;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.spectrum.Curve;

/**
 * Rescaling stays inside the thicknesses a material exists in; the nearest measured sample speaks for each
 * thickness; one nominal-thickness rule; stock sizes recommended from the feasible interval.
 */
class MadeThicknessesTest {

    private static final ConstantIndex GLASS = new ConstantIndex(1.5);
    /** T = 0.80 at 2 mm, n = 1.5: REFERENCE §7 worked example (Modern Optical Engineering eq. 10.5 + Beer–Lambert). */
    private static final Curve EIGHTY = Curve.of(new double[] {400, 410}, new double[] {0.8, 0.8}, 0);
    /** The same absorber at 5 mm: T(5 mm) = 0.645573 by that worked example. */
    private static final Curve AT_FIVE = Curve.of(new double[] {400, 410}, new double[] {0.645573, 0.645573}, 0);

    private static Requirement require(ThicknessSpec thickness, Clause... clauses) {
        return new Requirement(List.of(clauses), thickness, Optional.empty(), Optional.empty(), "");
    }

    private static Clause pass(double t) {
        return ClauseEvaluatorTest.point(Direction.PASS, 405, t);
    }

    private static Candidate sample(long id, Curve curve, double mm, MadeThicknesses made) {
        return new Candidate(id, 70, "illustrative clear sheet", curve, mm, true, GLASS, made);
    }

    private static MadeThicknesses range(double lo, double hi, Double... stock) {
        return MadeThicknesses.of(List.of(stock), lo, hi, List.of());
    }

    @Test
    void aCoatedGlassMeasuredAt4point005mmIs4mm() {
        // common practice, no source: parts are named by nominal thickness; 4.005 mm lies within 2 % of 4 mm
        assertThat(NominalThickness.same(4.005, 4)).isTrue();
        assertThat(NominalThickness.same(2.013, 2)).isTrue();
        Candidate coated = new Candidate(9, 90, "illustrative coated glass", EIGHTY, 4.005, false, null);
        SampleEvaluation e = SampleEvaluator.evaluate(coated, require(ThicknessSpec.at(4), pass(0.75)));
        assertThat(e.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(e.thicknessMm()).isEqualTo(4.005);
    }

    @Test
    void aFilmIsNotTheNextFilmSize() {
        // 25 µm and 30 µm films differ by 20 %, far beyond a micrometer's two 1 µm steps
        assertThat(NominalThickness.same(0.025, 0.03)).isFalse();
        assertThat(NominalThickness.same(0.0254, 0.025)).isTrue();
    }

    @Test
    void rescalingAFilmToMillimetresIsUnverified() {
        Candidate film = new Candidate(5, 50, "illustrative amber film", EIGHTY, 0.025, true, GLASS,
                range(0.025, 0.125, 0.025, 0.05, 0.125));
        SampleEvaluation e = SampleEvaluator.evaluate(film, require(ThicknessSpec.at(6), pass(0.0001)));
        assertThat(e.verdict()).isEqualTo(Verdict.UNVERIFIED);
        assertThat(e.clauses().get(0).explanation()).isEqualTo("made only 0.025–0.125 mm thick, not 6 mm");
        assertThat(e.clauses().get(0).value()).isNaN();
    }

    @Test
    void aRangeOutsideTheMadeThicknessesIsUnverifiedNeverMet() {
        Candidate film = new Candidate(5, 50, "illustrative amber film", EIGHTY, 0.025, true, GLASS,
                range(0.025, 0.125));
        SampleEvaluation e = SampleEvaluator.evaluate(film, require(ThicknessSpec.range(1, 6), pass(0.0001)));
        assertThat(e.verdict()).isEqualTo(Verdict.UNVERIFIED);
        assertThat(e.feasibleMm()).isNull();
        assertThat(e.clauses().get(0).explanation()).startsWith("made only 0.025–0.125 mm thick");
    }

    @Test
    void withoutStatedThicknessesRescalingStaysWithinAFactorOfTwoOfTheMeasuredSamples() {
        MadeThicknesses assumed = MadeThicknesses.of(List.of(), Double.NaN, Double.NaN, List.of(0.05, 0.25));
        assertThat(assumed.basis()).isEqualTo(MadeThicknesses.Basis.ASSUMED);
        assertThat(assumed.loMm()).isEqualTo(0.025);
        assertThat(assumed.hiMm()).isEqualTo(0.5);
        assertThat(assumed.makes(0.4)).isTrue();
        assertThat(assumed.makes(2)).isFalse();
        assertThat(assumed.limitText()).contains("factor of 2").contains("0.025–0.5 mm");
    }

    @Test
    void onlyStockSizesExistWhenNoRangeIsStated() {
        MadeThicknesses stock = MadeThicknesses.of(List.of(3.0, 5.0), Double.NaN, Double.NaN, List.of(3.0));
        assertThat(stock.makes(5)).isTrue();
        assertThat(stock.makes(4)).isFalse();
        assertThat(stock.limitText()).isEqualTo("stocked only at 3, 5 mm");
    }

    @Test
    void aThicknessSolvedBetweenStockSizesIsJudgedAtTheBestStockSize() {
        // T(2 mm) = 0.80 → T(5 mm) = 0.645573 (REFERENCE §7): over 64 % holds up to a bit past 5 mm
        Candidate lid = sample(7, EIGHTY, 2, MadeThicknesses.of(List.of(3.0, 5.0, 8.0), Double.NaN, Double.NaN, List.of()));
        SampleEvaluation e = SampleEvaluator.evaluate(lid, require(ThicknessSpec.range(4, 10), pass(0.64)));
        assertThat(e.thicknessMm()).isEqualTo(5);
        assertThat(e.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(e.clauses().get(0).value()).isCloseTo(0.645573, within(1e-6));
    }

    @Test
    void theSolverRecommendsTheStockSizesInsideTheFeasibleIntervalBestMarginFirst() {
        Candidate sheet = sample(7, EIGHTY, 2, range(1, 12, 3.0, 5.0, 8.0));
        SampleEvaluation e = SampleEvaluator.evaluate(sheet, require(ThicknessSpec.range(1, 12), pass(0.64)));
        assertThat(e.verdict()).isEqualTo(Verdict.MEETS);
        // a pass condition falls with thickness: the feasible interval starts at the range's thin end
        assertThat(e.feasibleMm().loMm()).isEqualTo(1);
        assertThat(e.feasibleMm().hiMm()).isBetween(5.0, 8.0);
        assertThat(e.stockAdvice().inside()).extracting(StockAdvice.StockFit::thicknessMm).containsExactly(3.0, 5.0);
        assertThat(e.stockAdvice().closestMiss()).isNull();
        assertThat(e.stockAdvice().describe()).startsWith("stock sizes that meet, best margin first: 3 mm");
    }

    @Test
    void whenNoStockSizeIsInsideTheClosestOneAndItsShortfallAreNamed() {
        Candidate sheet = sample(7, EIGHTY, 2, range(1, 12, 8.0, 10.0));
        SampleEvaluation e = SampleEvaluator.evaluate(sheet, require(ThicknessSpec.range(1, 12), pass(0.64)));
        StockAdvice advice = e.stockAdvice();
        assertThat(advice.inside()).isEmpty();
        assertThat(advice.closestMiss().thicknessMm()).isEqualTo(8);
        assertThat(advice.closestMiss().verdict()).isEqualTo(Verdict.MISSES);
        assertThat(advice.missMm()).isCloseTo(8 - e.feasibleMm().hiMm(), within(1e-9));
        assertThat(advice.describe()).startsWith("no stock size meets; 8 mm comes closest: worst margin -");
    }

    @Test
    void aMeasurementAtTheAskedThicknessWinsOverRescalingAnotherSample() {
        // rescaling the 2 mm sample to 5 mm reads 0.645573 (REFERENCE §7) and would meet "over 62 %"; the
        // material's own 5 mm measurement reads 0.60 and misses: the measurement decides
        Curve fiveLower = Curve.of(new double[] {400, 410}, new double[] {0.60, 0.60}, 0);
        MadeThicknesses made = range(1, 12);
        List<Candidate> samples = List.of(sample(1, EIGHTY, 2, made), sample(2, fiveLower, 5, made));
        List<MaterialEvaluation> judged = MaterialJudge.evaluate(samples, require(ThicknessSpec.at(5), pass(0.62)),
                Optional.empty());
        assertThat(judged).hasSize(1);
        assertThat(judged.get(0).evaluation().sampleId()).isEqualTo(2);
        assertThat(judged.get(0).evaluation().verdict()).isEqualTo(Verdict.MISSES);
    }

    @Test
    void otherwiseTheNearestMeasuredThicknessByRatioIsUsed() {
        // spans meet at the geometric mean: √(2·6) = 3.4641 mm
        double[] measured = {2, 6};
        assertThat(MaterialJudge.span(2, measured).hiMm()).isCloseTo(Math.sqrt(12), within(1e-12));
        assertThat(MaterialJudge.span(6, measured).loMm()).isCloseTo(Math.sqrt(12), within(1e-12));
        MadeThicknesses made = range(1, 12);
        List<Candidate> samples = List.of(sample(1, EIGHTY, 2, made), sample(2, AT_FIVE, 6, made));
        List<MaterialEvaluation> at3 = MaterialJudge.evaluate(samples, require(ThicknessSpec.at(3), pass(0.5)), Optional.empty());
        List<MaterialEvaluation> at4 = MaterialJudge.evaluate(samples, require(ThicknessSpec.at(4), pass(0.5)), Optional.empty());
        assertThat(at3).extracting(m -> m.evaluation().sampleId()).containsExactly(1L);
        assertThat(at4).extracting(m -> m.evaluation().sampleId()).containsExactly(2L);
    }

    @Test
    void aStockSizeMetOnAnotherSampleIsExplainedByThatSamplesPieceOfTheInterval() {
        // two measurements of one material that disagree (T = 0.80 at 2 mm and at 8 mm: batches of different
        // clarity, illustrative): over 76 % holds on the 2 mm sample only up to ~2.7 mm (T(5 mm) = 0.645573 for
        // that absorber, REFERENCE §7), on the 8 mm sample over its whole span from √(2·8) = 4 mm to past 8 mm;
        // the 6 mm stock size meets on the 8 mm sample, outside the 2 mm sample's interval
        MadeThicknesses made = range(1, 12, 6.0, 11.0);
        Curve eightAtEight = Curve.of(new double[] {400, 410}, new double[] {0.8, 0.8}, 0);
        List<MaterialEvaluation> rows = MaterialJudge.evaluate(
                List.of(sample(1, EIGHTY, 2, made), sample(2, eightAtEight, 8, made)),
                require(ThicknessSpec.range(1, 12), pass(0.76)), Optional.empty());
        SampleEvaluation thin = rows.stream().map(MaterialEvaluation::evaluation).filter(e -> e.sampleId() == 1)
                .findFirst().orElseThrow();
        SampleEvaluation thick = rows.stream().map(MaterialEvaluation::evaluation).filter(e -> e.sampleId() == 2)
                .findFirst().orElseThrow();
        assertThat(thin.feasibleMm().hiMm()).isBetween(2.0, 3.0);
        assertThat(thin.stockAdvice().inside()).extracting(StockAdvice.StockFit::thicknessMm).containsExactly(6.0);
        assertThat(thin.stockAdvice().elsewhere()).singleElement()
                .satisfies(piece -> assertThat(piece.contains(6)).isTrue())
                .satisfies(piece -> assertThat(piece.loMm()).isCloseTo(4, within(1e-6)));
        assertThat(thin.stockAdvice().describe())
                .startsWith("stock sizes that meet, best margin first: 6 mm")
                .contains("; the material's other samples meet at 4–");
        // and the other way round: the thick sample's row names the thin sample's piece
        assertThat(thick.stockAdvice().elsewhere()).singleElement()
                .satisfies(piece -> assertThat(piece).isEqualTo(thin.feasibleMm()));
    }

    @Test
    void anUnverifiedClosestStockSizeIsNotWordedAsANearMeet() {
        StockAdvice advice = new StockAdvice(List.of(),
                new StockAdvice.StockFit(2, Verdict.UNVERIFIED, 0.03004), Double.NaN);
        assertThat(advice.describe()).isEqualTo("no stock size is proven to meet; 2 mm comes closest: unverified there "
                + "(no clause fails, but the data cannot show every clause; worst margin 0.03004 decades on what they show)");
        StockAdvice missed = new StockAdvice(List.of(), new StockAdvice.StockFit(2, Verdict.MISSES, -0.12), 0.35);
        assertThat(missed.describe()).isEqualTo("no stock size meets; 2 mm comes closest: worst margin -0.12 decades, "
                + "0.35 mm outside the feasible interval");
    }

    @Test
    void theFeasibleIntervalSpansTheSamplesThatSpeakForItsParts() {
        // two measurements of one Beer–Lambert absorber (T = 0.80 at 2 mm, 0.645573 at 5 mm, REFERENCE §7):
        // judged piecewise, each over its own span, the joined interval is what one sample alone gives
        MadeThicknesses made = range(1, 12);
        Requirement r = require(ThicknessSpec.range(1, 12), pass(0.6));
        List<MaterialEvaluation> piecewise = MaterialJudge.evaluate(
                List.of(sample(1, EIGHTY, 2, made), sample(2, AT_FIVE, 5, made)), r, Optional.empty());
        SampleEvaluation alone = SampleEvaluator.evaluate(sample(1, EIGHTY, 2, made), r);
        MaterialEvaluation best = Ranking.rank(piecewise, 1).stream().findFirst()
                .map(row -> new MaterialEvaluation(row.materialId(), row.materialName(), row.evaluation())).orElseThrow();
        assertThat(best.evaluation().feasibleMm().loMm()).isEqualTo(alone.feasibleMm().loMm());
        assertThat(best.evaluation().feasibleMm().hiMm()).isCloseTo(alone.feasibleMm().hiMm(), within(1e-4));
    }

    @Test
    void aCoatedPartMeasuredElsewhereIsNamedACoatedPartNotAFixedLayer() {
        Candidate coated = new Candidate(9, 90, "illustrative coated quartz", EIGHTY, 2.013, false, null);
        SampleEvaluation e = SampleEvaluator.evaluate(coated, require(ThicknessSpec.at(6), pass(0.5)));
        assertThat(e.clauses().get(0).explanation())
                .isEqualTo("coated/laminated part, measured only at 2.013 mm; not rescalable to 6 mm")
                .doesNotContain("fixed layer");
    }
}
