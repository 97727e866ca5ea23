package org.spectralsieve.requirement;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.spectralsieve.spectrum.Curve;

/**
 * Explanations state transmittances down to OD 12 (T = 1e-12, the floor the margins use) and say so
 * beyond it: our own rule, since no instrument in common use states more (common practice, no source:
 * bench spectrophotometers reach OD 6–8).
 */
class ExplanationNumbersTest {

    /**
     * A number with an exponent other than the stated floor "1e-12", or a run of at least ten zeros: what
     * an absurd number looks like in text.
     */
    private static final Pattern ABSURD = Pattern.compile("\\d[eE]-?(?!12\\))\\d|0{10,}");
    private static final double[] NM = {400, 405, 410};

    private static Curve curve(double t, boolean below, double limit) {
        return Curve.of(NM, new double[] {t, t, t}, new boolean[] {below, below, below},
                new double[] {limit, limit, limit});
    }

    @Test
    void aReadingBeyondOd12IsStatedAsBelowOd12NotAsATinyNumber() {
        // a 1 % reading rescaled far: T = 1e-30 (a value, not a bound)
        ClauseResult r = ClauseEvaluator.evaluate(ClauseEvaluatorTest.point(Direction.BLOCK, 405, 0.01),
                curve(1e-30, false, 0));

        assertThat(r.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(r.explanation()).isEqualTo("T at 405 nm is below OD 12 (T < 1e-12), the most this tool states,"
                + " needs under 1 %");
    }

    @Test
    void aDetectionLimitRescaledTo1e236IsNotPrinted() {
        ClauseResult r = ClauseEvaluator.evaluate(ClauseEvaluatorTest.point(Direction.BLOCK, 405, 0.01),
                curve(1e-240, true, 1.8e-236));

        assertThat(r.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(r.explanation()).contains("below OD 12 (T < 1e-12)").doesNotContain("236");
        assertThat(ABSURD.matcher(r.explanation()).find()).as(r.explanation()).isFalse();
    }

    @Test
    void aDetectionLimitOfZeroIsNotPrintedAsZeroPercent() {
        ClauseResult r = ClauseEvaluator.evaluate(ClauseEvaluatorTest.point(Direction.PASS, 405, 0.5),
                curve(0, true, 0));

        assertThat(r.verdict()).isEqualTo(Verdict.MISSES);
        assertThat(r.explanation()).doesNotContain("of 0 %").contains("below OD 12");
    }

    @Test
    void aStatableDetectionLimitIsStillGivenAsANumber() {
        // 1e-9 is OD 9: within what the tool states, so the number stays (as 0.0000001 %)
        ClauseResult r = ClauseEvaluator.evaluate(ClauseEvaluatorTest.point(Direction.BLOCK, 405, 0.01),
                curve(0, true, 1e-9));

        assertThat(r.explanation()).isEqualTo("T at 405 nm is below the detection limit of 0.0000001 %, so it is under 1 %");
    }

    @Test
    void aBandMeanOfBoundsBeyondOd12SaysSo() {
        ClauseResult r = ClauseEvaluator.evaluate(
                ClauseEvaluatorTest.band(Direction.BLOCK, Aggregate.MEAN, 400, 410, 0.001), curve(0, true, 1e-200));

        assertThat(r.explanation()).startsWith("mean T over 400–410 nm is below a detection limit that is itself below OD 12");
        assertThat(ABSURD.matcher(r.explanation()).find()).as(r.explanation()).isFalse();
    }
}
