package org.spectralsieve.requirement;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.spectralsieve.spectrum.Curve;

/**
 * The confidence of a clause verdict: the probability that the true value meets the threshold, with a
 * Gaussian error of the stored σ in absorbance. Every expected number is worked by hand in the comments;
 * Φ values from the NIST/SEMATECH e-Handbook of Statistical Methods, §1.3.6.7.1 (table of the standard
 * normal distribution): Φ(1.645) = 0.9500, Φ(1) = 0.8413, Φ(−1) = 0.1587. Curves are illustrative.
 */
class ClauseConfidenceTest {

    /** T with absorbance 0.671: 10^−0.671 = 0.213304. Against 10 % (A_t = 1): (1 − 0.671)/0.2 = 1.645 σ. */
    private static final double T_A0671 = Math.pow(10, -0.671);

    private static TransmittanceClause pass(Band band, Aggregate aggregate, double threshold) {
        return new TransmittanceClause(Direction.PASS, aggregate, band, threshold, ThresholdUnit.PERCENT, "illustrative pass");
    }

    private static TransmittanceClause block(Band band, double threshold) {
        return new TransmittanceClause(Direction.BLOCK, Aggregate.EVERY_POINT, band, threshold, ThresholdUnit.PERCENT,
                "illustrative block");
    }

    private static Curve curve(double[] nm, double[] t, double[] sigmaA) {
        return Curve.of(nm, t, 0).withAbsorbanceUncertainty(sigmaA);
    }

    /** T = 21.33 % (A = 0.671) at 400 and 410 nm, σ_A 0.1 and 0.3: at 405 nm σ_A is interpolated to 0.2. */
    private static Curve flatAt0671() {
        return curve(new double[] {400, 410}, new double[] {T_A0671, T_A0671}, new double[] {0.1, 0.3});
    }

    @Test
    void aPassOnePointSixFourFiveSigmaClearOfItsThresholdIsNinetyFivePercentSure() {
        // A = 0.671, A_t = −log10 0.1 = 1, σ_A = 0.2 (midway between 0.1 and 0.3): P = Φ((1 − 0.671)/0.2) = Φ(1.645) = 0.9500
        ClauseResult r = ClauseEvaluator.evaluate(pass(Band.at(405), Aggregate.EVERY_POINT, 0.10), flatAt0671());

        assertThat(r.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(r.confidence().getAsDouble()).isCloseTo(0.9500, within(1e-4));
        assertThat(r.confidenceText()).isEqualTo("95 % confidence it holds");
    }

    @Test
    void aBlockOneSigmaUnderItsThresholdIsEightyFourPercentSure() {
        // T = 10^−2.2 = 0.631 % against 1 % (A_t = 2), σ_A = 0.2: P(A ≥ 2) = Φ((2.2 − 2)/0.2) = Φ(1) = 0.8413
        Curve c = curve(new double[] {400, 410}, new double[] {Math.pow(10, -2.2), Math.pow(10, -2.2)},
                new double[] {0.2, 0.2});
        ClauseResult r = ClauseEvaluator.evaluate(block(Band.at(405), 0.01), c);

        assertThat(r.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(r.confidence().getAsDouble()).isCloseTo(0.8413, within(1e-4));
        // shown rounded down, never surer than computed: 84.13 % → "84.1 %"
        assertThat(r.confidenceText()).isEqualTo("84.1 % confidence it holds");
    }

    @Test
    void aMissOneSigmaShortIsSixteenPercentLikelyToHoldAfterAll() {
        // A = 1.2 (T = 6.31 %) against a pass over 10 % (A_t = 1), σ_A = 0.2: P = Φ((1 − 1.2)/0.2) = Φ(−1) = 0.1587
        Curve c = curve(new double[] {400, 410}, new double[] {Math.pow(10, -1.2), Math.pow(10, -1.2)},
                new double[] {0.2, 0.2});
        ClauseResult r = ClauseEvaluator.evaluate(pass(Band.at(405), Aggregate.EVERY_POINT, 0.10), c);

        assertThat(r.verdict()).isEqualTo(Verdict.MISSES);
        assertThat(r.confidence().getAsDouble()).isCloseTo(0.1587, within(1e-4));
    }

    @Test
    void aBandJudgedAtEveryPointGetsTheBonferroniBoundOverItsReadings() {
        // readings at 400, 405 and 410 nm, each P = Φ(1.645) = 0.95: 1 − 3 × (1 − 0.95) = 0.85, whatever the correlation
        Curve c = curve(new double[] {400, 405, 410}, new double[] {T_A0671, T_A0671, T_A0671},
                new double[] {0.2, 0.2, 0.2});
        ClauseResult r = ClauseEvaluator.evaluate(pass(new Band(400, 410), Aggregate.EVERY_POINT, 0.10), c);

        assertThat(r.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(r.confidence().getAsDouble()).isCloseTo(0.85, within(3e-4));
    }

    @Test
    void aBandMeanTakesFullyCorrelatedErrorsInTransmittance() {
        // T 0.80 at 360 nm and 0.90 at 370 nm, σ_A 0.01: mean 0.85; σ_T = T·ln10·σ_A, so
        // σ_mean = ½(0.80 + 0.90)·2.302585·0.01 = 0.0195720; over 83 %: z = 0.02/0.0195720 = 1.02187,
        // Φ(1.02187) = 0.8466 (between the table's Φ(1.02) = 0.84614 and Φ(1.03) = 0.84849)
        Curve c = curve(new double[] {360, 370}, new double[] {0.80, 0.90}, new double[] {0.01, 0.01});
        ClauseResult r = ClauseEvaluator.evaluate(pass(new Band(360, 370), Aggregate.MEAN, 0.83), c);

        assertThat(r.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(r.value()).isCloseTo(0.85, within(1e-12));
        assertThat(r.confidence().getAsDouble()).isCloseTo(0.8466, within(1e-4));
    }

    @Test
    void theUncertaintyReachesTheVerdictThroughResampling() {
        // resampled onto a finer grid, σ_A is interpolated like the absorbance: still 0.2 at 405 nm, P still 0.9500
        Curve resampled = flatAt0671().resampleAt(new double[] {400, 402.5, 405, 407.5, 410});
        ClauseResult r = ClauseEvaluator.evaluate(pass(Band.at(405), Aggregate.EVERY_POINT, 0.10), resampled);

        assertThat(r.confidence().getAsDouble()).isCloseTo(0.9500, within(1e-4));
    }

    @Test
    void theBoundedCopiesOfACurveKeepItsUncertainty() {
        // raising a below-detection point to its limit (or lowering it to 0) moves a value, not the measurement's σ
        Curve c = Curve.of(new double[] {400, 405, 410}, new double[] {0.0005, 0.0002, 0.0005}, 0.001)
                .withAbsorbanceUncertainty(new double[] {0.05, 0.07, Double.NaN});

        assertThat(JudgedCurves.upperBounds(c).absorbanceUncertainties()).containsExactly(0.05, 0.07, Double.NaN);
        assertThat(JudgedCurves.lowerBounds(c).absorbanceUncertainties()).containsExactly(0.05, 0.07, Double.NaN);
    }

    @Test
    void withoutAStoredUncertaintyTheConfidenceIsUnknownNotInvented() {
        Curve bare = Curve.of(new double[] {400, 410}, new double[] {0.5, 0.5}, 0);
        ClauseResult r = ClauseEvaluator.evaluate(pass(Band.at(405), Aggregate.EVERY_POINT, 0.10), bare);

        assertThat(r.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(r.confidence()).isEmpty();
        assertThat(r.confidenceText()).isEqualTo("confidence unknown");
    }

    @Test
    void oneReadingWithoutAnUncertaintyLeavesTheBandsConfidenceUnknown() {
        Curve c = curve(new double[] {400, 405, 410}, new double[] {0.5, 0.5, 0.5}, new double[] {0.01, Double.NaN, 0.01});
        assertThat(ClauseEvaluator.evaluate(pass(new Band(400, 410), Aggregate.EVERY_POINT, 0.10), c).confidence()).isEmpty();
        assertThat(ClauseEvaluator.evaluate(pass(new Band(400, 410), Aggregate.MEAN, 0.10), c).confidence()).isEmpty();
    }

    @Test
    void aBlockProvenByADetectionLimitHasNoGaussianConfidence() {
        // 405 nm lies below the 0.1 % detection limit: the true T is only known to be under it
        Curve c = Curve.of(new double[] {400, 405, 410}, new double[] {0.0005, 0.0002, 0.0005}, 0.001)
                .withAbsorbanceUncertainty(new double[] {0.05, 0.05, 0.05});
        ClauseResult r = ClauseEvaluator.evaluate(block(Band.at(405), 0.01), c);

        assertThat(r.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(r.valueIsBound()).isTrue();
        assertThat(r.confidence()).isEmpty();
    }

    @Test
    void cutoffsAndBandsReachingOutsideTheRangeHaveNoConfidence() {
        Curve c = curve(new double[] {380, 390, 400}, new double[] {0.01, 0.5, 0.9}, new double[] {0.05, 0.05, 0.05});
        ClauseResult cutoff = ClauseEvaluator.evaluate(new CutoffClause(0.5, new Band(385, 395), "illustrative cutoff"), c);
        ClauseResult outside = ClauseEvaluator.evaluate(pass(new Band(395, 420), Aggregate.EVERY_POINT, 0.5), c);

        assertThat(cutoff.confidence()).isEmpty();
        assertThat(outside.verdict()).isEqualTo(Verdict.UNVERIFIED);
        assertThat(outside.confidence()).isEmpty();
    }

    // ---- "… with N% confidence" ----

    private static TransmittanceClause demanding(double fraction) {
        return pass(Band.at(405), Aggregate.EVERY_POINT, 0.10).withConfidenceDemand(fraction, "illustrative demand");
    }

    @Test
    void aClauseMeetsItsConfidenceDemandWhenSureEnough() {
        // P = Φ(1.645) = 0.9500 ≥ 90 %
        ClauseResult r = ClauseEvaluator.evaluate(demanding(0.90), flatAt0671());

        assertThat(r.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(r.explanation()).endsWith("; 95 % confident (90 % confidence asked)");
    }

    @Test
    void aValueThatMeetsButLessSurelyThanAskedIsUnverifiedAndSaysHowSure() {
        // P = 0.9500 < 99 %: the reading meets, the demand does not
        ClauseResult r = ClauseEvaluator.evaluate(demanding(0.99), flatAt0671());

        assertThat(r.verdict()).isEqualTo(Verdict.UNVERIFIED);
        assertThat(r.explanation()).contains("meets on the measured value, but only 95 % confident of it (99 % confidence asked)");
        assertThat(r.confidence().getAsDouble()).isCloseTo(0.9500, within(1e-4));
        // log10(0.213304 / 0.1) = 0.329: the margin still ranks the row among the unverified
        assertThat(r.marginDecades()).isCloseTo(0.329, within(1e-9));
    }

    @Test
    void aConfidenceDemandOnACurveWithoutUncertaintyIsUnverified() {
        Curve bare = Curve.of(new double[] {400, 410}, new double[] {0.5, 0.5}, 0);
        ClauseResult r = ClauseEvaluator.evaluate(demanding(0.95), bare);

        assertThat(r.verdict()).isEqualTo(Verdict.UNVERIFIED);
        assertThat(r.explanation()).contains("95 % confidence asked, but the curve carries no measurement uncertainty here,"
                + " so the confidence is unknown");
    }

    @Test
    void aBlockProvenOnlyByADetectionLimitCannotMeetAConfidenceDemand() {
        // T at 405 nm is under the 0.1 % limit: the block under 1 % is proven, but no Gaussian says how surely
        Curve c = Curve.of(new double[] {400, 405, 410}, new double[] {0.0005, 0.0002, 0.0005}, 0.001)
                .withAbsorbanceUncertainty(new double[] {0.05, 0.05, 0.05});
        ClauseResult r = ClauseEvaluator.evaluate(block(Band.at(405), 0.01).withConfidenceDemand(0.95, "illustrative"), c);

        assertThat(r.verdict()).isEqualTo(Verdict.UNVERIFIED);
        assertThat(r.explanation()).contains("95 % confidence asked, but a reading is only a detection-limit bound,"
                + " which has no stated uncertainty, so the confidence is unknown");
    }

    @Test
    void aMissStaysAMissWhateverConfidenceIsAsked() {
        // A = 1.2 against A_t = 1: misses on the value, P = 0.1587 under every allowed demand
        Curve c = curve(new double[] {400, 410}, new double[] {Math.pow(10, -1.2), Math.pow(10, -1.2)},
                new double[] {0.2, 0.2});
        ClauseResult r = ClauseEvaluator.evaluate(demanding(0.5), c);

        assertThat(r.verdict()).isEqualTo(Verdict.MISSES);
    }

    // ---- ranking ----

    @Test
    void amongRowsOfEqualMarginTheMoreCertainRanksFirst() {
        // two illustrative sheets with the same reading (21.33 % at 405 nm, margin log10(2.1330) = 0.329 decades):
        // "alder" measured with σ_A 0.2 (P = 0.95), "birch" with σ_A 0.1 (P = Φ(3.29) = 0.9995), "cedar" with none
        Curve alder = curve(new double[] {400, 410}, new double[] {T_A0671, T_A0671}, new double[] {0.2, 0.2});
        Curve birch = curve(new double[] {400, 410}, new double[] {T_A0671, T_A0671}, new double[] {0.1, 0.1});
        Curve cedar = Curve.of(new double[] {400, 410}, new double[] {T_A0671, T_A0671}, 0);
        Requirement requirement = new Requirement(List.of(pass(Band.at(405), Aggregate.EVERY_POINT, 0.10)),
                ThicknessSpec.AS_MEASURED, Optional.empty(), Optional.empty(), "illustrative");
        List<Candidate> candidates = List.of(
                new Candidate(1, 10, "alder sheet", alder, 2, false, null),
                new Candidate(3, 30, "cedar sheet", cedar, 2, false, null),
                new Candidate(2, 20, "birch sheet", birch, 2, false, null));

        List<RankedRow> rows = Ranking.evaluateAndRank(candidates, requirement, 10);

        assertThat(rows).extracting(r -> r.evaluation().worstMarginDecades())
                .allSatisfy(m -> assertThat(m).isCloseTo(0.329, within(1e-9)));
        // by name alone alder would lead; the more certain birch does, and the unknown cedar comes last
        assertThat(rows).extracting(RankedRow::materialName).containsExactly("birch sheet", "alder sheet", "cedar sheet");
        assertThat(rows.get(0).evaluation().confidence()).isEqualTo(OptionalDouble.of(rows.get(0).evaluation()
                .clauses().get(0).confidence().getAsDouble()));
    }

    @Test
    void equalMarginsWithUnknownConfidencesKeepTheOrderByNameAndAKnownOneGoesFirst() {
        assertThat(RankingOrder.compare(Standing.MEETS, 0.2, OptionalDouble.empty(), "alder", 1,
                Standing.MEETS, 0.2, OptionalDouble.empty(), "birch", 2)).isNegative();
        assertThat(RankingOrder.compare(Standing.MEETS, 0.2, OptionalDouble.of(0.6), "birch", 2,
                Standing.MEETS, 0.2, OptionalDouble.empty(), "alder", 1)).isNegative();
        // the margin still comes first: a larger margin with a lower confidence ranks higher
        assertThat(RankingOrder.compare(Standing.MEETS, 0.3, OptionalDouble.of(0.6), "birch", 2,
                Standing.MEETS, 0.2, OptionalDouble.of(0.99), "alder", 1)).isNegative();
    }
}
