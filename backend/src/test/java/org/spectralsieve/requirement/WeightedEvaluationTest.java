package org.spectralsieve.requirement;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.Arrays;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.optics.Layer;
import org.spectralsieve.optics.LightPath;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.weighting.SpectrumLookup;

/**
 * Weighted clauses, the critical wavelength and fixed layers, judged exactly and with thickness as a
 * design variable. Every expected number is computed here from the published formula it names, never by
 * the code under test.
 */
class WeightedEvaluationTest {

    private static final SpectrumLookup SPECTRA = SpectrumLookup.builtIn();
    private static final ConstantIndex N15 = new ConstantIndex(1.5);
    /** Single-surface reflectance at normal incidence, ((n − 1)/(n + 1))² (Fresnel; Modern Optical Engineering eq. 10.4). */
    private static final double R15 = 0.04;

    /** T constant from 190 to 1100 nm on a 1 nm grid, detection limit 0. */
    static Curve flat(double t) {
        double[] nm = new double[911];
        double[] ts = new double[nm.length];
        for (int i = 0; i < nm.length; i++) {
            nm[i] = 190 + i;
            ts[i] = t;
        }
        return Curve.of(nm, ts, 0);
    }

    private static Requirement require(ThicknessSpec thickness, Clause... clauses) {
        return new Requirement(List.of(clauses), thickness, Optional.empty(), Optional.empty(), "");
    }

    private static Requirement require(FixedLayer layer, ThicknessSpec thickness, Clause... clauses) {
        return new Requirement(List.of(clauses), thickness, Optional.empty(), Optional.empty(), Optional.of(layer), "");
    }

    private static WeightedClause weighted(String text) {
        return (WeightedClause) RequirementParser.parse(text, SPECTRA).clauses().get(0);
    }

    private static Candidate bulk(Curve curve, double mm) {
        return new Candidate(1, 1, "illustrative bulk sheet", curve, mm, true, N15);
    }

    // ---- weighted figures on one curve ----

    @Test
    void flatTransmittanceGivesEveryWeightedFigureEqualToThatTransmittance() {
        // ISO/CIE 17166 (erythema) and the ICNIRP S(λ) definition: T_eff = ∫E·W·T dλ / ∫E·W dλ, so a T that does
        // not vary with λ factors out and T_eff = T (REFERENCE §2, "a flat T gives UPF = 1/T for any E(λ)")
        Curve curve = flat(0.3);
        // luminous transmittance likewise: τv = Σ T·D65·V / Σ D65·V (ISO 8980-3, ISO 12312-1)
        for (String text : List.of("erythemal under 50%", "uv hazard under 50%", "luminous over 20%", "passes over 20% of led 365",
                "passes over 20% of led 395 weighted by blue-light", "passes over 20% of mercury low pressure")) {
            ClauseResult r = ClauseEvaluator.evaluate(weighted(text), curve);
            assertThat(r.value()).as(text).isCloseTo(0.3, within(1e-12));
            assertThat(r.valueIsBound()).as(text).isFalse();
        }
        ClauseResult erythemal = ClauseEvaluator.evaluate(weighted("erythemal under 50%"), curve);
        assertThat(erythemal.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(erythemal.marginDecades()).isCloseTo(Math.log10(0.5 / 0.3), within(1e-12));
        assertThat(ClauseEvaluator.evaluate(weighted("erythemal under 10%"), curve).verdict()).isEqualTo(Verdict.MISSES);
    }

    /** T = 0.9 from 380 nm on, T = 0.1 below it but flagged under a detection limit of {@code limit}. */
    private static Curve edgeAt380(double limit) {
        double[] nm = new double[911];
        double[] t = new double[nm.length];
        for (int i = 0; i < nm.length; i++) {
            nm[i] = 190 + i;
            t[i] = nm[i] < 380 ? Math.min(0.1, limit) : 0.9;
        }
        return Curve.of(nm, t, limit);
    }

    @Test
    void pointsBelowDetectionBoundTheFigureFromBothSides() {
        // led-385 is a Gaussian of 12 nm FWHM (σ = 12 / 2.3548 = 5.096 nm), integrated on its 1.2 nm step from
        // 349 nm, so the step from flagged to measured falls between the grid points 379.0 and 380.2 nm: the share s
        // of its power above the step lies between Φ((385 − 380.2)/σ) = 0.827 and Φ((385 − 379)/σ) = 0.880 (normal
        // table). With T = 0.9 above and the rest under a 30 % detection limit the true figure lies between
        // L = 0.9·s ∈ [0.744, 0.792] and U = 0.9·s + 0.3·(1 − s) ∈ [0.796, 0.828].
        Curve curve = edgeAt380(0.3);
        ClauseResult met = ClauseEvaluator.evaluate(weighted("passes over 70% of led 385"), curve);
        assertThat(met.verdict()).as(met.explanation()).isEqualTo(Verdict.MEETS); // proven by the measured points alone
        assertThat(met.value()).isBetween(0.744, 0.792);
        // both ends stated, as the figures answer states them (never "at least" here and "≤" there)
        assertThat(met.explanation()).contains("between").contains("taken at 0 and at their limit")
                .doesNotContain("at least");
        ClauseResult open = ClauseEvaluator.evaluate(weighted("passes over 79.4% of led 385"), curve);
        assertThat(open.verdict()).as(open.explanation()).isEqualTo(Verdict.UNVERIFIED);
        assertThat(open.explanation()).contains("lies between");
        assertThat(open.value()).isBetween(0.796, 0.828);
        assertThat(open.valueIsBound()).isTrue();
        assertThat(ClauseEvaluator.evaluate(weighted("passes over 85% of led 385"), curve).verdict()).isEqualTo(Verdict.MISSES);
        // the lower end is already above 70 %
        assertThat(ClauseEvaluator.evaluate(weighted("transmits under 70% of led 385"), curve).verdict()).isEqualTo(Verdict.MISSES);
        assertThat(ClauseEvaluator.evaluate(weighted("transmits under 79.4% of led 385"), curve).verdict())
                .isEqualTo(Verdict.UNVERIFIED);
        assertThat(ClauseEvaluator.evaluate(weighted("transmits under 85% of led 385"), curve).verdict()).isEqualTo(Verdict.MEETS);
    }

    @Test
    void aBlockUnderTheDetectionLimitIsProvenByTheBound() {
        // below 380 nm under a 0.1 % limit; erythema weights 380–400 nm by at most 10^(0.015·(140 − 380)) = 2.5e-4
        // of its UVB plateau (ISO/CIE 17166), so even at 0.9 there the figure stays far under 1 %
        ClauseResult erythemal = ClauseEvaluator.evaluate(weighted("erythemal under 1%"), edgeAt380(0.001));
        assertThat(erythemal.verdict()).as(erythemal.explanation()).isEqualTo(Verdict.MEETS);
        assertThat(erythemal.valueIsBound()).isTrue();
        assertThat(erythemal.explanation()).contains("taken at 0 and at their limit");
        ClauseResult flatSource = ClauseEvaluator.evaluate(weighted("passes over 50% of flat"), edgeAt380(0.001));
        assertThat(flatSource.verdict()).isEqualTo(Verdict.UNVERIFIED); // flat reaches 100 nm, the curve starts at 190 nm
        assertThat(flatSource.marginDecades()).isNaN();
        assertThat(flatSource.explanation()).contains("not available");
    }

    @Test
    void criticalWavelengthMatchesTheReferenceSheetCases() {
        // REFERENCE §3 [C], 1 nm trapezoid, 290–400 nm: flat A → 389.00; A linear 2 → 0 over 290–400 → 365.22;
        // A = 2 up to 340 nm, 0 above → 335.45
        assertCritical(nm -> 0.5, 389.00);
        assertCritical(nm -> 2 - 2 * (nm - 290) / 110, 365.22);
        assertCritical(nm -> nm <= 340 ? 2 : 0, 335.45);
    }

    private static void assertCritical(java.util.function.DoubleUnaryOperator absorbance, double expectedNm) {
        double[] nm = new double[151];
        double[] t = new double[nm.length];
        for (int i = 0; i < nm.length; i++) {
            nm[i] = 250 + i;
            t[i] = Math.pow(10, -absorbance.applyAsDouble(nm[i]));
        }
        Curve curve = Curve.of(nm, t, 0);
        for (double threshold : new double[] {expectedNm - 0.05, expectedNm + 0.05}) {
            CriticalWavelengthClause atLeast = new CriticalWavelengthClause(Comparison.AT_LEAST, threshold, "");
            ClauseResult r = ClauseEvaluator.evaluate(atLeast, curve);
            assertThat(r.value()).isCloseTo(expectedNm, within(0.005));
            Verdict expected = threshold < expectedNm ? Verdict.MEETS : Verdict.MISSES;
            assertThat(r.verdict()).as("λc " + expectedNm + " at least " + threshold).isEqualTo(expected);
            assertThat(Math.signum(r.marginDecades())).isEqualTo(expected == Verdict.MEETS ? 1.0 : -1.0);
            ClauseResult atMost = ClauseEvaluator.evaluate(new CriticalWavelengthClause(Comparison.AT_MOST, threshold, ""), curve);
            assertThat(atMost.verdict()).isEqualTo(expected == Verdict.MEETS ? Verdict.MISSES : Verdict.MEETS);
        }
    }

    @Test
    void criticalWavelengthIsUnverifiedWhereBoundsCouldMoveItAcrossTheThreshold() {
        // flat A = 0.5 (λc = 389 nm, REFERENCE §3) but 250–300 nm under a 1 % detection limit: the true absorbance
        // there may be far higher, which pulls λc down. So "at least 370" is not proven; "at most 395" holds and more
        // absorbance below can only keep it so; "at most 380" fails as read, but the bounds could still make it hold.
        double[] nm = new double[200];
        double[] t = new double[nm.length];
        boolean[] below = new boolean[nm.length];
        double[] limits = new double[nm.length];
        for (int i = 0; i < nm.length; i++) {
            nm[i] = 250 + i;
            below[i] = nm[i] <= 300;
            t[i] = below[i] ? 0.005 : Math.pow(10, -0.5);
            limits[i] = 0.01;
        }
        Curve curve = Curve.of(nm, t, below, limits);
        assertThat(ClauseEvaluator.evaluate(new CriticalWavelengthClause(Comparison.AT_LEAST, 370, ""), curve).verdict())
                .isEqualTo(Verdict.UNVERIFIED);
        assertThat(ClauseEvaluator.evaluate(new CriticalWavelengthClause(Comparison.AT_MOST, 395, ""), curve).verdict())
                .isEqualTo(Verdict.MEETS);
        assertThat(ClauseEvaluator.evaluate(new CriticalWavelengthClause(Comparison.AT_MOST, 380, ""), curve).verdict())
                .isEqualTo(Verdict.UNVERIFIED);
    }

    // ---- thickness as a design variable ----

    /** K from a slab's T: positive root of R²T·K² + (1 − R)²K − T = 0 (Modern Optical Engineering eq. 10.5 solved for K; REFERENCE §7). */
    private static double internal(double t, double r) {
        double a = r * r * t;
        double b = (1 - r) * (1 - r);
        return (-b + Math.sqrt(b * b + 4 * a * t)) / (2 * a);
    }

    @Test
    void passOfAnLedFromAFlatAbsorberSolvesToTheBeerLambertThickness() {
        // T(2 mm) = 0.80 everywhere, n = 1.5: with T flat the effective T equals T (see above), so
        // "passes over 60% of led 365" holds up to d = d0·ln K* / ln K0 (Beer–Lambert, K = K0^(d/d0))
        double kNow = internal(0.80, R15);
        double kNeeded = internal(0.60, R15);
        double dMax = 2 * Math.log(kNeeded) / Math.log(kNow);
        SampleEvaluation e = SampleEvaluator.evaluate(bulk(flat(0.80), 2),
                require(ThicknessSpec.range(0.5, 20), weighted("passes over 60% of led 365")));
        assertThat(e.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(e.feasibleMm().loMm()).isEqualTo(0.5);
        assertThat(e.feasibleMm().hiMm()).isCloseTo(dMax, within(1e-6));
        assertThat(e.thicknessMm()).isEqualTo(0.5); // only a pass: the thinnest allowed has the widest margin
    }

    @Test
    void blockOfAWeightedFigureSolvesToTheBeerLambertThicknessFromBelow() {
        // same absorber: "erythemal under 1%" needs K0^(d/d0) <= K(1 %), i.e. d >= d0·ln K* / ln K0
        double dMin = 2 * Math.log(internal(0.01, R15)) / Math.log(internal(0.80, R15));
        SampleEvaluation e = SampleEvaluator.evaluate(bulk(flat(0.80), 2),
                require(ThicknessSpec.range(1, 100), weighted("erythemal under 1%"), weighted("passes over 0.5% of led 405")));
        assertThat(e.feasibleMm().loMm()).isCloseTo(dMin, within(1e-6));
        double dMax = 2 * Math.log(internal(0.005, R15)) / Math.log(internal(0.80, R15));
        assertThat(e.feasibleMm().hiMm()).isCloseTo(dMax, within(1e-6));
        // the two margins are equal where log10(0.01/T) = log10(T/0.005): T = √(0.01·0.005)
        double dBest = 2 * Math.log(internal(Math.sqrt(0.01 * 0.005), R15)) / Math.log(internal(0.80, R15));
        assertThat(e.thicknessMm()).isCloseTo(dBest, within(1e-5));
        assertThat(e.verdict()).isEqualTo(Verdict.MEETS);
    }

    // ---- a fixed layer in the light path ----

    private static StackLayer glass(double mm, Curve curve, boolean bulk) {
        FixedLayer spec = new FixedLayer(FixedLayer.Placement.BEHIND, mm, "illustrative window glass", "behind");
        return StackLayer.of(spec, 9, "illustrative window glass", "illustrative-window-glass", 90, curve, 4, bulk, N15);
    }

    @Test
    void twoClearPlatesTransmitWhatStokesPileOfPlatesFormulaGives() {
        // Stokes' pile of m non-absorbing plates with incoherent reflections: T = (1 − R)/(1 + (2m − 1)R); one plate,
        // R = 0.04: 0.96/1.04 = 0.923077; two plates across an air gap: 0.96/1.12 = 0.857143
        double onePlate = (1 - R15) / (1 + R15);
        double twoPlates = (1 - R15) / (1 + 3 * R15);
        Candidate clear = new Candidate(2, 2, "illustrative clear plate", flat(onePlate), 3, false, N15);
        Requirement r = require(new FixedLayer(FixedLayer.Placement.BEHIND, 4, "illustrative window glass", ""),
                ThicknessSpec.AS_MEASURED, ClauseEvaluatorTest.point(Direction.PASS, 500, 0.85));
        SampleEvaluation e = SampleEvaluator.evaluate(clear, r, Optional.of(glass(4, flat(onePlate), false)));
        assertThat(e.clauses().get(0).value()).isCloseTo(twoPlates, within(1e-12));
        assertThat(e.verdict()).isEqualTo(Verdict.MEETS);
        // and the judged stack is the light path itself
        Curve path = LightPath.of(Layer.fixed(flat(onePlate), N15), Layer.fixed(flat(onePlate), N15)).transmittance();
        assertThat(path.transmittanceAt(500).getAsDouble()).isEqualTo(e.clauses().get(0).value());
    }

    @Test
    void aBulkLayerIsRescaledToTheAskedThicknessBeforeItJoinsThePath() {
        // the layer's own 4 mm curve at 0.70; asked at 8 mm it becomes slab(K0², R) (Beer–Lambert, Modern Optical Engineering eq. 10.5)
        double k0 = internal(0.70, R15);
        double k8 = k0 * k0;
        double layerAt8 = (1 - R15) * (1 - R15) * k8 / (1 - R15 * R15 * k8 * k8);
        StackLayer layer = glass(8, flat(0.70), true);
        assertThat(layer.rescaled()).isTrue();
        assertThat(layer.curve().transmittanceAt(500).getAsDouble()).isCloseTo(layerAt8, within(1e-12));
        // with a clear plate behind it: T1·T2 / (1 − R1·R2), each R the slab's total reflectance
        // R_slab = R + (1 − R)²R·K² / (1 − R²K²) (Modern Optical Engineering eq. 10.5)
        double plate = (1 - R15) / (1 + R15);
        double rPlate = 1 - plate;
        double rLayer = R15 + (1 - R15) * (1 - R15) * R15 * k8 * k8 / (1 - R15 * R15 * k8 * k8);
        double expected = plate * layerAt8 / (1 - rPlate * rLayer);
        Candidate clear = new Candidate(2, 2, "illustrative clear plate", flat(plate), 3, false, N15);
        SampleEvaluation e = SampleEvaluator.evaluate(clear, require(layer.spec(), ThicknessSpec.AS_MEASURED,
                ClauseEvaluatorTest.point(Direction.PASS, 500, 0.1)), Optional.of(layer));
        assertThat(e.clauses().get(0).value()).isCloseTo(expected, within(1e-12));
    }

    @Test
    void thicknessIsSolvedThroughTheStack() {
        // candidate T(2 mm) = 0.80, clear plate layer: stack T(d) = T_c(d)·T_p / (1 − R_c(d)·R_p); found here by
        // bisection on that formula, independently of the solver
        double plate = (1 - R15) / (1 + R15);
        double k0 = internal(0.80, R15);
        double threshold = 0.6;
        double lo = 0.5;
        double hi = 20;
        for (int i = 0; i < 200; i++) {
            double mid = (lo + hi) / 2;
            double k = Math.pow(k0, mid / 2);
            double tc = (1 - R15) * (1 - R15) * k / (1 - R15 * R15 * k * k);
            double rc = R15 + (1 - R15) * (1 - R15) * R15 * k * k / (1 - R15 * R15 * k * k);
            double stack = tc * plate / (1 - rc * (1 - plate));
            if (stack >= threshold) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        StackLayer layer = glass(4, flat(plate), false);
        Requirement r = require(layer.spec(), ThicknessSpec.range(0.5, 20), weighted("passes over 60% of led 395"));
        SampleEvaluation e = SampleEvaluator.evaluate(bulk(flat(0.80), 2), r, Optional.of(layer));
        assertThat(e.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(e.feasibleMm().hiMm()).isCloseTo(lo, within(1e-6));
        assertThat(e.feasibleMm().hiMm()).isLessThan(2 * Math.log(internal(0.6, R15)) / Math.log(k0)); // thinner than alone
    }

    @Test
    void partsThatShareNoMeasuredRangeLeaveEveryClauseUnverified() {
        Curve visibleOnly = Curve.of(new double[] {500, 600, 700}, new double[] {0.9, 0.9, 0.9}, 0);
        Curve uvOnly = Curve.of(new double[] {250, 300, 350}, new double[] {0.9, 0.9, 0.9}, 0);
        StackLayer layer = glass(4, visibleOnly, false);
        Candidate candidate = new Candidate(3, 3, "illustrative UV window", uvOnly, 2, false, N15);
        SampleEvaluation e = SampleEvaluator.evaluate(candidate, require(layer.spec(), ThicknessSpec.AS_MEASURED,
                ClauseEvaluatorTest.point(Direction.PASS, 300, 0.5)), Optional.of(layer));
        assertThat(e.verdict()).isEqualTo(Verdict.UNVERIFIED);
        assertThat(e.clauses().get(0).explanation()).startsWith("no light path").contains("do not overlap");
    }

    @Test
    void aLayerCanOnlyLowerTransmittanceAtEveryWavelength() {
        // why a pass on the candidate alone is a necessary condition for the stack (docs/store.md, "Store use"):
        // T1·T2/(1 − R1·R2) ≤ T1 because T2 + R2 ≤ 1 for any absorbing slab
        double[] nm = new double[911];
        double[] t = new double[nm.length];
        for (int i = 0; i < nm.length; i++) {
            nm[i] = 190 + i;
            t[i] = 0.9 / (1 + Math.exp(-(nm[i] - 400) / 8)); // an absorption edge at 400 nm
        }
        Curve candidate = Curve.of(nm, t, 0);
        for (double layerT : new double[] {0.05, 0.5, 0.9230769}) {
            Curve stack = LightPath.of(Layer.fixed(candidate, N15), Layer.fixed(flat(layerT), N15)).transmittance();
            for (int i = 0; i < nm.length; i++) {
                assertThat(stack.transmittance(i)).isLessThanOrEqualTo(Math.min(t[i], layerT) * (1 + 1e-12));
            }
        }
        assertThat(Arrays.stream(t).max().getAsDouble()).isGreaterThan(0.8);
    }
}
