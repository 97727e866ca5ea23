package org.spectralsieve.requirement;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.spectralsieve.spectrum.Curve;

/**
 * Clause judgements on small synthetic curves worked by hand. Margins are decades by definition
 * (OD = −log10 T, so log10 of a ratio of transmittances); absorbance interpolation is the curve's own
 * rule (midway between two points T is their geometric mean).
 */
class ClauseEvaluatorTest {

    private static final double TOL = 1e-9;

    static TransmittanceClause point(Direction direction, double nm, double threshold) {
        return new TransmittanceClause(direction, Aggregate.EVERY_POINT, Band.at(nm), threshold, ThresholdUnit.PERCENT,
                direction + " " + threshold + " at " + nm);
    }

    static TransmittanceClause band(Direction direction, Aggregate aggregate, double from, double to, double threshold) {
        return new TransmittanceClause(direction, aggregate, new Band(from, to), threshold, ThresholdUnit.PERCENT,
                direction + " " + aggregate + " " + threshold + " from " + from + " to " + to);
    }

    @Test
    void blockAtOnePointMissesWithTheReadingAndThresholdInWords() {
        Curve curve = Curve.of(new double[] {400, 405, 410}, new double[] {0.02, 0.031, 0.05}, 0);
        ClauseResult r = ClauseEvaluator.evaluate(point(Direction.BLOCK, 405, 0.01), curve);
        assertThat(r.verdict()).isEqualTo(Verdict.MISSES);
        assertThat(r.value()).isEqualTo(0.031);
        // log10(0.01 / 0.031) = −0.491362
        assertThat(r.marginDecades()).isCloseTo(-0.491362, within(1e-6));
        assertThat(r.explanation()).isEqualTo("T at 405 nm is 3.1 %, needs under 1 %");
        assertThat(r.valueIsBound()).isFalse();
    }

    @Test
    void passAtOnePointMeetsWithPositiveMargin() {
        Curve curve = Curve.of(new double[] {360, 370}, new double[] {0.9, 0.9}, 0);
        ClauseResult r = ClauseEvaluator.evaluate(point(Direction.PASS, 365, 0.8), curve);
        assertThat(r.verdict()).isEqualTo(Verdict.MEETS);
        // log10(0.9 / 0.8) = 0.051153
        assertThat(r.marginDecades()).isCloseTo(0.051153, within(1e-6));
    }

    @Test
    void blockBandIsDecidedByItsHighestStoredPoint() {
        Curve curve = Curve.of(new double[] {300, 310, 320, 330, 340}, new double[] {0.001, 0.002, 0.02, 0.003, 0.001}, 0);
        ClauseResult r = ClauseEvaluator.evaluate(band(Direction.BLOCK, Aggregate.EVERY_POINT, 305, 335, 0.01), curve);
        assertThat(r.verdict()).isEqualTo(Verdict.MISSES);
        assertThat(r.value()).isEqualTo(0.02);
        assertThat(r.explanation()).isEqualTo("highest T in 305–335 nm (at 320 nm) is 2 %, needs under 1 %");
    }

    @Test
    void passBandIsDecidedByAnInterpolatedBandEndWhenThatIsLowest() {
        // 305 nm lies midway between 0.5 (300) and 0.9 (310): T = sqrt(0.5 · 0.9) = 0.670820 in absorbance
        Curve curve = Curve.of(new double[] {300, 310, 320, 330, 340}, new double[] {0.5, 0.9, 0.9, 0.9, 0.9}, 0);
        ClauseResult r = ClauseEvaluator.evaluate(band(Direction.PASS, Aggregate.EVERY_POINT, 305, 340, 0.8), curve);
        assertThat(r.verdict()).isEqualTo(Verdict.MISSES);
        assertThat(r.value()).isCloseTo(0.670820, within(1e-6));
        assertThat(r.explanation()).startsWith("lowest T in 305–340 nm (at 305 nm) is 67.1 %");
    }

    @Test
    void meanOfALinearRampIsItsMidpointValue() {
        // T = 0.2 at 300 nm rising linearly to 0.8 at 400 nm: the trapezoid rule is exact on a straight line,
        // mean = (0.2 + 0.8) / 2 = 0.5
        double[] nm = new double[11];
        double[] t = new double[11];
        for (int i = 0; i <= 10; i++) {
            nm[i] = 300 + 10 * i;
            t[i] = 0.2 + 0.06 * i;
        }
        Curve ramp = Curve.of(nm, t, 0);
        ClauseResult r = ClauseEvaluator.evaluate(band(Direction.PASS, Aggregate.MEAN, 300, 400, 0.45), ramp);
        assertThat(r.value()).isCloseTo(0.5, within(TOL));
        assertThat(r.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(r.marginDecades()).isCloseTo(Math.log10(0.5 / 0.45), within(TOL));
        assertThat(r.explanation()).isEqualTo("mean T over 300–400 nm is 50 %, needs over 45 %");
        // a sub-band 320–360: mean of 0.32 and 0.56 = 0.44, under 0.45
        assertThat(ClauseEvaluator.evaluate(band(Direction.PASS, Aggregate.MEAN, 320, 360, 0.45), ramp).verdict())
                .isEqualTo(Verdict.MISSES);
    }

    @Test
    void bandReachingOutsideTheMeasuredRangeIsUnverifiedWithNaNMargin() {
        Curve curve = Curve.of(new double[] {250, 600, 1100}, new double[] {0.9, 0.9, 0.9}, 0);
        ClauseResult r = ClauseEvaluator.evaluate(band(Direction.PASS, Aggregate.EVERY_POINT, 190, 250, 0.8), curve);
        assertThat(r.verdict()).isEqualTo(Verdict.UNVERIFIED);
        assertThat(r.marginDecades()).isNaN();
        assertThat(r.value()).isNaN();
        assertThat(r.explanation()).isEqualTo("band 190–250 nm lies partly outside the measured range 250–1100 nm");
    }

    @Test
    void pointOutsideTheMeasuredRangeIsUnverified() {
        Curve curve = Curve.of(new double[] {250, 1100}, new double[] {0.9, 0.9}, 0);
        ClauseResult r = ClauseEvaluator.evaluate(point(Direction.BLOCK, 200, 0.01), curve);
        assertThat(r.verdict()).isEqualTo(Verdict.UNVERIFIED);
        assertThat(r.explanation()).isEqualTo("200 nm lies outside the measured range 250–1100 nm");
    }

    @Test
    void meanOverABandPartlyOutsideTheRangeIsUnverified() {
        Curve curve = Curve.of(new double[] {250, 1100}, new double[] {0.01, 0.01}, 0);
        ClauseResult r = ClauseEvaluator.evaluate(band(Direction.PASS, Aggregate.MEAN, 200, 300, 0.5), curve);
        assertThat(r.verdict()).isEqualTo(Verdict.UNVERIFIED);
        assertThat(r.marginDecades()).isNaN();
    }

    @Test
    void measuredPartOfAPartlyCoveredBandThatAlreadyMissesProvesAMiss() {
        // 300 nm is measured at 50 %: "blocks under 1 % from 200 to 400 nm" is proven false by data alone
        Curve curve = Curve.of(new double[] {250, 300, 1100}, new double[] {0.001, 0.5, 0.9}, 0);
        ClauseResult r = ClauseEvaluator.evaluate(band(Direction.BLOCK, Aggregate.EVERY_POINT, 200, 400, 0.01), curve);
        assertThat(r.verdict()).isEqualTo(Verdict.MISSES);
        assertThat(r.explanation()).endsWith("; the band reaches outside the measured range 250–1100 nm");
    }

    /**
     * A curve read at its detection floor of 0.1 % (common practice for a single-monochromator instrument:
     * stray light ≈ 0.1 % T, ASTM E387). The stored 0.1 % is only an upper bound u on T.
     */
    @ParameterizedTest(name = "{0} {1} at a 0.1 % floor → {2}, margin {3}")
    @CsvSource({
            // blocks under 0.01 %: u = 0.1 % > 0.01 % cannot show it; margin from the bound log10(1e-4/1e-3) = −1
            "BLOCK, 0.0001, UNVERIFIED, -1",
            // blocks under 1 %: T <= u = 0.1 % <= 1 % proves it; margin from the bound (a lower bound) = +1
            "BLOCK, 0.01,   MEETS,       1",
            // passes over 0.05 %: u >= threshold, but a bound never proves light passes; log10(1e-3/5e-4)
            "PASS,  0.0005, UNVERIFIED,  0.301030",
            // passes over 1 %: T <= u = 0.1 % < 1 % proves the miss; log10(1e-3/1e-2) = −1
            "PASS,  0.01,   MISSES,     -1",
    })
    void readingAtTheDetectionFloorIsAnUpperBound(Direction direction, double threshold, Verdict verdict, double margin) {
        Curve floor = Curve.of(new double[] {400, 410}, new double[] {0.001, 0.001}, 0.001);
        ClauseResult r = ClauseEvaluator.evaluate(point(direction, 405, threshold), floor);
        assertThat(r.verdict()).isEqualTo(verdict);
        assertThat(r.marginDecades()).isCloseTo(margin, within(1e-6));
        assertThat(r.valueIsBound()).isTrue();
        assertThat(r.value()).isCloseTo(0.001, within(1e-12));
    }

    @Test
    void detectionFloorAboveABlockThresholdIsExplainedAsSuch() {
        Curve floor = Curve.of(new double[] {400, 410}, new double[] {0.0004, 0.0004}, 0.001);
        ClauseResult r = ClauseEvaluator.evaluate(point(Direction.BLOCK, 405, 0.0001), floor);
        assertThat(r.explanation()).startsWith("T at 405 nm is below the detection limit of 0.1 %: cannot show under 0.01 %");
    }

    @Test
    void blockBandWhollyBelowADetectionLimitUnderTheThresholdMeets() {
        Curve floor = Curve.of(new double[] {300, 310, 320, 330}, new double[] {0, 0.0002, 0.0001, 0}, 0.001);
        ClauseResult r = ClauseEvaluator.evaluate(band(Direction.BLOCK, Aggregate.EVERY_POINT, 300, 330, 0.01), floor);
        assertThat(r.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(r.marginDecades()).isCloseTo(1, within(1e-9));
    }

    @Test
    void measuredMissOutweighsAnUnverifiableBoundInTheSameBand() {
        // 300 nm: bound 5 % (cannot show under 1 %); 320 nm: a real 2 % reading, a proven miss
        Curve curve = Curve.of(new double[] {300, 310, 320}, new double[] {0.01, 0.005, 0.02},
                new boolean[] {true, false, false}, new double[] {0.05, 0.05, 0.05});
        ClauseResult r = ClauseEvaluator.evaluate(band(Direction.BLOCK, Aggregate.EVERY_POINT, 300, 320, 0.01), curve);
        assertThat(r.verdict()).isEqualTo(Verdict.MISSES);
        assertThat(r.value()).isEqualTo(0.02);
        assertThat(r.valueIsBound()).isFalse();
    }

    /** Edge from CutoffsTest: the 1 % crossing lies half way between 390 (A = 3) and 400 nm (A = 1), at 395 nm. */
    private static final Curve EDGE = Curve.of(new double[] {380, 390, 400, 410, 420},
            new double[] {0.0001, 0.001, 0.1, 0.8, 0.9}, 0);

    @ParameterizedTest(name = "window {0}–{1} nm → {2}, margin {3}")
    @CsvSource({
            // T(400)/1 % = 10, 1 %/T(390) = 10: both edges one decade inside
            "390, 400, MEETS,       1",
            // cutoff 395 lies short of 400; T(400) = 10 % is one decade over the level: min(log10 80, −1)
            "400, 410, MISSES,     -1",
            // T(390) = 0.1 % against T(380) = 0.01 %: min(log10(0.001/0.01), log10(0.01/0.0001)) = −1
            "380, 390, MISSES,     -1",
    })
    void cutoffClauseMeetsWhenTheCrossingLiesInTheWindow(double from, double to, Verdict verdict, double margin) {
        ClauseResult r = ClauseEvaluator.evaluate(new CutoffClause(0.01, new Band(from, to), "cutoff"), EDGE);
        assertThat(r.verdict()).isEqualTo(verdict);
        assertThat(r.value()).isCloseTo(395, within(TOL));
        assertThat(r.marginDecades()).isCloseTo(margin, within(TOL));
    }

    @Test
    void cutoffWindowOutsideTheMeasuredRangeIsUnverified() {
        ClauseResult r = ClauseEvaluator.evaluate(new CutoffClause(0.01, new Band(350, 390), "cutoff"), EDGE);
        assertThat(r.verdict()).isEqualTo(Verdict.UNVERIFIED);
        assertThat(r.marginDecades()).isNaN();
        assertThat(r.explanation()).isEqualTo("window 350–390 nm lies partly outside the measured range 380–420 nm");
    }

    @Test
    void curveThatNeverFallsUnderTheLevelMissesACutoffWindow() {
        Curve clear = Curve.of(new double[] {380, 400, 420}, new double[] {0.6, 0.7, 0.8}, 0);
        ClauseResult r = ClauseEvaluator.evaluate(new CutoffClause(0.5, new Band(390, 410), "cutoff"), clear);
        assertThat(r.verdict()).isEqualTo(Verdict.MISSES);
        assertThat(r.value()).isNaN();
        assertThat(r.marginDecades()).isLessThanOrEqualTo(0);
    }

    @Test
    void cutoffHiddenBehindADetectionFloorOverTheLevelIsUnverified() {
        // floor 2 % over the 1 % level: the instrument cannot tell where T passed under 1 %
        Curve curve = Curve.of(new double[] {380, 390, 400, 410}, new double[] {0.005, 0.005, 0.1, 0.9}, 0.02);
        ClauseResult r = ClauseEvaluator.evaluate(new CutoffClause(0.01, new Band(385, 400), "cutoff"), curve);
        assertThat(r.verdict()).isEqualTo(Verdict.UNVERIFIED);
        assertThat(r.marginDecades()).isNaN();
    }

    @Test
    void meanOverABandWiderThanTheWholeCurveSaysPartlyOutside() {
        Curve curve = Curve.of(new double[] {300, 400}, new double[] {0.5, 0.5}, 0);
        ClauseResult r = ClauseEvaluator.evaluate(band(Direction.PASS, Aggregate.MEAN, 250, 450, 0.4), curve);
        assertThat(r.explanation()).isEqualTo("band 250–450 nm lies partly outside the measured range 300–400 nm");
    }

    @Test
    void blockThresholdUnderTheAbsorbanceFloorStillMeetsWithANonNegativeMargin() {
        // OD 13 asked of a reading of exactly 0: met, and the margin keeps the sign of the verdict
        Curve curve = Curve.of(new double[] {400, 410}, new double[] {0, 0.5}, 0);
        ClauseResult r = ClauseEvaluator.evaluate(point(Direction.BLOCK, 400, 1e-13), curve);
        assertThat(r.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(r.marginDecades()).isGreaterThanOrEqualTo(0);
    }
}
