package org.spectralsieve.requirement;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.spectrum.Curve;

/**
 * Levels relative to the same curve ("at 380 nm under 1% of its 550 nm value"), worked by hand. The clause shapes
 * come from the archival-glazing rule T(380), T(320) under 1 % of T(550) and T(400) under half of it (PRACTICE.md
 * §6 check 31, [S28]); the curves are made up for each case. Margins are decades: log10 of the ratio to the share.
 */
class RelativeClauseTest {

    private static final Curve GLAZING = Curve.of(new double[] {320, 380, 400, 550, 600},
            new double[] {0.0006, 0.003, 0.25, 0.6, 0.62}, 0);

    private static ClauseResult judge(String text, Curve curve) {
        Requirement r = RequirementParser.parse(text);
        return ClauseEvaluator.evaluate(r.clauses().get(0), curve);
    }

    @Test
    void aRatioUnderItsShareMeetsWithTheMarginInDecades() {
        ClauseResult r = judge("at 380 nm under 1% of its 550 nm value", GLAZING);
        // 0.003 / 0.6 = 0.005; log10(0.01 / 0.005) = 0.30103
        assertThat(r.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(r.value()).isCloseTo(0.005, within(1e-12));
        assertThat(r.marginDecades()).isCloseTo(0.30103, within(1e-5));
        assertThat(r.explanation()).isEqualTo("T(380 nm) / T(550 nm) is 0.5 % (0.3 % against 60 %), needs under 1 %");
    }

    @Test
    void halfOfItsValueMissesWhenTheRatioIsOverHalf() {
        ClauseResult r = judge("at 400 nm under half of its 550 nm value", GLAZING);
        // 0.25 / 0.6 = 0.41667 passes; a curve with 0.35 at 400 nm: 0.58333, log10(0.5 / 0.58333) = -0.066947
        assertThat(r.verdict()).isEqualTo(Verdict.MEETS);
        Curve yellowed = Curve.of(new double[] {400, 550}, new double[] {0.35, 0.6}, 0);
        ClauseResult missed = judge("at 400 nm under half of its 550 nm value", yellowed);
        assertThat(missed.verdict()).isEqualTo(Verdict.MISSES);
        assertThat(missed.marginDecades()).isCloseTo(-0.066947, within(1e-6));
    }

    @Test
    void theWorstReadingOfABandDecides() {
        // from 380 to 400 nm: readings 380 (0.003), 400 (0.25); the highest ratio is at 400 nm: 0.41667 > 1 %
        ClauseResult r = judge("from 380 to 400 nm under 1% of its 550 nm value", GLAZING);
        assertThat(r.verdict()).isEqualTo(Verdict.MISSES);
        assertThat(r.value()).isCloseTo(0.25 / 0.6, within(1e-12));
        assertThat(r.explanation()).startsWith("highest ratio in 380–400 nm: T(400 nm) / T(550 nm) is 41.7 %");
    }

    @Test
    void aNumeratorBelowDetectionMakesTheRatioAnUpperBoundThatProvesUnderAndDisprovesOver() {
        // detection limit 0.001: T(320) = 0.0006 is only known to be at most 0.001; ratio at most 0.001 / 0.6 = 0.16667 %
        Curve floored = Curve.of(new double[] {320, 550}, new double[] {0.0006, 0.6}, 0.001);
        ClauseResult under = judge("at 320 nm under 1% of its 550 nm value", floored);
        assertThat(under.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(under.valueIsBound()).isTrue();
        assertThat(under.value()).isCloseTo(0.001 / 0.6, within(1e-12));
        assertThat(under.explanation()).contains("is at most 0.167 %");
        ClauseResult over = judge("at 320 nm over 1% of its 550 nm value", floored);
        assertThat(over.verdict()).isEqualTo(Verdict.MISSES);
        // a share under the bound cannot be shown either way
        ClauseResult tight = judge("at 320 nm under 0.1% of its 550 nm value", floored);
        assertThat(tight.verdict()).isEqualTo(Verdict.UNVERIFIED);
    }

    @Test
    void aReferenceBelowDetectionMakesTheRatioALowerBound() {
        // T(550) = 0.0005 under the limit 0.0007: the true T(550) is at most 0.0007, so the ratio is at least
        // 0.0008 / 0.0007 = 114 %: over every share, so "under" is disproven and "over" proven
        Curve dark = Curve.of(new double[] {380, 550}, new double[] {0.0008, 0.0005}, 0.0007);
        ClauseResult under = judge("at 380 nm under 90% of its 550 nm value", dark);
        assertThat(under.verdict()).isEqualTo(Verdict.MISSES);
        assertThat(under.explanation()).contains("is at least 114 %");
        assertThat(judge("at 380 nm over 50% of its 550 nm value", dark).verdict()).isEqualTo(Verdict.MEETS);
        // both below detection: nothing is known of the ratio
        Curve black = Curve.of(new double[] {380, 550}, new double[] {0.0001, 0.0005}, 0.0007);
        assertThat(judge("at 380 nm under 90% of its 550 nm value", black).verdict()).isEqualTo(Verdict.UNVERIFIED);
    }

    @Test
    void aReferenceOutsideTheMeasuredRangeIsUnverifiedNotGuessed() {
        Curve uvOnly = Curve.of(new double[] {300, 450}, new double[] {0.001, 0.5}, 0);
        ClauseResult r = judge("at 380 nm under 1% of its 550 nm value", uvOnly);
        assertThat(r.verdict()).isEqualTo(Verdict.UNVERIFIED);
        assertThat(r.marginDecades()).isNaN();
        assertThat(r.explanation()).contains("550 nm lies outside the measured range");
    }

    /**
     * Thickness solving: for a bulk slab the ratio T(380)/T(550) falls as it thickens. The thinnest thickness that
     * keeps it under 1 % is found here independently from the slab formula with multiple reflections,
     * T = (1 − R)²τ / (1 − R²τ²), R = ((n − 1)/(n + 1))² (Born &amp; Wolf; the incoherent slab), τ = τ₀^(d/d₀), by
     * plain bisection on d, and compared with the solver's feasible interval.
     */
    @Test
    void thicknessSolvingFindsTheThinnestSlabWhoseRatioMeetsAsTheSlabFormulaGives() {
        double n = 1.5;
        double d0 = 2;
        Curve measured = Curve.of(new double[] {370, 380, 390, 540, 550, 560},
                new double[] {0.05, 0.1, 0.2, 0.9, 0.9, 0.9}, 0);
        Candidate slab = new Candidate(1, 1, "illustrative sheet", measured, d0, true, new ConstantIndex(n));
        Requirement r = RequirementParser.parse("at 380 nm under 1% of its 550 nm value, thickness 1 to 20 mm");

        SampleEvaluation e = SampleEvaluator.evaluate(slab, r);

        double rr = Math.pow((n - 1) / (n + 1), 2);
        double tau380 = internal(0.1, rr);
        double tau550 = internal(0.9, rr);
        double lo = 1;
        double hi = 20;
        for (int i = 0; i < 200; i++) {
            double mid = (lo + hi) / 2;
            double ratio = slab(Math.pow(tau380, mid / d0), rr) / slab(Math.pow(tau550, mid / d0), rr);
            if (ratio <= 0.01) {
                hi = mid;
            } else {
                lo = mid;
            }
        }
        assertThat(e.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(e.feasibleMm()).isNotNull();
        assertThat(e.feasibleMm().loMm()).isCloseTo(hi, within(1e-5));
        assertThat(e.feasibleMm().hiMm()).isEqualTo(20);
    }

    private static double slab(double tau, double r) {
        return (1 - r) * (1 - r) * tau / (1 - r * r * tau * tau);
    }

    /** τ from a measured T: the positive root of T R² τ² + (1 − R)² τ − T = 0. */
    private static double internal(double t, double r) {
        double a = t * r * r;
        double b = (1 - r) * (1 - r);
        return (-b + Math.sqrt(b * b + 4 * a * t)) / (2 * a);
    }
}
