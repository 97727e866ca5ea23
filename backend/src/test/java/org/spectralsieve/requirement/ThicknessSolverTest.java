package org.spectralsieve.requirement;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.optics.Slab;
import org.spectralsieve.spectrum.Curve;

/**
 * Thickness as a design variable, worked by hand. Formulas: slab T = (1 − R)²K / (1 − R²K²) and its
 * inverse (Modern Optical Engineering, 4th ed., eq. 10.5; inversion REFERENCE §7);
 * Beer–Lambert scaling of internal transmittance τi(d2) = τi(d1)^(d2/d1) (Modern Optical Engineering eqs. 10.2–10.3).
 * n = 1.5 gives R = 0.04 per surface (Modern Optical Engineering eq. 10.1); n = 1 gives R = 0, so T = K and the arithmetic
 * is plain Beer–Lambert.
 */
class ThicknessSolverTest {

    private static final ConstantIndex GLASS = new ConstantIndex(1.5);
    private static final ConstantIndex NO_SURFACES = new ConstantIndex(1.0);

    private static Requirement range(double min, double max, Clause... clauses) {
        return new Requirement(List.of(clauses), ThicknessSpec.range(min, max), Optional.empty(), Optional.empty(), "");
    }

    private static Candidate bulk(Curve curve, double mm, ConstantIndex index) {
        return new Candidate(1, 10, "illustrative sheet", curve, mm, true, index);
    }

    /** K = 0.5 at 2 mm with R = 0.04: T = 0.9216 · 0.5 / (1 − 0.0016 · 0.25) = 0.460984 (REFERENCE §7 table). */
    private static Curve halfInternalAt2mm(double... nm) {
        double t = Slab.transmittance(0.5, 0.04);
        double[] ts = new double[nm.length];
        java.util.Arrays.fill(ts, t);
        return Curve.of(nm, ts, 0);
    }

    @Test
    void slabInversionOfOnePercentGivesTheRequiredInternalTransmittance() {
        // K* = 2T / [(1−R)² + sqrt((1−R)⁴ + 4R²T²)] = 0.02 / (0.9216 + 0.92160035) = 0.0108507
        assertThat(Slab.internalFromTransmittance(0.01, 0.04)).isCloseTo(0.010851, within(5e-7));
        assertThat(Slab.transmittance(0.5, 0.04)).isCloseTo(0.460984, within(5e-7));
    }

    @Test
    void blockingUnderOnePercentAt405NeedsAbout13Point05mmOfTheIssuesSheet() {
        // d >= 2 mm · ln(0.0108507) / ln(0.5) = 2 · 4.52353 / 0.693147 = 13.0521 mm
        Curve curve = halfInternalAt2mm(400, 405, 410);
        Requirement req = range(1, 20, ClauseEvaluatorTest.point(Direction.BLOCK, 405, 0.01));
        ThicknessSolver.Solution s = ThicknessSolver.solve(req.clauses(), curve, 2, GLASS, 1, 20);
        assertThat(s.feasibleMm().loMm()).isCloseTo(13.05, within(0.01));
        assertThat(s.feasibleMm().loMm()).isCloseTo(13.052138, within(1e-6));
        assertThat(s.feasibleMm().hiMm()).isEqualTo(20);
        // only a block clause: thicker only helps, so the thickest allowed is recommended
        assertThat(s.recommendedMm()).isEqualTo(20);

        SampleEvaluation e = SampleEvaluator.evaluate(bulk(curve, 2, GLASS), req);
        assertThat(e.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(e.thicknessMm()).isEqualTo(20);
        assertThat(e.feasibleMm().loMm()).isCloseTo(13.052138, within(1e-6));
    }

    @Test
    void bisectionBetweenStoredPointsAgreesWithTheClosedForm() {
        // 402.5 nm is not stored; both neighbours have K = 0.5, so the interpolated reading behaves the same
        Curve curve = halfInternalAt2mm(400, 405, 410);
        List<Clause> clauses = List.of(ClauseEvaluatorTest.point(Direction.BLOCK, 402.5, 0.01));
        ThicknessSolver.Solution s = ThicknessSolver.solve(clauses, curve, 2, GLASS, 1, 20);
        assertThat(s.feasibleMm().loMm()).isCloseTo(13.052138, within(1e-6));
    }

    @Test
    void blockMeanIsSolvedByBisection() {
        // R = 0, T = 0.5 everywhere at 2 mm: mean(d) = 0.5^(d/2) <= 0.01 ⇔ d >= 2 ln 0.01 / ln 0.5 = 13.287712
        Curve curve = Curve.of(new double[] {400, 405, 410}, new double[] {0.5, 0.5, 0.5}, 0);
        List<Clause> clauses = List.of(ClauseEvaluatorTest.band(Direction.BLOCK, Aggregate.MEAN, 400, 410, 0.01));
        ThicknessSolver.Solution s = ThicknessSolver.solve(clauses, curve, 2, NO_SURFACES, 1, 20);
        assertThat(s.feasibleMm().loMm()).isCloseTo(13.287712, within(1e-6));
    }

    @Test
    void passAndBlockClausesBoundThicknessFromBothSidesAndTheRecommendationEqualisesTheirMargins() {
        // R = 0, at 2 mm: T(405) = 0.5, T(450) = 0.98; T(d) = T0^(d/2)
        //   blocks under 1 % at 405: 0.5^(d/2) <= 0.01  ⇔ d >= 2 ln 0.01 / ln 0.5  = 13.287712
        //   passes over 85 % at 450: 0.98^(d/2) >= 0.85 ⇔ d <= 2 ln 0.85 / ln 0.98 = 16.088827
        // equal margins: log10(0.98^(d/2) / 0.85) = log10(0.01 / 0.5^(d/2))
        //   ⇔ (d/2) · log10(0.98 · 0.5) = log10(0.0085) ⇔ d = 2 · (−2.070581) / (−0.309804) = 13.367042,
        //   both margins 0.011940 decades there
        Curve curve = Curve.of(new double[] {405, 450}, new double[] {0.5, 0.98}, 0);
        Requirement req = range(1, 20,
                ClauseEvaluatorTest.point(Direction.BLOCK, 405, 0.01),
                ClauseEvaluatorTest.point(Direction.PASS, 450, 0.85));
        ThicknessSolver.Solution s = ThicknessSolver.solve(req.clauses(), curve, 2, NO_SURFACES, 1, 20);
        assertThat(s.feasibleMm().loMm()).isCloseTo(13.287712, within(1e-6));
        assertThat(s.feasibleMm().hiMm()).isCloseTo(16.088827, within(1e-6));
        assertThat(s.recommendedMm()).isCloseTo(13.367042, within(1e-6));

        SampleEvaluation e = SampleEvaluator.evaluate(bulk(curve, 2, NO_SURFACES), req);
        assertThat(e.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(e.clauses().get(0).marginDecades()).isCloseTo(0.011940, within(1e-6));
        assertThat(e.clauses().get(1).marginDecades()).isCloseTo(0.011940, within(1e-6));
        assertThat(e.worstMarginDecades()).isCloseTo(0.011940, within(1e-6));
    }

    @Test
    void cutoffWindowBoundsThicknessFromBothEdges() {
        // R = 0, level 50 %, window 380–400 nm; at 2 mm T(380) = 0.6, T(400) = 0.9
        //   short edge: 0.6^(d/2) <= 0.5 ⇔ d >= 2 ln 0.5 / ln 0.6 = 2 · 0.693147 / 0.510826 = 2.713831
        //   long edge:  0.9^(d/2) >= 0.5 ⇔ d <= 2 ln 0.5 / ln 0.9 = 2 · 0.693147 / 0.105361 = 13.157627
        //   equal margins: (d/2) · log10(0.9 · 0.6) = 2 log10 0.5 ⇔ d = 4 · 0.301030 / 0.267606 = 4.499596
        Curve curve = Curve.of(new double[] {370, 380, 390, 400, 410}, new double[] {0.3, 0.6, 0.75, 0.9, 0.95}, 0);
        Requirement req = range(1, 20, new CutoffClause(0.5, new Band(380, 400), "cutoff 380 to 400"));
        ThicknessSolver.Solution s = ThicknessSolver.solve(req.clauses(), curve, 2, NO_SURFACES, 1, 20);
        assertThat(s.feasibleMm().loMm()).isCloseTo(2.713831, within(1e-6));
        assertThat(s.feasibleMm().hiMm()).isCloseTo(13.157627, within(1e-6));
        assertThat(s.recommendedMm()).isCloseTo(4.499596, within(1e-6));
        SampleEvaluation e = SampleEvaluator.evaluate(bulk(curve, 2, NO_SURFACES), req);
        assertThat(e.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(e.clauses().get(0).value()).isBetween(380.0, 400.0);
    }

    @Test
    void whenNoThicknessWorksTheBestAchievableIsJudgedAndMisses() {
        // within 1–5 mm the issue's sheet cannot block under 1 % (needs 13.05 mm); best is 5 mm:
        // K = 0.5^(5/2) = 0.176777, T = 0.9216 · K / (1 − 0.0016 K²) = 0.162929, margin log10(0.01/T) = −1.21198
        Curve curve = halfInternalAt2mm(400, 405, 410);
        SampleEvaluation e = SampleEvaluator.evaluate(bulk(curve, 2, GLASS),
                range(1, 5, ClauseEvaluatorTest.point(Direction.BLOCK, 405, 0.01)));
        assertThat(e.feasibleMm()).isNull();
        assertThat(e.thicknessMm()).isEqualTo(5);
        assertThat(e.verdict()).isEqualTo(Verdict.MISSES);
        assertThat(e.worstMarginDecades()).isCloseTo(-1.21198, within(1e-5));
    }

    @Test
    void blockProvenByADetectionBoundHoldsFromTheSolvedThicknessUpward() {
        // R = 0, both points read under a 0.1 % floor at 2 mm: true T(d) <= 0.001^(d/2).
        // blocks under 0.01 %: 0.001^(d/2) <= 1e-4 ⇔ d >= 2 · 4/3 = 2.666667 mm (sufficient; thinner may work too)
        Curve floor = Curve.of(new double[] {400, 410}, new double[] {0.0005, 0.0005}, 0.001);
        Requirement req = range(1, 20, ClauseEvaluatorTest.point(Direction.BLOCK, 405, 0.0001));
        SampleEvaluation e = SampleEvaluator.evaluate(bulk(floor, 2, NO_SURFACES), req);
        assertThat(e.feasibleMm().loMm()).isCloseTo(2.666667, within(1e-6));
        assertThat(e.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(e.clauses().get(0).valueIsBound()).isTrue();
    }

    @Test
    void passJudgedOnADetectionBoundIsNeverFeasible() {
        // bound at 1 mm: 0.001^(1/2) = 3.16 % >= 0.01 %, still only a bound: unverified, no interval
        Curve floor = Curve.of(new double[] {400, 410}, new double[] {0.0005, 0.0005}, 0.001);
        SampleEvaluation e = SampleEvaluator.evaluate(bulk(floor, 2, NO_SURFACES),
                range(1, 20, ClauseEvaluatorTest.point(Direction.PASS, 405, 0.0001)));
        assertThat(e.feasibleMm()).isNull();
        assertThat(e.thicknessMm()).isEqualTo(1);
        assertThat(e.verdict()).isEqualTo(Verdict.UNVERIFIED);
    }

    @Test
    void onlyPassClausesRecommendTheThinnestAllowed() {
        Curve curve = Curve.of(new double[] {405, 450}, new double[] {0.5, 0.98}, 0);
        ThicknessSolver.Solution s = ThicknessSolver.solve(
                List.of(ClauseEvaluatorTest.point(Direction.PASS, 450, 0.85)), curve, 2, NO_SURFACES, 1, 20);
        assertThat(s.recommendedMm()).isEqualTo(1);
        assertThat(s.feasibleMm().hiMm()).isCloseTo(16.088827, within(1e-6));
    }
}
