package org.spectralsieve.weighting;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.ArrayList;
import java.util.List;
import java.util.function.DoubleUnaryOperator;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.MethodSource;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.weighting.Figure.Bound;

class WeightedFiguresTest {

    /** A curve on a 1 nm grid over [from, to] with T given by the function. */
    private static Curve curve(double from, double to, DoubleUnaryOperator t) {
        int n = (int) Math.round(to - from) + 1;
        double[] nm = new double[n];
        double[] tr = new double[n];
        for (int i = 0; i < n; i++) {
            nm[i] = from + i;
            tr[i] = t.applyAsDouble(nm[i]);
        }
        return Curve.of(nm, tr, 0);
    }

    private static Curve absorbance(DoubleUnaryOperator a) {
        return curve(180, 1100, nm -> Math.pow(10, -a.applyAsDouble(nm)));
    }

    static Stream<Arguments> everyEmitterAndResponse() {
        List<Arguments> all = new ArrayList<>();
        for (Emitter e : EmitterCatalogue.all()) {
            for (Response r : Response.catalogue()) {
                all.add(Arguments.of(e.name(), r.name()));
            }
        }
        return all.stream();
    }

    /** Definition (issue 5, reference sheet §2): a spectrally flat T gives effective T = T and PF = 1/T. */
    @ParameterizedTest(name = "{0} × {1}")
    @MethodSource("everyEmitterAndResponse")
    void flatThirtyPercentFilterGivesThirtyPercentAndFactorOneOverPointThree(String emitter, String response) {
        // over the whole tool range: the flat response now weights every emitter wherever it has power
        Curve flat = curve(100, 1100, nm -> 0.3);
        Emitter e = EmitterCatalogue.named(emitter).orElseThrow();
        Response r = Response.named(response).orElseThrow();
        Figure t = WeightedFigures.effectiveTransmittance(flat, e, r);
        Figure pf = WeightedFigures.protectionFactor(flat, e, r);
        if (!t.available()) {
            // only pairs that share no wavelengths may be unavailable, and they must say so
            assertThat(t.note()).contains("has no power inside the range");
            return;
        }
        assertThat(t.value().getAsDouble()).isCloseTo(0.3, within(1e-12));
        assertThat(pf.value().getAsDouble()).isCloseTo(1 / 0.3, within(1e-11));
        assertThat(t.bound()).isEqualTo(Bound.VALUE);
    }

    @Test
    void everyUvEmitterHasPowerUnderErythemaAndActinicWeighting() {
        Curve flat = curve(180, 1100, nm -> 0.3);
        for (Emitter e : EmitterCatalogue.all()) {
            assertThat(WeightedFigures.effectiveTransmittance(flat, e, Response.actinicUv()).available())
                    .as(e.name()).isTrue();
        }
    }

    /**
     * Reference sheet §3, Diffey critical wavelength, 1 nm trapezoid, linear interpolation in the crossing
     * interval: flat A → 389 nm (stated in the published description of the method); the three check
     * curves → 335.45, 365.22, 385.95 nm (computed by the sheet from the same definition).
     */
    @ParameterizedTest
    @CsvSource({"flat, 389.00", "step, 335.45", "linear, 365.22", "oneHalf, 385.95"})
    void criticalWavelengthMatchesDiffeyCheckCurves(String shape, double expected) {
        DoubleUnaryOperator a = switch (shape) {
            case "flat" -> nm -> 0.7;
            case "step" -> nm -> nm <= 340 ? 2 : 0;
            case "linear" -> nm -> nm >= 400 ? 0 : nm <= 290 ? 2 : 2 * (400 - nm) / 110;
            case "oneHalf" -> nm -> nm <= 320 ? 1 : 0.5;
            default -> throw new IllegalArgumentException(shape);
        };
        Figure lc = WeightedFigures.criticalWavelength(absorbance(a));
        assertThat(lc.value().getAsDouble()).isCloseTo(expected, within(0.005));
    }

    @Test
    void criticalWavelengthNeedsTheWhole290To400Range() {
        Figure lc = WeightedFigures.criticalWavelength(curve(300, 800, nm -> 0.5));
        assertThat(lc.available()).isFalse();
        assertThat(lc.note()).contains("needs 290.0-400.0 nm");
    }

    /** Reference sheet §6 (ANSI Z80.3-2001 §3.2, OD = log 1/τ): 0.8 → 0.096910, 0.5 → 0.301030, 1e-3 → 3. */
    @ParameterizedTest
    @CsvSource({"0.8, 0.096910", "0.5, 0.301030", "0.1, 1", "0.01, 2", "1e-3, 3", "1e-6, 6"})
    void opticalDensityAtALineIsMinusLogTransmittance(double t, double od) {
        Figure f = WeightedFigures.opticalDensityAt(curve(200, 500, nm -> t), 365);
        assertThat(f.value().getAsDouble()).isCloseTo(od, within(5e-7));
        assertThat(f.name()).isEqualTo("opticalDensity365");
    }

    @Test
    void opticalDensityBelowDetectionIsALowerBound() {
        Curve c = Curve.of(new double[] {300, 400}, new double[] {1e-4, 1e-4}, 1e-3);
        assertThat(WeightedFigures.opticalDensityAt(c, 365).bound()).isEqualTo(Bound.AT_LEAST);
        assertThat(WeightedFigures.protectionFactor(c, Emitter.flat(), Response.flat(300, 400)).bound())
                .isEqualTo(Bound.AT_LEAST);
    }

    @Test
    void figureOutsideTheCurveIsUnavailableWithAReason() {
        Curve visible = curve(380, 800, nm -> 0.9);
        Figure t = WeightedFigures.effectiveTransmittance(visible, Emitter.flat(), Response.erythema());
        assertThat(t.available()).isFalse();
        assertThat(t.note()).contains("never extrapolated");
        assertThat(WeightedFigures.opticalDensityAt(visible, 254).available()).isFalse();
        assertThat(WeightedFigures.meanTransmittance(visible, UvBand.UVB).available()).isFalse();
    }

    /**
     * Curves start at 190 nm, the actinic table at 180 nm; 180-190 nm holds under 1 % of the flat-source
     * weight (table of reference sheet §4: S ≤ 0.019 there, ∫S ≈ 0.15 nm of ∫S ≈ 46 nm over 180-400 nm, 0.33 %), so the
     * figure is taken over the covered part and says so. A flat T still gives exactly T.
     */
    @Test
    void actinicFigureOfACurveFrom190NanometresLeavesOutTheSmallUncoveredShareAndSaysSo() {
        Figure t = WeightedFigures.effectiveTransmittance(curve(190, 1100, nm -> 0.3), Emitter.flat(),
                Response.actinicUv());
        assertThat(t.value().getAsDouble()).isCloseTo(0.3, within(1e-12));
        assertThat(t.note()).contains("190.0-400.0 nm").contains("leaving out");
        assertThat(t.outsideShare()).isBetween(0.002, 0.005);
    }

    /**
     * The normaliser covers exactly the numerator's interval, 190-400 nm, with its own trapezoid ends: the
     * share left out is ∫S over 180-190 nm / ∫S over 180-400 nm, here integrated independently on a 0.01 nm
     * grid (S log-linear between the rows of reference sheet §4). Counting 190 nm as a full interior point
     * puts half a grid interval outside the curve into the normaliser and the share comes out 2-3 % low.
     */
    @Test
    void actinicNormaliserIntegratesOverTheSameIntervalAsTheNumerator() {
        Response s = Response.actinicUv();
        double outside = fineIntegral(s, 180, 190);
        double all = fineIntegral(s, 180, 400);
        Figure t = WeightedFigures.effectiveTransmittance(curve(190, 1100, nm -> 0.3), Emitter.flat(), s);
        assertThat(t.outsideShare()).isCloseTo(outside / all, within(2e-3 * outside / all));
        // a ramp in T distinguishes the two intervals in the value too: the figure is ∫S·T / ∫S over 190-400 nm
        Curve ramp = curve(190, 1100, nm -> Math.min(1, (nm - 180) / 300));
        double expected = fineIntegral(s, 190, 400, nm -> Math.min(1, (nm - 180) / 300)) / fineIntegral(s, 190, 400);
        assertThat(WeightedFigures.effectiveTransmittance(ramp, Emitter.flat(), s).value().getAsDouble())
                .isCloseTo(expected, within(1e-4 * expected));
    }

    private static double fineIntegral(Response r, double from, double to) {
        return fineIntegral(r, from, to, nm -> 1);
    }

    private static double fineIntegral(Response r, double from, double to, DoubleUnaryOperator t) {
        int n = (int) Math.round((to - from) / 0.01);
        double h = (to - from) / n;
        double sum = 0;
        for (int i = 0; i <= n; i++) {
            double nm = from + i * h;
            sum += r.weightAt(nm) * t.applyAsDouble(nm) * (i == 0 || i == n ? 0.5 : 1);
        }
        return sum * h;
    }

    /**
     * Unweighted means flat over the whole emitter: led-405 (Gaussian, 12 nm FWHM, cut at 369-441 nm) behind
     * a long-pass curve, T = 0 up to 400 nm and 1 from 401 nm, passes the share of its power above the
     * edge, which lies between 400 and 401 nm (T is interpolated in absorbance there): between Φ(4 / σ) and
     * Φ(5 / σ) with σ = 12 / 2.3548 = 5.096 nm, i.e. Φ(0.785) = 0.784 and Φ(0.981) = 0.837 (normal table).
     * The old flat response ended at 400 nm and gave 0.
     */
    @Test
    void flatResponseWeightsTheWholeEmitterNotOnly250To400Nanometres() {
        Curve longPass = curve(190, 1100, nm -> nm > 400 ? 1 : 0);
        Figure t = WeightedFigures.effectiveTransmittance(longPass, EmitterCatalogue.named("led-405").orElseThrow(),
                Response.flat());
        assertThat(t.value().getAsDouble()).isBetween(0.784, 0.837);
        assertThat(t.outsideShare()).isZero();
        assertThat(t.note()).contains("369.0-441.0 nm");
    }

    /**
     * An imported response that ends inside the emitter's band: what lies beyond its table is weight the
     * figure cannot see. Held at the table's end value the estimate is exact for this flat table: a table
     * flat at 1 over 300-400 nm under led-405 misses the share of the LED's power above 400 nm, 0.837 (as
     * above): the figure is not available and says how much. A table that falls to 0 at its ends misses nothing.
     */
    @Test
    void anImportedResponseThatEndsInsideTheEmittersBandIsNotAvailableAndSaysHowMuchItMisses() {
        Emitter led = EmitterCatalogue.named("led-405").orElseThrow();
        Curve clear = curve(190, 1100, nm -> 0.5);
        Response cut = Response.tabulated("initiator", "test table", new double[] {300, 400}, new double[] {1, 1});
        Figure t = WeightedFigures.effectiveTransmittance(clear, led, cut);
        assertThat(t.available()).isFalse();
        assertThat(t.note()).contains("outside the table of response initiator").contains("84 %");
        Response fading = Response.tabulated("fading", "test table", new double[] {300, 350, 445},
                new double[] {0, 1, 0});
        Figure f = WeightedFigures.effectiveTransmittance(clear, led, fading);
        assertThat(f.value().getAsDouble()).isCloseTo(0.5, within(1e-12));
        assertThat(f.outsideShare()).isZero();
        // the standard action spectra are 0 outside their tables by definition: nothing is missed
        assertThat(WeightedFigures.effectiveTransmittance(clear, led, Response.erythema()).outsideShare()).isZero();
    }

    /**
     * Between 1 % and 0 left out, the figure stands and carries the share: a table ending at 440 nm misses
     * the LED's tail above it, 1 − Φ(35 / σ) ≈ 3e-12 of its power: far under 1 %, and reported as left out.
     * One ending at 420 nm misses 1 − Φ(15 / σ) = 1 − Φ(2.94) = 0.0016 (normal table): under 1 %, carried.
     */
    @Test
    void aSmallShareOutsideTheResponseIsCarriedByTheFigure() {
        Emitter led = EmitterCatalogue.named("led-405").orElseThrow();
        Response to420 = Response.tabulated("to-420", "test table", new double[] {300, 420}, new double[] {1, 1});
        Figure t = WeightedFigures.effectiveTransmittance(curve(190, 1100, nm -> 0.5), led, to420);
        assertThat(t.value().getAsDouble()).isCloseTo(0.5, within(1e-12));
        assertThat(t.outsideShare()).isCloseTo(0.0016, within(0.0003));
        assertThat(t.note()).contains("leaving out");
    }

    /**
     * Reference sheet §6: OD = −log10 T, and no eyewear scale states more than LB10 (OD ≥ 10); the figures
     * state at most OD 12. A sheet rescaled far beyond its data passes 10⁻³⁰: its protection factor is
     * stated as at least 10¹², never 10³⁰, and its effective T as at most 10⁻¹², both saying they were capped.
     */
    @Test
    void figuresNeverStateMoreThanOpticalDensityTwelve() {
        Curve opaque = curve(190, 1100, nm -> 1e-30);
        WeightedFigures.Report r = WeightedFigures.report(opaque, Emitter.flat(), Response.erythema());
        assertThat(r.protectionFactor().value().getAsDouble()).isEqualTo(1e12);
        assertThat(r.protectionFactor().bound()).isEqualTo(Bound.AT_LEAST);
        assertThat(r.protectionFactor().note()).contains("capped");
        assertThat(r.effectiveTransmittance().value().getAsDouble()).isEqualTo(1e-12);
        assertThat(r.effectiveTransmittance().bound()).isEqualTo(Bound.AT_MOST);
        assertThat(r.opticalDensities().get(0).value().getAsDouble()).isEqualTo(12);
        assertThat(r.opticalDensities().get(0).bound()).isEqualTo(Bound.AT_LEAST);
        assertThat(r.bandMeans().get(2).value().getAsDouble()).isEqualTo(1e-12);
        // a figure within OD 12 is left as computed
        WeightedFigures.Report clear = WeightedFigures.report(curve(190, 1100, nm -> 1e-6), Emitter.flat(),
                Response.erythema());
        assertThat(clear.protectionFactor().value().getAsDouble()).isCloseTo(1e6, within(1e-3));
        assertThat(clear.protectionFactor().bound()).isEqualTo(Bound.VALUE);
    }

    /**
     * A bounded figure carries both ends: points below the detection limit at their limit (U) and at 0 (L).
     * Half the erythema range under a 1 % limit: U > L > 0, and the stated text names both ends.
     */
    @Test
    void aBoundedFigureCarriesBothEndsAndIsStatedByThem() {
        int n = 911;
        double[] nm = new double[n];
        double[] t = new double[n];
        boolean[] below = new boolean[n];
        double[] limits = new double[n];
        for (int i = 0; i < n; i++) {
            nm[i] = 190 + i;
            below[i] = nm[i] < 300;
            t[i] = below[i] ? 0.01 : 0.5;
            limits[i] = 0.01;
        }
        Curve c = Curve.of(nm, t, below, limits);
        Figure f = WeightedFigures.report(c, Emitter.flat(), Response.erythema()).effectiveTransmittance();
        assertThat(f.bound()).isEqualTo(Bound.AT_MOST);
        double lower = f.otherEnd().orElseThrow();
        assertThat(lower).isGreaterThan(0).isLessThan(f.value().getAsDouble());
        assertThat(FigureText.stated(f)).isEqualTo("between " + FigureText.percent(lower) + " and "
                + FigureText.percent(f.value().getAsDouble()));
        assertThat(FigureText.ends(0.7961, 0.7964)).isEqualTo("79.6 %");
        assertThat(FigureText.ends(0, 0.001)).isEqualTo("at most 0.1 %");
    }

    @Test
    void erythemalFigureOfACurveMissingMostOfItsWeightIsRefused() {
        Figure t = WeightedFigures.effectiveTransmittance(curve(300, 1100, nm -> 0.3), Emitter.flat(),
                Response.erythema());
        assertThat(t.available()).isFalse();
        assertThat(t.note()).contains("of the weighted power lies outside the curve");
    }

    /** Definition of a mean on the trapezoid grid: T linear 0.2 → 0.9 over UVB averages to 0.55 exactly. */
    @Test
    void uvbMeanOfALinearRampIsItsMidpoint() {
        Curve ramp = curve(280, 315, nm -> 0.2 + 0.7 * (nm - 280) / 35);
        assertThat(WeightedFigures.meanTransmittance(ramp, UvBand.UVB).value().getAsDouble())
                .isCloseTo(0.55, within(1e-12));
    }

    /**
     * Reference sheet §10: the dermatology convention splits at 290 and 320 nm, CIE at 280 and 315 nm. A
     * curve with T = 0.2 below 300 nm and 0.8 from 300 nm shows the difference in the UVB means.
     */
    @Test
    void bandMeansFollowTheChosenConventionAndNameTheNumericBand() {
        Curve c = curve(190, 1100, nm -> nm < 300 ? 0.2 : 0.8);
        List<Figure> cie = WeightedFigures.bandMeans(c, UvBand.Convention.CIE);
        List<Figure> derm = WeightedFigures.bandMeans(c, UvBand.Convention.DERMATOLOGY);
        assertThat(cie).extracting(Figure::name).containsExactly("meanTransmittanceUVC(100-280 nm)",
                "meanTransmittanceUVB(280-315 nm)", "meanTransmittanceUVA(315-400 nm)");
        assertThat(derm).extracting(Figure::name).containsExactly("meanTransmittanceUVC(200-290 nm)",
                "meanTransmittanceUVB(290-320 nm)", "meanTransmittanceUVA(320-400 nm)");
        // trapezoid on 1 nm: CIE UVB 280..315 has 19 intervals at 0.2 (280-299), 1 mixed (299-300), 15 at 0.8
        double cieUvb = (19 * 0.2 + 0.5 + 15 * 0.8) / 35;
        double dermUvb = (9 * 0.2 + 0.5 + 20 * 0.8) / 30;
        assertThat(cie.get(1).value().getAsDouble()).isCloseTo(cieUvb, within(1e-12));
        assertThat(derm.get(1).value().getAsDouble()).isCloseTo(dermUvb, within(1e-12));
        assertThat(derm.get(1).note()).startsWith("UVB 290-320 nm (dermatology convention)");
        assertThat(derm.get(0).note()).doesNotContain("covered part");
        assertThat(UvBand.Convention.named(" Dermatology ")).contains(UvBand.Convention.DERMATOLOGY);
        assertThat(UvBand.Convention.named("iso")).isEmpty();
    }

    @Test
    void uvcMeanIsTakenOverTheCoveredPartAndSaysSo() {
        Figure uvc = WeightedFigures.meanTransmittance(curve(200, 400, nm -> 0.4), UvBand.UVC);
        assertThat(uvc.value().getAsDouble()).isCloseTo(0.4, within(1e-12));
        assertThat(uvc.note()).contains("covered part 200.0-280.0 nm only");
    }

    /**
     * A blocker below 320 nm and clear above: the erythema-weighted T is the UVA share of the weighted
     * flat spectrum, ∫_{319.5}^{400} s_er / ∫_{250}^{400} s_er, from the ISO/CIE 17166 formula integrated
     * in closed form (three branches) — an independent check of the trapezoid integration.
     */
    @Test
    void erythemalTransmittanceOfAnIdealEdgeMatchesTheClosedFormIntegral() {
        Curve edge = curve(180, 1100, nm -> nm < 320 ? 0 : 1);
        double k1 = 0.094 * Math.log(10);
        double k2 = 0.015 * Math.log(10);
        double b1 = 48; // 250..298, s = 1
        double b2a = (1 - Math.exp(-k1 * 21.5)) / k1; // 298..319.5
        double b2b = (Math.exp(-k1 * 21.5) - Math.exp(-k1 * 30)) / k1; // 319.5..328
        double b3 = Math.pow(10, 0.015 * (140 - 328)) * (1 - Math.exp(-k2 * 72)) / k2; // 328..400
        double expected = (b2b + b3) / (b1 + b2a + b2b + b3);
        double got = WeightedFigures.effectiveTransmittance(edge, Emitter.flat(), Response.erythema())
                .value().getAsDouble();
        // on the 1 nm trapezoid a step between the 319 and 320 nm points acts as an edge at 319.5 nm (half
        // the interval), so the closed form splits there; the remaining trapezoid error is well under 1 %
        assertThat(got).isCloseTo(expected, within(expected * 0.01));
    }
}
